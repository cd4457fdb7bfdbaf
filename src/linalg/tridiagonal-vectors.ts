/**
 * Eigenvectors of a symmetric tridiagonal matrix from its eigenvalues, by
 * inverse iteration with reorthogonalization within clusters.
 *
 * Method: the inverse iteration of LAPACK's dstein (Anderson et al.,
 * LAPACK Users' Guide, 3rd ed. 1999; Golub & Van Loan, Matrix
 * Computations, 4th ed. 2013, §8.2.2 and §8.4), written anew. The matrix
 * is first split where an off-diagonal is negligible
 * (|e[i]| ≤ ε (|d[i]| + |d[i+1]|), the QL test; setting it to zero changes
 * T by at most ε‖T‖). Each unreduced block is scaled by a power of two to
 * a 1-norm near 1 (exactly, so that no solve can overflow or underflow);
 * in it, the eigenvalues (from QL
 * without vectors) are taken in ascending order; those closer than
 * 10⁻³ ‖T_block‖₁ to the previous one join its cluster. For each eigenvalue
 * λ, T − σI (σ = λ, nudged by 10 ε |λ| above the previous shift when two
 * coincide) is factored once with partial pivoting (O(n)); a pseudo-random
 * start vector is then repeatedly solved against it, made orthogonal to the
 * vectors already found in the cluster (modified Gram–Schmidt, repeated
 * when it removed more than half of the norm), and normalized. The
 * iteration has converged when the solve grew the vector so much that the
 * residual ‖(T − σI) y‖ is at most √10 m^{3/2} ε ‖T_block‖₁ (m the block
 * size; dstein's test), and two more iterations follow. Vectors of
 * different blocks have disjoint supports, so are exactly orthogonal.
 * @module
 */
import { tridiagonalQL } from './tridiagonal-ql.js';

const EPSILON = 2 ** -52;
/** Solves before the residual test must have passed (dstein's MAXITS). */
const MAX_ITERATIONS = 5;
/** Solves after it passed (dstein's EXTRA). */
const EXTRA_ITERATIONS = 2;

/**
 * The eigen-decomposition of the symmetric tridiagonal matrix with
 * diagonal `d` and off-diagonal `e` (`e[i]` = T(i, i+1), length ≥ n − 1;
 * neither is modified).
 *
 * Writes: `values` (length n) ← the eigenvalues, ascending within each
 * unreduced block but not overall; `rows` (row-major n×n) ← row r the unit
 * eigenvector of T for `values[r]`.
 *
 * @returns the number of QL sweeps spent on the eigenvalues, or −1 when an
 *   eigenvalue did not converge in QL or an eigenvector did not converge in
 *   inverse iteration (or met a non-finite number); then `values` and
 *   `rows` are unspecified and the caller falls back to QL with vectors.
 *   Allocates O(n) scratch, never throws.
 */
