/**
 * Three-atom bend kernels: harmonic angle and cosine angle. The vertex is the
 * middle atom j; u = x_i − x_j, v = x_k − x_j.
 *
 * θ is computed as atan2(|u × v|, u · v), which is accurate at every angle
 * (acos loses half the digits near 0° and 180°). Its gradient is written
 * without any 1/sin θ factor:
 *
 *   dθ/dx_i = −(c × u) / (|c| |u|²),  dθ/dx_k = (c × v) / (|c| |v|²),
 *   dθ/dx_j = −(dθ/dx_i + dθ/dx_k),   c = u × v,
 *
 * whose magnitude is 1/|u| (resp. 1/|v|) at every angle, so only the
 * direction c/|c| becomes undefined, and only at exactly 0° or 180°, where
 * the gradient is taken as zero (a harmonic angle with θ0 = 180° has its
 * minimum there, so zero is also the true value in the common case).
 * @module
 */
import type { TermTable } from './table.js';

/**
 * Harmonic angle, E = ½ k (θ − θ0)², params [k, theta0 (radians)].
 * dE/dθ = k (θ − θ0). See {@link Kernel} for the arguments.
 */
export function accumulateHarmonicAngles(
  x: Float64Array,
  table: TermTable,
  gradient?: Float64Array,
  energies?: Float64Array,
): number {
  const { atoms, params, count } = table;
  let total = 0;
  for (let t = 0; t < count; t++) {
    const i = 3 * atoms[3 * t];
    const j = 3 * atoms[3 * t + 1];
    const k3 = 3 * atoms[3 * t + 2];
    const kf = params[2 * t];
    const theta0 = params[2 * t + 1];
    const ux = x[i] - x[j];
    const uy = x[i + 1] - x[j + 1];
    const uz = x[i + 2] - x[j + 2];
    const vx = x[k3] - x[j];
    const vy = x[k3 + 1] - x[j + 1];
    const vz = x[k3 + 2] - x[j + 2];
    // c = u × v
    const cx = uy * vz - uz * vy;
    const cy = uz * vx - ux * vz;
    const cz = ux * vy - uy * vx;
    const cn = Math.sqrt(cx * cx + cy * cy + cz * cz);
    const theta = Math.atan2(cn, ux * vx + uy * vy + uz * vz);
    const d = theta - theta0;
    const e = 0.5 * kf * d * d;
    total += e;
    if (energies !== undefined) energies[t] = e;
    if (gradient !== undefined && cn > 0) {
      const dEdTheta = kf * d;
      const u2 = ux * ux + uy * uy + uz * uz;
      const v2 = vx * vx + vy * vy + vz * vz;
      const fi = -dEdTheta / (cn * u2);
      const fk = dEdTheta / (cn * v2);
      // c × u and c × v
      const gix = fi * (cy * uz - cz * uy);
      const giy = fi * (cz * ux - cx * uz);
      const giz = fi * (cx * uy - cy * ux);
      const gkx = fk * (cy * vz - cz * vy);
      const gky = fk * (cz * vx - cx * vz);
      const gkz = fk * (cx * vy - cy * vx);
      gradient[i] += gix;
      gradient[i + 1] += giy;
      gradient[i + 2] += giz;
      gradient[k3] += gkx;
      gradient[k3 + 1] += gky;
      gradient[k3 + 2] += gkz;
      gradient[j] -= gix + gkx;
      gradient[j + 1] -= giy + gky;
      gradient[j + 2] -= giz + gkz;
    }
  }
  return total;
}

/**
 * Cosine angle, E = ½ k (cos θ − cos θ0)², params [k, cosTheta0].
 * With cos θ = u·v / (|u| |v|):
 *   d cos θ/dx_i = v / (|u| |v|) − cos θ · u / |u|²,
 *   d cos θ/dx_k = u / (|u| |v|) − cos θ · v / |v|²,
 * which is smooth through 0° and 180° (it vanishes there). Coincident atoms
 * (|u| or |v| zero) count as cos θ = 1 with a zero gradient.
 */
export function accumulateCosineAngles(
  x: Float64Array,
  table: TermTable,
  gradient?: Float64Array,
  energies?: Float64Array,
): number {
  const { atoms, params, count } = table;
  let total = 0;
  for (let t = 0; t < count; t++) {
    const i = 3 * atoms[3 * t];
    const j = 3 * atoms[3 * t + 1];
    const k3 = 3 * atoms[3 * t + 2];
    const kf = params[2 * t];
    const cos0 = params[2 * t + 1];
    const ux = x[i] - x[j];
    const uy = x[i + 1] - x[j + 1];
    const uz = x[i + 2] - x[j + 2];
    const vx = x[k3] - x[j];
    const vy = x[k3 + 1] - x[j + 1];
    const vz = x[k3 + 2] - x[j + 2];
    const u2 = ux * ux + uy * uy + uz * uz;
    const v2 = vx * vx + vy * vy + vz * vz;
    const uv = Math.sqrt(u2 * v2);
    let c = uv > 0 ? (ux * vx + uy * vy + uz * vz) / uv : 1;
    if (c > 1) c = 1;
    else if (c < -1) c = -1;
    const d = c - cos0;
    const e = 0.5 * kf * d * d;
    total += e;
    if (energies !== undefined) energies[t] = e;
    if (gradient !== undefined && uv > 0) {
      const f = kf * d;
      const a = f / uv;
      const bi = (f * c) / u2;
      const bk = (f * c) / v2;
      const gix = a * vx - bi * ux;
      const giy = a * vy - bi * uy;
      const giz = a * vz - bi * uz;
      const gkx = a * ux - bk * vx;
      const gky = a * uy - bk * vy;
      const gkz = a * uz - bk * vz;
      gradient[i] += gix;
      gradient[i + 1] += giy;
      gradient[i + 2] += giz;
      gradient[k3] += gkx;
      gradient[k3 + 1] += gky;
      gradient[k3 + 2] += gkz;
      gradient[j] -= gix + gkx;
      gradient[j + 1] -= giy + gky;
      gradient[j + 2] -= giz + gkz;
    }
  }
  return total;
}
