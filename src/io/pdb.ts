/**
 * PDB files of small molecules: ATOM/HETATM, CONECT, MODEL/ENDMDL, TER,
 * TITLE and HEADER, in the fixed columns of the wwPDB "Atomic Coordinate
 * Entry Format Description", version 3.3. Other records are skipped.
 * See docs/structure-files.md for the rules chosen (element from the atom
 * name, alternate locations, charges, precision).
 * @module
 */
import {
  checkStructureForWriting,
  columns,
  coordinatesToWrite,
  elementInAnyCase,
  fixedInteger,
  fixedNumber,
  fixedNumberOrNull,
  sortBonds,
  splitLines,
  StructureError,
  type PdbAtomRecord,
  type PdbStructure,
  type Structure,
} from './structure.js';

/** One model while it is being read. */
interface ModelBuild {
  line: number; // line of its MODEL record (0 when the file has none)
  modelNumber: number | null;
  elements: string[];
  names: string[];
  charges: number[];
  x: number[];
  atoms: PdbAtomRecord[];
  atomLines: number[];
  terAfter: number[];
  notes: string[];
  /** serial → atom index (dropped alternate locations point at the atom kept). */
  bySerial: Map<number, number>;
  /** first line of each serial, for the duplicate message. */
  serialLine: Map<number, number>;
  /** atom identity (name, residue, chain, number, insertion code) → altLoc kept and the atom's index. */
  altKept: Map<string, { altLoc: string; index: number }>;
}

function newModel(line: number, modelNumber: number | null): ModelBuild {
  return {
    line,
    modelNumber,
    elements: [],
    names: [],
    charges: [],
    x: [],
    atoms: [],
    atomLines: [],
    terAfter: [],
    notes: [],
    bySerial: new Map(),
    serialLine: new Map(),
    altKept: new Map(),
  };
}

/**
 * The element an atom name implies, by the PDB alignment convention (the
 * symbol is right-justified in columns 13-14): `field` is columns 13-16.
 * Column 13 blank or a digit → the letter in column 14; columns 13-14 both
 * letters → that two-letter symbol when it is an element, except a name
 * filling all four columns that starts with H (a hydrogen such as HG12),
 * else the letter in column 13; column 13 a letter and column 14 not →
 * column 13. Returns `undefined` when no element results.
 */
export function elementFromAtomName(field: string): string | undefined {
  const c13 = field[0] ?? ' ';
  const c14 = field[1] ?? ' ';
  const letter = (c: string) => /[A-Za-z]/.test(c);
  if (c13 === ' ' || /\d/.test(c13)) return letter(c14) ? elementInAnyCase(c14) : undefined;
  if (!letter(c13)) return undefined;
  if (letter(c14)) {
    const full = field.length === 4 && !field.includes(' ');
    if (!(full && c13.toUpperCase() === 'H')) {
      const two = elementInAnyCase(c13 + c14);
      if (two !== undefined) return two;
    }
  }
  return elementInAnyCase(c13);
}

function parseCharge(field: string, lineNo: number): number {
  const t = field.trim();
  if (t === '') return 0;
  const m = /^(\d)([+-])$/.exec(t);
  if (!m) throw new StructureError(lineNo, 'charge', `expected a charge such as "2+" or "1-", got "${t}"`, [79, 80]);
  const v = Number(m[1]);
  return m[2] === '-' ? -v || 0 : v;
}

