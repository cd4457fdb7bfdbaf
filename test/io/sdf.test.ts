/**
 * SDF/MOL V2000 reading and writing, following "CTfile Formats" (BIOVIA /
 * Dassault Systèmes, 2020 edition): counts line aaabbblllfffcccsssxxxrrrpppiiimmmvvvvvv,
 * atom line x y z (3 × F10.4), symbol (32-34), mass difference (35-36),
 * charge code (37-39: 1 = +3, 2 = +2, 3 = +1, 4 = doublet radical,
 * 5 = −1, 6 = −2, 7 = −3), bond line 111222tttsss (type 4 = aromatic,
 * 5-8 query types), `M  CHG` superseding the atom block's charges, `M  END`,
 * data items, `$$$$`. Column positions and codes as recalled from that
 * document (from memory). Molecules and coordinates are of our own invention.
 */
import { describe, expect, it } from 'vitest';
import { readMol, readSdf, writeMol, writeSdf, writeSdfRecords } from '../../src/io/sdf.js';
import { newStructure, StructureError } from '../../src/io/structure.js';

const RECORDS = [
  'formaldehyde, invented geometry',
  '  handmade  1202260000  3D',
  'first record',
  '  4  3  0  0  0  0  0  0  0  0999 V2000',
  '    0.0000    0.0000    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0',
  '    1.2100    0.0000    0.0000 O   0  0  0  0  0  0  0  0  0  0  0  0',
  '   -0.5500    0.9400    0.0000 H   0  0  0  0  0  0  0  0  0  0  0  0',
  '   -0.5500   -0.9400    0.0000 H   0  0  0  0  0  0  0  0  0  0  0  0',
  '  1  2  2  0  0  0',
  '  1  3  1  0  0  0',
  '  4  1  1  1  0  0',
  'M  END',
  '> <origin>',
  'invented for the tests',
  '',
  '> 7 <note> (two lines)',
  'line one',
  'line two',
  '',
  '$$$$',
  'benzene ring, carbons only',
  '',
  '',
  '  6  6  0  0  0  0  0  0  0  0999 V2000',
  '    1.3900    0.0000    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0',
  '    0.6950    1.2038    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0',
  '   -0.6950    1.2038    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0',
  '   -1.3900    0.0000    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0',
  '   -0.6950   -1.2038    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0',
  '    0.6950   -1.2038    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0',
  '  1  2  4  0  0  0',
  '  2  3  4  0  0  0',
  '  3  4  4  0  0  0',
  '  4  5  4  0  0  0',
  '  5  6  4  0  0  0',
  '  6  1  4  0  0  0',
  'M  END',
  '$$$$',
  'charged fragment',
  '',
  '',
  '  3  2  0  0  1  0  0  0  0  0999 V2000',
  '    0.0000    0.0000    0.0000 N   0  3  0  0  0  0  0  0  0  0  0  0',
  '    1.0000    0.0000    0.0000 O   0  5  0  0  0  0  0  0  0  0  0  0',
  '    2.0000    0.0000    0.0000 C   1  0  0  0  0  0  0  0  0  0  0  0',
  '  1  2  1  0  0  0',
  '  2  3  1  0  0  0',
  'M  CHG  2   1   1   2  -2',
  'M  ISO  1   3  13',
  'M  END',
  '$$$$',
];
const TEXT = RECORDS.join('\n') + '\n';

function errorOf(f: () => unknown): StructureError {
  try {
    f();
  } catch (e) {
    expect(e).toBeInstanceOf(StructureError);
    return e as StructureError;
  }
  throw new Error('expected a StructureError');
}

