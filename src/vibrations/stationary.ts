/**
 * Whether a structure is at a stationary point, as normal modes assume.
 * @module
 */
import { forceSummary } from '../analysis/forces.js';
import { defaultMaxForce, type Units } from '../units.js';

/** The stationary-point test of a gradient. */
export interface StationaryCheck {
  /** Largest per-atom force norm |g_a| (energy/length, model units). */
  readonly maxForce: number;
  /** The atom that has it (−1 with no atoms). */
  readonly maxForceAtom: number;
  /** The threshold used (energy/length, model units). */
  readonly threshold: number;
  /** True when `maxForce` ≤ `threshold`. */
  readonly stationary: boolean;
}

/**
 * Test the gradient (flat, 3N, energy/length in `units`) for a stationary
 * point: the largest per-atom force norm against `threshold` (default
 * 0.01 kcal/mol/Å converted to `units`, the minimizer's default). Harmonic
 * frequencies away from a stationary point mix in the force and are not
 * those of any minimum or saddle. NaN forces count as not stationary.
 */
export function checkStationary(gradient: Float64Array, units: Units, threshold = defaultMaxForce(units)): StationaryCheck {
  const { maxForce, maxForceAtom } = forceSummary(gradient);
  return { maxForce, maxForceAtom, threshold, stationary: maxForce <= threshold };
}