function readAtom(line: string, lineNo: number, model: ModelBuild): void {
  const record = line.startsWith('HETATM') ? 'HETATM' : 'ATOM';
  const serial = fixedInteger(line, lineNo, 7, 11, 'serial');
  const nameField = columns(line, 13, 16);
  const altLoc = columns(line, 17, 17).trim();
  const residueName = columns(line, 18, 20).trim();
  const chain = columns(line, 22, 22).trim();
  const residueNumber = columns(line, 23, 26).trim() === '' ? null : fixedInteger(line, lineNo, 23, 26, 'residue number');
  const insertionCode = columns(line, 27, 27).trim();
  const x = fixedNumber(line, lineNo, 31, 38, 'x');
  const y = fixedNumber(line, lineNo, 39, 46, 'y');
  const z = fixedNumber(line, lineNo, 47, 54, 'z');
  const occupancy = fixedNumberOrNull(line, lineNo, 55, 60, 'occupancy');
  const bFactor = fixedNumberOrNull(line, lineNo, 61, 66, 'temperature factor');
  const segment = columns(line, 73, 76).trim();
  const elementField = columns(line, 77, 78).trim();
  const charge = parseCharge(columns(line, 79, 80), lineNo);
  const name = nameField.trim();

  let element: string | undefined;
  if (elementField !== '') {
    element = elementInAnyCase(elementField);
    if (element === undefined) throw new StructureError(lineNo, 'element', `"${elementField}" is not an element symbol`, [77, 78]);
  } else {
    element = elementFromAtomName(nameField);
    if (element === undefined) {
      throw new StructureError(lineNo, 'name', `columns 77-78 (element) are blank and no element can be told from the atom name "${nameField}"`, [13, 16]);
    }
  }

  const identity = [name, residueName, chain, residueNumber ?? '', insertionCode].join('\u0000');
  const firstLine = model.serialLine.get(serial);
  if (firstLine !== undefined) {
    throw new StructureError(lineNo, 'serial', `atom serial ${serial} is used twice (first on line ${firstLine})`, [7, 11]);
  }
  model.serialLine.set(serial, lineNo);
  if (altLoc !== '') {
    const kept = model.altKept.get(identity);
    if (kept && kept.altLoc !== altLoc) {
      model.notes.push(`line ${lineNo}: alternate location ${altLoc} of atom ${name || serial} dropped; ${kept.altLoc} kept`);
      model.bySerial.set(serial, kept.index);
      return;
    }
    if (!kept) model.altKept.set(identity, { altLoc, index: model.elements.length });
  }
  if (elementField === '') {
    model.notes.push(`line ${lineNo}: element ${element} taken from atom name "${nameField}" (columns 77-78 are blank)`);
  }
  model.bySerial.set(serial, model.elements.length);
  model.elements.push(element);
  model.names.push(name);
  model.charges.push(charge);
  model.x.push(x, y, z);
  model.atomLines.push(lineNo);
  model.atoms.push({ record, serial, nameField, altLoc, residueName, chain, residueNumber, insertionCode, occupancy, bFactor, segment });
}

/**
 * Read a PDB file: one structure per MODEL (or one when there are no MODEL
 * records). Columns follow PDB format v3.3; the element is taken from
 * columns 77-78 in any letter case (`CL` → `Cl`), or, when they are blank,
 * from the atom name by {@link elementFromAtomName} (with a note); the
 * formal charge from columns 79-80 (`2+`, `1-`). Coordinates are ångström.
 * Of atoms that differ only in their alternate location, the first
 * location seen is kept and the others dropped (with a note). CONECT
 * records give the bonds of every model (a pair listed more than once is
 * one bond; orders unknown, so `bondOrders` is `null`); with no CONECT
 * records `bonds` is `null`. The title is the TITLE text, else the HEADER
 * classification (columns 11-50).
 *
 * Throws {@link StructureError} for empty input or input without atoms, bad
 * numbers or charges, unknown elements, duplicated serials, CONECT to a
 * serial no atom has or to the atom itself, MODEL without ENDMDL (or the
 * reverse), atoms outside MODEL/ENDMDL in a file that has MODELs, and
 * models whose atoms differ.
 */