describe('readSdf', () => {
  const [formaldehyde, benzene, charged] = readSdf(TEXT);

  it('reads every record between $$$$ lines', () => {
    expect(readSdf(TEXT)).toHaveLength(3);
    expect([formaldehyde.title, benzene.title, charged.title]).toEqual(['formaldehyde, invented geometry', 'benzene ring, carbons only', 'charged fragment']);
  });

  it('atoms, coordinates (Å), bonds sorted with the smaller index first, orders', () => {
    expect(formaldehyde.elements).toEqual(['C', 'O', 'H', 'H']);
    expect(formaldehyde.names).toEqual(['', '', '', '']);
    expect(Array.from(formaldehyde.coordinates)).toEqual([0, 0, 0, 1.21, 0, 0, -0.55, 0.94, 0, -0.55, -0.94, 0]);
    expect(Array.from(formaldehyde.bonds!)).toEqual([0, 1, 0, 2, 0, 3]);
    expect(Array.from(formaldehyde.bondOrders!)).toEqual([2, 1, 1]);
  });

  it('keeps the direction and stereo of each bond as written (a wedge starts at its first atom)', () => {
    expect(formaldehyde.record.bonds[2]).toEqual({ from: 3, to: 0, stereo: 1, trailing: '  0  0', fileIndex: 2 });
    expect(writeSdf(formaldehyde).split('\n')[10]).toBe('  4  1  1  1  0  0');
  });

  it('aromatic bond type 4 is order 1.5', () => {
    expect(Array.from(benzene.bondOrders!)).toEqual([1.5, 1.5, 1.5, 1.5, 1.5, 1.5]);
    expect(Array.from(benzene.bonds!)).toEqual([0, 1, 0, 5, 1, 2, 2, 3, 3, 4, 4, 5]);
  });

  it('keeps the header lines and the data items', () => {
    expect(formaldehyde.record.headerLines).toEqual(['formaldehyde, invented geometry', '  handmade  1202260000  3D', 'first record']);
    expect(formaldehyde.record.dataItems).toEqual([
      { name: 'origin', header: '> <origin>', lines: ['invented for the tests'] },
      { name: 'note', header: '> 7 <note> (two lines)', lines: ['line one', 'line two'] },
    ]);
  });

  it('M  CHG supersedes the atom block charges (CTfile rule), with a note where they differ', () => {
    expect(Array.from(charged.formalCharges)).toEqual([1, -2, 0]);
    expect(charged.record.chargeLines).toBe(true);
    expect(charged.notes).toEqual([
      "line 44: the atom block's charge -1 of atom 2 is ignored: M  CHG/M  RAD lines are present, and they give -2",
    ]);
  });

  it('M  RAD alone also makes the atom block charges ignored; a charge set later is written as M  CHG', () => {
    const lines = ['radical', '', '', '  2  1  0  0  0  0  0  0  0  0999 V2000',
      '    0.0000    0.0000    0.0000 C   0  3  0  0  0  0  0  0  0  0  0  0',
      '    1.0000    0.0000    0.0000 O   0  0  0  0  0  0  0  0  0  0  0  0',
      '  1  2  1  0  0  0', 'M  RAD  1   1   2', 'M  END'];
    const [s] = readSdf(lines.join('\n'));
    expect(Array.from(s.formalCharges)).toEqual([0, 0]);
    expect(s.record.properties).toEqual(['M  RAD  1   1   2']);
    expect(s.notes).toEqual(["line 5: the atom block's charge +1 of atom 1 is ignored: M  CHG/M  RAD lines are present, and they give 0"]);
    s.formalCharges[1] = -1;
    const text = writeSdf(s);
    expect(text).toContain('\nM  CHG  1   2  -1\nM  RAD  1   1   2\nM  END\n');
    expect(Array.from(readSdf(text)[0].formalCharges)).toEqual([0, -1]);
  });

  it('keeps M  ISO, the mass difference, the chiral flag', () => {
    expect(charged.record.properties).toEqual(['M  ISO  1   3  13']);
    expect(charged.record.atoms[2].massDifference).toBe(1);
    expect(charged.record.chiralFlag).toBe(1);
  });

  it('atom-block charge codes 1-7 give +3 … −3, code 4 a radical of charge 0', () => {
    const lines = RECORDS.slice(38, 47);
    lines[3] = '  7  0  0  0  0  0  0  0  0  0999 V2000';
    const atoms = [1, 2, 3, 4, 5, 6, 7].map((c) => `    0.0000    0.0000    0.0000 C   0  ${c}  0  0  0  0  0  0  0  0  0  0`);
    const [s] = readSdf([...lines.slice(0, 4), ...atoms, 'M  END'].join('\n'));
    expect(Array.from(s.formalCharges)).toEqual([3, 2, 1, 0, -1, -2, -3]);
    expect(s.record.atoms.map((a) => a.radical)).toEqual([false, false, false, true, false, false, false]);
    expect(s.notes).toEqual([]);
    expect(readSdf(writeSdf(s))).toEqual([s]);
  });

  it('accepts atom lines that stop after the symbol, and a file without $$$$', () => {
    const [s] = readSdf(['short', '', '', '  1  0  0  0  0  0  0  0  0  0999 V2000', '    1.0000    2.0000    3.0000 Cl', 'M  END'].join('\n'));
    expect(s.elements).toEqual(['Cl']);
    expect(s.record.atoms[0]).toEqual({ massDifference: 0, radical: false, stereoFields: '' });
    expect(Array.from(s.bonds!)).toEqual([]);
    expect(Array.from(s.bondOrders!)).toEqual([]);
  });

  it('notes a record without M  END', () => {
    const [s] = readSdf(RECORDS.slice(38, 47).join('\n'));
    expect(s.notes).toEqual(['line 9: record 1 has no "M  END" line; its connection table was taken to end here']);
  });
});

