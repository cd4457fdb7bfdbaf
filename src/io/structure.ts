/**
 * The structure of a small molecule as read from a PDB, XYZ or SDF/MOL file:
 * the shared shape every reader returns and every writer takes, its error
 * type, and the small parsing helpers the readers share.
 *
 * See docs/structure-files.md for what each format reads and writes.
 * @module
 */
import { ELEMENT_SYMBOLS, isElement } from '../elements.js';

/** One atom of a PDB file: the fields of its ATOM/HETATM record that are not in {@link Structure}. */
export interface PdbAtomRecord {
  /** `ATOM` or `HETATM`. */
  record: 'ATOM' | 'HETATM';
  /** Atom serial number (columns 7-11). */
  serial: number;
  /** Columns 13-16 exactly as read (the name with its alignment); the writer uses it while its trimmed text is still the atom's name. */
  nameField: string;
  /** Alternate location indicator (column 17), `''` when blank. */
  altLoc: string;
  /** Residue name (columns 18-20), trimmed. */
  residueName: string;
  /** Chain identifier (column 22), `''` when blank. */
  chain: string;
  /** Residue sequence number (columns 23-26), `null` when blank. */
  residueNumber: number | null;
  /** Code for insertion of residues (column 27), `''` when blank. */
  insertionCode: string;
  /** Occupancy (columns 55-60), `null` when blank. */
  occupancy: number | null;
  /** Temperature factor (columns 61-66), `null` when blank. */
  bFactor: number | null;
  /** Segment identifier (columns 73-76, a PDB v2 field kept for round trips), trimmed. */
  segment: string;
}

/** What a PDB model keeps beyond {@link Structure}. */
export interface PdbRecord {
  format: 'pdb';
  /** The HEADER line as read (trailing blanks removed), or `null` when there was none. */
  header: string | null;
  /** The MODEL serial number, or `null` when the file has no MODEL records. */
  modelNumber: number | null;
  /** One entry per atom (same order as the atoms). */
  atoms: PdbAtomRecord[];
  /** Indices of the atoms a TER record followed, ascending. */
  terAfter: number[];
}

/** What an XYZ frame keeps beyond {@link Structure}. */
export interface XyzRecord {
  format: 'xyz';
  /** The comment line as read (line breaks removed); the title is this line trimmed. */
  comment: string;
  /** Per atom, the text after the z coordinate (extra columns), trimmed; `''` when none. */
  atomTails: string[];
}

/** One atom of an SDF/MOL record: atom-block fields not in {@link Structure}. */
export interface SdfAtomRecord {
  /** Mass difference from the element's usual mass (columns 35-36, −3 … +4). */
  massDifference: number;
  /** Charge code 4 ("doublet radical") in the atom block, counted only when no `M  CHG`/`M  RAD` line is present. */
  radical: boolean;
  /** Columns 40-69 as read (stereo parity, hydrogen count, stereo care, valence, …), trailing blanks removed. */
  stereoFields: string;
}

/** One bond of an SDF/MOL record: bond-block fields not in {@link Structure}. */
export interface SdfBondRecord {
  /** First atom as written in the file (0-based); the wedge of a stereo bond starts here. */
  from: number;
  /** Second atom as written in the file (0-based). */
  to: number;
  /** Bond stereo (columns 10-12): 0, or 1/4/6 for single bonds, 3 for double bonds. */
  stereo: number;
  /** Columns 13-21 as read (unused field, bond topology, reacting centre), trailing blanks removed. */
  trailing: string;
  /** Position of the bond in the file's bond block (0-based); the writer keeps that order. */
  fileIndex: number;
}

/** One data item of an SDF record: a `>` header line and its value lines. */
export interface SdfDataItem {
  /** The field name between `<` and `>` in the header, `''` when it has none. */
  name: string;
  /** The header line as read (trailing blanks removed). */
  header: string;
  /** The value, one string per line (none when the value is empty). */
  lines: string[];
}

