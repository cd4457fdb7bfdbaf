/**
 * Hessians of the restraint kinds: flat-bottomed position restraints and
 * flat-bottomed distance restraints.
 *
 * Both energies are ½ k (r − bound)² outside a flat region and 0 inside it;
 * their second derivative jumps at the edge of the flat region (from 0
 * inside to k along the radius outside), so the Hessian is discontinuous
 * there. At a point exactly on an edge the kernels count it as inside (the
 * gradient kernels give a zero gradient there) and return zero blocks,
 * except where the flat region is empty (flat = 0, lower = upper), in which
 * case the energy is a smooth ½ k (r − bound)² and its Hessian is returned.
 * @module
 */
import { PAIR_DISTANCE_RESTRAINT, pairHessians } from './bond.js';
import type { HessianKernel } from './sink.js';

/** One 3×3 block, row-major. */
const block = new Float64Array(9);

/**
 * Position restraint, E = ½ k max(0, r − flat)², d = x_i − x0, r = |d|,
 * u = d / r, params [k, x0, y0, z0, flat]:
 *
 *   ∂²E/∂x_i² = k [(1 − flat/r) I + (flat/r) u uᵀ]   for r > flat,
 *               k I                                  for flat = 0 (every r),
 *               0                                    for r ≤ flat.
 */
export const positionRestraintHessian: HessianKernel = {
  slots: [0],
  accumulate(x, table, sink) {
    const { atoms, params, count } = table;
    for (let t = 0; t < count; t++) {
      const a = atoms[t];
      const i = 3 * a;
      const p = 5 * t;
      const k = params[p];
      const flat = params[p + 4];
      const dx = x[i] - params[p + 1];
      const dy = x[i + 1] - params[p + 2];
      const dz = x[i + 2] - params[p + 3];
      const r2 = dx * dx + dy * dy + dz * dz;
      const r = Math.sqrt(r2);
      let diagonal = 0;
      let w = 0;
      if (flat === 0) {
        diagonal = k;
      } else if (r > flat) {
        diagonal = k * (1 - flat / r);
        w = (k * flat) / (r * r2); // k (flat/r) u uᵀ = k flat d dᵀ / r³
      }
      const xy = w * dx * dy;
      const xz = w * dx * dz;
      const yz = w * dy * dz;
      block[0] = diagonal + w * dx * dx;
      block[1] = xy;
      block[2] = xz;
      block[3] = xy;
      block[4] = diagonal + w * dy * dy;
      block[5] = yz;
      block[6] = xz;
      block[7] = yz;
      block[8] = diagonal + w * dz * dz;
      sink.add(a, a, block, 0, 3);
    }
  },
};

/**
 * Distance restraint, params [k, lower, upper], r = |x_j − x_i|: outside
 * [lower, upper] a harmonic stretch with E'' = k and E'/r = k (r − bound)/r
 * (see `bond.ts`); strictly inside, and on an edge of a non-empty flat
 * region, zero; at r = 0 zero (direction undefined).
 */
export const distanceRestraintHessian: HessianKernel = {
  slots: [0, 1],
  accumulate: (x, table, sink) => pairHessians(x, table, sink, 0, 1, PAIR_DISTANCE_RESTRAINT),
};
