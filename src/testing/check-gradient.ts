/**
 * Numerical verification of an analytic gradient by central differences.
 *
 * {@link checkGradient} evaluates a function's analytic gradient once and
 * compares it, coordinate by coordinate, with a finite-difference estimate
 * built from values alone. It works on any function of the shape
 * `(x, gradient?) => value`; the coordinate layout (`[x0, y0, z0, x1, …]`) is
 * only used to name the atom and axis of the worst coordinate.
 * @module
 */

/**
 * A function with an analytic gradient: returns its value at `x` and, when
 * `gradient` is given, OVERWRITES it with d(value)/dx in the same layout as
 * `x` (one entry per entry of `x`). It must not modify `x`.
 */
export type EnergyFunction = (x: Float64Array, gradient?: Float64Array) => number;

/** Axis names, indexed by `i % 3`. */
export type Axis = 'x' | 'y' | 'z';

/** Options of {@link checkGradient}. Every field is optional. */
export interface GradientCheckOptions {
  /**
   * Points of the central-difference stencil: `4` (default, fourth order,
   * 4 evaluations per coordinate) or `2` (second order, 2 evaluations).
   */
  readonly stencil?: 2 | 4;
  /**
   * Relative step: coordinate `i` is displaced by `h_i = step · max(1, |x_i|)`
   * (in units of x). Default `1e-4` for the 4-point stencil, `1e-6` for the
   * 2-point one. Must be finite and > 0.
   */
  readonly step?: number;
  /**
   * Check only these coordinates (0-based indices into `x`, integers in
   * `[0, x.length)`), e.g. a random sample of a large system. Default: all.
   */
  readonly indices?: ArrayLike<number>;
  /**
   * Largest accepted {@link GradientCheck.maxRelError}. Default `1e-6`.
   * Must be finite and > 0.
   */
  readonly tolerance?: number;
}

/** The coordinate where analytic and numerical derivatives disagree most. */
export interface GradientCheckWorst {
  /** 0-based index into `x`. */
  readonly index: number;
  /** `floor(index / 3)`. */
  readonly atom: number;
  /** `'xyz'[index % 3]`. */
  readonly axis: Axis;
  /** The analytic derivative at `index` (same units as fn's value per unit of x). */
  readonly analytic: number;
  /**
   * The finite-difference derivative at `index` (same units); `NaN` when the
   * coordinate was not among the checked `indices` (this happens only when the
   * analytic gradient is non-finite there).
   */
  readonly numerical: number;
}

/** The result of {@link checkGradient}. */
export interface GradientCheck {
  /** `maxRelError ≤ tolerance` and every value (energy, both gradients) finite. */
  readonly ok: boolean;
  /**
   * Largest |analytic − numerical| over the checked coordinates, in the same
   * units as fn's value per unit of x. `NaN` if any checked value is non-finite.
   */
  readonly maxAbsError: number;
  /**
   * `maxAbsError / max(1, largest |analytic component|)` (the largest taken
   * over the whole analytic gradient). This exact definition is a contract
   * the command line relies on; it is dimensionless only when the gradient is
   * larger than 1 in magnitude, and an absolute error otherwise.
   */
  readonly maxRelError: number;
  /**
   * The coordinate with the largest absolute error, or the first one with a
   * non-finite value (which takes precedence); `null` when nothing was checked
   * and nothing is non-finite (e.g. empty `x`).
   */
  readonly worst: GradientCheckWorst | null;
  /** fn's value at `x`. */
  readonly energy: number;
  /** The analytic gradient at `x` (length `x.length`). */
  readonly analytic: Float64Array;
  /**
   * The finite-difference gradient (length `x.length`, same layout); `NaN`
   * at coordinates that were not checked.
   */
  readonly numerical: Float64Array;
  /** How many times fn was called (1 with a gradient, the rest without). */
  readonly evaluations: number;
  /** The tolerance `ok` was decided with. */
  readonly tolerance: number;
}

/** Default relative step of the 4-point stencil. */
const DEFAULT_STEP_4 = 1e-4;
/** Default relative step of the 2-point stencil. */
const DEFAULT_STEP_2 = 1e-6;
/** Default tolerance on `maxRelError`. */
const DEFAULT_TOLERANCE = 1e-6;
const AXES: readonly Axis[] = ['x', 'y', 'z'];