export function readPdb(text: string): PdbStructure[] {
  const lines = splitLines(text);
  if (lines.every((l) => l.trim() === '')) throw new StructureError(0, '', 'the input is empty');
  const models: ModelBuild[] = [];
  let current: ModelBuild | null = null;
  let usesModels = false;
  let open = false;
  let header: string | null = null;
  const titleParts: string[] = [];
  const conect: { line: string; lineNo: number }[] = [];

  for (let i = 0; i < lines.length; i++) {
    const line = lines[i];
    const lineNo = i + 1;
    const name = line.slice(0, 6).trimEnd();
    if (name === 'END') break;
    switch (name) {
      case 'HEADER':
        header = line.trimEnd();
        break;
      case 'TITLE':
        titleParts.push(line.slice(10).trimEnd());
        break;
      case 'MODEL': {
        if (open) throw new StructureError(lineNo, '', `MODEL before the ENDMDL of the model on line ${current!.line}`);
        if (!usesModels && models.length > 0) {
          throw new StructureError(lineNo, '', `MODEL after atoms that are in no model (line ${models[0].atomLines[0]})`);
        }
        usesModels = true;
        open = true;
        // Columns 11-14 per v3.3; some writers put the serial elsewhere after "MODEL" (accepted when it is the only thing there).
        const loose = line.slice(6).trim();
        const modelNumber =
          columns(line, 11, 14).trim() === '' && /^\d+$/.test(loose) ? Number(loose) : fixedInteger(line, lineNo, 11, 14, 'model serial');
        current = newModel(lineNo, modelNumber);
        models.push(current);
        break;
      }
      case 'ENDMDL':
        if (!open) throw new StructureError(lineNo, '', 'ENDMDL without a MODEL before it');
        open = false;
        current = null;
        break;
      case 'ATOM':
      case 'HETATM':
        if (!current) {
          if (usesModels) throw new StructureError(lineNo, '', `${name} record outside MODEL/ENDMDL in a file that has MODEL records`);
          current = newModel(0, null);
          models.push(current);
        }
        readAtom(line, lineNo, current);
        break;
      case 'TER':
        if (current && current.elements.length > 0) {
          const last = current.elements.length - 1;
          if (current.terAfter[current.terAfter.length - 1] !== last) current.terAfter.push(last);
        }
        break;
      case 'CONECT':
        conect.push({ line, lineNo });
        break;
      default:
        break; // REMARK, ANISOU, CRYST1, MASTER, …: not needed here
    }
  }
  if (open) throw new StructureError(current!.line, '', `MODEL ${current!.modelNumber} has no ENDMDL (is the file truncated?)`);
  if (models.length === 0 || models.every((m) => m.elements.length === 0)) {
    throw new StructureError(0, '', 'no ATOM or HETATM records in the input');
  }

  const first = models[0];
  for (let k = 0; k < models.length; k++) {
    const m = models[k];
    if (m.elements.length === 0) throw new StructureError(m.line, '', `model ${m.modelNumber} has no atoms`);
    if (k === 0) continue;
    if (m.elements.length !== first.elements.length) {
      throw new StructureError(m.line, '', `model ${m.modelNumber} has ${m.elements.length} atoms; model ${first.modelNumber} has ${first.elements.length} (every model must have the same atoms)`);
    }
    for (let a = 0; a < m.elements.length; a++) {
      if (m.elements[a] !== first.elements[a] || m.names[a] !== first.names[a]) {
        throw new StructureError(m.atomLines[a], '', `atom ${a + 1} of model ${m.modelNumber} is "${m.names[a]}" (${m.elements[a]}); in model ${first.modelNumber} it is "${first.names[a]}" (${first.elements[a]}) (every model must have the same atoms)`);
      }
    }
  }

  // CONECT: bonds of every model, by the serials of the first.
  let bonds: Int32Array | null = null;
  const conectNotes: string[] = [];
  if (conect.length > 0) {
    const seen = new Set<number>();
    const pairs: [number, number][] = [];
    const n = first.elements.length;
    for (const { line, lineNo } of conect) {
      const serial = fixedInteger(line, lineNo, 7, 11, 'atom serial');
      const from = first.bySerial.get(serial);
      if (from === undefined) throw new StructureError(lineNo, 'atom serial', `no atom has serial ${serial}`, [7, 11]);
      for (let f = 0; f < 4; f++) {
        const c0 = 12 + 5 * f;
        if (columns(line, c0, c0 + 4).trim() === '') continue;
        const other = fixedInteger(line, lineNo, c0, c0 + 4, 'bonded atom serial');
        const to = first.bySerial.get(other);
        if (to === undefined) throw new StructureError(lineNo, 'bonded atom serial', `no atom has serial ${other}`, [c0, c0 + 4]);
        if (other === serial) throw new StructureError(lineNo, 'bonded atom serial', `atom serial ${serial} is bonded to itself`, [c0, c0 + 4]);
        if (from === to) {
          conectNotes.push(`line ${lineNo}: bond ${serial}-${other} skipped: both serials are locations of the same atom`);
          continue;
        }
        const key = Math.min(from, to) * n + Math.max(from, to);
        if (seen.has(key)) continue;
        seen.add(key);
        pairs.push([from, to]);
      }
    }
    bonds = sortBonds(pairs).bonds;
  }

  let title = titleParts.join('').trim();
  if (title === '' && header !== null) title = columns(header, 11, 50).trim();

  return models.map((m) => ({
    title,
    elements: m.elements,
    names: m.names,
    formalCharges: Int32Array.from(m.charges),
    coordinates: Float64Array.from(m.x),
    bonds: bonds ? Int32Array.from(bonds) : null,
    bondOrders: null,
    notes: [...m.notes, ...conectNotes],
    format: 'pdb' as const,
    record: { format: 'pdb' as const, header, modelNumber: m.modelNumber, atoms: m.atoms, terAfter: m.terAfter },
  }));
}

