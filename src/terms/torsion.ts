/**
 * Four-atom torsion kernels: periodic dihedral, Ryckaert–Bellemans and
 * harmonic improper. All three are functions of the torsion angle φ of the
 * atoms i–j–k–l in the order written (IUPAC sign: cis 0, trans π).
 *
 * With b1 = x_j − x_i, b2 = x_k − x_j, b3 = x_l − x_k, m = b1 × b2,
 * n = b2 × b3:
 *
 *   φ = atan2(|b2| b1 · n, m · n)                      (exact at 0 and π)
 *
 * with |b2| b1 · n evaluated as ((m × n) · b2) / |b2|, which keeps its
 * digits when both bond angles are near 180°.
 *   dφ/dx_i = −|b2| / |m|² · m
 *   dφ/dx_l = +|b2| / |n|² · n
 *   dφ/dx_j = q dφ/dx_l − (1 + p) dφ/dx_i
 *   dφ/dx_k = p dφ/dx_i − (1 + q) dφ/dx_l,   p = b1·b2/|b2|², q = b3·b2/|b2|²
 *
 * (the form of Blondel & Karplus, J. Comput. Chem. 17 (1996) 1132, which
 * has no 1/sin φ and so no trouble at φ = 0 or π). It grows like 1/sin of the
 * bond angles i–j–k and j–k–l, as the true gradient does, and is followed as
 * close to a line as rounding allows; only when an angle is collinear to
 * rounding (|m|² or |n|² below 1e-30 of |b1|²|b2|² or |b2|²|b3|²), where φ
 * is undefined, is the term's gradient taken as zero (and φ as atan2's
 * value there, a finite number).
 * @module
 */
import type { TermTable } from './table.js';

const TWO_PI = 2 * Math.PI;
/** Squared sine of an angle below which the angle counts as collinear. */
const COLLINEAR_SIN2 = 1e-30;

/** Which energy of φ a torsion loop evaluates. */
const enum Form {
  Periodic,
  RyckaertBellemans,
  Improper,
}

/**
 * Periodic dihedral, E = k [1 + cos(n φ − phase)], params
 * [k, n, cos phase, sin phase] (n a whole number ≥ 1).
 * dE/dφ = −k n sin(n φ − phase). See {@link Kernel} for the arguments.
 */
export function accumulatePeriodicDihedrals(
  x: Float64Array,
  table: TermTable,
  gradient?: Float64Array,
  energies?: Float64Array,
): number {
  return torsions(x, table, gradient, energies, Form.Periodic);
}

/**
 * Ryckaert–Bellemans torsion, E = Σ_{m=0..5} c_m cos^m ψ with ψ = φ − 180°,
 * params [c0..c5]. With cos ψ = −cos φ:
 * dE/dφ = sin φ · Σ_{m=1..5} m c_m (−cos φ)^{m−1}.
 */
export function accumulateRyckaertBellemans(
  x: Float64Array,
  table: TermTable,
  gradient?: Float64Array,
  energies?: Float64Array,
): number {
  return torsions(x, table, gradient, energies, Form.RyckaertBellemans);
}

/**
 * Harmonic improper, E = ½ k Δ², Δ = φ − ξ0 wrapped into [−π, π), params
 * [k, xi0 (rad)]. dE/dφ = k Δ (the energy jumps where Δ wraps, at ξ0 + π).
 */
export function accumulateHarmonicImpropers(
  x: Float64Array,
  table: TermTable,
  gradient?: Float64Array,
  energies?: Float64Array,
): number {
  return torsions(x, table, gradient, energies, Form.Improper);
}

/** Wrap an angle difference into [−π, π). */
export function wrapAngle(d: number): number {
  return d - TWO_PI * Math.floor((d + Math.PI) / TWO_PI);
}

