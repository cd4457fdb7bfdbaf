/**
 * finiteDifferenceHessian of src/hessian/finite-difference.ts on functions
 * with known Hessians and on models, against the analytic one.
 */
import { describe, expect, it } from 'vitest';
import { finiteDifferenceHessian } from '../../src/hessian/finite-difference.js';
import { modelHessian } from '../../src/hessian/model.js';
import { parseModel } from '../../src/model/model.js';
import { EVERY_KIND, SPEC_WATER } from '../fixtures/models.js';
import { createRandom } from '../helpers/random.js';
import { relativeError } from './support.js';

describe('finiteDifferenceHessian', () => {
  it('recovers A for f = ½ xᵀ A x + bᵀ x (central differences of a linear gradient are exact but for rounding)', () => {
    const rng = createRandom(16);
    const n = 7;
    const a = new Float64Array(n * n);
    for (let r = 0; r < n; r++) for (let c = r; c < n; c++) a[r * n + c] = a[c * n + r] = rng.uniform(-5, 5);
    const b = Float64Array.from({ length: n }, () => rng.uniform(-1, 1));
    const fn = (x: Float64Array, g: Float64Array): number => {
      let f = 0;
      for (let r = 0; r < n; r++) {
        let s = b[r];
        for (let c = 0; c < n; c++) s += a[r * n + c] * x[c];
        g[r] = s;
        f += x[r] * (s + b[r]) * 0.5;
      }
      return f;
    };
    const x = Float64Array.from({ length: n }, () => rng.uniform(-3, 3));
    const h = finiteDifferenceHessian(fn, x);
    expect(relativeError(a, h)).toBeLessThan(1e-10);
  });

  it('is exactly symmetric and does not modify x', () => {
    const model = parseModel(EVERY_KIND);
    const x = model.coordinates;
    const before = Float64Array.from(x);
    const h = finiteDifferenceHessian((y, g) => model.energy(y, g), x);
    const n = x.length;
    for (let r = 0; r < n; r++) for (let c = r + 1; c < n; c++) expect(h[r * n + c]).toBe(h[c * n + r]);
    expect(Array.from(x)).toEqual(Array.from(before));
  });

  it.each([
    ['SPEC_WATER', SPEC_WATER],
    ['EVERY_KIND', EVERY_KIND],
  ] as const)('agrees with the analytic modelHessian on %s (default step 1e-5: error ≈ 1e-9 relative)', (_name, file) => {
    const model = parseModel(file);
    const x = model.coordinates;
    const numeric = finiteDifferenceHessian((y, g) => model.energy(y, g), x);
    // truncation h²|g‴|/6 and rounding ε|g|/h are both ~1e-10 of the entries at h = 1e-5
    expect(relativeError(modelHessian(model, x), numeric)).toBeLessThan(1e-7);
  });

  it('takes a step option; a smaller step on a smooth function changes little', () => {
    const model = parseModel(SPEC_WATER);
    const x = model.coordinates;
    const a = finiteDifferenceHessian((y, g) => model.energy(y, g), x, { step: 1e-4 });
    const b = finiteDifferenceHessian((y, g) => model.energy(y, g), x, { step: 1e-6 });
    expect(relativeError(a, b)).toBeLessThan(1e-6);
  });

  it('throws RangeError for a bad step or a non-finite coordinate', () => {
    const fn = (x: Float64Array, g: Float64Array): number => {
      g.fill(0);
      return 0;
    };
    expect(() => finiteDifferenceHessian(fn, new Float64Array(3), { step: 0 })).toThrow(new RangeError('step: expected a finite number > 0, got 0'));
    expect(() => finiteDifferenceHessian(fn, new Float64Array(3), { step: Number.NaN })).toThrow(RangeError);
    expect(() => finiteDifferenceHessian(fn, Float64Array.of(0, Number.POSITIVE_INFINITY))).toThrow(new RangeError('x[1]: expected a finite number, got Infinity'));
    expect(finiteDifferenceHessian(fn, new Float64Array(0)).length).toBe(0);
  });
});
