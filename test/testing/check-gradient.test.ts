import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { checkGradient, formatGradientCheck } from '../../src/testing/index.js';
import type { EnergyFunction } from '../../src/testing/index.js';

// ---------------------------------------------------------------------------
// Fixtures: functions whose gradients are known in closed form.
// ---------------------------------------------------------------------------

/**
 * Seeded xorshift32 generator, uniform in [0, 1). Source: G. Marsaglia,
 * "Xorshift RNGs", Journal of Statistical Software 8 (2003) issue 14
 * (shift triple 13, 17, 5).
 */
function xorshift32(seed: number): () => number {
  let s = seed >>> 0 || 1;
  return () => {
    s ^= s << 13;
    s >>>= 0;
    s ^= s >>> 17;
    s ^= s << 5;
    s >>>= 0;
    return s / 4294967296;
  };
}

/** Uniform in [lo, hi) from `rand`. */
function uniform(rand: () => number, lo: number, hi: number): number {
  return lo + (hi - lo) * rand();
}

/** A random point of length n with entries in [lo, hi). */
function randomPoint(seed: number, n: number, lo = -2, hi = 2): Float64Array {
  const rand = xorshift32(seed);
  const x = new Float64Array(n);
  for (let i = 0; i < n; i++) x[i] = uniform(rand, lo, hi);
  return x;
}

/**
 * f = xᵀ A x with A symmetric (seeded random entries in [−1, 1)); the exact
 * gradient is 2 A x (exact by construction).
 */
function quadraticForm(n: number, seed: number): EnergyFunction {
  const rand = xorshift32(seed);
  const a = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = i; j < n; j++) {
      const v = uniform(rand, -1, 1);
      a[i * n + j] = v;
      a[j * n + i] = v;
    }
  }
  return (x, gradient) => {
    let e = 0;
    for (let i = 0; i < n; i++) {
      let ax = 0;
      for (let j = 0; j < n; j++) ax += a[i * n + j] * x[j];
      e += x[i] * ax;
      if (gradient) gradient[i] = 2 * ax;
    }
    return e;
  };
}

/**
 * f = Σ_{i<n−1} sin(x_i) cos(x_{i+1}); exact gradient (by differentiation):
 * ∂f/∂x_i = cos(x_i) cos(x_{i+1}) [i < n−1] − sin(x_{i−1}) sin(x_i) [i > 0].
 */
const sinCosChain: EnergyFunction = (x, gradient) => {
  const n = x.length;
  let e = 0;
  if (gradient) gradient.fill(0);
  for (let i = 0; i + 1 < n; i++) {
    const si = Math.sin(x[i]);
    const ci = Math.cos(x[i]);
    const sj = Math.sin(x[i + 1]);
    const cj = Math.cos(x[i + 1]);
    e += si * cj;
    if (gradient) {
      gradient[i] += ci * cj;
      gradient[i + 1] -= si * sj;
    }
  }
  return e;
};

/**
 * Rosenbrock's function, f = Σ_{i<n−1} 100 (x_{i+1} − x_i²)² + (1 − x_i)²
 * (H. H. Rosenbrock, Computer Journal 3 (1960) 175). Exact gradient:
 * ∂f/∂x_i = −400 x_i (x_{i+1} − x_i²) − 2 (1 − x_i) [i < n−1]
 *          + 200 (x_i − x_{i−1}²) [i > 0].
 */
const rosenbrock: EnergyFunction = (x, gradient) => {
  const n = x.length;
  let e = 0;
  if (gradient) gradient.fill(0);
  for (let i = 0; i + 1 < n; i++) {
    const t = x[i + 1] - x[i] * x[i];
    const u = 1 - x[i];
    e += 100 * t * t + u * u;
    if (gradient) {
      gradient[i] += -400 * x[i] * t - 2 * u;
      gradient[i + 1] += 200 * t;
    }
  }
  return e;
};

