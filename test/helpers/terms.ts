/**
 * Helpers to build term tables by hand and to call kernels the way
 * `checkGradient` expects (gradient overwritten, not added to).
 */
import { expect } from 'vitest';
import { KERNELS } from '../../src/terms/kernels.js';
import { createTable, KIND_LAYOUTS } from '../../src/terms/table.js';
import type { TermKind, TermTable } from '../../src/terms/table.js';
import { checkGradient, gradientMatchers } from '../../src/testing/index.js';
import type { EnergyFunction, GradientCheck, GradientCheckOptions } from '../../src/testing/index.js';

expect.extend(gradientMatchers);

/** One row of a table: its atom indices and internal parameters (see KIND_LAYOUTS). */
export interface Row {
  readonly atoms: readonly number[];
  readonly params: readonly number[];
}

/** A table of `kind` holding `rows`, checked against the kind's layout. */
export function makeTable(kind: TermKind, rows: readonly Row[]): TermTable {
  const { arity, columns } = KIND_LAYOUTS[kind];
  const table = createTable(kind, rows.length);
  rows.forEach((row, t) => {
    if (row.atoms.length !== arity || row.params.length !== columns.length) {
      throw new Error(`makeTable(${kind}): row ${t} needs ${arity} atoms and ${columns.length} params`);
    }
    table.atoms.set(row.atoms, t * arity);
    table.params.set(row.params, t * columns.length);
  });
  return table;
}

/** A one-term table of `kind` on atoms 0, 1, … (arity − 1). */
export function singleTerm(kind: TermKind, params: readonly number[]): TermTable {
  const atoms = Array.from({ length: KIND_LAYOUTS[kind].arity }, (_, a) => a);
  return makeTable(kind, [{ atoms, params }]);
}

/**
 * Internal parameters of a periodic dihedral k [1 + cos(n φ − phase)] (phase
 * in radians), in the layout of KIND_LAYOUTS: [k, n, cos phase, sin phase].
 */
export function periodicDihedralParams(k: number, n: number, phase: number): number[] {
  return [k, n, Math.cos(phase), Math.sin(phase)];
}

/** The table's kernel as an {@link EnergyFunction}: the gradient is zeroed, then accumulated. */
export function energyFunction(table: TermTable): EnergyFunction {
  const kernel = KERNELS[table.kind];
  return (x, gradient) => {
    if (gradient !== undefined) gradient.fill(0);
    return kernel(x, table, gradient);
  };
}

/** Energy and gradient (from zero) of one table at `x`. */
export function evaluate(table: TermTable, x: Float64Array): { energy: number; gradient: Float64Array } {
  const gradient = new Float64Array(x.length);
  const energy = KERNELS[table.kind](x, table, gradient);
  return { energy, gradient };
}

/** `checkGradient` of the table's kernel at `x`. */
export function checkTerm(table: TermTable, x: Float64Array, options?: GradientCheckOptions): GradientCheck {
  return checkGradient(energyFunction(table), x, options);
}

/** Whether every entry is finite. */
export function allFinite(values: ArrayLike<number>): boolean {
  for (let n = 0; n < values.length; n++) if (!Number.isFinite(values[n])) return false;
  return true;
}

/**
 * Prints `label: value` when the environment variable STRAINWISE_TEST_REPORT
 * is set, so the worst errors of a run can be read off; silent otherwise.
 */
export function report(label: string, value: number): void {
  if (process.env.STRAINWISE_TEST_REPORT) console.log(`[report] ${label}: ${value.toExponential(2)}`);
}
