/**
 * Restricting a symmetric matrix to the orthogonal complement of a few
 * orthonormal vectors, with Householder reflectors (Golub & Van Loan,
 * Matrix Computations, 4th ed. 2013, §5.1 and §5.2: a QR factorization
 * B = Q R of the k basis vectors gives Q, whose last n − k columns are an
 * orthonormal basis D of the complement).
 * @module
 */

/** A symmetric matrix restricted to the complement of k orthonormal vectors, and the way back. */
export interface ComplementRestriction {
  /** n − k, the order of {@link matrix}. */
  readonly size: number;
  /** Dᵀ A D, row-major (n − k)×(n − k), symmetric (both triangles written). */
  readonly matrix: Float64Array;
  /**
   * Map a vector y of the complement's coordinates (length n − k) to the
   * full space: writes D y into `out` (length n) and returns it. Lengths
   * and angles are kept (D has orthonormal columns), and D y is orthogonal
   * to every basis vector. Allocates nothing.
   */
  lift(y: Float64Array, out: Float64Array): Float64Array;
}

/**
 * Restrict the symmetric `n`×`n` matrix `matrix` (row-major, both
 * triangles read) to the orthogonal complement of the `k` orthonormal
 * vectors stored as the rows of `basis` (row-major k×n). Equivalent to
 * diagonalizing P A P with P = I − B Bᵀ and dropping the k null directions
 * of B, but the dropped space is exactly span(B) by construction, so no
 * eigenvector has to be chosen by its eigenvalue or its overlap.
 *
 * Inputs are not modified. Cost about 8 k n² operations.
 * @throws RangeError when the lengths do not fit n and k, or when the rows
 *   of `basis` are not orthonormal to 1e-8.
 */
export function restrictToComplement(matrix: Float64Array, n: number, basis: Float64Array, k: number): ComplementRestriction {
  if (matrix.length !== n * n) throw new RangeError(`restrictToComplement: matrix: expected n² = ${n * n} numbers, got ${matrix.length}`);
  if (!Number.isInteger(k) || k < 0 || k > n || basis.length !== k * n) {
    throw new RangeError(`restrictToComplement: basis: expected k×n = ${k}×${n} numbers, got ${basis.length}`);
  }
  for (let r = 0; r < k; r++) {
    for (let s = r; s < k; s++) {
      let dot = 0;
      for (let j = 0; j < n; j++) dot += basis[r * n + j] * basis[s * n + j];
      if (Math.abs(dot - (r === s ? 1 : 0)) > 1e-8) {
        throw new RangeError(`restrictToComplement: basis rows ${r} and ${s} are not orthonormal (dot product ${dot})`);
      }
    }
  }
  // Householder QR of the basis: reflector r maps (current) row r onto ±e_r.
  const v = new Float64Array(k * n);
  const beta = new Float64Array(k);
  const b = Float64Array.from(basis);
  for (let r = 0; r < k; r++) {
    const row = r * n;
    let norm2 = 0;
    for (let j = r; j < n; j++) norm2 += b[row + j] * b[row + j];
    const x0 = b[row + r];
    const alpha = x0 > 0 ? -Math.sqrt(norm2) : Math.sqrt(norm2);
    for (let j = r; j < n; j++) v[row + j] = b[row + j];
    v[row + r] = x0 - alpha;
    beta[r] = 1 / (alpha * (alpha - x0));
    for (let s = r + 1; s < k; s++) reflect(v, row, beta[r], b, s * n, r, n);
  }
  // A ← H_r A H_r for r = 0 … k−1 (full storage): A − v wᵀ − w vᵀ, w = p − (β pᵀv / 2) v, p = β A v.
  const a = Float64Array.from(matrix);
  const p = new Float64Array(n);
  for (let r = 0; r < k; r++) {
    const row = r * n;
    const bt = beta[r];
    let pv = 0;
    for (let i = 0; i < n; i++) {
      let s = 0;
      for (let j = r; j < n; j++) s += a[i * n + j] * v[row + j];
      p[i] = bt * s;
    }
    for (let i = r; i < n; i++) pv += p[i] * v[row + i];
    const half = 0.5 * bt * pv;
    for (let i = r; i < n; i++) p[i] -= half * v[row + i];
    // v is zero before index r: rows and columns below r change only through w.
    for (let i = 0; i < n; i++) {
      const vi = i >= r ? v[row + i] : 0;
      const wi = p[i];
      const ri = i * n;
      for (let j = 0; j < n; j++) a[ri + j] -= vi * p[j] + wi * (j >= r ? v[row + j] : 0);
    }
  }
  const size = n - k;
  const restricted = new Float64Array(size * size);
  for (let i = 0; i < size; i++) restricted.set(a.subarray((k + i) * n + k, (k + i + 1) * n), i * size);
  return {
    size,
    matrix: restricted,
    lift(y, out) {
      out.fill(0, 0, k);
      out.set(y.subarray(0, size), k);
      for (let r = k - 1; r >= 0; r--) reflect(v, r * n, beta[r], out, 0, r, n);
      return out;
    },
  };
}

/** target[offset + r … offset + n−1] ← (I − β u uᵀ) applied to it, u = v[row + r … row + n−1]. */
function reflect(v: Float64Array, row: number, beta: number, target: Float64Array, offset: number, r: number, n: number): void {
  let dot = 0;
  for (let j = r; j < n; j++) dot += v[row + j] * target[offset + j];
  const f = beta * dot;
  for (let j = r; j < n; j++) target[offset + j] -= f * v[row + j];
}
