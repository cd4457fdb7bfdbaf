/**
 * Stretch Hessians of src/hessian/bond.ts: eigenvalues of a diatomic, the
 * Morse curvature, and the r = 0 cases.
 */
import { describe, expect, it } from 'vitest';
import { applyMotion, randomRigidMotion } from '../helpers/geometry.js';
import { createRandom } from '../helpers/random.js';
import { singleTerm } from '../helpers/terms.js';
import { analytic, maxAbs, numericHessian, relativeError, symmetricEigenvalues } from './support.js';

/** Two atoms at distance r along a random direction. */
function diatomic(r: number, seed: number): Float64Array {
  return applyMotion(new Float64Array([0, 0, 0, r, 0, 0]), randomRigidMotion(createRandom(seed)));
}

describe('harmonic-bond Hessian', () => {
  it('a diatomic at r0 has eigenvalues {0 ×5, 2k} (stiffness only along the bond; common practice)', () => {
    for (const [k, r0, seed] of [[600, 1.09, 1], [1100, 0.9572, 2], [35, 2.4, 3]]) {
      const values = symmetricEigenvalues(analytic(singleTerm('harmonic-bond', [k, r0]), diatomic(r0, seed)), 6);
      for (let n = 0; n < 5; n++) expect(Math.abs(values[n])).toBeLessThan(1e-10 * k);
      expect(values[5] / (2 * k)).toBeCloseTo(1, 12);
    }
  });

  it('stretched to r: {0 ×3, 2k(r − r0)/r ×2, 2k} (the rotations of a stretched bond are stiff)', () => {
    const k = 500;
    const r0 = 1.2;
    const r = 1.5;
    const values = symmetricEigenvalues(analytic(singleTerm('harmonic-bond', [k, r0]), diatomic(r, 4)), 6);
    for (let n = 0; n < 3; n++) expect(Math.abs(values[n])).toBeLessThan(1e-10 * k);
    expect(values[3]).toBeCloseTo((2 * k * (r - r0)) / r, 9);
    expect(values[4]).toBeCloseTo((2 * k * (r - r0)) / r, 9);
    expect(values[5]).toBeCloseTo(2 * k, 9);
  });

  it('compressed below r0 the transverse eigenvalues are negative: 2k(r − r0)/r < 0', () => {
    const values = symmetricEigenvalues(analytic(singleTerm('harmonic-bond', [500, 1.2]), diatomic(0.9, 5)), 6);
    expect(values[0]).toBeCloseTo((2 * 500 * (0.9 - 1.2)) / 0.9, 9);
    expect(values[1]).toBeCloseTo((2 * 500 * (0.9 - 1.2)) / 0.9, 9);
  });

  it('r0 = 0: blocks ±k I at every r, r = 0 included (E = ½ k |d|²)', () => {
    for (const x of [new Float64Array(6), diatomic(0.7, 6)]) {
      const h = analytic(singleTerm('harmonic-bond', [40, 0]), x);
      for (let r = 0; r < 6; r++) {
        for (let c = 0; c < 6; c++) {
          const expected = r % 3 !== c % 3 ? 0 : Math.floor(r / 3) === Math.floor(c / 3) ? 40 : -40;
          expect(h[r * 6 + c]).toBeCloseTo(expected, 12);
        }
      }
    }
  });

  it('coincident atoms with r0 > 0: zero blocks (direction undefined, as the gradient)', () => {
    expect(maxAbs(analytic(singleTerm('harmonic-bond', [40, 1]), new Float64Array([1, 2, 3, 1, 2, 3])))).toBe(0);
  });
});

describe('morse-bond Hessian', () => {
  it('at r0 the bond eigenvalue is 2·(2 D a²), the harmonic force constant k_e = 2 D a² of the Morse potential (Morse, Phys. Rev. 34 (1929) 57)', () => {
    const D = 100;
    const a = 2.1;
    const values = symmetricEigenvalues(analytic(singleTerm('morse-bond', [D, a, 0.96]), diatomic(0.96, 7)), 6);
    expect(values[5] / (4 * D * a * a)).toBeCloseTo(1, 12);
    for (let n = 0; n < 5; n++) expect(Math.abs(values[n])).toBeLessThan(1e-10);
  });

  it('at the inflection point r0 + ln 2 / a the curvature along the bond is zero', () => {
    const D = 100;
    const a = 2.1;
    const r = 0.96 + Math.LN2 / a;
    const x = new Float64Array([0, 0, 0, r, 0, 0]);
    const h = analytic(singleTerm('morse-bond', [D, a, 0.96]), x);
    expect(Math.abs(h[0])).toBeLessThan(1e-12 * D * a * a);
    // across the bond: E′/r = 2 D a e (1 − e)/r with e = ½
    expect(h[1 * 6 + 1]).toBeCloseTo((2 * D * a * 0.25) / r, 10);
  });

  it('matches differences far out on the tail and at short range', () => {
    for (const r of [0.5, 3, 6]) {
      const table = singleTerm('morse-bond', [80, 1.8, 1.1]);
      const x = diatomic(r, 8);
      expect(relativeError(analytic(table, x), numericHessian(table, x))).toBeLessThan(1e-8);
    }
  });
});

describe('urey-bradley Hessian', () => {
  it('is the harmonic bond between atoms i and k; the middle atom has no rows', () => {
    const x = new Float64Array([1.2, 0.1, 0, 0, 0, 0, -0.5, 1.1, 0.2]);
    const h = analytic(singleTerm('urey-bradley', [50, 2.1]), x);
    const bond = analytic(singleTerm('harmonic-bond', [50, 2.1]), new Float64Array([1.2, 0.1, 0, -0.5, 1.1, 0.2]));
    const map = [0, 1, 2, 6, 7, 8];
    for (let r = 0; r < 6; r++) for (let c = 0; c < 6; c++) expect(h[map[r] * 9 + map[c]]).toBe(bond[r * 6 + c]);
    for (let c = 0; c < 9; c++) for (const r of [3, 4, 5]) expect(h[r * 9 + c]).toBe(0);
  });
});
