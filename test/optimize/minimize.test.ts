/** The minimizers of src/optimize/minimize.ts on published test problems and on their contract. */
import { describe, expect, it } from 'vitest';
import { minimize } from '../../src/optimize/minimize.js';
import type { MinimizeMethod, MinimizeResult } from '../../src/optimize/minimize.js';
import type { ObjectiveFunction, Projection } from '../../src/optimize/types.js';
import { chainModel } from './chain.js';
import {
  BEALE,
  BROWN_BADLY_SCALED,
  EXTENDED_ROSENBROCK,
  FREUDENSTEIN_ROTH,
  HELICAL_VALLEY,
  POWELL_BADLY_SCALED,
  POWELL_SINGULAR,
  ROSENBROCK_10,
  ROSENBROCK_2,
  WOOD,
  rosenbrock,
} from './problems.js';
import type { TestProblem } from './problems.js';

const METHODS: readonly MinimizeMethod[] = ['lbfgs', 'cg', 'sd', 'fire'];
const DESCENT: readonly MinimizeMethod[] = ['lbfgs', 'cg', 'sd'];

/** f and the gradient's largest per-atom norm at `x`, re-evaluated outside the minimizer. */
function reevaluate(fn: ObjectiveFunction, x: Float64Array): { f: number; gMax: number } {
  const g = new Float64Array(x.length);
  const f = fn(x, g);
  let gMax = 0;
  for (let i = 0; i < x.length; i += 3) {
    const a = g[i];
    const b = i + 1 < x.length ? g[i + 1] : 0;
    const c = i + 2 < x.length ? g[i + 2] : 0;
    gMax = Math.max(gMax, Math.sqrt(a * a + b * b + c * c));
  }
  return { f, gMax };
}

/** Checks the result's own report against a re-evaluation of its coordinates. */
function expectHonest(fn: ObjectiveFunction, r: MinimizeResult): void {
  const { f, gMax } = reevaluate(fn, r.x);
  expect(r.energy).toBe(f);
  expect(r.maxForce).toBe(gMax);
}

describe('Rosenbrock (H. H. Rosenbrock, Computer Journal 3 (1960) 175): minimum f = 0 at (1, …, 1)', () => {
  // Criteria: 1e-6 for the line-search methods; 1e-4 for SD and FIRE, whose
  // linear convergence on this valley needs thousands of steps (common practice).
  for (const problem of [ROSENBROCK_2, ROSENBROCK_10, EXTENDED_ROSENBROCK]) {
    for (const method of METHODS) {
      it(`${method} solves ${problem.name}`, () => {
        const fast = method === 'lbfgs' || method === 'cg';
        const maxForce = fast ? 1e-6 : 1e-4;
        const r = minimize(problem.fn, Float64Array.from(problem.start), { method, maxForce, maxIterations: 50_000 });
        expect(r).toMatchObject({ converged: true, reason: 'max-force', method });
        expect(r.maxForce).toBeLessThanOrEqual(maxForce);
        expect(r.energy).toBeLessThan(fast ? 1e-10 : 1e-6);
        for (const v of r.x) expect(Math.abs(v - 1)).toBeLessThan(fast ? 1e-5 : 1e-2);
        expectHonest(problem.fn, r);
      });
    }
  }

  it('L-BFGS needs few evaluations on the 2-D problem from (−1.2, 1)', () => {
    const r = minimize(rosenbrock, new Float64Array([-1.2, 1]), { maxForce: 1e-6 });
    // 55 at the time of writing; a bound with room, not a timing.
    expect(r.evaluations).toBeLessThanOrEqual(70);
  });
});

