/**
 * Block-sparse Hessian: 3×3 blocks over the atom pairs that share a term.
 *
 * Built in two passes, as a sparse factorization would be: the symbolic
 * pass (the constructor) reads only the tables' atom indices and fixes the
 * pattern — which blocks exist and, for every `add` a kernel will make,
 * which block it lands in; the numeric pass ({@link BlockSparseHessian.update})
 * runs the kernels at a geometry and writes the blocks' values through those
 * precomputed slots, without any search, in time linear in the number of terms.
 *
 * Nonbonded pairs, when given, are not in the block pattern: with a cutoff
 * their set depends on the geometry, and without one they would make the
 * pattern dense. They are kept beside it as a list of pair blocks
 * ({@link NonbondedPairHessian}), found again at every update, and added in
 * products and in `toDense`.
 * @module
 */
import type { NonbondedPairs } from '../terms/nonbonded.js';
import type { TermTable } from '../terms/table.js';
import { HESSIAN_KERNELS } from './kernels.js';
import { NonbondedPairHessian } from './nonbonded.js';
import type { HessianSink } from './sink.js';

/** Writes each block a kernel hands over into its precomputed slot (or skips it). */
class SlotSink implements HessianSink {
  cursor = 0;
  constructor(
    private readonly values: Float64Array,
    private readonly slots: Int32Array,
  ) {}

  add(_a: number, _b: number, source: Float64Array, offset: number, stride: number): void {
    const slot = this.slots[this.cursor++];
    if (slot < 0) return; // the lower-triangle twin of a stored block
    const v = this.values;
    v[slot] += source[offset];
    v[slot + 1] += source[offset + 1];
    v[slot + 2] += source[offset + 2];
    v[slot + 3] += source[offset + stride];
    v[slot + 4] += source[offset + stride + 1];
    v[slot + 5] += source[offset + stride + 2];
    v[slot + 6] += source[offset + 2 * stride];
    v[slot + 7] += source[offset + 2 * stride + 1];
    v[slot + 8] += source[offset + 2 * stride + 2];
  }
}

/**
 * A symmetric Hessian stored as 3×3 blocks (a, b) with a ≤ b, row by row:
 * the blocks of atom row a are `columns[rowStart[a] .. rowStart[a+1]−1]`
 * (increasing, the diagonal block first, present for every atom), block n's
 * entry (p, q) is `values[9n + 3p + q]` = ∂²E/∂x_{a,p}∂x_{b,q}. The blocks
 * with a > b are the transposes and are not stored.
 *
 * The pattern is fixed by the tables' atoms when constructed; call
 * {@link update} for each geometry. The tables are kept by reference: change
 * their parameters freely, but not their atoms (build a new one instead).
 *
 * With a nonbonded pair set, the blocks above hold the bonded terms only;
 * the pairs counted at the last update's geometry are in {@link nonbonded}
 * (their number changes with the geometry when there is a cutoff), and
 * {@link multiply} and {@link toDense} give the whole Hessian.
 */
export class BlockSparseHessian {
  /** Number of atoms N; vectors have length 3N. */
  readonly atomCount: number;
  /** Start of each atom row in {@link columns}, length N + 1. */
  readonly rowStart: Int32Array;
  /** Column atom b of every stored block, length {@link blockCount}. */
  readonly columns: Int32Array;
  /** Block values, 9 per block, row-major within the block. */
  readonly values: Float64Array;
  /** The nonbonded pair blocks (at the last update's geometry), or null without a pair set. */
  readonly nonbonded: NonbondedPairHessian | null;

  readonly #tables: readonly TermTable[];
  readonly #slots: Int32Array;
  readonly #sink: SlotSink;
  readonly #scratch: Float64Array;

