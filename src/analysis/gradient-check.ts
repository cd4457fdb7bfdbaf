/**
 * A model's analytic gradient against numerical derivatives, with the term
 * kind to blame for the worst coordinate.
 * @module
 */
import type { EnergyKind } from '../model/kinds.js';
import type { Model } from '../model/model.js';
import { checkGradient, type GradientCheck, type GradientCheckOptions } from '../testing/check-gradient.js';

/** The result of {@link checkModelGradient}. */
export interface ModelGradientCheck {
  /** The whole-model check (see `checkGradient`). */
  readonly check: GradientCheck;
  /** The worst coordinate and the kind whose own gradient is furthest off there; null for a model without terms or nonbonded pairs. */
  readonly worst: { readonly atom: number; readonly axis: 'x' | 'y' | 'z'; readonly kind: EnergyKind } | null;
}

/**
 * Check `model`'s gradient at `x` (default: the model's coordinates) by
 * numerical differentiation of its energy, then re-check the worst
 * coordinate kind by kind (term kinds, `lennard-jones`, `coulomb`) to name
 * the kind responsible.
 * `ok` follows the command line's rule: maxRelError ≤ tolerance (default 1e-6).
 */
export function checkModelGradient(
  model: Model,
  x: Float64Array = model.coordinates,
  options: GradientCheckOptions = {},
): ModelGradientCheck {
  const check = checkGradient((y, g) => model.energy(y, g), x, options);
  if (model.kinds.length === 0 || check.worst === null) return { check, worst: null };
  const index = check.worst.index;
  let kind = model.kinds[0];
  let largest = -1;
  for (const each of model.kinds) {
    const one = checkGradient((y, g) => model.kindEnergy(each, y, g), x, { ...options, indices: [index] });
    const err = Number.isNaN(one.maxAbsError) ? Infinity : one.maxAbsError;
    if (err > largest) {
      largest = err;
      kind = each;
    }
  }
  return { check, worst: { atom: check.worst.atom, axis: check.worst.axis, kind } };
}
