/**
 * Harmonic-oscillator thermochemistry against values worked out by hand
 * (30-digit arithmetic) from the formulas of McQuarrie, Statistical
 * Mechanics (1976), ch. 8, with the CODATA 2018 exact h, c, k_B, N_A:
 * θ = h c ν̃ / k_B, x = θ/T, ZPE = ½ R θ, H = R θ (½ + 1/(eˣ − 1)),
 * S = R (x/(eˣ − 1) − ln(1 − e⁻ˣ)), G = H − T S, p0 = 1 − e⁻ˣ.
 */
import { describe, expect, it } from 'vitest';
import { harmonicThermo } from '../../src/vibrations/thermo.js';

const KJ = { length: 'angstrom', energy: 'kJ/mol' } as const;
const KCAL = { length: 'angstrom', energy: 'kcal/mol' } as const;

// [ν̃ cm⁻¹, T K, ZPE J/mol, H J/mol, S J/(mol K), G J/mol, p0] — hand-computed as above.
const CASES = [
  [1000, 298.15, 5981.328281934850, 6078.057669409866, 0.3913918920040888, 5961.364176808847, 0.9919789127020826],
  [250, 500, 1495.332070483713, 4334.991141343661, 11.22986177701925, -1279.939747165965, 0.5129499741799176],
] as const;

describe('harmonicThermo: one mode against hand-computed values', () => {
  for (const [nu, T, zpe, h, s, g, p0] of CASES) {
    it(`${nu} cm⁻¹ at ${T} K, in kJ/mol and kcal/mol`, () => {
      const t = harmonicThermo([nu], KJ, T);
      expect(t.zeroPointEnergy / (zpe / 1000)).toBeCloseTo(1, 12);
      expect(t.enthalpy / (h / 1000)).toBeCloseTo(1, 12);
      expect(t.entropy / (s / 1000)).toBeCloseTo(1, 12);
      expect(t.freeEnergy / (g / 1000)).toBeCloseTo(1, 12);
      expect(t.populations[0]).toBeCloseTo(p0, 14);
      const c = harmonicThermo([nu], KCAL, T);
      expect(c.enthalpy / (h / 4184)).toBeCloseTo(1, 12); // 1 kcal = 4.184 kJ (exact by definition)
    });
  }

  it('θ/ν̃ is the second radiation constant c2 = 1.438 776 877 cm K (CODATA 2018, from memory): ZPE of 1 cm⁻¹ = ½ R c2', () => {
    const R = 6.022_140_76e23 * 1.380_649e-23; // J/(mol K), CODATA 2018 exact
    const t = harmonicThermo([1], KJ, 298.15);
    expect((t.zeroPointEnergy * 1000) / (0.5 * R * 1.438776877)).toBeCloseTo(1, 9);
  });
});
