/**
 * The kernel of every term kind, by name.
 * @module
 */
import {
  accumulateCosineAngles,
  accumulateCosineSeriesAngles,
  accumulateHarmonicAngles,
  accumulatePeriodicAngles,
} from './angle.js';
import { accumulateHarmonicBonds, accumulateMorseBonds, accumulateUreyBradley } from './bond.js';
import { accumulateInversions } from './inversion.js';
import { accumulateDistanceRestraints, accumulatePositionRestraints } from './restraint.js';
import type { Kernel, TermKind, TermTable } from './table.js';
import {
  accumulateHarmonicImpropers,
  accumulatePeriodicDihedrals,
  accumulateRyckaertBellemans,
} from './torsion.js';

/** The accumulate function of each kind (see {@link Kernel}). */
export const KERNELS: Readonly<Record<TermKind, Kernel>> = {
  'harmonic-bond': accumulateHarmonicBonds,
  'morse-bond': accumulateMorseBonds,
  'harmonic-angle': accumulateHarmonicAngles,
  'cosine-angle': accumulateCosineAngles,
  'urey-bradley': accumulateUreyBradley,
  'periodic-dihedral': accumulatePeriodicDihedrals,
  'ryckaert-bellemans': accumulateRyckaertBellemans,
  'harmonic-improper': accumulateHarmonicImpropers,
  'position-restraint': accumulatePositionRestraints,
  'distance-restraint': accumulateDistanceRestraints,
  'cosine-series-angle': accumulateCosineSeriesAngles,
  'periodic-angle': accumulatePeriodicAngles,
  inversion: accumulateInversions,
};

/**
 * Sum of every table's energy at `x`. When `gradient` is given it is
 * overwritten (zeroed, then filled) with dE/dx. Never allocates.
 */
export function accumulateAll(
  x: Float64Array,
  tables: readonly TermTable[],
  gradient?: Float64Array,
): number {
  if (gradient !== undefined) gradient.fill(0);
  let total = 0;
  for (let n = 0; n < tables.length; n++) {
    const table = tables[n];
    total += KERNELS[table.kind](x, table, gradient);
  }
  return total;
}
