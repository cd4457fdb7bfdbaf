/**
 * PDB reading and writing. Column positions are those of the wwPDB "Atomic
 * Coordinate Entry Format Description", version 3.3 (ATOM/HETATM, CONECT,
 * MODEL, TER, TITLE records), as recalled (from memory) — the positions
 * used are the ones listed in docs/structure-files.md. Molecules are of our
 * own invention (methanol-like and water-like fragments, invented coordinates).
 */
import { describe, expect, it } from 'vitest';
import { elementFromAtomName, readPdb, writePdb, writePdbModels } from '../../src/io/pdb.js';
import { newStructure, StructureError } from '../../src/io/structure.js';

const METHANOL = [
  'HEADER    INVENTED LIGAND                         02-DEC-26   XXXX',
  'TITLE     AN INVENTED METHANOL FRAGMENT WITH A CHLORINE AND',
  'TITLE    2 TWO CHARGED ATOMS',
  'REMARK   1 THIS LINE IS SKIPPED',
  'HETATM    1  C1  MOH A   1      -0.748   0.015   0.024  1.00  0.00           C',
  'HETATM    2  O1  MOH A   1       0.558  -0.420  -0.278  1.00  0.00           O',
  'HETATM    3  H1  MOH A   1      -1.416  -0.810  -0.208  1.00  0.00',
  'HETATM    4 CL1  MOH A   1       1.000   0.500   0.100  1.00  0.00',
  'TER       5      MOH A   1',
  'HETATM    6  N1  AMM B   2       3.000   0.000   0.000  1.00  0.00           N1+',
  'HETATM    7  O2  AMM B   2       4.000   0.000   0.000  1.00  0.00           o1-',
  'CONECT    1    2    3    4',
  'CONECT    2    1',
  'CONECT    6    7',
  'CONECT    7    6',
  'END',
  'HETATM    9  C9  MOH A   1       9.000   9.000   9.000  1.00  0.00           C',
].join('\n');

function errorOf(f: () => unknown): StructureError {
  try {
    f();
  } catch (e) {
    expect(e).toBeInstanceOf(StructureError);
    return e as StructureError;
  }
  throw new Error('expected a StructureError');
}

describe('readPdb: fields', () => {
  const [s] = readPdb(METHANOL);

  it('reads atoms, elements (77-78 or from the name), charges (79-80) and coordinates', () => {
    expect(s.format).toBe('pdb');
    expect(s.elements).toEqual(['C', 'O', 'H', 'Cl', 'N', 'O']);
    expect(s.names).toEqual(['C1', 'O1', 'H1', 'CL1', 'N1', 'O2']);
    expect(Array.from(s.formalCharges)).toEqual([0, 0, 0, 0, 1, -1]);
    expect(Array.from(s.coordinates)).toEqual([
      -0.748, 0.015, 0.024, 0.558, -0.42, -0.278, -1.416, -0.81, -0.208, 1, 0.5, 0.1, 3, 0, 0, 4, 0, 0,
    ]);
  });

  it('stops at END', () => {
    expect(s.elements).toHaveLength(6);
  });

  it('joins TITLE continuation lines (text from column 11)', () => {
    expect(s.title).toBe('AN INVENTED METHANOL FRAGMENT WITH A CHLORINE AND TWO CHARGED ATOMS');
    expect(s.record.header).toBe('HEADER    INVENTED LIGAND                         02-DEC-26   XXXX');
  });

  it('CONECT gives bonds (each pair once, smaller index first, sorted); orders unknown', () => {
    expect(Array.from(s.bonds!)).toEqual([0, 1, 0, 2, 0, 3, 4, 5]);
    expect(s.bondOrders).toBeNull();
  });

  it('keeps the record fields and where TER was', () => {
    expect(s.record.atoms[4]).toEqual({
      record: 'HETATM',
      serial: 6,
      nameField: ' N1 ',
      altLoc: '',
      residueName: 'AMM',
      chain: 'B',
      residueNumber: 2,
      insertionCode: '',
      occupancy: 1,
      bFactor: 0,
      segment: '',
    });
    expect(s.record.terAfter).toEqual([3]);
    expect(s.record.modelNumber).toBeNull();
  });

  it('notes each element taken from an atom name', () => {
    expect(s.notes).toEqual([
      'line 7: element H taken from atom name " H1 " (columns 77-78 are blank)',
      'line 8: element Cl taken from atom name "CL1 " (columns 77-78 are blank)',
    ]);
  });

  it('without CONECT, bonds are null; the HEADER classification is the title when there is no TITLE', () => {
    const [t] = readPdb(METHANOL.split('\n').filter((l) => !l.startsWith('CONECT') && !l.startsWith('TITLE')).join('\n'));
    expect(t.bonds).toBeNull();
    expect(t.title).toBe('INVENTED LIGAND');
  });
});