/** `v` with `decimals` decimals right-justified in `width` columns; throws RangeError when it does not fit. */
function fixed(v: number, width: number, decimals: number, what: string): string {
  let t = v.toFixed(decimals);
  if (/^-0\.0*$/.test(t)) t = t.slice(1);
  if (t.length > width) throw new RangeError(`${what}: ${v} does not fit ${width} columns with ${decimals} decimals`);
  return t.padStart(width);
}

function integer(v: number, width: number, what: string): string {
  const t = String(v);
  if (!Number.isInteger(v) || t.length > width) throw new RangeError(`${what}: ${v} is not a whole number that fits ${width} columns`);
  return t.padStart(width);
}

function text(v: string, width: number, what: string): string {
  if (v.length > width) throw new RangeError(`${what}: "${v}" is longer than ${width} characters`);
  return v;
}

/** Columns 13-16 for an atom name: a name of four characters fills them; a shorter one starts in column 14 when its element has one letter (the PDB alignment convention), else in column 13. */
function nameColumns(name: string, element: string, what: string): string {
  text(name, 4, what);
  if (name.length === 4) return name;
  return element.length === 1 && name.length <= 3 ? ` ${name}`.padEnd(4) : name.padEnd(4);
}

function chargeColumns(q: number, what: string): string {
  if (q === 0) return '  ';
  if (!Number.isInteger(q) || Math.abs(q) > 9) throw new RangeError(`${what}: formal charge ${q} does not fit columns 79-80`);
  return `${Math.abs(q)}${q > 0 ? '+' : '-'}`;
}

/** The PDB record for atom `a` of `s` (the structure's own when it came from PDB, else a HETATM of residue UNL). */
function atomRecordFor(s: Structure, a: number): PdbAtomRecord {
  if (s.format === 'pdb' && s.record.atoms.length === s.elements.length) return s.record.atoms[a];
  return {
    record: 'HETATM',
    serial: a + 1,
    nameField: '',
    altLoc: '',
    residueName: 'UNL',
    chain: '',
    residueNumber: 1,
    insertionCode: '',
    occupancy: 1,
    bFactor: 0,
    segment: '',
  };
}

