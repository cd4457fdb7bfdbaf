/**
 * Householder reduction of a real symmetric matrix to tridiagonal form,
 * A = Q T Qᵀ, working on rows of a row-major array.
 *
 * Method: Householder similarity transforms (Golub & Van Loan, Matrix
 * Computations, 4th ed. 2013, §8.3.1). Step k reflects row k beyond the
 * diagonal onto its first entry with H_k = I − β v vᵀ and updates the
 * trailing block as A ← H A H = A − v wᵀ − w vᵀ, where p = β A v and
 * w = p − (β pᵀv / 2) v. Only the upper triangle (column ≥ row) is read and
 * written, so every inner loop runs along a row.
 * @module
 */

/**
 * Reduce the symmetric `n`×`n` matrix held in the upper triangle of `a`
 * (row-major, entry (i, j) at `a[i * n + j]`, j ≥ i read; the lower
 * triangle is neither read nor kept) to tridiagonal form.
 *
 * Writes: `diagonal[i]` = T(i, i) (length n), `offDiagonal[i]` = T(i, i + 1)
 * for i < n − 1 (length n, the last entry set to 0), `beta[k]` the
 * reflector scale of step k (length n), and overwrites `a`: row k, columns
 * k + 1 … n − 1, holds the reflector vector v of step k; the rest of `a` is
 * scratch. `scratch` must have length ≥ n. Never allocates, never throws.
 */
export function tridiagonalize(
  a: Float64Array,
  n: number,
  diagonal: Float64Array,
  offDiagonal: Float64Array,
  beta: Float64Array,
  scratch: Float64Array,
): void {
  const p = scratch;
  for (let k = 0; k < n - 1; k++) {
    const row = k * n;
    const start = k + 1;
    diagonal[k] = a[row + k];
    // x = a[k, k+1 .. n-1]; reflect it onto alpha e1.
    let tail = 0;
    for (let j = start + 1; j < n; j++) tail += a[row + j] * a[row + j];
    const x0 = a[row + start];
    if (tail === 0) {
      // Already tridiagonal in this row: no reflection.
      offDiagonal[k] = x0;
      beta[k] = 0;
      a[row + start] = 0;
      continue;
    }
    const norm = Math.sqrt(x0 * x0 + tail);
    const alpha = x0 > 0 ? -norm : norm;
    const b = 1 / (alpha * (alpha - x0)); // 2 / vᵀv, with v = x − alpha e1
    a[row + start] = x0 - alpha;
    offDiagonal[k] = alpha;
    beta[k] = b;
    // p = b A22 v, from the upper triangle of the trailing block.
    for (let i = start; i < n; i++) p[i] = 0;
    for (let i = start; i < n; i++) {
      const ri = i * n;
      const vi = a[row + i];
      let s = a[ri + i] * vi;
      for (let j = i + 1; j < n; j++) {
        const aij = a[ri + j];
        s += aij * a[row + j];
        p[j] += aij * vi;
      }
      p[i] += s;
    }
    let pv = 0;
    for (let i = start; i < n; i++) {
      p[i] *= b;
      pv += p[i] * a[row + i];
    }
    const half = 0.5 * b * pv;
    for (let i = start; i < n; i++) p[i] -= half * a[row + i]; // p is now w
    // A22 ← A22 − v wᵀ − w vᵀ (upper triangle).
    for (let i = start; i < n; i++) {
      const ri = i * n;
      const vi = a[row + i];
      const wi = p[i];
      for (let j = i; j < n; j++) a[ri + j] -= vi * p[j] + wi * a[row + j];
    }
  }
  if (n > 0) {
    diagonal[n - 1] = a[(n - 1) * n + n - 1];
    offDiagonal[n - 1] = 0;
    beta[n - 1] = 0;
  }
}

/**
 * Form Qᵀ = H_{n−2} ⋯ H_1 H_0 from the reflectors {@link tridiagonalize}
 * left in `a` and `beta`, into `out` (row-major n×n; row i of `out` is
 * column i of Q). Accumulated from the right, M ← M H_k for k descending,
 * so that only the trailing block is touched and every loop runs along a
 * row. `scratch` length ≥ n. Never allocates, never throws.
 */
export function reflectorsTransposed(a: Float64Array, n: number, beta: Float64Array, out: Float64Array, scratch: Float64Array): void {
  out.fill(0);
  for (let i = 0; i < n; i++) out[i * n + i] = 1;
  const u = scratch;
  for (let k = n - 2; k >= 0; k--) {
    const b = beta[k];
    if (b === 0) continue;
    const row = k * n;
    const start = k + 1;
    // u = M v over the trailing block (rows and columns ≥ start).
    for (let i = start; i < n; i++) {
      const ri = i * n;
      let s = 0;
      for (let j = start; j < n; j++) s += out[ri + j] * a[row + j];
      u[i] = b * s;
    }
    for (let i = start; i < n; i++) {
      const ri = i * n;
      const ui = u[i];
      if (ui === 0) continue;
      for (let j = start; j < n; j++) out[ri + j] -= ui * a[row + j];
    }
  }
}
