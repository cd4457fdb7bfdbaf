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
export { compileTerms, tableFromRecords, writeParameters } from './model/compile.js';
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
export { accumulateHarmonicAngles, accumulateCosineAngles } from './terms/angle.js';
export {
  accumulatePeriodicDihedrals,
  accumulateRyckaertBellemans,
  accumulateHarmonicImpropers,
  wrapAngle,
} from './terms/torsion.js';
export { accumulatePositionRestraints, accumulateDistanceRestraints } from './terms/restraint.js';
export { distance, bendAngle, torsionAngle } from './terms/measure.js';

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
