/**
 * Force measures used by the convergence tests: the largest and the RMS
 * per-atom norm of a gradient, taking consecutive triples of coordinates as
 * atoms (a trailing group of 1 or 2 when the length is not a multiple of 3).
 * @module
 */

/**
 * Largest Euclidean norm of any triple `[v[3i], v[3i+1], v[3i+2]]` of `v`
 * (units of `v`). Returns 0 for an empty array; NaN if `v` holds NaN.
 */
export function maxAtomNorm(v: Float64Array): number {
  let largest = 0;
  const n = v.length;
  for (let i = 0; i < n; i += 3) {
    const a = v[i];
    const b = i + 1 < n ? v[i + 1] : 0;
    const c = i + 2 < n ? v[i + 2] : 0;
    const s = a * a + b * b + c * c;
    if (s !== s) return NaN;
    if (s > largest) largest = s;
  }
  return Math.sqrt(largest);
}

/**
 * Root mean square of the per-atom norms of `v`: sqrt(Σ vᵢ² / atoms), where
 * atoms = ceil(n / 3). Never above {@link maxAtomNorm}. Returns 0 when empty.
 */
export function rmsAtomNorm(v: Float64Array): number {
  const atoms = Math.ceil(v.length / 3);
  if (atoms === 0) return 0;
  let s = 0;
  for (let i = 0; i < v.length; i++) s += v[i] * v[i];
  return Math.sqrt(s / atoms);
}
