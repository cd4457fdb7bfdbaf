/**
 * Frozen atoms and fixed distances as a {@link Projection} for the
 * minimizers: positions are moved back onto the constraints after a step,
 * and the gradient is projected onto what may move.
 *
 * Positions: an iteration over the constraints one at a time (SHAKE,
 * Ryckaert, Ciccotti & Berendsen, J. Comput. Phys. 23 (1977) 327), each
 * correction along the constraint's bond vector in the reference geometry.
 * Gradient: the components along the constraints removed (the second half
 * of RATTLE, Andersen, J. Comput. Phys. 52 (1983) 24), with the Lagrange
 * multipliers found from the small, sparse linear system they satisfy
 * (directly when it is banded, else by conjugate gradients).
 *
 * Weights: every free atom has weight 1 and every frozen atom weight 0 (a
 * constraint between a frozen and a free atom moves only the free one).
 * Masses are not used: a minimizer needs the projection orthogonal in plain
 * coordinates, so that the projected gradient itself, not a mass-weighted
 * version of it, points along the allowed set; masses would matter only
 * for dynamics.
 * @module
 */
import { ModelError } from '../errors.js';
import type { Projection } from '../optimize/types.js';

/** A fixed distance |x_j − x_i| = length between atoms `i` and `j`. */
export interface DistanceConstraint {
  /** First atom (0-based index). */
  readonly i: number;
  /** Second atom (0-based index, not `i`). */
  readonly j: number;
  /** The distance to hold, in the coordinates' length unit (> 0). */
  readonly length: number;
}

/** Options of {@link createProjection}. */
export interface ProjectionOptions {
  /** Number of atoms N; coordinate and gradient arrays have length 3N. */
  readonly atomCount: number;
  /** Atoms that never move (0-based, distinct). */
  readonly frozen?: ArrayLike<number>;
  /** Fixed distances; no pair twice, never between two frozen atoms. */
  readonly distances?: readonly DistanceConstraint[];
  /** A distance holds when |r − length| ≤ tolerance · length. Default 1e-10. */
  readonly tolerance?: number;
  /** Most sweeps over the constraints in {@link Projection.projectPositions}. Default 500. */
  readonly maxIterations?: number;
  /**
   * Start coordinates (flat, length 3N; not modified). When given, a copy is
   * projected once and a {@link ModelError} thrown if that fails, so that a
   * set of constraints that cannot all hold is refused before any
   * minimization starts.
   */
  readonly start?: Float64Array;
  /** How lengths are labelled in error messages, e.g. `Å`. Default `length units`. */
  readonly lengthUnit?: string;
}

/** The constraint furthest from its length, as found by {@link ConstraintProjection.largestViolation}. */
export interface ConstraintViolation {
  /** Index in `distances` (−1 when there are no constraints). */
  readonly constraint: number;
  /** |r − length|, in the coordinates' length unit (0 when there are no constraints). */
  readonly violation: number;
  /** |r − length| / length. */
  readonly relative: number;
}

/** A {@link Projection} with a few read-outs for checks and reports. */
export interface ConstraintProjection extends Projection {
  /** Number of atoms N. */
  readonly atomCount: number;
  /** The frozen atoms, sorted and distinct. */
  readonly frozen: Int32Array;
  /** Number of fixed distances. */
  readonly constraintCount: number;
  /** The relative tolerance of a fixed distance. */
  readonly tolerance: number;
  /** Whether every fixed distance holds at `x` within the tolerance (frozen atoms are not checked). Never allocates. */
  satisfied(x: Float64Array): boolean;
  /** The fixed distance with the largest |r − length| at `x` (first on ties). Allocates the small result. */
  largestViolation(x: Float64Array): ConstraintViolation;
}

