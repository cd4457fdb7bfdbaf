/**
 * Internal coordinates read off flat coordinates: distance, bend angle and
 * torsion angle, with the same formulas the kernels use. Atom indices are
 * 0-based; angles are returned in radians.
 * @module
 */

/** Distance |x_j − x_i| between atoms i and j. */
export function distance(x: Float64Array, i: number, j: number): number {
  const a = 3 * i;
  const b = 3 * j;
  return Math.hypot(x[b] - x[a], x[b + 1] - x[a + 1], x[b + 2] - x[a + 2]);
}

/** Bend angle i–j–k at vertex j, radians in [0, π], via atan2(|u × v|, u · v). */
export function bendAngle(x: Float64Array, i: number, j: number, k: number): number {
  const a = 3 * i;
  const b = 3 * j;
  const c = 3 * k;
  const ux = x[a] - x[b];
  const uy = x[a + 1] - x[b + 1];
  const uz = x[a + 2] - x[b + 2];
  const vx = x[c] - x[b];
  const vy = x[c + 1] - x[b + 1];
  const vz = x[c + 2] - x[b + 2];
  const cx = uy * vz - uz * vy;
  const cy = uz * vx - ux * vz;
  const cz = ux * vy - uy * vx;
  return Math.atan2(Math.sqrt(cx * cx + cy * cy + cz * cz), ux * vx + uy * vy + uz * vz);
}

/**
 * Torsion angle i–j–k–l, radians in (−π, π], IUPAC sign (cis 0, trans π;
 * positive when, looking along j→k, the bond j–i turns clockwise to eclipse
 * k–l): φ = atan2(|b2| b1 · (b2 × b3), (b1 × b2) · (b2 × b3)), the first
 * argument evaluated as ((m × n) · b2) / |b2| to keep its digits near lines.
 */
export function torsionAngle(x: Float64Array, i: number, j: number, k: number, l: number): number {
  const a = 3 * i;
  const b = 3 * j;
  const c = 3 * k;
  const d = 3 * l;
  const b1x = x[b] - x[a];
  const b1y = x[b + 1] - x[a + 1];
  const b1z = x[b + 2] - x[a + 2];
  const b2x = x[c] - x[b];
  const b2y = x[c + 1] - x[b + 1];
  const b2z = x[c + 2] - x[b + 2];
  const b3x = x[d] - x[c];
  const b3y = x[d + 1] - x[c + 1];
  const b3z = x[d + 2] - x[c + 2];
  const mx = b1y * b2z - b1z * b2y;
  const my = b1z * b2x - b1x * b2z;
  const mz = b1x * b2y - b1y * b2x;
  const nx = b2y * b3z - b2z * b3y;
  const ny = b2z * b3x - b2x * b3z;
  const nz = b2x * b3y - b2y * b3x;
  const b2n = Math.sqrt(b2x * b2x + b2y * b2y + b2z * b2z);
  // |b2| b1 · n as ((m × n) · b2) / |b2|: accurate when both bond angles are near 180°
  const sin =
    b2n > 0 ? ((my * nz - mz * ny) * b2x + (mz * nx - mx * nz) * b2y + (mx * ny - my * nx) * b2z) / b2n : 0;
  const phi = Math.atan2(sin, mx * nx + my * ny + mz * nz);
  return phi === -Math.PI ? Math.PI : phi;
}

/**
 * Out-of-plane angle ω of the bond i–l against the plane of i, j, k
 * (radians in [−π/2, π/2]; 0 when l lies in the plane, positive on the side
 * of (x_j − x_i) × (x_k − x_i)), as the `inversion` kernel computes it:
 * ω = atan2(n · d, |n × d|), n = (x_j − x_i) × (x_k − x_i), d = x_l − x_i.
 * 0 when the plane or the bond is undefined (collinear or coincident atoms).
 */
export function outOfPlaneAngle(x: Float64Array, i: number, j: number, k: number, l: number): number {
  const a = 3 * i;
  const b = 3 * j;
  const c = 3 * k;
  const e = 3 * l;
  const ax = x[b] - x[a];
  const ay = x[b + 1] - x[a + 1];
  const az = x[b + 2] - x[a + 2];
  const bx = x[c] - x[a];
  const by = x[c + 1] - x[a + 1];
  const bz = x[c + 2] - x[a + 2];
  const dx = x[e] - x[a];
  const dy = x[e + 1] - x[a + 1];
  const dz = x[e + 2] - x[a + 2];
  const nx = ay * bz - az * by;
  const ny = az * bx - ax * bz;
  const nz = ax * by - ay * bx;
  const qx = ny * dz - nz * dy;
  const qy = nz * dx - nx * dz;
  const qz = nx * dy - ny * dx;
  return Math.atan2(nx * dx + ny * dy + nz * dz, Math.sqrt(qx * qx + qy * qy + qz * qz));
}
