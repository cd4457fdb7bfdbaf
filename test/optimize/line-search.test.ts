/** The strong-Wolfe line search of src/optimize/line-search.ts. */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { lineSearch } from '../../src/optimize/line-search.js';
import type { ObjectiveFunction, Projection } from '../../src/optimize/types.js';

/**
 * A random smooth function bounded below on Rⁿ (invented for the test):
 * Σ aᵢ (xᵢ − cᵢ)² + b Σ sin(ω xᵢ) + e Σ xᵢ⁴ with aᵢ > 0, so a strong-Wolfe
 * step exists along every descent direction.
 */
function smooth(a: number[], c: number[], b: number, w: number, e: number): ObjectiveFunction {
  return (x, g) => {
    let f = 0;
    for (let i = 0; i < x.length; i++) {
      const t = x[i] - c[i];
      f += a[i] * t * t + b * Math.sin(w * x[i]) + e * x[i] ** 4;
      if (g) g[i] = 2 * a[i] * t + b * w * Math.cos(w * x[i]) + 4 * e * x[i] ** 3;
    }
    return f;
  };
}

const dot = (p: Float64Array, q: Float64Array): number => p.reduce((s, v, i) => s + v * q[i], 0);

const problem = (nMax: number) =>
  fc.integer({ min: 1, max: nMax }).chain((n) =>
    fc.record({
      a: fc.array(fc.double({ min: 0.01, max: 100, noNaN: true }), { minLength: n, maxLength: n }),
      c: fc.array(fc.double({ min: -5, max: 5, noNaN: true }), { minLength: n, maxLength: n }),
      x: fc.array(fc.double({ min: -5, max: 5, noNaN: true }), { minLength: n, maxLength: n }),
      d: fc.array(fc.double({ min: -3, max: 3, noNaN: true }), { minLength: n, maxLength: n }),
      b: fc.double({ min: -2, max: 2, noNaN: true }),
      w: fc.double({ min: 0.1, max: 5, noNaN: true }),
      e: fc.double({ min: 0, max: 1, noNaN: true }),
      c1: fc.double({ min: 1e-4, max: 0.3, noNaN: true }),
      gap: fc.double({ min: 0.05, max: 0.6, noNaN: true }),
      step: fc.double({ min: 1e-3, max: 10, noNaN: true }),
    }),
  );

