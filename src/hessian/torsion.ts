/**
 * Hessians of the torsion kinds: periodic dihedral, Ryckaert–Bellemans and
 * harmonic improper, all functions E(φ) of the torsion angle of i–j–k–l.
 *
 * Notation of the gradient kernel: b1 = x_j − x_i, b2 = x_k − x_j,
 * b3 = x_l − x_k, m = b1 × b2, n = b2 × b3, B = |b2|, M = |m|, N = |n|,
 * p = b1·b2/B², q = b3·b2/B². Over the bond vectors, the kernel's gradient
 * (Blondel & Karplus, J. Comput. Chem. 17 (1996) 1132) reads
 *
 *   φ_1 = ∂φ/∂b1 = (B/M²) m,   φ_3 = ∂φ/∂b3 = (B/N²) n,
 *   φ_2 = ∂φ/∂b2 = −p φ_1 − q φ_3,
 *
 * an identity in b1, b2, b3, so it can be differentiated as it stands.
 * With S(a) the cross-product matrix (S(a) w = a × w), w = b2 × m,
 * z = b2 × n (entry [r][c] of φ_st is ∂(φ_s)_r/∂(b_t)_c):
 *
 *   φ_11 = −(B/M⁴)(m wᵀ + w mᵀ)          φ_33 = (B/N⁴)(n zᵀ + z nᵀ)
 *   φ_13 = 0
 *   φ_12 = m b2ᵀ/(B M²) + (B/M²) S(b1) + (2B/M⁴) m (b1 × m)ᵀ
 *   φ_32 = n b2ᵀ/(B N²) − (B/N²) S(b3) − (2B/N⁴) n (b3 × n)ᵀ
 *   φ_22 = −φ_1 ∇pᵀ − p φ_12 − φ_3 ∇qᵀ − q φ_32,
 *          ∇p = ∂p/∂b2 = b1/B² − 2 (b1·b2) b2/B⁴, ∇q likewise with b3
 *
 * (derived here from the kernel's gradient by the product rule; φ_11 and
 * φ_33 are the symmetric forms of (B/M²)(−S(b2)) − (2B/M⁴) m wᵀ and its
 * mirror, as for the bend angle they have no 1/sin φ). The energy's Hessian
 * over the bonds is E''(φ) ∇φ∇φᵀ + E'(φ) ∇²φ, spread over the atoms by
 * x_i ↦ −b1, x_j ↦ b1 − b2, x_k ↦ b2 − b3, x_l ↦ b3.
 *
 * It grows like 1/sin² of the bond angles i–j–k and j–k–l, as the true
 * Hessian does. Where a bond angle is collinear to rounding (the gradient
 * kernel's test, |m|² or |n|² below 1e-30 of |b1|²|b2|² or |b2|²|b3|²) φ is
 * undefined and the term's blocks are zero, as its gradient is.
 *
 * E'(φ), E''(φ) per kind, with cos nφ and sin nφ from the kernel's
 * angle-addition recurrence (no trigonometric call):
 * - periodic: E' = −k n sin(nφ − phase), E'' = −k n² cos(nφ − phase)
 * - Ryckaert–Bellemans, y = cos ψ = −cos φ, P(y) = Σ c_m y^m:
 *   E' = sin φ P'(y), E'' = sin² φ P''(y) + cos φ P'(y)
 * - harmonic improper: E' = k Δ (Δ wrapped as in the kernel), E'' = k; the
 *   jump of E at Δ = ±π is not represented.
 * @module
 */
import type { TermTable } from '../terms/table.js';
import { wrapAngle } from '../terms/torsion.js';
import { emitLocal, expandToAtoms, spreadOf } from './local.js';
import type { HessianKernel, HessianSink } from './sink.js';

/** Squared sine below which a bond angle counts as collinear (as in the gradient kernel). */
const COLLINEAR_SIN2 = 1e-30;
const SLOTS: readonly number[] = [0, 1, 2, 3];
/** Rows atoms i, j, k, l; columns b1, b2, b3. */
const COEFFICIENTS: readonly number[] = [-1, 0, 0, 1, -1, 0, 0, 1, -1, 0, 0, 1];
const SPREAD = spreadOf(COEFFICIENTS, 4, 3);

const enum Form {
  Periodic,
  RyckaertBellemans,
  Improper,
}

/** Hessian of E over (b1, b2, b3), 9×9 row-major. */
const inner = new Float64Array(81);
/** Hessian over atoms i, j, k, l, 12×12 row-major. */
const local = new Float64Array(144);
/** ∇φ over (b1, b2, b3). */
const g = new Float64Array(9);
/** φ_12 and φ_32, 3×3 row-major each. */
const f12 = new Float64Array(9);
const f32 = new Float64Array(9);
/** Vectors: m, n, w, z, b1×m, b3×n, ∇p, ∇q, b1, b2, b3. */
const vec = new Float64Array(33);
const M = 0;
const N = 3;
const W = 6;
const Z = 9;
const B1M = 12;
const B3N = 15;
const GP = 18;
const GQ = 21;
const B1 = 24;
const B2 = 27;
const B3 = 30;

