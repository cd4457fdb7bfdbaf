/**
 * Two-atom stretch kernels: harmonic bond, Morse bond, and the Urey–Bradley
 * 1–3 distance term (which reads atoms i and k of an i–j–k triple).
 *
 * With d = x_j − x_i and r = |d|: dr/dx_j = d / r = −dr/dx_i. Every kernel
 * computes dE/dr and adds (dE/dr / r) · d to atom j and its negative to
 * atom i. At r = 0 the direction is undefined and the gradient is zero,
 * except where the energy is a plain ½ k r² (r0 = 0), whose gradient k·d is
 * defined everywhere.
 * @module
 */
import type { TermTable } from './table.js';

/**
 * Harmonic bond, E = ½ k (r − r0)², params [k, r0].
 * dE/dr = k (r − r0). See {@link Kernel} for the arguments.
 */
export function accumulateHarmonicBonds(
  x: Float64Array,
  table: TermTable,
  gradient?: Float64Array,
  energies?: Float64Array,
): number {
  return stretch(x, table, 0, 1, gradient, energies);
}

/**
 * Urey–Bradley 1–3 term, E = ½ k (|x_k − x_i| − s0)², params [k, s0], atoms
 * i j k (j is not used). Same derivative as a harmonic bond between i and k.
 */
export function accumulateUreyBradley(
  x: Float64Array,
  table: TermTable,
  gradient?: Float64Array,
  energies?: Float64Array,
): number {
  return stretch(x, table, 0, 2, gradient, energies);
}

/**
 * Add f·d to atom j's gradient and −f·d to atom i's (i, j are offsets 3·atom):
 * the gradient of any function of r = |d|, d = x_j − x_i, with f = (dE/dr)/r.
 * Small enough that the engine inlines it into the kernels' loops.
 */
export function addPairGradient(
  gradient: Float64Array,
  i: number,
  j: number,
  f: number,
  dx: number,
  dy: number,
  dz: number,
): void {
  const gx = f * dx;
  const gy = f * dy;
  const gz = f * dz;
  gradient[j] += gx;
  gradient[j + 1] += gy;
  gradient[j + 2] += gz;
  gradient[i] -= gx;
  gradient[i + 1] -= gy;
  gradient[i + 2] -= gz;
}

/** Harmonic stretch between columns `ci` and `cj` of each term's atoms. */
function stretch(
  x: Float64Array,
  table: TermTable,
  ci: number,
  cj: number,
  gradient: Float64Array | undefined,
  energies: Float64Array | undefined,
): number {
  const { atoms, params, count, arity } = table;
  let total = 0;
  for (let t = 0; t < count; t++) {
    const i = 3 * atoms[t * arity + ci];
    const j = 3 * atoms[t * arity + cj];
    const k = params[2 * t];
    const r0 = params[2 * t + 1];
    const dx = x[j] - x[i];
    const dy = x[j + 1] - x[i + 1];
    const dz = x[j + 2] - x[i + 2];
    const r = Math.sqrt(dx * dx + dy * dy + dz * dz);
    const dr = r - r0;
    const e = 0.5 * k * dr * dr;
    total += e;
    if (energies !== undefined) energies[t] = e;
    if (gradient !== undefined) {
      // dE/dd = k (r − r0) d / r; with r0 = 0 this is k d (defined at r = 0 too).
      const f = r0 === 0 ? k : r > 0 ? (k * dr) / r : 0;
      addPairGradient(gradient, i, j, f, dx, dy, dz);
    }
  }
  return total;
}

/**
 * Morse bond, E = D [1 − exp(−a (r − r0))]², params [D, a, r0].
 * With e = exp(−a (r − r0)): dE/dr = 2 D a e (1 − e). E → D as r → ∞, and
 * d²E/dr² at r0 is 2 D a², the harmonic force constant it matches.
 */
export function accumulateMorseBonds(
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
    const D = params[3 * t];
    const a = params[3 * t + 1];
    const r0 = params[3 * t + 2];
    const dx = x[j] - x[i];
    const dy = x[j + 1] - x[i + 1];
    const dz = x[j + 2] - x[i + 2];
    const r = Math.sqrt(dx * dx + dy * dy + dz * dz);
    const ex = Math.exp(-a * (r - r0));
    const one = 1 - ex;
    const e = D * one * one;
    total += e;
    if (energies !== undefined) energies[t] = e;
    if (gradient !== undefined && r > 0) {
      const f = (2 * D * a * ex * one) / r;
      addPairGradient(gradient, i, j, f, dx, dy, dz);
    }
  }
  return total;
}