/** Names for atoms that have none, when writing a structure that did not come from PDB: element + running number per element (C1, C2, H1…). */
function namesFor(s: Structure): string[] {
  if (s.format === 'pdb') return s.names;
  const counts = new Map<string, number>();
  return s.names.map((name, a) => {
    if (name !== '') return name;
    const e = s.elements[a];
    const k = (counts.get(e) ?? 0) + 1;
    counts.set(e, k);
    return `${e.toUpperCase()}${k}`;
  });
}

/**
 * One ATOM/HETATM line, 80 columns, laid out per PDB v3.3: record name 1-6,
 * serial 7-11, name 13-16, altLoc 17, residue name 18-20, chain 22, residue
 * number 23-26, insertion code 27, x y z 31-38 39-46 47-54 (8.3), occupancy
 * 55-60 and temperature factor 61-66 (6.2), segment 73-76, element 77-78
 * (right-justified, upper case), charge 79-80.
 */
function atomLine(r: PdbAtomRecord, name: string, element: string, charge: number, x: Float64Array, a: number): string {
  const what = `atom ${a + 1}`;
  const nameField = r.nameField.trim() === name && r.nameField.length === 4 ? r.nameField : nameColumns(name, element, `${what} (name)`);
  const parts = [
    r.record.padEnd(6),
    integer(r.serial, 5, `${what} (serial)`),
    ' ',
    nameField,
    text(r.altLoc, 1, `${what} (altLoc)`).padEnd(1),
    text(r.residueName, 3, `${what} (residue name)`).padStart(3),
    ' ',
    text(r.chain, 1, `${what} (chain)`).padEnd(1),
    r.residueNumber === null ? '    ' : integer(r.residueNumber, 4, `${what} (residue number)`),
    text(r.insertionCode, 1, `${what} (insertion code)`).padEnd(1),
    '   ',
    fixed(x[3 * a], 8, 3, `${what} (x)`),
    fixed(x[3 * a + 1], 8, 3, `${what} (y)`),
    fixed(x[3 * a + 2], 8, 3, `${what} (z)`),
    r.occupancy === null ? '      ' : fixed(r.occupancy, 6, 2, `${what} (occupancy)`),
    r.bFactor === null ? '      ' : fixed(r.bFactor, 6, 2, `${what} (temperature factor)`),
    '      ',
    text(r.segment, 4, `${what} (segment)`).padEnd(4),
    element.toUpperCase().padStart(2),
    chargeColumns(charge, what),
  ];
  return parts.join('');
}

/** TER after atom record `r`: serial one more than the atom's, then its residue. */
function terLine(r: PdbAtomRecord): string {
  const serial = r.serial + 1 <= 99999 ? String(r.serial + 1).padStart(5) : '     ';
  const residueNumber = r.residueNumber === null ? '    ' : String(r.residueNumber).padStart(4);
  return `TER   ${serial}      ${r.residueName.padStart(3)} ${r.chain.padEnd(1)}${residueNumber}${r.insertionCode}`.trimEnd();
}

/** TITLE lines for `title`: 70 characters per line in columns 11-80, continuation numbers in 9-10, broken so no line ends in a blank. */
function titleLines(title: string): string[] {
  const out: string[] = [];
  let rest = title.replace(/[\r\n]+/g, ' ');
  while (rest.length > 0) {
    let cut = Math.min(70, rest.length);
    if (cut < rest.length) {
      while (cut > 1 && rest[cut - 1] === ' ') cut--;
    }
    const piece = rest.slice(0, cut);
    rest = rest.slice(cut);
    const k = out.length + 1;
    if (k > 99) throw new RangeError('title is too long for 99 TITLE lines');
    out.push(`TITLE   ${k === 1 ? '  ' : String(k).padStart(2)}${piece}`);
  }
  return out;
}

/**
 * The PDB text of `s` as one structure (a MODEL/ENDMDL pair only when it
 * came from a MODEL of a PDB file), with `coordinates` (flat, 3N, Å) in
 * place of its own when given. See {@link writePdbModels}.
 */
