/**
 * SDF and MOL files, V2000 connection tables, as described in "CTfile
 * Formats" (BIOVIA / Dassault Systèmes, 2020 edition): header block, counts
 * line, atom block, bond block, properties block up to `M  END`, data items,
 * and `$$$$` between records. V3000 is refused.
 * See docs/structure-files.md for what is kept and the rules chosen.
 * @module
 */
import { isElement } from '../elements.js';
import {
  checkStructureForWriting,
  columns,
  coordinatesToWrite,
  fixedInteger,
  fixedNumber,
  sortBonds,
  splitLines,
  StructureError,
  type SdfAtomRecord,
  type SdfBondRecord,
  type SdfDataItem,
  type SdfStructure,
  type Structure,
} from './structure.js';

/** Atom-block charge codes (columns 37-39) → formal charge; code 4 is a doublet radical (charge 0). */
const CHARGE_OF_CODE = [0, 3, 2, 1, 0, -1, -2, -3];
/** Query bond types of the bond block, refused here. */
const QUERY_BOND_TYPES: Record<number, string> = { 5: 'single or double', 6: 'single or aromatic', 7: 'double or aromatic', 8: 'any' };
/** Bond block type → bond order. */
const ORDER_OF_TYPE: Record<number, number> = { 1: 1, 2: 2, 3: 3, 4: 1.5 };

