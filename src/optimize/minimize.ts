/**
 * One entry point that minimizes any {@link ObjectiveFunction} from a start
 * vector: L-BFGS, Polak–Ribière conjugate gradients, adaptive steepest
 * descent and FIRE, with the same convergence tests, caps, callback and
 * cancellation for all four.
 * @module
 */
import { vectorWorkspace, type VectorEngine, type VectorKernels } from '../linalg/vector-kernels.js';
import { createInitialMatrix, type InitialMatrixForm } from './initial-matrix.js';
import { lineSearch } from './line-search.js';
import type { LineSearchResult } from './line-search.js';
import type { ObjectiveFunction, Preconditioner, Projection } from './types.js';

/** The minimization methods offered by {@link minimize}. */
export type MinimizeMethod = 'lbfgs' | 'cg' | 'sd' | 'fire';

/** Why {@link minimize} stopped; the first three mean `converged: true`. */
export type MinimizeReason =
  | 'max-force'
  | 'rms-force'
  | 'energy-change'
  | 'max-iterations'
  | 'max-evaluations'
  | 'line-search-failed'
  | 'non-finite'
  | 'stopped'
  | 'aborted';

/** What {@link MinimizeOptions.onIteration} receives after each accepted step. */
export interface IterationInfo {
  /** Accepted steps so far (1 at the first call). */
  iteration: number;
  /** Function+gradient evaluations so far, including the first. */
  evaluations: number;
  /** f at the current point. */
  energy: number;
  /** Largest per-atom norm of the (projected) gradient. */
  maxForce: number;
  /** RMS per-atom norm of the (projected) gradient. */
  rmsForce: number;
  /** The current point: the minimizer's own array, read it during the call only and do not modify it. */
  x: Float64Array;
}

/** Settings of {@link minimize}; every field has a default. */
export interface MinimizeOptions {
  /** Method; default `'lbfgs'`. */
  method?: MinimizeMethod;
  /**
   * Converged when the largest per-atom norm of the projected gradient
   * (consecutive coordinate triples as atoms) is ≤ this; default 0.01 (common practice).
   */
  maxForce?: number;
  /** Also converged when the RMS per-atom gradient norm is ≤ this (off unless given). */
  rmsForce?: number;
  /** Also converged when an accepted step changes f by ≤ this in magnitude (off unless given). */
  energyChange?: number;
  /** Most accepted steps; default 10000. 0 evaluates the start point only. */
  maxIterations?: number;
  /** Most function+gradient evaluations, the first included; default unlimited. */
  maxEvaluations?: number;
  /** Largest move of any one atom in one step, in the units of x; default 0.3. */
  maxStep?: number;
  /** L-BFGS: number of stored correction pairs; default 10. */
  history?: number;
  /**
   * L-BFGS: the initial inverse Hessian H0 of the two-loop recursion.
   * `'scalar'`: γ I with γ = sᵀy / yᵀy from the latest pair. `'diagonal'`
   * (default): a diagonal matrix updated with every pair by the diagonal of
   * the BFGS update (Gilbert and Lemaréchal, Math. Programming 45 (1989)
   * 407), then scaled so that yᵀ H0 y = sᵀ y for the latest pair (the
   * condition that gives γ in the scalar case). The diagonal adapts to
   * coordinates of very different stiffness (stiff bonds beside soft
   * torsions) and needs markedly fewer evaluations on such problems.
   */
  scaling?: InitialMatrixForm;
  /**
   * L-BFGS: a change of variables that makes the problem better conditioned
   * (for a model, `relaxModel` builds one from its bond and angle terms). It
   * is rebuilt at the current point every `preconditionerRefresh` accepted
   * steps; when it cannot be built the run goes on without it.
   */
  preconditioner?: Preconditioner;
  /** L-BFGS: accepted steps between rebuilds of the preconditioner; default 50. */
  preconditionerRefresh?: number;
  /** FIRE: largest time step; default 1. The first step is a tenth of it. */
  dtMax?: number;
  /** What may move (frozen coordinates, fixed distances); applied to every trial point and gradient. */
  projection?: Projection;
  /**
   * How the minimizer's own vector work (inner products, updates, the
   * two-loop recursion) runs: `'wasm'` in WebAssembly SIMD loops where
   * available, else in JavaScript; `'js'` always in JavaScript. Default:
   * `'wasm'` from 96 coordinates (32 atoms) on, `'js'` below, where the cost
   * of each call into WebAssembly and of setting up its memory outweighs the
   * faster loops (measured with Node 20 on Rosenbrock functions). The
   * two agree to rounding (sums are added in a different order) and each is
   * deterministic. With `'wasm'` the arrays the objective receives are views
   * of one WebAssembly memory; they behave as any other `Float64Array`.
   */
  engine?: VectorEngine;
  /** Called after each accepted step; returning `false` stops the run with reason `'stopped'`. */
  onIteration?: (info: IterationInfo) => boolean | void;
  /** Stops the run with reason `'aborted'` when aborted (checked before each step). */
  signal?: AbortSignal;
}

