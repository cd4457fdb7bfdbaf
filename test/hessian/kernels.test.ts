/**
 * Properties every Hessian kernel of src/hessian/ has, run for every kind (TERM_KINDS):
 * agreement with central differences of the kind's analytic GRADIENT kernel
 * (src/terms/) on random realistic cases, exact symmetry, the block order
 * the sinks rely on, translation and rotation invariance, and a many-term
 * table equal to the sum of its one-term tables.
 */
import { describe, expect, it } from 'vitest';
import { tablesHessian } from '../../src/hessian/dense.js';
import { HESSIAN_KERNELS } from '../../src/hessian/kernels.js';
import type { HessianSink } from '../../src/hessian/sink.js';
import { KIND_LAYOUTS, TERM_KINDS } from '../../src/terms/table.js';
import type { TermKind, TermTable } from '../../src/terms/table.js';
import { CASES } from '../helpers/cases.js';
import { randomPoolTable } from '../helpers/properties.js';
import { createRandom } from '../helpers/random.js';
import { makeTable, report, singleTerm } from '../helpers/terms.js';
import { analytic, gradientOf, matVec, maxAbs, numericHessian, relativeError, rotate } from './support.js';

/** Random cases per kind for the comparison with differences. */
const CASES_PER_KIND = 250;
/**
 * Accepted relative error (max |ΔH| / max(1, max |H|)) against the 4-point
 * central differences of the analytic gradient with relative step 1e-4: the
 * stencil's truncation error is O(h⁴) ≈ 1e-16 times the fifth derivative,
 * and its rounding ≈ ε |g| / h ≈ 1e-12 |g|; measured worst over the kinds
 * ≈ 8e-10 (periodic dihedral with n = 6). 2e-8 leaves a margin of 25 and
 * still catches any wrong term (a wrong sign or factor gives errors ≥ 1e-2).
 */
const TOLERANCE = 2e-8;

/** Kinds whose energy depends only on relative positions (all but position restraints). */
const INVARIANT: readonly TermKind[] = TERM_KINDS.filter((kind) => kind !== 'position-restraint');

describe.each(TERM_KINDS.map((kind, n) => [kind, n] as const))('%s Hessian', (kind: TermKind, n: number) => {
  it(`matches 4-point central differences of the analytic gradient on ${CASES_PER_KIND} random cases`, () => {
    const rng = createRandom(7100 + n);
    let worst = 0;
    for (let c = 0; c < CASES_PER_KIND; c++) {
      const { x, params } = CASES[kind](rng);
      const table = singleTerm(kind, params);
      const error = relativeError(analytic(table, x), numericHessian(table, x));
      worst = Math.max(worst, error);
      expect(error, `case ${c}: x = [${Array.from(x)}], params = [${params}]`).toBeLessThanOrEqual(TOLERANCE);
    }
    report(`${kind} Hessian vs differences, worst`, worst);
  });

  it('is exactly symmetric (H[r][c] === H[c][r]) on many-term tables over shared atoms', () => {
    const rng = createRandom(7200 + n);
    for (let c = 0; c < 20; c++) {
      const { x, table } = randomPoolTable(kind, rng, 30);
      const h = tablesHessian([table], x.length / 3, x);
      const size = x.length;
      for (let r = 0; r < size; r++) {
        for (let s = r + 1; s < size; s++) expect(h[r * size + s]).toBe(h[s * size + r]);
      }
    }
  });

  it('calls sink.add once per ordered pair of its slots, in order, for every term', () => {
    const rng = createRandom(7300 + n);
    const { x, table } = randomPoolTable(kind, rng, 7);
    const calls: number[] = [];
    const recorder: HessianSink = { add: (a, b) => void calls.push(a, b) };
    const { slots } = HESSIAN_KERNELS[kind];
    HESSIAN_KERNELS[kind].accumulate(x, table, recorder);
    const expected: number[] = [];
    for (let t = 0; t < table.count; t++) {
      for (const s of slots) for (const u of slots) expected.push(table.atoms[t * table.arity + s], table.atoms[t * table.arity + u]);
    }
    expect(calls).toEqual(expected);
  });

  it('a many-term table gives the sum of its one-term tables', () => {
    const rng = createRandom(7400 + n);
    for (let c = 0; c < 10; c++) {
      const { x, table } = randomPoolTable(kind, rng, 25);
      const whole = tablesHessian([table], x.length / 3, x);
      const sum = new Float64Array(whole.length);
      for (let t = 0; t < table.count; t++) {
        const one = oneRow(table, t);
        const part = tablesHessian([one], x.length / 3, x);
        for (let e = 0; e < sum.length; e++) sum[e] += part[e];
      }
      expect(relativeError(whole, sum)).toBeLessThanOrEqual(1e-14);
    }
  });

  if (INVARIANT.includes(kind)) {
    it('translation: every block row sums to zero (Σ_b H_ab = 0)', () => {
      const rng = createRandom(7500 + n);
      for (let c = 0; c < 200; c++) {
        const { x, params } = CASES[kind](rng);
        const h = analytic(singleTerm(kind, params), x);
        const size = x.length;
        const scale = maxAbs(h);
        for (let r = 0; r < size; r++) {
          for (let q = 0; q < 3; q++) {
            let sum = 0;
            for (let b = 0; b < size / 3; b++) sum += h[r * size + 3 * b + q];
            // cancellation of ≤ 4 entries of size ≤ scale: a few ε·scale
            expect(Math.abs(sum), `case ${c}, row ${r}`).toBeLessThanOrEqual(1e-13 * scale);
          }
        }
      }
    });

    it('rotation: H·(ω × x) = ω × g for every ω (derivative of g·(ω × x) = 0)', () => {
      const rng = createRandom(7600 + n);
      for (let c = 0; c < 200; c++) {
        const { x, params } = CASES[kind](rng);
        const table = singleTerm(kind, params);
        const h = analytic(table, x);
        const g = gradientOf(table, x);
        const omega = rng.unitVector();
        const left = matVec(h, rotate(omega, x));
        const right = rotate(omega, g);
        const allowed = 1e-13 * (maxAbs(h) * maxAbs(x) * x.length + maxAbs(g));
        for (let e = 0; e < x.length; e++) {
          expect(Math.abs(left[e] - right[e]), `case ${c}, entry ${e}`).toBeLessThanOrEqual(allowed);
        }
      }
    });
  }
});