describe('readSdf: errors name the line and columns', () => {
  const first = RECORDS.slice(0, 20);
  const edit = (index: number, line: string) => first.map((l, i) => (i === index ? line : l)).join('\n');
  it.each([
    ['V3000', edit(3, '  0  0  0     0  0            999 V3000'), 'line 4, columns 34-39 (version): V3000 is not supported; save as V2000'],
    ['a count that is not a number', edit(3, 'abc  3  0  0  0  0  0  0  0  0999 V2000'), 'line 4, columns 1-3 (atom count): expected a whole number, got "abc"'],
    ['an unknown version', edit(3, '  4  3  0  0  0  0  0  0  0  0999 V9999'), 'line 4, columns 34-39 (version): expected V2000, got "V9999"'],
    ['atom lists', edit(3, '  4  3  1  0  0  0  0  0  0  0999 V2000'), 'line 4, columns 7-9 (atom list count): atom lists (query structures) are not supported'],
    ['a bad coordinate', edit(5, '    1.2100    0.0.00    0.0000 O   0  0  0  0  0  0  0  0  0  0  0  0'), 'line 6, columns 11-20 (y): expected a number, got "0.0.00"'],
    ['an unknown symbol', edit(5, '    1.2100    0.0000    0.0000 Q   0  0  0  0  0  0  0  0  0  0  0  0'), 'line 6, columns 32-34 (symbol): "Q" is not an element symbol (query atoms, pseudo-atoms and other letter cases are not read)'],
    ['a symbol in the wrong case', edit(5, '    1.2100    0.0000    0.0000 CL  0  0  0  0  0  0  0  0  0  0  0  0'), 'line 6, columns 32-34 (symbol): "CL" is not an element symbol (query atoms, pseudo-atoms and other letter cases are not read)'],
    ['a charge code out of range', edit(5, '    1.2100    0.0000    0.0000 O   0  8  0  0  0  0  0  0  0  0  0  0'), 'line 6, columns 37-39 (charge): expected a charge code 0-7, got 8'],
    ['a bond to an atom out of range', edit(9, '  1  9  1  0  0  0'), 'line 10, columns 4-6 (second atom): atom 9 is out of range (the record has 4 atoms)'],
    ['a self bond', edit(9, '  3  3  1  0  0  0'), 'line 10: bond 2 joins atom 3 to itself'],
    ['a duplicated bond', edit(9, '  2  1  1  0  0  0'), 'line 10: bond 1-2 is given twice (first on line 9)'],
    ['a query bond type', edit(9, '  1  3  8  0  0  0'), 'line 10, columns 7-9 (bond type): bond type 8 ("any") is a query type and is not supported'],
    ['a bond type that does not exist', edit(9, '  1  3  9  0  0  0'), 'line 10, columns 7-9 (bond type): bond type 9 is not a CTfile bond type (1-8)'],
    ['more atoms counted than given', edit(3, '  5  3  0  0  0  0  0  0  0  0999 V2000'), 'line 9: expected atom 5 of 5 (the counts line, line 4, says 5 atoms), got what looks like a bond line: "1  2  2  0  0  0"'],
    ['fewer bonds counted than given', edit(3, '  4  2  0  0  0  0  0  0  0  0999 V2000'), 'line 11: expected a property line ("M  …") or "M  END" after the 4 atoms and 2 bonds the counts line (line 4) gives, got "4  1  1  1  0  0"; does the counts line agree with the blocks?'],
    ['more bonds counted than given', edit(3, '  4  4  0  0  0  0  0  0  0  0999 V2000'), 'line 12: the bond block ends after 3 bonds; the counts line (line 4) says 4'],
    ['M  CHG to an atom out of range', edit(11, 'M  CHG  1   7   1'), 'line 12, columns 10-13 (atom): atom 7 is out of range (the record has 4 atoms)'],
    ['a stray line among the data items', edit(15, 'stray'), 'line 16: expected a data item header ("> <name>") or "$$$$", got "stray"'],
    ['a truncated file', first.slice(0, 6).join('\n'), 'line 7: the atom block ends after 2 atoms; the counts line (line 4) says 4'],
    ['a file that ends in the header', first.slice(0, 2).join('\n'), 'line 3: the file ends inside record 1: header line 3 is missing'],
    ['empty input', '\n\n', 'the input is empty'],
  ])('%s', (_, text, message) => {
    expect(errorOf(() => readSdf(text)).message).toBe(message);
  });
});

