/**
 * The in-memory model: a validated model file compiled into term tables,
 * with `energy`, `breakdown` and `toJSON`.
 * @module
 */
import { standardAtomicWeight } from '../elements.js';
import { accumulateAll, KERNELS } from '../terms/kernels.js';
import {
  accumulateNonbonded,
  NONBONDED_COULOMB,
  NONBONDED_LENNARD_JONES,
  type NonbondedPairs,
} from '../terms/nonbonded.js';
import type { TermKind, TermTable } from '../terms/table.js';
import type { Units } from '../units.js';
import { compileTerms, type CompiledTable } from './compile.js';
import { isNonbondedKind, type EnergyKind } from './kinds.js';
import { compileNonbonded } from './nonbonded.js';
import type { ModelFile } from './schema.js';
import { readModelFile } from './validate.js';

/** One atom as the model holds it (defaults filled in). */
export interface ModelAtom {
  /** Chemical symbol, as in the periodic table (`C`, `Cl`). */
  readonly element: string;
  /** Name from the file, or `''`. */
  readonly name: string;
  /** Mass in dalton (the file's, or the element's standard atomic weight). */
  readonly mass: number;
  /** Charge in elementary charges (default 0). */
  readonly charge: number;
  /** Type label from the file, or `''`. */
  readonly type: string;
}

/** Energy per kind at one geometry, in the model's energy unit. */
export interface EnergyBreakdown {
  /** The sum of `byKind`. */
  readonly total: number;
  /**
   * Kind → energy, for every kind the model has (in the order of
   * {@link Model.kinds}): its term kinds, then `lennard-jones` and `coulomb`
   * when its `nonbonded` block gives them.
   */
  readonly byKind: Readonly<Partial<Record<EnergyKind, number>>>;
}

/**
 * Read, validate and compile a model file.
 *
 * @param input - the model file as JSON text, or as an already-parsed object
 *   (which is validated just the same and deep-copied).
 * @returns the compiled {@link Model}.
 * @throws {@link ModelError} naming the place of the first problem
 *   (`terms[12].atoms[2]: index 40 is out of range (model has 31 atoms)`);
 *   nothing is half-loaded.
 */
export function parseModel(input: string | unknown): Model {
  return new Model(readModelFile(input));
}

/**
 * A compiled model. Create it with {@link parseModel}. Immutable: energies
 * are functions of the coordinates you pass, which are never modified.
 */
export class Model {
  /** The model's units; every energy, length and force is in these. */
  readonly units: Units;
  /** Number of atoms N; coordinate arrays have length 3N. */
  readonly atomCount: number;
  /** The atoms, with defaults filled in. */
  readonly atoms: readonly ModelAtom[];
  /** Masses in dalton, one per atom. */
  readonly masses: Float64Array;
  /** One table per kind present, in summing order (see `TERM_KINDS`). */
  readonly tables: readonly TermTable[];
  /**
   * The kinds the model reports energies for: first the kind of each of
   * {@link tables}, in that order, then `lennard-jones` and `coulomb` when
   * the `nonbonded` block gives them (each even when it is zero everywhere).
   */
  readonly kinds: readonly EnergyKind[];
  /** The compiled nonbonded pairs, or null when the model has no `lennardJones` or `coulomb`. */
  readonly nonbonded: NonbondedPairs | null;
  /** Atoms that a minimizer must not move (sorted, distinct). */
  readonly frozen: Int32Array;

  readonly #file: ModelFile;
  readonly #coordinates: Float64Array;
  readonly #sources: readonly Int32Array[];
  /** Energies per nonbonded kind of the last evaluation (scratch, so that `energy` allocates nothing). */
  readonly #parts = new Float64Array(2);

  /** Compile an already-validated model file (use {@link parseModel} for untrusted input). */
  constructor(file: ModelFile) {
    this.#file = file;
    this.units = { length: file.units.length, energy: file.units.energy };
    this.atomCount = file.atoms.length;
    this.atoms = file.atoms.map((a) => ({
      element: a.element,
      name: a.name ?? '',
      mass: a.mass ?? (standardAtomicWeight(a.element) as number),
      charge: a.charge ?? 0,
      type: a.type ?? '',
    }));
    this.masses = Float64Array.from(this.atoms, (a) => a.mass);
    const x = new Float64Array(3 * this.atomCount);
    file.coordinates.forEach((row, a) => {
      x[3 * a] = row[0];
      x[3 * a + 1] = row[1];
      x[3 * a + 2] = row[2];
    });
    this.#coordinates = x;
    const compiled: CompiledTable[] = compileTerms(file.terms);
    this.tables = compiled.map((c) => c.table);
    this.#sources = compiled.map((c) => c.source);
    const nonbonded = compileNonbonded(file);
    this.nonbonded = nonbonded?.pairs ?? null;
    this.kinds = [...this.tables.map((t) => t.kind), ...(nonbonded?.kinds ?? [])];
    this.frozen = Int32Array.from([...(file.frozen ?? [])].sort((a, b) => a - b));
  }

