/**
 * Mass weighting of a Cartesian Hessian.
 * @module
 */

/**
 * The mass-weighted Hessian M^{−½} H M^{−½}: entry (i, j) is
 * H(i, j) / √(m_a m_b), a and b the atoms of coordinates i and j
 * (coordinate i belongs to atom ⌊i/3⌋). `hessian` is row-major (3N)×(3N),
 * `masses` has N entries (dalton). Result in energy/length² per dalton,
 * written into `out` (length (3N)², may be `hessian` itself) or a new array,
 * and returned. Never throws; lengths are the caller's to check.
 */
export function massWeightHessian(hessian: Float64Array, masses: Float64Array, out?: Float64Array): Float64Array {
  const n = 3 * masses.length;
  const result = out ?? new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    const wi = 1 / Math.sqrt(masses[(i / 3) | 0]);
    const ri = i * n;
    for (let j = 0; j < n; j++) result[ri + j] = hessian[ri + j] * wi / Math.sqrt(masses[(j / 3) | 0]);
  }
  return result;
}