/** What an SDF/MOL record keeps beyond {@link Structure}. */
export interface SdfRecord {
  format: 'sdf';
  /** The three header lines as read (trailing blanks removed); the title is the first, trimmed. */
  headerLines: [string, string, string];
  /** Chiral flag of the counts line (columns 13-15): 0 or 1. */
  chiralFlag: number;
  /** One entry per atom. */
  atoms: SdfAtomRecord[];
  /** One entry per bond, in the order of {@link Structure.bonds}. */
  bonds: SdfBondRecord[];
  /** Whether the record gave charges in `M  CHG` lines and some atom is charged (the writer then writes `M  CHG` lines again). */
  chargeLines: boolean;
  /** The structural-text lines (2 per entry of the counts line's sss). */
  structuralText: string[];
  /** Property-block lines kept as read (`M  ISO`, `M  RAD`, `A  `, `V  `, …), without `M  CHG` and `M  END`. */
  properties: string[];
  /** The data items after `M  END`, in order. */
  dataItems: SdfDataItem[];
}

/** Fields every structure has, whatever file it came from. */
export interface StructureBase {
  /** The title (PDB TITLE or HEADER, XYZ comment line, SDF first header line), trimmed; `''` if none. */
  title: string;
  /** Element symbols in periodic-table case (`C`, `Cl`), one per atom. */
  elements: string[];
  /** Atom names (PDB columns 13-16, trimmed), `''` where the format has none. */
  names: string[];
  /** Formal charge per atom in elementary charges, 0 where none is given. */
  formalCharges: Int32Array;
  /** Coordinates in ångström, flat `[x0, y0, z0, x1, …]`, length 3N. */
  coordinates: Float64Array;
  /** Bonded pairs, `2 × B`, 0-based, smaller index first, sorted by pair; `null` when the file gives no bonds. */
  bonds: Int32Array | null;
  /** Per bond (same order as `bonds`): 1, 2, 3, or 1.5 for aromatic; `null` when the file gives no orders (PDB CONECT). */
  bondOrders: Float64Array | null;
  /** What the reader decided and the user should know, one sentence each, starting with the line where it applies. */
  notes: string[];
}

/** A structure read from a PDB file (one MODEL). */
export interface PdbStructure extends StructureBase {
  format: 'pdb';
  record: PdbRecord;
}

/** A structure read from an XYZ file (one frame). */
export interface XyzStructure extends StructureBase {
  format: 'xyz';
  record: XyzRecord;
}

/** A structure read from an SDF or MOL file (one record). */
export interface SdfStructure extends StructureBase {
  format: 'sdf';
  record: SdfRecord;
}

/**
 * A small molecule as read from a structure file: the fields every format
 * has, plus `record`, the format-specific data the writer of the same format
 * needs to write the file back faithfully (discriminated by `format`).
 * Writers of another format ignore `record`.
 */
export type Structure = PdbStructure | XyzStructure | SdfStructure;

/**
 * A structure file broke a rule of its format.
 *
 * `line` is 1-based (0 when the whole input is at fault, e.g. empty input);
 * `field` names the field (`x`, `atom count`, `bond type`…, `''` when none);
 * `columns` are the 1-based first and last columns of the field when known.
 * `message` is the full one-line text, `PLACE: detail`, for example
 * `line 12, columns 31-38 (x): expected a number, got "1.2.3"`, or just the
 * detail when there is no line.
 */
export class StructureError extends Error {
  /** 1-based line number, 0 when no single line is at fault. */
  readonly line: number;
  /** The field at fault, `''` when none. */
  readonly field: string;
  /** 1-based first and last column of the field, or `null`. */
  readonly columns: readonly [number, number] | null;
  /** The place alone: `line 12, columns 31-38 (x)`, `line 4`, or `''`. */
  readonly place: string;
  /** The problem alone, without the place. */
  readonly detail: string;

  constructor(line: number, field: string, detail: string, columns: readonly [number, number] | null = null) {
    let place = '';
    if (line > 0) {
      place = `line ${line}`;
      if (columns) {
        const span = columns[0] === columns[1] ? `column ${columns[0]}` : `columns ${columns[0]}-${columns[1]}`;
        place += `, ${span}${field ? ` (${field})` : ''}`;
      }
    }
    super(place ? `${place}: ${detail}` : detail);
    this.name = 'StructureError';
    this.line = line;
    this.field = field;
    this.columns = columns;
    this.place = place;
    this.detail = detail;
  }
}

const DECIMAL = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;
const INTEGER = /^[+-]?\d+$/;

/** `text` as a finite decimal number (`1`, `-2.5`, `.5`, `1e-3`, `-0` stays −0), or `undefined`. Never throws. */
export function parseDecimal(text: string): number | undefined {
  if (!DECIMAL.test(text)) return undefined;
  const v = Number(text);
  return Number.isFinite(v) ? v : undefined;
}

