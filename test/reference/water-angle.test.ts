/**
 * A water-like geometry built at exactly 104.52° (the spec's example,
 * ../shared/spec/model-file.md; O–H 0.9572 Å) reads back 104.52°.
 */
import { describe, expect, it } from 'vitest';
import { bendAngle } from '../../src/terms/measure.js';
import { deg, rad } from '../helpers/geometry.js';
import { evaluate, singleTerm } from '../helpers/terms.js';

const THETA = 104.52; // degrees (exact by construction below)
const R = 0.9572; // Å
// O at the origin, the hydrogens symmetric about +y at ±θ/2.
const half = rad(THETA) / 2;
const WATER = new Float64Array([R * Math.sin(half), R * Math.cos(half), 0, 0, 0, 0, -R * Math.sin(half), R * Math.cos(half), 0]);

describe('water-like angle', () => {
  it('bendAngle reads 104.52° back to 1e-12°', () => {
    expect(Math.abs(deg(bendAngle(WATER, 0, 1, 2)) - THETA)).toBeLessThanOrEqual(1e-12);
  });

  it('a harmonic angle with θ0 = 104.52° and a cosine angle with cos θ0 are at their minimum there', () => {
    for (const [kind, params] of [
      ['harmonic-angle', [100, rad(THETA)]],
      ['cosine-angle', [100, Math.cos(rad(THETA))]],
    ] as const) {
      const { energy, gradient } = evaluate(singleTerm(kind, params), WATER);
      expect(energy).toBeLessThanOrEqual(1e-26);
      expect(Math.max(...Array.from(gradient, Math.abs))).toBeLessThanOrEqual(1e-12);
    }
    // 1° away the harmonic energy is ½ k (1°)², so the minimum is not trivially zero.
    expect(evaluate(singleTerm('harmonic-angle', [100, rad(THETA + 1)]), WATER).energy).toBeCloseTo(0.5 * 100 * rad(1) ** 2, 12);
  });
});
