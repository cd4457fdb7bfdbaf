/**
 * Inversion (out-of-plane) kernel for a centre with three neighbours, after
 * the form of Rappé et al. (J. Am. Chem. Soc. 114 (1992) 10024).
 *
 * A term's atoms are [I, A, B, C]: the centre I first, then its three
 * neighbours. For one choice of the out-of-plane neighbour L, with the other
 * two J, K, ω is the angle between the bond I–L and the plane I J K
 * (0 when L lies in the plane). With a = x_J − x_I, b = x_K − x_I,
 * d = x_L − x_I, n = a × b and q = n × d:
 *
 *   ω = atan2(n · d, |q|)            in [−π/2, π/2], accurate at every angle
 *   dω/dx_L = (d × q) / (|d|² |q|)   (size 1/|d|)
 *   dω/dn   = (q × n) / (|n|² |q|)   (size 1/|n|)
 *   dω/dx_J = b × dω/dn,  dω/dx_K = dω/dn × a,  dω/dx_I = −(the other three)
 *
 * (no 1/cos ω). The term's energy is the mean over the three choices
 * (L = C, A, B in turn):
 *
 *   E = ⅓ Σ [c0 + c1 cos ω + c2 cos 2ω],  dE/dω = −⅓ sin ω (c1 + 4 c2 cos ω)
 *
 * so that when all three ω are equal, E = c0 + c1 cos ω + c2 cos 2ω: the
 * coefficients are the whole centre's. cos ω is the absolute value of a
 * smooth function near ω = ±90° (the bond I–L along the plane's normal),
 * where a non-zero c1 makes a cone-shaped point; there the direction of dω/dx
 * is undefined and that choice's gradient is taken as zero, as it is where
 * the plane is undefined (I, J, K collinear to rounding: |n|² below 1e-30 of
 * |a|² |b|²) or L sits on I (energy then that of ω = 0).
 * @module
 */
import type { TermTable } from './table.js';

/** Squared sine of the angle J–I–K below which the plane counts as undefined. */
const COLLINEAR_SIN2 = 1e-30;
const THIRD = 1 / 3;

/**
 * Inversion, E = ⅓ Σ_{three choices} [c0 + c1 cos ω + c2 cos 2ω], params
 * [c0, c1, c2] (energies), atoms [centre, a, b, c]. See the module comment
 * for ω and its gradient, and {@link Kernel} for the arguments.
 */
export function accumulateInversions(
  x: Float64Array,
  table: TermTable,
  gradient?: Float64Array,
  energies?: Float64Array,
): number {
  const { atoms, params, count } = table;
  let total = 0;
  for (let t = 0; t < count; t++) {
    const centre = 3 * atoms[4 * t];
    const c0 = params[3 * t];
    const c1 = params[3 * t + 1];
    const c2 = params[3 * t + 2];
    let e = 0;
    for (let choice = 0; choice < 3; choice++) {
      // (J, K, L) = (A, B, C), (B, C, A), (C, A, B)
      const jj = 3 * atoms[4 * t + 1 + choice];
      const kk = 3 * atoms[4 * t + 1 + ((choice + 1) % 3)];
      const ll = 3 * atoms[4 * t + 1 + ((choice + 2) % 3)];
      const ax = x[jj] - x[centre];
      const ay = x[jj + 1] - x[centre + 1];
      const az = x[jj + 2] - x[centre + 2];
      const bx = x[kk] - x[centre];
      const by = x[kk + 1] - x[centre + 1];
      const bz = x[kk + 2] - x[centre + 2];
      const dx = x[ll] - x[centre];
      const dy = x[ll + 1] - x[centre + 1];
      const dz = x[ll + 2] - x[centre + 2];
      // n = a × b, q = n × d
      const nx = ay * bz - az * by;
      const ny = az * bx - ax * bz;
      const nz = ax * by - ay * bx;
      const qx = ny * dz - nz * dy;
      const qy = nz * dx - nx * dz;
      const qz = nx * dy - ny * dx;
      const n2 = nx * nx + ny * ny + nz * nz;
      const d2 = dx * dx + dy * dy + dz * dz;
      const a2 = ax * ax + ay * ay + az * az;
      const b2 = bx * bx + by * by + bz * bz;
      const defined = n2 > COLLINEAR_SIN2 * a2 * b2 && d2 > 0;
      const sinTerm = defined ? nx * dx + ny * dy + nz * dz : 0;
      const q = Math.sqrt(qx * qx + qy * qy + qz * qz);
      const hyp = Math.sqrt(n2 * d2);
      const cosw = defined && hyp > 0 ? q / hyp : 1;
      const sinw = defined && hyp > 0 ? sinTerm / hyp : 0;
      e += THIRD * (c0 + c1 * cosw + c2 * (2 * cosw * cosw - 1));
      if (gradient === undefined || !defined || !(q > 0)) continue;
      const f = -THIRD * sinw * (c1 + 4 * c2 * cosw); // dE/dω
      // dE/dx_L = f (d × q) / (|d|² |q|)
      const fl = f / (d2 * q);
      const glx = fl * (dy * qz - dz * qy);
      const gly = fl * (dz * qx - dx * qz);
      const glz = fl * (dx * qy - dy * qx);
      // dE/dn = f (q × n) / (|n|² |q|)
      const fn = f / (n2 * q);
      const gnx = fn * (qy * nz - qz * ny);
      const gny = fn * (qz * nx - qx * nz);
      const gnz = fn * (qx * ny - qy * nx);
      // dE/dx_J = b × dE/dn, dE/dx_K = dE/dn × a
      const gjx = by * gnz - bz * gny;
      const gjy = bz * gnx - bx * gnz;
      const gjz = bx * gny - by * gnx;
      const gkx = gny * az - gnz * ay;
      const gky = gnz * ax - gnx * az;
      const gkz = gnx * ay - gny * ax;
      gradient[ll] += glx;
      gradient[ll + 1] += gly;
      gradient[ll + 2] += glz;
      gradient[jj] += gjx;
      gradient[jj + 1] += gjy;
      gradient[jj + 2] += gjz;
      gradient[kk] += gkx;
      gradient[kk + 1] += gky;
      gradient[kk + 2] += gkz;
      gradient[centre] -= glx + gjx + gkx;
      gradient[centre + 1] -= gly + gjy + gky;
      gradient[centre + 2] -= glz + gjz + gkz;
    }
    total += e;
    if (energies !== undefined) energies[t] = e;
  }
  return total;
}