/** What {@link minimize} returns. */
export interface MinimizeResult {
  /** True when a convergence criterion was met. */
  converged: boolean;
  /** Why the run stopped. */
  reason: MinimizeReason;
  /** The method used. */
  method: MinimizeMethod;
  /** Accepted steps. */
  iterations: number;
  /** Every call of the objective, the first included. */
  evaluations: number;
  /** f(x0) (after projecting x0, when a projection is given). */
  initialEnergy: number;
  /** f at the returned `x`. */
  energy: number;
  /** Largest per-atom norm of the projected gradient at `x`. */
  maxForce: number;
  /** RMS per-atom norm of the projected gradient at `x`. */
  rmsForce: number;
  /** The final point (the last good one on `'non-finite'`), a new array. */
  x: Float64Array;
}

const METHODS: readonly MinimizeMethod[] = ['lbfgs', 'cg', 'sd', 'fire'];
/** Curvature pairs with sᵀy ≤ EPS · yᵀy are skipped (machine epsilon, common practice). */
const EPS = 2.220446049250313e-16;
/** From this many coordinates on, the default engine is `'wasm'` (see {@link MinimizeOptions.engine}). */
const WASM_MIN_LENGTH = 96;

function show(value: unknown): string {
  return typeof value === 'string' ? JSON.stringify(value) : String(value);
}

function positive(name: string, value: number | undefined, fallback: number): number {
  if (value === undefined) return fallback;
  if (typeof value !== 'number' || !Number.isFinite(value) || value <= 0) {
    throw new RangeError(`${name}: expected a finite number > 0, got ${show(value)}`);
  }
  return value;
}

function count(name: string, value: number | undefined, fallback: number, min: number, infinite: boolean): number {
  if (value === undefined) return fallback;
  const ok = typeof value === 'number' && ((Number.isInteger(value) && value >= min) || (infinite && value === Infinity));
  if (!ok) {
    throw new RangeError(`${name}: expected an integer ≥ ${min}${infinite ? ' or Infinity' : ''}, got ${show(value)}`);
  }
  return value;
}

/**
 * Minimizes `fn` from `x0`.
 *
 * - `'lbfgs'`: limited-memory BFGS, two-loop recursion with `history` pairs
 *   (pairs with sᵀy ≤ ε yᵀy skipped), initial matrix per `scaling`, strong-Wolfe line
 *   search with c2 = 0.9; the first step moves 1/‖g‖ along −g, later ones
 *   try α = 1 first.
 * - `'cg'`: Polak–Ribière with β = max(0, β_PR), restarted along −g when the
 *   direction is not a descent direction and every n steps; c2 = 0.1.
 * - `'sd'`: steepest descent with a step (largest atom move) grown ×1.2
 *   after a decrease and halved after a rise.
 * - `'fire'`: FIRE (E. Bitzek et al., Phys. Rev. Lett. 97 (2006) 170201), unit
 *   masses, N_min 5, f_inc 1.1, f_dec 0.5, α_start 0.1, f_α 0.99. FIRE's
 *   energy may rise between steps; the returned energy is that of the
 *   returned point.
 *
 * For the first three, f never rises between accepted points. Every step is
 * capped so no atom moves more than `maxStep`. With a projection, x0 is first
 * projected (reference x0 itself), every trial point is projected from the
 * current point and every gradient projected; convergence is judged on the
 * projected gradient. A NaN or infinite energy or gradient stops the run
 * (`'non-finite'`) with the last good point. Deterministic; `x0` is not
 * modified. Criteria are tested in the order max-force, rms-force,
 * energy-change; the first met ends the run.
 *
 * @throws RangeError naming the option when an option or `x0` is invalid, or
 *   when the projection cannot place x0 on the allowed set.
 */
