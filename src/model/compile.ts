/**
 * Turning validated term records (file units, degrees) into term tables
 * (flat arrays, radians). This is the only place degrees become radians.
 * @module
 */
import type { TermRecord } from './schema.js';
import { createTable, KIND_LAYOUTS, TERM_KINDS, type TermKind, type TermTable } from '../terms/table.js';

const RADIANS_PER_DEGREE = Math.PI / 180;

/**
 * cos of an angle in degrees, exact (0, ±1) at whole multiples of 90°, where
 * Math.cos of the radian value is off by rounding (cos(π/2) ≈ 6e-17).
 */
function cosDegrees(deg: number): number {
  return sinDegrees(deg + 90);
}

/** sin of an angle in degrees, exact at whole multiples of 90°. */
function sinDegrees(deg: number): number {
  const r = ((deg % 360) + 360) % 360;
  if (r === 0) return 0;
  if (r === 90) return 1;
  if (r === 180) return 0;
  if (r === 270) return -1;
  return Math.sin(deg * RADIANS_PER_DEGREE);
}

/** A compiled table with, for each row, the index of its record in `terms[]`. */
export interface CompiledTable {
  readonly table: TermTable;
  /** `source[t]` is the index in the file's `terms` of row `t`. */
  readonly source: Int32Array;
}

/**
 * Write the internal parameters of one record into `out` at `offset`, in the
 * layout of {@link KIND_LAYOUTS} (angles converted from degrees to radians;
 * `cosine-angle` stores cos θ0, `periodic-dihedral` cos and sin of its phase; `position-restraint` `flat` defaults to 0;
 * `cosine-series-angle` and `inversion` store k C0, k C1, k C2 (see
 * {@link cosineSeriesCoefficients}; an inversion with ω0 = 0 has C = [1, −1, 0]);
 * `periodic-angle` stores k/n², n and cos(n θ0) = ±1).
 */
export function writeParameters(term: TermRecord, out: Float64Array, offset: number): void {
  switch (term.kind) {
    case 'harmonic-bond':
      out[offset] = term.k;
      out[offset + 1] = term.r0;
      return;
    case 'morse-bond':
      out[offset] = term.D;
      out[offset + 1] = term.a;
      out[offset + 2] = term.r0;
      return;
    case 'harmonic-angle':
      out[offset] = term.k;
      out[offset + 1] = term.theta0 * RADIANS_PER_DEGREE;
      return;
    case 'cosine-angle':
      out[offset] = term.k;
      out[offset + 1] = cosDegrees(term.theta0);
      return;
    case 'urey-bradley':
      out[offset] = term.k;
      out[offset + 1] = term.s0;
      return;
    case 'periodic-dihedral':
      out[offset] = term.k;
      out[offset + 1] = term.n;
      out[offset + 2] = cosDegrees(term.phase);
      out[offset + 3] = sinDegrees(term.phase);
      return;
    case 'ryckaert-bellemans':
      for (let m = 0; m < 6; m++) out[offset + m] = term.c[m];
      return;
    case 'harmonic-improper':
      out[offset] = term.k;
      out[offset + 1] = term.xi0 * RADIANS_PER_DEGREE;
      return;
    case 'position-restraint':
      out[offset] = term.k;
      out[offset + 1] = term.x0[0];
      out[offset + 2] = term.x0[1];
      out[offset + 3] = term.x0[2];
      out[offset + 4] = term.flat ?? 0;
      return;
    case 'distance-restraint':
      out[offset] = term.k;
      out[offset + 1] = term.lower;
      out[offset + 2] = term.upper;
      return;
    case 'cosine-series-angle': {
      const [c0, c1, c2] = cosineSeriesCoefficients(term.theta0);
      out[offset] = term.k * c0;
      out[offset + 1] = term.k * c1;
      out[offset + 2] = term.k * c2;
      return;
    }
    case 'periodic-angle':
      out[offset] = term.k / (term.n * term.n);
      out[offset + 1] = term.n;
      // cos(n θ0) for θ0 a whole multiple of 180°/n (checked when reading): exactly ±1
      out[offset + 2] = Math.round((term.n * term.theta0) / 180) % 2 === 0 ? 1 : -1;
      return;
    case 'inversion': {
      const [c0, c1, c2] = term.omega0 === 0 ? [1, -1, 0] : cosineSeriesCoefficients(term.omega0);
      out[offset] = term.k * c0;
      out[offset + 1] = term.k * c1;
      out[offset + 2] = term.k * c2;
      return;
    }
  }
}

/**
 * The coefficients [C0, C1, C2] of C0 + C1 cos θ + C2 cos 2θ with its minimum
 * (zero) at θ0 and curvature 1 there: C2 = 1/(4 sin²θ0), C1 = −4 C2 cos θ0,
 * C0 = C2 (2 cos²θ0 + 1) (the general angle form of Rappé et al., J. Am.
 * Chem. Soc. 114 (1992) 10024, scaled so that E''(θ0) = 1). θ0 in degrees,
 * strictly between 0 and 180.
 */
export function cosineSeriesCoefficients(theta0Degrees: number): [number, number, number] {
  const c = cosDegrees(theta0Degrees);
  const s = sinDegrees(theta0Degrees);
  const c2 = 1 / (4 * s * s);
  return [c2 * (2 * c * c + 1), c === 0 ? 0 : -4 * c2 * c, c2];
}

/**
 * One table per kind present in `terms`, in the order of {@link TERM_KINDS}
 * (kinds with no terms are left out). Records must already be validated.
 */
export function compileTerms(terms: readonly TermRecord[]): CompiledTable[] {
  const counts = new Map<TermKind, number>();
  for (const term of terms) counts.set(term.kind, (counts.get(term.kind) ?? 0) + 1);
  const compiled: CompiledTable[] = [];
  for (const kind of TERM_KINDS) {
    const count = counts.get(kind);
    if (count === undefined) continue;
    const table = createTable(kind, count);
    const source = new Int32Array(count);
    const { arity, columns } = KIND_LAYOUTS[kind];
    let row = 0;
    terms.forEach((term, index) => {
      if (term.kind !== kind) return;
      for (let a = 0; a < arity; a++) table.atoms[row * arity + a] = term.atoms[a];
      writeParameters(term, table.params, row * columns.length);
      source[row] = index;
      row++;
    });
    compiled.push({ table, source });
  }
  return compiled;
}

/**
 * Build a table of one kind from term records written as in the model file
 * (file units, angles in degrees), without a model: for code that makes its
 * own terms. The records are not validated here; pass well-formed ones.
 */
export function tableFromRecords<K extends TermKind>(
  kind: K,
  records: readonly Omit<Extract<TermRecord, { kind: K }>, 'kind'>[],
): TermTable {
  const terms = records.map((r) => ({ ...r, kind }) as unknown as TermRecord);
  const compiled = compileTerms(terms);
  return compiled.length > 0 ? compiled[0].table : createTable(kind, 0);
}
