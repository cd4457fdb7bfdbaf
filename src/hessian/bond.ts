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

/** Which energy of r a pair loop evaluates (plain numbers: shared with restraint.ts). */
export const PAIR_HARMONIC = 0;
export const PAIR_MORSE = 1;
export const PAIR_DISTANCE_RESTRAINT = 2;

/**
 * The Hessian blocks of every term of `table` whose energy is a function of
 * r = |x_cj − x_ci| (columns ci, cj of the term's atoms): K = (E'/r) I +
 * (E'' − E'/r) d dᵀ / r² and −K, handed to the sink in slot order
 * (i,i), (i,j), (j,i), (j,j). One loop for every pair kind, so that no
 * floating-point number crosses a function call (V8 would box it).
 */
export function pairHessians(
  x: Float64Array,
  table: TermTable,
  sink: HessianSink,
  ci: number,
  cj: number,
  form: number,
): void {
  const { atoms, params, count, arity, width } = table;
  const h = pairScratch;
  for (let t = 0; t < count; t++) {
    const ai = atoms[t * arity + ci];
    const aj = atoms[t * arity + cj];
    const i = 3 * ai;
    const j = 3 * aj;
    const p = t * width;
    const dx = x[j] - x[i];
    const dy = x[j + 1] - x[i + 1];
    const dz = x[j + 2] - x[i + 2];
    const r2 = dx * dx + dy * dy + dz * dz;
    const r = Math.sqrt(r2);
    let e2 = 0; // E''(r)
    let f = 0; // E'(r) / r
    if (form === PAIR_HARMONIC) {
      const k = params[p];
      const r0 = params[p + 1];
      if (r0 === 0) {
        e2 = k; // ½ k r²: K = k I exactly, at r = 0 too
        f = k;
      } else if (r > 0) {
        e2 = k;
        f = (k * (r - r0)) / r;
      }
    } else if (form === PAIR_MORSE) {
      const D = params[p];
      const a = params[p + 1];
      const ex = Math.exp(-a * (r - params[p + 2]));
      if (r > 0) {
        e2 = 2 * D * a * a * ex * (2 * ex - 1);
        f = (2 * D * a * ex * (1 - ex)) / r;
      }
    } else {
      const k = params[p];
      const lower = params[p + 1];
      const upper = params[p + 2];
      if ((r < lower || r > upper || lower === upper) && r > 0) {
        e2 = k;
        f = (k * (r - (r < lower ? lower : upper))) / r;
      }
    }
    const w = r2 > 0 ? (e2 - f) / r2 : 0;
    const xy = w * dx * dy;
    const xz = w * dx * dz;
    const yz = w * dy * dz;
    h[0] = f + w * dx * dx;
    h[1] = xy;
    h[2] = xz;
    h[3] = xy;
    h[4] = f + w * dy * dy;
    h[5] = yz;
    h[6] = xz;
    h[7] = yz;
    h[8] = f + w * dz * dz;
    for (let n = 0; n < 9; n++) h[9 + n] = -h[n];
    sink.add(ai, ai, h, 0, 3);
    sink.add(ai, aj, h, 9, 3);
    sink.add(aj, ai, h, 9, 3);
    sink.add(aj, aj, h, 0, 3);
  }
}

/**
 * Harmonic bond, E = ½ k (r − r0)², params [k, r0]: E'' = k, E'/r = k (r − r0)/r.
 * See {@link HessianKernel}.
 */
export const harmonicBondHessian: HessianKernel = {
  slots: [0, 1],
  accumulate: (x, table, sink) => pairHessians(x, table, sink, 0, 1, PAIR_HARMONIC),
};

/**
 * Urey–Bradley, E = ½ k (|x_k − x_i| − s0)², params [k, s0], atoms i j k:
 * a harmonic bond between i and k; j gets nothing (slots [0, 2]).
 */
export const ureyBradleyHessian: HessianKernel = {
  slots: [0, 2],
  accumulate: (x, table, sink) => pairHessians(x, table, sink, 0, 2, PAIR_HARMONIC),
};

/**
 * Morse bond, E = D [1 − e]², e = exp(−a (r − r0)), params [D, a, r0]:
 * E' = 2 D a e (1 − e), E'' = 2 D a² e (2e − 1) (so 2 D a² at r0, and
 * negative beyond the inflection r0 + ln 2 / a).
 */
export const morseBondHessian: HessianKernel = {
  slots: [0, 1],
  accumulate: (x, table, sink) => pairHessians(x, table, sink, 0, 1, PAIR_MORSE),
};