/** Split text into lines (LF, CRLF or CR); a final line break does not start another line. */
export function splitLines(text: string): string[] {
  const lines = text.split(/\r\n|\n|\r/);
  if (lines.length > 0 && lines[lines.length - 1] === '') lines.pop();
  return lines;
}

/** Columns `first`..`last` (1-based, inclusive) of `line`, blanks where the line is short. */
export function columns(line: string, first: number, last: number): string {
  return line.slice(first - 1, last).padEnd(last - first + 1, ' ');
}

/**
 * The number in columns `first`..`last` of `line` (line number `lineNo`).
 * Throws {@link StructureError} `line L, columns a-b (field): expected a number, got "…"`.
 */
export function fixedNumber(line: string, lineNo: number, first: number, last: number, field: string): number {
  const text = columns(line, first, last).trim();
  const v = parseDecimal(text);
  if (v === undefined) throw new StructureError(lineNo, field, `expected a number, got "${text}"`, [first, last]);
  return v + 0; // −0 (as in "-0.000") becomes 0: fixed-width writers write 0 unsigned
}

/** Like {@link fixedNumber} but `null` for a blank field. */
export function fixedNumberOrNull(line: string, lineNo: number, first: number, last: number, field: string): number | null {
  return columns(line, first, last).trim() === '' ? null : fixedNumber(line, lineNo, first, last, field);
}

/**
 * The whole number in columns `first`..`last`; `blank` is returned for a blank
 * field when given, else a blank field is an error. Throws
 * {@link StructureError} `…: expected a whole number, got "…"`.
 */
export function fixedInteger(line: string, lineNo: number, first: number, last: number, field: string, blank?: number): number {
  const text = columns(line, first, last).trim();
  if (text === '' && blank !== undefined) return blank;
  if (!INTEGER.test(text)) throw new StructureError(lineNo, field, `expected a whole number, got "${text}"`, [first, last]);
  return Number(text) + 0;
}

const BY_UPPER: ReadonlyMap<string, string> = new Map(ELEMENT_SYMBOLS.map((s) => [s.toUpperCase(), s]));

/** The element symbol in periodic-table case for `symbol` in any case (`CL` → `Cl`), or `undefined`. Never throws. */
export function elementInAnyCase(symbol: string): string | undefined {
  return BY_UPPER.get(symbol.toUpperCase());
}

/**
 * Sort bonded pairs (0-based, any order within a pair) into the
 * {@link Structure.bonds} layout: smaller index first, sorted by pair.
 * Returns the flat pairs and `order`, where sorted bond k was input pair
 * `order[k]` (so per-bond data can follow). Does not check for duplicates.
 */
export function sortBonds(pairs: readonly (readonly [number, number])[]): { bonds: Int32Array; order: number[] } {
  const order = pairs.map((_, k) => k);
  const lo = (k: number) => Math.min(pairs[k][0], pairs[k][1]);
  const hi = (k: number) => Math.max(pairs[k][0], pairs[k][1]);
  order.sort((a, b) => lo(a) - lo(b) || hi(a) - hi(b));
  const bonds = new Int32Array(2 * pairs.length);
  order.forEach((k, i) => {
    bonds[2 * i] = lo(k);
    bonds[2 * i + 1] = hi(k);
  });
  return { bonds, order };
}

/**
 * The coordinates a writer should write: `coordinates` when given (checked
 * to be 3N finite numbers), else the structure's own.
 * Throws `RangeError` naming the atom and axis of a non-finite value, or the length.
 */
export function coordinatesToWrite(s: StructureBase, coordinates?: Float64Array): Float64Array {
  const x = coordinates ?? s.coordinates;
  const n = s.elements.length;
  if (x.length !== 3 * n) {
    throw new RangeError(`coordinates: expected 3N = ${3 * n} numbers, got ${x.length}`);
  }
  for (let i = 0; i < x.length; i++) {
    if (!Number.isFinite(x[i])) throw new RangeError(`atom ${Math.floor(i / 3) + 1} (${'xyz'[i % 3]}): ${x[i]} is not a finite number`);
  }
  return x;
}

/**
 * Check the parts of a structure every writer relies on: every element is a
 * periodic-table symbol, the per-atom arrays have N entries, bonds are in
 * range, and bond orders (when given) match the bonds. Throws `RangeError`
 * naming the atom or bond (1-based).
 */
