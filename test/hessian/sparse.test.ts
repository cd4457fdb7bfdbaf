/**
 * The block-sparse Hessian of src/hessian/sparse.ts: its pattern, equality
 * with the dense assembly, products, and errors.
 */
import { describe, expect, it } from 'vitest';
import { tablesHessian } from '../../src/hessian/dense.js';
import { BlockSparseHessian } from '../../src/hessian/sparse.js';
import { KIND_LAYOUTS, TERM_KINDS } from '../../src/terms/table.js';
import type { TermTable } from '../../src/terms/table.js';
import { PARAMS } from '../helpers/cases.js';
import { createRandom } from '../helpers/random.js';
import type { Random } from '../helpers/random.js';
import { makeTable } from '../helpers/terms.js';
import type { Row } from '../helpers/terms.js';
import { matVec, maxAbs } from './support.js';

/** Random terms of every kind on a random pool of atoms (shared atoms, many repeats of pairs). */
function randomSystem(rng: Random, atoms: number, perKind: number): { x: Float64Array; tables: TermTable[] } {
  const x = Float64Array.from({ length: 3 * atoms }, () => rng.uniform(-3, 3));
  const tables = TERM_KINDS.map((kind) => {
    const rows: Row[] = [];
    const { arity } = KIND_LAYOUTS[kind];
    for (let t = 0; t < perKind; t++) {
      const chosen: number[] = [];
      while (chosen.length < arity) {
        const a = rng.int(0, atoms - 1);
        if (!chosen.includes(a)) chosen.push(a);
      }
      rows.push({ atoms: chosen, params: PARAMS[kind](rng) });
    }
    return makeTable(kind, rows);
  });
  return { x, tables };
}

describe('BlockSparseHessian', () => {
  it('toDense() equals the dense assembly bit for bit (20 random systems of every kind)', () => {
    const rng = createRandom(13);
    for (let c = 0; c < 20; c++) {
      const atoms = rng.int(4, 15);
      const { x, tables } = randomSystem(rng, atoms, rng.int(0, 6));
      const sparse = new BlockSparseHessian(tables, atoms).update(x);
      expect(Array.from(sparse.toDense())).toEqual(Array.from(tablesHessian(tables, atoms, x)));
    }
  });

  it('multiply(v) equals the dense product, also in place (out = v)', () => {
    const rng = createRandom(14);
    for (let c = 0; c < 20; c++) {
      const atoms = rng.int(4, 15);
      const { x, tables } = randomSystem(rng, atoms, 5);
      const sparse = new BlockSparseHessian(tables, atoms).update(x);
      const v = Float64Array.from(x, () => rng.uniform(-1, 1));
      const dense = matVec(tablesHessian(tables, atoms, x), v);
      const product = sparse.multiply(v);
      const allowed = 1e-13 * maxAbs(sparse.values) * atoms;
      for (let e = 0; e < v.length; e++) expect(Math.abs(product[e] - dense[e])).toBeLessThanOrEqual(allowed);
      const copy = Float64Array.from(v);
      expect(sparse.multiply(copy, copy)).toBe(copy);
      expect(Array.from(copy)).toEqual(Array.from(product));
    }
  });

  it('the pattern holds exactly the pairs that share a term, plus every diagonal block', () => {
    // chain 0-1-2-3-4 with bonds, one angle 0-1-2, one Urey–Bradley 2-3-4 (pair 2-4, not 2-3 nor 3-4 by itself)
    const tables = [
      makeTable('harmonic-bond', [{ atoms: [1, 0], params: [1, 1] }, { atoms: [1, 2], params: [1, 1] }]),
      makeTable('harmonic-angle', [{ atoms: [0, 1, 2], params: [1, 2] }]),
      makeTable('urey-bradley', [{ atoms: [2, 3, 4], params: [1, 2] }]),
    ];
    const sparse = new BlockSparseHessian(tables, 6);
    const pairs: string[] = [];
    for (let a = 0; a < 6; a++) for (let n = sparse.rowStart[a]; n < sparse.rowStart[a + 1]; n++) pairs.push(`${a}-${sparse.columns[n]}`);
    expect(pairs).toEqual(['0-0', '0-1', '0-2', '1-1', '1-2', '2-2', '2-4', '3-3', '4-4', '5-5']);
    expect(sparse.blockCount).toBe(10);
  });

  it('update() overwrites: twice at the same x gives the same values; a new x gives new values', () => {
    const rng = createRandom(15);
    const { x, tables } = randomSystem(rng, 10, 4);
    const sparse = new BlockSparseHessian(tables, 10);
    const first = Float64Array.from(sparse.update(x).values);
    expect(Array.from(sparse.update(x).values)).toEqual(Array.from(first));
    const moved = Float64Array.from(x, (v) => v + rng.uniform(-0.1, 0.1));
    expect(Array.from(sparse.update(moved).toDense())).toEqual(Array.from(tablesHessian(tables, 10, moved)));
  });

  it('an atom in no term has a zero diagonal block; no tables gives the zero matrix', () => {
    const sparse = new BlockSparseHessian([], 3).update(new Float64Array(9));
    expect(sparse.blockCount).toBe(3);
    expect(maxAbs(sparse.toDense())).toBe(0);
    expect(Array.from(sparse.multiply(new Float64Array(9).fill(1)))).toEqual(new Array(9).fill(0));
  });

  it('throws RangeError naming the place for bad atoms and wrong lengths', () => {
    const bad = makeTable('harmonic-bond', [{ atoms: [0, 1], params: [1, 1] }, { atoms: [2, 7], params: [1, 1] }]);
    expect(() => new BlockSparseHessian([bad], 3)).toThrow(new RangeError('tables[0].atoms[3]: index 7 is out of range (3 atoms)'));
    expect(() => new BlockSparseHessian([], -1)).toThrow(RangeError);
    const sparse = new BlockSparseHessian([], 2);
    expect(() => sparse.update(new Float64Array(5))).toThrow(new RangeError('x: expected 3N = 6 numbers, got 5'));
    expect(() => sparse.multiply(new Float64Array(5))).toThrow(new RangeError('v: expected 3N = 6 numbers, got 5'));
    expect(() => sparse.multiply(new Float64Array(6), new Float64Array(3))).toThrow(RangeError);
    expect(() => sparse.toDense(new Float64Array(35))).toThrow(new RangeError('out: expected (3N)² = 36 numbers, got 35'));
  });
});