describe('elementFromAtomName (element symbol right-justified in columns 13-14, PDB convention)', () => {
  // Each case follows from the rule in src/io/pdb.ts; the alignment convention is PDB v3.3 practice (from memory).
  it.each([
    [' CA ', 'C'], // column 13 blank: column 14
    ['CA  ', 'Ca'], // two letters in 13-14 that make an element
    ['CL1 ', 'Cl'],
    ['FE  ', 'Fe'],
    ['1HB ', 'H'], // digit in column 13: column 14
    ['HG12', 'H'], // four-column name starting with H: hydrogen
    ['HG  ', 'Hg'],
    ['C1  ', 'C'], // letter, then a digit
    ['CX  ', 'C'], // two letters that are no element: column 13
    ['    ', undefined],
    ['1234', undefined],
  ])('%j → %s', (field, element) => {
    expect(elementFromAtomName(field)).toBe(element);
  });
});

const WATER_ALT = [
  'ATOM      1  O  AHOH W   7       0.000   0.000   0.117  0.60 10.50           O',
  'ATOM      2  O  BHOH W   7       0.100   0.000   0.117  0.40 10.50           O',
  'ATOM      3  H1  HOH W   7       0.000   0.757  -0.469  1.00 11.00           H',
  'ATOM      4  H2  HOH W   7       0.000  -0.757  -0.469  1.00 11.00           H',
  'CONECT    2    3    4',
  'CONECT    1    3',
];

describe('readPdb: alternate locations', () => {
  it('keeps the first location seen, drops the others with a note; CONECT to a dropped one goes to the kept atom', () => {
    const [s] = readPdb(WATER_ALT.join('\n'));
    expect(s.elements).toEqual(['O', 'H', 'H']);
    expect(Array.from(s.coordinates.subarray(0, 3))).toEqual([0, 0, 0.117]);
    expect(s.record.atoms[0].altLoc).toBe('A');
    expect(s.record.atoms[0].occupancy).toBe(0.6);
    expect(s.notes).toEqual(['line 2: alternate location B of atom O dropped; A kept']);
    expect(Array.from(s.bonds!)).toEqual([0, 1, 0, 2]);
  });

  it('a location B seen first is the one kept', () => {
    const lines = [WATER_ALT[1], WATER_ALT[0], ...WATER_ALT.slice(2, 4)];
    const [s] = readPdb(lines.join('\n'));
    expect(s.coordinates[0]).toBe(0.1);
    expect(s.notes).toEqual(['line 2: alternate location A of atom O dropped; B kept']);
  });
});

function twoModels(second = ['ATOM      1  O   HOH W   1       0.000   0.000   0.200  1.00  0.00           O',
  'ATOM      2  H1  HOH W   1       0.000   0.800  -0.400  1.00  0.00           H',
  'ATOM      3  H2  HOH W   1       0.000  -0.800  -0.400  1.00  0.00           H']): string {
  return [
    'MODEL        1',
    'ATOM      1  O   HOH W   1       0.000   0.000   0.117  1.00  0.00           O',
    'ATOM      2  H1  HOH W   1       0.000   0.757  -0.469  1.00  0.00           H',
    'ATOM      3  H2  HOH W   1       0.000  -0.757  -0.469  1.00  0.00           H',
    'ENDMDL',
    'MODEL        2',
    ...second,
    'ENDMDL',
    'CONECT    1    2    3',
    'END',
  ].join('\n');
}