export function minimize(fn: ObjectiveFunction, x0: Float64Array, options: MinimizeOptions = {}): MinimizeResult {
  if (!(x0 instanceof Float64Array) || x0.length === 0) {
    throw new RangeError(`x0: expected a non-empty Float64Array, got ${x0 instanceof Float64Array ? 'length 0' : show(x0)}`);
  }
  for (let i = 0; i < x0.length; i++) {
    if (!Number.isFinite(x0[i])) throw new RangeError(`x0[${i}]: expected a finite number, got ${x0[i]}`);
  }
  const method = options.method ?? 'lbfgs';
  if (!METHODS.includes(method)) {
    throw new RangeError(`method: expected one of ${METHODS.map((m) => `'${m}'`).join(', ')}, got ${show(method)}`);
  }
  const maxForce = positive('maxForce', options.maxForce, 0.01);
  const rmsForce = options.rmsForce === undefined ? -1 : positive('rmsForce', options.rmsForce, 0);
  const energyChange = options.energyChange === undefined ? -1 : positive('energyChange', options.energyChange, 0);
  const maxIterations = count('maxIterations', options.maxIterations, 10000, 0, true);
  const maxEvaluations = count('maxEvaluations', options.maxEvaluations, Infinity, 1, true);
  const maxStep = positive('maxStep', options.maxStep, 0.3);
  const history = count('history', options.history, 10, 1, false);
  const dtMax = positive('dtMax', options.dtMax, 1);
  const scaling = options.scaling ?? 'diagonal';
  if (scaling !== 'diagonal' && scaling !== 'scalar' && scaling !== 'block') {
    throw new RangeError(`scaling: expected 'block', 'diagonal' or 'scalar', got ${show(scaling)}`);
  }
  const { projection, onIteration, signal } = options;
  const refresh = count('preconditionerRefresh', options.preconditionerRefresh, 50, 1, true);
  let preconditioner = method === 'lbfgs' ? options.preconditioner : undefined;
  if (onIteration !== undefined && typeof onIteration !== 'function') {
    throw new RangeError(`onIteration: expected a function, got ${show(onIteration)}`);
  }

  const engine = options.engine ?? (x0.length >= WASM_MIN_LENGTH ? 'wasm' : 'js');
  if (engine !== 'wasm' && engine !== 'js') throw new RangeError(`engine: expected 'wasm' or 'js', got ${show(engine)}`);

  const n = x0.length;
  const lbfgs = method === 'lbfgs';
  // Every vector of the run comes from one workspace, so that the kernels can work on them.
  const diagonalH0 = lbfgs && (scaling === 'diagonal' || (scaling === 'block' && n % 3 !== 0));
  const vectorCount =
    5 + (method === 'fire' ? 1 : 0) + (lbfgs ? 2 * history + 2 : 0) + (diagonalH0 ? 2 : 0) + (preconditioner ? history + 4 : 0);
  const workspace = vectorWorkspace(n, vectorCount, engine);
  const kernels = workspace.kernels;
  let taken = 0;
  const take = (): Float64Array => workspace.vectors[taken++];
  const dot = kernels.dot;
  const norms = new Float64Array(2);
  /** Largest per-atom norm (as `maxAtomNorm`, on the kernels); the RMS is left in norms[1]. */
  const maxAtomNorm = (v: Float64Array): number => {
    kernels.atomNorms(v, norms);
    return norms[0];
  };
  const rmsOf = (v: Float64Array): number => {
    kernels.atomNorms(v, norms);
    return norms[1];
  };

  let x = take();
  x.set(x0);
  if (projection && !projection.projectPositions(x, x0)) {
    throw new RangeError('x0: the projection could not place the start point on the allowed set');
  }
  let g = take();
  let xT = take();
  let gT = take();
  const d = take();

  let evaluations = 1;
  let f = fn(x, g);
  if (projection) projection.projectGradient(x, g);
  const initialEnergy = f;
  let iterations = 0;

  const finish = (reason: MinimizeReason, converged: boolean): MinimizeResult => ({
    converged,
    reason,
    method,
    iterations,
    evaluations,
    initialEnergy,
    energy: f,
    maxForce: maxAtomNorm(g),
    rmsForce: rmsOf(g),
    x: Float64Array.from(x),
  });

  if (!Number.isFinite(f) || !allFinite(g)) return finish('non-finite', false);
  if (maxAtomNorm(g) <= maxForce) return finish('max-force', true);
  if (rmsForce > 0 && rmsOf(g) <= rmsForce) return finish('rms-force', true);

  // Method state, allocated once.
  const S: Float64Array[] = [];
  const Y: Float64Array[] = [];
  const rho = new Float64Array(lbfgs ? history : 0);
  const alpha = new Float64Array(lbfgs ? history : 0);
  const empty = new Float64Array(0);
  let spareS: Float64Array = empty;
  let spareY: Float64Array = empty;
  if (lbfgs) {
    for (let k = 0; k < history; k++) {
      S.push(take());
      Y.push(take());
    }
    spareS = take();
    spareY = take();
  }
  const products = new Float64Array(2);
  let pairs = 0;
  const H0 = createInitialMatrix(
    lbfgs ? scaling : 'scalar',
    lbfgs ? n : 0,
    diagonalH0 ? { kernels, b: take(), h: take() } : { kernels, b: empty, h: empty },
  );
  // With a preconditioner, H0 is learned from the pairs in whitened form (z = Lᵀ Π x):
  // ĝ = L⁻¹ Π g is kept for the current point and ŷ = L⁻¹ Π y for every stored
  // pair, so that the first loop's result is whitened by axpys (ŷ = ĝ_new − ĝ_old
  // needs no sweep) and each step needs one forward and one backward sweep.
  const H0z = createInitialMatrix('scalar', 0, { kernels, b: empty, h: empty });
  const zY = preconditioner ? take() : empty;
  let gz: Float64Array = preconditioner ? take() : empty;
  let gzT: Float64Array = preconditioner ? take() : empty;
  const YZ: Float64Array[] = [];
  let spareYZ: Float64Array = empty;
  if (preconditioner) {
    for (let k = 0; k < history; k++) YZ.push(take());
    spareYZ = take();
  }
  let sinceRefresh = 0;
  if (preconditioner) {
    if (preconditioner.update(x)) preconditioner.whiten(g, gz);
    else preconditioner = undefined;
  }
  let newest = -1;
  let cgSinceRestart = 0;
  let cgPrevStep = 0;
  let cgPrevSlope = 0;
  let cgHaveDirection = false;
  let sdMove = -1;
  const v = method === 'fire' ? take() : d;
  let dt = dtMax / 10;
  let fireAlpha = 0.1;
  let firePositive = 0;

  /** Steepest-descent initial step: 1/‖g‖, capped by maxStep. */
  const firstStep = (stepMax: number): number => Math.min(1 / Math.sqrt(dot(g, g)), stepMax);

  /** Runs a line search along d; maps the remaining evaluation budget to its trial cap. */
  const search = (initial: number, c2: number): LineSearchResult => {
    const dMax = maxAtomNorm(d);
    const stepMax = maxStep / dMax;
    const budget = maxEvaluations - evaluations;
    return lineSearch(fn, x, f, g, d, Math.min(initial, stepMax), xT, gT, {
      c1: 1e-4,
      c2,
      stepMin: 0,
      stepMax,
      maxTrials: Math.min(20, budget),
      projection,
    }, kernels);
  };

  /** Whether a line-search result may be taken: Wolfe, or finite with lower f. */
  const acceptable = (r: LineSearchResult): boolean =>
    r.ok || (r.evaluations > 0 && r.reason !== 'non-finite' && r.reason !== 'projection-failed' && r.value < f && allFinite(gT));

  /**
   * d = −H g by the two-loop recursion (Nocedal and Wright 2006, Algorithm
   * 7.4), with each update fused with the next inner product so that every
   * pass over the vectors does one axpy and one dot product.
   */
  const lbfgsDirection = (): void => {
    if (pairs === 0) {
      if (preconditioner) {
        // d = −P⁻¹ g: the model's own Newton-like step
        kernels.scaleDot(zY, -1, gz, gz);
        preconditioner.unwhiten(zY, d);
      } else {
        kernels.scaleDot(d, -1, g, g);
      }
      return;
    }
    const oldest = twoLoopFirst(kernels, d, g, S, Y, rho, alpha, newest, pairs, history);
    if (preconditioner) {
      // L⁻¹ Π q with q = −g − Σ αₖ yₖ, from ĝ and the ŷₖ
      kernels.scaleDot(zY, -1, gz, gz);
      let k = newest;
      let j = 0;
      for (; j + 1 < pairs; j += 2) {
        const k2 = (k - 1 + history) % history;
        kernels.axpy2(zY, -alpha[k], YZ[k], -alpha[k2], YZ[k2]);
        k = (k2 - 1 + history) % history;
      }
      if (j < pairs) kernels.axpy(zY, -alpha[k], YZ[k]);
      H0z.apply(zY);
      preconditioner.unwhiten(zY, d);
    } else {
      H0.apply(d);
    }
    twoLoopSecond(kernels, d, S, Y, rho, alpha, oldest, pairs, history);
  };

  /**
   * Teach H0 the pair (s, y) (slot `slot`), in whitened form when
   * preconditioned: γ = sᵀy / ŷᵀŷ (sᵀy is the same in both variables); on
   * molecule-like models the diagonal form learned in z did no better.
   */
  const learn = (s: Float64Array, y: Float64Array, sy: number, yy: number, slot: number): void => {
    if (!preconditioner) H0.update(s, y, sy, yy);
    else H0z.update(s, YZ[slot], sy, dot(YZ[slot], YZ[slot]));
  };

  const storePair = (): void => {
    // Written into the spare pair first, so that a rejected pair never
    // overwrites the oldest stored one.
    const s = spareS;
    const y = spareY;
    kernels.differences(s, y, xT, x, gT, g, products);
    const sy = products[0];
    const yy = products[1];
    const yz = spareYZ;
    if (preconditioner) {
      preconditioner.whiten(gT, gzT);
      kernels.axpyTo(yz, gzT, -1, gz); // ŷ = ĝ_new − ĝ_old
      const t = gz;
      gz = gzT;
      gzT = t;
    }
    if (!(sy > EPS * yy) || !(yy > 0)) return;
    const slot = (newest + 1) % history;
    spareS = S[slot];
    spareY = Y[slot];
    S[slot] = s;
    Y[slot] = y;
    if (preconditioner) {
      spareYZ = YZ[slot];
      YZ[slot] = yz;
    }
    rho[slot] = 1 / sy;
    newest = slot;
    if (pairs < history) pairs++;
    if (pairs === 1) {
      H0.reset();
      H0z.reset();
    }
    learn(s, y, sy, yy, slot);
  };

  type Outcome = 'accepted' | 'failed' | 'non-finite' | 'budget';
  /** f at the point an accepted step leaves in xT. */
  let fNew = f;
  const outcomeOf = (r: LineSearchResult): Outcome => {
    if (r.reason === 'non-finite') return 'non-finite';
    if (acceptable(r)) {
      fNew = r.value;
      return 'accepted';
    }
    if (evaluations >= maxEvaluations) return 'budget';
    return 'failed';
  };

  const stepLbfgs = (): Outcome => {
    if (preconditioner && ++sinceRefresh > refresh) {
      // Rebuild P here; H0 restarts from the newest pair in the new variables.
      // The stored ŷ are whitened again with the new factor (one sweep each).
      sinceRefresh = 1;
      if (!preconditioner.update(x)) preconditioner = undefined;
      else {
        preconditioner.whiten(g, gz);
        for (let j = 0, k = newest; j < pairs; j++, k = (k - 1 + history) % history) preconditioner.whiten(Y[k], YZ[k]);
      }
      H0.reset();
      H0z.reset();
      if (pairs > 0) learn(S[newest], Y[newest], 1 / rho[newest], dot(Y[newest], Y[newest]), newest);
    }
    for (let attempt = 0; attempt < 2; attempt++) {
      lbfgsDirection();
      if (preconditioner && projection) projection.projectGradient(x, d);
      let initial = 1;
      if ((pairs === 0 && !preconditioner) || !(dot(g, d) < 0)) {
        kernels.scaleDot(d, -1, g, g);
        pairs = 0;
        initial = firstStep(Infinity);
      }
      const r = search(initial, 0.9);
      evaluations += r.evaluations;
      const o = outcomeOf(r);
      if (o === 'accepted') {
        storePair();
        return o;
      }
      if (o !== 'failed' || pairs === 0) return o;
      pairs = 0; // retry once along −g with a fresh history
    }
    return 'failed';
  };

  const stepCg = (): Outcome => {
    for (let attempt = 0; attempt < 2; attempt++) {
      let restart = !cgHaveDirection || cgSinceRestart >= n;
      if (!restart) {
        // d holds the previous direction; gT the previous gradient is in the swapped array.
        const num = dot(g, g) - dot(g, gT);
        const beta = Math.max(0, num / dot(gT, gT));
        kernels.combine(d, -1, g, beta);
        if (!(dot(g, d) < 0) || !Number.isFinite(beta)) restart = true;
      }
      let initial: number;
      if (restart) {
        kernels.scaleDot(d, -1, g, g);
        cgSinceRestart = 0;
        initial = cgHaveDirection ? cgPrevStep * (cgPrevSlope / dot(g, d)) : firstStep(Infinity);
      } else {
        initial = cgPrevStep * (cgPrevSlope / dot(g, d));
      }
      if (!(initial > 0) || !Number.isFinite(initial)) initial = firstStep(Infinity);
      const slope = dot(g, d);
      const r = search(initial, 0.1);
      evaluations += r.evaluations;
      const o = outcomeOf(r);
      if (o === 'accepted') {
        cgPrevStep = r.step;
        cgPrevSlope = slope;
        cgHaveDirection = true;
        cgSinceRestart++;
        return o;
      }
      if (o !== 'failed' || restart) return o;
      cgHaveDirection = false; // retry once along −g
    }
    return 'failed';
  };

  const stepSd = (): Outcome => {
    const gMax = maxAtomNorm(g);
    if (sdMove < 0) sdMove = Math.min(maxStep, gMax / Math.sqrt(dot(g, g)));
    const tiny = 1e-15 * (1 + maxAtomNorm(x));
    while (sdMove > tiny) {
      if (evaluations >= maxEvaluations) return 'budget';
      const a = sdMove / gMax;
      kernels.axpyTo(xT, x, -a, g);
      let fT = NaN;
      if (!projection || projection.projectPositions(xT, x)) {
        fT = fn(xT, gT);
        evaluations++;
        if (projection) projection.projectGradient(xT, gT);
        if (!Number.isFinite(fT) || !allFinite(gT)) return 'non-finite';
      }
      if (fT < f) {
        fNew = fT;
        sdMove = Math.min(1.2 * sdMove, maxStep);
        return 'accepted';
      }
      sdMove *= 0.5;
    }
    return 'failed';
  };

  const stepFire = (): Outcome => {
    if (evaluations >= maxEvaluations) return 'budget';
    // Mixing with F = −g (Bitzek et al. 2006).
    const power = -dot(g, v);
    if (power > 0) {
      const vNorm = Math.sqrt(dot(v, v));
      const gNorm = Math.sqrt(dot(g, g));
      const c = gNorm > 0 ? (fireAlpha * vNorm) / gNorm : 0;
      kernels.combine(v, -c, g, 1 - fireAlpha);
      if (firePositive > 5) {
        dt = Math.min(dt * 1.1, dtMax);
        fireAlpha *= 0.99;
      }
      firePositive++;
    } else {
      v.fill(0);
      dt *= 0.5;
      fireAlpha = 0.1;
      firePositive = 0;
    }
    // Semi-implicit Euler with unit masses, the move capped at maxStep per atom.
    kernels.axpy(v, -dt, g);
    if (projection) projection.projectGradient(x, v);
    const vMax = maxAtomNorm(v) * dt;
    const scale = vMax > maxStep ? maxStep / vMax : 1;
    kernels.axpyTo(xT, x, scale * dt, v);
    if (projection && !projection.projectPositions(xT, x)) return 'failed';
    const fT = fn(xT, gT);
    evaluations++;
    if (projection) projection.projectGradient(xT, gT);
    if (!Number.isFinite(fT) || !allFinite(gT)) return 'non-finite';
    fNew = fT;
    return 'accepted';
  };

  const step = method === 'lbfgs' ? stepLbfgs : method === 'cg' ? stepCg : method === 'sd' ? stepSd : stepFire;

  for (;;) {
    if (iterations >= maxIterations) return finish('max-iterations', false);
    if (evaluations >= maxEvaluations) return finish('max-evaluations', false);
    if (signal?.aborted) return finish('aborted', false);
    const outcome = step();
    if (outcome === 'non-finite') return finish('non-finite', false);
    if (outcome === 'budget') return finish('max-evaluations', false);
    if (outcome === 'failed') return finish('line-search-failed', false);
    // Accepted: the new point and gradient are in xT, gT; swap them in.
    const fOld = f;
    let t = x;
    x = xT;
    xT = t;
    t = g;
    g = gT;
    gT = t;
    f = fNew;
    iterations++;
    const mf = maxAtomNorm(g);
    const rf = norms[1];
    const more = onIteration ? onIteration({ iteration: iterations, evaluations, energy: f, maxForce: mf, rmsForce: rf, x }) : undefined;
    if (mf <= maxForce) return finish('max-force', true);
    if (rmsForce > 0 && rf <= rmsForce) return finish('rms-force', true);
    if (energyChange > 0 && Math.abs(f - fOld) <= energyChange) return finish('energy-change', true);
    if (more === false) return finish('stopped', false);
  }
}