function torsions(
  x: Float64Array,
  table: TermTable,
  gradient: Float64Array | undefined,
  energies: Float64Array | undefined,
  form: Form,
): number {
  const { atoms, params, count, width } = table;
  let total = 0;
  for (let t = 0; t < count; t++) {
    const i = 3 * atoms[4 * t];
    const j = 3 * atoms[4 * t + 1];
    const k = 3 * atoms[4 * t + 2];
    const l = 3 * atoms[4 * t + 3];
    const b1x = x[j] - x[i];
    const b1y = x[j + 1] - x[i + 1];
    const b1z = x[j + 2] - x[i + 2];
    const b2x = x[k] - x[j];
    const b2y = x[k + 1] - x[j + 1];
    const b2z = x[k + 2] - x[j + 2];
    const b3x = x[l] - x[k];
    const b3y = x[l + 1] - x[k + 1];
    const b3z = x[l + 2] - x[k + 2];
    // m = b1 × b2, n = b2 × b3
    const mx = b1y * b2z - b1z * b2y;
    const my = b1z * b2x - b1x * b2z;
    const mz = b1x * b2y - b1y * b2x;
    const nx = b2y * b3z - b2z * b3y;
    const ny = b2z * b3x - b2x * b3z;
    const nz = b2x * b3y - b2y * b3x;
    const b22 = b2x * b2x + b2y * b2y + b2z * b2z;
    const b2n = Math.sqrt(b22);
    const cosTerm = mx * nx + my * ny + mz * nz;
    // |b2| b1 · n, computed as ((m × n) · b2) / |b2| (the same number, since
    // m × n = (b1 · n) b2): it keeps its digits when both bond angles are
    // near linear, where the dot product b1 · n cancels.
    const sinTerm =
      b2n > 0 ? ((my * nz - mz * ny) * b2x + (mz * nx - mx * nz) * b2y + (mx * ny - my * nx) * b2z) / b2n : 0;
    let phi = Math.atan2(sinTerm, cosTerm);
    if (phi === -Math.PI) phi = Math.PI;

    const p = t * width;
    let e: number;
    let dEdPhi: number;
    if (form === Form.Periodic) {
      // cos(nφ − phase) = cos nφ cos phase + sin nφ sin phase, with cos nφ and
      // sin nφ from cos φ and sin φ by the angle-addition recurrence: no trig.
      const hyp = Math.sqrt(cosTerm * cosTerm + sinTerm * sinTerm);
      const c1 = hyp > 0 ? cosTerm / hyp : 1;
      const s1 = hyp > 0 ? sinTerm / hyp : 0;
      const n = params[p + 1];
      let cn = c1;
      let sn = s1;
      for (let m = 1; m < n; m++) {
        const c = cn * c1 - sn * s1;
        sn = sn * c1 + cn * s1;
        cn = c;
      }
      const kf = params[p];
      const cp = params[p + 2];
      const sp = params[p + 3];
      e = kf * (1 + cn * cp + sn * sp);
      dEdPhi = -kf * n * (sn * cp - cn * sp);
    } else if (form === Form.RyckaertBellemans) {
      const hyp = Math.sqrt(cosTerm * cosTerm + sinTerm * sinTerm);
      const cphi = hyp > 0 ? cosTerm / hyp : 1;
      const sphi = hyp > 0 ? sinTerm / hyp : 0;
      const c = -cphi; // cos ψ, ψ = φ − π
      const c0 = params[p];
      const c1 = params[p + 1];
      const c2 = params[p + 2];
      const c3 = params[p + 3];
      const c4 = params[p + 4];
      const c5 = params[p + 5];
      e = c0 + c * (c1 + c * (c2 + c * (c3 + c * (c4 + c * c5))));
      dEdPhi = sphi * (c1 + c * (2 * c2 + c * (3 * c3 + c * (4 * c4 + c * 5 * c5))));
    } else {
      const kf = params[p];
      const d = wrapAngle(phi - params[p + 1]);
      e = 0.5 * kf * d * d;
      dEdPhi = kf * d;
    }
    total += e;
    if (energies !== undefined) energies[t] = e;
    if (gradient === undefined) continue;

    const m2 = mx * mx + my * my + mz * mz;
    const n2 = nx * nx + ny * ny + nz * nz;
    const b12 = b1x * b1x + b1y * b1y + b1z * b1z;
    const b32 = b3x * b3x + b3y * b3y + b3z * b3z;
    if (!(m2 > COLLINEAR_SIN2 * b12 * b22) || !(n2 > COLLINEAR_SIN2 * b22 * b32)) continue;

    const fi = (-dEdPhi * b2n) / m2;
    const fl = (dEdPhi * b2n) / n2;
    const gix = fi * mx;
    const giy = fi * my;
    const giz = fi * mz;
    const glx = fl * nx;
    const gly = fl * ny;
    const glz = fl * nz;
    const pp = (b1x * b2x + b1y * b2y + b1z * b2z) / b22;
    const qq = (b3x * b2x + b3y * b2y + b3z * b2z) / b22;
    const gjx = qq * glx - (1 + pp) * gix;
    const gjy = qq * gly - (1 + pp) * giy;
    const gjz = qq * glz - (1 + pp) * giz;
    gradient[i] += gix;
    gradient[i + 1] += giy;
    gradient[i + 2] += giz;
    gradient[l] += glx;
    gradient[l + 1] += gly;
    gradient[l + 2] += glz;
    gradient[j] += gjx;
    gradient[j + 1] += gjy;
    gradient[j + 2] += gjz;
    // the four atom gradients sum to zero (no net force)
    gradient[k] -= gix + glx + gjx;
    gradient[k + 1] -= giy + gly + gjy;
    gradient[k + 2] -= giz + glz + gjz;
  }
  return total;
}