describe('readPdb: MODEL/ENDMDL', () => {
  it('gives one structure per model, CONECT applying to all', () => {
    const models = readPdb(twoModels());
    expect(models).toHaveLength(2);
    expect(models.map((m) => m.record.modelNumber)).toEqual([1, 2]);
    expect(models[0].coordinates[2]).toBe(0.117);
    expect(models[1].coordinates[2]).toBe(0.2);
    for (const m of models) expect(Array.from(m.bonds!)).toEqual([0, 1, 0, 2]);
  });

  it('takes a model serial written out of columns 11-14 when it is alone on the line', () => {
    const loose = twoModels().replace('MODEL        2', 'MODEL 2');
    expect(readPdb(loose).map((m) => m.record.modelNumber)).toEqual([1, 2]);
    expect(errorOf(() => readPdb(twoModels().replace('MODEL        2', 'MODEL     two'))).message).toBe(
      'line 6, columns 11-14 (model serial): expected a whole number, got "two"',
    );
  });

  it('writes them back as models', () => {
    const models = readPdb(twoModels());
    const text = writePdbModels(models);
    expect(text.split('\n').filter((l) => /^(MODEL|ENDMDL|END$)/.test(l))).toEqual(['MODEL        1', 'ENDMDL', 'MODEL        2', 'ENDMDL', 'END']);
    expect(readPdb(text)).toEqual(models);
  });

  it('refuses models with different atoms', () => {
    expect(errorOf(() => readPdb(twoModels(['ATOM      1  O   HOH W   1       0.000   0.000   0.200  1.00  0.00           O']))).message).toBe(
      'line 6: model 2 has 1 atoms; model 1 has 3 (every model must have the same atoms)',
    );
    const swapped = ['ATOM      1  H1  HOH W   1       0.000   0.000   0.200  1.00  0.00           H',
      'ATOM      2  O   HOH W   1       0.000   0.800  -0.400  1.00  0.00           O',
      'ATOM      3  H2  HOH W   1       0.000  -0.800  -0.400  1.00  0.00           H'];
    expect(errorOf(() => readPdb(twoModels(swapped))).message).toBe(
      'line 7: atom 1 of model 2 is "H1" (H); in model 1 it is "O" (O) (every model must have the same atoms)',
    );
  });

  it('refuses MODEL without ENDMDL, ENDMDL without MODEL, and atoms outside models', () => {
    const lines = twoModels().split('\n');
    expect(errorOf(() => readPdb(lines.slice(0, 9).join('\n'))).message).toBe('line 6: MODEL 2 has no ENDMDL (is the file truncated?)');
    expect(errorOf(() => readPdb(lines.filter((_, i) => i !== 0).join('\n'))).message).toBe('line 4: ENDMDL without a MODEL before it');
    expect(errorOf(() => readPdb(lines.filter((_, i) => i !== 5).join('\n'))).message).toBe('line 6: ATOM record outside MODEL/ENDMDL in a file that has MODEL records');
    expect(errorOf(() => readPdb(lines.filter((_, i) => i !== 4).join('\n'))).message).toBe('line 5: MODEL before the ENDMDL of the model on line 1');
    const outside = [...lines.slice(0, 5), lines[1], ...lines.slice(5)];
    expect(errorOf(() => readPdb(outside.join('\n'))).message).toBe('line 6: ATOM record outside MODEL/ENDMDL in a file that has MODEL records');
  });
});

