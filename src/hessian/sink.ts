/**
 * Where Hessian kernels put their numbers: a sink receives 3×3 atom-pair
 * blocks, and the same kernel code fills a dense matrix or a block-sparse
 * one depending on the sink it is handed.
 * @module
 */
import type { TermTable } from '../terms/table.js';

/**
 * Receives the 3×3 blocks of a Hessian. `add(a, b, source, offset, stride)`
 * ADDS the block ∂²E/∂x_a∂x_b (a, b atom indices, 0-based) whose entry
 * (p, q), p, q ∈ {0, 1, 2} the axes x, y, z, is
 * `source[offset + p·stride + q]`. The source is the kernel's scratch: read
 * it at once, never keep it.
 *
 * The kernels' contract with a sink (see {@link HessianKernel}): for every
 * term, in table order, `add` is called once for every ORDERED pair (s, t)
 * of the kind's used atom slots, s then t in increasing order, blocks that
 * happen to be zero included. So both (a, b) and (b, a) arrive, the second
 * the exact transpose of the first; a sink may keep both or only one.
 */
export interface HessianSink {
  /** Adds one 3×3 block; see above. */
  add(a: number, b: number, source: Float64Array, offset: number, stride: number): void;
}

/**
 * A sink that adds into a dense row-major (3N)×(3N) matrix: block (a, b)
 * lands at rows 3a..3a+2, columns 3b..3b+2. Make one per assembly; it holds
 * no state besides the matrix it writes to.
 */
export class DenseSink implements HessianSink {
  /** The matrix added into, length (3N)², row-major. */
  readonly matrix: Float64Array;
  /** 3N, the row length. */
  readonly size: number;

  /** A sink writing into `matrix`, a (3·atomCount)² row-major array (not cleared here). */
  constructor(matrix: Float64Array, atomCount: number) {
    this.matrix = matrix;
    this.size = 3 * atomCount;
  }

  /** Adds the block (see {@link HessianSink}) at rows 3a…3a+2, columns 3b…3b+2. */
  add(a: number, b: number, source: Float64Array, offset: number, stride: number): void {
    const m = this.matrix;
    const n = this.size;
    let row = 3 * a * n + 3 * b;
    for (let p = 0; p < 3; p++) {
      const s = offset + p * stride;
      m[row] += source[s];
      m[row + 1] += source[s + 1];
      m[row + 2] += source[s + 2];
      row += n;
    }
  }
}

/**
 * The Hessian of one term kind. `accumulate(x, table, sink)` adds, for every
 * term of `table` at coordinates `x` (flat, 3N), the 3×3 blocks of the term's
 * second derivatives into `sink`, following the contract of
 * {@link HessianSink}: for every term, one `add` per ordered pair of the
 * atom columns listed in `slots` (row-major over `slots × slots`). Never
 * allocates (its scratch is made once, with the module), never throws.
 */
export interface HessianKernel {
  /** Which atom columns of a term the energy depends on (Urey–Bradley: [0, 2]). */
  readonly slots: readonly number[];
  /** Adds every term's blocks into `sink`; see above. */
  readonly accumulate: (x: Float64Array, table: TermTable, sink: HessianSink) => void;
}
