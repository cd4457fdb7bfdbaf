/**
 * Restraint kernels of src/terms/restraint.ts: flat-bottomed position
 * restraints (tied to a point in space, so not invariant under rigid motions
 * of the atoms alone) and flat-bottomed distance restraints.
 */
import { describe, expect, it } from 'vitest';
import { accumulateDistanceRestraints, accumulatePositionRestraints } from '../../src/terms/restraint.js';
import { CASES } from '../helpers/cases.js';
import { applyMotion, maxAbs, randomRigidMotion } from '../helpers/geometry.js';
import { describeKernelProperties } from '../helpers/properties.js';
import { createRandom } from '../helpers/random.js';
import { allFinite, energyFunction, evaluate, makeTable, singleTerm } from '../helpers/terms.js';

describeKernelProperties('position-restraint', { seed: 901, gradientTolerance: 1e-10, invariant: false });
describeKernelProperties('distance-restraint', { seed: 1001, gradientTolerance: 1e-10, invariant: true });

describe('position-restraint', () => {
  // The atom at d = x − x0 = (3, 4, 12) from its reference point: r = 13.
  const x = new Float64Array([4, 6, 15]);
  const at = (k: number, flat: number): number[] => [k, 1, 2, 3, flat];

  it('outside the flat region: ½ k (r − flat)², gradient k (r − flat) d / r', () => {
    const { energy, gradient } = evaluate(singleTerm('position-restraint', at(2, 10)), x);
    expect(energy).toBe(9); // ½ · 2 · (13 − 10)², exact by construction
    const f = (2 * 3) / 13;
    [3 * f, 4 * f, 12 * f].forEach((g, c) => expect(gradient[c]).toBeCloseTo(g, 14));
  });

  it('flat = 0 is a plain ½ k r², gradient k d (zero at the reference point, as the derivative is)', () => {
    const { energy, gradient } = evaluate(singleTerm('position-restraint', at(2, 0)), x);
    expect(energy).toBe(169);
    expect(Array.from(gradient)).toEqual([6, 8, 24]);
    const onPoint = new Float64Array([1, 2, 3]);
    const zero = evaluate(singleTerm('position-restraint', at(2, 0)), onPoint);
    expect(zero.energy).toBe(0);
    expect(Array.from(zero.gradient)).toEqual([0, 0, 0]);
    expect(energyFunction(singleTerm('position-restraint', at(2, 0)))).toHaveCorrectGradient(onPoint, { tolerance: 1e-12 });
  });

  it('inside the flat region and on its edge: energy and gradient exactly zero', () => {
    for (const flat of [13, 13.5, 100]) {
      const { energy, gradient } = evaluate(singleTerm('position-restraint', at(50, flat)), x);
      expect(energy).toBe(0);
      expect(Array.from(gradient)).toEqual([0, 0, 0]);
    }
  });

  it('is continuous with a continuous gradient across the edge of the flat region', () => {
    // 1e-9 outside the edge: E ≈ ½ · 50 · (1e-9)², |g| ≈ 50 · 1e-9.
    const outside = evaluate(singleTerm('position-restraint', at(50, 13 - 1e-9)), x);
    expect(outside.energy).toBeGreaterThan(0);
    expect(outside.energy).toBeLessThan(0.5 * 50 * 1.01e-18);
    expect(maxAbs(outside.gradient)).toBeGreaterThan(0);
    expect(Math.hypot(...outside.gradient)).toBeLessThan(50 * 1.01e-9);
    // 1e-9 inside: nothing.
    const inside = evaluate(singleTerm('position-restraint', at(50, 13 + 1e-9)), x);
    expect(inside.energy).toBe(0);
    expect(maxAbs(inside.gradient)).toBe(0);
  });

  it('translating the atom and its reference point together changes nothing; so does rotating both about any point', () => {
    const rng = createRandom(91);
    for (let n = 0; n < 200; n++) {
      const { x: atom, params } = CASES['position-restraint'](rng);
      const table = singleTerm('position-restraint', params);
      const before = evaluate(table, atom);
      const motion = n % 2 === 0
        ? { rotation: new Float64Array([1, 0, 0, 0, 1, 0, 0, 0, 1]), translation: randomRigidMotion(rng).translation }
        : randomRigidMotion(rng);
      const movedAtom = applyMotion(atom, motion);
      const movedPoint = applyMotion(new Float64Array(params.slice(1, 4)), motion);
      const movedTable = singleTerm('position-restraint', [params[0], ...movedPoint, params[4]]);
      const after = evaluate(movedTable, movedAtom);
      expect(Math.abs(after.energy - before.energy)).toBeLessThanOrEqual(1e-12 * Math.max(1, before.energy));
      // The gradient turns with the motion: R g.
      const turned = applyMotion(before.gradient, { rotation: motion.rotation, translation: new Float64Array(3) });
      for (let c = 0; c < 3; c++) expect(Math.abs(after.gradient[c] - turned[c])).toBeLessThanOrEqual(1e-11 * Math.max(1, maxAbs(turned)));
    }
  });

  it('moving the atom alone does change the energy (it is tied to a point in space)', () => {
    const table = singleTerm('position-restraint', at(2, 0));
    expect(accumulatePositionRestraints(new Float64Array([5, 6, 15]), table)).not.toBe(accumulatePositionRestraints(x, table));
  });

  it('each restraint acts on its own atom only', () => {
    const table = makeTable('position-restraint', [
      { atoms: [2], params: [10, 0, 0, 0, 0] },
      { atoms: [0], params: [10, 1, 1, 1, 0] },
    ]);
    const pos = new Float64Array([1, 1, 2, 9, 9, 9, 0, 0, 3]);
    const { energy, gradient } = evaluate(table, pos);
    expect(energy).toBe(0.5 * 10 * 9 + 0.5 * 10 * 1);
    expect(Array.from(gradient)).toEqual([0, 0, 10, 0, 0, 0, 0, 0, 30]);
  });
});