/** Default relative tolerance of a fixed distance (the spec's 1e-10). */
export const DEFAULT_CONSTRAINT_TOLERANCE = 1e-10;
/** Default cap on sweeps over the constraints when projecting positions. */
export const DEFAULT_MAX_ITERATIONS = 500;
/**
 * A correction is refused (projectPositions returns false) when the current
 * bond vector d and the reference one s have d·s ≤ this · length²: the bond
 * has turned nearly perpendicular to, or away from, its reference direction.
 */
export const DENOMINATOR_FLOOR = 1e-6;
/** Largest |c − d| over coupled constraints (after renumbering) for which projectGradient factors the system directly. */
export const BAND_LIMIT = 24;
/** A pivot of the direct factorization below this · its diagonal counts as singular (conjugate gradients are used instead). */
export const PIVOT_FLOOR = 1e-10;
/**
 * projectGradient iterates until every entry of Mᵀg is at most this · |g|
 * (Euclidean norm of the gradient after zeroing frozen atoms); entry c of
 * Mᵀg is (g_j − g_i)·r̂_ij of constraint c, frozen ends left out.
 */
export const GRADIENT_TOLERANCE = 1e-14;

/**
 * Build the projection for frozen atoms and fixed distances.
 *
 * `projectPositions(x, reference)` copies frozen coordinates from
 * `reference` bit-for-bit, then sweeps over the constraints, correcting each
 * violated one along its bond vector in `reference` (unit weights, frozen
 * atoms weight 0), until a whole sweep finds every distance within
 * `tolerance · length`; it returns false (x then holds the last iterate)
 * after `maxIterations` sweeps, on a vanishing denominator (see
 * {@link DENOMINATOR_FLOOR}), or on a non-finite coordinate. An `x` that
 * already satisfies everything is left bit-for-bit unchanged. `x` may be
 * `reference` itself (the directions then follow the current bonds): that
 * is how to put start coordinates onto the constraints before a
 * minimization, `projection.projectPositions(x, x)`.
 *
 * `projectGradient(x, g)` sets frozen components of `g` to 0 and removes
 * the components along the constraints at `x`, so that afterwards
 * (g_j − g_i)·r̂_ij = 0 for every constraint: the orthogonal projection onto
 * what may move. The multipliers solve a K×K system (K constraints) that
 * couples constraints sharing a free atom: solved directly by a banded
 * Cholesky factorization when, with the constraints renumbered to bring
 * coupled ones together (reverse Cuthill–McKee), coupled constraints are at
 * most {@link BAND_LIMIT} apart (chains, rings, trees, rigid groups of a
 * few atoms) and the system is not singular, then refined, or else
 * solved, by conjugate gradients until every |(g_j − g_i)·r̂_ij| ≤
 * {@link GRADIENT_TOLERANCE}·|g| (capped at 2K + 20 steps). A constraint
 * whose atoms coincide at `x` has no direction and is skipped.
 *
 * Neither method allocates; both take arrays of length 3N (not checked).
 *
 * @throws RangeError for options out of range (atom indices, a constraint
 *   of an atom with itself, a pair constrained twice, both atoms frozen,
 *   a length ≤ 0, a tolerance or cap out of range, `start` of the wrong length).
 * @throws {@link ModelError} with place `constraints` when `start` is given
 *   and cannot be projected, e.g. `constraints: cannot all be satisfied from
 *   the given coordinates (largest violation 3 Å in constraints[1])`; the
 *   violation named is the largest |r − length| at the start coordinates.
 */