/** `fn` with its gradient component `index` passed through `edit`. */
function corrupt(fn: EnergyFunction, index: number, edit: (g: number) => number): EnergyFunction {
  return (x, gradient) => {
    const e = fn(x, gradient);
    if (gradient) gradient[index] = edit(gradient[index]);
    return e;
  };
}

/** The analytic gradient of `fn` at `x`. */
function gradientOf(fn: EnergyFunction, x: Float64Array): Float64Array {
  const g = new Float64Array(x.length);
  fn(x, g);
  return g;
}

const N = 15; // five atoms
const cases: { name: string; fn: EnergyFunction; x: Float64Array }[] = [
  { name: 'quadratic form xᵀAx', fn: quadraticForm(N, 12345), x: randomPoint(1, N) },
  { name: 'sin/cos chain', fn: sinCosChain, x: randomPoint(2, N, -3, 3) },
  { name: 'Rosenbrock', fn: rosenbrock, x: randomPoint(3, N) },
];

// ---------------------------------------------------------------------------

describe('checkGradient on closed-form gradients', () => {
  describe.each(cases)('$name', ({ fn, x }) => {
    it('accepts the exact gradient (maxRelError < 1e-9, common practice for double precision)', () => {
      const r = checkGradient(fn, x);
      expect(r.ok).toBe(true);
      expect(r.maxRelError).toBeLessThan(1e-9);
      expect(r.maxAbsError).toBeLessThan(1e-9 * Math.max(1, ...Array.from(r.analytic, Math.abs)));
      expect(r.energy).toBe(fn(x));
      expect(Array.from(r.analytic)).toEqual(Array.from(gradientOf(fn, x)));
      expect(r.evaluations).toBe(1 + 4 * N);
      expect(r.worst).not.toBeNull();
      expect(r.tolerance).toBe(1e-6);
    });

    it('passes with the 2-point stencil too (maxRelError < 1e-6, the default tolerance)', () => {
      const r = checkGradient(fn, x, { stencil: 2 });
      expect(r.ok).toBe(true);
      expect(r.maxRelError).toBeLessThan(1e-6);
      expect(r.evaluations).toBe(1 + 2 * N);
    });

    it('rejects one component scaled by 1.001 and names exactly that coordinate', () => {
      const k = 7; // atom 2, y
      const g = gradientOf(fn, x);
      const largest = Math.max(...Array.from(g, Math.abs));
      // Precondition: the corrupted component is not negligible (so 0.1 % of it exceeds the tolerance).
      expect(Math.abs(g[k])).toBeGreaterThan(0.01 * largest);
      const r = checkGradient(corrupt(fn, k, (v) => v * 1.001), x);
      expect(r.ok).toBe(false);
      expect(r.worst).toMatchObject({ index: 7, atom: 2, axis: 'y' });
      expect(r.worst?.analytic).toBe(g[k] * 1.001);
      // The numerical side still sees the true derivative (to 1e-9 of the scale, as above).
      expect(Math.abs((r.worst?.numerical ?? Number.NaN) - g[k])).toBeLessThan(1e-9 * largest);
      expect(Math.abs(r.maxAbsError - Math.abs(g[k]) * 0.001)).toBeLessThan(1e-9 * largest);
    });

    it('rejects one component with its sign flipped and names exactly that coordinate', () => {
      const k = 11; // atom 3, z
      const g = gradientOf(fn, x);
      expect(Math.abs(g[k])).toBeGreaterThan(1e-3); // precondition: a flip is visible
      const r = checkGradient(corrupt(fn, k, (v) => -v), x);
      expect(r.ok).toBe(false);
      expect(r.worst).toMatchObject({ index: 11, atom: 3, axis: 'z' });
      expect(r.worst?.analytic).toBe(-g[k]);
      const largest = Math.max(1, ...Array.from(g, Math.abs));
      expect(Math.abs(r.maxAbsError - 2 * Math.abs(g[k]))).toBeLessThan(1e-9 * largest);
    });
  });

  it('Rosenbrock: zero value and zero gradient at its minimum (1, …, 1) (Rosenbrock 1960)', () => {
    const x = new Float64Array(N).fill(1);
    const r = checkGradient(rosenbrock, x);
    expect(r.energy).toBe(0);
    expect(Array.from(r.analytic)).toEqual(new Array(N).fill(0));
    expect(r.ok).toBe(true);
    expect(r.maxAbsError).toBeLessThan(1e-9);
  });
});