describe('writeSdf', () => {
  it('writes every record back so that it reads the same', () => {
    const all = readSdf(TEXT);
    const text = writeSdfRecords(all);
    const again = readSdf(text);
    // The charge note is not repeated: the atom block written agrees with M  CHG.
    expect(again.map((s) => s.notes)).toEqual([[], [], []]);
    expect(again).toEqual(all.map((s) => ({ ...s, notes: [] })));
  });

  it('writes the file it read line for line when it follows the usual layout', () => {
    const all = readSdf(TEXT);
    expect(writeSdfRecords(all.slice(0, 2))).toBe(RECORDS.slice(0, 38).join('\n') + '\n');
  });

  it('writes charges as atom-block codes, and as M  CHG when they were read so or do not fit a code', () => {
    const s = newStructure(['N', 'O', 'Fe'], new Float64Array(9), { formalCharges: Int32Array.of(1, -1, 0) });
    const text = writeSdf(s);
    expect(text.split('\n')[4]).toBe('    0.0000    0.0000    0.0000 N   0  3  0  0  0  0  0  0  0  0  0  0');
    expect(text).not.toContain('M  CHG');
    s.formalCharges[2] = 4;
    const withLines = writeSdf(s);
    expect(withLines).toContain('\nM  CHG  3   1   1   2  -1   3   4\n');
    expect(Array.from(readSdf(withLines)[0].formalCharges)).toEqual([1, -1, 4]);
  });

  it('gives a structure from another format a plain header and zero stereo fields', () => {
    const s = newStructure(['O', 'H', 'H'], Float64Array.of(0, 0, 0.117, 0, 0.757, -0.469, 0, -0.757, -0.469), {
      title: 'water',
      bonds: Int32Array.of(1, 0, 0, 2),
      bondOrders: Float64Array.of(1, 1),
    });
    expect(writeMol(s)).toBe(
      [
        'water',
        '  strainws          3D',
        '',
        '  3  2  0  0  0  0  0  0  0  0999 V2000',
        '    0.0000    0.0000    0.1170 O   0  0  0  0  0  0  0  0  0  0  0  0',
        '    0.0000    0.7570   -0.4690 H   0  0  0  0  0  0  0  0  0  0  0  0',
        '    0.0000   -0.7570   -0.4690 H   0  0  0  0  0  0  0  0  0  0  0  0',
        '  1  2  1  0',
        '  1  3  1  0',
        'M  END',
        '',
      ].join('\n'),
    );
  });

  it('refuses values that do not fit', () => {
    const s = newStructure(['C'], Float64Array.of(100000, 0, 0));
    expect(() => writeSdf(s)).toThrow('atom 1 (x): 100000 does not fit columns of 10 with 4 decimals (10.4)');
    const t = newStructure(['C', 'C'], new Float64Array(6), { bonds: Int32Array.of(0, 1), bondOrders: Float64Array.of(2.5) });
    expect(() => writeSdf(t)).toThrow('bond 1: order 2.5 is not 1, 2, 3 or 1.5');
    expect(() => writeSdf(newStructure(['C'], new Float64Array(3), { formalCharges: Int32Array.of(16) }))).toThrow('atom 1: formal charge 16 is outside −15 … 15');
  });
});

describe('readMol / writeMol', () => {
  it('a MOL file is one record, with or without $$$$', () => {
    const mol = RECORDS.slice(20, 37).join('\n') + '\n';
    const [s] = readMol(mol);
    expect(s.elements).toHaveLength(6);
    expect(writeMol(s)).toBe(mol);
    expect(readMol(mol + '$$$$\n')).toHaveLength(1);
  });

  it('refuses a MOL file with several records', () => {
    expect(errorOf(() => readMol(TEXT)).message).toBe('a MOL file holds one structure; this one has 3 records (read it as SDF)');
  });
});
