/**
 * Per-atom force summaries of a gradient (flat, 3N).
 * @module
 */

/** Largest and root-mean-square per-atom force norms, and where the largest is. */
export interface ForceSummary {
  /** Largest |g_a| over the atoms counted (energy per length). */
  readonly maxForce: number;
  /** Atom with the largest force norm, or −1 when no atom was counted. */
  readonly maxForceAtom: number;
  /** sqrt(mean over counted atoms of |g_a|²). */
  readonly rmsForce: number;
}

/**
 * Summarise the per-atom force norms |g_a| of `gradient` (flat, 3N). Atoms
 * whose index is in `skip` (e.g. frozen atoms) are left out. A NaN anywhere
 * makes `maxForce` NaN, so it cannot pass for converged.
 */
export function forceSummary(gradient: Float64Array, skip?: ArrayLike<number>): ForceSummary {
  const n = gradient.length / 3;
  const skipped = new Uint8Array(n);
  if (skip !== undefined) for (let s = 0; s < skip.length; s++) skipped[skip[s]] = 1;
  let max = 0;
  let at = -1;
  let sum = 0;
  let counted = 0;
  for (let a = 0; a < n; a++) {
    if (skipped[a]) continue;
    const f2 = gradient[3 * a] ** 2 + gradient[3 * a + 1] ** 2 + gradient[3 * a + 2] ** 2;
    const f = Math.sqrt(f2);
    if (Number.isNaN(f)) return { maxForce: NaN, maxForceAtom: a, rmsForce: NaN };
    if (f > max || at < 0) {
      max = f;
      at = a;
    }
    sum += f2;
    counted++;
  }
  return { maxForce: max, maxForceAtom: at, rmsForce: counted > 0 ? Math.sqrt(sum / counted) : 0 };
}