/** Reads one record starting at `lines[start]`; returns it and the index of the line after its `$$$$` (or the end). */
function readRecord(lines: string[], start: number, recordNo: number): { structure: SdfStructure; next: number } {
  let i = start;
  const at = (k: number) => k + 1; // 1-based line number of index k
  const need = (what: string) => {
    if (i >= lines.length) throw new StructureError(at(i), '', `the file ends inside record ${recordNo}: ${what} is missing`);
    return lines[i];
  };
  const headerLines: [string, string, string] = ['', '', ''];
  for (let h = 0; h < 3; h++) {
    headerLines[h] = need(`header line ${h + 1}`).trimEnd();
    i++;
  }
  const countsNo = at(i);
  const counts = need('the counts line');
  i++;
  const version = columns(counts, 34, 39).trim();
  if (version === 'V3000' || /V3000/.test(counts)) {
    throw new StructureError(countsNo, 'version', 'V3000 is not supported; save as V2000', [34, 39]);
  }
  if (version !== '' && version !== 'V2000') {
    throw new StructureError(countsNo, 'version', `expected V2000, got "${version}"`, [34, 39]);
  }
  const atomCount = fixedInteger(counts, countsNo, 1, 3, 'atom count');
  const bondCount = fixedInteger(counts, countsNo, 4, 6, 'bond count');
  const listCount = fixedInteger(counts, countsNo, 7, 9, 'atom list count', 0);
  const chiralFlag = fixedInteger(counts, countsNo, 13, 15, 'chiral flag', 0);
  const textCount = fixedInteger(counts, countsNo, 16, 18, 'structural text count', 0);
  if (atomCount <= 0) throw new StructureError(countsNo, 'atom count', `record ${recordNo} has an atom count of ${atomCount}`, [1, 3]);
  if (bondCount < 0) throw new StructureError(countsNo, 'bond count', `expected a count of 0 or more, got ${bondCount}`, [4, 6]);
  if (listCount !== 0) throw new StructureError(countsNo, 'atom list count', 'atom lists (query structures) are not supported', [7, 9]);
  if (chiralFlag !== 0 && chiralFlag !== 1) throw new StructureError(countsNo, 'chiral flag', `expected 0 or 1, got ${chiralFlag}`, [13, 15]);

  const elements: string[] = [];
  const x = new Float64Array(3 * atomCount);
  const codeCharges = new Int32Array(atomCount);
  const atoms: SdfAtomRecord[] = [];
  const atomLines: number[] = [];
  for (let a = 0; a < atomCount; a++, i++) {
    if (i >= lines.length || lines[i].startsWith('$$$$')) {
      throw new StructureError(at(i), '', `the atom block ends after ${a} atoms; the counts line (line ${countsNo}) says ${atomCount}`);
    }
    const line = lines[i];
    const lineNo = at(i);
    if (/^(\s*\d+){3,7}\s*$/.test(line) && line.trimEnd().length <= 21) {
      throw new StructureError(lineNo, '', `expected atom ${a + 1} of ${atomCount} (the counts line, line ${countsNo}, says ${atomCount} atoms), got what looks like a bond line: "${line.trim()}"`);
    }
    x[3 * a] = fixedNumber(line, lineNo, 1, 10, 'x');
    x[3 * a + 1] = fixedNumber(line, lineNo, 11, 20, 'y');
    x[3 * a + 2] = fixedNumber(line, lineNo, 21, 30, 'z');
    const symbol = columns(line, 32, 34).trim();
    if (!isElement(symbol)) {
      const why = symbol === '' ? 'the atom symbol is blank' : `"${symbol}" is not an element symbol (query atoms, pseudo-atoms and other letter cases are not read)`;
      throw new StructureError(lineNo, 'symbol', why, [32, 34]);
    }
    const massDifference = fixedInteger(line, lineNo, 35, 36, 'mass difference', 0);
    const code = fixedInteger(line, lineNo, 37, 39, 'charge', 0);
    if (code < 0 || code > 7) throw new StructureError(lineNo, 'charge', `expected a charge code 0-7, got ${code}`, [37, 39]);
    elements.push(symbol);
    codeCharges[a] = CHARGE_OF_CODE[code];
    atoms.push({ massDifference, radical: code === 4, stereoFields: line.slice(39, 69).trimEnd() });
    atomLines.push(lineNo);
  }

  const pairs: [number, number][] = [];
  const bondData: { order: number; record: SdfBondRecord }[] = [];
  const bondLine = new Map<number, number>();
  for (let b = 0; b < bondCount; b++, i++) {
    if (i >= lines.length || lines[i].startsWith('$$$$') || lines[i].startsWith('M  ')) {
      throw new StructureError(at(i), '', `the bond block ends after ${b} bonds; the counts line (line ${countsNo}) says ${bondCount}`);
    }
    const line = lines[i];
    const lineNo = at(i);
    const from = fixedInteger(line, lineNo, 1, 3, 'first atom');
    const to = fixedInteger(line, lineNo, 4, 6, 'second atom');
    const type = fixedInteger(line, lineNo, 7, 9, 'bond type');
    const stereo = fixedInteger(line, lineNo, 10, 12, 'bond stereo', 0);
    for (const [v, c, f] of [[from, 1, 'first atom'], [to, 4, 'second atom']] as const) {
      if (v < 1 || v > atomCount) throw new StructureError(lineNo, f, `atom ${v} is out of range (the record has ${atomCount} atoms)`, [c, c + 2]);
    }
    if (from === to) throw new StructureError(lineNo, '', `bond ${b + 1} joins atom ${from} to itself`);
    if (QUERY_BOND_TYPES[type]) {
      throw new StructureError(lineNo, 'bond type', `bond type ${type} ("${QUERY_BOND_TYPES[type]}") is a query type and is not supported`, [7, 9]);
    }
    const order = ORDER_OF_TYPE[type];
    if (order === undefined) throw new StructureError(lineNo, 'bond type', `bond type ${type} is not a CTfile bond type (1-8)`, [7, 9]);
    const key = Math.min(from, to) * (atomCount + 1) + Math.max(from, to);
    const firstLine = bondLine.get(key);
    if (firstLine !== undefined) throw new StructureError(lineNo, '', `bond ${Math.min(from, to)}-${Math.max(from, to)} is given twice (first on line ${firstLine})`);
    bondLine.set(key, lineNo);
    pairs.push([from - 1, to - 1]);
    bondData.push({ order, record: { from: from - 1, to: to - 1, stereo, trailing: line.slice(12, 21).trimEnd(), fileIndex: b } });
  }

  const structuralText: string[] = [];
  for (let t = 0; t < 2 * textCount; t++, i++) {
    structuralText.push(need(`structural text line ${t + 1} of ${2 * textCount}`).trimEnd());
  }

  // Properties block, up to M  END.
  const properties: string[] = [];
  const chargeSets: { atom: number; charge: number }[] = [];
  let chargeOrRadicalLines = false;
  let chargeLines = false;
  const notes: string[] = [];
  let ended = false;
  while (i < lines.length) {
    const line = lines[i];
    const lineNo = at(i);
    if (line.startsWith('M  END')) {
      ended = true;
      i++;
      break;
    }
    if (line.startsWith('$$$$') || line.startsWith('>')) break;
    if (line.startsWith('M  CHG')) {
      chargeOrRadicalLines = chargeLines = true;
      const count = fixedInteger(line, lineNo, 7, 9, 'entry count');
      if (count < 1 || count > 8) throw new StructureError(lineNo, 'entry count', `expected 1-8 entries, got ${count}`, [7, 9]);
      for (let k = 0; k < count; k++) {
        const c = 10 + 8 * k;
        const atom = fixedInteger(line, lineNo, c, c + 3, 'atom');
        const charge = fixedInteger(line, lineNo, c + 4, c + 7, 'charge');
        if (atom < 1 || atom > atomCount) throw new StructureError(lineNo, 'atom', `atom ${atom} is out of range (the record has ${atomCount} atoms)`, [c, c + 3]);
        if (charge < -15 || charge > 15) throw new StructureError(lineNo, 'charge', `expected a charge from -15 to 15, got ${charge}`, [c + 4, c + 7]);
        chargeSets.push({ atom: atom - 1, charge });
      }
      i++;
      continue;
    }
    if (line.startsWith('M  RAD')) chargeOrRadicalLines = true;
    if (/^(M  |A  |V  |G  |S  SKP)/.test(line)) {
      properties.push(line.trimEnd());
      let follow = 0;
      if (line.startsWith('A  ') || line.startsWith('G  ')) follow = 1;
      else if (line.startsWith('S  SKP')) follow = fixedInteger(line, lineNo, 7, 9, 'lines to skip');
      i++;
      for (let f = 0; f < follow; f++, i++) properties.push(need(`line ${f + 1} after the property on line ${lineNo}`).trimEnd());
      continue;
    }
    throw new StructureError(
      lineNo,
      '',
      `expected a property line ("M  …") or "M  END" after the ${atomCount} atoms and ${bondCount} bonds the counts line (line ${countsNo}) gives, got "${line.trim()}"; does the counts line agree with the blocks?`,
    );
  }
  if (!ended) notes.push(`line ${at(i - 1)}: record ${recordNo} has no "M  END" line; its connection table was taken to end here`);

  // Charges: atom block, unless M  CHG or M  RAD lines are present (then those give them; CTfile rule).
  const formalCharges = new Int32Array(atomCount);
  if (chargeOrRadicalLines) {
    for (const { atom, charge } of chargeSets) formalCharges[atom] = charge;
    for (let a = 0; a < atomCount; a++) {
      if (codeCharges[a] !== 0 && codeCharges[a] !== formalCharges[a]) {
        notes.push(`line ${atomLines[a]}: the atom block's charge ${signed(codeCharges[a])} of atom ${a + 1} is ignored: M  CHG/M  RAD lines are present, and they give ${signed(formalCharges[a])}`);
      }
      atoms[a].radical = false;
    }
  } else {
    formalCharges.set(codeCharges);
  }
  chargeLines &&= formalCharges.some((q) => q !== 0);

  // Data items, up to $$$$.
  const dataItems: SdfDataItem[] = [];
  while (i < lines.length && !lines[i].startsWith('$$$$')) {
    const line = lines[i];
    if (line.trim() === '') {
      i++;
      continue;
    }
    if (!line.startsWith('>')) {
      throw new StructureError(at(i), '', `expected a data item header ("> <name>") or "$$$$", got "${line.trim()}"`);
    }
    const name = /<([^>]*)>/.exec(line)?.[1] ?? '';
    const item: SdfDataItem = { name, header: line.trimEnd(), lines: [] };
    i++;
    while (i < lines.length && lines[i].trim() !== '' && !lines[i].startsWith('$$$$')) {
      item.lines.push(lines[i].trimEnd());
      i++;
    }
    dataItems.push(item);
  }
  if (i < lines.length) i++; // the $$$$

  const sorted = sortBonds(pairs);
  const structure: SdfStructure = {
    title: headerLines[0].trim(),
    elements,
    names: elements.map(() => ''),
    formalCharges,
    coordinates: x,
    bonds: sorted.bonds,
    bondOrders: Float64Array.from(sorted.order, (k) => bondData[k].order),
    notes,
    format: 'sdf',
    record: {
      format: 'sdf',
      headerLines,
      chiralFlag,
      atoms,
      bonds: sorted.order.map((k) => bondData[k].record),
      chargeLines,
      structuralText,
      properties,
      dataItems,
    },
  };
  return { structure, next: i };
}

