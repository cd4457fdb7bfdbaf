/**
 * modelHessian, modelSparseHessian and hessianVectorProduct of
 * src/hessian/model.ts on the shared fixtures.
 */
import { describe, expect, it } from 'vitest';
import { tablesHessian } from '../../src/hessian/dense.js';
import { hessianVectorProduct, modelHessian, modelSparseHessian } from '../../src/hessian/model.js';
import { parseModel } from '../../src/model/model.js';
import { EVERY_KIND, SPEC_WATER } from '../fixtures/models.js';
import { createRandom } from '../helpers/random.js';
import { centralHessian, matVec, maxAbs, relativeError, rotate } from './support.js';

const FIXTURES = [
  ['SPEC_WATER', SPEC_WATER],
  ['EVERY_KIND', EVERY_KIND],
] as const;

describe.each(FIXTURES)('modelHessian on %s', (_name, file) => {
  const model = parseModel(file);
  const x = model.coordinates;
  const size = 3 * model.atomCount;
  const gradient = (y: Float64Array): Float64Array => {
    const g = new Float64Array(y.length);
    model.energy(y, g);
    return g;
  };

  it('matches 4-point differences of model.energy’s gradient, at the file geometry and 20 perturbed ones', () => {
    const rng = createRandom(17);
    for (let c = 0; c <= 20; c++) {
      const y = c === 0 ? x : Float64Array.from(x, (v) => v + rng.uniform(-0.05, 0.05));
      expect(relativeError(modelHessian(model, y), centralHessian(gradient, y, 1e-4)), `case ${c}`).toBeLessThan(1e-8);
    }
  });

  it('is (3N)×(3N), exactly symmetric, and written into out when given (overwritten)', () => {
    const h = modelHessian(model, x);
    expect(h.length).toBe(size * size);
    for (let r = 0; r < size; r++) for (let c = r + 1; c < size; c++) expect(h[r * size + c]).toBe(h[c * size + r]);
    const out = new Float64Array(size * size).fill(7);
    expect(modelHessian(model, x, out)).toBe(out);
    expect(Array.from(out)).toEqual(Array.from(h));
    expect(modelHessian(model, x)).not.toBe(h);
  });

  it('equals the sparse Hessian’s toDense() bit for bit, and hessianVectorProduct equals H·v', () => {
    const h = modelHessian(model, x);
    const sparse = modelSparseHessian(model).update(x);
    expect(Array.from(sparse.toDense())).toEqual(Array.from(h));
    const rng = createRandom(18);
    for (let c = 0; c < 5; c++) {
      const v = Float64Array.from(x, () => rng.uniform(-1, 1));
      const expected = matVec(h, v);
      const product = hessianVectorProduct(model, x, v);
      for (let e = 0; e < size; e++) expect(Math.abs(product[e] - expected[e])).toBeLessThanOrEqual(1e-12 * maxAbs(h));
    }
  });

  it('throws RangeError for coordinates or out of the wrong length', () => {
    expect(() => modelHessian(model, new Float64Array(size - 1))).toThrow(new RangeError(`x: expected 3N = ${size} numbers, got ${size - 1}`));
    expect(() => modelHessian(model, x, new Float64Array(size))).toThrow(RangeError);
    expect(() => hessianVectorProduct(model, x, new Float64Array(2))).toThrow(RangeError);
  });
});

describe('modelHessian invariances', () => {
  it('water (no position restraints): block rows sum to zero and H·(ω × x) = ω × g', () => {
    const model = parseModel(SPEC_WATER);
    const x = model.coordinates;
    const h = modelHessian(model, x);
    const g = new Float64Array(x.length);
    model.energy(x, g);
    const n = x.length;
    for (let r = 0; r < n; r++) {
      for (let q = 0; q < 3; q++) {
        let sum = 0;
        for (let b = 0; b < n / 3; b++) sum += h[r * n + 3 * b + q];
        expect(Math.abs(sum)).toBeLessThanOrEqual(1e-12 * maxAbs(h));
      }
    }
    const omega = [0.3, -0.8, 0.52];
    const left = matVec(h, rotate(omega, x));
    const right = rotate(omega, g);
    for (let e = 0; e < n; e++) expect(Math.abs(left[e] - right[e])).toBeLessThanOrEqual(1e-12 * maxAbs(h) * n);
  });

  it('EVERY_KIND has position restraints: the Hessian minus theirs is translation invariant', () => {
    const model = parseModel(EVERY_KIND);
    const x = model.coordinates;
    const rest = model.tables.filter((t) => t.kind !== 'position-restraint');
    expect(rest.length).toBe(model.tables.length - 1);
    const h = tablesHessian(rest, model.atomCount, x);
    const n = x.length;
    for (let r = 0; r < n; r++) {
      let sum = 0;
      for (let b = 0; b < n / 3; b++) sum += h[r * n + 3 * b + (r % 3)];
      expect(Math.abs(sum)).toBeLessThanOrEqual(1e-12 * maxAbs(h));
    }
  });
});
