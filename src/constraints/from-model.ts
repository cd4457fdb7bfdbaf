/**
 * The projection of a {@link Model}: its frozen atoms (and any extra ones
 * asked for) and its fixed-distance constraints.
 * @module
 */
import { ModelError } from '../errors.js';
import type { Model } from '../model/model.js';
import { type ConstraintProjection, createProjection, type DistanceConstraint } from './projection.js';

/** Options of {@link projectionForModel}. */
export interface ModelProjectionOptions {
  /** Atoms to hold in place besides the model's `frozen` (0-based; repeats of the model's are allowed). */
  readonly frozen?: ArrayLike<number>;
  /** Relative tolerance of a fixed distance (default 1e-10, as in the spec). */
  readonly tolerance?: number;
  /** Most sweeps over the constraints when projecting positions (default 500). */
  readonly maxIterations?: number;
}

/**
 * Build the {@link ConstraintProjection} for `model`, or return `undefined`
 * when nothing is frozen and there are no constraints.
 *
 * Constraint `c` of the projection is `constraints[c]` of the model file,
 * with its explicit `length` (the model's length unit). The start
 * coordinates `x` (flat, length 3N; default the model's coordinates; not
 * modified) are projected once, on a copy, to check that the constraints
 * can all hold; when a `length` differs from the start distance, put `x`
 * onto the constraints with `projection.projectPositions(x, x)` before
 * minimizing.
 *
 * @throws {@link ModelError} with place `constraints[c]` when an extra
 *   frozen atom makes constraint `c` join two frozen atoms, and with place
 *   `constraints` when the constraints cannot all be satisfied from `x`
 *   (`constraints: cannot all be satisfied from the given coordinates
 *   (largest violation 3 Å in constraints[1])`, lengths in `Å` or `nm`).
 * @throws RangeError when `x` has the wrong length or an extra frozen atom
 *   is out of range.
 */
export function projectionForModel(
  model: Model,
  x?: Float64Array,
  options: ModelProjectionOptions = {},
): ConstraintProjection | undefined {
  const n = model.atomCount;
  const start = x ?? model.coordinates;
  if (start.length !== 3 * n) throw new RangeError(`coordinates: expected 3N = ${3 * n} numbers, got ${start.length}`);
  const frozenSet = new Set<number>(model.frozen);
  Array.from(options.frozen ?? [], Number).forEach((a, f) => {
    if (!Number.isInteger(a) || a < 0 || a >= n) {
      throw new RangeError(`frozen[${f}]: index ${a} is out of range (model has ${n} atoms)`);
    }
    frozenSet.add(a);
  });
  const distances: DistanceConstraint[] = (model.toJSON().constraints ?? []).map((record, c) => {
    const [i, j] = record.atoms;
    if (frozenSet.has(i) && frozenSet.has(j)) {
      throw new ModelError(
        `constraints[${c}]`,
        `atoms ${i} and ${j} are both frozen; a constraint between two frozen atoms is not allowed`,
      );
    }
    // readModelFile fills in every missing length, so it is always present here.
    return { i, j, length: record.length as number };
  });
  if (frozenSet.size === 0 && distances.length === 0) return undefined;
  return createProjection({
    atomCount: n,
    frozen: [...frozenSet],
    distances,
    tolerance: options.tolerance,
    maxIterations: options.maxIterations,
    start,
    lengthUnit: model.units.length === 'angstrom' ? 'Å' : 'nm',
  });
}