export function createProjection(options: ProjectionOptions): ConstraintProjection {
  const n = options.atomCount;
  if (!Number.isInteger(n) || n < 0) throw new RangeError(`atomCount: expected a non-negative integer, got ${n}`);
  const tolerance = options.tolerance ?? DEFAULT_CONSTRAINT_TOLERANCE;
  if (!(tolerance > 0 && tolerance < 1)) throw new RangeError(`tolerance: expected a number in (0, 1), got ${tolerance}`);
  const maxIterations = options.maxIterations ?? DEFAULT_MAX_ITERATIONS;
  if (!Number.isInteger(maxIterations) || maxIterations < 1) {
    throw new RangeError(`maxIterations: expected a positive integer, got ${maxIterations}`);
  }

  // Frozen atoms: a sorted list and a per-atom weight (0 frozen, 1 free).
  const weight = new Float64Array(n).fill(1);
  const frozenList = Array.from(options.frozen ?? [], Number);
  frozenList.forEach((a, f) => {
    if (!Number.isInteger(a) || a < 0 || a >= n) {
      throw new RangeError(`frozen[${f}]: index ${a} is out of range (${n} atoms)`);
    }
    if (weight[a] === 0) throw new RangeError(`frozen[${f}]: atom ${a} is listed twice`);
    weight[a] = 0;
  });
  const frozen = Int32Array.from(frozenList.sort((a, b) => a - b));

  // Constraints as flat tables, first in the order given.
  const distances = options.distances ?? [];
  const k = distances.length;
  const listI = new Int32Array(k);
  const listJ = new Int32Array(k);
  const seen = new Map<string, number>();
  distances.forEach((c, index) => {
    const place = `distances[${index}]`;
    for (const a of [c.i, c.j]) {
      if (!Number.isInteger(a) || a < 0 || a >= n) throw new RangeError(`${place}: index ${a} is out of range (${n} atoms)`);
    }
    if (c.i === c.j) throw new RangeError(`${place}: atom ${c.i} is constrained to itself`);
    if (!(c.length > 0 && Number.isFinite(c.length))) {
      throw new RangeError(`${place}: expected a length > 0, got ${c.length}`);
    }
    const key = c.i < c.j ? `${c.i}-${c.j}` : `${c.j}-${c.i}`;
    const first = seen.get(key);
    if (first !== undefined) throw new RangeError(`${place}: pair ${c.i}-${c.j} is constrained twice (first at distances[${first}])`);
    seen.set(key, index);
    if (weight[c.i] === 0 && weight[c.j] === 0) {
      throw new RangeError(`${place}: atoms ${c.i} and ${c.j} are both frozen; a constraint between two frozen atoms is not allowed`);
    }
    listI[index] = c.i;
    listJ[index] = c.j;
  });

  // Then renumbered so that constraints sharing a free atom are close
  // (see bandOrder): constraint c here is distances[order[c]], and
  // distances[o] is constraint position[o].
  const order = bandOrder(listI, listJ, weight);
  const position = new Int32Array(k);
  const ci = new Int32Array(k);
  const cj = new Int32Array(k);
  const length = new Float64Array(k);
  for (let c = 0; c < k; c++) {
    const o = order[c];
    position[o] = c;
    ci[c] = listI[o];
    cj[c] = listJ[o];
    length[c] = distances[o].length;
  }

  // Work arrays for projectGradient (preallocated: no allocation per call).
  const direction = new Float64Array(3 * k); // r̂_c at x (zero when undefined)
  const residual = new Float64Array(k);
  const search = new Float64Array(k);
  const product = new Float64Array(k);
  const spread = new Float64Array(3 * n); // M·p
  const maxCgSteps = 2 * k + 20;

  // The matrix A = MᵀM of the multipliers couples constraints c and d that
  // share a free atom. When every such pair is close in the order (|c − d| ≤
  // BAND_LIMIT), A is banded and is factored directly (Cholesky, A = L Lᵀ).
  const pairC: number[] = [];
  const pairD: number[] = [];
  const pairSign: number[] = [];
  {
    const touching: number[][] = Array.from({ length: n }, () => []);
    for (let c = 0; c < k; c++) {
      for (const a of [ci[c], cj[c]]) {
        if (weight[a] === 0) continue;
        for (const d of touching[a]) {
          pairC.push(c);
          pairD.push(d);
          // m_c has −r̂ on atom i and +r̂ on atom j.
          pairSign.push((a === cj[c] ? 1 : -1) * (a === cj[d] ? 1 : -1));
        }
        touching[a].push(c);
      }
    }
  }
  let bandwidth = 0;
  for (let p = 0; p < pairC.length; p++) bandwidth = Math.max(bandwidth, pairC[p] - pairD[p]);
  const banded = k > 0 && bandwidth <= BAND_LIMIT;
  const width = bandwidth + 1;
  const band = new Float64Array(banded ? k * width : 0); // band[c·width + (c − d)] = L_cd, d ≤ c
  const pc = Int32Array.from(pairC);
  const pd = Int32Array.from(pairD);
  const ps = Float64Array.from(pairSign);

  /** Factor A at the current directions into {@link band}; false when A is (nearly) singular. */
  const factor = (): boolean => {
    band.fill(0);
    for (let c = 0; c < k; c++) band[c * width] = weight[ci[c]] + weight[cj[c]];
    for (let p = 0; p < pc.length; p++) {
      const c = pc[p];
      const d = pd[p];
      const u = 3 * c;
      const v = 3 * d;
      band[c * width + (c - d)] +=
        ps[p] * (direction[u] * direction[v] + direction[u + 1] * direction[v + 1] + direction[u + 2] * direction[v + 2]);
    }
    for (let c = 0; c < k; c++) {
      const first = Math.max(0, c - bandwidth);
      for (let d = first; d <= c; d++) {
        let sum = band[c * width + (c - d)];
        for (let e = Math.max(first, d - bandwidth); e < d; e++) sum -= band[c * width + (c - e)] * band[d * width + (d - e)];
        if (d < c) {
          band[c * width + (c - d)] = sum / band[d * width];
        } else {
          if (!(sum > PIVOT_FLOOR * (weight[ci[c]] + weight[cj[c]]))) return false;
          band[c * width] = Math.sqrt(sum);
        }
      }
    }
    return true;
  };

  /** rhs ← A⁻¹ rhs with the factor in {@link band}. */
  const solve = (rhs: Float64Array): void => {
    for (let c = 0; c < k; c++) {
      let sum = rhs[c];
      for (let e = Math.max(0, c - bandwidth); e < c; e++) sum -= band[c * width + (c - e)] * rhs[e];
      rhs[c] = sum / band[c * width];
    }
    for (let c = k - 1; c >= 0; c--) {
      let sum = rhs[c];
      for (let e = c + 1; e <= Math.min(k - 1, c + bandwidth); e++) sum -= band[e * width + (e - c)] * rhs[e];
      rhs[c] = sum / band[c * width];
    }
  };

  /** |r − length| of constraint c at x (NaN for non-finite coordinates). */
  const distanceError = (x: Float64Array, c: number): number => {
    const a = 3 * ci[c];
    const b = 3 * cj[c];
    const dx = x[b] - x[a];
    const dy = x[b + 1] - x[a + 1];
    const dz = x[b + 2] - x[a + 2];
    return Math.abs(Math.sqrt(dx * dx + dy * dy + dz * dz) - length[c]);
  };

  const projectPositions = (x: Float64Array, reference: Float64Array): boolean => {
    for (let f = 0; f < frozen.length; f++) {
      const a = 3 * frozen[f];
      x[a] = reference[a];
      x[a + 1] = reference[a + 1];
      x[a + 2] = reference[a + 2];
    }
    for (let sweep = 0; sweep < maxIterations; sweep++) {
      let corrected = false;
      for (let c = 0; c < k; c++) {
        const a = 3 * ci[c];
        const b = 3 * cj[c];
        const dx = x[b] - x[a];
        const dy = x[b + 1] - x[a + 1];
        const dz = x[b + 2] - x[a + 2];
        const r2 = dx * dx + dy * dy + dz * dz;
        const l = length[c];
        if (Math.abs(Math.sqrt(r2) - l) <= tolerance * l) continue;
        const sx = reference[b] - reference[a];
        const sy = reference[b + 1] - reference[a + 1];
        const sz = reference[b + 2] - reference[a + 2];
        const ds = dx * sx + dy * sy + dz * sz;
        const wa = weight[ci[c]];
        const wb = weight[cj[c]];
        // Also false for NaN: a non-finite coordinate ends the projection.
        if (!(ds > DENOMINATOR_FLOOR * l * l)) return false;
        // New d = d + (wa + wb)·g·s with g chosen so that |d|² = l² to first order.
        const g = (l * l - r2) / (2 * ds * (wa + wb));
        x[a] -= wa * g * sx;
        x[a + 1] -= wa * g * sy;
        x[a + 2] -= wa * g * sz;
        x[b] += wb * g * sx;
        x[b + 1] += wb * g * sy;
        x[b + 2] += wb * g * sz;
        corrected = true;
      }
      if (!corrected) return true;
    }
    return false;
  };

  /** out ← Mᵀ·v for the masked directions M (one entry per constraint). */
  const gather = (v: Float64Array, out: Float64Array): void => {
    for (let c = 0; c < k; c++) {
      const a = 3 * ci[c];
      const b = 3 * cj[c];
      const u = 3 * c;
      const wa = weight[ci[c]];
      const wb = weight[cj[c]];
      out[c] =
        wb * (direction[u] * v[b] + direction[u + 1] * v[b + 1] + direction[u + 2] * v[b + 2]) -
        wa * (direction[u] * v[a] + direction[u + 1] * v[a + 1] + direction[u + 2] * v[a + 2]);
    }
  };

  /** v ← v + scale · M·p. */
  const scatter = (p: Float64Array, scale: number, v: Float64Array): void => {
    for (let c = 0; c < k; c++) {
      const a = 3 * ci[c];
      const b = 3 * cj[c];
      const u = 3 * c;
      const s = scale * p[c];
      const wa = weight[ci[c]] * s;
      const wb = weight[cj[c]] * s;
      v[a] -= wa * direction[u];
      v[a + 1] -= wa * direction[u + 1];
      v[a + 2] -= wa * direction[u + 2];
      v[b] += wb * direction[u];
      v[b + 1] += wb * direction[u + 1];
      v[b + 2] += wb * direction[u + 2];
    }
  };

  const squaredNorm = (v: Float64Array): number => {
    let s = 0;
    for (let m = 0; m < v.length; m++) s += v[m] * v[m];
    return s;
  };

  const largestEntry = (v: Float64Array): number => {
    let m = 0;
    for (let c = 0; c < v.length; c++) m = Math.max(m, Math.abs(v[c]));
    return m;
  };

  const projectGradient = (x: Float64Array, g: Float64Array): void => {
    for (let f = 0; f < frozen.length; f++) {
      const a = 3 * frozen[f];
      g[a] = 0;
      g[a + 1] = 0;
      g[a + 2] = 0;
    }
    if (k === 0) return;
    for (let c = 0; c < k; c++) {
      const a = 3 * ci[c];
      const b = 3 * cj[c];
      const dx = x[b] - x[a];
      const dy = x[b + 1] - x[a + 1];
      const dz = x[b + 2] - x[a + 2];
      const r = Math.sqrt(dx * dx + dy * dy + dz * dz);
      const usable = r > 0 && r < Infinity;
      const inv = usable ? 1 / r : 0;
      direction[3 * c] = usable ? dx * inv : 0;
      direction[3 * c + 1] = usable ? dy * inv : 0;
      direction[3 * c + 2] = usable ? dz * inv : 0;
    }
    const floor = GRADIENT_TOLERANCE * Math.sqrt(squaredNorm(g));
    // Direct solve of (MᵀM) λ = Mᵀg when A is banded and not singular; g ← g − M λ.
    if (banded && factor()) {
      gather(g, search);
      solve(search);
      scatter(search, -1, g);
    }
    // Conjugate gradients on the same system (a refinement after the direct
    // solve, which usually stops at once; the whole solve otherwise), applying
    // each step to g directly (g ← g − α M p), so that the residual Mᵀg is the
    // quantity driven to zero; it is recomputed from g every step.
    gather(g, residual);
    let rr = squaredNorm(residual);
    if (!(largestEntry(residual) > floor)) return;
    search.set(residual);
    for (let step = 0; step < maxCgSteps; step++) {
      spread.fill(0);
      scatter(search, 1, spread);
      gather(spread, product);
      let pAp = 0;
      for (let c = 0; c < k; c++) pAp += search[c] * product[c];
      if (!(pAp > 0)) return;
      const alpha = rr / pAp;
      scatter(search, -alpha, g);
      gather(g, residual);
      if (!(largestEntry(residual) > floor)) return;
      const next = squaredNorm(residual);
      const beta = next / rr;
      rr = next;
      for (let c = 0; c < k; c++) search[c] = residual[c] + beta * search[c];
    }
  };

  const satisfied = (x: Float64Array): boolean => {
    for (let c = 0; c < k; c++) {
      if (!(distanceError(x, c) <= tolerance * length[c])) return false;
    }
    return true;
  };

  const largestViolation = (x: Float64Array): ConstraintViolation => {
    let worst = -1;
    let violation = 0;
    for (let o = 0; o < k; o++) {
      const e = distanceError(x, position[o]);
      const v = Number.isNaN(e) ? Infinity : e;
      if (worst < 0 || v > violation) {
        worst = o;
        violation = v;
      }
    }
    return { constraint: worst, violation, relative: worst < 0 ? 0 : violation / distances[worst].length };
  };

  const projection: ConstraintProjection = {
    atomCount: n,
    frozen,
    constraintCount: k,
    tolerance,
    projectPositions,
    projectGradient,
    satisfied,
    largestViolation,
  };

  const start = options.start;
  if (start !== undefined) {
    if (start.length !== 3 * n) throw new RangeError(`start: expected 3N = ${3 * n} numbers, got ${start.length}`);
    const work = start.slice();
    if (!projectPositions(work, start)) {
      const worst = largestViolation(start);
      const unit = options.lengthUnit ?? 'length units';
      throw new ModelError(
        'constraints',
        `cannot all be satisfied from the given coordinates (largest violation ${formatLength(worst.violation)} ${unit} in constraints[${worst.constraint}])`,
      );
    }
  }
  return projection;
}