export function tridiagonalEigenvectors(d: Float64Array, e: Float64Array, n: number, values: Float64Array, rows: Float64Array): number {
  rows.fill(0);
  const work = new Float64Array(8 * n + 2);
  const pivots = new Uint8Array(n);
  let seed = 0x2545f491;
  let sweeps = 0;
  let start = 0;
  while (start < n) {
    let end = start;
    while (end < n - 1 && Math.abs(e[end]) > EPSILON * (Math.abs(d[end]) + Math.abs(d[end + 1]))) end++;
    const m = end - start + 1;
    if (m === 1) {
      values[start] = d[start];
      rows[start * n + start] = 1;
      start = end + 1;
      continue;
    }
    // The block scaled by a power of two to ‖·‖₁ ≈ 1 (exact), so that the solves can neither overflow nor underflow.
    let blockNorm = 0; // ‖T_block‖₁
    for (let i = start; i <= end; i++) {
      const s = Math.abs(d[i]) + (i > start ? Math.abs(e[i - 1]) : 0) + (i < end ? Math.abs(e[i]) : 0);
      if (s > blockNorm) blockNorm = s;
    }
    const scale = 2 ** -Math.round(Math.log2(blockNorm));
    if (!(scale > 0 && scale < Infinity && 1 / scale < Infinity)) return -1;
    const sd = work.subarray(6 * m, 7 * m);
    const se = work.subarray(7 * m, 8 * m);
    for (let i = 0; i < m; i++) {
      sd[i] = d[start + i] * scale;
      se[i] = i < m - 1 ? e[start + i] * scale : 0;
    }
    let norm = 0;
    for (let i = 0; i < m; i++) {
      const s = Math.abs(sd[i]) + (i > 0 ? Math.abs(se[i - 1]) : 0) + Math.abs(se[i]);
      if (s > norm) norm = s;
    }
    // Eigenvalues of the (scaled) block, ascending.
    const bd = values.subarray(start, end + 1);
    bd.set(sd);
    const be = work.subarray(0, m);
    be.set(se);
    const used = tridiagonalQL(bd, be, m);
    if (used < 0) return -1;
    sweeps += used;
    bd.sort();
    const clusterGap = 1e-3 * norm;
    const accept = Math.sqrt(10) * m * Math.sqrt(m) * EPSILON * norm;
    const tiny = EPSILON * norm;
    const u0 = work.subarray(m, 2 * m);
    const u1 = work.subarray(2 * m, 3 * m);
    const u2 = work.subarray(3 * m, 4 * m);
    const mult = work.subarray(4 * m, 5 * m);
    const x = work.subarray(5 * m, 6 * m);
    let clusterStart = 0;
    let shift = 0;
    for (let j = 0; j < m; j++) {
      const lambda = bd[j];
      if (j > 0 && lambda - bd[j - 1] > clusterGap) clusterStart = j;
      if (j === 0 || j === clusterStart) shift = lambda;
      else shift = Math.max(lambda, shift + 10 * EPSILON * Math.max(Math.abs(lambda), tiny));
      factor(sd, se, 0, m, shift, tiny, u0, u1, u2, mult, pivots);
      for (let i = 0; i < m; i++) {
        seed = (Math.imul(seed, 1103515245) + 12345) >>> 0;
        x[i] = seed / 4294967296 - 0.5;
      }
      normalize(x, m);
      let passed = -1;
      for (let it = 0; ; it++) {
        solve(m, u0, u1, u2, mult, pivots, x);
        const grown = orthogonalize(x, m, rows, n, start, clusterStart, j);
        if (!(grown > 0) || !Number.isFinite(grown)) return -1;
        // x had ‖·‖₂ = 1 before the solve: the residual of x/‖x‖ is about 1/grown.
        const scale = 1 / grown;
        for (let i = 0; i < m; i++) x[i] *= scale;
        if (passed < 0 && scale <= accept) passed = it;
        if (passed >= 0 && it - passed >= EXTRA_ITERATIONS) break;
        if (passed < 0 && it + 1 >= MAX_ITERATIONS) return -1;
      }
      rows.set(x, (start + j) * n + start);
    }
    if (!verified(sd, se, m, bd, rows, n, start, clusterGap, accept)) return -1;
    for (let j = 0; j < m; j++) bd[j] /= scale;
    start = end + 1;
  }
  return sweeps;
}

/**
 * A posteriori check of a block's vectors (found by the property tests: a
 * rare matrix with splits near 1e-9 got vectors with residual 0.4 although
 * every iteration had "converged"): each residual ‖T z − λ z‖∞ must be at
 * most `accept` and, within each cluster, |z_pᵀ z_q| at most 1e-12. Across
 * clusters orthogonality follows from small residuals and the gap. O(m) per
 * vector plus the clusters' Gram matrices; false sends the caller to its
 * fallback (QL with vectors).
 */
function verified(
  sd: Float64Array,
  se: Float64Array,
  m: number,
  values: Float64Array,
  rows: Float64Array,
  n: number,
  offset: number,
  clusterGap: number,
  accept: number,
): boolean {
  let clusterStart = 0;
  for (let j = 0; j < m; j++) {
    const base = (offset + j) * n + offset;
    const lambda = values[j];
    for (let i = 0; i < m; i++) {
      let tz = (sd[i] - lambda) * rows[base + i];
      if (i > 0) tz += se[i - 1] * rows[base + i - 1];
      if (i < m - 1) tz += se[i] * rows[base + i + 1];
      if (!(Math.abs(tz) <= accept)) return false;
    }
    if (j > 0 && lambda - values[j - 1] > clusterGap) clusterStart = j;
    for (let q = clusterStart; q <= j; q++) {
      const other = (offset + q) * n + offset;
      let dot = 0;
      for (let i = 0; i < m; i++) dot += rows[base + i] * rows[other + i];
      if (!(Math.abs(dot - (q === j ? 1 : 0)) <= 1e-12)) return false;
    }
  }
  return true;
}

