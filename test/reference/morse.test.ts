/**
 * Morse bond against the identities of its definition, E = D [1 − exp(−a (r − r0))]²
 * (P. M. Morse, Phys. Rev. 34 (1929) 57): E(r0) = 0 at the minimum,
 * d²E/dr² = 2 D a² there, and E → D at long range. Parameters are invented.
 */
import { describe, expect, it } from 'vitest';
import { evaluate, singleTerm } from '../helpers/terms.js';

const [D, a, r0] = [100, 2, 1.1]; // invented values
const morse = singleTerm('morse-bond', [D, a, r0]);

/** dE/dr at separation r: the x component of the gradient on atom j, with the pair along x. */
function slope(r: number): number {
  return evaluate(morse, new Float64Array([0, 0, 0, r, 0, 0])).gradient[3];
}

describe('Morse bond (Morse 1929)', () => {
  it('E(r0) = 0 with zero gradient: the minimum is at r0 (exact by construction)', () => {
    const { energy, gradient } = evaluate(morse, new Float64Array([0, 0, 0, r0, 0, 0]));
    expect(energy).toBe(0);
    expect(Array.from(gradient).every((g) => g === 0)).toBe(true);
    // dE/dr < 0 below r0 and > 0 above it; E > 0 on both sides.
    for (const dr of [1e-3, 0.1, 0.5]) {
      expect(slope(r0 - dr)).toBeLessThan(0);
      expect(slope(r0 + dr)).toBeGreaterThan(0);
      expect(evaluate(morse, new Float64Array([0, 0, 0, r0 - dr, 0, 0])).energy).toBeGreaterThan(0);
      expect(evaluate(morse, new Float64Array([0, 0, 0, r0 + dr, 0, 0])).energy).toBeGreaterThan(0);
    }
  });

  it('d²E/dr² at r0 is 2 D a² (4-point central difference of the kernel’s gradient)', () => {
    const h = 1e-4;
    const curvature = (-slope(r0 + 2 * h) + 8 * slope(r0 + h) - 8 * slope(r0 - h) + slope(r0 - 2 * h)) / (12 * h);
    expect(Math.abs(curvature - 2 * D * a * a)).toBeLessThanOrEqual(1e-9 * 2 * D * a * a);
  });

  it('E → D at long range: at r0 + 50/a, E = D to rounding and the force vanishes', () => {
    const { energy, gradient } = evaluate(morse, new Float64Array([0, 0, 0, r0 + 50 / a, 0, 0]));
    expect(Math.abs(energy - D)).toBeLessThanOrEqual(1e-12 * D);
    expect(Math.abs(gradient[3])).toBeLessThanOrEqual(1e-15 * D * a);
  });
});