/**
 * Compares `fn`'s analytic gradient at `x` with central differences.
 *
 * **What it computes.** One call `fn(copy, analytic)` gives the energy and the
 * analytic gradient; the buffer handed to fn is filled with `NaN` first, so a
 * function that adds into `gradient` instead of overwriting it, or leaves a
 * component unwritten, fails the check. Then, for each checked coordinate i,
 * the derivative is estimated from values alone (fn called without a
 * gradient) with the step h_i = step · max(1, |x_i|):
 *
 * - `stencil: 4` (default): (−f(x+2h) + 8f(x+h) − 8f(x−h) + f(x−2h)) / (12h).
 *   Truncation error h⁴ f⁽⁵⁾/30, i.e. O(h⁴); rounding error ≈ 1.5 ε|E|/h with
 *   ε ≈ 2.2e-16 and |E| the size of the function's value. The default
 *   step 1e-4 makes the truncation term about 3e-18 · f⁽⁵⁾ (negligible for
 *   any function that varies on a scale much longer than 1e-4 units of x)
 *   while keeping rounding near 3e-12 · |E|: both far below the default
 *   tolerance 1e-6.
 * - `stencil: 2`: (f(x+h) − f(x−h)) / (2h). Truncation h² f‴/6, O(h²);
 *   rounding ≈ ε|E|/h. The default step 1e-6 puts both near 1e-10 to 1e-12
 *   for well-scaled functions. Cheaper (2 calls per coordinate), less exact.
 *
 * The factor max(1, |x_i|) keeps the step a fixed fraction of large
 * coordinates (so x_i ± h_i differs from x_i in enough digits) and absolute
 * near the origin. The step actually used is `(x_i + h_i) − x_i`, so that
 * x_i + h is exactly representable and the divisor matches the displacement.
 *
 * **Errors.** `maxAbsError` is the largest |analytic − numerical| over the
 * checked coordinates (same units as fn's value per unit of x);
 * `maxRelError` divides it by max(1, largest |analytic component|) — this
 * exact definition is a contract of the command line. `ok` is
 * `maxRelError ≤ tolerance` with every value finite; a `NaN` or infinity in
 * the energy or either gradient makes `ok` false, and `worst` points at the
 * first non-finite coordinate.
 *
 * `x` is not modified: fn is only ever called on a private copy. Work arrays
 * (the copy and the two result gradients) are allocated once, before the
 * per-coordinate loop. Empty `x` gives `ok: true`, `worst: null`.
 *
 * @param fn - The function to check (see {@link EnergyFunction}).
 * @param x - The point, any length (3N for coordinates, but not required).
 * @param options - Stencil, step, indices and tolerance; see {@link GradientCheckOptions}.
 * @returns The comparison; see {@link GradientCheck}.
 * @throws TypeError if `fn` is not a function or `x` is not a Float64Array.
 * @throws RangeError if `x` holds a non-finite number; if `stencil` is not
 *   2 or 4; if `step` or `tolerance` is not finite or ≤ 0; if an index is not
 *   an integer in `[0, x.length)`; or if the step is so small that
 *   x_i + h_i == x_i for a checked coordinate.
 */
export function checkGradient(
  fn: EnergyFunction,
  x: Float64Array,
  options: GradientCheckOptions = {},
): GradientCheck {
  if (typeof fn !== 'function') {
    throw new TypeError(`checkGradient: fn must be a function (x, gradient?) => number, got ${describe(fn)}`);
  }
  if (!(x instanceof Float64Array)) {
    throw new TypeError(`checkGradient: x must be a Float64Array, got ${describe(x)}`);
  }
  const n = x.length;
  const stencil = options.stencil ?? 4;
  if (stencil !== 2 && stencil !== 4) {
    throw new RangeError(`checkGradient: stencil must be 2 or 4, got ${String(stencil)}`);
  }
  const step = options.step ?? (stencil === 4 ? DEFAULT_STEP_4 : DEFAULT_STEP_2);
  if (typeof step !== 'number' || !Number.isFinite(step) || step <= 0) {
    throw new RangeError(`checkGradient: step must be a finite number > 0, got ${String(step)}`);
  }
  const tolerance = options.tolerance ?? DEFAULT_TOLERANCE;
  if (typeof tolerance !== 'number' || !Number.isFinite(tolerance) || tolerance <= 0) {
    throw new RangeError(`checkGradient: tolerance must be a finite number > 0, got ${String(tolerance)}`);
  }
  for (let i = 0; i < n; i++) {
    if (!Number.isFinite(x[i])) {
      throw new RangeError(`checkGradient: x[${i}] must be finite, got ${x[i]}`);
    }
  }
  const indices = options.indices;
  const count = indices === undefined ? n : indices.length;
  for (let k = 0; k < count; k++) {
    const i = indices === undefined ? k : indices[k];
    if (indices !== undefined && !(Number.isInteger(i) && i >= 0 && i < n)) {
      throw new RangeError(
        `checkGradient: indices[${k}] = ${String(i)} is out of range: expected an integer in [0, ${n})`,
      );
    }
    if (effectiveStep(x[i], step) <= 0) {
      throw new RangeError(
        `checkGradient: step ${step} is too small for x[${i}] = ${x[i]} (x + h rounds to x)`,
      );
    }
  }

  // Work arrays, allocated once.
  const work = Float64Array.from(x);
  const analytic = new Float64Array(n).fill(Number.NaN);
  const numerical = new Float64Array(n).fill(Number.NaN);

  const energy = fn(work, analytic);
  let evaluations = 1;
  for (let i = 0; i < n; i++) work[i] = x[i]; // in case fn broke its contract

  for (let k = 0; k < count; k++) {
    const i = indices === undefined ? k : indices[k];
    const xi = x[i];
    const h = effectiveStep(xi, step);
    let d: number;
    if (stencil === 4) {
      work[i] = xi + 2 * h;
      const f2p = fn(work);
      work[i] = xi + h;
      const f1p = fn(work);
      work[i] = xi - h;
      const f1m = fn(work);
      work[i] = xi - 2 * h;
      const f2m = fn(work);
      d = (8 * (f1p - f1m) - (f2p - f2m)) / (12 * h);
      evaluations += 4;
    } else {
      work[i] = xi + h;
      const fp = fn(work);
      work[i] = xi - h;
      const fm = fn(work);
      d = (fp - fm) / (2 * h);
      evaluations += 2;
    }
    work[i] = xi;
    numerical[i] = d;
  }

  // Scale: the largest finite |analytic component|; first non-finite one.
  let scale = 1;
  let firstBadAnalytic = -1;
  for (let i = 0; i < n; i++) {
    const a = analytic[i];
    if (!Number.isFinite(a)) {
      if (firstBadAnalytic < 0) firstBadAnalytic = i;
    } else if (Math.abs(a) > scale) {
      scale = Math.abs(a);
    }
  }

  let maxAbsError = 0;
  let worstIndex = -1;
  let firstBadChecked = -1;
  for (let k = 0; k < count; k++) {
    const i = indices === undefined ? k : indices[k];
    const e = Math.abs(analytic[i] - numerical[i]);
    if (!Number.isFinite(e)) {
      if (firstBadChecked < 0 || i < firstBadChecked) firstBadChecked = i;
    } else if (worstIndex < 0 || e > maxAbsError) {
      maxAbsError = e;
      worstIndex = i;
    }
  }
  if (firstBadChecked >= 0) maxAbsError = Number.NaN;

  const badIndex =
    firstBadAnalytic >= 0 && firstBadChecked >= 0
      ? Math.min(firstBadAnalytic, firstBadChecked)
      : Math.max(firstBadAnalytic, firstBadChecked);
  if (badIndex >= 0) worstIndex = badIndex;

  const maxRelError = maxAbsError / scale;
  const finite = badIndex < 0 && Number.isFinite(energy);
  const ok = finite && maxRelError <= tolerance;

  const worst: GradientCheckWorst | null =
    worstIndex < 0
      ? null
      : {
          index: worstIndex,
          atom: Math.floor(worstIndex / 3),
          axis: AXES[worstIndex % 3],
          analytic: analytic[worstIndex],
          numerical: numerical[worstIndex],
        };

  return { ok, maxAbsError, maxRelError, worst, energy, analytic, numerical, evaluations, tolerance };
}

