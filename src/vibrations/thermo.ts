/**
 * Harmonic-oscillator vibrational thermochemistry.
 *
 * Formulas: the vibrational partition function of independent harmonic
 * oscillators, energies counted from the bottom of the well (McQuarrie,
 * Statistical Mechanics, 1976, ch. 8, "vibrational partition function").
 * For a mode of wavenumber ν̃, with θ = h c ν̃ / k_B and x = θ / T, per mole
 * (R = N_A k_B):
 *
 * - zero-point energy  ½ N_A h c ν̃ = ½ R θ
 * - enthalpy           H = U = R θ (½ + 1 / (eˣ − 1))   (pV does not involve vibrations)
 * - entropy            S = R (x / (eˣ − 1) − ln(1 − e⁻ˣ))
 * - free energy        G = A = H − T S = R T (x / 2 + ln(1 − e⁻ˣ))
 * - ground-state population  1 − e⁻ˣ (the Boltzmann weight of v = 0)
 *
 * summed over the modes with a positive wavenumber. Imaginary (negative)
 * and zero wavenumbers have no harmonic partition function and are left
 * out of every sum.
 * @module
 */
import { AVOGADRO, BOLTZMANN, joulePerMolPer, PLANCK, SPEED_OF_LIGHT, type Units } from '../units.js';

/** The default temperature, K. */
export const STANDARD_TEMPERATURE = 298.15;

/** Harmonic vibrational thermochemistry at one temperature. */
export interface HarmonicThermo {
  /** Temperature, K. */
  readonly temperature: number;
  /** ½ Σ N_A h c ν̃ over the included modes, in the model's energy unit (per mol). */
  readonly zeroPointEnergy: number;
  /** Vibrational enthalpy at T, the zero-point energy included (model energy unit per mol). */
  readonly enthalpy: number;
  /** Vibrational entropy at T (model energy unit per mol per K). */
  readonly entropy: number;
  /** Vibrational free energy H − T S at T, the zero-point energy included (model energy unit per mol). */
  readonly freeEnergy: number;
  /** Per mode (same order as the wavenumbers given), the ground-state population 1 − exp(−hcν̃/k_BT); NaN for an excluded mode. */
  readonly populations: Float64Array;
  /** How many modes entered the sums. */
  readonly includedModes: number;
  /** How many were left out (imaginary or zero wavenumber). */
  readonly excludedModes: number;
  /** A note for people when modes were left out, else `''`. */
  readonly note: string;
}

/**
 * Harmonic vibrational thermochemistry of the wavenumbers `frequencies`
 * (cm⁻¹; negative = imaginary) at `temperature` (K, default 298.15), with
 * energies in `units.energy` per mol (CODATA 2018 h, c, k_B, N_A; see the
 * module comment for the formulas and their source).
 * @throws RangeError when `temperature` is not a finite number > 0 or a wavenumber is not finite.
 */
export function harmonicThermo(frequencies: ArrayLike<number>, units: Units, temperature = STANDARD_TEMPERATURE): HarmonicThermo {
  if (!(Number.isFinite(temperature) && temperature > 0)) {
    throw new RangeError(`harmonicThermo: temperature: expected a finite number > 0 (K), got ${temperature}`);
  }
  const R = AVOGADRO * BOLTZMANN; // J/(mol K)
  const perJoule = 1 / joulePerMolPer(units.energy);
  const populations = new Float64Array(frequencies.length);
  let zpe = 0;
  let enthalpy = 0;
  let entropy = 0;
  let included = 0;
  for (let i = 0; i < frequencies.length; i++) {
    const nu = frequencies[i];
    if (!Number.isFinite(nu)) throw new RangeError(`harmonicThermo: frequencies[${i}] is ${nu}, expected a finite number`);
    if (!(nu > 0)) {
      populations[i] = NaN;
      continue;
    }
    included++;
    const theta = (PLANCK * SPEED_OF_LIGHT * 100 * nu) / BOLTZMANN; // K
    const x = theta / temperature;
    const occupation = 1 / Math.expm1(x); // 1/(eˣ − 1); 0 when eˣ overflows
    const logGround = Math.log(-Math.expm1(-x)); // ln(1 − e⁻ˣ)
    zpe += 0.5 * R * theta;
    enthalpy += R * theta * (0.5 + occupation);
    entropy += R * ((x === Infinity ? 0 : x * occupation) - logGround);
    populations[i] = -Math.expm1(-x);
  }
  const excluded = frequencies.length - included;
  return {
    temperature,
    zeroPointEnergy: zpe * perJoule,
    enthalpy: enthalpy * perJoule,
    entropy: entropy * perJoule,
    freeEnergy: (enthalpy - temperature * entropy) * perJoule,
    populations,
    includedModes: included,
    excludedModes: excluded,
    note:
      excluded === 0
        ? ''
        : `${excluded} mode${excluded === 1 ? '' : 's'} with an imaginary or zero wavenumber left out of the thermochemistry`,
  };
}
