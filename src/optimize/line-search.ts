/**
 * A line search that brackets a step satisfying the strong Wolfe conditions
 * with safeguarded cubic and quadratic interpolation, after J. J. Moré and
 * D. J. Thuente, "Line search algorithms with guaranteed sufficient
 * decrease", ACM TOMS 20 (1994) 286–307.
 * @module
 */
import { jsKernels, type VectorKernels } from '../linalg/vector-kernels.js';
import type { ObjectiveFunction, Projection } from './types.js';

/** Settings of {@link lineSearch}; every field has a default. */
export interface LineSearchOptions {
  /** Sufficient-decrease constant c1 in (0, c2); default 1e-4. */
  c1?: number;
  /** Curvature constant c2 in (c1, 1); default 0.9 (use 0.1 for conjugate gradients). */
  c2?: number;
  /** Smallest step allowed; default 0. */
  stepMin?: number;
  /** Largest step allowed; default 1e20. */
  stepMax?: number;
  /** Most function+gradient evaluations; default 20. */
  maxTrials?: number;
  /** Relative width of the bracket below which the search gives up; default 1e-14. */
  relativeWidth?: number;
  /** Optional projection: trial points and gradients are projected before the tests. */
  projection?: Projection;
}

/** Why {@link lineSearch} stopped. Only `'wolfe'` comes with `ok: true`. */
export type LineSearchReason =
  | 'wolfe'
  | 'max-trials'
  | 'step-max'
  | 'step-min'
  | 'rounding'
  | 'interval-too-small'
  | 'non-finite'
  | 'projection-failed'
  | 'not-descent';

/** What {@link lineSearch} returns, describing the last trial point (the one left in the work arrays). */
export interface LineSearchResult {
  /** True when the strong Wolfe conditions hold at `step`. */
  ok: boolean;
  /** The last trial step α (the point is x + α d, projected if a projection was given). */
  step: number;
  /** φ(step) = f at the trial point (NaN when no trial was evaluated). */
  value: number;
  /** φ'(step) = g(trial) · d, with the projected gradient when a projection is given. */
  slope: number;
  /** Function+gradient evaluations made. */
  evaluations: number;
  /** Why the search stopped. */
  reason: LineSearchReason;
}

const XTRAPL = 1.1;
const XTRAPU = 4.0;

/** The interval of uncertainty and its end values, one per search (so searches may nest). */
interface StepState {
  stx: number; fx: number; dx: number;
  sty: number; fy: number; dy: number;
  brackt: boolean;
}

/**
 * The safeguarded step rule of Moré–Thuente (their section 4): updates the
 * interval in `st` with the trial (stp, fp, dp) and returns the next trial,
 * kept within [stpmin, stpmax].
 */
