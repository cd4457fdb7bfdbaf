/**
 * A test matcher for analytic gradients, for vitest's `expect.extend`.
 *
 * Nothing here imports vitest at run time: the matcher is a plain function
 * that follows the `expect.extend` protocol (`this.isNot`, a
 * `{ pass, message }` result), and only the type augmentation at the end
 * refers to vitest, through `import type`.
 *
 * ```ts
 * // vitest.setup.ts (listed in `test.setupFiles`)
 * import { expect } from 'vitest';
 * import { gradientMatchers } from 'strainwise/testing';
 * expect.extend(gradientMatchers);
 *
 * // some.test.ts
 * expect(energy).toHaveCorrectGradient(x, { tolerance: 1e-7 });
 * ```
 * @module
 */
import type {} from 'vitest';
import { checkGradient, formatGradientCheck } from './check-gradient.js';
import type { GradientCheckOptions } from './check-gradient.js';

/** The part of a matcher's `this` that the gradient matcher reads. */
export interface GradientMatcherContext {
  /** True under `.not`. */
  readonly isNot: boolean;
}

/** What a matcher returns to `expect`: whether it passed and a message. */
export interface GradientMatcherResult {
  /** Whether the gradient passed {@link checkGradient}. */
  pass: boolean;
  /** The text shown when the assertion (or its `.not`) fails. */
  message: () => string;
}

/** The type of {@link gradientMatchers}. */
export type GradientMatchers = {
  /**
   * Passes when `checkGradient(received, x, options).ok`.
   *
   * @param received - The function under test, `(x, gradient?) => number`.
   * @param x - The point to check at (not modified).
   * @param options - Passed on to {@link checkGradient}.
   * @throws TypeError if `received` is not a function; whatever
   *   {@link checkGradient} throws for bad `x` or options (also under `.not`).
   */
  toHaveCorrectGradient(
    this: GradientMatcherContext,
    received: unknown,
    x: Float64Array,
    options?: GradientCheckOptions,
  ): GradientMatcherResult;
};

/**
 * Matchers to register with `expect.extend(gradientMatchers)`:
 * `expect(fn).toHaveCorrectGradient(x, options?)` passes when fn's analytic
 * gradient at `x` agrees with central differences within
 * `options.tolerance` (see {@link checkGradient}); `.not` inverts it. The
 * failure message names the worst coordinate (index, atom, axis), its
 * analytic and numerical derivatives, both errors and the tolerance.
 */
export const gradientMatchers: GradientMatchers = {
  toHaveCorrectGradient(received, x, options) {
    if (typeof received !== 'function') {
      throw new TypeError(
        `toHaveCorrectGradient: expected a function (x, gradient?) => number, got ${received === null ? 'null' : typeof received}`,
      );
    }
    const result = checkGradient(received as (x: Float64Array, gradient?: Float64Array) => number, x, options);
    const summary = formatGradientCheck(result);
    const pass = result.ok;
    const message = pass
      ? () =>
          `expected the analytic gradient NOT to agree with central differences, but it does ` +
          `(max rel error ${result.maxRelError.toExponential(3)} ≤ tolerance ${result.tolerance.toExponential(1)})\n${summary}`
      : () => `expected the analytic gradient to agree with central differences, but it does not\n${summary}`;
    return { pass, message };
  },
};

declare module 'vitest' {
  // The type parameter must match vitest's own declaration exactly.
  interface Matchers<T = any> {
    /**
     * Asserts that the received function's analytic gradient at `x` agrees
     * with central differences (see `checkGradient` in `strainwise/testing`).
     * Register first with `expect.extend(gradientMatchers)`.
     */
    toHaveCorrectGradient(x: Float64Array, options?: GradientCheckOptions): void;
  }
}