function signed(q: number): string {
  return q > 0 ? `+${q}` : String(q);
}

/**
 * Read an SDF (or MOL) file: V2000 records separated by `$$$$`. Per record:
 * title from header line 1 (trimmed; the three header lines are kept),
 * atoms (x y z in ångström, element symbol exactly as in the periodic
 * table, mass difference, charge code 1-7 = +3 … −3, 4 = doublet radical),
 * bonds (types 1, 2, 3 → orders 1, 2, 3; type 4, aromatic → 1.5), and the
 * properties block: `M  CHG` gives charges, and when any `M  CHG` or
 * `M  RAD` line is present the atom block's charges are ignored (CTfile
 * rule; a note says so where they differed). Other property lines
 * (`M  ISO`, `M  RAD`, …) and the data items are kept in the record.
 *
 * Throws {@link StructureError} for empty input, V3000, bad counts or
 * numbers, a truncated file, unknown symbols (query atoms), query bond
 * types 5-8, atom lists, bond indices out of range, self bonds, duplicated
 * bonds, and lines that do not fit where the counts line says they are.
 */
export function readSdf(text: string): SdfStructure[] {
  const lines = splitLines(text);
  let end = lines.length;
  while (end > 0 && lines[end - 1].trim() === '') end--;
  if (end === 0) throw new StructureError(0, '', 'the input is empty');
  const body = lines.slice(0, end);
  const out: SdfStructure[] = [];
  let i = 0;
  while (i < body.length) {
    const { structure, next } = readRecord(body, i, out.length + 1);
    out.push(structure);
    i = next;
  }
  return out;
}

