/**
 * A molecule-like test model with invented parameters (no physical
 * meaning): a chain of atoms joined by stiff springs (bonds, k = 600, r0 =
 * 1.53), softer 1–3 springs (angles, k = 80, r0 = 2.5) and a soft
 * repulsion between atoms three or more apart (k = 4 inside 3.5), started
 * from a randomly perturbed zig-zag. Energy and gradient are exact.
 */
import type { ObjectiveFunction } from '../../src/optimize/types.js';
import { createRandom } from '../helpers/random.js';

/** A chain model of `atoms` atoms: its objective and a start (flat, 3N). */
export function chainModel(atoms: number, seed: number): { fn: ObjectiveFunction; start: Float64Array } {
  const rng = createRandom(seed);
  const start = new Float64Array(3 * atoms);
  for (let i = 0; i < atoms; i++) {
    start[3 * i] = 1.3 * i + rng.uniform(-0.3, 0.3);
    start[3 * i + 1] = (i % 2) * 0.8 + rng.uniform(-0.3, 0.3);
    start[3 * i + 2] = rng.uniform(-0.3, 0.3);
  }
  /** Adds k/2 (r − r0)² for the pair i, j (only when r < r0 if `repulsive`). */
  const spring = (x: Float64Array, g: Float64Array | undefined, i: number, j: number, k: number, r0: number, repulsive: boolean): number => {
    const dx = x[3 * j] - x[3 * i];
    const dy = x[3 * j + 1] - x[3 * i + 1];
    const dz = x[3 * j + 2] - x[3 * i + 2];
    const r = Math.sqrt(dx * dx + dy * dy + dz * dz);
    if (repulsive && r >= r0) return 0;
    const dr = r - r0;
    if (g) {
      const c = (k * dr) / r; // dE/dr / r
      g[3 * i] -= c * dx;
      g[3 * i + 1] -= c * dy;
      g[3 * i + 2] -= c * dz;
      g[3 * j] += c * dx;
      g[3 * j + 1] += c * dy;
      g[3 * j + 2] += c * dz;
    }
    return 0.5 * k * dr * dr;
  };
  const fn: ObjectiveFunction = (x, g) => {
    if (g) g.fill(0);
    let e = 0;
    for (let i = 0; i + 1 < atoms; i++) e += spring(x, g, i, i + 1, 600, 1.53, false);
    for (let i = 0; i + 2 < atoms; i++) e += spring(x, g, i, i + 2, 80, 2.5, false);
    for (let i = 0; i < atoms; i++) for (let j = i + 3; j < atoms; j++) e += spring(x, g, i, j, 4, 3.5, true);
    return e;
  };
  return { fn, start };
}
