/**
 * `strainwise/testing`: tools to verify analytic gradients in your own tests.
 *
 * - {@link checkGradient}: compare a function's gradient with central
 *   differences and get a report; {@link formatGradientCheck} prints it.
 * - {@link gradientMatchers}: `expect.extend(gradientMatchers)` adds
 *   `expect(fn).toHaveCorrectGradient(x, options?)` to vitest.
 * @module
 */
export { checkGradient, formatGradientCheck } from './check-gradient.js';
export type {
  Axis,
  EnergyFunction,
  GradientCheck,
  GradientCheckOptions,
  GradientCheckWorst,
} from './check-gradient.js';
export { gradientMatchers } from './matchers.js';
export type { GradientMatcherContext, GradientMatcherResult, GradientMatchers } from './matchers.js';
