/**
 * strainwise: bonded molecular-mechanics terms with exact analytic
 * gradients. This module only re-exports.
 * @module
 */
export { ModelError } from './errors.js';
export * from './units.js';
export { ELEMENTS, ELEMENT_SYMBOLS, isElement, findElement, standardAtomicWeight } from './elements.js';
export type { ElementEntry, ElementSymbol } from './elements.js';

export { parseModel, Model } from './model/model.js';
export type { ModelAtom, EnergyBreakdown } from './model/model.js';
export { readModelFile } from './model/validate.js';
export { convertModelUnits } from './model/convert.js';
export { compileTerms, tableFromRecords, writeParameters, cosineSeriesCoefficients } from './model/compile.js';
export type { CompiledTable } from './model/compile.js';
export { MODEL_FORMAT, MODEL_VERSIONS, MODEL_DEFAULTS } from './model/schema.js';
export type {
  ModelFile,
  AtomRecord,
  TermRecord,
  TermRecordOf,
  NonbondedRecord,
  ConstraintRecord,
  ModelMetadata,
} from './model/schema.js';

export { TERM_KINDS, KIND_LAYOUTS, createTable } from './terms/table.js';
export type { TermKind, KindLayout, TermTable, Kernel } from './terms/table.js';
export { KERNELS, accumulateAll } from './terms/kernels.js';
export { accumulateHarmonicBonds, accumulateMorseBonds, accumulateUreyBradley } from './terms/bond.js';
export {
  accumulateHarmonicAngles,
  accumulateCosineAngles,
  accumulateCosineSeriesAngles,
  accumulatePeriodicAngles,
} from './terms/angle.js';
export { accumulateInversions } from './terms/inversion.js';
export {
  accumulatePeriodicDihedrals,
  accumulateRyckaertBellemans,
  accumulateHarmonicImpropers,
  wrapAngle,
} from './terms/torsion.js';
export { accumulatePositionRestraints, accumulateDistanceRestraints } from './terms/restraint.js';
export { distance, bendAngle, torsionAngle, outOfPlaneAngle } from './terms/measure.js';

export { forceSummary } from './analysis/forces.js';
export type { ForceSummary } from './analysis/forces.js';
export { mostStrainedTerms } from './analysis/strain.js';
export type { StrainedTerm } from './analysis/strain.js';
export { energyReport } from './analysis/report.js';
export type { EnergyReport } from './analysis/report.js';
export { checkModelGradient } from './analysis/gradient-check.js';
export type { ModelGradientCheck } from './analysis/gradient-check.js';

export { applyRigidMotion, rotationAbout, centreOf, centre } from './geometry/transform.js';

export * from './optimize/index.js';
export { createProjection } from './constraints/projection.js';
export type { ConstraintProjection, ConstraintViolation, DistanceConstraint, ProjectionOptions } from './constraints/projection.js';
export { projectionForModel } from './constraints/from-model.js';
export type { ModelProjectionOptions } from './constraints/from-model.js';
export { relaxModel } from './model/relax.js';
export type { RelaxOptions, RelaxResult } from './model/relax.js';
export { writeFileWhole } from './io/write-file.js';
export { xyzFrame } from './io/xyz.js';
export { stiffTermPreconditioner } from './model/preconditioner.js';

// Generic parameters (Rappé et al. 1992) for a perceived topology
export * from './params/index.js';

// Nonbonded pairs (the model file's `nonbonded` block)
export type { EnergyKind, NonbondedKind } from './model/kinds.js';
export { NONBONDED_KINDS, isNonbondedKind } from './model/kinds.js';
export { compileNonbonded, bondSeparations, nonbondedConnectivity } from './model/nonbonded.js';
export type { BondSeparations, CompiledNonbonded } from './model/nonbonded.js';
export {
  createNonbondedPairs,
  accumulateNonbonded,
  accumulateNonbondedAllPairs,
  countedPairCount,
  NONBONDED_LENNARD_JONES,
  NONBONDED_COULOMB,
  NONBONDED_ALL,
} from './terms/nonbonded.js';
export type { NonbondedPairs, NonbondedParameters, CombinationRule } from './terms/nonbonded.js';

export {
  perceiveBonds,
  perceiveBondOrders,
  perceiveTopology,
  covalentRadius,
  COVALENT_RADIUS_ELEMENTS,
  DEFAULT_BOND_TOLERANCE,
  HYDROGEN_PAIR_TOLERANCE,
  MULTIPLE_BOND_RATIO,
  TRIPLE_BOND_RATIO,
} from './perceive/index.js';
export type { BondPerceptionOptions, TopologyInput, Topology, Hybridization } from './perceive/index.js';

export { symmetricEigen, EigenConvergenceError } from './linalg/symmetric-eigen.js';
export type { SymmetricEigen, SymmetricEigenOptions } from './linalg/symmetric-eigen.js';
export { tridiagonalize, reflectorsTransposed, applyReflectorsToRows } from './linalg/tridiagonal.js';
export { tridiagonalQL, QL_SWEEPS_PER_EIGENVALUE } from './linalg/tridiagonal-ql.js';
export { tridiagonalEigenvectors } from './linalg/tridiagonal-vectors.js';
export { restrictToComplement } from './linalg/complement.js';
export type { ComplementRestriction } from './linalg/complement.js';
export { massWeightHessian } from './vibrations/mass-weight.js';
export { rigidMotions, LINEAR_MOMENT_RATIO } from './vibrations/rigid-motions.js';
export type { RigidMotions } from './vibrations/rigid-motions.js';
export { normalModes } from './vibrations/normal-modes.js';
export type { NormalModes, NormalModeOptions } from './vibrations/normal-modes.js';
export { harmonicThermo, STANDARD_TEMPERATURE } from './vibrations/thermo.js';
export type { HarmonicThermo } from './vibrations/thermo.js';
export { checkStationary } from './vibrations/stationary.js';
export type { StationaryCheck } from './vibrations/stationary.js';
export { vibrationalAnalysis } from './vibrations/model-modes.js';
export type { VibrationalAnalysis, VibrationalAnalysisOptions } from './vibrations/model-modes.js';
export { modeAnimation } from './vibrations/animate.js';
export type { ModeAnimationOptions } from './vibrations/animate.js';

export * from './hessian/index.js';

export { StructureError, newStructure } from './io/structure.js';
export type {
  Structure,
  StructureBase,
  PdbStructure,
  XyzStructure,
  SdfStructure,
  PdbRecord,
  PdbAtomRecord,
  XyzRecord,
  SdfRecord,
  SdfAtomRecord,
  SdfBondRecord,
  SdfDataItem,
  NewStructureOptions,
} from './io/structure.js';
export { readPdb, writePdb, writePdbModels, elementFromAtomName } from './io/pdb.js';
export { readSdf, readMol, writeSdf, writeMol, writeSdfRecords } from './io/sdf.js';
export { readXyz, writeXyz, writeXyzFrames } from './io/xyz.js';
export { STRUCTURE_FORMATS, structureFormatFor } from './io/structure-format.js';
export type { StructureFormat } from './io/structure-format.js';
export { BlockCholesky } from './linalg/block-cholesky.js';
export { vectorWorkspace, wasmKernelsAvailable, jsKernels } from './linalg/vector-kernels.js';
export type { VectorEngine, VectorKernels, VectorWorkspace } from './linalg/vector-kernels.js';
