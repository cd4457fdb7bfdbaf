/**
 * Analytic second derivatives of every term kind: dense and block-sparse
 * assembly, and a finite-difference Hessian for any function. Re-exports only.
 * @module
 */
export type { HessianSink, HessianKernel } from './sink.js';
export { DenseSink } from './sink.js';
export { HESSIAN_KERNELS } from './kernels.js';
export { harmonicBondHessian, morseBondHessian, ureyBradleyHessian } from './bond.js';
export { harmonicAngleHessian, cosineAngleHessian, cosineSeriesAngleHessian, periodicAngleHessian } from './angle.js';
export { inversionHessian } from './inversion.js';
export { periodicDihedralHessian, ryckaertBellemansHessian, harmonicImproperHessian } from './torsion.js';
export { positionRestraintHessian, distanceRestraintHessian } from './restraint.js';
export { tablesHessian } from './dense.js';
export { NonbondedPairHessian } from './nonbonded.js';
export { BlockSparseHessian } from './sparse.js';
export { modelHessian, modelSparseHessian, hessianVectorProduct } from './model.js';
export { finiteDifferenceHessian } from './finite-difference.js';
export type { FiniteDifferenceHessianOptions } from './finite-difference.js';
