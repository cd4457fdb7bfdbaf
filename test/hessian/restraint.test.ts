/**
 * Restraint Hessians of src/hessian/restraint.ts: the flat-bottomed forms,
 * their edges, and the position restraint's closed form.
 */
import { describe, expect, it } from 'vitest';
import { createRandom } from '../helpers/random.js';
import { singleTerm } from '../helpers/terms.js';
import { analytic, maxAbs, numericHessian, relativeError, symmetricEigenvalues } from './support.js';

describe('position-restraint Hessian', () => {
  const at = (k: number, flat: number): number[] => [k, 1, -2, 0.5, flat];

  it('outside the flat region: k [(1 − flat/r) I + (flat/r) u uᵀ], eigenvalues k (radial) and k (1 − flat/r) ×2', () => {
    const rng = createRandom(11);
    for (let c = 0; c < 50; c++) {
      const k = rng.uniform(1, 100);
      const flat = rng.uniform(0.1, 1);
      const r = flat + rng.uniform(0.05, 2);
      const [ux, uy, uz] = rng.unitVector();
      const x = new Float64Array([1 + r * ux, -2 + r * uy, 0.5 + r * uz]);
      const h = analytic(singleTerm('position-restraint', at(k, flat)), x);
      const u = [ux, uy, uz];
      for (let p = 0; p < 3; p++) {
        for (let q = 0; q < 3; q++) {
          const expected = k * ((p === q ? 1 - flat / r : 0) + (flat / r) * u[p] * u[q]);
          expect(h[3 * p + q]).toBeCloseTo(expected, 11);
        }
      }
      const values = symmetricEigenvalues(h, 3);
      expect(values[0]).toBeCloseTo(k * (1 - flat / r), 10);
      expect(values[1]).toBeCloseTo(k * (1 - flat / r), 10);
      expect(values[2]).toBeCloseTo(k, 10);
    }
  });

  it('inside the flat region and exactly on its edge: zero; flat = 0: k I everywhere, on the point too', () => {
    expect(maxAbs(analytic(singleTerm('position-restraint', at(50, 1)), new Float64Array([1.3, -2, 0.5])))).toBe(0);
    expect(maxAbs(analytic(singleTerm('position-restraint', at(50, 0.75)), new Float64Array([1.75, -2, 0.5])))).toBe(0);
    for (const x of [new Float64Array([1, -2, 0.5]), new Float64Array([3, 0, 0])]) {
      expect(Array.from(analytic(singleTerm('position-restraint', at(50, 0)), x))).toEqual([50, 0, 0, 0, 50, 0, 0, 0, 50]);
    }
  });

  it('just outside the edge the radial curvature is already k (a jump from 0: the energy is C¹, not C²)', () => {
    const h = analytic(singleTerm('position-restraint', at(50, 0.75)), new Float64Array([1.75 + 1e-9, -2, 0.5]));
    expect(h[0]).toBeCloseTo(50, 9);
    expect(h[4]).toBeCloseTo(50 * (1 - 0.75 / (0.75 + 1e-9)), 9);
  });
});

describe('distance-restraint Hessian', () => {
  const pair = (r: number): Float64Array => new Float64Array([0.2, 0.1, -0.3, 0.2 + 0.6 * r, 0.1 + 0.8 * r, -0.3]);

  it('between the bounds, and on a bound of a non-empty range: zero', () => {
    for (const r of [1.5, 1, 2]) expect(maxAbs(analytic(singleTerm('distance-restraint', [30, 1, 2]), pair(r)))).toBe(0);
  });

  it('below the lower and above the upper bound: a harmonic bond to that bound, matching differences', () => {
    for (const [r, bound] of [[0.7, 1], [2.6, 2]]) {
      const table = singleTerm('distance-restraint', [30, 1, 2]);
      const bond = analytic(singleTerm('harmonic-bond', [30, bound]), pair(r));
      expect(Array.from(analytic(table, pair(r)))).toEqual(Array.from(bond));
      expect(relativeError(analytic(table, pair(r)), numericHessian(table, pair(r)))).toBeLessThan(1e-9);
    }
  });

  it('lower = upper: an ordinary harmonic bond, smooth through the bound (k u uᵀ there)', () => {
    const table = singleTerm('distance-restraint', [30, 1.4, 1.4]);
    const h = analytic(table, pair(1.4));
    expect(h[0]).toBeCloseTo(30 * 0.36, 12);
    expect(h[1]).toBeCloseTo(30 * 0.48, 12);
    expect(relativeError(h, numericHessian(table, pair(1.4)))).toBeLessThan(1e-9);
  });

  it('coincident atoms: zero blocks', () => {
    expect(maxAbs(analytic(singleTerm('distance-restraint', [30, 1, 2]), pair(0)))).toBe(0);
  });
});
