/**
 * A model's analytic gradient against numerical derivatives, with the term
 * kind to blame for the worst coordinate.
 * @module
 */
import type { Model } from '../model/model.js';
import { KERNELS } from '../terms/kernels.js';
import type { TermKind, TermTable } from '../terms/table.js';
import { checkGradient, type GradientCheck, type GradientCheckOptions } from '../testing/check-gradient.js';

/** The result of {@link checkModelGradient}. */
export interface ModelGradientCheck {
  /** The whole-model check (see `checkGradient`). */
  readonly check: GradientCheck;
  /** The worst coordinate and the kind whose own gradient is furthest off there; null for a model without terms. */
  readonly worst: { readonly atom: number; readonly axis: 'x' | 'y' | 'z'; readonly kind: TermKind } | null;
}

/** The energy function of one table alone, with `gradient` overwritten. */
function tableEnergy(table: TermTable): (x: Float64Array, gradient?: Float64Array) => number {
  const kernel = KERNELS[table.kind];
  return (x, gradient) => {
    if (gradient !== undefined) gradient.fill(0);
    return kernel(x, table, gradient);
  };
}

/**
 * Check `model`'s gradient at `x` (default: the model's coordinates) by
 * numerical differentiation of its energy, then re-check the worst
 * coordinate kind by kind to name the kind responsible.
 * `ok` follows the command line's rule: maxRelError ≤ tolerance (default 1e-6).
 */
export function checkModelGradient(
  model: Model,
  x: Float64Array = model.coordinates,
  options: GradientCheckOptions = {},
): ModelGradientCheck {
  const check = checkGradient((y, g) => model.energy(y, g), x, options);
  if (model.tables.length === 0 || check.worst === null) return { check, worst: null };
  const index = check.worst.index;
  let kind = model.tables[0].kind;
  let largest = -1;
  for (const table of model.tables) {
    const one = checkGradient(tableEnergy(table), x, { ...options, indices: [index] });
    const err = Number.isNaN(one.maxAbsError) ? Infinity : one.maxAbsError;
    if (err > largest) {
      largest = err;
      kind = table.kind;
    }
  }
  return { check, worst: { atom: check.worst.atom, axis: check.worst.axis, kind } };
}
