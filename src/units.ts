/**
 * Units and physical constants, in one place.
 *
 * A model carries its own units (`angstrom` or `nanometer`, `kcal/mol` or
 * `kJ/mol`); kernels are unit-free and compute in whatever units their
 * parameters are in. Conversion happens only at the edges.
 *
 * Constants: CODATA 2018 exact values for c, h, k_B and N_A, the CODATA
 * 2018 recommended value of the atomic mass constant; the thermochemical
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
/** Planck constant, J s (CODATA 2018, exact). */
export const PLANCK = 6.626_070_15e-34;
/** Boltzmann constant, J/K (CODATA 2018, exact). */
export const BOLTZMANN = 1.380_649e-23;
/**
 * Atomic mass constant (one dalton), kg (CODATA 2018 recommended value
 * 1.660 539 066 60(50) × 10⁻²⁷, from memory). It differs from
 * 10⁻³ kg/mol / N_A by 3 parts in 10¹⁰.
 */
export const DALTON = 1.660_539_066_6e-27;

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

/** How many J/mol one unit of `unit` is (4184 for kcal/mol, 1000 for kJ/mol). */
export function joulePerMolPer(unit: EnergyUnit): number {
  return 1000 * kjPerMolPer(unit);
}

/**
 * Wavenumber (cm⁻¹) of a harmonic curvature, per square root of it: for an
 * eigenvalue λ of a mass-weighted Hessian in `units` energy/length² per
 * dalton, ν̃ = √λ · `wavenumberPerRootCurvature(units)`, from
 * ν̃ = ω / (2π c), ω = √(λ_SI), λ_SI = λ · (J/mol per energy unit) / N_A /
 * (m per length unit)² / (kg per dalton). About 108.59 for kcal/mol and Å.
 */
export function wavenumberPerRootCurvature(units: Units): number {
  const metre = angstromPer(units.length) * 1e-10;
  const toSI = joulePerMolPer(units.energy) / AVOGADRO / (metre * metre) / DALTON; // s⁻²
  return Math.sqrt(toSI) / (2 * Math.PI * SPEED_OF_LIGHT * 100);
}