/** Moré, Garbow, Hillstrom, ACM TOMS 7 (1981) 17: problems, standard starts and published minima (see problems.ts). */
describe('Moré–Garbow–Hillstrom test problems', () => {
  const cases: { problem: TestProblem; fTol: number; xTol?: number; maxStep?: number; methods?: MinimizeMethod[] }[] = [
    { problem: FREUDENSTEIN_ROTH, fTol: 1e-4 }, // published f to 4 decimals: 48.9842…
    { problem: POWELL_BADLY_SCALED, fTol: 1e-12, methods: ['lbfgs'] },
    { problem: POWELL_BADLY_SCALED, fTol: 1e-6, methods: ['cg'] },
    { problem: BROWN_BADLY_SCALED, fTol: 1e-12, xTol: 1e-6, maxStep: 1e7 }, // x1 must travel 1e6
    { problem: BEALE, fTol: 1e-12, xTol: 1e-5 },
    { problem: HELICAL_VALLEY, fTol: 1e-12, xTol: 1e-5 },
    { problem: WOOD, fTol: 1e-12, xTol: 1e-5 },
    { problem: POWELL_SINGULAR, fTol: 1e-8 }, // singular Hessian at the minimum: f falls like |x|⁴
  ];
  for (const { problem, fTol, xTol, maxStep, methods } of cases) {
    for (const method of methods ?? (['lbfgs', 'cg'] as const)) {
      it(`${method} reaches a published minimum of ${problem.name}`, () => {
        const r = minimize(problem.fn, Float64Array.from(problem.start), { method, maxForce: 1e-6, ...(maxStep ? { maxStep } : {}) });
        expect(r.converged).toBe(true);
        const nearest = Math.min(...problem.minima.map((m) => Math.abs(r.energy - m)));
        expect(nearest).toBeLessThan(fTol);
        if (xTol !== undefined && problem.minimizer) {
          problem.minimizer.forEach((m, i) => expect(Math.abs(r.x[i] - m)).toBeLessThanOrEqual(xTol * Math.max(1, Math.abs(m))));
        }
        expectHonest(problem.fn, r);
      });
    }
  }

  for (const method of ['sd', 'fire'] as const) {
    for (const problem of [BEALE, HELICAL_VALLEY]) {
      it(`${method} reaches the minimum of ${problem.name} (criterion 1e-5)`, () => {
        const r = minimize(problem.fn, Float64Array.from(problem.start), { method, maxForce: 1e-5, maxIterations: 50_000 });
        expect(r.converged).toBe(true);
        expect(r.energy).toBeLessThan(1e-8);
        problem.minimizer!.forEach((m, i) => expect(Math.abs(r.x[i] - m)).toBeLessThan(1e-3));
      });
    }
  }
});

describe('molecule-like chain (test/optimize/chain.ts)', () => {
  for (const method of METHODS) {
    it(`${method} converges${method === 'fire' ? '' : ' and never raises the energy'}, each atom moving at most maxStep per step`, () => {
      const { fn, start } = chainModel(30, 7);
      const maxForce = method === 'lbfgs' ? 1e-3 : 1e-2;
      const energies: number[] = [];
      let previous = Float64Array.from(start);
      let largestMove = 0;
      const r = minimize(fn, start, {
        method,
        maxForce,
        onIteration: ({ energy, x }) => {
          energies.push(energy);
          for (let i = 0; i < x.length; i += 3) {
            largestMove = Math.max(largestMove, Math.hypot(x[i] - previous[i], x[i + 1] - previous[i + 1], x[i + 2] - previous[i + 2]));
          }
          previous = Float64Array.from(x);
        },
      });
      expect(r).toMatchObject({ converged: true, reason: 'max-force' });
      expect(r.energy).toBeLessThan(r.initialEnergy);
      expectHonest(fn, r);
      expect(reevaluate(fn, r.x).gMax).toBeLessThanOrEqual(maxForce);
      expect(energies).toHaveLength(r.iterations);
      expect(largestMove).toBeLessThanOrEqual(0.3 * (1 + 1e-12));
      if (method !== 'fire') {
        let last = r.initialEnergy;
        for (const e of energies) {
          expect(e).toBeLessThanOrEqual(last);
          last = e;
        }
      }
    });
  }

  it('L-BFGS converges to 1e-3 in few evaluations per step', () => {
    const { fn, start } = chainModel(40, 3);
    const r = minimize(fn, start, { maxForce: 1e-3 });
    expect(r.converged).toBe(true);
    // About 1.1 evaluations per step at the time of writing; 1.5 leaves room (common practice for a Wolfe search with α = 1 first).
    expect(r.evaluations).toBeLessThanOrEqual(1.5 * r.iterations + 2);
  });
});