describe('stencil accuracy (leading Taylor error terms h²f‴/6 and h⁴f⁽⁵⁾/30, exact by construction)', () => {
  // One-variable functions with exact derivatives: (eˣ)' = eˣ, (sin x)' = cos x.
  const oneD: { name: string; f: (t: number) => number; df: (t: number) => number; t: number }[] = [
    { name: 'exp', f: Math.exp, df: Math.exp, t: 0.5 },
    { name: 'sin', f: Math.sin, df: Math.cos, t: 0.7 },
  ];
  const wrap = (f: (t: number) => number, df: (t: number) => number): EnergyFunction => (x, gradient) => {
    if (gradient) gradient[0] = df(x[0]);
    return f(x[0]);
  };
  const numericalError = (
    f: (t: number) => number,
    df: (t: number) => number,
    t: number,
    stencil: 2 | 4,
    step?: number,
  ): number => {
    const r = checkGradient(wrap(f, df), Float64Array.of(t), { stencil, step });
    return Math.abs(r.numerical[0] - df(t));
  };

  describe.each(oneD)('$name', ({ f, df, t }) => {
    it('the 4-point stencil is more accurate than the 2-point one at the same step', () => {
      for (const step of [1e-2, 1e-3]) {
        const e2 = numericalError(f, df, t, 2, step);
        const e4 = numericalError(f, df, t, 4, step);
        // Leading terms: 2-point h²|f‴|/6 ≈ 1.7e-5 (h = 1e-2), 4-point h⁴|f⁽⁵⁾|/30 ≈ 3e-10 for
        // |f‴|, |f⁽⁵⁾| ≈ 1 here; a factor 100 is a wide margin (exact by construction).
        expect(e4).toBeLessThan(e2 / 100);
      }
    });

    it('the 4-point stencil with its default step beats the 2-point one with its default step', () => {
      const e2 = numericalError(f, df, t, 2);
      const e4 = numericalError(f, df, t, 4);
      // 4-point, h = 1e-4: rounding ≈ 1.5 ε|E|/h ≈ 3e-12 for |E| ≈ 1, truncation ≈ 3e-18;
      // 2-point, h = 1e-6: rounding ≈ ε|E|/h ≈ 2e-10 (the estimates in checkGradient's TSDoc).
      expect(e4).toBeLessThan(e2);
      expect(e4).toBeLessThan(1e-11);
    });

    it('halving the step divides the error by about 4 (2-point) and 16 (4-point)', () => {
      // Errors scale as h² and h⁴, so the ratios are 4 and 16 up to higher-order terms
      // (exact by construction); steps are large enough that rounding does not interfere.
      const r2 = numericalError(f, df, t, 2, 1e-2) / numericalError(f, df, t, 2, 5e-3);
      const r4 = numericalError(f, df, t, 4, 1e-1) / numericalError(f, df, t, 4, 5e-2);
      expect(r2).toBeGreaterThan(3.8);
      expect(r2).toBeLessThan(4.2);
      expect(r4).toBeGreaterThan(14);
      expect(r4).toBeLessThan(18);
    });
  });
});