describe('HESSIAN_KERNELS', () => {
  it('has a kernel for every kind, with slots inside the kind’s atoms', () => {
    for (const kind of TERM_KINDS) {
      const { slots } = HESSIAN_KERNELS[kind];
      const { arity } = KIND_LAYOUTS[kind];
      expect(slots.length).toBe(kind === 'urey-bradley' ? 2 : arity);
      for (const s of slots) expect(s).toBeLessThan(arity);
    }
    expect(Object.keys(HESSIAN_KERNELS).sort()).toEqual([...TERM_KINDS].sort());
    expect(HESSIAN_KERNELS['urey-bradley'].slots).toEqual([0, 2]);
  });

  it('an empty table adds nothing', () => {
    for (const kind of TERM_KINDS) {
      const h = tablesHessian([makeTable(kind, [])], 4, new Float64Array(12).fill(1));
      expect(maxAbs(h)).toBe(0);
    }
  });

  it('every kind in one system: the Hessian of the sum is the sum of the Hessians', () => {
    const rng = createRandom(7700);
    const coordinates: number[] = [];
    const tables = TERM_KINDS.map((kind) => {
      const { x, params } = CASES[kind](rng);
      const first = coordinates.length / 3;
      coordinates.push(...x);
      return makeTable(kind, [{ atoms: Array.from({ length: x.length / 3 }, (_, a) => first + a), params }]);
    });
    const x = new Float64Array(coordinates);
    const all = tablesHessian(tables, x.length / 3, x);
    const sum = new Float64Array(all.length);
    for (const table of tables) {
      const part = tablesHessian([table], x.length / 3, x);
      for (let e = 0; e < sum.length; e++) sum[e] += part[e];
    }
    expect(relativeError(all, sum)).toBeLessThanOrEqual(1e-15);
  });
});

/** A one-term table holding row t of `table`. */
function oneRow(table: TermTable, t: number): TermTable {
  return makeTable(table.kind, [
    {
      atoms: Array.from(table.atoms.subarray(t * table.arity, (t + 1) * table.arity)),
      params: Array.from(table.params.subarray(t * table.width, (t + 1) * table.width)),
    },
  ]);
}
