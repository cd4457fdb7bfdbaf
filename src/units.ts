/**
 * Units and physical constants, in one place.
 *
 * A model carries its own units (`angstrom` or `nanometer`, `kcal/mol` or
 * `kJ/mol`); kernels are unit-free and compute in whatever units their
 * parameters are in. Conversion happens only at the edges.
 *
 * Constants: CODATA 2018 exact values for c and N_A; the thermochemical
 * calorie 1 kcal = 4.184 kJ; the Coulomb constant of the model-file spec.
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

/**
 * Coulomb constant e²/(4π ε0) · N_A in kJ·nm/(mol·e²): the primary value,
 * 138.935458 as the model-file spec gives it. Of the spec's two values this
 * one carries more digits (nine against the seven of 332.0637), so the other
 * unit pairs are derived from it with {@link KJ_PER_KCAL} and
 * {@link ANGSTROM_PER_NANOMETER}; in kcal·Å/(mol·e²) it is
 * 138.935458 × 10 / 4.184 = 332.063714…, which rounds to the spec's 332.0637.
 * (CODATA 2018, e = 1.602176634e-19 C exact, ε0 = 8.8541878128e-12 F/m,
 * N_A exact, gives 138.9354576…, whose nine-digit rounding is this value.)
 */
export const COULOMB_KJ_NM = 138.935458;

/**
 * The Coulomb constant C in `units`: energy · length per elementary charge
 * squared, so that two charges q_i, q_j (in e) at distance r (in the length
 * unit) have E = C q_i q_j / r in the energy unit. Derived from
 * {@link COULOMB_KJ_NM}: 138.935458 kJ·nm, 1389.35458 kJ·Å,
 * 33.2063714… kcal·nm, 332.063714… kcal·Å (all per mol·e²).
 */
export function coulombConstant(units: Units): number {
  return COULOMB_KJ_NM * unitFactor({ length: 'nanometer', energy: 'kJ/mol' }, units, 1, 1);
}
