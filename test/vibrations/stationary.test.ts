/** The stationary-point test: the minimizer's default threshold 0.01 kcal/mol/Å, converted (spec/cli.md). */
import { describe, expect, it } from 'vitest';
import { checkStationary } from '../../src/vibrations/stationary.js';

describe('checkStationary', () => {
  it('compares the largest per-atom force norm with 0.01 kcal/mol/Å, or 0.4184 kJ/mol/nm (×4.184 ×10, exact)', () => {
    const g = Float64Array.of(0, 0, 0, 0.006, 0.008, 0); // |g_1| = 0.01
    const a = checkStationary(g, { length: 'angstrom', energy: 'kcal/mol' });
    expect(a).toMatchObject({ maxForceAtom: 1, threshold: 0.01, stationary: true });
    expect(a.maxForce).toBeCloseTo(0.01, 15);
    const b = checkStationary(Float64Array.of(0.5, 0, 0), { length: 'nanometer', energy: 'kJ/mol' });
    expect(b.threshold).toBeCloseTo(0.4184, 15);
    expect(b.stationary).toBe(false);
    expect(checkStationary(Float64Array.of(0.5, 0, 0), { length: 'nanometer', energy: 'kJ/mol' }, 1).stationary).toBe(true);
    expect(checkStationary(Float64Array.of(NaN, 0, 0), { length: 'angstrom', energy: 'kcal/mol' }).stationary).toBe(false);
  });
});
