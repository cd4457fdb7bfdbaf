/**
 * Vibrational analysis of a model: Hessian, normal modes, harmonic
 * thermochemistry and the stationary-point test in one call.
 * @module
 */
import { modelHessian } from '../hessian/model.js';
import type { Model } from '../model/model.js';
import { normalModes, type NormalModes } from './normal-modes.js';
import { checkStationary, type StationaryCheck } from './stationary.js';
import { harmonicThermo, STANDARD_TEMPERATURE, type HarmonicThermo } from './thermo.js';

/** Options of {@link vibrationalAnalysis}. */
export interface VibrationalAnalysisOptions {
  /** Coordinates (flat, 3N, model length unit); default the model's own. */
  readonly x?: Float64Array;
  /** Temperature for the thermochemistry, K (default 298.15). */
  readonly temperature?: number;
  /** Stationary-point threshold on the largest per-atom force, model units (default 0.01 kcal/mol/Å converted). */
  readonly maxForce?: number;
}

/** What {@link vibrationalAnalysis} finds. */
export interface VibrationalAnalysis {
  /** The normal modes (see {@link NormalModes}). */
  readonly modes: NormalModes;
  /** Harmonic thermochemistry of `modes.frequencies`. */
  readonly thermo: HarmonicThermo;
  /** The stationary-point test at the coordinates used. */
  readonly stationary: StationaryCheck;
  /** Whether rigid motions were removed: false when the model has position restraints. */
  readonly projectRigid: boolean;
  /** The coordinates analysed (a copy). */
  readonly x: Float64Array;
}

/**
 * Normal modes of `model` at its coordinates (or `options.x`), with masses
 * from the model (the file's or the element's standard atomic weight).
 * Rigid motions are removed unless the model has `position-restraint`
 * terms, which tie it to space (then `zeroModes` is 0 and all 3N modes are
 * kept). Frozen atoms and constraints are not applied: the modes are those
 * of the energy.
 * @throws RangeError when `options.x` has the wrong length or an option is out of range.
 */
export function vibrationalAnalysis(model: Model, options: VibrationalAnalysisOptions = {}): VibrationalAnalysis {
  const x = Float64Array.from(options.x ?? model.coordinates);
  if (x.length !== 3 * model.atomCount) {
    throw new RangeError(`vibrationalAnalysis: x: expected 3N = ${3 * model.atomCount} numbers, got ${x.length}`);
  }
  if (options.maxForce !== undefined && !(options.maxForce > 0)) {
    throw new RangeError(`vibrationalAnalysis: maxForce: expected a number > 0, got ${options.maxForce}`);
  }
  const gradient = new Float64Array(x.length);
  model.energy(x, gradient);
  const stationary = checkStationary(gradient, model.units, options.maxForce);
  const projectRigid = !model.kinds.includes('position-restraint');
  const hessian = modelHessian(model, x);
  const modes = normalModes(hessian, model.masses, x, model.units, { projectRigid });
  const thermo = harmonicThermo(modes.frequencies, model.units, options.temperature ?? STANDARD_TEMPERATURE);
  return { modes, thermo, stationary, projectRigid, x };
}
