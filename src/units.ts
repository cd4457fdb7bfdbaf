/**
 * Units and physical constants, in one place.
 *
 * A model carries its own units (`angstrom` or `nanometer`, `kcal/mol` or
 * `kJ/mol`); kernels are unit-free and compute in whatever units their
 * parameters are in. Conversion happens only at the edges.
 *
 * Constants: CODATA 2018 exact values for c and N_A; the thermochemical
 * calorie 1 kcal = 4.184 kJ.
 * @module
 */

/** Length units a model may use. */
export type LengthUnit = 'angstrom' | 'nanometer';
/** Energy units a model may use (per mole). */
export type EnergyUnit = 'kcal/mol' | 'kJ/mol';

/** A model's unit system. */
export interface Units {
  readonly length: LengthUnit;
  readonly energy: EnergyUnit;
}

/** The length units the model file accepts. */
export const LENGTH_UNITS: readonly LengthUnit[] = ['angstrom', 'nanometer'];
/** The energy units the model file accepts. */
export const ENERGY_UNITS: readonly EnergyUnit[] = ['kcal/mol', 'kJ/mol'];

/** Speed of light in vacuum, m/s (CODATA 2018, exact). */
export const SPEED_OF_LIGHT = 299_792_458;
/** Avogadro constant, 1/mol (CODATA 2018, exact). */
export const AVOGADRO = 6.022_140_76e23;
/** Kilojoules in one thermochemical kilocalorie (exact by definition). */
export const KJ_PER_KCAL = 4.184;
/** Ångström in one nanometre (exact). */
export const ANGSTROM_PER_NANOMETER = 10;

/** How many ångström one unit of `unit` is. */
export function angstromPer(unit: LengthUnit): number {
  return unit === 'angstrom' ? 1 : ANGSTROM_PER_NANOMETER;
}

/** How many kJ/mol one unit of `unit` is. */
export function kjPerMolPer(unit: EnergyUnit): number {
  return unit === 'kJ/mol' ? 1 : KJ_PER_KCAL;
}

/**
 * Factor that converts a quantity of dimension energy^e · length^l from units
 * `from` to units `to`: `valueTo = valueFrom * unitFactor(from, to, e, l)`.
 *
 * Examples: a length is (0, 1), an energy (1, 0), a bond force constant
 * energy/length² is (1, −2), the Morse `a` (per length) is (0, −1), a force
 * energy/length is (1, −1).
 */
export function unitFactor(from: Units, to: Units, energyPower: number, lengthPower: number): number {
  const e = kjPerMolPer(from.energy) / kjPerMolPer(to.energy);
  const l = angstromPer(from.length) / angstromPer(to.length);
  return Math.pow(e, energyPower) * Math.pow(l, lengthPower);
}

/** The default convergence force, 0.01 kcal/mol/Å, in `units` (energy/length). */
export function defaultMaxForce(units: Units): number {
  return 0.01 * unitFactor({ length: 'angstrom', energy: 'kcal/mol' }, units, 1, -1);
}
