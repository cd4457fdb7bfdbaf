/**
 * The Hessian kernel of every term kind, by name.
 * @module
 */
import type { TermKind } from '../terms/table.js';
import {
  cosineAngleHessian,
  cosineSeriesAngleHessian,
  harmonicAngleHessian,
  periodicAngleHessian,
} from './angle.js';
import { harmonicBondHessian, morseBondHessian, ureyBradleyHessian } from './bond.js';
import { inversionHessian } from './inversion.js';
import { distanceRestraintHessian, positionRestraintHessian } from './restraint.js';
import type { HessianKernel } from './sink.js';
import { harmonicImproperHessian, periodicDihedralHessian, ryckaertBellemansHessian } from './torsion.js';

/** The Hessian kernel of each kind (see {@link HessianKernel}). */
export const HESSIAN_KERNELS: Readonly<Record<TermKind, HessianKernel>> = {
  'harmonic-bond': harmonicBondHessian,
  'morse-bond': morseBondHessian,
  'harmonic-angle': harmonicAngleHessian,
  'cosine-angle': cosineAngleHessian,
  'urey-bradley': ureyBradleyHessian,
  'periodic-dihedral': periodicDihedralHessian,
  'ryckaert-bellemans': ryckaertBellemansHessian,
  'harmonic-improper': harmonicImproperHessian,
  'position-restraint': positionRestraintHessian,
  'distance-restraint': distanceRestraintHessian,
  'cosine-series-angle': cosineSeriesAngleHessian,
  'periodic-angle': periodicAngleHessian,
  inversion: inversionHessian,
};
