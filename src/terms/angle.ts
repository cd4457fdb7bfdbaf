/**
 * Three-atom bend kernels: harmonic, cosine, cosine-series and periodic
 * angles. The vertex is the middle atom j; u = x_i − x_j, v = x_k − x_j.
 *
 * θ is computed as atan2(|u × v|, u · v), which is accurate at every angle
 * (acos loses half the digits near 0° and 180°). Its gradient is written
 * without any 1/sin θ factor:
 *
 *   dθ/dx_i = −(c × u) / (|c| |u|²),  dθ/dx_k = (c × v) / (|c| |v|²),
 *   dθ/dx_j = −(dθ/dx_i + dθ/dx_k),   c = u × v,
 *
 * whose magnitude is 1/|u| (resp. 1/|v|) at every angle, so only the
 * direction c/|c| becomes undefined, and only at exactly 0° or 180°, where
 * the gradient is taken as zero (a harmonic angle with θ0 = 180° has its
 * minimum there, so zero is also the true value in the common case).
 *
 * The cosine, cosine-series and periodic angles are polynomials in cos θ and
 * use d cos θ/dx instead, which is smooth through the line.
 * @module
 */
import type { TermTable } from './table.js';

/**
 * Harmonic angle, E = ½ k (θ − θ0)², params [k, theta0 (radians)].
 * dE/dθ = k (θ − θ0). See {@link Kernel} for the arguments.
 */
export function accumulateHarmonicAngles(
  x: Float64Array,
  table: TermTable,
  gradient?: Float64Array,
  energies?: Float64Array,
): number {
  const { atoms, params, count } = table;
  let total = 0;
  for (let t = 0; t < count; t++) {
    const i = 3 * atoms[3 * t];
    const j = 3 * atoms[3 * t + 1];
    const k3 = 3 * atoms[3 * t + 2];
    const kf = params[2 * t];
    const theta0 = params[2 * t + 1];
    const ux = x[i] - x[j];
    const uy = x[i + 1] - x[j + 1];
    const uz = x[i + 2] - x[j + 2];
    const vx = x[k3] - x[j];
    const vy = x[k3 + 1] - x[j + 1];
    const vz = x[k3 + 2] - x[j + 2];
    // c = u × v
    const cx = uy * vz - uz * vy;
    const cy = uz * vx - ux * vz;
    const cz = ux * vy - uy * vx;
    const cn = Math.sqrt(cx * cx + cy * cy + cz * cz);
    const theta = Math.atan2(cn, ux * vx + uy * vy + uz * vz);
    const d = theta - theta0;
    const e = 0.5 * kf * d * d;
    total += e;
    if (energies !== undefined) energies[t] = e;
    if (gradient !== undefined && cn > 0) {
      const dEdTheta = kf * d;
      const u2 = ux * ux + uy * uy + uz * uz;
      const v2 = vx * vx + vy * vy + vz * vz;
      const fi = -dEdTheta / (cn * u2);
      const fk = dEdTheta / (cn * v2);
      // c × u and c × v
      const gix = fi * (cy * uz - cz * uy);
      const giy = fi * (cz * ux - cx * uz);
      const giz = fi * (cx * uy - cy * ux);
      const gkx = fk * (cy * vz - cz * vy);
      const gky = fk * (cz * vx - cx * vz);
      const gkz = fk * (cx * vy - cy * vx);
      gradient[i] += gix;
      gradient[i + 1] += giy;
      gradient[i + 2] += giz;
      gradient[k3] += gkx;
      gradient[k3 + 1] += gky;
      gradient[k3 + 2] += gkz;
      gradient[j] -= gix + gkx;
      gradient[j + 1] -= giy + gky;
      gradient[j + 2] -= giz + gkz;
    }
  }
  return total;
}

/**
 * Cosine angle, E = ½ k (cos θ − cos θ0)², params [k, cosTheta0].
 * With cos θ = u·v / (|u| |v|):
 *   d cos θ/dx_i = v / (|u| |v|) − cos θ · u / |u|²,
 *   d cos θ/dx_k = u / (|u| |v|) − cos θ · v / |v|²,
 * which is smooth through 0° and 180° (it vanishes there). Coincident atoms
 * (|u| or |v| zero) count as cos θ = 1 with a zero gradient.
 */
export function accumulateCosineAngles(
  x: Float64Array,
  table: TermTable,
  gradient?: Float64Array,
  energies?: Float64Array,
): number {
  const { atoms, params, count } = table;
  let total = 0;
  for (let t = 0; t < count; t++) {
    const i = 3 * atoms[3 * t];
    const j = 3 * atoms[3 * t + 1];
    const k3 = 3 * atoms[3 * t + 2];
    const kf = params[2 * t];
    const cos0 = params[2 * t + 1];
    const ux = x[i] - x[j];
    const uy = x[i + 1] - x[j + 1];
    const uz = x[i + 2] - x[j + 2];
    const vx = x[k3] - x[j];
    const vy = x[k3 + 1] - x[j + 1];
    const vz = x[k3 + 2] - x[j + 2];
    const u2 = ux * ux + uy * uy + uz * uz;
    const v2 = vx * vx + vy * vy + vz * vz;
    const uv = Math.sqrt(u2 * v2);
    let c = uv > 0 ? (ux * vx + uy * vy + uz * vz) / uv : 1;
    if (c > 1) c = 1;
    else if (c < -1) c = -1;
    const d = c - cos0;
    const e = 0.5 * kf * d * d;
    total += e;
    if (energies !== undefined) energies[t] = e;
    if (gradient !== undefined && uv > 0) {
      const f = kf * d;
      const a = f / uv;
      const bi = (f * c) / u2;
      const bk = (f * c) / v2;
      const gix = a * vx - bi * ux;
      const giy = a * vy - bi * uy;
      const giz = a * vz - bi * uz;
      const gkx = a * ux - bk * vx;
      const gky = a * uy - bk * vy;
      const gkz = a * uz - bk * vz;
      gradient[i] += gix;
      gradient[i + 1] += giy;
      gradient[i + 2] += giz;
      gradient[k3] += gkx;
      gradient[k3 + 1] += gky;
      gradient[k3 + 2] += gkz;
      gradient[j] -= gix + gkx;
      gradient[j + 1] -= giy + gky;
      gradient[j + 2] -= giz + gkz;
    }
  }
  return total;
}