function cross(out: number, a: number, b: number): void {
  const ax = vec[a];
  const ay = vec[a + 1];
  const az = vec[a + 2];
  const bx = vec[b];
  const by = vec[b + 1];
  const bz = vec[b + 2];
  vec[out] = ay * bz - az * by;
  vec[out + 1] = az * bx - ax * bz;
  vec[out + 2] = ax * by - ay * bx;
}

/** Entry [r][c] of S(a), the matrix of w ↦ a × w, for a at vec[a]. */
function skew(a: number, r: number, c: number): number {
  if (r === c) return 0;
  // S = [[0, −a3, a2], [a3, 0, −a1], [−a2, a1, 0]]
  const k = 3 - r - c; // the third index
  const sign = (r + 1) % 3 === c ? -1 : 1;
  return sign * vec[a + k];
}

function torsionHessians(x: Float64Array, table: TermTable, sink: HessianSink, form: Form): void {
  const { atoms, params, count, width } = table;
  for (let t = 0; t < count; t++) {
    const i = 3 * atoms[4 * t];
    const j = 3 * atoms[4 * t + 1];
    const k = 3 * atoms[4 * t + 2];
    const l = 3 * atoms[4 * t + 3];
    for (let c = 0; c < 3; c++) {
      vec[B1 + c] = x[j + c] - x[i + c];
      vec[B2 + c] = x[k + c] - x[j + c];
      vec[B3 + c] = x[l + c] - x[k + c];
    }
    cross(M, B1, B2);
    cross(N, B2, B3);
    const mx = vec[M];
    const my = vec[M + 1];
    const mz = vec[M + 2];
    const nx = vec[N];
    const ny = vec[N + 1];
    const nz = vec[N + 2];
    const b2x = vec[B2];
    const b2y = vec[B2 + 1];
    const b2z = vec[B2 + 2];
    const b22 = b2x * b2x + b2y * b2y + b2z * b2z;
    const b2n = Math.sqrt(b22);
    const cosTerm = mx * nx + my * ny + mz * nz;
    const sinTerm =
      b2n > 0 ? ((my * nz - mz * ny) * b2x + (mz * nx - mx * nz) * b2y + (mx * ny - my * nx) * b2z) / b2n : 0;
    const m2 = mx * mx + my * my + mz * mz;
    const n2 = nx * nx + ny * ny + nz * nz;
    const b12 = vec[B1] * vec[B1] + vec[B1 + 1] * vec[B1 + 1] + vec[B1 + 2] * vec[B1 + 2];
    const b32 = vec[B3] * vec[B3] + vec[B3 + 1] * vec[B3 + 1] + vec[B3 + 2] * vec[B3 + 2];
    if (!(m2 > COLLINEAR_SIN2 * b12 * b22) || !(n2 > COLLINEAR_SIN2 * b22 * b32)) {
      local.fill(0);
      emitLocal(sink, local, atoms, 4 * t, SLOTS);
      continue;
    }

    const p = t * width;
    let d1: number;
    let d2: number;
    if (form === Form.Periodic) {
      const hyp = Math.sqrt(cosTerm * cosTerm + sinTerm * sinTerm);
      const c1 = hyp > 0 ? cosTerm / hyp : 1;
      const s1 = hyp > 0 ? sinTerm / hyp : 0;
      const n = params[p + 1];
      let cn = c1;
      let sn = s1;
      for (let r = 1; r < n; r++) {
        const c = cn * c1 - sn * s1;
        sn = sn * c1 + cn * s1;
        cn = c;
      }
      const kf = params[p];
      const cp = params[p + 2];
      const sp = params[p + 3];
      d1 = -kf * n * (sn * cp - cn * sp);
      d2 = -kf * n * n * (cn * cp + sn * sp);
    } else if (form === Form.RyckaertBellemans) {
      const hyp = Math.sqrt(cosTerm * cosTerm + sinTerm * sinTerm);
      const cphi = hyp > 0 ? cosTerm / hyp : 1;
      const sphi = hyp > 0 ? sinTerm / hyp : 0;
      const y = -cphi;
      const c1 = params[p + 1];
      const c2 = params[p + 2];
      const c3 = params[p + 3];
      const c4 = params[p + 4];
      const c5 = params[p + 5];
      const dP = c1 + y * (2 * c2 + y * (3 * c3 + y * (4 * c4 + y * 5 * c5)));
      const ddP = 2 * c2 + y * (6 * c3 + y * (12 * c4 + y * 20 * c5));
      d1 = sphi * dP;
      d2 = sphi * sphi * ddP + cphi * dP;
    } else {
      let phi = Math.atan2(sinTerm, cosTerm);
      if (phi === -Math.PI) phi = Math.PI;
      const kf = params[p];
      d1 = kf * wrapAngle(phi - params[p + 1]);
      d2 = kf;
    }

    // ∇φ over the bonds
    const fm = b2n / m2;
    const fn = b2n / n2;
    const pp = (vec[B1] * b2x + vec[B1 + 1] * b2y + vec[B1 + 2] * b2z) / b22;
    const qq = (vec[B3] * b2x + vec[B3 + 1] * b2y + vec[B3 + 2] * b2z) / b22;
    for (let c = 0; c < 3; c++) {
      g[c] = fm * vec[M + c];
      g[6 + c] = fn * vec[N + c];
      g[3 + c] = -pp * g[c] - qq * g[6 + c];
    }
    cross(W, B2, M);
    cross(Z, B2, N);
    cross(B1M, B1, M);
    cross(B3N, B3, N);
    const b1b2 = pp * b22;
    const b3b2 = qq * b22;
    const b24 = b22 * b22;
    for (let c = 0; c < 3; c++) {
      vec[GP + c] = vec[B1 + c] / b22 - (2 * b1b2 * vec[B2 + c]) / b24;
      vec[GQ + c] = vec[B3 + c] / b22 - (2 * b3b2 * vec[B2 + c]) / b24;
    }
    const a11 = -b2n / (m2 * m2);
    const a33 = b2n / (n2 * n2);
    const u12 = 1 / (b2n * m2);
    const s12 = b2n / m2;
    const t12 = (2 * b2n) / (m2 * m2);
    const u32 = 1 / (b2n * n2);
    const s32 = -b2n / n2;
    const t32 = (-2 * b2n) / (n2 * n2);
    for (let r = 0; r < 3; r++) {
      for (let c = 0; c < 3; c++) {
        f12[3 * r + c] = u12 * vec[M + r] * vec[B2 + c] + s12 * skew(B1, r, c) + t12 * vec[M + r] * vec[B1M + c];
        f32[3 * r + c] = u32 * vec[N + r] * vec[B2 + c] + s32 * skew(B3, r, c) + t32 * vec[N + r] * vec[B3N + c];
      }
    }
    for (let r = 0; r < 3; r++) {
      for (let c = 0; c < 3; c++) {
        const h11 = a11 * (vec[M + r] * vec[W + c] + vec[W + r] * vec[M + c]);
        const h33 = a33 * (vec[N + r] * vec[Z + c] + vec[Z + r] * vec[N + c]);
        const h22 =
          -g[r] * vec[GP + c] - pp * f12[3 * r + c] - g[6 + r] * vec[GQ + c] - qq * f32[3 * r + c];
        // φ_21[r][c] = φ_12[c][r], φ_23[r][c] = φ_32[c][r]
        const h12 = f12[3 * r + c];
        const h32 = f32[3 * r + c];
        inner[r * 9 + c] = d2 * g[r] * g[c] + d1 * h11;
        inner[r * 9 + 6 + c] = d2 * g[r] * g[6 + c];
        inner[(6 + r) * 9 + c] = d2 * g[6 + r] * g[c];
        inner[(6 + r) * 9 + 6 + c] = d2 * g[6 + r] * g[6 + c] + d1 * h33;
        inner[(3 + r) * 9 + 3 + c] = d2 * g[3 + r] * g[3 + c] + d1 * h22;
        inner[r * 9 + 3 + c] = d2 * g[r] * g[3 + c] + d1 * h12;
        inner[(3 + c) * 9 + r] = d2 * g[r] * g[3 + c] + d1 * h12;
        inner[(6 + r) * 9 + 3 + c] = d2 * g[6 + r] * g[3 + c] + d1 * h32;
        inner[(3 + c) * 9 + 6 + r] = d2 * g[6 + r] * g[3 + c] + d1 * h32;
      }
    }
    expandToAtoms(inner, SPREAD, local);
    emitLocal(sink, local, atoms, 4 * t, SLOTS);
  }
}

/**
 * Periodic dihedral, E = k [1 + cos(n φ − phase)], params
 * [k, n, cosPhase, sinPhase]. See {@link HessianKernel} and the module comment.
 */
export const periodicDihedralHessian: HessianKernel = {
  slots: SLOTS,
  accumulate: (x, table, sink) => torsionHessians(x, table, sink, Form.Periodic),
};

/** Ryckaert–Bellemans, E = Σ c_m cos^m(φ − π), params [c0..c5]. */
export const ryckaertBellemansHessian: HessianKernel = {
  slots: SLOTS,
  accumulate: (x, table, sink) => torsionHessians(x, table, sink, Form.RyckaertBellemans),
};

/** Harmonic improper, E = ½ k Δ², Δ = φ − ξ0 wrapped into [−π, π), params [k, xi0]. */
export const harmonicImproperHessian: HessianKernel = {
  slots: SLOTS,
  accumulate: (x, table, sink) => torsionHessians(x, table, sink, Form.Improper),
};
