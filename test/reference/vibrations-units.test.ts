/**
 * The constants behind the wavenumber conversion, and the conversion
 * itself in the four unit systems.
 */
import { describe, expect, it } from 'vitest';
import { AVOGADRO, BOLTZMANN, DALTON, PLANCK, SPEED_OF_LIGHT, wavenumberPerRootCurvature } from '../../src/units.js';

describe('CODATA 2018 constants (src/units.ts)', () => {
  it('h, k_B, c, N_A exact; the dalton', () => {
    expect(PLANCK).toBe(6.62607015e-34); // CODATA 2018, exact (SI 2019 definition)
    expect(BOLTZMANN).toBe(1.380649e-23); // CODATA 2018, exact
    expect(SPEED_OF_LIGHT).toBe(299792458); // exact; also spec/cli.md
    expect(AVOGADRO).toBe(6.02214076e23); // exact; also spec/cli.md
    expect(DALTON).toBe(1.6605390666e-27); // CODATA 2018 recommended value, from memory
    expect(Math.abs(DALTON * AVOGADRO * 1000 - 1)).toBeLessThan(1e-9); // M_u = 1 g/mol to 3.5e-10 (CODATA 2018, from memory)
  });
});

describe('wavenumberPerRootCurvature', () => {
  it('about 108.59 cm⁻¹ per √(kcal/mol/Å²/Da) (common practice, from memory), and the other unit systems follow from 4.184 and 10', () => {
    const kcalA = wavenumberPerRootCurvature({ length: 'angstrom', energy: 'kcal/mol' });
    expect(kcalA).toBeCloseTo(108.59, 2);
    expect(wavenumberPerRootCurvature({ length: 'nanometer', energy: 'kJ/mol' }) / (kcalA / Math.sqrt(4.184) / 10)).toBeCloseTo(1, 14);
    expect(wavenumberPerRootCurvature({ length: 'nanometer', energy: 'kcal/mol' }) / (kcalA / 10)).toBeCloseTo(1, 14);
    expect(wavenumberPerRootCurvature({ length: 'angstrom', energy: 'kJ/mol' }) / (kcalA / Math.sqrt(4.184))).toBeCloseTo(1, 14);
  });
});