describe('checkGradient behaviour', () => {
  const fn = cases[0].fn;
  const x = cases[0].x;

  it('leaves x unchanged and never hands x itself to fn', () => {
    const before = Array.from(x);
    const seen = new Set<Float64Array>();
    const spy: EnergyFunction = (y, g) => {
      seen.add(y);
      return fn(y, g);
    };
    checkGradient(spy, x);
    expect(Array.from(x)).toEqual(before);
    expect(seen.has(x)).toBe(false);
  });

  it('leaves x unchanged even when fn writes into its input', () => {
    const before = Array.from(x);
    const vandal: EnergyFunction = (y, g) => {
      const e = fn(y, g);
      y.fill(123);
      return e;
    };
    checkGradient(vandal, x);
    expect(Array.from(x)).toEqual(before);
  });

  it('differences are taken at x even if fn scribbles on its input during the gradient call', () => {
    const scribbler: EnergyFunction = (y, g) => {
      const e = fn(y, g);
      if (g) y.fill(0.5);
      return e;
    };
    const r = checkGradient(scribbler, x);
    expect(r.ok).toBe(true);
    expect(r.maxRelError).toBeLessThan(1e-9);
  });

  it('indices restricts the check to those coordinates', () => {
    const r = checkGradient(fn, x, { indices: [2, 9] });
    expect(r.ok).toBe(true);
    expect(r.evaluations).toBe(1 + 4 * 2);
    for (let i = 0; i < N; i++) {
      expect(Number.isNaN(r.numerical[i])).toBe(i !== 2 && i !== 9);
    }
    expect([2, 9]).toContain(r.worst?.index);
    expect(r.analytic.length).toBe(N);
  });

  it('indices: an error outside the sample goes unseen, one inside is found (Int32Array accepted)', () => {
    const wrong = corrupt(fn, 5, (v) => -v);
    expect(checkGradient(wrong, x, { indices: [0, 1, 2] }).ok).toBe(true);
    const r = checkGradient(wrong, x, { indices: Int32Array.of(0, 5) });
    expect(r.ok).toBe(false);
    expect(r.worst).toMatchObject({ index: 5, atom: 1, axis: 'z' });
  });

  it('empty indices: nothing checked, ok, worst null', () => {
    const r = checkGradient(fn, x, { indices: [] });
    expect(r).toMatchObject({ ok: true, worst: null, maxAbsError: 0, maxRelError: 0, evaluations: 1 });
  });

  it('a NaN in the analytic gradient: not ok, worst points at it', () => {
    const r = checkGradient(corrupt(fn, 4, () => Number.NaN), x);
    expect(r.ok).toBe(false);
    expect(r.worst?.index).toBe(4);
    expect(r.worst?.analytic).toBeNaN();
    expect(r.maxAbsError).toBeNaN();
    expect(r.maxRelError).toBeNaN();
  });

  it('a NaN in the analytic gradient outside indices still fails, worst points at it', () => {
    const r = checkGradient(corrupt(fn, 13, () => Number.NaN), x, { indices: [0, 1] });
    expect(r.ok).toBe(false);
    expect(r.worst).toMatchObject({ index: 13, atom: 4, axis: 'y' });
    expect(r.worst?.numerical).toBeNaN();
  });

  it('an infinite analytic component fails too', () => {
    const r = checkGradient(corrupt(fn, 0, () => Number.POSITIVE_INFINITY), x);
    expect(r.ok).toBe(false);
    expect(r.worst?.index).toBe(0);
  });

  it('a function that adds into gradient instead of overwriting it fails (buffer starts as NaN)', () => {
    const adds: EnergyFunction = (y, g) => {
      if (!g) return fn(y);
      const tmp = new Float64Array(y.length);
      const e = fn(y, tmp);
      for (let i = 0; i < y.length; i++) g[i] += tmp[i];
      return e;
    };
    const r = checkGradient(adds, x);
    expect(r.ok).toBe(false);
    expect(r.worst?.index).toBe(0);
  });

  it('a function that leaves one component unwritten fails and names it', () => {
    const lazy: EnergyFunction = (y, g) => {
      if (!g) return fn(y);
      const tmp = new Float64Array(y.length);
      const e = fn(y, tmp);
      for (let i = 0; i < y.length; i++) if (i !== 8) g[i] = tmp[i];
      return e;
    };
    const r = checkGradient(lazy, x);
    expect(r.ok).toBe(false);
    expect(r.worst).toMatchObject({ index: 8, atom: 2, axis: 'z' });
  });

  it('a NaN value away from x makes the numerical derivative NaN: not ok, worst points at it', () => {
    const x0 = x[6];
    const spiky: EnergyFunction = (y, g) => (y[6] !== x0 ? Number.NaN : fn(y, g));
    const r = checkGradient(spiky, x);
    expect(r.ok).toBe(false);
    expect(r.worst?.index).toBe(6);
    expect(r.worst?.numerical).toBeNaN();
    expect(Number.isFinite(r.worst?.analytic)).toBe(true);
  });

  it('a non-finite energy at x fails even when the gradients agree', () => {
    const nanEnergy: EnergyFunction = (y, g) => {
      const e = fn(y, g);
      return g ? Number.NaN : e;
    };
    const r = checkGradient(nanEnergy, x);
    expect(r.energy).toBeNaN();
    expect(r.maxRelError).toBeLessThan(1e-9);
    expect(r.ok).toBe(false);
  });

  it('empty x: ok, worst null, one evaluation', () => {
    const r = checkGradient(() => 0, new Float64Array(0));
    expect(r).toMatchObject({ ok: true, worst: null, maxAbsError: 0, maxRelError: 0, energy: 0, evaluations: 1 });
    expect(r.analytic.length).toBe(0);
    expect(r.numerical.length).toBe(0);
  });

  it('accepts any length; atom and axis derive from the index', () => {
    // f = Σ c_i x_i, gradient c (exact by construction); component 4 is wrong.
    const c = [1, 2, 3, 4, 5];
    const linear: EnergyFunction = (y, g) => {
      let e = 0;
      for (let i = 0; i < y.length; i++) {
        e += c[i] * y[i];
        if (g) g[i] = c[i] + (i === 4 ? 1 : 0);
      }
      return e;
    };
    const r = checkGradient(linear, new Float64Array(5));
    expect(r.worst).toMatchObject({ index: 4, atom: 1, axis: 'y', analytic: 6 });
    expect(r.worst?.numerical).toBeCloseTo(5, 10);
  });

  it('maxRelError = maxAbsError / max(1, largest |analytic|) (the CLI contract)', () => {
    // Linear functions: central differences are exact up to rounding (exact by construction).
    const linearWithError = (c: number[], delta: number): EnergyFunction => (y, g) => {
      let e = 0;
      for (let i = 0; i < c.length; i++) {
        e += c[i] * y[i];
        if (g) g[i] = c[i] + (i === 0 ? delta : 0);
      }
      return e;
    };
    const big = checkGradient(linearWithError([10, -20, 5], 0.01), Float64Array.of(0.3, -0.2, 0.1));
    expect(big.maxAbsError).toBeCloseTo(0.01, 9);
    expect(big.maxRelError).toBeCloseTo(0.01 / 20, 10);
    const small = checkGradient(linearWithError([0.1, -0.2, 0.05], 0.01), Float64Array.of(0.3, -0.2, 0.1));
    expect(small.maxRelError).toBeCloseTo(0.01, 9); // scale is 1 when every |component| < 1
    expect(small.maxRelError).toBe(small.maxAbsError);
  });

  it('tolerance decides ok', () => {
    const wrong = corrupt(fn, 7, (v) => v * 1.001);
    const r = checkGradient(wrong, x);
    expect(checkGradient(wrong, x, { tolerance: r.maxRelError * 1.01 }).ok).toBe(true);
    expect(checkGradient(wrong, x, { tolerance: r.maxRelError * 0.99 }).ok).toBe(false);
    expect(checkGradient(wrong, x, { tolerance: 0.5 }).tolerance).toBe(0.5);
  });

  it('the step is h_i = step · max(1, |x_i|): the displacements seen by fn', () => {
    const y = Float64Array.of(0.25, -300);
    const seen: number[][] = [];
    const rec: EnergyFunction = (z, g) => {
      if (g) g.fill(0);
      else seen.push([z[0], z[1]]);
      return 0;
    };
    checkGradient(rec, y, { stencil: 2, step: 2 ** -10 });
    // Powers of two keep every sum exact here (exact by construction).
    expect(seen).toEqual([
      [0.25 + 2 ** -10, -300],
      [0.25 - 2 ** -10, -300],
      [0.25, -300 + 300 * 2 ** -10],
      [0.25, -300 - 300 * 2 ** -10],
    ]);
  });
});

