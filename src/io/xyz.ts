/**
 * XYZ text (the plain multi-frame format: atom count, a comment line, then
 * one `Element x y z` line per atom, ångström), for results and
 * trajectories: the frame writer `xyzFrame`, and the Structure reader and
 * writers `readXyz`, `writeXyz`, `writeXyzFrames`.
 * @module
 */
import { ELEMENT_SYMBOLS, isElement } from '../elements.js';
import {
  checkStructureForWriting,
  coordinatesToWrite,
  elementInAnyCase,
  lineList,
  parseDecimal,
  splitLines,
  StructureError,
  type Structure,
  type XyzStructure,
} from './structure.js';

/**
 * One XYZ frame for atoms with symbols `elements` at `x` (flat, 3N). The
 * comment is put on one line (line breaks become spaces). Coordinates are
 * written with JavaScript's shortest round-trip form, so they read back to
 * the same doubles.
 */
export function xyzFrame(elements: readonly string[], x: Float64Array, comment = ''): string {
  const lines = [String(elements.length), comment.replace(/[\r\n]+/g, ' ')];
  for (let a = 0; a < elements.length; a++) {
    lines.push(`${elements[a]} ${x[3 * a]} ${x[3 * a + 1]} ${x[3 * a + 2]}`);
  }
  return lines.join('\n') + '\n';
}

/** A whitespace-separated word of a line and its 1-based first and last column. */
interface Word {
  text: string;
  first: number;
  last: number;
}

function wordsOf(line: string): Word[] {
  const words: Word[] = [];
  const re = /\S+/g;
  let m: RegExpExecArray | null;
  while ((m = re.exec(line)) !== null) words.push({ text: m[0], first: m.index + 1, last: m.index + m[0].length });
  return words;
}

const WHOLE = /^\d+$/;

/**
 * Read an XYZ file: one or more frames, each an atom count line, a comment
 * line (the title, trimmed), and one `Element x y z` line per atom
 * (whitespace-separated, coordinates in ångström). Text after z is kept in
 * the record and written back. Elements may be written in any letter case
 * (`CL` → `Cl`) or as atomic numbers (`6` → `C`); either adds a note. Blank
 * lines after the last frame are allowed. Bonds are `null` (XYZ has none).
 *
 * Throws {@link StructureError} for empty input, a count that is not a whole
 * number or is 0, a missing comment line, a short or malformed atom line, an
 * unknown element, a number that is not a decimal number, and a count that
 * disagrees with the atom lines that follow.
 */
