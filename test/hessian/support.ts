/**
 * Helpers of the Hessian tests: a plain central-difference Hessian of a
 * kernel's analytic gradient (written here independently of
 * src/hessian/finite-difference.ts, so one can check the other), error
 * measures, products, and a Jacobi eigenvalue routine for small symmetric
 * matrices.
 */
import { tablesHessian } from '../../src/hessian/dense.js';
import { KERNELS } from '../../src/terms/kernels.js';
import type { TermTable } from '../../src/terms/table.js';

/** Number of atoms a flat coordinate array holds. */
export const atomsOf = (x: Float64Array): number => x.length / 3;

/** The analytic Hessian of one table at x (dense, (3N)², N from x). */
export function analytic(table: TermTable, x: Float64Array): Float64Array {
  return tablesHessian([table], atomsOf(x), x);
}

/** The kernel's analytic gradient at x (from zero). */
export function gradientOf(table: TermTable, x: Float64Array): Float64Array {
  const g = new Float64Array(x.length);
  KERNELS[table.kind](x, table, g);
  return g;
}

/**
 * Central differences of a gradient function, column by column, NOT
 * symmetrized, with the 4-point stencil of the gradient checker:
 * column j = (−g(x + 2h e_j) + 8 g(x + h e_j) − 8 g(x − h e_j) + g(x − 2h e_j)) / (12 h),
 * h = step · max(1, |x_j|) (truncation error O(h⁴), rounding O(ε/h)).
 */
export function centralHessian(grad: (x: Float64Array) => Float64Array, x: Float64Array, step: number): Float64Array {
  const n = x.length;
  const h = new Float64Array(n * n);
  const y = Float64Array.from(x);
  for (let j = 0; j < n; j++) {
    const d = step * Math.max(1, Math.abs(x[j]));
    y[j] = x[j] + 2 * d;
    const g2 = grad(y);
    y[j] = x[j] + d;
    const g1 = grad(y);
    y[j] = x[j] - d;
    const m1 = grad(y);
    y[j] = x[j] - 2 * d;
    const m2 = grad(y);
    y[j] = x[j];
    for (let i = 0; i < n; i++) h[i * n + j] = (-g2[i] + 8 * g1[i] - 8 * m1[i] + m2[i]) / (12 * d);
  }
  return h;
}

/** Central differences of a table kernel's analytic gradient. */
export function numericHessian(table: TermTable, x: Float64Array, step = 1e-4): Float64Array {
  return centralHessian((y) => gradientOf(table, y), x, step);
}

/** Largest absolute entry. */
export function maxAbs(values: ArrayLike<number>): number {
  let m = 0;
  for (let n = 0; n < values.length; n++) m = Math.max(m, Math.abs(values[n]));
  return m;
}

/** max |a − b| / max(1, max |a|): the gradient checker's relative measure, for matrices. */
export function relativeError(a: ArrayLike<number>, b: ArrayLike<number>): number {
  let e = 0;
  for (let n = 0; n < a.length; n++) e = Math.max(e, Math.abs(a[n] - b[n]));
  return e / Math.max(1, maxAbs(a));
}

/** max |a − b| / max |a| (scale-free; for matrices with large entries). */
export function scaledError(a: ArrayLike<number>, b: ArrayLike<number>): number {
  let e = 0;
  for (let n = 0; n < a.length; n++) e = Math.max(e, Math.abs(a[n] - b[n]));
  const s = maxAbs(a);
  return s > 0 ? e / s : e;
}

/** Dense n×n row-major times vector. */
export function matVec(m: Float64Array, v: Float64Array): Float64Array {
  const n = v.length;
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let s = 0;
    for (let j = 0; j < n; j++) s += m[i * n + j] * v[j];
    out[i] = s;
  }
  return out;
}

/** Per atom, ω × x_a (an infinitesimal rotation of every atom about the origin). */
export function rotate(omega: readonly number[], x: Float64Array): Float64Array {
  const out = new Float64Array(x.length);
  for (let a = 0; a < x.length; a += 3) {
    out[a] = omega[1] * x[a + 2] - omega[2] * x[a + 1];
    out[a + 1] = omega[2] * x[a] - omega[0] * x[a + 2];
    out[a + 2] = omega[0] * x[a + 1] - omega[1] * x[a];
  }
  return out;
}

/**
 * Eigenvalues of a small symmetric n×n matrix (row-major) by cyclic Jacobi
 * rotations (Golub & Van Loan, Matrix Computations, 4th ed., §8.5), sorted
 * increasing. Stops when the off-diagonal mass is below 1e-30 of the total,
 * or after 100 sweeps.
 */
export function symmetricEigenvalues(matrix: Float64Array, n: number): number[] {
  const a = Float64Array.from(matrix);
  let total = 0;
  for (let i = 0; i < n * n; i++) total += a[i] * a[i];
  for (let sweep = 0; sweep < 100; sweep++) {
    let off = 0;
    for (let p = 0; p < n; p++) for (let q = p + 1; q < n; q++) off += a[p * n + q] * a[p * n + q];
    if (off <= 1e-30 * total) break;
    for (let p = 0; p < n; p++) {
      for (let q = p + 1; q < n; q++) {
        const apq = a[p * n + q];
        if (apq === 0) continue;
        const theta = (a[q * n + q] - a[p * n + p]) / (2 * apq);
        const t = Math.sign(theta || 1) / (Math.abs(theta) + Math.sqrt(theta * theta + 1));
        const c = 1 / Math.sqrt(t * t + 1);
        const s = t * c;
        for (let k = 0; k < n; k++) {
          const akp = a[k * n + p];
          const akq = a[k * n + q];
          a[k * n + p] = c * akp - s * akq;
          a[k * n + q] = s * akp + c * akq;
        }
        for (let k = 0; k < n; k++) {
          const apk = a[p * n + k];
          const aqk = a[q * n + k];
          a[p * n + k] = c * apk - s * aqk;
          a[q * n + k] = s * apk + c * aqk;
        }
      }
    }
  }
  return Array.from({ length: n }, (_, i) => a[i * n + i]).sort((x, y) => x - y);
}