describe('checkGradient input validation (exact messages)', () => {
  const x = Float64Array.of(1, 2, 3, 4, 5, 6, 7, 8, 9);
  const fn = quadraticForm(9, 7);

  it.each([
    [{ step: 0 }, 'checkGradient: step must be a finite number > 0, got 0'],
    [{ step: -1e-4 }, 'checkGradient: step must be a finite number > 0, got -0.0001'],
    [{ step: Number.NaN }, 'checkGradient: step must be a finite number > 0, got NaN'],
    [{ step: Number.POSITIVE_INFINITY }, 'checkGradient: step must be a finite number > 0, got Infinity'],
    [{ tolerance: 0 }, 'checkGradient: tolerance must be a finite number > 0, got 0'],
    [{ tolerance: -1 }, 'checkGradient: tolerance must be a finite number > 0, got -1'],
    [{ tolerance: Number.NaN }, 'checkGradient: tolerance must be a finite number > 0, got NaN'],
    [{ indices: [0, 9] }, 'checkGradient: indices[1] = 9 is out of range: expected an integer in [0, 9)'],
    [{ indices: [-1] }, 'checkGradient: indices[0] = -1 is out of range: expected an integer in [0, 9)'],
    [{ indices: [1.5] }, 'checkGradient: indices[0] = 1.5 is out of range: expected an integer in [0, 9)'],
    [{ step: 1e-17 }, 'checkGradient: step 1e-17 is too small for x[0] = 1 (x + h rounds to x)'],
  ])('%o → RangeError', (options, message) => {
    expect(() => checkGradient(fn, x, options)).toThrow(new RangeError(message));
    expect(() => checkGradient(fn, x, options)).toThrow(RangeError);
  });

  it('rejects a stencil other than 2 or 4', () => {
    const options = { stencil: 3 } as unknown as { stencil: 2 };
    expect(() => checkGradient(fn, x, options)).toThrow(new RangeError('checkGradient: stencil must be 2 or 4, got 3'));
  });

  it('rejects a non-finite coordinate', () => {
    const bad = Float64Array.of(0, 0, Number.NaN);
    expect(() => checkGradient(fn, bad)).toThrow(new RangeError('checkGradient: x[2] must be finite, got NaN'));
  });

  it('rejects x that is not a Float64Array, and fn that is not a function', () => {
    const plain = [1, 2, 3] as unknown as Float64Array;
    expect(() => checkGradient(fn, plain)).toThrow(new TypeError('checkGradient: x must be a Float64Array, got Array'));
    const notFn = 42 as unknown as EnergyFunction;
    expect(() => checkGradient(notFn, x)).toThrow(
      new TypeError('checkGradient: fn must be a function (x, gradient?) => number, got number'),
    );
  });

  it('validates before calling fn', () => {
    let calls = 0;
    const counted: EnergyFunction = (y, g) => {
      calls++;
      return fn(y, g);
    };
    expect(() => checkGradient(counted, x, { indices: [3, 99] })).toThrow(RangeError);
    expect(calls).toBe(0);
  });
});

