/**
 * Harmonic thermochemistry: sums, limits, populations, excluded modes.
 * Formulas: McQuarrie, Statistical Mechanics (1976), ch. 8 (see src/vibrations/thermo.ts).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { harmonicThermo } from '../../src/vibrations/thermo.js';

const KCAL = { length: 'angstrom', energy: 'kcal/mol' } as const;
const H = 6.626_070_15e-34; // J s (CODATA 2018, exact)
const C = 299_792_458; // m/s (CODATA 2018, exact)
const NA = 6.022_140_76e23; // 1/mol (CODATA 2018, exact)

describe('harmonicThermo', () => {
  it('ZPE is ½ Σ h c ν̃ N_A exactly (the definition), in kcal/mol', () => {
    const nus = [3700.5, 1650.25, 3600, 120];
    const t = harmonicThermo(nus, KCAL);
    const expected = nus.reduce((s, nu) => s + 0.5 * H * C * 100 * nu * NA, 0) / 4184;
    expect(t.zeroPointEnergy / expected).toBeCloseTo(1, 14);
    expect(t.temperature).toBe(298.15);
  });

  it('populations: a 3000 cm⁻¹ mode is > 0.999 in v = 0 at 298.15 K, a 100 cm⁻¹ one < 0.5 (common practice), each 1 − exp(−hcν̃/k_BT)', () => {
    const t = harmonicThermo([3000, 100], KCAL, 298.15);
    expect(t.populations[0]).toBeGreaterThan(0.999);
    expect(t.populations[1]).toBeLessThan(0.5);
    const kB = 1.380_649e-23; // J/K (CODATA 2018, exact)
    for (const [i, nu] of [3000, 100].entries()) {
      expect(t.populations[i]).toBeCloseTo(1 - Math.exp(-(H * C * 100 * nu) / (kB * 298.15)), 15);
    }
  });

  it('imaginary and zero wavenumbers are left out with a note; the rest sum as alone', () => {
    const all = harmonicThermo([-400, 0, 1000, 2000], KCAL);
    const real = harmonicThermo([1000, 2000], KCAL);
    expect(all.excludedModes).toBe(2);
    expect(all.includedModes).toBe(2);
    expect(all.note).toMatch(/2 modes with an imaginary or zero wavenumber left out/);
    expect(real.note).toBe('');
    expect(all.enthalpy).toBe(real.enthalpy);
    expect(all.entropy).toBe(real.entropy);
    expect(Number.isNaN(all.populations[0])).toBe(true);
    expect(Number.isNaN(all.populations[1])).toBe(true);
  });

  it('property: sums over modes are additive, G = H − TS, H ≥ ZPE, S ≥ 0, and S grows with T', () => {
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: 10, max: 4000, noNaN: true }), { minLength: 1, maxLength: 8 }),
        fc.double({ min: 10, max: 2000, noNaN: true }),
        (nus, T) => {
          const t = harmonicThermo(nus, KCAL, T);
          let h = 0;
          let s = 0;
          for (const nu of nus) {
            const one = harmonicThermo([nu], KCAL, T);
            h += one.enthalpy;
            s += one.entropy;
          }
          const hotter = harmonicThermo(nus, KCAL, T * 1.5);
          return (
            Math.abs(t.enthalpy - h) <= 1e-12 * h &&
            Math.abs(t.entropy - s) <= 1e-12 * Math.max(s, 1e-300) &&
            Math.abs(t.freeEnergy - (t.enthalpy - T * t.entropy)) <= 1e-12 * Math.max(t.enthalpy, T * t.entropy) &&
            t.enthalpy >= t.zeroPointEnergy &&
            t.entropy >= 0 &&
            hotter.entropy >= t.entropy
          );
        },
      ),
      { numRuns: 100 },
    );
  });

  it('limits: far below θ the mode is frozen (H = ZPE, S = 0, p0 = 1); far above it, H → RT (equipartition, common practice)', () => {
    const cold = harmonicThermo([3000], KCAL, 1);
    expect(cold.enthalpy).toBe(cold.zeroPointEnergy);
    expect(cold.entropy).toBe(0);
    expect(cold.populations[0]).toBe(1);
    const R = (NA * 1.380_649e-23) / 4184; // kcal/(mol K)
    const hot = harmonicThermo([1], KCAL, 1e5);
    // U = RT + O(θ²/T) for T ≫ θ (the ½ Rθ of the zero point cancels the first correction).
    expect(hot.enthalpy / (R * 1e5)).toBeCloseTo(1, 8);
  });

  it('refuses a temperature that is not > 0 and a non-finite wavenumber', () => {
    expect(() => harmonicThermo([1000], KCAL, 0)).toThrow('harmonicThermo: temperature: expected a finite number > 0 (K), got 0');
    expect(() => harmonicThermo([1000], KCAL, NaN)).toThrow(RangeError);
    expect(() => harmonicThermo([1000, Infinity], KCAL)).toThrow('harmonicThermo: frequencies[1] is Infinity, expected a finite number');
  });
});