/**
 * Cosine-series angle, E = c0 + c1 cos θ + c2 cos 2θ, params [c0, c1, c2]
 * (energies; a model file gives k and θ0 and `writeParameters` turns them
 * into c_m = k C_m with C2 = 1/(4 sin²θ0), C1 = −4 C2 cos θ0,
 * C0 = C2 (2 cos²θ0 + 1)). With c = cos θ and cos 2θ = 2c² − 1:
 *   dE/dc = c1 + 4 c2 c,
 * times d cos θ/dx as in {@link accumulateCosineAngles}: a polynomial in
 * cos θ, so smooth through 0° and 180°. Coincident atoms count as cos θ = 1
 * with a zero gradient.
 */
export function accumulateCosineSeriesAngles(
  x: Float64Array,
  table: TermTable,
  gradient?: Float64Array,
  energies?: Float64Array,
): number {
  return cosinePolynomialAngles(x, table, gradient, energies, false);
}

/**
 * Periodic angle, E = a [1 − sign · cos(n θ)], params [a, n, sign]: a = k/n²
 * (energy), n a whole number ≥ 1, sign = cos(n θ0) = ±1 (the file's θ0 is a
 * whole multiple of 180°/n, so the minimum is at θ0 and k is the curvature
 * there: d²E/dθ² = k). cos nθ = T_n(cos θ), and
 *   dE/dc = −a · sign · n U_{n−1}(c),   c = cos θ,
 * with the Chebyshev polynomials T_n and U_{n−1} from their three-term
 * recurrences (no trigonometric calls); smooth through 0° and 180°.
 */
export function accumulatePeriodicAngles(
  x: Float64Array,
  table: TermTable,
  gradient?: Float64Array,
  energies?: Float64Array,
): number {
  return cosinePolynomialAngles(x, table, gradient, energies, true);
}

/** The loop of the two bends that are polynomials in cos θ. */
function cosinePolynomialAngles(
  x: Float64Array,
  table: TermTable,
  gradient: Float64Array | undefined,
  energies: Float64Array | undefined,
  periodic: boolean,
): number {
  const { atoms, params, count } = table;
  let total = 0;
  for (let t = 0; t < count; t++) {
    const i = 3 * atoms[3 * t];
    const j = 3 * atoms[3 * t + 1];
    const k3 = 3 * atoms[3 * t + 2];
    const ux = x[i] - x[j];
    const uy = x[i + 1] - x[j + 1];
    const uz = x[i + 2] - x[j + 2];
    const vx = x[k3] - x[j];
    const vy = x[k3 + 1] - x[j + 1];
    const vz = x[k3 + 2] - x[j + 2];
    const u2 = ux * ux + uy * uy + uz * uz;
    const v2 = vx * vx + vy * vy + vz * vz;
    const uv = Math.sqrt(u2 * v2);
    let c = uv > 0 ? (ux * vx + uy * vy + uz * vz) / uv : 1;
    if (c > 1) c = 1;
    else if (c < -1) c = -1;
    const p0 = params[3 * t];
    const p1 = params[3 * t + 1];
    const p2 = params[3 * t + 2];
    let e: number;
    let dEdc: number;
    if (periodic) {
      // T_n(c) and U_{n−1}(c): T_{m+1} = 2c T_m − T_{m−1}, same for U.
      let tPrev = 1;
      let tn = c;
      let uPrev = 0;
      let un = 1;
      for (let m = 1; m < p1; m++) {
        const tNext = 2 * c * tn - tPrev;
        const uNext = 2 * c * un - uPrev;
        tPrev = tn;
        tn = tNext;
        uPrev = un;
        un = uNext;
      }
      e = p0 * (1 - p2 * tn);
      dEdc = -p0 * p2 * p1 * un;
    } else {
      e = p0 + p1 * c + p2 * (2 * c * c - 1);
      dEdc = p1 + 4 * p2 * c;
    }
    total += e;
    if (energies !== undefined) energies[t] = e;
    if (gradient !== undefined && uv > 0) {
      const a = dEdc / uv;
      const bi = (dEdc * c) / u2;
      const bk = (dEdc * c) / v2;
      const gix = a * vx - bi * ux;
      const giy = a * vy - bi * uy;
      const giz = a * vz - bi * uz;
      const gkx = a * ux - bk * vx;
      const gky = a * uy - bk * vy;
      const gkz = a * uz - bk * vz;
      gradient[i] += gix;
      gradient[i + 1] += giy;
      gradient[i + 2] += giz;
      gradient[k3] += gkx;
      gradient[k3 + 1] += gky;
      gradient[k3 + 2] += gkz;
      gradient[j] -= gix + gkx;
      gradient[j + 1] -= giy + gky;
      gradient[j + 2] -= giz + gkz;
    }
  }
  return total;
}
