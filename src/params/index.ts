/**
 * Generic parameters after Rappé et al. (J. Am. Chem. Soc. 114 (1992) 10024):
 * atom typing, the atomic table, the formulas, and whole-molecule assignment.
 * This module only re-exports.
 * @module
 */
export { assignGenericParameters, effectiveBondOrders, GENERATOR, GENERIC_CAUTION } from './assign.js';
export type { GenericParameterOptions } from './assign.js';
export { genericAtomTypes, typeGeometry, isAmideNitrogen, isCarbonylCarbon } from './atom-types.js';
export type { TypeGeometry } from './atom-types.js';
export {
  GENERIC_ATOM_TYPES,
  GENERIC_ELEMENTS,
  BOND_ORDER_LAMBDA,
  FORCE_CONSTANT_SCALE,
  AMIDE_BOND_ORDER,
  INVERSION,
  GROUP16_TORSION,
} from './generic-atoms.js';
export type { GenericAtomParameters } from './generic-atoms.js';
export {
  naturalBondLength,
  bondForceConstant,
  angleForceConstant,
  torsionRule,
  periodicDihedralFor,
  pyramidalInversionConstant,
} from './formulas.js';
export type { TorsionRule, TorsionCentre } from './formulas.js';
export { modelFromStructure, structureOfModel } from './from-structure.js';
export type { StructureModel, StructureModelOptions } from './from-structure.js';