describe('formatGradientCheck', () => {
  const fn = cases[2].fn;
  const x = cases[2].x;

  it('summarizes a failure: worst coordinate, both derivatives, errors, units, FAIL', () => {
    const r = checkGradient(corrupt(fn, 7, (v) => -v), x);
    const text = formatGradientCheck(r, 'kJ/mol/nm');
    expect(text).toContain('gradient check: FAIL (tolerance 1.0e-6 on max relative error)');
    expect(text).toContain('worst coordinate: index 7 (atom 2, y)');
    expect(text).toContain(`analytic:  ${r.worst?.analytic.toExponential(12)} kJ/mol/nm`);
    expect(text).toContain(`numerical: ${r.worst?.numerical.toExponential(12)} kJ/mol/nm`);
    expect(text).toContain(`max abs error: ${r.maxAbsError.toExponential(3)} kJ/mol/nm`);
    expect(text).toContain(`max rel error: ${r.maxRelError.toExponential(3)}`);
    expect(text).toContain(`evaluations: ${r.evaluations}`);
    expect(text.endsWith('\n')).toBe(false);
    expect(text.split('\n').length).toBe(6);
  });

  it('summarizes a pass without units', () => {
    const text = formatGradientCheck(checkGradient(fn, x));
    expect(text.startsWith('gradient check: PASS')).toBe(true);
    expect(text).not.toMatch(/undefined/);
  });

  it('explains a non-finite analytic component and an empty check', () => {
    const text = formatGradientCheck(checkGradient(corrupt(fn, 3, () => Number.NaN), x));
    expect(text).toContain('analytic:  NaN');
    expect(text).toContain('fn must overwrite every component of gradient');
    const empty = formatGradientCheck(checkGradient(() => 0, new Float64Array(0)));
    expect(empty).toContain('worst coordinate: none');
  });
});