describe('readPdb: errors name the line and columns', () => {
  const base = METHANOL.split('\n');
  const edit = (index: number, line: string) => base.map((l, i) => (i === index ? line : l)).join('\n');
  it.each([
    ['a bad number', edit(4, 'HETATM    1  C1  MOH A   1      -0.748   1.2.3   0.024  1.00  0.00           C'), 'line 5, columns 39-46 (y): expected a number, got "1.2.3"'],
    ['a blank coordinate (short line)', edit(4, 'HETATM    1  C1  MOH A   1      -0.748   0.015'), 'line 5, columns 47-54 (z): expected a number, got ""'],
    ['a bad serial', edit(4, 'HETATM    x  C1  MOH A   1      -0.748   0.015   0.024  1.00  0.00           C'), 'line 5, columns 7-11 (serial): expected a whole number, got "x"'],
    ['an unknown element', edit(4, 'HETATM    1  C1  MOH A   1      -0.748   0.015   0.024  1.00  0.00          XX'), 'line 5, columns 77-78 (element): "XX" is not an element symbol'],
    ['an element that cannot be told from the name', edit(4, 'HETATM    1 1234 MOH A   1      -0.748   0.015   0.024  1.00  0.00'), 'line 5, columns 13-16 (name): columns 77-78 (element) are blank and no element can be told from the atom name "1234"'],
    ['a bad charge', edit(4, 'HETATM    1  C1  MOH A   1      -0.748   0.015   0.024  1.00  0.00           C+2'), 'line 5, columns 79-80 (charge): expected a charge such as "2+" or "1-", got "+2"'],
    ['a serial used twice', edit(5, 'HETATM    1  O1  MOH A   1       0.558  -0.420  -0.278  1.00  0.00           O'), 'line 6, columns 7-11 (serial): atom serial 1 is used twice (first on line 5)'],
    ['CONECT to a serial no atom has', edit(12, 'CONECT    2   17'), 'line 13, columns 12-16 (bonded atom serial): no atom has serial 17'],
    ['CONECT from a serial no atom has', edit(12, 'CONECT   17    2'), 'line 13, columns 7-11 (atom serial): no atom has serial 17'],
    ['CONECT of an atom to itself', edit(12, 'CONECT    2    2'), 'line 13, columns 12-16 (bonded atom serial): atom serial 2 is bonded to itself'],
    ['empty input', '\n  \n', 'the input is empty'],
    ['no atoms', 'HEADER    NOTHING\nEND\n', 'no ATOM or HETATM records in the input'],
  ])('%s', (_, text, message) => {
    const e = errorOf(() => readPdb(text));
    expect(e.message).toBe(message);
  });

  it('the error carries line and field', () => {
    const e = errorOf(() => readPdb(edit(4, 'HETATM    1  C1  MOH A   1      -0.748   1.2.3   0.024  1.00  0.00           C')));
    expect([e.line, e.field, e.columns, e.detail]).toEqual([5, 'y', [39, 46], 'expected a number, got "1.2.3"']);
  });
});

