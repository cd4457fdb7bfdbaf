/**
 * Restraint kernels: flat-bottomed position restraints on single atoms and
 * flat-bottomed distance restraints between pairs.
 * @module
 */
import { addPairGradient } from './bond.js';
import type { TermTable } from './table.js';

/**
 * Position restraint, E = ½ k max(0, |x_i − x0| − flat)², params
 * [k, x0, y0, z0, flat]. With d = x_i − x0, r = |d|:
 * dE/dx_i = k (r − flat) d / r when r > flat (k d when flat = 0, which is
 * defined at r = 0 as well), else 0.
 */
export function accumulatePositionRestraints(
  x: Float64Array,
  table: TermTable,
  gradient?: Float64Array,
  energies?: Float64Array,
): number {
  const { atoms, params, count } = table;
  let total = 0;
  for (let t = 0; t < count; t++) {
    const i = 3 * atoms[t];
    const p = 5 * t;
    const k = params[p];
    const flat = params[p + 4];
    const dx = x[i] - params[p + 1];
    const dy = x[i + 1] - params[p + 2];
    const dz = x[i + 2] - params[p + 3];
    const r = Math.sqrt(dx * dx + dy * dy + dz * dz);
    const over = r - flat;
    let e = 0;
    if (flat === 0) {
      // plain ½ k |d|²: gradient k·d, defined everywhere (even where r² underflows)
      e = 0.5 * k * r * r;
      if (gradient !== undefined) {
        gradient[i] += k * dx;
        gradient[i + 1] += k * dy;
        gradient[i + 2] += k * dz;
      }
    } else if (over > 0) {
      e = 0.5 * k * over * over;
      if (gradient !== undefined) {
        const f = (k * over) / r;
        gradient[i] += f * dx;
        gradient[i + 1] += f * dy;
        gradient[i + 2] += f * dz;
      }
    }
    total += e;
    if (energies !== undefined) energies[t] = e;
  }
  return total;
}

/**
 * Distance restraint, params [k, lower, upper]; with r = |x_j − x_i|:
 * E = ½ k (lower − r)² for r < lower, ½ k (r − upper)² for r > upper, 0
 * between. dE/dr = k (r − lower) or k (r − upper); at r = 0 (coincident
 * atoms, direction undefined) the gradient is zero.
 */
export function accumulateDistanceRestraints(
  x: Float64Array,
  table: TermTable,
  gradient?: Float64Array,
  energies?: Float64Array,
): number {
  const { atoms, params, count } = table;
  let total = 0;
  for (let t = 0; t < count; t++) {
    const i = 3 * atoms[2 * t];
    const j = 3 * atoms[2 * t + 1];
    const p = 3 * t;
    const k = params[p];
    const lower = params[p + 1];
    const upper = params[p + 2];
    const dx = x[j] - x[i];
    const dy = x[j + 1] - x[i + 1];
    const dz = x[j + 2] - x[i + 2];
    const r = Math.sqrt(dx * dx + dy * dy + dz * dz);
    const dr = r < lower ? r - lower : r > upper ? r - upper : 0;
    const e = 0.5 * k * dr * dr;
    total += e;
    if (energies !== undefined) energies[t] = e;
    if (gradient !== undefined && dr !== 0 && r > 0) {
      addPairGradient(gradient, i, j, (k * dr) / r, dx, dy, dz);
    }
  }
  return total;
}