describe('minimize: stopping, caps and failures', () => {
  const start = (): Float64Array => new Float64Array([-1.2, 1]);

  for (const method of METHODS) {
    it(`${method}: onIteration returning false stops with 'stopped'`, () => {
      const seen: number[] = [];
      const r = minimize(rosenbrock, start(), {
        method,
        maxForce: 1e-12,
        onIteration: (info) => {
          seen.push(info.iteration);
          expect(info.evaluations).toBeGreaterThanOrEqual(info.iteration + 1);
          return info.iteration < 3;
        },
      });
      expect(r).toMatchObject({ converged: false, reason: 'stopped', iterations: 3 });
      expect(seen).toEqual([1, 2, 3]);
    });

    it(`${method}: an AbortSignal stops with 'aborted'`, () => {
      const controller = new AbortController();
      const r = minimize(rosenbrock, start(), {
        method,
        maxForce: 1e-12,
        signal: controller.signal,
        onIteration: ({ iteration }) => {
          if (iteration === 2) controller.abort();
        },
      });
      expect(r).toMatchObject({ converged: false, reason: 'aborted', iterations: 2 });
    });

    it(`${method}: a NaN energy stops with 'non-finite' and returns the last good point`, () => {
      // Rosenbrock made NaN for x0 > 0: every path from (−1.2, 1) to (1, 1) must cross it.
      const walled: ObjectiveFunction = (x, g) => (x[0] > 0 ? NaN : rosenbrock(x, g));
      const r = minimize(walled, start(), { method, maxForce: 1e-8, maxStep: 0.5 });
      expect(r).toMatchObject({ converged: false, reason: 'non-finite' });
      expect(r.x[0]).toBeLessThanOrEqual(0);
      expect(Number.isFinite(r.energy)).toBe(true);
      expectHonest(walled, r);
    });

    it(`${method}: never more than maxIterations steps, nor maxEvaluations calls`, () => {
      const a = minimize(rosenbrock, start(), { method, maxForce: 1e-12, maxIterations: 7 });
      expect(a).toMatchObject({ converged: false, reason: 'max-iterations', iterations: 7 });
      let calls = 0;
      const counted: ObjectiveFunction = (x, g) => {
        calls++;
        return rosenbrock(x, g);
      };
      const b = minimize(counted, start(), { method, maxForce: 1e-12, maxEvaluations: 11 });
      expect(b).toMatchObject({ converged: false, reason: 'max-evaluations' });
      expect(b.evaluations).toBe(calls);
      expect(calls).toBeLessThanOrEqual(11);
    });

    it(`${method}: deterministic, and x0 is not modified`, () => {
      const x0 = start();
      const a = minimize(rosenbrock, x0, { method, maxIterations: 200 });
      const b = minimize(rosenbrock, x0, { method, maxIterations: 200 });
      expect(Array.from(x0)).toEqual([-1.2, 1]);
      expect(Array.from(a.x)).toEqual(Array.from(b.x));
      expect(a.evaluations).toBe(b.evaluations);
      expect(a.x).not.toBe(x0);
    });
  }

  it('runs may nest: an objective that itself minimizes gives the same path', () => {
    const plain = minimize(rosenbrock, start(), { maxForce: 1e-6 });
    const nesting: ObjectiveFunction = (x, g) => {
      minimize(rosenbrock, new Float64Array([0.5, -0.5]), { maxIterations: 3 });
      return rosenbrock(x, g);
    };
    const nested = minimize(nesting, start(), { maxForce: 1e-6 });
    expect(Array.from(nested.x)).toEqual(Array.from(plain.x));
    expect(nested.evaluations).toBe(plain.evaluations);
  });

  it('maxIterations 0 evaluates only', () => {
    let calls = 0;
    const r = minimize(
      (x, g) => {
        calls++;
        return rosenbrock(x, g);
      },
      start(),
      { maxIterations: 0 },
    );
    // f(−1.2, 1) = 100 (1 − 1.44)² + 2.2² = 24.2 (Moré–Garbow–Hillstrom 1981, problem 1, f(x0)).
    expect(r).toMatchObject({ converged: false, reason: 'max-iterations', iterations: 0, evaluations: 1 });
    expect(calls).toBe(1);
    expect(r.energy).toBeCloseTo(24.2, 12);
    expect(r.initialEnergy).toBe(r.energy);
    expect(Array.from(r.x)).toEqual([-1.2, 1]);
  });

  it('reports convergence at the start without stepping', () => {
    const r = minimize(rosenbrock, new Float64Array([1, 1]));
    expect(r).toMatchObject({ converged: true, reason: 'max-force', iterations: 0, evaluations: 1, energy: 0 });
  });

  it('an already-aborted signal stops after the first evaluation', () => {
    const controller = new AbortController();
    controller.abort();
    const r = minimize(rosenbrock, start(), { signal: controller.signal });
    expect(r).toMatchObject({ reason: 'aborted', iterations: 0, evaluations: 1 });
  });

  it('a non-finite start stops at once', () => {
    const r = minimize(() => Infinity, start());
    expect(r).toMatchObject({ converged: false, reason: 'non-finite', iterations: 0, evaluations: 1 });
  });

  it('honours rmsForce and energyChange', () => {
    const a = minimize(rosenbrock, start(), { maxForce: 1e-14, rmsForce: 1e-3 });
    expect(a).toMatchObject({ converged: true, reason: 'rms-force' });
    expect(a.rmsForce).toBeLessThanOrEqual(1e-3);
    const b = minimize(rosenbrock, start(), { method: 'sd', maxForce: 1e-14, energyChange: 1e-6 });
    expect(b).toMatchObject({ converged: true, reason: 'energy-change' });
  });

  it("L-BFGS with scaling 'scalar' (γ = sᵀy / yᵀy) also solves Rosenbrock 2-D and the chain", () => {
    const a = minimize(rosenbrock, start(), { scaling: 'scalar', maxForce: 1e-6 });
    expect(a).toMatchObject({ converged: true, reason: 'max-force' });
    expect(Math.abs(a.x[0] - 1)).toBeLessThan(1e-5);
    const { fn, start: x0 } = chainModel(30, 7);
    const b = minimize(fn, x0, { scaling: 'scalar', maxForce: 1e-3 });
    expect(b).toMatchObject({ converged: true, reason: 'max-force' });
    const c = minimize(fn, x0, { scaling: 'scalar', maxForce: 1e-3, history: 3 });
    expect(c).toMatchObject({ converged: true, reason: 'max-force' });
  });

  it('validates options with messages naming them', () => {
    const x0 = start();
    expect(() => minimize(rosenbrock, x0, { scaling: 'unit' as 'scalar' })).toThrow(
      new RangeError(`scaling: expected 'block', 'diagonal' or 'scalar', got "unit"`),
    );
    expect(() => minimize(rosenbrock, x0, { maxEvaluations: 0 })).toThrow(
      new RangeError('maxEvaluations: expected an integer ≥ 1 or Infinity, got 0'),
    );
    expect(() => minimize(rosenbrock, x0, { maxForce: -1 })).toThrow(new RangeError('maxForce: expected a finite number > 0, got -1'));
    expect(() => minimize(rosenbrock, x0, { maxStep: NaN })).toThrow(new RangeError('maxStep: expected a finite number > 0, got NaN'));
    expect(() => minimize(rosenbrock, x0, { maxIterations: 1.5 })).toThrow(
      new RangeError('maxIterations: expected an integer ≥ 0 or Infinity, got 1.5'),
    );
    expect(() => minimize(rosenbrock, x0, { history: 0 })).toThrow(new RangeError('history: expected an integer ≥ 1, got 0'));
    expect(() => minimize(rosenbrock, x0, { method: 'newton' as MinimizeMethod })).toThrow(
      new RangeError(`method: expected one of 'lbfgs', 'cg', 'sd', 'fire', got "newton"`),
    );
    expect(() => minimize(rosenbrock, new Float64Array(0))).toThrow(new RangeError('x0: expected a non-empty Float64Array, got length 0'));
    expect(() => minimize(rosenbrock, new Float64Array([1, NaN]))).toThrow(new RangeError('x0[1]: expected a finite number, got NaN'));
    expect(() => minimize(rosenbrock, x0, { engine: 'gpu' as 'js' })).toThrow(new RangeError(`engine: expected 'wasm' or 'js', got "gpu"`));
  });
});

