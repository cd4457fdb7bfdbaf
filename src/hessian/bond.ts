/**
 * Hessians of the two-atom stretch kinds: harmonic bond, Morse bond and the
 * Urey–Bradley 1–3 term (atoms i and k of i–j–k).
 *
 * With d = x_j − x_i, r = |d|, u = d / r, the first and second derivatives
 * of r are ∇_j r = u = −∇_i r and ∇²_jj r = (I − u uᵀ) / r. For E(r):
 *
 *   K = ∂²E/∂x_j² = E''(r) u uᵀ + (E'(r) / r) (I − u uᵀ),
 *   ∂²E/∂x_i² = K,  ∂²E/∂x_i∂x_j = −K,
 *
 * so a stretch has stiffness E'' along the bond and E'/r across it (the
 * rotational part, zero at the minimum). Where r = 0 the direction is
 * undefined and the blocks are zero, except for a plain ½ k r² (r0 = 0),
 * whose Hessian k I is defined everywhere, as the gradient kernels do.
 * @module
 */
import type { TermTable } from '../terms/table.js';
import type { HessianKernel, HessianSink } from './sink.js';

/** [K, −K], each 3×3 row-major: the scratch of every pair kernel. */
const pairScratch = new Float64Array(18);

/**
 * Writes K = f I + (e2 − f) d dᵀ / r² and −K into {@link pairScratch}, and
 * hands the four blocks of the pair (i, j) to the sink in slot order
 * (i,i), (i,j), (j,i), (j,j). `e2` is E''(r) and `f` is E'(r)/r; r² is
 * passed as `r2` (> 0 unless both terms vanish, see callers).
 */
export function emitPair(
  sink: HessianSink,
  a: number,
  b: number,
  e2: number,
  f: number,
  dx: number,
  dy: number,
  dz: number,
  r2: number,
): void {
  const h = pairScratch;
  const w = r2 > 0 ? (e2 - f) / r2 : 0;
  const xx = f + w * dx * dx;
  const yy = f + w * dy * dy;
  const zz = f + w * dz * dz;
  const xy = w * dx * dy;
  const xz = w * dx * dz;
  const yz = w * dy * dz;
  h[0] = xx;
  h[1] = xy;
  h[2] = xz;
  h[3] = xy;
  h[4] = yy;
  h[5] = yz;
  h[6] = xz;
  h[7] = yz;
  h[8] = zz;
  for (let n = 0; n < 9; n++) h[9 + n] = -h[n];
  sink.add(a, a, h, 0, 3);
  sink.add(a, b, h, 9, 3);
  sink.add(b, a, h, 9, 3);
  sink.add(b, b, h, 0, 3);
}

/** Harmonic stretch ½ k (r − r0)² between columns `ci` and `cj`. */
function harmonicStretch(x: Float64Array, table: TermTable, sink: HessianSink, ci: number, cj: number): void {
  const { atoms, params, count, arity } = table;
  for (let t = 0; t < count; t++) {
    const ai = atoms[t * arity + ci];
    const aj = atoms[t * arity + cj];
    const i = 3 * ai;
    const j = 3 * aj;
    const k = params[2 * t];
    const r0 = params[2 * t + 1];
    const dx = x[j] - x[i];
    const dy = x[j + 1] - x[i + 1];
    const dz = x[j + 2] - x[i + 2];
    const r2 = dx * dx + dy * dy + dz * dz;
    const r = Math.sqrt(r2);
    let e2 = k;
    let f = k; // r0 = 0: K = k I exactly, at r = 0 too
    if (r0 !== 0) {
      if (r > 0) f = (k * (r - r0)) / r;
      else e2 = f = 0;
    }
    emitPair(sink, ai, aj, e2, f, dx, dy, dz, r2);
  }
}

/**
 * Harmonic bond, E = ½ k (r − r0)², params [k, r0]: E'' = k, E'/r = k (r − r0)/r.
 * See {@link HessianKernel}.
 */
export const harmonicBondHessian: HessianKernel = {
  slots: [0, 1],
  accumulate: (x, table, sink) => harmonicStretch(x, table, sink, 0, 1),
};

/**
 * Urey–Bradley, E = ½ k (|x_k − x_i| − s0)², params [k, s0], atoms i j k:
 * a harmonic bond between i and k; j gets nothing (slots [0, 2]).
 */
export const ureyBradleyHessian: HessianKernel = {
  slots: [0, 2],
  accumulate: (x, table, sink) => harmonicStretch(x, table, sink, 0, 2),
};

/**
 * Morse bond, E = D [1 − e]², e = exp(−a (r − r0)), params [D, a, r0]:
 * E' = 2 D a e (1 − e), E'' = 2 D a² e (2e − 1) (so 2 D a² at r0, and
 * negative beyond the inflection r0 + ln 2 / a).
 */
export const morseBondHessian: HessianKernel = {
  slots: [0, 1],
  accumulate(x, table, sink) {
    const { atoms, params, count } = table;
    for (let t = 0; t < count; t++) {
      const ai = atoms[2 * t];
      const aj = atoms[2 * t + 1];
      const i = 3 * ai;
      const j = 3 * aj;
      const D = params[3 * t];
      const a = params[3 * t + 1];
      const r0 = params[3 * t + 2];
      const dx = x[j] - x[i];
      const dy = x[j + 1] - x[i + 1];
      const dz = x[j + 2] - x[i + 2];
      const r2 = dx * dx + dy * dy + dz * dz;
      const r = Math.sqrt(r2);
      const ex = Math.exp(-a * (r - r0));
      let e2 = 0;
      let f = 0;
      if (r > 0) {
        e2 = 2 * D * a * a * ex * (2 * ex - 1);
        f = (2 * D * a * ex * (1 - ex)) / r;
      }
      emitPair(sink, ai, aj, e2, f, dx, dy, dz, r2);
    }
  },
};