/** The representable step `(xi + h) − xi` for h = step · max(1, |xi|). */
function effectiveStep(xi: number, step: number): number {
  const h = step * Math.max(1, Math.abs(xi));
  return xi + h - xi;
}

/** A short description of a value's type, for error messages. */
function describe(value: unknown): string {
  if (value === null) return 'null';
  if (typeof value === 'object') return (value as object).constructor?.name ?? 'object';
  return typeof value;
}

/**
 * A short, human-readable, multi-line summary of a {@link GradientCheck}:
 * pass or fail with the tolerance, the worst coordinate (index, atom, axis),
 * its analytic and numerical derivatives, both errors, the energy and the
 * number of evaluations. Numbers are printed with enough digits to see the
 * disagreement.
 *
 * @param result - What {@link checkGradient} returned.
 * @param unitsLabel - Optional units of the gradient (fn's value per unit of
 *   x, e.g. `'kJ/mol/nm'`), appended to derivatives and to the absolute error.
 * @returns Lines joined with `\n`, no trailing newline.
 */
export function formatGradientCheck(result: GradientCheck, unitsLabel?: string): string {
  const u = unitsLabel ? ` ${unitsLabel}` : '';
  const lines: string[] = [];
  lines.push(`gradient check: ${result.ok ? 'PASS' : 'FAIL'} (tolerance ${fmt(result.tolerance, 1)} on max relative error)`);
  const w = result.worst;
  if (w === null) {
    lines.push('  worst coordinate: none (no coordinates checked)');
  } else {
    lines.push(`  worst coordinate: index ${w.index} (atom ${w.atom}, ${w.axis})`);
    lines.push(`  analytic:  ${fmt(w.analytic, 12)}${u}`);
    lines.push(`  numerical: ${fmt(w.numerical, 12)}${u}`);
    if (!Number.isFinite(w.analytic)) {
      lines.push('  the analytic gradient is not finite here (fn must overwrite every component of gradient)');
    } else if (!Number.isFinite(w.numerical)) {
      lines.push('  the numerical derivative is not finite here (fn returned a non-finite value near x)');
    }
  }
  lines.push(`  max abs error: ${fmt(result.maxAbsError, 3)}${u}, max rel error: ${fmt(result.maxRelError, 3)}`);
  lines.push(`  energy: ${fmt(result.energy, 12)}, evaluations: ${result.evaluations}`);
  return lines.join('\n');
}

/** Exponential notation with `digits` after the point; NaN/Infinity as is. */
function fmt(v: number, digits: number): string {
  return Number.isFinite(v) ? v.toExponential(digits) : String(v);
}