/*
 * The hot loops of L-BFGS live in top-level functions rather than in
 * minimize's closures: V8 then optimizes each once, instead of deoptimizing
 * a closure whose code after its loop has not run yet (measured: the
 * pair-storing closure was deoptimized on nearly every call).
 */

/**
 * First loop of the two-loop recursion (Nocedal and Wright 2006, Algorithm
 * 7.4) on d = −g, newest pair first, each update fused with the next inner
 * product so every pass does one axpy and one dot product. Returns the slot
 * of the oldest pair.
 */
function twoLoopFirst(
  kernels: VectorKernels,
  d: Float64Array,
  g: Float64Array,
  S: readonly Float64Array[],
  Y: readonly Float64Array[],
  rho: Float64Array,
  alpha: Float64Array,
  newest: number,
  pairs: number,
  history: number,
): number {
  let k = newest;
  let acc = kernels.scaleDot(d, -1, g, S[k]);
  for (let j = 0; j < pairs; j++) {
    const a = rho[k] * acc;
    alpha[k] = a;
    const y = Y[k];
    if (j === pairs - 1) {
      kernels.axpy(d, -a, y);
      break;
    }
    k = (k - 1 + history) % history;
    acc = kernels.axpyDot(d, -a, y, S[k]);
  }
  return k;
}

/** Second loop of the two-loop recursion, oldest pair first, fused like the first. */
function twoLoopSecond(
  kernels: VectorKernels,
  d: Float64Array,
  S: readonly Float64Array[],
  Y: readonly Float64Array[],
  rho: Float64Array,
  alpha: Float64Array,
  oldest: number,
  pairs: number,
  history: number,
): void {
  let k = oldest;
  let acc = kernels.dot(Y[k], d);
  for (let j = 0; j < pairs; j++) {
    const c = alpha[k] - rho[k] * acc;
    const s = S[k];
    if (j === pairs - 1) {
      kernels.axpy(d, c, s);
      break;
    }
    k = (k + 1) % history;
    acc = kernels.axpyDot(d, c, s, Y[k]);
  }
}

function allFinite(a: Float64Array): boolean {
  for (let i = 0; i < a.length; i++) if (!Number.isFinite(a[i])) return false;
  return true;
}
