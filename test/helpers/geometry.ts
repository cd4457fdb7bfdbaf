/**
 * Geometry builders for the kernel tests: atoms placed from internal
 * coordinates (exact in a fixed frame), random rigid motions (gl-matrix
 * rotations, kept in double precision), and the net force and torque of a
 * gradient. Coordinates are flat `[x0, y0, z0, x1, …]` as everywhere else.
 */
import { mat3, quat, vec3 } from 'gl-matrix';
import type { Random } from './random.js';

/**
 * Three atoms i, j, k with |x_i − x_j| = r1, |x_k − x_j| = r2 and the angle
 * i–j–k = theta (radians): j at the origin, i on +x, k in the xy plane.
 */
export function triangle(r1: number, r2: number, theta: number): Float64Array {
  return new Float64Array([r1, 0, 0, 0, 0, 0, r2 * Math.cos(theta), r2 * Math.sin(theta), 0]);
}

/**
 * Four atoms i, j, k, l with bond lengths |b1| = r1, |b2| = r2, |b3| = r3,
 * bond angles i–j–k = theta1 and j–k–l = theta2, and torsion angle phi
 * (radians, IUPAC sign). j is at the origin and k on +z; i lies in the xz
 * plane on the +x side, l at azimuth phi from +x. Looking along j→k (+z),
 * the rotation +x → +y is clockwise, so phi > 0 is the IUPAC positive sense.
 */
export function chain(
  r1: number,
  r2: number,
  r3: number,
  theta1: number,
  theta2: number,
  phi: number,
): Float64Array {
  const s2 = r3 * Math.sin(theta2);
  return new Float64Array([
    r1 * Math.sin(theta1), 0, r1 * Math.cos(theta1),
    0, 0, 0,
    0, 0, r2,
    s2 * Math.cos(phi), s2 * Math.sin(phi), r2 - r3 * Math.cos(theta2),
  ]);
}

/** A proper rotation (3×3, column-major as in gl-matrix) and a translation. */
export interface RigidMotion {
  readonly rotation: Float64Array;
  readonly translation: Float64Array;
}

/** A random rotation (uniform-ish over orientations) and a translation in [−t, t)³. */
export function randomRigidMotion(rng: Random, t = 5): RigidMotion {
  const q = new Float64Array(4);
  let norm = 0;
  do {
    for (let c = 0; c < 4; c++) q[c] = rng.uniform(-1, 1);
    norm = Math.hypot(q[0], q[1], q[2], q[3]);
  } while (norm > 1 || norm < 0.1);
  quat.normalize(q, q);
  const rotation = mat3.fromQuat(new Float64Array(9), q) as Float64Array;
  const translation = new Float64Array([rng.uniform(-t, t), rng.uniform(-t, t), rng.uniform(-t, t)]);
  return { rotation, translation };
}

/** A rotation by `angle` radians about the unit `axis` (right-handed). */
export function rotationAbout(axis: readonly [number, number, number], angle: number): Float64Array {
  const q = quat.setAxisAngle(new Float64Array(4), axis, angle);
  return mat3.fromQuat(new Float64Array(9), q) as Float64Array;
}

/** A new array: every atom of `x` moved to R x + t. */
export function applyMotion(x: Float64Array, motion: RigidMotion): Float64Array {
  const out = new Float64Array(x.length);
  const p = new Float64Array(3);
  const { rotation, translation } = motion;
  for (let a = 0; a < x.length; a += 3) {
    p[0] = x[a];
    p[1] = x[a + 1];
    p[2] = x[a + 2];
    vec3.transformMat3(p, p, rotation);
    out[a] = p[0] + translation[0];
    out[a + 1] = p[1] + translation[1];
    out[a + 2] = p[2] + translation[2];
  }
  return out;
}

/** A new array: `x` with `v` added to every atom. */
export function translate(x: Float64Array, v: readonly number[]): Float64Array {
  const out = Float64Array.from(x);
  for (let a = 0; a < x.length; a += 3) {
    out[a] += v[0];
    out[a + 1] += v[1];
    out[a + 2] += v[2];
  }
  return out;
}

/** Σ_a g_a, the net force (with the opposite sign). */
export function netForce(g: Float64Array): [number, number, number] {
  let fx = 0;
  let fy = 0;
  let fz = 0;
  for (let a = 0; a < g.length; a += 3) {
    fx += g[a];
    fy += g[a + 1];
    fz += g[a + 2];
  }
  return [fx, fy, fz];
}

/** Σ_a x_a × g_a, the net torque about the origin (with the opposite sign). */
export function netTorque(x: Float64Array, g: Float64Array): [number, number, number] {
  let tx = 0;
  let ty = 0;
  let tz = 0;
  for (let a = 0; a < g.length; a += 3) {
    tx += x[a + 1] * g[a + 2] - x[a + 2] * g[a + 1];
    ty += x[a + 2] * g[a] - x[a] * g[a + 2];
    tz += x[a] * g[a + 1] - x[a + 1] * g[a];
  }
  return [tx, ty, tz];
}

/** Largest absolute entry of an array (0 for an empty one). */
export function maxAbs(values: ArrayLike<number>): number {
  let m = 0;
  for (let n = 0; n < values.length; n++) m = Math.max(m, Math.abs(values[n]));
  return m;
}

/** Degrees to radians. */
export const rad = (degrees: number): number => (degrees * Math.PI) / 180;
/** Radians to degrees. */
export const deg = (radians: number): number => (radians * 180) / Math.PI;