// ---------------------------------------------------------------------------
// Property: random low-degree polynomials with their exact gradients.
// ---------------------------------------------------------------------------

/** A polynomial Σ_t c_t Π_{v ∈ vars_t} x_v (vars may repeat: powers). */
interface Polynomial {
  readonly n: number;
  readonly terms: readonly { readonly c: number; readonly vars: readonly number[] }[];
}

/** The polynomial and its exact gradient (product rule, exact by construction). */
function polynomial(p: Polynomial): EnergyFunction {
  return (x, gradient) => {
    if (gradient) gradient.fill(0);
    let e = 0;
    for (const { c, vars } of p.terms) {
      let prod = c;
      for (const v of vars) prod *= x[v];
      e += prod;
      if (gradient) {
        for (let k = 0; k < vars.length; k++) {
          let d = c;
          for (let l = 0; l < vars.length; l++) if (l !== k) d *= x[vars[l]];
          gradient[vars[k]] += d;
        }
      }
    }
    return e;
  };
}

const polynomialArb = fc.integer({ min: 1, max: 9 }).chain((n) =>
  fc.record({
    n: fc.constant(n),
    terms: fc.array(
      fc.record({
        c: fc.double({ min: -10, max: 10, noNaN: true }),
        // Total degree ≤ 4: the 4-point stencil's truncation error is then zero.
        vars: fc.array(fc.integer({ min: 0, max: n - 1 }), { minLength: 0, maxLength: 4 }),
      }),
      { minLength: 1, maxLength: 6 },
    ),
    x: fc.array(fc.double({ min: -3, max: 3, noNaN: true }), { minLength: n, maxLength: n }),
  }),
);

describe('property: random low-degree polynomials', () => {
  it('the checker passes on the exact gradient', () => {
    fc.assert(
      fc.property(polynomialArb, ({ n, terms, x }) => {
        const r = checkGradient(polynomial({ n, terms }), Float64Array.from(x));
        expect(r.ok).toBe(true);
        // Degree ≤ 4 ⇒ zero truncation; what is left is rounding, ≈ 1.5 ε|E|/h, about 1e-8 in the
        // worst case here (|E| ≤ 6·10·3⁴ ≈ 5e3, h ≥ 1e-4) and far less typically (common practice bound).
        expect(r.maxRelError).toBeLessThan(1e-8);
      }),
      { seed: 20240601, numRuns: 300 },
    );
  });

  it('the checker fails on a gradient with one component off by 1 % of the scale, and names it', () => {
    fc.assert(
      fc.property(polynomialArb, fc.nat(), ({ n, terms, x }, pick) => {
        const fn = polynomial({ n, terms });
        const point = Float64Array.from(x);
        const g = gradientOf(fn, point);
        const k = pick % n;
        const delta = 0.01 * Math.max(1, ...Array.from(g, Math.abs));
        const r = checkGradient(corrupt(fn, k, (v) => v + delta), point);
        expect(r.ok).toBe(false);
        expect(r.worst?.index).toBe(k);
      }),
      { seed: 20240602, numRuns: 300 },
    );
  });
});