/** x ← x / ‖x‖₂. */
function normalize(x: Float64Array, m: number): void {
  let s = 0;
  for (let i = 0; i < m; i++) s += x[i] * x[i];
  const f = 1 / Math.sqrt(s);
  for (let i = 0; i < m; i++) x[i] *= f;
}

/**
 * Remove from x its components along rows first … j − 1 of the block (the
 * cluster's vectors so far; columns `offset` … of `rows`), by modified
 * Gram–Schmidt, a second time when the first removed more than half of
 * ‖x‖. Returns ‖x‖₂ afterwards (the length before normalization).
 */
function orthogonalize(x: Float64Array, m: number, rows: Float64Array, n: number, offset: number, first: number, j: number): number {
  let before = 0;
  for (let i = 0; i < m; i++) before += x[i] * x[i];
  if (first === j) return Math.sqrt(before);
  for (let pass = 0; pass < 2; pass++) {
    for (let q = first; q < j; q++) {
      const base = (offset + q) * n + offset;
      let dot = 0;
      for (let i = 0; i < m; i++) dot += rows[base + i] * x[i];
      for (let i = 0; i < m; i++) x[i] -= dot * rows[base + i];
    }
    let after = 0;
    for (let i = 0; i < m; i++) after += x[i] * x[i];
    if (after > 0.25 * before) return Math.sqrt(after);
    before = after;
  }
  return Math.sqrt(before);
}

/**
 * LU factorization with partial pivoting of T − σI for the block of T
 * starting at `offset` (size m): U has diagonals u0 (the reciprocals of the
 * main diagonal, so that the solves multiply), u1, u2 (first and second above), `mult` the multipliers, `pivots[k]` = 1 when rows k and
 * k+1 were interchanged. Pivots smaller than `tiny` in magnitude are
 * replaced by ±tiny (the perturbation of dstein's solver).
 */
function factor(
  d: Float64Array,
  e: Float64Array,
  offset: number,
  m: number,
  shift: number,
  tiny: number,
  u0: Float64Array,
  u1: Float64Array,
  u2: Float64Array,
  mult: Float64Array,
  pivots: Uint8Array,
): void {
  let diag = d[offset] - shift;
  let sup = m > 1 ? e[offset] : 0;
  for (let k = 0; k < m - 1; k++) {
    const sub = e[offset + k];
    const next = d[offset + k + 1] - shift;
    const nextSup = k + 2 < m ? e[offset + k + 1] : 0;
    if (Math.abs(diag) >= Math.abs(sub)) {
      pivots[k] = 0;
      const pivot = Math.abs(diag) < tiny ? (diag < 0 ? -tiny : tiny) : diag;
      const l = sub / pivot;
      mult[k] = l;
      u0[k] = 1 / pivot;
      u1[k] = sup;
      u2[k] = 0;
      diag = next - l * sup;
      sup = nextSup;
    } else {
      pivots[k] = 1;
      const l = diag / sub;
      mult[k] = l;
      u0[k] = 1 / sub;
      u1[k] = next;
      u2[k] = nextSup;
      diag = sup - l * next;
      sup = -l * nextSup;
    }
  }
  u0[m - 1] = 1 / (Math.abs(diag) < tiny ? (diag < 0 ? -tiny : tiny) : diag);
  u1[m - 1] = 0;
  u2[m - 1] = 0;
}

/** x ← (T − σI)⁻¹ x with the factors of {@link factor}. */
function solve(
  m: number,
  u0: Float64Array,
  u1: Float64Array,
  u2: Float64Array,
  mult: Float64Array,
  pivots: Uint8Array,
  x: Float64Array,
): void {
  for (let k = 0; k < m - 1; k++) {
    if (pivots[k] === 1) {
      const t = x[k];
      x[k] = x[k + 1];
      x[k + 1] = t - mult[k] * x[k];
    } else {
      x[k + 1] -= mult[k] * x[k];
    }
  }
  x[m - 1] *= u0[m - 1];
  if (m > 1) x[m - 2] = (x[m - 2] - u1[m - 2] * x[m - 1]) * u0[m - 2];
  for (let k = m - 3; k >= 0; k--) x[k] = (x[k] - u1[k] * x[k + 1] - u2[k] * x[k + 2]) * u0[k];
}
