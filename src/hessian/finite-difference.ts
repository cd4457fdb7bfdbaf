/**
 * A Hessian by finite differences of a gradient, for functions that have an
 * analytic gradient but no analytic Hessian.
 * @module
 */

/** Options of {@link finiteDifferenceHessian}. */
export interface FiniteDifferenceHessianOptions {
  /**
   * Relative step: coordinate j is displaced by h_j = step · max(1, |x_j|)
   * (units of x). Default 1e-5; must be finite and > 0.
   */
  readonly step?: number;
}

/** Default relative step: ≈ (3 ε)^{1/3} for central differences of a gradient. */
const DEFAULT_STEP = 1e-5;

/**
 * The Hessian of `fn` at `x` by central differences of its gradient:
 * column j is (g(x + h_j e_j) − g(x − h_j e_j)) / (2 h_j), then the matrix
 * is symmetrized, H ← (H + Hᵀ)/2 (exactly symmetric). Costs 2·x.length
 * gradient evaluations; returns a new (n×n) row-major `Float64Array`,
 * n = x.length.
 *
 * **The step.** The error of a central difference is about
 * h² |g'''| / 6 (truncation) plus ε |g| / h (rounding, ε = 2.2e-16), smallest
 * near h = (3 ε)^{1/3} ≈ 1e-5 for quantities of order one, where both are
 * ~1e-10 relative. So the default relative step is 1e-5 · max(1, |x_j|):
 * larger than the gradient checker's 1e-4 would suit a 4-point stencil, but
 * this is the plain 2-point one. Pass a smaller step near a sharp feature
 * (a bend close to linear) and a larger one for a noisy gradient.
 *
 * @param fn - returns the value at its first argument and OVERWRITES its
 *   second with the gradient (the shape of `model.energy`); must not modify x.
 * @throws RangeError if `x` holds a non-finite number or `step` is not finite and > 0.
 */
export function finiteDifferenceHessian(
  fn: (x: Float64Array, gradient: Float64Array) => number,
  x: Float64Array,
  options: FiniteDifferenceHessianOptions = {},
): Float64Array {
  const step = options.step ?? DEFAULT_STEP;
  if (!(Number.isFinite(step) && step > 0)) {
    throw new RangeError(`step: expected a finite number > 0, got ${String(step)}`);
  }
  const n = x.length;
  for (let i = 0; i < n; i++) {
    if (!Number.isFinite(x[i])) throw new RangeError(`x[${i}]: expected a finite number, got ${x[i]}`);
  }
  const work = Float64Array.from(x);
  const plus = new Float64Array(n);
  const minus = new Float64Array(n);
  const h = new Float64Array(n * n);
  for (let j = 0; j < n; j++) {
    const xj = x[j];
    const hj = step * Math.max(1, Math.abs(xj));
    work[j] = xj + hj;
    const up = work[j];
    fn(work, plus);
    work[j] = xj - hj;
    const down = work[j];
    fn(work, minus);
    work[j] = xj;
    const width = up - down; // the step actually taken, after rounding
    for (let i = 0; i < n; i++) h[i * n + j] = (plus[i] - minus[i]) / width;
  }
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      const mean = 0.5 * (h[i * n + j] + h[j * n + i]);
      h[i * n + j] = mean;
      h[j * n + i] = mean;
    }
  }
  return h;
}