describe("minimize: the 'wasm' and 'js' engines", () => {
  // The same formulas with sums in a different order: paths agree to rounding
  // at first, and every method converges under both to the same minimum.
  for (const method of METHODS) {
    it(`${method}: both converge on the 40-atom chain to the same energy, and each is deterministic`, () => {
      const { fn, start: x0 } = chainModel(40, 11);
      const options = { method, maxForce: 1e-3, maxIterations: 20000 };
      const w = minimize(fn, x0, { ...options, engine: 'wasm' });
      const j = minimize(fn, x0, { ...options, engine: 'js' });
      expect(w.converged).toBe(true);
      expect(j.converged).toBe(true);
      expectHonest(fn, w);
      expectHonest(fn, j);
      expect(Math.abs(w.energy - j.energy)).toBeLessThan(1e-6 * Math.max(1, Math.abs(j.energy)));
      const again = minimize(fn, x0, { ...options, engine: 'wasm' });
      expect(again.evaluations).toBe(w.evaluations);
      expect(Array.from(again.x)).toEqual(Array.from(w.x));
    });
  }
  it('the first L-BFGS steps agree to rounding', () => {
    const { fn, start: x0 } = chainModel(40, 11);
    const w = minimize(fn, x0, { maxIterations: 5, engine: 'wasm' });
    const j = minimize(fn, x0, { maxIterations: 5, engine: 'js' });
    expect(w.evaluations).toBe(j.evaluations);
    for (let i = 0; i < x0.length; i++) expect(Math.abs(w.x[i] - j.x[i])).toBeLessThan(1e-10);
  });
});

