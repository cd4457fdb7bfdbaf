/**
 * The kernel registry and accumulateAll of src/terms/kernels.ts.
 */
import { describe, expect, it } from 'vitest';
import {
  accumulateCosineAngles,
  accumulateCosineSeriesAngles,
  accumulateHarmonicAngles,
  accumulatePeriodicAngles,
} from '../../src/terms/angle.js';
import { accumulateInversions } from '../../src/terms/inversion.js';
import { accumulateHarmonicBonds, accumulateMorseBonds, accumulateUreyBradley } from '../../src/terms/bond.js';
import { accumulateAll, KERNELS } from '../../src/terms/kernels.js';
import { accumulateDistanceRestraints, accumulatePositionRestraints } from '../../src/terms/restraint.js';
import { createTable, KIND_LAYOUTS, TERM_KINDS } from '../../src/terms/table.js';
import type { TermTable } from '../../src/terms/table.js';
import { accumulateHarmonicImpropers, accumulatePeriodicDihedrals, accumulateRyckaertBellemans } from '../../src/terms/torsion.js';
import { checkGradient, formatGradientCheck } from '../../src/testing/index.js';
import { CASES } from '../helpers/cases.js';
import { maxAbs } from '../helpers/geometry.js';
import { randomPoolTable } from '../helpers/properties.js';
import { createRandom } from '../helpers/random.js';
import type { Random } from '../helpers/random.js';
import { evaluate, makeTable, report } from '../helpers/terms.js';
import type { Row } from '../helpers/terms.js';

/**
 * One to three random terms of every kind, each on atoms of its own
 * (coordinates of the cases laid end to end), in one table per kind.
 */
function mixedSystem(rng: Random): { x: Float64Array; tables: TermTable[] } {
  const coordinates: number[] = [];
  const tables = TERM_KINDS.map((kind) => {
    const rows: Row[] = [];
    for (let t = rng.int(1, 3); t > 0; t--) {
      const { x, params } = CASES[kind](rng);
      const first = coordinates.length / 3;
      coordinates.push(...x);
      rows.push({ atoms: Array.from({ length: x.length / 3 }, (_, a) => first + a), params });
    }
    return makeTable(kind, rows);
  });
  return { x: new Float64Array(coordinates), tables };
}

describe('KERNELS', () => {
  it('has exactly one kernel per term kind, the one exported for it', () => {
    expect(Object.keys(KERNELS).sort()).toEqual([...TERM_KINDS].sort());
    expect(KERNELS).toEqual({
      'harmonic-bond': accumulateHarmonicBonds,
      'morse-bond': accumulateMorseBonds,
      'harmonic-angle': accumulateHarmonicAngles,
      'cosine-angle': accumulateCosineAngles,
      'urey-bradley': accumulateUreyBradley,
      'periodic-dihedral': accumulatePeriodicDihedrals,
      'ryckaert-bellemans': accumulateRyckaertBellemans,
      'harmonic-improper': accumulateHarmonicImpropers,
      'position-restraint': accumulatePositionRestraints,
      'distance-restraint': accumulateDistanceRestraints,
      'cosine-series-angle': accumulateCosineSeriesAngles,
      'periodic-angle': accumulatePeriodicAngles,
      inversion: accumulateInversions,
    });
  });

  it('createTable makes zero-filled tables of the layout’s arity and width', () => {
    for (const kind of TERM_KINDS) {
      const table = createTable(kind, 7);
      const { arity, columns } = KIND_LAYOUTS[kind];
      expect(table).toMatchObject({ kind, count: 7, arity, width: columns.length });
      expect(table.atoms.length).toBe(7 * arity);
      expect(table.params.length).toBe(7 * columns.length);
      expect(table.atoms.every((a) => a === 0) && table.params.every((p) => p === 0)).toBe(true);
    }
  });

  it('arity matches the atoms each kind acts on', () => {
    const arity = Object.fromEntries(TERM_KINDS.map((kind) => [kind, KIND_LAYOUTS[kind].arity]));
    expect(arity).toEqual({
      'harmonic-bond': 2,
      'morse-bond': 2,
      'harmonic-angle': 3,
      'cosine-angle': 3,
      'urey-bradley': 3,
      'periodic-dihedral': 4,
      'ryckaert-bellemans': 4,
      'harmonic-improper': 4,
      'position-restraint': 1,
      'distance-restraint': 2,
      'cosine-series-angle': 3,
      'periodic-angle': 3,
      inversion: 4,
    });
  });
});

describe('accumulateAll', () => {
  it('returns the sum of the kernels and OVERWRITES the gradient with the sum of theirs', () => {
    const rng = createRandom(1101);
    for (let n = 0; n < 50; n++) {
      const { x, tables } = mixedSystem(rng);
      let energy = 0;
      const expected = new Float64Array(x.length);
      for (const table of tables) energy += KERNELS[table.kind](x, table, expected);
      const gradient = new Float64Array(x.length).fill(Number.NaN);
      expect(accumulateAll(x, tables, gradient)).toBe(energy);
      expect(Array.from(gradient)).toEqual(Array.from(expected));
      expect(accumulateAll(x, tables)).toBe(energy);
    }
  });

  it(`is itself a correct energy function: checkGradient on 300 random mixed systems (every kind), maxRelError ≤ 1e-9`, () => {
    const rng = createRandom(1102);
    let worst = 0;
    for (let n = 0; n < 300; n++) {
      const { x, tables } = mixedSystem(rng);
      const result = checkGradient((y, g) => accumulateAll(y, tables, g), x, { tolerance: 1e-9 });
      worst = Math.max(worst, result.maxRelError);
      expect(result.ok, `system ${n}\n${formatGradientCheck(result)}`).toBe(true);
    }
    report('accumulateAll mixed systems worst maxRelError', worst);
  });

  it('with no tables, or only empty ones, returns 0 and zeroes the gradient', () => {
    const x = new Float64Array([1, 2, 3, 4, 5, 6]);
    const gradient = new Float64Array(6).fill(9);
    expect(accumulateAll(x, [], gradient)).toBe(0);
    expect(Array.from(gradient)).toEqual([0, 0, 0, 0, 0, 0]);
    gradient.fill(9);
    const empty = TERM_KINDS.map((kind) => createTable(kind, 0));
    expect(accumulateAll(x, empty, gradient)).toBe(0);
    expect(Array.from(gradient)).toEqual([0, 0, 0, 0, 0, 0]);
    expect(accumulateAll(x, [])).toBe(0);
  });

  it('tables of one kind may share atoms with tables of others; listing a table twice counts it twice', () => {
    const rng = createRandom(1103);
    const pool = randomPoolTable('harmonic-angle', rng, 10);
    const bonds = randomPoolTable('harmonic-bond', rng, 10).table;
    const { x } = pool;
    const once = accumulateAll(x, [pool.table, bonds]);
    const twice = new Float64Array(x.length);
    expect(accumulateAll(x, [pool.table, bonds, pool.table, bonds], twice)).toBeCloseTo(2 * once, 9);
    const single = evaluate(pool.table, x).gradient;
    const bondGradient = evaluate(bonds, x).gradient;
    const scale = Math.max(1, maxAbs(twice));
    for (let c = 0; c < x.length; c++) expect(Math.abs(twice[c] - 2 * (single[c] + bondGradient[c]))).toBeLessThanOrEqual(1e-13 * scale);
  });
});