  /**
   * Symbolic pass: the pattern of the Hessian of the sum of `tables` over
   * `atomCount` atoms (values zero until {@link update}). O(terms · log).
   * With `nonbonded` (a pair set over the same atoms, e.g. `model.nonbonded`)
   * its pair blocks are added too, from a pair list (see {@link nonbonded}).
   *
   * @throws RangeError naming the place (`tables[1].atoms[7]: index 12 is out
   *   of range (3 atoms)`) if an atom index is not an integer in [0, atomCount),
   *   or if `nonbonded` is over a different number of atoms.
   */
  constructor(tables: readonly TermTable[], atomCount: number, nonbonded?: NonbondedPairs | null) {
    if (!Number.isInteger(atomCount) || atomCount < 0) {
      throw new RangeError(`atomCount: expected an integer ≥ 0, got ${String(atomCount)}`);
    }
    if (nonbonded != null && nonbonded.atomCount !== atomCount) {
      throw new RangeError(`nonbonded: its pair set has ${nonbonded.atomCount} atoms, expected ${atomCount}`);
    }
    this.nonbonded = nonbonded == null ? null : new NonbondedPairHessian(nonbonded);
    this.atomCount = atomCount;
    this.#tables = tables;
    const count = new Int32Array(atomCount + 1);
    let calls = 0;
    for (let n = 0; n < tables.length; n++) {
      const table = tables[n];
      const { atoms, arity } = table;
      for (let e = 0; e < table.count * arity; e++) {
        const a = atoms[e];
        if (!(a >= 0 && a < atomCount)) {
          throw new RangeError(`tables[${n}].atoms[${e}]: index ${a} is out of range (${atomCount} atoms)`);
        }
      }
      const slots = HESSIAN_KERNELS[table.kind].slots;
      calls += table.count * slots.length * slots.length;
      forEachPair(table, slots, (a, b) => {
        if (a < b) count[a]++;
      });
    }
    // rows: diagonal + every b > a (with repeats), then sort and drop repeats
    const start = new Int32Array(atomCount + 1);
    for (let a = 0; a < atomCount; a++) start[a + 1] = start[a] + 1 + count[a];
    const raw = new Int32Array(start[atomCount]);
    const fill = Int32Array.from(start.subarray(0, atomCount));
    for (let a = 0; a < atomCount; a++) raw[fill[a]++] = a;
    for (const table of tables) {
      forEachPair(table, HESSIAN_KERNELS[table.kind].slots, (a, b) => {
        if (a < b) raw[fill[a]++] = b;
      });
    }
    const rowStart = new Int32Array(atomCount + 1);
    let kept = 0;
    for (let a = 0; a < atomCount; a++) {
      const row = raw.subarray(start[a], start[a + 1]).sort();
      rowStart[a] = kept;
      for (let c = 0; c < row.length; c++) {
        if (c === 0 || row[c] !== row[c - 1]) raw[kept++] = row[c];
      }
    }
    rowStart[atomCount] = kept;
    this.rowStart = rowStart;
    this.columns = raw.slice(0, kept);
    this.values = new Float64Array(9 * kept);

    const slots = new Int32Array(calls);
    let cursor = 0;
    for (const table of tables) {
      forEachPair(table, HESSIAN_KERNELS[table.kind].slots, (a, b) => {
        slots[cursor++] = a > b ? -1 : 9 * this.#find(a, b);
      });
    }
    this.#slots = slots;
    this.#sink = new SlotSink(this.values, slots);
    this.#scratch = new Float64Array(3 * atomCount);
  }

  /** Number of stored blocks (a ≤ b). */
  get blockCount(): number {
    return this.columns.length;
  }