export function readXyz(text: string): XyzStructure[] {
  const lines = splitLines(text);
  let end = lines.length;
  while (end > 0 && lines[end - 1].trim() === '') end--;
  if (end === 0) throw new StructureError(0, '', 'the input is empty');
  const frames: XyzStructure[] = [];
  let i = 0;
  let previousCountLine = 0;
  while (i < end) {
    const frame = frames.length + 1;
    const countLine = i + 1;
    const countWords = wordsOf(lines[i]);
    if (countWords.length !== 1 || !WHOLE.test(countWords[0].text)) {
      const got = lines[i].trim();
      const hint = frame > 1 ? `; does line ${previousCountLine} give too few atoms?` : '';
      throw new StructureError(countLine, 'atom count', `expected the atom count of frame ${frame} (a whole number), got "${got}"${hint}`);
    }
    const n = Number(countWords[0].text);
    previousCountLine = countLine;
    if (n === 0) throw new StructureError(countLine, 'atom count', `frame ${frame} has an atom count of 0`);
    i++;
    if (i >= lines.length) throw new StructureError(countLine, 'comment', `the file ends after the atom count of frame ${frame}; the comment line is missing`);
    const comment = lines[i];
    i++;
    const elements: string[] = [];
    const tails: string[] = [];
    const x = new Float64Array(3 * n);
    const caseLines = new Map<string, number[]>();
    const numberLines = new Map<string, number[]>();
    for (let a = 0; a < n; a++, i++) {
      const lineNo = i + 1;
      if (i >= end) {
        throw new StructureError(lineNo, '', `the file ends after ${a} of the ${n} atoms of frame ${frame} (count on line ${countLine})`);
      }
      const line = lines[i];
      const words = wordsOf(line);
      if (words.length === 0) throw new StructureError(lineNo, '', `expected atom ${a + 1} of frame ${frame} (element x y z), got a blank line`);
      if (words.length === 1 && WHOLE.test(words[0].text)) {
        throw new StructureError(lineNo, '', `expected atom ${a + 1} of ${n} of frame ${frame} (count on line ${countLine}), got "${words[0].text}", which looks like the count of another frame`);
      }
      if (words.length < 4) {
        throw new StructureError(lineNo, '', `expected element x y z, got ${words.length} field${words.length === 1 ? '' : 's'}: "${line.trim()}"`);
      }
      const w = words[0];
      let symbol: string | undefined;
      if (isElement(w.text)) symbol = w.text;
      else if (WHOLE.test(w.text)) {
        const z = Number(w.text);
        if (z >= 1 && z <= ELEMENT_SYMBOLS.length) {
          symbol = ELEMENT_SYMBOLS[z - 1];
          push(numberLines, w.text, lineNo);
        }
      } else {
        symbol = elementInAnyCase(w.text);
        if (symbol !== undefined) push(caseLines, w.text, lineNo);
      }
      if (symbol === undefined) throw new StructureError(lineNo, 'element', `"${w.text}" is not an element symbol or atomic number`, [w.first, w.last]);
      elements.push(symbol);
      for (let k = 0; k < 3; k++) {
        const word = words[k + 1];
        const v = parseDecimal(word.text);
        if (v === undefined) throw new StructureError(lineNo, 'xyz'[k], `expected a number, got "${word.text}"`, [word.first, word.last]);
        x[3 * a + k] = v;
      }
      tails.push(line.slice(words[3].last).trim());
    }
    const notes: string[] = [];
    for (const [t, at] of caseLines) notes.push(`line ${at[0]}: "${t}" read as element ${elementInAnyCase(t)} (lines ${lineList(at)})`);
    for (const [t, at] of numberLines) notes.push(`line ${at[0]}: atomic number ${t} read as element ${ELEMENT_SYMBOLS[Number(t) - 1]} (lines ${lineList(at)})`);
    frames.push({
      title: comment.trim(),
      elements,
      names: elements.map(() => ''),
      formalCharges: new Int32Array(n),
      coordinates: x,
      bonds: null,
      bondOrders: null,
      notes,
      format: 'xyz',
      record: { format: 'xyz', comment, atomTails: tails },
    });
  }
  return frames;
}

function push(map: Map<string, number[]>, key: string, line: number): void {
  const list = map.get(key);
  if (list) list.push(line);
  else map.set(key, [line]);
}

/** A coordinate as text that reads back to the same double (−0 stays −0). */
function exactNumber(v: number): string {
  return Object.is(v, -0) ? '-0' : String(v);
}

/**
 * One XYZ frame of `s`, with `coordinates` (flat, 3N, ångström) in place of
 * its own when given. Numbers are written in JavaScript's shortest
 * round-trip form, so {@link readXyz} gives back the same doubles. The
 * comment line is the record's comment when `s` came from XYZ and its title
 * is unchanged, else the title (line breaks become spaces); text kept after
 * z is written back. Throws `RangeError` for an element that is not a
 * symbol, arrays of the wrong length, or a non-finite coordinate.
 */
export function writeXyz(s: Structure, coordinates?: Float64Array): string {
  checkStructureForWriting(s);
  const x = coordinatesToWrite(s, coordinates);
  const n = s.elements.length;
  const record = s.format === 'xyz' ? s.record : null;
  const comment = (record && record.comment.trim() === s.title ? record.comment : s.title).replace(/[\r\n]+/g, ' ');
  const tails = record && record.atomTails.length === n ? record.atomTails : null;
  const lines = [String(n), comment];
  for (let a = 0; a < n; a++) {
    const tail = tails && tails[a] ? ` ${tails[a]}` : '';
    lines.push(`${s.elements[a]} ${exactNumber(x[3 * a])} ${exactNumber(x[3 * a + 1])} ${exactNumber(x[3 * a + 2])}${tail}`);
  }
  return lines.join('\n') + '\n';
}

/**
 * Several XYZ frames, one after another, for `structures` (each with
 * `coordinates[k]` in place of its own when given). Throws as {@link writeXyz}.
 */
export function writeXyzFrames(structures: readonly Structure[], coordinates?: readonly (Float64Array | undefined)[]): string {
  return structures.map((s, k) => writeXyz(s, coordinates?.[k])).join('');
}