  /** The model's title, or `''`. */
  get title(): string {
    return this.#file.title ?? '';
  }

  /** Number of terms over all kinds. */
  get termCount(): number {
    return this.#file.terms.length;
  }

  /** The coordinates of the file, as a fresh flat `Float64Array` of length 3N. */
  get coordinates(): Float64Array {
    return this.#coordinates.slice();
  }

  /**
   * Total energy at `x` (flat, length 3N, the model's length unit), in the
   * model's energy unit. When `gradient` (length 3N) is given it is
   * overwritten with dE/dx (energy per length). Never allocates, never
   * throws, never modifies `x`; arrays of the wrong length give meaningless
   * numbers (check `x.length === 3 * model.atomCount` at your boundary).
   * Includes the nonbonded pairs when the model has them (a counted pair of
   * coincident atoms makes it +Infinity; see `src/terms/nonbonded.ts`).
   */
  energy(x: Float64Array, gradient?: Float64Array): number {
    const bonded = accumulateAll(x, this.tables, gradient);
    return this.nonbonded === null ? bonded : bonded + accumulateNonbonded(x, this.nonbonded, gradient);
  }

  /**
   * Energy of one kind alone at `x` (0 for a kind the model does not have).
   * When `gradient` is given it is overwritten with that kind's dE/dx.
   * Never allocates, never throws.
   */
  kindEnergy(kind: EnergyKind, x: Float64Array, gradient?: Float64Array): number {
    if (gradient !== undefined) gradient.fill(0);
    if (isNonbondedKind(kind)) {
      if (this.nonbonded === null) return 0;
      const include = kind === 'lennard-jones' ? NONBONDED_LENNARD_JONES : NONBONDED_COULOMB;
      return accumulateNonbonded(x, this.nonbonded, gradient, undefined, include);
    }
    let e = 0;
    for (const table of this.tables) if (table.kind === kind) e += KERNELS[kind](x, table, gradient);
    return e;
  }

  /** Energy per kind at `x` (allocates a small result object). */
  breakdown(x: Float64Array): EnergyBreakdown {
    const byKind: Partial<Record<EnergyKind, number>> = {};
    let total = 0;
    for (const table of this.tables) {
      const e = KERNELS[table.kind](x, table);
      byKind[table.kind] = e;
      total += e;
    }
    if (this.nonbonded !== null) {
      const parts = this.#parts;
      // Summed as `energy` sums, so that total and energy(x) agree to the bit.
      total += accumulateNonbonded(x, this.nonbonded, undefined, parts);
      if (this.nonbonded.hasLennardJones) byKind['lennard-jones'] = parts[0];
      if (this.nonbonded.hasCoulomb) byKind.coulomb = parts[1];
    }
    return { total, byKind };
  }

  /**
   * Energy of every term at `x`: one `Float64Array` per table (same order as
   * {@link tables}), entry `t` the energy of row `t`. Nonbonded pairs are
   * not terms and are not included (see {@link breakdown} for their sums).
   */
  termEnergies(x: Float64Array): Float64Array[] {
    return this.tables.map((table) => {
      const out = new Float64Array(table.count);
      KERNELS[table.kind](x, table, undefined, out);
      return out;
    });
  }

  /** For table `tableIndex`, the index in the file's `terms` of each row. */
  termSource(tableIndex: number): Int32Array {
    return this.#sources[tableIndex];
  }

  /**
   * The model as a model-file object (a deep copy, ready for
   * `JSON.stringify`), with coordinates from `x` when given. Parameters are
   * written exactly as read (degrees stay the numbers given), so a model
   * saved and read again is the same model.
   */
  toJSON(x?: Float64Array): ModelFile {
    const copy = structuredClone(this.#file) as ModelFile;
    if (x !== undefined) {
      copy.coordinates = copy.coordinates.map((_, a) => [x[3 * a], x[3 * a + 1], x[3 * a + 2]]) as ModelFile['coordinates'];
    }
    return copy;
  }
}