function nextStep(st: StepState, stp: number, fp: number, dp: number, stpmin: number, stpmax: number): number {
  const { stx, fx, dx, sty, fy, dy } = st;
  const sgnd = dp * Math.sign(dx);
  let stpf: number;
  if (fp > fx) {
    // Case 1: higher value; the minimum is bracketed.
    const theta = (3 * (fx - fp)) / (stp - stx) + dx + dp;
    const s = Math.max(Math.abs(theta), Math.abs(dx), Math.abs(dp));
    let gamma = s * Math.sqrt(Math.max(0, (theta / s) ** 2 - (dx / s) * (dp / s)));
    if (stp < stx) gamma = -gamma;
    const p = gamma - dx + theta;
    const q = gamma - dx + gamma + dp;
    const stpc = stx + (p / q) * (stp - stx);
    const stpq = stx + (dx / ((fx - fp) / (stp - stx) + dx) / 2) * (stp - stx);
    stpf = Math.abs(stpc - stx) < Math.abs(stpq - stx) ? stpc : stpc + (stpq - stpc) / 2;
    st.brackt = true;
  } else if (sgnd < 0) {
    // Case 2: lower value, derivatives of opposite sign; bracketed.
    const theta = (3 * (fx - fp)) / (stp - stx) + dx + dp;
    const s = Math.max(Math.abs(theta), Math.abs(dx), Math.abs(dp));
    let gamma = s * Math.sqrt(Math.max(0, (theta / s) ** 2 - (dx / s) * (dp / s)));
    if (stp > stx) gamma = -gamma;
    const p = gamma - dp + theta;
    const q = gamma - dp + gamma + dx;
    const stpc = stp + (p / q) * (stx - stp);
    const stpq = stp + (dp / (dp - dx)) * (stx - stp);
    stpf = Math.abs(stpc - stp) > Math.abs(stpq - stp) ? stpc : stpq;
    st.brackt = true;
  } else if (Math.abs(dp) < Math.abs(dx)) {
    // Case 3: lower value, same sign, derivative decreasing in magnitude.
    const theta = (3 * (fx - fp)) / (stp - stx) + dx + dp;
    const s = Math.max(Math.abs(theta), Math.abs(dx), Math.abs(dp));
    let gamma = s * Math.sqrt(Math.max(0, (theta / s) ** 2 - (dx / s) * (dp / s)));
    if (stp > stx) gamma = -gamma;
    const p = gamma - dp + theta;
    const q = gamma + (dx - dp) + gamma;
    const r = p / q;
    let stpc: number;
    if (r < 0 && gamma !== 0) stpc = stp + r * (stx - stp);
    else stpc = stp > stx ? stpmax : stpmin;
    const stpq = stp + (dp / (dp - dx)) * (stx - stp);
    if (st.brackt) {
      stpf = Math.abs(stpc - stp) < Math.abs(stpq - stp) ? stpc : stpq;
      stpf = stp > stx ? Math.min(stp + 0.66 * (sty - stp), stpf) : Math.max(stp + 0.66 * (sty - stp), stpf);
    } else {
      stpf = Math.abs(stpc - stp) > Math.abs(stpq - stp) ? stpc : stpq;
      stpf = Math.max(stpmin, Math.min(stpmax, stpf));
    }
  } else if (st.brackt) {
    // Case 4: lower value, same sign, derivative not decreasing; use the other end.
    const theta = (3 * (fp - fy)) / (sty - stp) + dy + dp;
    const s = Math.max(Math.abs(theta), Math.abs(dy), Math.abs(dp));
    let gamma = s * Math.sqrt(Math.max(0, (theta / s) ** 2 - (dy / s) * (dp / s)));
    if (stp > sty) gamma = -gamma;
    const p = gamma - dp + theta;
    const q = gamma - dp + gamma + dy;
    stpf = stp + (p / q) * (sty - stp);
  } else {
    stpf = stp > stx ? stpmax : stpmin;
  }
  if (fp > fx) {
    st.sty = stp; st.fy = fp; st.dy = dp;
  } else {
    if (sgnd < 0) {
      st.sty = stx; st.fy = fx; st.dy = dx;
    }
    st.stx = stp; st.fx = fp; st.dx = dp;
  }
  return Number.isFinite(stpf) ? stpf : (st.stx + st.sty) / 2;
}

/**
 * Searches along `d` from `x` for a step α with
 * φ(α) ≤ φ(0) + c1 α φ'(0) and |φ'(α)| ≤ c2 |φ'(0)|, where φ(α) = f(x + α d).
 *
 * The first trial is `initialStep` (clamped to [stepMin, stepMax]); when it
 * already satisfies the conditions it is accepted with one evaluation.
 * Writes the last trial point into `xTrial` and its gradient (projected, if
 * a projection is given) into `gTrial`; `x`, `g` and `d` are only read. With
 * a projection, each trial is x + α d moved by `projectPositions(xTrial, x)`
 * and its gradient passed through `projectGradient`; φ'(α) is then the
 * projected gradient's component along d. Never throws; allocates only its
 * small interval record and the result object (no arrays), so searches may
 * nest (an objective may itself run a search).
 *
 * @param fn the objective.
 * @param x the current point (length n).
 * @param f0 f(x).
 * @param g0 ∇f(x) (projected, if a projection is used).
 * @param d the search direction; g0 · d must be negative.
 * @param initialStep the first trial α (> 0).
 * @param xTrial work array of length n, receives the last trial point.
 * @param gTrial work array of length n, receives its gradient.
 * @param kernels the vector kernels for the trial points and slopes (the
 *   minimizers pass their workspace's; every array must then come from that
 *   workspace). Default: plain JavaScript loops.
 */
