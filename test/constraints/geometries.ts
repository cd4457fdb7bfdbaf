/**
 * Constrained geometries for the projection tests. Every reference geometry
 * satisfies its constraints by construction: each length is measured from
 * the reference coordinates themselves.
 */
import type { DistanceConstraint } from '../../src/constraints/projection.js';
import type { Random } from '../helpers/random.js';

/** A reference geometry with its fixed distances and frozen atoms. */
export interface ConstrainedCase {
  readonly name: string;
  readonly atomCount: number;
  readonly reference: Float64Array;
  readonly distances: DistanceConstraint[];
  readonly frozen: number[];
}

/** |x_j − x_i| for atoms i, j of flat coordinates x. */
export function distance(x: Float64Array, i: number, j: number): number {
  const dx = x[3 * j] - x[3 * i];
  const dy = x[3 * j + 1] - x[3 * i + 1];
  const dz = x[3 * j + 2] - x[3 * i + 2];
  return Math.sqrt(dx * dx + dy * dy + dz * dz);
}

/** Constraints between the given pairs with lengths measured in `x`. */
function measured(x: Float64Array, pairs: readonly (readonly [number, number])[]): DistanceConstraint[] {
  return pairs.map(([i, j]) => ({ i, j, length: distance(x, i, j) }));
}

/** A random open chain of `n` atoms, steps of 1–1.6 in random directions, consecutive atoms constrained. */
export function chain(rng: Random, n: number, frozen: number[] = []): ConstrainedCase {
  const x = new Float64Array(3 * n);
  for (let a = 1; a < n; a++) {
    const u = rng.unitVector();
    const step = rng.uniform(1, 1.6);
    for (let d = 0; d < 3; d++) x[3 * a + d] = x[3 * (a - 1) + d] + step * u[d];
  }
  const pairs = Array.from({ length: n - 1 }, (_, a) => [a, a + 1] as const);
  return { name: `chain of ${n}${frozen.length ? `, frozen ${frozen.join(',')}` : ''}`, atomCount: n, reference: x, distances: measured(x, pairs), frozen };
}

/** A puckered ring of `n` atoms (radius 1.5, heights ±0.25 with random jitter), every ring bond constrained. */
export function ring(rng: Random, n: number, frozen: number[] = []): ConstrainedCase {
  const x = new Float64Array(3 * n);
  for (let a = 0; a < n; a++) {
    const phi = (2 * Math.PI * a) / n;
    x[3 * a] = 1.5 * Math.cos(phi) + rng.uniform(-0.05, 0.05);
    x[3 * a + 1] = 1.5 * Math.sin(phi) + rng.uniform(-0.05, 0.05);
    x[3 * a + 2] = (a % 2 === 0 ? 0.25 : -0.25) + rng.uniform(-0.05, 0.05);
  }
  const pairs = Array.from({ length: n }, (_, a) => [a, (a + 1) % n] as const);
  return { name: `ring of ${n}${frozen.length ? `, frozen ${frozen.join(',')}` : ''}`, atomCount: n, reference: x, distances: measured(x, pairs), frozen };
}

/**
 * A rigid water-like triangle: O–H 0.9572 and H–O–H 104.52° (the values of
 * the spec's water example, test/fixtures/models.ts), all three distances
 * constrained (O–H, O–H, H–H), placed in a random orientation.
 */
export function waterTriangle(rng: Random): ConstrainedCase {
  const r = 0.9572;
  const half = ((104.52 / 2) * Math.PI) / 180;
  const local = [
    [0, 0, 0],
    [r * Math.sin(half), r * Math.cos(half), 0],
    [-r * Math.sin(half), r * Math.cos(half), 0],
  ];
  // Random orientation: rotate the plane's axes onto a random orthonormal frame.
  const e1 = rng.unitVector();
  const t = rng.unitVector();
  const dot = e1[0] * t[0] + e1[1] * t[1] + e1[2] * t[2];
  const v = [t[0] - dot * e1[0], t[1] - dot * e1[1], t[2] - dot * e1[2]];
  const nv = Math.hypot(v[0], v[1], v[2]);
  const e2 = v.map((c) => c / nv);
  const x = new Float64Array(9);
  local.forEach((p, a) => {
    for (let d = 0; d < 3; d++) x[3 * a + d] = 2 + p[0] * e1[d] + p[1] * e2[d];
  });
  return {
    name: 'water-like triangle',
    atomCount: 3,
    reference: x,
    distances: measured(x, [
      [0, 1],
      [0, 2],
      [1, 2],
    ]),
    frozen: [],
  };
}

