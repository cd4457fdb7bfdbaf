/**
 * Eigenvalues and orthonormal eigenvectors of a real symmetric matrix:
 * Householder tridiagonalization A = Q T Qᵀ (./tridiagonal.ts); the
 * eigenvalues of T by the implicit QL method with Wilkinson shifts
 * (./tridiagonal-ql.ts); the eigenvectors of T by inverse iteration with
 * reorthogonalization in clusters (./tridiagonal-vectors.ts), carried back
 * to A by the reflectors (about 10n³/3 operations in all). Should inverse
 * iteration fail to converge, QL is run again accumulating every rotation
 * into the vectors (about 9n³ operations), which cannot lose orthogonality.
 * @module
 */
import { applyReflectorsToRows, reflectorsTransposed, tridiagonalize } from './tridiagonal.js';
import { tridiagonalEigenvectors } from './tridiagonal-vectors.js';
import { QL_SWEEPS_PER_EIGENVALUE, tridiagonalQL } from './tridiagonal-ql.js';

/** The eigen-decomposition of a symmetric n×n matrix A = V diag(values) Vᵀ. */
export interface SymmetricEigen {
  /** n, the order of the matrix. */
  readonly size: number;
  /** The n eigenvalues, ascending. */
  readonly values: Float64Array;
  /**
   * The orthonormal eigenvectors, one per ROW (row-major n×n): eigenvector
   * i, for `values[i]`, is `vectors.subarray(i * n, (i + 1) * n)`. This is
   * Vᵀ in the usual notation. Empty (length 0) when vectors were not asked for.
   */
  readonly vectors: Float64Array;
  /** QL sweeps used over all eigenvalues. */
  readonly sweeps: number;
}

/** Options of {@link symmetricEigen}. */
export interface SymmetricEigenOptions {
  /** Compute the eigenvectors (default true); without them the cost drops from about 10n³/3 to 4n³/3 operations. */
  readonly vectors?: boolean;
  /**
   * How the eigenvectors are found: `'inverse-iteration'` (default; falls
   * back to `'ql'` by itself when an eigenvector does not converge) or
   * `'ql'`, the rotations of the QL sweeps accumulated into the vectors
   * (about three times slower, the same accuracy).
   */
  readonly method?: 'inverse-iteration' | 'ql';
}

/** The QL iteration did not converge (practically never happens for finite input). */
export class EigenConvergenceError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'EigenConvergenceError';
  }
}

/**
 * Diagonalize the real symmetric matrix `matrix` (row-major n×n, entry
 * (i, j) at `matrix[i * n + j]`). Only the upper triangle (j ≥ i) is read;
 * `matrix` is not modified.
 *
 * @param n - the order; default √(matrix.length).
 * @returns eigenvalues ascending and, unless `options.vectors` is false,
 *   orthonormal eigenvectors as rows (see {@link SymmetricEigen}). The
 *   residual ‖A v − λ v‖ is of the order of the unit roundoff times ‖A‖.
 * @throws RangeError when `matrix.length` is not n², or an entry of the
 *   upper triangle is not finite (naming the entry).
 * @throws {@link EigenConvergenceError} when an eigenvalue does not converge
 *   within 60 QL sweeps (inverse iteration that does not converge is not an
 *   error: QL with vectors takes over).
 */
export function symmetricEigen(matrix: Float64Array, n?: number, options: SymmetricEigenOptions = {}): SymmetricEigen {
  const size = n ?? Math.round(Math.sqrt(matrix.length));
  if (!Number.isInteger(size) || size < 0 || matrix.length !== size * size) {
    throw new RangeError(`symmetricEigen: matrix: expected n² = ${size * size} numbers for n = ${size}, got ${matrix.length}`);
  }
  for (let i = 0; i < size; i++) {
    for (let j = i; j < size; j++) {
      if (!Number.isFinite(matrix[i * size + j])) {
        throw new RangeError(`symmetricEigen: matrix[${i}][${j}] is ${matrix[i * size + j]}, expected a finite number`);
      }
    }
  }
  const wantVectors = options.vectors !== false;
  const a = Float64Array.from(matrix);
  const d = new Float64Array(size);
  const e = new Float64Array(size);
  const beta = new Float64Array(size);
  const scratch = new Float64Array(2 * size);
  tridiagonalize(a, size, d, e, beta, scratch);
  if (wantVectors && size > 2 && options.method !== 'ql') {
    // Fast path: eigenvalues of T, eigenvectors of T by inverse iteration, then back to A.
    const tValues = new Float64Array(size);
    const tRows = new Float64Array(size * size);
    const sweeps = tridiagonalEigenvectors(d, e, size, tValues, tRows);
    if (sweeps >= 0) {
      applyReflectorsToRows(a, size, beta, tRows, size);
      return sortedPairs(tValues, tRows, size, sweeps);
    }
  }
  let rows: Float64Array | undefined;
  if (wantVectors) {
    rows = new Float64Array(size * size);
    reflectorsTransposed(a, size, beta, rows, scratch);
  }
  let known: Float64Array | undefined;
  if (rows !== undefined && size > 2) {
    // Eigenvalues first (O(n²)), then the sweeps on the vectors with them as shifts.
    known = d.slice();
    const first = tridiagonalQL(known, e.slice(), size);
    if (first < 0) known = undefined;
    else known.sort();
  }
  const sweeps = tridiagonalQL(d, e, size, rows, known);
  if (sweeps < 0) {
    throw new EigenConvergenceError(
      `symmetricEigen: eigenvalue ${-1 - sweeps} of ${size} did not converge within ${QL_SWEEPS_PER_EIGENVALUE} QL sweeps`,
    );
  }
  return sortedPairs(d, rows, size, sweeps);
}

/** Values ascending, with the rows of `rows` (when given) permuted alike. */
function sortedPairs(d: Float64Array, rows: Float64Array | undefined, size: number, sweeps: number): SymmetricEigen {
  const order = Array.from({ length: size }, (_, i) => i).sort((p, q) => d[p] - d[q]);
  const values = Float64Array.from(order, (i) => d[i]);
  let vectors = new Float64Array(0);
  if (rows !== undefined) {
    vectors = new Float64Array(size * size);
    for (let r = 0; r < size; r++) vectors.set(rows.subarray(order[r] * size, (order[r] + 1) * size), r * size);
  }
  return { size, values, vectors, sweeps };
}
