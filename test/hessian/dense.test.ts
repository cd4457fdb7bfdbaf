/**
 * tablesHessian of src/hessian/dense.ts: output buffer and argument errors.
 */
import { describe, expect, it } from 'vitest';
import { tablesHessian } from '../../src/hessian/dense.js';
import { makeTable } from '../helpers/terms.js';

describe('tablesHessian', () => {
  const bond = makeTable('harmonic-bond', [{ atoms: [0, 1], params: [100, 1] }]);
  const x = new Float64Array([0, 0, 0, 1.5, 0, 0]);

  it('overwrites out (stale content cleared) and returns it', () => {
    const out = new Float64Array(36).fill(5);
    expect(tablesHessian([bond], 2, x, out)).toBe(out);
    // along the bond: ±k; across: ±k (r − r0)/r = ±100/3 (bond.ts formula)
    expect(out[0]).toBeCloseTo(100, 12);
    expect(out[3]).toBeCloseTo(-100, 12);
    expect(out[7]).toBeCloseTo(100 / 3, 12);
    expect(out[2]).toBe(0);
  });

  it('no tables: the zero matrix; no atoms: an empty one', () => {
    expect(Array.from(tablesHessian([], 2, x))).toEqual(new Array(36).fill(0));
    expect(tablesHessian([], 0, new Float64Array(0)).length).toBe(0);
  });

  it('throws RangeError for x or out of the wrong length', () => {
    expect(() => tablesHessian([bond], 2, new Float64Array(5))).toThrow(new RangeError('x: expected 3N = 6 numbers, got 5'));
    expect(() => tablesHessian([bond], 2, x, new Float64Array(35))).toThrow(new RangeError('out: expected (3N)² = 36 numbers, got 35'));
  });
});
