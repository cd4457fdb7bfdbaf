/**
 * The wrap of a harmonic improper's deviation, Δ = φ − ξ0 into [−π, π)
 * (../shared/spec/model-file.md). All values exact by construction.
 */
import { describe, expect, it } from 'vitest';
import { torsionAngle } from '../../src/terms/measure.js';
import { wrapAngle } from '../../src/terms/torsion.js';
import { deg, rad } from '../helpers/geometry.js';
import { evaluate, singleTerm } from '../helpers/terms.js';

/** i–j–k–l with j–k on +z, i at azimuth 0 and l at azimuth phi (IUPAC sign, see torsion-sign.test.ts). */
function chainAt(cosPhi: number, sinPhi: number): Float64Array {
  return new Float64Array([1.44, 0, -0.51, 0, 0, 0, 0, 0, 1.53, 1.44 * cosPhi, 1.44 * sinPhi, 2.04]);
}

describe('harmonic-improper wrap', () => {
  it('ξ0 = 170°, φ = −170°: Δ = +20°, not −340°', () => {
    expect(deg(wrapAngle(rad(-170) - rad(170)))).toBeCloseTo(20, 12);
    const x = chainAt(Math.cos(rad(-170)), Math.sin(rad(-170)));
    expect(deg(torsionAngle(x, 0, 1, 2, 3))).toBeCloseTo(-170, 12);
    const k = 50;
    const { energy, gradient } = evaluate(singleTerm('harmonic-improper', [k, rad(170)]), x);
    expect(energy).toBeCloseTo(0.5 * k * rad(20) ** 2, 10);
    // Δ > 0, so E falls as φ decreases: turning l back towards −180° (about +z,
    // clockwise in the xy plane as seen from +z) lowers it. dE/dφ = k Δ; with
    // l at azimuth α (= φ here), dφ/dα = 1 and α grows along (−sin α, cos α).
    const alpha = rad(-170);
    const dEdAlpha = (-Math.sin(alpha) * gradient[9] + Math.cos(alpha) * gradient[10]) * 1.44;
    expect(dEdAlpha).toBeCloseTo(k * rad(20), 10);
  });

  it('φ = ξ0 + 180° gives Δ = −180° (the lower end of [−π, π)): trans with ξ0 = 0, and φ = 90° with ξ0 = −90°', () => {
    expect(wrapAngle(Math.PI)).toBe(-Math.PI);
    const k = 10;
    // Trans: φ = π exactly; ξ0 = 0.
    const trans = chainAt(-1, 0);
    expect(torsionAngle(trans, 0, 1, 2, 3)).toBe(Math.PI);
    // φ = 90° exactly: m · n = 0 exactly (m along +y, n along −x).
    const right = chainAt(0, 1);
    expect(torsionAngle(right, 0, 1, 2, 3)).toBe(Math.PI / 2);
    for (const [x, xi0] of [
      [trans, 0],
      [right, -Math.PI / 2],
    ] as const) {
      const { energy, gradient } = evaluate(singleTerm('harmonic-improper', [k, xi0]), x);
      expect(energy).toBeCloseTo(0.5 * k * Math.PI * Math.PI, 12);
      // dE/dα = k Δ along l's azimuth α: −kπ for Δ = −π (it would be +kπ for Δ = +π).
      const alpha = Math.atan2(x[10], x[9]);
      const dEdAlpha = (-Math.sin(alpha) * gradient[9] + Math.cos(alpha) * gradient[10]) * 1.44;
      expect(dEdAlpha).toBeCloseTo(-k * Math.PI, 10);
    }
  });
});
