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
