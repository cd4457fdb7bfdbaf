/**
 * Everything the `energy` command shows, as data: per-kind energies and term
 * counts, the gradient, force summary and the most strained terms.
 * @module
 */
import type { EnergyKind } from '../model/kinds.js';
import type { Model } from '../model/model.js';
import { countedPairCount } from '../terms/nonbonded.js';
import type { Units } from '../units.js';
import { forceSummary } from './forces.js';
import { mostStrainedTerms, type StrainedTerm } from './strain.js';

/** The energy report of a model at one geometry. */
export interface EnergyReport {
  /** Sum of `byKind` (model energy unit). */
  readonly total: number;
  /** Kind → energy for every kind the model has (term kinds, then `lennard-jones`, `coulomb`). */
  readonly byKind: Readonly<Partial<Record<EnergyKind, number>>>;
  /**
   * Kind → number of terms; for `lennard-jones` and `coulomb`, the number of
   * atom pairs that count (all pairs less the excluded ones, 1-4 pairs
   * included), before any cutoff.
   */
  readonly termCounts: Readonly<Partial<Record<EnergyKind, number>>>;
  /** dE/dx per atom, `[gx, gy, gz]` (energy per length). */
  readonly gradient: [number, number, number][];
  /** Largest per-atom force norm |g_a| over all atoms (energy per length). */
  readonly maxForce: number;
  /** The atom it acts on (−1 for no atoms). */
  readonly maxForceAtom: number;
  /** RMS of the per-atom force norms. */
  readonly rmsForce: number;
  /** The highest-energy terms, most strained first. */
  readonly strained: StrainedTerm[];
  /** The model's units. */
  readonly units: Units;
}

/** Build the {@link EnergyReport} of `model` at `x` (default: its own coordinates). */
export function energyReport(model: Model, x: Float64Array = model.coordinates, strainedLimit = 8): EnergyReport {
  const g = new Float64Array(3 * model.atomCount);
  model.energy(x, g);
  const { total, byKind } = model.breakdown(x);
  const termCounts: Partial<Record<EnergyKind, number>> = {};
  for (const t of model.tables) termCounts[t.kind] = t.count;
  if (model.nonbonded !== null) {
    const pairs = countedPairCount(model.nonbonded);
    if (model.nonbonded.hasLennardJones) termCounts['lennard-jones'] = pairs;
    if (model.nonbonded.hasCoulomb) termCounts.coulomb = pairs;
  }
  const gradient: [number, number, number][] = [];
  for (let a = 0; a < model.atomCount; a++) gradient.push([g[3 * a], g[3 * a + 1], g[3 * a + 2]]);
  const forces = forceSummary(g);
  return {
    total,
    byKind,
    termCounts,
    gradient,
    ...forces,
    strained: mostStrainedTerms(model, x, strainedLimit),
    units: model.units,
  };
}