  /** Index of block (a, b), a ≤ b, by bisection in row a (symbolic pass only). */
  #find(a: number, b: number): number {
    let lo = this.rowStart[a];
    let hi = this.rowStart[a + 1] - 1;
    while (lo <= hi) {
      const mid = (lo + hi) >> 1;
      const c = this.columns[mid];
      if (c === b) return mid;
      if (c < b) lo = mid + 1;
      else hi = mid - 1;
    }
    throw new Error(`internal: block (${a}, ${b}) missing from the pattern`);
  }

  /**
   * Numeric pass: overwrites {@link values} with the Hessian at `x` (flat,
   * 3N, the tables' length unit). Linear in the number of terms, no
   * allocation; with a nonbonded pair set, also finds its pair blocks at `x`
   * (O(N²) distance tests; its pair arrays grow only when more pairs than
   * ever before are within the cutoff). Returns `this`.
   *
   * @throws RangeError if `x.length` is not 3N.
   */
  update(x: Float64Array): this {
    if (x.length !== 3 * this.atomCount) {
      throw new RangeError(`x: expected 3N = ${3 * this.atomCount} numbers, got ${x.length}`);
    }
    this.values.fill(0);
    const sink = this.#sink;
    sink.cursor = 0;
    const tables = this.#tables;
    for (let n = 0; n < tables.length; n++) {
      const table = tables[n];
      HESSIAN_KERNELS[table.kind].accumulate(x, table, sink);
    }
    if (sink.cursor !== this.#slots.length) {
      throw new Error('internal: a Hessian kernel broke its block order contract');
    }
    this.nonbonded?.update(x);
    return this;
  }

  /**
   * Hessian-vector product H·v (v flat, length 3N): written into `out`
   * (length 3N, overwritten; may be `v` itself) or a new array, and
   * returned. O(blocks), no allocation when `out` is given.
   *
   * @throws RangeError if `v` or `out` has the wrong length.
   */
  multiply(v: Float64Array, out?: Float64Array): Float64Array {
    const size = 3 * this.atomCount;
    if (v.length !== size) throw new RangeError(`v: expected 3N = ${size} numbers, got ${v.length}`);
    if (out !== undefined && out.length !== size) {
      throw new RangeError(`out: expected 3N = ${size} numbers, got ${out.length}`);
    }
    const result = out ?? new Float64Array(size);
    const y = result === v ? this.#scratch : result;
    y.fill(0);
    const { rowStart, columns, values } = this;
    for (let a = 0; a < this.atomCount; a++) {
      const ia = 3 * a;
      const va0 = v[ia];
      const va1 = v[ia + 1];
      const va2 = v[ia + 2];
      let y0 = 0;
      let y1 = 0;
      let y2 = 0;
      for (let n = rowStart[a]; n < rowStart[a + 1]; n++) {
        const ib = 3 * columns[n];
        const h = 9 * n;
        const vb0 = v[ib];
        const vb1 = v[ib + 1];
        const vb2 = v[ib + 2];
        y0 += values[h] * vb0 + values[h + 1] * vb1 + values[h + 2] * vb2;
        y1 += values[h + 3] * vb0 + values[h + 4] * vb1 + values[h + 5] * vb2;
        y2 += values[h + 6] * vb0 + values[h + 7] * vb1 + values[h + 8] * vb2;
        if (ib !== ia) {
          y[ib] += values[h] * va0 + values[h + 3] * va1 + values[h + 6] * va2;
          y[ib + 1] += values[h + 1] * va0 + values[h + 4] * va1 + values[h + 7] * va2;
          y[ib + 2] += values[h + 2] * va0 + values[h + 5] * va1 + values[h + 8] * va2;
        }
      }
      y[ia] += y0;
      y[ia + 1] += y1;
      y[ia + 2] += y2;
    }
    this.nonbonded?.multiplyAdd(v, y);
    if (y !== result) result.set(y);
    return result;
  }

  /**
   * The same Hessian as a dense (3N)×(3N) row-major matrix (both triangles),
   * written into `out` (length (3N)², overwritten) or a new array.
   *
   * @throws RangeError if `out` has the wrong length.
   */
  toDense(out?: Float64Array): Float64Array {
    const size = 3 * this.atomCount;
    if (out !== undefined && out.length !== size * size) {
      throw new RangeError(`out: expected (3N)² = ${size * size} numbers, got ${out.length}`);
    }
    const m = out ?? new Float64Array(size * size);
    m.fill(0);
    const { rowStart, columns, values } = this;
    for (let a = 0; a < this.atomCount; a++) {
      for (let n = rowStart[a]; n < rowStart[a + 1]; n++) {
        const b = columns[n];
        for (let p = 0; p < 3; p++) {
          for (let q = 0; q < 3; q++) {
            const value = values[9 * n + 3 * p + q];
            m[(3 * a + p) * size + 3 * b + q] = value;
            if (b !== a) m[(3 * b + q) * size + 3 * a + p] = value;
          }
        }
      }
    }
    this.nonbonded?.addToDense(m, size);
    return m;
  }
}

/** Calls `visit(a, b)` for every ordered slot pair of every term, in kernel order. */
function forEachPair(table: TermTable, slots: readonly number[], visit: (a: number, b: number) => void): void {
  const { atoms, arity, count } = table;
  for (let t = 0; t < count; t++) {
    const base = t * arity;
    for (let s = 0; s < slots.length; s++) {
      const a = atoms[base + slots[s]];
      for (let u = 0; u < slots.length; u++) visit(a, atoms[base + slots[u]]);
    }
  }
}