describe('distance-restraint', () => {
  // A pair with d = x_j − x_i = (3, 4, 12), r = 13.
  const pair = new Float64Array([1, 2, 3, 4, 6, 15]);

  it('below lower: ½ k (lower − r)², pushing the atoms apart', () => {
    const { energy, gradient } = evaluate(singleTerm('distance-restraint', [2, 15, 20]), pair);
    expect(energy).toBe(4);
    const f = (2 * -2) / 13;
    [-3 * f, -4 * f, -12 * f, 3 * f, 4 * f, 12 * f].forEach((g, c) => expect(gradient[c]).toBeCloseTo(g, 14));
    expect(gradient[5]).toBeLessThan(0); // dE/dz_j < 0: moving j away lowers E
  });

  it('above upper: ½ k (r − upper)², pulling them together', () => {
    const { energy, gradient } = evaluate(singleTerm('distance-restraint', [2, 5, 10]), pair);
    expect(energy).toBe(9);
    expect(gradient[5]).toBeCloseTo((2 * 3 * 12) / 13, 14);
  });

  it('between lower and upper, and on both edges: exactly zero', () => {
    for (const [lower, upper] of [
      [10, 20],
      [13, 20],
      [5, 13],
      [13, 13],
    ]) {
      const { energy, gradient } = evaluate(singleTerm('distance-restraint', [40, lower, upper]), pair);
      expect(energy).toBe(0);
      expect(Array.from(gradient).every((g) => g === 0)).toBe(true);
    }
  });

  it('with lower = upper it is a harmonic bond with r0 = lower', () => {
    const rng = createRandom(92);
    for (let n = 0; n < 100; n++) {
      const { x } = CASES['harmonic-bond'](rng);
      const [k, r0] = [rng.uniform(1, 100), rng.uniform(0.5, 3)];
      const restraint = evaluate(singleTerm('distance-restraint', [k, r0, r0]), x);
      const bond = evaluate(singleTerm('harmonic-bond', [k, r0]), x);
      expect(restraint.energy).toBeCloseTo(bond.energy, 12);
      for (let c = 0; c < 6; c++) expect(restraint.gradient[c]).toBeCloseTo(bond.gradient[c], 12);
    }
  });

  it('coincident atoms: energy ½ k lower², finite, gradient zero (direction undefined)', () => {
    const same = new Float64Array([1, 1, 1, 1, 1, 1]);
    const { energy, gradient } = evaluate(singleTerm('distance-restraint', [30, 2, 3]), same);
    expect(energy).toBe(0.5 * 30 * 4);
    expect(allFinite(gradient) && Array.from(gradient).every((g) => g === 0)).toBe(true);
    expect(accumulateDistanceRestraints(same, singleTerm('distance-restraint', [30, 0, 3]))).toBe(0);
  });
});
