/**
 * The ½ k convention: a harmonic bond between masses m1 and m2 vibrates at
 * ω = sqrt(k / μ). From a diatomic's harmonic wavenumber ωe we compute k,
 * build the bond, take the kernel's curvature (central differences of its
 * gradient) and get ωe back. The curvature enters through the trace of the
 * mass-weighted Hessian, Σ_c H_cc / m_c, which for a diatomic at its
 * minimum is the one non-zero eigenvalue k / μ (the rotations and
 * translations have eigenvalue 0), so m1 and m2 enter separately.
 */
import { describe, expect, it } from 'vitest';
import { applyMotion, randomRigidMotion } from '../helpers/geometry.js';
import { createRandom } from '../helpers/random.js';
import { evaluate, singleTerm } from '../helpers/terms.js';

// CODATA 2018 exact values, and the thermochemical calorie (exact by definition).
const C = 299_792_458; // speed of light, m/s (CODATA 2018, exact)
const NA = 6.022_140_76e23; // Avogadro constant, 1/mol (CODATA 2018, exact)
const J_PER_KCAL = 4184; // 1 kcal = 4.184 kJ (exact by definition)
// 1 Da = 1e-3 kg/mol / N_A to 4e-10 (the molar mass constant is
// 0.99999999965 g/mol since 2019, CODATA 2018 — from memory): negligible here.
const KG_PER_DA = 1e-3 / NA;

// Atomic masses in Da (AME / IUPAC, from memory; ¹²C is 12 exactly by definition).
const MASS = { H1: 1.00782503, Cl35: 34.96885268, C12: 12, O16: 15.99491462 };

// Harmonic wavenumbers ωe, cm⁻¹ (Huber & Herzberg, Constitution of Diatomic
// Molecules, 1979, via the NIST Chemistry WebBook — from memory), and
// equilibrium bond lengths re, Å (same source, from memory; only the place of
// the minimum, it does not enter ω).
const MOLECULES = [
  { name: '¹H³⁵Cl', m1: MASS.H1, m2: MASS.Cl35, omega: 2990.95, re: 1.27455 },
  { name: '¹²C¹⁶O', m1: MASS.C12, m2: MASS.O16, omega: 2169.81, re: 1.12832 },
];

/** Force constant (J/m²) of a harmonic wavenumber (cm⁻¹) for masses in Da: k = μ (2π c ω̃)². */
function forceConstant(omega: number, m1: number, m2: number): number {
  const mu = ((m1 * m2) / (m1 + m2)) * KG_PER_DA;
  return mu * (2 * Math.PI * C * 100 * omega) ** 2;
}

/**
 * Wavenumber (cm⁻¹) from the kernel: Σ_c H_cc / m_c, with H_cc from a
 * 4-point central difference of the gradient, in the model's units; `toSI`
 * turns energy/length²/Da into J/m²/kg.
 */
function wavenumberFromKernel(k: number, r0: number, m1: number, m2: number, toSI: number, seed: number): number {
  const table = singleTerm('harmonic-bond', [k, r0]);
  const x = applyMotion(new Float64Array([0, 0, 0, r0, 0, 0]), randomRigidMotion(createRandom(seed), r0));
  const masses = [m1, m1, m1, m2, m2, m2];
  let trace = 0;
  for (let c = 0; c < 6; c++) {
    const h = 1e-4 * r0;
    const g = (dx: number): number => {
      const y = Float64Array.from(x);
      y[c] += dx;
      return evaluate(table, y).gradient[c];
    };
    const hcc = (-g(2 * h) + 8 * g(h) - 8 * g(-h) + g(-2 * h)) / (12 * h);
    trace += hcc / masses[c];
  }
  const omegaSI = Math.sqrt((trace * toSI) / KG_PER_DA); // rad/s
  return omegaSI / (2 * Math.PI * C * 100);
}

describe('harmonic diatomic: ω = sqrt(k / μ) gives the tabulated ωe back', () => {
  for (const { name, m1, m2, omega, re } of MOLECULES) {
    it(`${name}: ωe = ${omega} cm⁻¹ back to 0.01 cm⁻¹, in kcal/mol/Å² and in kJ/mol/nm², which agree`, () => {
      const kSI = forceConstant(omega, m1, m2); // J/m² per molecule
      // kcal/mol/Å²: J/m² → J/Å² (×1e-20) → J/mol (×N_A) → kcal/mol (÷4184).
      const kKcal = (kSI * 1e-20 * NA) / J_PER_KCAL;
      // kJ/mol/nm²: J/m² → J/nm² (×1e-18) → kJ/mol (×N_A/1000).
      const kKj = (kSI * 1e-18 * NA) / 1000;
      expect(kKj).toBeCloseTo(kKcal * 4.184 * 100, 6); // the two unit systems describe one spring
      const fromKcal = wavenumberFromKernel(kKcal, re, m1, m2, (J_PER_KCAL / NA) * 1e20, 1);
      const fromKj = wavenumberFromKernel(kKj, re / 10, m1, m2, (1000 / NA) * 1e18, 2);
      expect(Math.abs(fromKcal - omega)).toBeLessThanOrEqual(0.01);
      expect(Math.abs(fromKj - omega)).toBeLessThanOrEqual(0.01);
      expect(Math.abs(fromKcal - fromKj)).toBeLessThanOrEqual(1e-6);
    });
  }
});
