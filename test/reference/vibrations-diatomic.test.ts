/**
 * Harmonic diatomics through the whole normal-mode pipeline: from a
 * handbook harmonic wavenumber ωe we build the spring k = μ (2π c ωe)², in
 * each of the four unit systems, and `normalModes` must give ωe back as
 * the one vibration, with 5 rigid motions removed (linear). Values and
 * their sources as in ./diatomic-wavenumber.test.ts.
 */
import { describe, expect, it } from 'vitest';
import { parseModel } from '../../src/model/model.js';
import type { Units } from '../../src/units.js';
import { vibrationalAnalysis } from '../../src/vibrations/model-modes.js';
import { applyMotion, randomRigidMotion } from '../helpers/geometry.js';
import { createRandom } from '../helpers/random.js';
import { modelFile } from '../vibrations/models.js';

const C = 299_792_458; // speed of light, m/s (CODATA 2018, exact)
const NA = 6.022_140_76e23; // Avogadro constant, 1/mol (CODATA 2018, exact)
const KG_PER_DA = 1.660_539_066_6e-27; // atomic mass constant (CODATA 2018, from memory)
const J_PER_MOL = { 'kcal/mol': 4184, 'kJ/mol': 1000 }; // 1 kcal = 4.184 kJ (exact by definition)
const METRE = { angstrom: 1e-10, nanometer: 1e-9 }; // exact

// Atomic masses in Da (AME / IUPAC, from memory; ¹²C is 12 exactly by definition).
const MASS = { H1: 1.00782503, Cl35: 34.96885268, C12: 12, O16: 15.99491462 };
// Harmonic wavenumbers ωe, cm⁻¹, and equilibrium bond lengths re, Å (Huber &
// Herzberg, Constitution of Diatomic Molecules, 1979, via the NIST Chemistry
// WebBook — from memory).
const MOLECULES = [
  { name: '¹H³⁵Cl', a: 'H', b: 'Cl', m1: MASS.H1, m2: MASS.Cl35, omega: 2990.95, re: 1.27455 },
  { name: '¹²C¹⁶O', a: 'C', b: 'O', m1: MASS.C12, m2: MASS.O16, omega: 2169.81, re: 1.12832 },
];

const UNIT_SYSTEMS: Units[] = [
  { length: 'angstrom', energy: 'kcal/mol' },
  { length: 'nanometer', energy: 'kJ/mol' },
  { length: 'nanometer', energy: 'kcal/mol' },
  { length: 'angstrom', energy: 'kJ/mol' },
];

describe('diatomic normal mode: the handbook ωe back from k = μ (2π c ωe)²', () => {
  for (const mol of MOLECULES) {
    for (const units of UNIT_SYSTEMS) {
      it(`${mol.name} in ${units.energy} and ${units.length}: one mode at ωe ± 0.01 cm⁻¹, 5 zero modes, μ and k back`, () => {
        const muDa = (mol.m1 * mol.m2) / (mol.m1 + mol.m2);
        const kSI = muDa * KG_PER_DA * (2 * Math.PI * C * 100 * mol.omega) ** 2; // J/m² per molecule
        const k = (kSI * NA * METRE[units.length] ** 2) / J_PER_MOL[units.energy];
        const r0 = mol.re * (1e-10 / METRE[units.length]);
        const x = applyMotion(Float64Array.of(0, 0, 0, r0, 0, 0), randomRigidMotion(createRandom(7), r0));
        const model = parseModel(
          modelFile([{ element: mol.a, mass: mol.m1 }, { element: mol.b, mass: mol.m2 }], x, [{ kind: 'harmonic-bond', atoms: [0, 1], k, r0 }], units),
        );
        const { modes, stationary } = vibrationalAnalysis(model);
        expect(stationary.stationary).toBe(true);
        expect(modes.zeroModes).toBe(5);
        expect(modes.linear).toBe(true);
        expect(modes.frequencies.length).toBe(1);
        expect(Math.abs(modes.frequencies[0] - mol.omega)).toBeLessThanOrEqual(0.01);
        // With the Cartesian displacement normalized to 1 (d1 = −m2 s u, d2 = m1 s u), the mode's
        // reduced mass 1/Σ q²/m is m1 m2 (m1 + m2) / (m1² + m2²), not μ (derived here, by
        // construction of the convention), and its force constant that mass times λ = k/μ.
        const modeMass = (mol.m1 * mol.m2 * (mol.m1 + mol.m2)) / (mol.m1 ** 2 + mol.m2 ** 2);
        expect(modes.reducedMasses[0] / modeMass).toBeCloseTo(1, 7);
        expect(modes.forceConstants[0] / ((modeMass * k) / muDa)).toBeCloseTo(1, 7);
      });
    }
  }
});