export function writePdb(s: Structure, coordinates?: Float64Array): string {
  return writePdbModels([s], coordinates ? [coordinates] : undefined);
}

/**
 * PDB text (format v3.3 columns) for one or more models of the same atoms:
 * HEADER (as read, from the first structure), TITLE, then per model
 * `MODEL n` (the model number read, else its position; left out for a
 * single structure that had none), its ATOM/HETATM lines and TER records,
 * `ENDMDL`; then CONECT records for the bonds of the first structure (each
 * bond listed from both atoms, four per line) and `END`. Coordinates are
 * written 8.3 (to 0.001 Å), so they must lie in −999.999 … 9999.999.
 * Structures that did not come from PDB are written as HETATM of residue
 * `UNL` (the wwPDB code for an unknown ligand), serials 1…N, occupancy
 * 1.00, temperature factor 0.00, and atoms without names get element +
 * running number (`C1`, `CL2`). Bond orders cannot be written (CONECT has none).
 *
 * Throws `RangeError` for values that do not fit their columns (naming the
 * atom), an element that is not a symbol, models whose atom counts or
 * bonds differ, and no structures.
 */
export function writePdbModels(structures: readonly Structure[], coordinates?: readonly (Float64Array | undefined)[]): string {
  if (structures.length === 0) throw new RangeError('no structures to write');
  const firstS = structures[0];
  const n = firstS.elements.length;
  const out: string[] = [];
  if (firstS.format === 'pdb' && firstS.record.header !== null) out.push(firstS.record.header);
  out.push(...titleLines(firstS.title));
  const firstBonds = firstS.bonds;
  structures.forEach((s, k) => {
    checkStructureForWriting(s);
    const x = coordinatesToWrite(s, coordinates?.[k]);
    if (s.elements.length !== n) throw new RangeError(`model ${k + 1}: has ${s.elements.length} atoms; model 1 has ${n}`);
    const sameBonds =
      (s.bonds === null && firstBonds === null) ||
      (s.bonds !== null && firstBonds !== null && s.bonds.length === firstBonds.length && s.bonds.every((v, i) => v === firstBonds[i]));
    if (!sameBonds) throw new RangeError(`model ${k + 1}: its bonds differ from model 1's (CONECT applies to every model)`);
    const modelNumber = s.format === 'pdb' ? s.record.modelNumber : null;
    const withModel = structures.length > 1 || modelNumber !== null;
    if (withModel) out.push(`MODEL     ${integer(modelNumber ?? k + 1, 4, `model ${k + 1} (model serial)`)}`);
    const names = namesFor(s);
    const ter = new Set(s.format === 'pdb' && s.record.atoms.length === n ? s.record.terAfter : []);
    for (let a = 0; a < n; a++) {
      const r = atomRecordFor(s, a);
      out.push(atomLine(r, names[a], s.elements[a], s.formalCharges[a], x, a));
      if (ter.has(a)) out.push(terLine(r));
    }
    if (withModel) out.push('ENDMDL');
  });
  if (firstBonds && firstBonds.length > 0) {
    const partners: number[][] = Array.from({ length: n }, () => []);
    for (let b = 0; 2 * b < firstBonds.length; b++) {
      partners[firstBonds[2 * b]].push(firstBonds[2 * b + 1]);
      partners[firstBonds[2 * b + 1]].push(firstBonds[2 * b]);
    }
    const serial = (a: number) => integer(atomRecordFor(firstS, a).serial, 5, `atom ${a + 1} (serial)`);
    for (let a = 0; a < n; a++) {
      const list = partners[a].sort((p, q) => p - q);
      for (let i = 0; i < list.length; i += 4) {
        out.push(`CONECT${serial(a)}${list.slice(i, i + 4).map(serial).join('')}`);
      }
    }
  }
  out.push('END');
  return out.join('\n') + '\n';
}