export function checkStructureForWriting(s: StructureBase): void {
  const n = s.elements.length;
  if (n === 0) throw new RangeError('structure has no atoms');
  s.elements.forEach((e, a) => {
    if (!isElement(e)) throw new RangeError(`atom ${a + 1}: "${e}" is not an element symbol (periodic-table case, e.g. "Cl")`);
  });
  if (s.names.length !== n) throw new RangeError(`names: expected ${n} entries, got ${s.names.length}`);
  if (s.formalCharges.length !== n) throw new RangeError(`formalCharges: expected ${n} entries, got ${s.formalCharges.length}`);
  if (s.bonds) {
    if (s.bonds.length % 2 !== 0) throw new RangeError(`bonds: expected 2 × B indices, got ${s.bonds.length}`);
    for (let k = 0; k < s.bonds.length; k++) {
      const a = s.bonds[k];
      if (!(a >= 0 && a < n)) throw new RangeError(`bond ${(k >> 1) + 1}: atom index ${a} is out of range (structure has ${n} atoms)`);
    }
    for (let b = 0; 2 * b < s.bonds.length; b++) {
      if (s.bonds[2 * b] === s.bonds[2 * b + 1]) throw new RangeError(`bond ${b + 1}: joins atom ${s.bonds[2 * b] + 1} to itself`);
    }
    if (s.bondOrders && s.bondOrders.length !== s.bonds.length / 2) {
      throw new RangeError(`bondOrders: expected ${s.bonds.length / 2} entries, got ${s.bondOrders.length}`);
    }
  }
}

/** Options for {@link newStructure}. */
export interface NewStructureOptions {
  /** Title (default `''`). */
  title?: string;
  /** Atom names, one per atom (default all `''`). */
  names?: string[];
  /** Formal charges, one per atom (default all 0). */
  formalCharges?: Int32Array;
  /** Bonded pairs, 2 × B, 0-based, in any order (default `null`: no bonds given). */
  bonds?: Int32Array | null;
  /** Bond orders, one per pair of `bonds` (1, 2, 3 or 1.5; default `null`). */
  bondOrders?: Float64Array | null;
}

/**
 * A structure made in code rather than read (an XYZ-format structure with
 * no extra record data), e.g. to write it as PDB or SDF. Bonds are sorted
 * into the {@link Structure.bonds} layout (orders follow). Arrays are copied.
 * Throws `RangeError` for an element that is not a symbol, arrays of the
 * wrong length, bonds out of range or joining an atom to itself, and when the
 * coordinates are not 3N long.
 */
export function newStructure(elements: readonly string[], coordinates: Float64Array, options: NewStructureOptions = {}): XyzStructure {
  let bonds: Int32Array | null = null;
  let bondOrders: Float64Array | null = null;
  if (options.bonds) {
    if (options.bonds.length % 2 !== 0) throw new RangeError(`bonds: expected 2 × B indices, got ${options.bonds.length}`);
    if (options.bondOrders && options.bondOrders.length !== options.bonds.length / 2) {
      throw new RangeError(`bondOrders: expected ${options.bonds.length / 2} entries, got ${options.bondOrders.length}`);
    }
    const pairs: [number, number][] = [];
    for (let b = 0; 2 * b + 1 < options.bonds.length; b++) pairs.push([options.bonds[2 * b], options.bonds[2 * b + 1]]);
    const sorted = sortBonds(pairs);
    bonds = sorted.bonds;
    const orders = options.bondOrders;
    if (orders) bondOrders = Float64Array.from(sorted.order, (k) => orders[k]);
  }
  const s: XyzStructure = {
    title: options.title ?? '',
    elements: [...elements],
    names: options.names ? [...options.names] : elements.map(() => ''),
    formalCharges: options.formalCharges ? Int32Array.from(options.formalCharges) : new Int32Array(elements.length),
    coordinates: Float64Array.from(coordinates),
    bonds,
    bondOrders,
    notes: [],
    format: 'xyz',
    record: { format: 'xyz', comment: (options.title ?? '').replace(/[\r\n]+/g, ' '), atomTails: elements.map(() => '') },
  };
  checkStructureForWriting(s);
  coordinatesToWrite(s);
  return s;
}

/** `lines` as a short list for a note: `3, 5, 9` or `3, 5, 9, … (12 lines)`. */
export function lineList(lines: readonly number[]): string {
  if (lines.length <= 5) return lines.join(', ');
  return `${lines.slice(0, 5).join(', ')}, … (${lines.length} lines)`;
}