describe('lineSearch', () => {
  for (const nMax of [1, 8]) {
    it(`returns a step satisfying the strong Wolfe conditions it was given (random smooth functions, n ≤ ${nMax})`, () => {
      fc.assert(
        fc.property(problem(nMax), (p) => {
          const fn = smooth(p.a, p.c, p.b, p.w, p.e);
          const x = Float64Array.from(p.x);
          const g0 = new Float64Array(x.length);
          const f0 = fn(x, g0);
          const d = Float64Array.from(p.d);
          let slope0 = dot(g0, d);
          if (slope0 > 0) for (let i = 0; i < d.length; i++) d[i] = -d[i];
          slope0 = -Math.abs(slope0);
          fc.pre(slope0 < -1e-6);
          const c2 = Math.min(0.99, p.c1 + p.gap);
          const xT = new Float64Array(x.length);
          const gT = new Float64Array(x.length);
          const r = lineSearch(fn, x, f0, g0, d, p.step, xT, gT, { c1: p.c1, c2, maxTrials: 60 });
          expect(r.ok).toBe(true);
          expect(r.reason).toBe('wolfe');
          // Re-evaluate the returned step independently.
          const xs = x.map((v, i) => v + r.step * d[i]);
          const gs = new Float64Array(x.length);
          const fs = fn(xs, gs);
          expect(Array.from(xT)).toEqual(Array.from(xs));
          expect(r.value).toBe(fs);
          expect(r.slope).toBeCloseTo(dot(gs, d), 12);
          expect(fs).toBeLessThanOrEqual(f0 + p.c1 * r.step * slope0);
          expect(Math.abs(dot(gs, d))).toBeLessThanOrEqual(c2 * Math.abs(slope0));
          expect(r.evaluations).toBeGreaterThanOrEqual(1);
          expect(r.evaluations).toBeLessThanOrEqual(60);
        }),
        { numRuns: 300, seed: 1994 },
      );
    });
  }

  // f(x) = ½ xᵀ diag(1, 4) x from (1, 1) along the Newton direction −x: α = 1 is the exact minimizer (exact by construction).
  const quadratic: ObjectiveFunction = (x, g) => {
    if (g) {
      g[0] = x[0];
      g[1] = 4 * x[1];
    }
    return 0.5 * x[0] * x[0] + 2 * x[1] * x[1];
  };

  it('accepts the first trial when it satisfies the conditions (one evaluation)', () => {
    const x = new Float64Array([1, 1]);
    const g = new Float64Array(2);
    const f = quadratic(x, g);
    const d = new Float64Array([-1, -1]);
    const xT = new Float64Array(2);
    const gT = new Float64Array(2);
    const r = lineSearch(quadratic, x, f, g, d, 0.25, xT, gT);
    expect(r).toMatchObject({ ok: true, step: 0.25, evaluations: 1, reason: 'wolfe' });
    expect(Array.from(xT)).toEqual([0.75, 0.75]);
    expect(Array.from(gT)).toEqual([0.75, 3]);
  });

  it('refuses a direction that is not a descent direction without evaluating', () => {
    const x = new Float64Array([1, 1]);
    const g = new Float64Array(2);
    const f = quadratic(x, g);
    const r = lineSearch(quadratic, x, f, g, new Float64Array([1, 0]), 1, new Float64Array(2), new Float64Array(2));
    expect(r).toMatchObject({ ok: false, evaluations: 0, reason: 'not-descent' });
  });

  it('stops at stepMax on a function that keeps falling', () => {
    // f(x) = −x: no minimizer, slope −1 everywhere (exact by construction).
    const linear: ObjectiveFunction = (x, g) => {
      if (g) g[0] = -1;
      return -x[0];
    };
    const r = lineSearch(linear, new Float64Array([0]), 0, new Float64Array([-1]), new Float64Array([1]), 1, new Float64Array(1), new Float64Array(1), {
      stepMax: 7,
    });
    expect(r).toMatchObject({ ok: false, step: 7, value: -7, reason: 'step-max' });
  });

  it('keeps to the cap on trials', () => {
    const linear: ObjectiveFunction = (x, g) => {
      if (g) g[0] = -1;
      return -x[0];
    };
    const r = lineSearch(linear, new Float64Array([0]), 0, new Float64Array([-1]), new Float64Array([1]), 1, new Float64Array(1), new Float64Array(1), {
      maxTrials: 3,
    });
    expect(r).toMatchObject({ ok: false, evaluations: 3, reason: 'max-trials' });
  });

  it('reports a non-finite trial', () => {
    const wall: ObjectiveFunction = (x, g) => {
      if (g) g[0] = 2 * (x[0] - 10);
      return x[0] > 1 ? NaN : (x[0] - 10) ** 2;
    };
    const g = new Float64Array([-20]);
    const r = lineSearch(wall, new Float64Array([0]), 100, g, new Float64Array([1]), 5, new Float64Array(1), new Float64Array(1));
    expect(r).toMatchObject({ ok: false, evaluations: 1, reason: 'non-finite' });
  });

  it('projects trial points and gradients (a frozen coordinate stays bit-for-bit)', () => {
    const frozen: Projection = {
      projectPositions(x, reference) {
        x[1] = reference[1];
        return true;
      },
      projectGradient(_x, g) {
        g[1] = 0;
      },
    };
    const x = new Float64Array([1, 0.1 + 0.2]);
    const g = new Float64Array(2);
    const f = quadratic(x, g);
    frozen.projectGradient(x, g);
    const d = new Float64Array([-1, -3]); // has a component along the frozen coordinate
    const xT = new Float64Array(2);
    const gT = new Float64Array(2);
    const r = lineSearch(quadratic, x, f, g, d, 1, xT, gT, { projection: frozen });
    expect(r.ok).toBe(true);
    expect(Object.is(xT[1], x[1])).toBe(true);
    expect(gT[1]).toBe(0);
    expect(r.step).toBe(1); // the exact minimizer along the free coordinate (exact by construction)
  });
});
