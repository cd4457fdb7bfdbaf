/**
 * The shapes shared by every minimizer. Minimizers know nothing of
 * chemistry: they minimize any function of a flat `Float64Array`.
 * @module
 */

/**
 * A function to minimize: returns f(x) and, when `gradient` is given,
 * overwrites it with ∇f(x) (same length as x). Must not modify `x`.
 */
export type ObjectiveFunction = (x: Float64Array, gradient?: Float64Array) => number;

/**
 * What may move, handed to a minimizer by the caller (frozen atoms, fixed
 * distances). Both methods work in place and must not allocate per call.
 */
export interface Projection {
  /**
   * Move `x` back onto the allowed set (constraints satisfied, frozen
   * coordinates equal to `reference`'s), starting from `x` and using
   * `reference` (the last accepted point, which satisfies them) for the
   * constraint directions. Returns false if it could not (the step is then
   * rejected).
   */
  projectPositions(x: Float64Array, reference: Float64Array): boolean;
  /**
   * Remove from `g` (in place) what the allowed set cannot follow at `x`:
   * frozen coordinates set to 0, components along the constraints removed.
   */
  projectGradient(x: Float64Array, g: Float64Array): void;
}

/**
 * A change of variables that makes a problem better conditioned: a symmetric
 * positive definite P ≈ ∇²f, factored as P = Πᵀ L Lᵀ Π (Π a permutation).
 * L-BFGS then works in z = Lᵀ Π x: its initial inverse Hessian becomes
 * Πᵀ L⁻ᵀ D L⁻¹ Π with D learned in z. None of the methods may allocate.
 */
export interface Preconditioner {
  /** (Re)build P at `x`; false when it could not (the minimizer then goes on without it). */
  update(x: Float64Array): boolean;
  /** out = L⁻¹ Π v. */
  whiten(v: Float64Array, out: Float64Array): void;
  /** out = Πᵀ L⁻ᵀ w; may overwrite `w`. */
  unwhiten(w: Float64Array, out: Float64Array): void;
  /** out = Lᵀ Π v. */
  stretch(v: Float64Array, out: Float64Array): void;
}