/**
 * Read a MOL file: exactly one V2000 record (as {@link readSdf}; a trailing
 * `$$$$` is allowed). Throws {@link StructureError} as {@link readSdf}, and
 * when the file holds more than one record.
 */
export function readMol(text: string): SdfStructure[] {
  const list = readSdf(text);
  if (list.length > 1) throw new StructureError(0, '', `a MOL file holds one structure; this one has ${list.length} records (read it as SDF)`);
  return list;
}

function num(v: number, what: string): string {
  let t = v.toFixed(4);
  if (/^-0\.0*$/.test(t)) t = t.slice(1);
  if (t.length > 10) throw new RangeError(`${what}: ${v} does not fit columns of 10 with 4 decimals (10.4)`);
  return t.padStart(10);
}

function int3(v: number, what: string): string {
  const t = String(v);
  if (!Number.isInteger(v) || t.length > 3) throw new RangeError(`${what}: ${v} does not fit 3 columns`);
  return t.padStart(3);
}

const DEFAULT_ATOM_TAIL = '  0'.repeat(10);

/**
 * One V2000 record (header, counts line, atom and bond blocks, properties,
 * `M  END`, data items) for `s`, with `coordinates` in place of its own when
 * given, without the `$$$$` line. Record data read from SDF (header lines,
 * stereo fields, bond direction and stereo, kept property lines, data
 * items) is written back; a structure from another format gets a plain
 * header and zero stereo fields.
 */
