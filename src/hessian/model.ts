// Placeholder in branch helper/modes: replaced on merge by the analytic Hessian of branch helper/hessian.
/**
 * The Hessian of a model's energy, by central differences of its analytic
 * gradient (placeholder; see the first line).
 * @module
 */
import type { Model } from '../model/model.js';
import { angstromPer } from '../units.js';

/**
 * The Hessian ∂²E/∂x_i∂x_j of `model`'s energy at `x` (flat, 3N, the
 * model's length unit), dense, symmetric, row-major (3N)×(3N), in the
 * model's energy per length². Written into `out` (length (3N)²) when given,
 * else into a new array, and returned.
 *
 * Central differences of the analytic gradient with a step of 1e-4 Å (in
 * the model's length unit), then symmetrized as (H + Hᵀ)/2: error of the
 * order of 1e-8 relative for smooth terms. `x` is not modified.
 * @throws RangeError when `x` or `out` has the wrong length.
 */
export function modelHessian(model: Model, x: Float64Array, out?: Float64Array): Float64Array {
  const n = 3 * model.atomCount;
  if (x.length !== n) throw new RangeError(`modelHessian: x: expected 3N = ${n} numbers, got ${x.length}`);
  const h = out ?? new Float64Array(n * n);
  if (h.length !== n * n) throw new RangeError(`modelHessian: out: expected (3N)² = ${n * n} numbers, got ${h.length}`);
  const step = 1e-4 / angstromPer(model.units.length);
  const y = Float64Array.from(x);
  const plus = new Float64Array(n);
  const minus = new Float64Array(n);
  for (let c = 0; c < n; c++) {
    y[c] = x[c] + step;
    model.energy(y, plus);
    y[c] = x[c] - step;
    model.energy(y, minus);
    y[c] = x[c];
    for (let r = 0; r < n; r++) h[c * n + r] = (plus[r] - minus[r]) / (2 * step);
  }
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      const s = 0.5 * (h[i * n + j] + h[j * n + i]);
      h[i * n + j] = s;
      h[j * n + i] = s;
    }
  }
  return h;
}