/**
 * An order of the constraints in which those sharing a free atom are close,
 * so that the system of projectGradient has a narrow band: reverse
 * Cuthill–McKee (breadth-first from a constraint of fewest neighbours,
 * neighbours by fewest neighbours, then reversed). Returns order[c] = the
 * index in the given list of constraint c. A chain or ring gets a band of
 * width at most 2.
 */
function bandOrder(listI: Int32Array, listJ: Int32Array, weight: Float64Array): Int32Array {
  const k = listI.length;
  const touching: number[][] = Array.from({ length: weight.length }, () => []);
  for (let c = 0; c < k; c++) {
    for (const a of [listI[c], listJ[c]]) if (weight[a] !== 0) touching[a].push(c);
  }
  const neighbours: number[][] = Array.from({ length: k }, () => []);
  for (const group of touching) {
    for (const c of group) for (const d of group) if (c !== d && !neighbours[c].includes(d)) neighbours[c].push(d);
  }
  const byDegree = (c: number, d: number): number => neighbours[c].length - neighbours[d].length || c - d;
  for (const list of neighbours) list.sort(byDegree);
  const starts = Array.from({ length: k }, (_, c) => c).sort(byDegree);
  const visited = new Uint8Array(k);
  const result: number[] = [];
  let next = 0;
  while (result.length < k) {
    while (visited[starts[next]]) next++;
    let head = result.length;
    result.push(starts[next]);
    visited[starts[next]] = 1;
    while (head < result.length) {
      for (const d of neighbours[result[head]]) {
        if (!visited[d]) {
          visited[d] = 1;
          result.push(d);
        }
      }
      head++;
    }
  }
  return Int32Array.from(result.reverse());
}

/** A length for a message: three significant digits, no trailing zeros. */
function formatLength(value: number): string {
  return String(Number(value.toPrecision(3)));
}