export function lineSearch(
  fn: ObjectiveFunction,
  x: Float64Array,
  f0: number,
  g0: Float64Array,
  d: Float64Array,
  initialStep: number,
  xTrial: Float64Array,
  gTrial: Float64Array,
  options: LineSearchOptions = {},
  kernels: VectorKernels = jsKernels,
): LineSearchResult {
  const c1 = options.c1 ?? 1e-4;
  const c2 = options.c2 ?? 0.9;
  const stepMin = options.stepMin ?? 0;
  const stepMax = options.stepMax ?? 1e20;
  const maxTrials = options.maxTrials ?? 20;
  const xtol = options.relativeWidth ?? 1e-14;
  const projection = options.projection;

  const ginit = kernels.dot(g0, d);
  if (!(ginit < 0) || !Number.isFinite(f0)) {
    return { ok: false, step: 0, value: f0, slope: ginit, evaluations: 0, reason: 'not-descent' };
  }
  const gtest = c1 * ginit;
  const st: StepState = { stx: 0, fx: f0, dx: ginit, sty: 0, fy: f0, dy: ginit, brackt: false };
  let stage = 1;
  let width = stepMax - stepMin;
  let width1 = 2 * width;
  let stp = Math.min(Math.max(initialStep, stepMin), stepMax);
  let stmin = 0;
  let stmax = stp + XTRAPU * stp;
  let evaluations = 0;
  let f = NaN;
  let g = NaN;

  for (;;) {
    if (evaluations >= maxTrials) {
      return { ok: false, step: stp, value: f, slope: g, evaluations, reason: 'max-trials' };
    }
    kernels.axpyTo(xTrial, x, stp, d);
    if (projection && !projection.projectPositions(xTrial, x)) {
      return { ok: false, step: stp, value: NaN, slope: NaN, evaluations, reason: 'projection-failed' };
    }
    f = fn(xTrial, gTrial);
    evaluations++;
    if (projection) projection.projectGradient(xTrial, gTrial);
    g = kernels.dot(gTrial, d);
    if (!Number.isFinite(f) || !Number.isFinite(g)) {
      return { ok: false, step: stp, value: f, slope: g, evaluations, reason: 'non-finite' };
    }

    const ftest = f0 + stp * gtest;
    if (stage === 1 && f <= ftest && g >= 0) stage = 2;
    if (f <= ftest && Math.abs(g) <= -c2 * ginit) {
      return { ok: true, step: stp, value: f, slope: g, evaluations, reason: 'wolfe' };
    }
    if (st.brackt && (stp <= stmin || stp >= stmax)) {
      return { ok: false, step: stp, value: f, slope: g, evaluations, reason: 'rounding' };
    }
    if (st.brackt && stmax - stmin <= xtol * stmax) {
      return { ok: false, step: stp, value: f, slope: g, evaluations, reason: 'interval-too-small' };
    }
    if (stp === stepMax && f <= ftest && g <= gtest) {
      return { ok: false, step: stp, value: f, slope: g, evaluations, reason: 'step-max' };
    }
    if (stp === stepMin && (f > ftest || g >= gtest)) {
      return { ok: false, step: stp, value: f, slope: g, evaluations, reason: 'step-min' };
    }

    if (stage === 1 && f <= st.fx && f > ftest) {
      // Work with the modified function ψ(α) = φ(α) − φ(0) − c1 α φ'(0).
      st.fx -= st.stx * gtest; st.fy -= st.sty * gtest;
      st.dx -= gtest; st.dy -= gtest;
      stp = nextStep(st, stp, f - stp * gtest, g - gtest, stmin, stmax);
      st.fx += st.stx * gtest; st.fy += st.sty * gtest;
      st.dx += gtest; st.dy += gtest;
    } else {
      stp = nextStep(st, stp, f, g, stmin, stmax);
    }

    if (st.brackt) {
      if (Math.abs(st.sty - st.stx) >= 0.66 * width1) stp = st.stx + 0.5 * (st.sty - st.stx);
      width1 = width;
      width = Math.abs(st.sty - st.stx);
      stmin = Math.min(st.stx, st.sty);
      stmax = Math.max(st.stx, st.sty);
    } else {
      stmin = stp + XTRAPL * (stp - st.stx);
      stmax = stp + XTRAPU * (stp - st.stx);
    }
    stp = Math.min(Math.max(stp, stepMin), stepMax);
    if ((st.brackt && (stp <= stmin || stp >= stmax)) || (st.brackt && stmax - stmin <= xtol * stmax)) {
      stp = st.stx;
    }
  }
}
