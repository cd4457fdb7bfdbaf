/**
 * Dense Hessian assembly from term tables.
 * @module
 */
import type { TermTable } from '../terms/table.js';
import { HESSIAN_KERNELS } from './kernels.js';
import { DenseSink } from './sink.js';

/**
 * The Hessian of the sum of `tables` at `x`, dense: a (3N)×(3N) row-major
 * matrix, entry [3a+p, 3b+q] = ∂²E/∂x_{a,p}∂x_{b,q} (energy per length²,
 * in the units of the parameters and coordinates), N = `atomCount`.
 * `out` (length (3N)², optional) is OVERWRITTEN and returned; otherwise a
 * new array is made. Exactly symmetric (H[r][c] === H[c][r]). Linear in the
 * number of terms besides clearing `out`, which is O(N²).
 *
 * @throws RangeError if `x.length` is not 3·atomCount or `out` has the wrong length.
 */
export function tablesHessian(
  tables: readonly TermTable[],
  atomCount: number,
  x: Float64Array,
  out?: Float64Array,
): Float64Array {
  const size = 3 * atomCount;
  if (x.length !== size) {
    throw new RangeError(`x: expected 3N = ${size} numbers, got ${x.length}`);
  }
  if (out !== undefined && out.length !== size * size) {
    throw new RangeError(`out: expected (3N)² = ${size * size} numbers, got ${out.length}`);
  }
  const matrix = out ?? new Float64Array(size * size);
  matrix.fill(0);
  const sink = new DenseSink(matrix, atomCount);
  for (let n = 0; n < tables.length; n++) {
    const table = tables[n];
    HESSIAN_KERNELS[table.kind].accumulate(x, table, sink);
  }
  return matrix;
}
