/**
 * XYZ reading and the Structure writer. The layout (atom count line, comment
 * line, one `element x y z` line per atom, frames concatenated) is common
 * practice; the choices beyond it (any letter case, atomic numbers, extra
 * columns kept) are ours, documented in docs/structure-files.md.
 * Molecules and coordinates are invented.
 */
import { describe, expect, it } from 'vitest';
import { newStructure, StructureError } from '../../src/io/structure.js';
import { readXyz, writeXyz, writeXyzFrames, xyzFrame } from '../../src/io/xyz.js';

const WATER = ['3', ' water, invented geometry ', 'O 0.000 0.000 0.117', 'H   0.000  0.757 -0.469', '\tH 0 -0.757 -4.69e-1'].join('\n');

function errorOf(f: () => unknown): StructureError {
  try {
    f();
  } catch (e) {
    expect(e).toBeInstanceOf(StructureError);
    return e as StructureError;
  }
  throw new Error('expected a StructureError');
}

describe('readXyz', () => {
  it('reads count, comment (the title, trimmed) and whitespace-separated atoms', () => {
    const [s] = readXyz(WATER);
    expect(s.format).toBe('xyz');
    expect(s.title).toBe('water, invented geometry');
    expect(s.record.comment).toBe(' water, invented geometry ');
    expect(s.elements).toEqual(['O', 'H', 'H']);
    expect(Array.from(s.coordinates)).toEqual([0, 0, 0.117, 0, 0.757, -0.469, 0, -0.757, -0.469]);
    expect(s.bonds).toBeNull();
    expect(s.bondOrders).toBeNull();
    expect(Array.from(s.formalCharges)).toEqual([0, 0, 0]);
    expect(s.names).toEqual(['', '', '']);
    expect(s.notes).toEqual([]);
  });

  it('reads several frames, CRLF line ends and blank lines at the end', () => {
    const text = [WATER, '1', 'second', 'Ne 1 2 3', '', '  '].join('\r\n');
    const frames = readXyz(text);
    expect(frames.map((f) => f.elements)).toEqual([['O', 'H', 'H'], ['Ne']]);
    expect(frames[1].title).toBe('second');
  });

  it('reads symbols in any letter case and atomic numbers, with a note', () => {
    const [s] = readXyz(['4', '', 'CL 0 0 0', 'cl 1 0 0', '6 2 0 0', 'CL 3 0 0'].join('\n'));
    expect(s.elements).toEqual(['Cl', 'Cl', 'C', 'Cl']);
    expect(s.notes).toEqual([
      'line 3: "CL" read as element Cl (lines 3, 6)',
      'line 4: "cl" read as element Cl (lines 4)',
      'line 5: atomic number 6 read as element C (lines 5)',
    ]);
  });

  it('keeps the text after z and writes it back', () => {
    const text = ['2', 'with charges', 'Na 0 0 0 1.0 extra', 'Cl 2.36 0 0 -1.0', ''].join('\n');
    const [s] = readXyz(text);
    expect(s.record.atomTails).toEqual(['1.0 extra', '-1.0']);
    expect(writeXyz(s)).toBe(text);
  });

  it.each([
    ['empty input', '\n \n', 'the input is empty'],
    ['a count that is not a number', 'three\nc\nO 0 0 0', 'line 1: expected the atom count of frame 1 (a whole number), got "three"'],
    ['a count of 0', '0\nnothing', 'line 1: frame 1 has an atom count of 0'],
    ['no comment line', '3', 'line 1: the file ends after the atom count of frame 1; the comment line is missing'],
    ['fewer atoms than counted', WATER.replace(/^3/, '4'), 'line 6: the file ends after 3 of the 4 atoms of frame 1 (count on line 1)'],
    ['fewer atoms than counted, then the next frame', WATER.replace(/^3/, '4') + '\n1\nx\nHe 0 0 0', 'line 6: expected atom 4 of 4 of frame 1 (count on line 1), got "1", which looks like the count of another frame'],
    ['more atoms than counted', WATER.replace(/^3/, '2'), 'line 5: expected the atom count of frame 2 (a whole number), got "H 0 -0.757 -4.69e-1"; does line 1 give too few atoms?'],
    ['a blank atom line', '2\nc\nO 0 0 0\n\nH 0 0 1', 'line 4: expected atom 2 of frame 1 (element x y z), got a blank line'],
    ['a short atom line', '1\nc\nO 0 0', 'line 3: expected element x y z, got 3 fields: "O 0 0"'],
    ['a bad number', '1\nc\nO 0 1.2.3 0', 'line 3, columns 5-9 (y): expected a number, got "1.2.3"'],
    ['hexadecimal is not a decimal number', '1\nc\nO 0x1 0 0', 'line 3, columns 3-5 (x): expected a number, got "0x1"'],
    ['an unknown element', '1\nc\n  Xx 0 0 0', 'line 3, columns 3-4 (element): "Xx" is not an element symbol or atomic number'],
    ['atomic number 0', '1\nc\n0 0 0 0', 'line 3, column 1 (element): "0" is not an element symbol or atomic number'],
  ])('refuses %s', (_, text, message) => {
    expect(errorOf(() => readXyz(text)).message).toBe(message);
  });
});

describe('writeXyz', () => {
  it('numbers read back to the same doubles, −0 included', () => {
    const x = Float64Array.of(0.1 + 0.2, -0, 1e-300, -1 / 3, 12345.678901234567, 5e21);
    const s = newStructure(['C', 'O'], x, { title: 't' });
    const [t] = readXyz(writeXyz(s));
    expect(Object.is(t.coordinates[1], -0)).toBe(true);
    expect(Array.from(t.coordinates)).toEqual(Array.from(x));
  });

  it('agrees with xyzFrame where xyzFrame writes the same numbers', () => {
    const x = Float64Array.of(1.5, 2, -3.25);
    expect(writeXyz(newStructure(['Br'], x, { title: 'a\nb' }))).toBe(xyzFrame(['Br'], x, 'a\nb'));
  });

  it('writes several frames that read back as they were', () => {
    const frames = readXyz([WATER, '1', 'second', 'Ne 1 2 3'].join('\n'));
    expect(readXyz(writeXyzFrames(frames))).toEqual(frames);
    const moved = frames.map((f) => f.coordinates.map((v) => v + 1));
    expect(readXyz(writeXyzFrames(frames, moved)).map((f) => Array.from(f.coordinates))).toEqual(moved.map((m) => Array.from(m)));
  });

  it('refuses what it cannot write', () => {
    const s = newStructure(['C'], new Float64Array(3));
    expect(() => writeXyz(s, Float64Array.of(0, NaN, 0))).toThrow('atom 1 (y): NaN is not a finite number');
    expect(() => writeXyz({ ...s, elements: ['CL'] })).toThrow('atom 1: "CL" is not an element symbol (periodic-table case, e.g. "Cl")');
  });
});