function recordText(s: Structure, coordinates?: Float64Array): string {
  checkStructureForWriting(s);
  const x = coordinatesToWrite(s, coordinates);
  const n = s.elements.length;
  if (n > 999) throw new RangeError(`V2000 holds at most 999 atoms; this structure has ${n}`);
  const r = s.format === 'sdf' ? s.record : null;
  const atomRecords = r && r.atoms.length === n ? r.atoms : null;
  const bonds = s.bonds ?? new Int32Array(0);
  const b = bonds.length / 2;
  if (b > 999) throw new RangeError(`V2000 holds at most 999 bonds; this structure has ${b}`);
  const orders = s.bondOrders;
  const title = s.title.replace(/[\r\n]+/g, ' ');
  const header = r ? [r.headerLines[0].trim() === s.title ? r.headerLines[0] : title, r.headerLines[1], r.headerLines[2]] : [title, '  strainws          3D', ''];
  const textLines = r ? r.structuralText : [];
  const lines = [...header];
  lines.push(`${int3(n, 'atom count')}${int3(b, 'bond count')}  0  0${int3(r ? r.chiralFlag : 0, 'chiral flag')}${int3(textLines.length / 2, 'structural text count')}  0  0  0  0999 V2000`);
  let needChargeLines = r ? r.chargeLines : false;
  // With an M  RAD line kept, readers ignore atom-block charges: they must go in M  CHG lines.
  const radicalLines = r ? r.properties.some((p) => p.startsWith('M  RAD')) : false;
  for (let a = 0; a < n; a++) {
    const q = s.formalCharges[a];
    const ar = atomRecords?.[a];
    let code = 0;
    if (q >= -3 && q <= 3 && q !== 0) code = 4 - q;
    else if (q === 0 && ar?.radical) code = 4;
    if (q !== 0 && (code === 0 || radicalLines)) needChargeLines = true;
    if (!Number.isInteger(q) || q < -15 || q > 15) throw new RangeError(`atom ${a + 1}: formal charge ${q} is outside −15 … 15`);
    const md = ar ? ar.massDifference : 0;
    const mdText = String(md);
    if (!Number.isInteger(md) || mdText.length > 2) throw new RangeError(`atom ${a + 1}: mass difference ${md} does not fit 2 columns`);
    const tail = ar ? ar.stereoFields : DEFAULT_ATOM_TAIL;
    lines.push(`${num(x[3 * a], `atom ${a + 1} (x)`)}${num(x[3 * a + 1], `atom ${a + 1} (y)`)}${num(x[3 * a + 2], `atom ${a + 1} (z)`)} ${s.elements[a].padEnd(3)}${mdText.padStart(2)}${String(code).padStart(3)}${tail}`);
  }
  const bondRecords = new Map<number, SdfBondRecord>();
  if (r) for (const br of r.bonds) bondRecords.set(Math.min(br.from, br.to) * n + Math.max(br.from, br.to), br);
  // Bonds in the order the file had them (bonds without a record last, in structure order).
  const recordOf = (k: number) => bondRecords.get(Math.min(bonds[2 * k], bonds[2 * k + 1]) * n + Math.max(bonds[2 * k], bonds[2 * k + 1]));
  const writeOrder = Array.from({ length: b }, (_, k) => k).sort((p, q) => (recordOf(p)?.fileIndex ?? b + p) - (recordOf(q)?.fileIndex ?? b + q));
  for (const k of writeOrder) {
    const i = bonds[2 * k];
    const j = bonds[2 * k + 1];
    const order = orders ? orders[k] : 1;
    const type = order === 1.5 ? 4 : order;
    if (type !== 1 && type !== 2 && type !== 3 && type !== 4) throw new RangeError(`bond ${k + 1}: order ${order} is not 1, 2, 3 or 1.5`);
    const br = bondRecords.get(Math.min(i, j) * n + Math.max(i, j));
    const [from, to] = br ? [br.from, br.to] : [i, j];
    const tail = br ? `${String(br.stereo).padStart(3)}${br.trailing}` : '  0';
    lines.push(`${int3(from + 1, 'bond atom')}${int3(to + 1, 'bond atom')}${String(type).padStart(3)}${tail}`);
  }
  lines.push(...textLines);
  if (needChargeLines) {
    const charged: number[] = [];
    for (let a = 0; a < n; a++) if (s.formalCharges[a] !== 0) charged.push(a);
    for (let k = 0; k < charged.length; k += 8) {
      const group = charged.slice(k, k + 8);
      lines.push(`M  CHG${int3(group.length, 'count')}${group.map((a) => ` ${int3(a + 1, 'atom')} ${int3(s.formalCharges[a], 'charge')}`).join('')}`);
    }
  }
  if (r) lines.push(...r.properties);
  lines.push('M  END');
  if (r) {
    for (const item of r.dataItems) {
      lines.push(item.header.includes(`<${item.name}>`) ? item.header : `> <${item.name}>`, ...item.lines, '');
    }
  }
  return lines.join('\n') + '\n';
}

/**
 * An SDF with one record for `s` (ended by `$$$$`); see {@link writeSdfRecords}.
 */
export function writeSdf(s: Structure, coordinates?: Float64Array): string {
  return writeSdfRecords([s], coordinates ? [coordinates] : undefined);
}

/**
 * A MOL file (one V2000 record, no `$$$$`) for `s`; see {@link writeSdfRecords}.
 */
export function writeMol(s: Structure, coordinates?: Float64Array): string {
  return recordText(s, coordinates);
}

/**
 * SDF text: one V2000 record per structure, each followed by `$$$$`, with
 * `coordinates[k]` in place of structure k's own when given. Coordinates are
 * written 10.4 (to 0.0001 Å; they must lie in −9999.9999 … 99999.9999);
 * bond orders 1, 2, 3, 1.5 as types 1, 2, 3, 4 (no orders: single bonds);
 * charges in the atom block (codes for −3 … +3), and also as `M  CHG` lines
 * when the record read had them or a charge is outside −3 … +3. Record data
 * read from SDF (header lines, stereo fields, bond direction and stereo,
 * property lines other than `M  CHG`, data items) is written back.
 * Throws `RangeError` for values that do not fit their columns (naming the
 * atom or bond), more than 999 atoms or bonds, an element that is not a
 * symbol, an order that is not 1, 2, 3 or 1.5, and no structures.
 */
export function writeSdfRecords(structures: readonly Structure[], coordinates?: readonly (Float64Array | undefined)[]): string {
  if (structures.length === 0) throw new RangeError('no structures to write');
  return structures.map((s, k) => `${recordText(s, coordinates?.[k])}$$$$\n`).join('');
}
