/**
 * Eigenvalues (and optionally eigenvectors) of a symmetric tridiagonal
 * matrix by the implicit QL method with Wilkinson shifts.
 *
 * Method: Bowdler, Martin, Reinsch & Wilkinson, "The QR and QL algorithms
 * for symmetric matrices", Numer. Math. 11 (1968) 293; see also Golub &
 * Van Loan, Matrix Computations, 4th ed. 2013, §8.3. Each sweep works on an
 * unreduced block l … m (off-diagonals e[l … m−1] non-negligible). The shift
 * is the eigenvalue of the leading 2×2 block nearer to d[l] (Wilkinson's
 * choice); the bulge it makes is chased from the bottom of the block to its
 * top with plane rotations. When the eigenvalues are known already (a
 * first pass without vectors costs O(n²)), the first sweep of each block
 * uses the known eigenvalue nearest to Wilkinson's shift instead, which
 * usually splits off an eigenvalue in one sweep and so halves the work on
 * the vectors; any shift keeps every step an exact orthogonal similarity,
 * so this changes only the number of sweeps, never the accuracy. An
 * off-diagonal counts as negligible when
 * |e[i]| ≤ ε (|d[i]| + |d[i+1]|) with ε the double-precision unit roundoff.
 * @module
 */

const EPSILON = 2 ** -52;

/** Sweeps allowed per eigenvalue before {@link tridiagonalQL} gives up. */
export const QL_SWEEPS_PER_EIGENVALUE = 60;

/**
 * Diagonalize the symmetric tridiagonal matrix with diagonal `d` (length n)
 * and off-diagonal `e` (`e[i]` = T(i, i+1), length ≥ n; `e[n−1]` ignored)
 * in place.
 *
 * Writes: `d` ← the eigenvalues (in no particular order), `e` ← scratch.
 * When `rows` is given (row-major n×n), every plane rotation G acting on
 * indices (i, i+1) is applied to rows i and i+1 of it (rows ← Gᵀ rows), so
 * starting from Qᵀ of A = Q T Qᵀ, row i ends as the eigenvector of A for
 * `d[i]`; starting from the identity, as that of T.
 *
 * `knownValues`, when given, holds the eigenvalues of this matrix sorted
 * ascending (from an earlier call without `rows`); they serve as shifts.
 *
 * @returns the number of sweeps, or −1 − i when eigenvalue i did not
 *   converge within {@link QL_SWEEPS_PER_EIGENVALUE} sweeps (the caller
 *   reports it). Never allocates, never throws.
 */
export function tridiagonalQL(d: Float64Array, e: Float64Array, n: number, rows?: Float64Array, knownValues?: Float64Array): number {
  let sweeps = 0;
  if (n > 0) e[n - 1] = 0;
  const used = knownValues === undefined ? undefined : new Uint8Array(knownValues.length);
  for (let l = 0; l < n; l++) {
    let iterations = 0;
    for (;;) {
      // Find the end m of the unreduced block that starts at l.
      let m = l;
      for (; m < n - 1; m++) {
        const scale = Math.abs(d[m]) + Math.abs(d[m + 1]);
        if (Math.abs(e[m]) <= EPSILON * scale) break;
      }
      if (m === l) {
        if (used !== undefined) take(knownValues as Float64Array, used, d[l]);
        break;
      }
      if (iterations++ === QL_SWEEPS_PER_EIGENVALUE) return -1 - l;
      sweeps++;
      // Wilkinson shift from the leading 2×2 block [d_l e_l; e_l d_{l+1}].
      let g = (d[l + 1] - d[l]) / (2 * e[l]);
      let r = hypot(g, 1);
      let shift = d[l] - e[l] / (g + (g >= 0 ? r : -r));
      if (used !== undefined && iterations <= 2) shift = nearestUnused(knownValues as Float64Array, used, shift, false);
      // Chase the bulge from m − 1 up to l.
      let s = 1;
      let c = 1;
      let p = 0;
      g = d[m] - shift;
      let i = m - 1;
      let underflow = false;
      // Rotations go to the rows in pairs, (i+1, i+2) then (i, i+1) in one pass over three rows.
      let pending = -1;
      let pc = 1;
      let ps = 0;
      for (; i >= l; i--) {
        const f = s * e[i];
        const b = c * e[i];
        r = hypot(f, g);
        e[i + 1] = r;
        if (r === 0) {
          // The rotation vanished: the block splits here; undo the last update and restart.
          d[i + 1] -= p;
          e[m] = 0;
          underflow = true;
          break;
        }
        s = f / r;
        c = g / r;
        g = d[i + 1] - p;
        r = (d[i] - g) * s + 2 * c * b;
        p = s * r;
        d[i + 1] = g + p;
        g = c * r - b;
        if (rows !== undefined) {
          if (pending === i + 1) {
            rotateRowPairs(rows, n, i, pc, ps, c, s);
            pending = -1;
          } else {
            pending = i;
            pc = c;
            ps = s;
          }
        }
      }
      if (rows !== undefined && pending >= 0) rotateRows(rows, n, pending, pc, ps);
      if (underflow) continue;
      d[l] -= p;
      e[l] = g;
      e[m] = 0;
    }
  }
  return sweeps;
}

/** The rotation (c1, s1) of rows i+1, i+2 and then (c2, s2) of rows i, i+1, in one pass. */
function rotateRowPairs(rows: Float64Array, n: number, i: number, c1: number, s1: number, c2: number, s2: number): void {
  const a = i * n;
  const b = a + n;
  const e = b + n;
  for (let k = 0; k < n; k++) {
    const x0 = rows[a + k];
    const x1 = rows[b + k];
    const x2 = rows[e + k];
    const t1 = c1 * x1 - s1 * x2;
    rows[e + k] = s1 * x1 + c1 * x2;
    rows[b + k] = s2 * x0 + c2 * t1;
    rows[a + k] = c2 * x0 - s2 * t1;
  }
}

/** √(a² + b²), without Math.hypot's cost where no overflow or underflow can occur. */
function hypot(a: number, b: number): number {
  const m = Math.max(Math.abs(a), Math.abs(b));
  return m < 1e150 && m > 1e-150 ? Math.sqrt(a * a + b * b) : Math.hypot(a, b);
}

/**
 * The entry of the ascending `values` nearest to `x` among those not yet
 * `used` (or `x` itself when all are); with `mark`, marks it used.
 */
function nearestUnused(values: Float64Array, used: Uint8Array, x: number, mark: boolean): number {
  let lo = 0;
  let hi = values.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (values[mid] < x) lo = mid;
    else hi = mid;
  }
  while (lo >= 0 && used[lo]) lo--;
  while (hi < values.length && used[hi]) hi++;
  let best = -1;
  if (lo >= 0) best = lo;
  if (hi < values.length && (best < 0 || Math.abs(values[hi] - x) < Math.abs(values[best] - x))) best = hi;
  if (best < 0) return x;
  if (mark) used[best] = 1;
  return values[best];
}

/** Mark the known eigenvalue nearest to the converged `value` as used. */
function take(values: Float64Array, used: Uint8Array, value: number): void {
  nearestUnused(values, used, value, true);
}

/** The QL step's rotation of rows i and i+1: row_i ← c·row_i − s·row_{i+1}, row_{i+1} ← s·row_i + c·row_{i+1}. */
function rotateRows(rows: Float64Array, n: number, i: number, c: number, s: number): void {
  const a = i * n;
  const b = a + n;
  for (let k = 0; k < n; k++) {
    const x = rows[a + k];
    const y = rows[b + k];
    rows[b + k] = s * x + c * y;
    rows[a + k] = c * x - s * y;
  }
}