/**
 * Seven atoms: a chain 0–1–2–3 with atom 0 frozen, a free atom 4 tied to a
 * frozen atom 5, and a free atom 6 with no constraint at all.
 */
export function touchingFrozen(rng: Random): ConstrainedCase {
  const base = chain(rng, 4);
  const x = new Float64Array(21);
  x.set(base.reference);
  const extra = [
    [3, 3, 0],
    [4.2, 3.1, 0.4],
    [-2, 1, 1],
  ];
  extra.forEach((p, e) => x.set(p, 3 * (4 + e)));
  return {
    name: 'constraints touching frozen atoms',
    atomCount: 7,
    reference: x,
    distances: [...base.distances, { i: 4, j: 5, length: distance(x, 4, 5) }],
    frozen: [0, 5],
  };
}

/** `x` plus independent uniform noise in [−amplitude, amplitude) on every coordinate (a fresh array). */
export function perturbed(rng: Random, x: Float64Array, amplitude: number): Float64Array {
  return x.map((v) => v + rng.uniform(-amplitude, amplitude));
}

/** A random vector of length `size`, entries uniform in [−1, 1). */
export function randomVector(rng: Random, size: number): Float64Array {
  return Float64Array.from({ length: size }, () => rng.uniform(-1, 1));
}

/** Euclidean norm. */
export function norm(v: Float64Array): number {
  let s = 0;
  for (const c of v) s += c * c;
  return Math.sqrt(s);
}

/** (g_j − g_i)·r̂_ij at x: the rate of change of |r_ij| along −g, with a minus sign. */
export function alongConstraint(x: Float64Array, g: Float64Array, c: DistanceConstraint): number {
  const r = distance(x, c.i, c.j);
  let s = 0;
  for (let d = 0; d < 3; d++) s += (g[3 * c.j + d] - g[3 * c.i + d]) * ((x[3 * c.j + d] - x[3 * c.i + d]) / r);
  return s;
}

/**
 * Eight atoms near the corners of a cube of edge 1.5 (random jitter ±0.1)
 * with all 28 distances constrained: more constraints than the 18 internal
 * degrees of freedom, so the constraint directions are linearly dependent.
 */
export function rigidCube(rng: Random): ConstrainedCase {
  const x = new Float64Array(24);
  for (let a = 0; a < 8; a++) {
    x[3 * a] = (a & 1) * 1.5 + rng.uniform(-0.1, 0.1);
    x[3 * a + 1] = ((a >> 1) & 1) * 1.5 + rng.uniform(-0.1, 0.1);
    x[3 * a + 2] = ((a >> 2) & 1) * 1.5 + rng.uniform(-0.1, 0.1);
  }
  const pairs: [number, number][] = [];
  for (let i = 0; i < 8; i++) for (let j = i + 1; j < 8; j++) pairs.push([i, j]);
  return { name: 'rigid cube, all 28 distances', atomCount: 8, reference: x, distances: measured(x, pairs), frozen: [] };
}

/**
 * A free centre atom with `arms` atoms around it at distances 1–1.5 in
 * random directions, every arm constrained: all arms share the centre, so
 * every constraint is coupled to every other.
 */
export function star(rng: Random, arms: number): ConstrainedCase {
  const x = new Float64Array(3 * (arms + 1));
  for (let a = 1; a <= arms; a++) {
    const u = rng.unitVector();
    const r = rng.uniform(1, 1.5);
    for (let d = 0; d < 3; d++) x[3 * a + d] = r * u[d];
  }
  const pairs = Array.from({ length: arms }, (_, a) => [0, a + 1] as const);
  return { name: `star of ${arms} arms`, atomCount: arms + 1, reference: x, distances: measured(x, pairs), frozen: [] };
}
