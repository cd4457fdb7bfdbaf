/**
 * Rigid motions and centring of flat coordinate arrays, off the hot path,
 * built on gl-matrix. Every function writes into a caller's `out` (which may
 * be the input itself) and returns it.
 * @module
 */
import { mat3, quat, vec3 } from 'gl-matrix';

/**
 * Rotate every atom of `x` (flat, 3N) by the unit quaternion `rotation`
 * ([x, y, z, w], gl-matrix layout) about the origin, then translate by
 * `translation`; writes into `out` (may be `x`) and returns it.
 */
export function applyRigidMotion(
  out: Float64Array,
  x: Float64Array,
  rotation: ArrayLike<number>,
  translation: ArrayLike<number> = [0, 0, 0],
): Float64Array {
  // gl-matrix's create() makes Float32Array; pass Float64Array outs to keep full precision.
  const m = mat3.fromQuat(new Float64Array(9) as unknown as mat3, rotation as quat);
  const p = new Float64Array(3) as unknown as vec3;
  for (let a = 0; a < x.length; a += 3) {
    vec3.set(p, x[a], x[a + 1], x[a + 2]);
    vec3.transformMat3(p, p, m);
    out[a] = p[0] + translation[0];
    out[a + 1] = p[1] + translation[1];
    out[a + 2] = p[2] + translation[2];
  }
  return out;
}

/**
 * A unit quaternion for a rotation by `angle` radians about `axis` (any
 * length > 0), in gl-matrix layout [x, y, z, w], as a Float64Array.
 */
export function rotationAbout(axis: ArrayLike<number>, angle: number): Float64Array {
  const q = new Float64Array(4);
  const n = vec3.normalize(new Float64Array(3) as unknown as vec3, axis as vec3);
  quat.setAxisAngle(q as unknown as quat, n, angle);
  return q;
}

/**
 * Mass-weighted centre of `x` (flat, 3N), or the plain centroid when
 * `masses` is left out; writes [cx, cy, cz] into `out` and returns it.
 */
export function centreOf(out: Float64Array, x: Float64Array, masses?: ArrayLike<number>): Float64Array {
  let sx = 0;
  let sy = 0;
  let sz = 0;
  let sw = 0;
  for (let a = 0; 3 * a < x.length; a++) {
    const w = masses === undefined ? 1 : masses[a];
    sx += w * x[3 * a];
    sy += w * x[3 * a + 1];
    sz += w * x[3 * a + 2];
    sw += w;
  }
  out[0] = sw > 0 ? sx / sw : 0;
  out[1] = sw > 0 ? sy / sw : 0;
  out[2] = sw > 0 ? sz / sw : 0;
  return out;
}

/** Shift `x` so that its centre (see {@link centreOf}) is at the origin; writes into `out` (may be `x`). */
export function centre(out: Float64Array, x: Float64Array, masses?: ArrayLike<number>): Float64Array {
  const c = centreOf(new Float64Array(3), x, masses);
  for (let a = 0; a < x.length; a += 3) {
    out[a] = x[a] - c[0];
    out[a + 1] = x[a + 1] - c[1];
    out[a + 2] = x[a + 2] - c[2];
  }
  return out;
}
