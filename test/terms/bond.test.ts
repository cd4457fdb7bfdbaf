/**
 * Stretch kernels of src/terms/bond.ts: harmonic bond, Morse bond and the
 * Urey–Bradley 1–3 term.
 */
import { describe, expect, it } from 'vitest';
import { accumulateHarmonicBonds, accumulateMorseBonds, accumulateUreyBradley } from '../../src/terms/bond.js';
import { describeKernelProperties } from '../helpers/properties.js';
import { allFinite, checkTerm, energyFunction, evaluate, singleTerm } from '../helpers/terms.js';

describeKernelProperties('harmonic-bond', { seed: 101, gradientTolerance: 1e-10, invariant: true });
describeKernelProperties('morse-bond', { seed: 201, gradientTolerance: 1e-9, invariant: true });
describeKernelProperties('urey-bradley', { seed: 301, gradientTolerance: 1e-10, invariant: true });

// A pair at d = x_j − x_i = (3, 4, 12), r = 13 (exact by construction).
const PAIR = new Float64Array([1, 2, 3, 4, 6, 15]);

describe('harmonic-bond', () => {
  it('is ½ k (r − r0)² with gradient ±k (r − r0) d / r', () => {
    const table = singleTerm('harmonic-bond', [2, 10]);
    const { energy, gradient } = evaluate(table, PAIR);
    expect(energy).toBe(9); // ½ · 2 · (13 − 10)², exact by construction
    const f = (2 * 3) / 13;
    const expected = [-3 * f, -4 * f, -12 * f, 3 * f, 4 * f, 12 * f];
    expected.forEach((g, c) => expect(gradient[c]).toBeCloseTo(g, 14));
    expect(accumulateHarmonicBonds(PAIR, table)).toBe(9);
  });

  it('is zero with zero gradient at r = r0', () => {
    const { energy, gradient } = evaluate(singleTerm('harmonic-bond', [500, 13]), PAIR);
    expect(energy).toBe(0);
    expect(Array.from(gradient)).toEqual([0, 0, 0, 0, 0, 0]);
  });

  it('r0 = 0: ½ k r² with gradient k·d, defined even at coincident atoms and when r² underflows', () => {
    const table = singleTerm('harmonic-bond', [300, 0]);
    // |d| = 1e-200: r = sqrt(1e-400) underflows to 0, yet k·d is representable.
    const tiny = new Float64Array([0, 0, 0, 1e-200, -2e-200, 0]);
    const { energy, gradient } = evaluate(table, tiny);
    expect(energy).toBe(0);
    expect(Array.from(gradient)).toEqual([-300 * 1e-200, 300 * 2e-200, 0, 300 * 1e-200, -300 * 2e-200, 0]);
    expect(gradient[3]).not.toBe(0);
    const coincident = new Float64Array([0.5, -1, 2, 0.5, -1, 2]);
    const at = evaluate(table, coincident);
    expect(at.energy).toBe(0);
    expect(Array.from(at.gradient).every((g) => g === 0)).toBe(true);
    expect(energyFunction(table)).toHaveCorrectGradient(coincident, { tolerance: 1e-12 });
  });

  it('coincident atoms with r0 > 0: energy ½ k r0², gradient zero (direction undefined)', () => {
    const { energy, gradient } = evaluate(singleTerm('harmonic-bond', [300, 1.5]), new Float64Array([1, 1, 1, 1, 1, 1]));
    expect(energy).toBe(0.5 * 300 * 1.5 * 1.5);
    expect(Array.from(gradient).every((g) => g === 0)).toBe(true);
  });
});

describe('morse-bond', () => {
  it('is D [1 − exp(−a (r − r0))]² with dE/dr = 2 D a e (1 − e) along the bond', () => {
    const [D, a, r0] = [90, 2.1, 11.5];
    const table = singleTerm('morse-bond', [D, a, r0]);
    const { energy, gradient } = evaluate(table, PAIR);
    const e = Math.exp(-a * (13 - r0));
    expect(energy).toBeCloseTo(D * (1 - e) ** 2, 12);
    const f = (2 * D * a * e * (1 - e)) / 13;
    [-3 * f, -4 * f, -12 * f, 3 * f, 4 * f, 12 * f].forEach((g, c) => expect(gradient[c]).toBeCloseTo(g, 13));
    expect(accumulateMorseBonds(PAIR, table)).toBe(energy);
  });

  it('is exactly zero with zero gradient at r = r0, and D = 0 or a = 0 gives no energy', () => {
    for (const params of [
      [90, 2.1, 13],
      [0, 2.1, 11],
      [90, 0, 11],
    ]) {
      const { energy, gradient } = evaluate(singleTerm('morse-bond', params), PAIR);
      expect(energy).toBe(0);
      expect(Array.from(gradient).every((g) => g === 0)).toBe(true);
    }
  });

  it('coincident atoms: energy D (1 − exp(a r0))², finite, gradient zero', () => {
    const [D, a, r0] = [100, 2, 1.2];
    const { energy, gradient } = evaluate(singleTerm('morse-bond', [D, a, r0]), new Float64Array([3, 2, 1, 3, 2, 1]));
    expect(energy).toBeCloseTo(D * (1 - Math.exp(a * r0)) ** 2, 10);
    expect(Array.from(gradient).every((g) => g === 0)).toBe(true);
  });

  it('is steep on the repulsive side and flat far out: the gradient matches central differences at both', () => {
    const table = singleTerm('morse-bond', [100, 2.5, 1.2]);
    for (const r of [0.5, 0.8, 1.2, 3, 10, 25]) {
      const x = new Float64Array([0.1, -0.2, 0.3, 0.1 + r, -0.2, 0.3]);
      expect(checkTerm(table, x).maxRelError).toBeLessThanOrEqual(1e-9);
    }
  });
});

describe('urey-bradley', () => {
  // i, j, k with x_k − x_i = (3, 4, 12): the 1–3 distance is 13.
  const TRIPLE = new Float64Array([1, 2, 3, -5, 7, 0.5, 4, 6, 15]);

  it('is ½ k (|x_k − x_i| − s0)² and never touches the middle atom', () => {
    const table = singleTerm('urey-bradley', [2, 10]);
    const { energy, gradient } = evaluate(table, TRIPLE);
    expect(energy).toBe(9); // ½ · 2 · (13 − 10)², exact by construction
    const f = (2 * 3) / 13;
    [-3 * f, -4 * f, -12 * f, 0, 0, 0, 3 * f, 4 * f, 12 * f].forEach((g, c) => expect(gradient[c]).toBeCloseTo(g, 14));
    expect(gradient[3] === 0 && gradient[4] === 0 && gradient[5] === 0).toBe(true);
    const moved = Float64Array.from(TRIPLE);
    moved.set([40, -30, 20], 3);
    expect(accumulateUreyBradley(moved, table)).toBe(energy);
  });

  it('coincident outer atoms: energy ½ k s0², finite, gradient zero', () => {
    const { energy, gradient } = evaluate(singleTerm('urey-bradley', [50, 2.4]), new Float64Array([1, 0, 0, 0, 1, 0, 1, 0, 0]));
    expect(energy).toBeCloseTo(0.5 * 50 * 2.4 * 2.4, 12);
    expect(allFinite(gradient) && Array.from(gradient).every((g) => g === 0)).toBe(true);
  });
});
