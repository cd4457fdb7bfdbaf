/**
 * Minimizing a model's energy: the chemistry-aware convenience over the
 * general minimizers, with the model's frozen atoms and fixed distances.
 * @module
 */
import { projectionForModel } from '../constraints/from-model.js';
import { minimize, type MinimizeOptions, type MinimizeResult } from '../optimize/minimize.js';
import { defaultMaxForce } from '../units.js';
import type { EnergyBreakdown, Model } from './model.js';
import { stiffTermPreconditioner } from './preconditioner.js';

/** Options of {@link relaxModel}: those of `minimize`, less the projection, which comes from the model. */
export type RelaxOptions = Omit<MinimizeOptions, 'projection'> & {
  /** Start coordinates (flat, 3N); default the model's own. */
  readonly start?: Float64Array;
  /**
   * L-BFGS: precondition with the model's bond and angle terms
   * ({@link stiffTermPreconditioner}); default true. Ignored by the other
   * methods and when `preconditioner` is given.
   */
  readonly precondition?: boolean;
};

/** The minimizer's result, with the energy per kind before and after. */
export interface RelaxResult extends MinimizeResult {
  /** Energy per kind at the start coordinates. */
  readonly before: EnergyBreakdown;
  /** Energy per kind at the final coordinates. */
  readonly after: EnergyBreakdown;
}

/**
 * Minimize `model`'s energy from its coordinates (or `options.start`),
 * keeping its frozen atoms in place and its fixed distances held.
 * `maxForce` defaults to 0.01 kcal/mol/Å in the model's units.
 * @throws {@link ModelError} when the model's constraints cannot be satisfied from the start coordinates.
 * @throws RangeError for an invalid option.
 */
export function relaxModel(model: Model, options: RelaxOptions = {}): RelaxResult {
  const { start, precondition, ...rest } = options;
  const x0 = start ?? model.coordinates;
  const projection = projectionForModel(model, x0);
  const preconditioner =
    rest.preconditioner ??
    (precondition !== false && (rest.method ?? 'lbfgs') === 'lbfgs'
      ? stiffTermPreconditioner(model.atomCount, model.tables, model.frozen)
      : undefined);
  const result = minimize((x, g) => model.energy(x, g), x0, {
    maxForce: defaultMaxForce(model.units),
    ...rest,
    ...(projection === undefined ? {} : { projection }),
    ...(preconditioner === undefined ? {} : { preconditioner }),
  });
  return { ...result, before: model.breakdown(x0), after: model.breakdown(result.x) };
}