describe('writePdb', () => {
  it('writes back what was read (same structure on reading again) and TER where it was', () => {
    const [s] = readPdb(METHANOL);
    const text = writePdb(s);
    const [t] = readPdb(text);
    expect({ ...t, notes: [] }).toEqual({ ...s, notes: [] });
    expect(t.notes).toEqual([]); // elements are now in columns 77-78
    expect(text.split('\n')[6]).toBe('TER       5      MOH A   1');
  });

  it('lays an ATOM line out in the PDB v3.3 columns, character by character', () => {
    // Expected positions: PDB v3.3 ATOM record (from memory; listed in docs/structure-files.md).
    const [s] = readPdb('ATOM      1  O   HOH W   7       0.000   0.000   0.117  1.00 10.50           O\n');
    s.record.atoms[0] = { ...s.record.atoms[0], serial: 12345, altLoc: 'A', insertionCode: 'B', residueNumber: -12, segment: 'SEG1' };
    s.names[0] = 'CL12';
    s.elements[0] = 'Cl';
    s.formalCharges[0] = -1;
    const line = writePdb(s, Float64Array.of(-123.4567, 1234.5, 0.0004)).split('\n')[0];
    const col = (a: number, b: number) => line.slice(a - 1, b);
    expect(line).toHaveLength(80);
    expect(col(1, 6)).toBe('ATOM  '); // record name
    expect(col(7, 11)).toBe('12345'); // serial, right-justified
    expect(col(12, 12)).toBe(' ');
    expect(col(13, 16)).toBe('CL12'); // atom name
    expect(col(17, 17)).toBe('A'); // altLoc
    expect(col(18, 20)).toBe('HOH'); // residue name
    expect(col(21, 21)).toBe(' ');
    expect(col(22, 22)).toBe('W'); // chain
    expect(col(23, 26)).toBe(' -12'); // residue number
    expect(col(27, 27)).toBe('B'); // insertion code
    expect(col(28, 30)).toBe('   ');
    expect(col(31, 38)).toBe('-123.457'); // x, 8.3
    expect(col(39, 46)).toBe('1234.500'); // y
    expect(col(47, 54)).toBe('   0.000'); // z (0.0004 rounds to 0.000, written without a sign)
    expect(col(55, 60)).toBe('  1.00'); // occupancy 6.2
    expect(col(61, 66)).toBe(' 10.50'); // temperature factor 6.2
    expect(col(67, 72)).toBe('      ');
    expect(col(73, 76)).toBe('SEG1'); // segment (PDB v2 columns 73-76)
    expect(col(77, 78)).toBe('CL'); // element, right-justified
    expect(col(79, 80)).toBe('1-'); // charge
  });

  it('aligns new names by the element convention, and a one-letter element right-justified', () => {
    const s = newStructure(['C', 'Cl', 'O'], Float64Array.of(0, 0, 0, 1, 0, 0, 2, 0, 0), { names: ['C1', 'CL2', ''], formalCharges: Int32Array.of(0, 0, 2) });
    const lines = writePdb(s).split('\n');
    expect(lines[0]).toBe('HETATM    1  C1  UNL     1       0.000   0.000   0.000  1.00  0.00           C  ');
    expect(lines[1].slice(12, 16)).toBe('CL2 ');
    expect(lines[2].slice(12, 16)).toBe(' O1 '); // a missing name: element + running number
    expect(lines[2].slice(76, 80)).toBe(' O2+');
    expect(readPdb(lines.join('\n')).map((t) => t.elements)).toEqual([['C', 'Cl', 'O']]);
  });

  it('lists each bond from both atoms in CONECT, four partners per line', () => {
    const x = new Float64Array(18);
    const s = newStructure(['C', 'H', 'H', 'H', 'H', 'H'], x, { bonds: Int32Array.of(0, 1, 0, 2, 0, 3, 0, 4, 0, 5) });
    const conect = writePdb(s).split('\n').filter((l) => l.startsWith('CONECT'));
    expect(conect[0]).toBe('CONECT    1    2    3    4    5');
    expect(conect[1]).toBe('CONECT    1    6');
    expect(conect[2]).toBe('CONECT    2    1');
    expect(Array.from(readPdb(writePdb(s))[0].bonds!)).toEqual(Array.from(s.bonds!));
  });

  it('a pair listed more than once is one bond', () => {
    const [s] = readPdb([WATER_ALT[0], WATER_ALT[2], 'CONECT    1    3    3', 'CONECT    3    1'].join('\n'));
    expect(Array.from(s.bonds!)).toEqual([0, 1]);
  });

  it('refuses values that do not fit their columns', () => {
    const s = newStructure(['C'], Float64Array.of(10000, 0, 0));
    expect(() => writePdb(s)).toThrow('atom 1 (x): 10000 does not fit 8 columns with 3 decimals');
    expect(() => writePdb(s, Float64Array.of(-999.9996, 0, 0))).toThrow('atom 1 (x): -999.9996 does not fit 8 columns with 3 decimals');
    expect(() => writePdb(newStructure(['C'], new Float64Array(3), { names: ['CARBON'] }))).toThrow('atom 1 (name): "CARBON" is longer than 4 characters');
    expect(() => writePdb(newStructure(['C'], new Float64Array(3), { formalCharges: Int32Array.of(10) }))).toThrow('atom 1: formal charge 10 does not fit columns 79-80');
    expect(() => writePdb(s, new Float64Array(2))).toThrow('coordinates: expected 3N = 3 numbers, got 2');
  });

  it('writes new coordinates in place of the structure\'s own', () => {
    const [s] = readPdb(METHANOL);
    const x = s.coordinates.map((v) => v + 1);
    const [t] = readPdb(writePdb(s, x));
    for (let i = 0; i < x.length; i++) expect(t.coordinates[i]).toBeCloseTo(x[i], 3);
    expect(s.coordinates[0]).toBe(-0.748); // the structure is not changed
  });
});
