import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { gradientMatchers } from '../../src/testing/index.js';
import type { EnergyFunction } from '../../src/testing/index.js';

expect.extend(gradientMatchers);

/**
 * Harmonic spring between atoms 0 and 1, E = ½ k (r − r0)², with
 * dE/dx_1 = k (r − r0) (x_1 − x_0) / r = −dE/dx_0 (exact by differentiation).
 */
function spring(k: number, r0: number): EnergyFunction {
  return (x, gradient) => {
    const dx = x[3] - x[0];
    const dy = x[4] - x[1];
    const dz = x[5] - x[2];
    const r = Math.sqrt(dx * dx + dy * dy + dz * dz);
    if (gradient) {
      const f = (k * (r - r0)) / r;
      gradient[0] = -f * dx;
      gradient[1] = -f * dy;
      gradient[2] = -f * dz;
      gradient[3] = f * dx;
      gradient[4] = f * dy;
      gradient[5] = f * dz;
    }
    return 0.5 * k * (r - r0) * (r - r0);
  };
}

const good = spring(300, 1.5);
/** The same spring with the y component of atom 1 (index 4) sign-flipped. */
const bad: EnergyFunction = (x, gradient) => {
  const e = good(x, gradient);
  if (gradient) gradient[4] = -gradient[4];
  return e;
};
const x = Float64Array.of(0.1, -0.2, 0.05, 1.2, 0.9, -0.4);

describe('toHaveCorrectGradient', () => {
  it('passes on a correct gradient', () => {
    expect(good).toHaveCorrectGradient(x);
    expect(good).toHaveCorrectGradient(x, { stencil: 2, tolerance: 1e-5 });
  });

  it('fails on a wrong gradient with a message naming the worst coordinate', () => {
    expect(() => expect(bad).toHaveCorrectGradient(x)).toThrow(/worst coordinate: index 4 \(atom 1, y\)/);
    expect(() => expect(bad).toHaveCorrectGradient(x)).toThrow(
      /expected the analytic gradient to agree with central differences, but it does not/,
    );
  });

  it('the failure message shows analytic, numerical, both errors and the tolerance', () => {
    const g = new Float64Array(6);
    good(x, g);
    let message = '';
    try {
      expect(bad).toHaveCorrectGradient(x, { tolerance: 1e-7 });
    } catch (error) {
      message = (error as Error).message;
    }
    expect(message).toContain(`analytic:  ${(-g[4]).toExponential(12)}`);
    expect(message).toMatch(/numerical: \S+/);
    expect(message).toMatch(/max abs error: \S+, max rel error: \S+/);
    expect(message).toContain('tolerance 1.0e-7');
    expect(message).toContain('FAIL');
  });

  it('supports .not: passes on a wrong gradient, fails on a correct one', () => {
    expect(bad).not.toHaveCorrectGradient(x);
    expect(() => expect(good).not.toHaveCorrectGradient(x)).toThrow(
      /expected the analytic gradient NOT to agree with central differences, but it does \(max rel error .* ≤ tolerance 1\.0e-6\)/,
    );
  });

  it('passes options on to checkGradient (indices, tolerance)', () => {
    expect(bad).toHaveCorrectGradient(x, { indices: [0, 1, 2, 3, 5] });
    expect(bad).not.toHaveCorrectGradient(x, { indices: [4] });
    // A 0.1 % error in one component passes a 1e-2 tolerance and fails the default.
    const slightly: EnergyFunction = (y, gradient) => {
      const e = good(y, gradient);
      if (gradient) gradient[0] *= 1.001;
      return e;
    };
    expect(slightly).toHaveCorrectGradient(x, { tolerance: 1e-2 });
    expect(slightly).not.toHaveCorrectGradient(x);
  });

  it('a NaN gradient fails', () => {
    const nan: EnergyFunction = (y, gradient) => {
      const e = good(y, gradient);
      if (gradient) gradient[2] = Number.NaN;
      return e;
    };
    expect(() => expect(nan).toHaveCorrectGradient(x)).toThrow(/index 2 \(atom 0, z\)[\s\S]*analytic: {2}NaN/);
  });

  it('throws a TypeError for a received value that is not a function, also under .not', () => {
    expect(() => expect(42).toHaveCorrectGradient(x)).toThrow(
      new TypeError('toHaveCorrectGradient: expected a function (x, gradient?) => number, got number'),
    );
    expect(() => expect(null).not.toHaveCorrectGradient(x)).toThrow(TypeError);
  });

  it('lets checkGradient validation errors through', () => {
    expect(() => expect(good).toHaveCorrectGradient(x, { step: -1 })).toThrow(
      new RangeError('checkGradient: step must be a finite number > 0, got -1'),
    );
  });

  it('works unregistered too, as a plain function with the expect.extend protocol', () => {
    const yes = gradientMatchers.toHaveCorrectGradient.call({ isNot: false }, good, x);
    const no = gradientMatchers.toHaveCorrectGradient.call({ isNot: false }, bad, x);
    expect(yes.pass).toBe(true);
    expect(no.pass).toBe(false);
    expect(no.message()).toContain('worst coordinate: index 4');
  });
});

describe('no run-time dependency on vitest', () => {
  // The package's `strainwise/testing` entry must load where vitest is absent:
  // the sources may refer to vitest only through `import type` (erased).
  it.each(['check-gradient.ts', 'matchers.ts', 'index.ts'])('src/testing/%s', (file) => {
    const source = readFileSync(new URL(`../../src/testing/${file}`, import.meta.url), 'utf8');
    const imports = source.split('\n').filter((line) => /^\s*(import|export)\b.*from\s+['"]vitest['"]/.test(line));
    for (const line of imports) expect(line).toMatch(/^\s*import type\b/);
    expect(source).not.toMatch(/import\(\s*['"]vitest['"]\s*\)/);
    expect(source).not.toMatch(/^\s*import\s+['"]vitest['"]/m);
  });
});