describe('minimize with a projection', () => {
  // Freezes atoms 0 and 5 of the chain (coordinates 0–2 and 15–17) and the z of atom 9.
  const FROZEN = [0, 1, 2, 15, 16, 17, 29];
  const freeze: Projection = {
    projectPositions(x, reference) {
      for (const i of FROZEN) x[i] = reference[i];
      return true;
    },
    projectGradient(_x, g) {
      for (const i of FROZEN) g[i] = 0;
    },
  };
  for (const method of METHODS) {
    it(`${method}: frozen coordinates stay bit-for-bit equal and the projected force is small`, () => {
      const { fn, start } = chainModel(20, 11);
      start[15] += 0.1 + 0.2; // not a round number, so a drift would show
      const r = minimize(fn, start, { method, maxForce: 1e-2, projection: freeze, maxIterations: 50_000 });
      expect(r).toMatchObject({ converged: true, reason: 'max-force' });
      for (const i of FROZEN) expect(Object.is(r.x[i], start[i])).toBe(true);
      // The unfrozen part of the gradient is below the criterion.
      const g = new Float64Array(start.length);
      fn(r.x, g);
      freeze.projectGradient(r.x, g);
      for (let i = 0; i < g.length; i += 3) expect(Math.hypot(g[i], g[i + 1], g[i + 2])).toBeLessThanOrEqual(1e-2);
    });
  }
});
