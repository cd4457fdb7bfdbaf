/**
 * Round trips: for random structures within what each format holds,
 * read(write(s)) equals s in every field. Coordinates are drawn on each
 * format's grid (PDB 8.3 → multiples of 0.001 Å, SDF 10.4 → multiples of
 * 0.0001 Å) so they come back as the same doubles; XYZ takes any finite
 * double. Equality is true by construction of the formats (no outside value).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ELEMENT_SYMBOLS } from '../../src/elements.js';
import { readPdb, writePdb, writePdbModels } from '../../src/io/pdb.js';
import { readSdf, writeSdfRecords } from '../../src/io/sdf.js';
import { STRUCTURE_FORMATS } from '../../src/io/structure-format.js';
import {
  newStructure,
  sortBonds,
  type PdbAtomRecord,
  type PdbStructure,
  type SdfStructure,
  type XyzStructure,
} from '../../src/io/structure.js';
import { readXyz, writeXyzFrames } from '../../src/io/xyz.js';

const RUNS = { numRuns: 150 };
const element = fc.constantFrom(...ELEMENT_SYMBOLS);
const upperWord = (max: number) => fc.stringMatching(new RegExp(`^[A-Z0-9]{0,${max}}$`));
const grid = (min: number, max: number, scale: number) => fc.integer({ min: Math.round(min * scale), max: Math.round(max * scale) }).map((k) => k / scale);
const words = fc.array(fc.stringMatching(/^[A-Za-z0-9,().-]{1,12}$/), { maxLength: 20 }).map((w) => w.join(' '));

/** Distinct bonded pairs among n atoms, in the Structure layout. */
function bondsOf(n: number): fc.Arbitrary<[number, number][]> {
  if (n < 2) return fc.constant([]);
  const pair = fc.tuple(fc.integer({ min: 0, max: n - 1 }), fc.integer({ min: 0, max: n - 1 })).filter(([a, b]) => a !== b);
  return fc.uniqueArray(pair, { maxLength: 2 * n, selector: ([a, b]) => Math.min(a, b) * n + Math.max(a, b) });
}

describe('PDB round trip', () => {
  // Built once: making a stringMatching arbitrary is costly, drawing from it is not.
  const atomFields = fc
      .record({
        record: fc.constantFrom('ATOM' as const, 'HETATM' as const),
        name: upperWord(4),
        shifted: fc.boolean(),
        altLoc: fc.constantFrom('', 'A'),
        residueName: upperWord(3),
        chain: fc.constantFrom('', 'A', 'z'),
        residueNumber: fc.option(fc.integer({ min: -999, max: 9999 })),
        insertionCode: fc.constantFrom('', 'B'),
        occupancy: fc.option(grid(-99.99, 999.99, 100)),
        bFactor: fc.option(grid(-99.99, 999.99, 100)),
        segment: upperWord(4),
      })
      .map(({ name, shifted, ...rest }) => ({ name, rest: { ...rest, nameField: shifted && name.length < 4 ? ` ${name}`.padEnd(4) : name.padEnd(4) } }));
  const pdbAtom = (serial: number): fc.Arbitrary<{ r: PdbAtomRecord; name: string }> =>
    atomFields.map(({ name, rest }) => ({ name, r: { ...rest, serial } }));

  const structure = fc
    .integer({ min: 1, max: 10 })
    .chain((n) =>
      fc.record({
        n: fc.constant(n),
        serials: fc.uniqueArray(fc.integer({ min: -9999, max: 99999 }), { minLength: n, maxLength: n }),
        elements: fc.array(element, { minLength: n, maxLength: n }),
        charges: fc.array(fc.integer({ min: -9, max: 9 }), { minLength: n, maxLength: n }),
        x: fc.array(grid(-999.999, 9999.999, 1000), { minLength: 3 * n, maxLength: 3 * n }),
        bonds: fc.option(bondsOf(n)),
        title: words,
        header: fc.boolean(),
        modelNumber: fc.option(fc.integer({ min: 0, max: 9999 })),
        ter: fc.uniqueArray(fc.integer({ min: 0, max: n - 1 }), { maxLength: 3 }),
        extra: fc.constant(null),
      }),
    )
    .chain((g) => fc.tuple(fc.constant(g), fc.tuple(...g.serials.map(pdbAtom))))
    .map(([g, atoms]): PdbStructure => ({
      title: g.title,
      elements: g.elements,
      names: atoms.map((a) => a.name),
      formalCharges: Int32Array.from(g.charges),
      coordinates: Float64Array.from(g.x),
      // A file with CONECT records but no bond in them cannot be written: no bonds there means none given.
      bonds: g.bonds && g.bonds.length > 0 ? sortBonds(g.bonds).bonds : null,
      bondOrders: null,
      notes: [],
      format: 'pdb',
      record: {
        format: 'pdb',
        header: g.header && g.title !== '' ? 'HEADER    INVENTED' : null,
        modelNumber: g.modelNumber,
        atoms: atoms.map((a) => a.r),
        terAfter: [...g.ter].sort((a, b) => a - b),
      },
    }));

  it('read(write(s)) equals s', () => {
    fc.assert(
      fc.property(structure, (s) => {
        expect(readPdb(writePdb(s))).toEqual([s]);
      }),
      RUNS,
    );
  });

  it('several models of the same atoms come back as they were', () => {
    fc.assert(
      fc.property(structure, fc.array(grid(-999.999, 9999.999, 1000), { minLength: 30, maxLength: 30 }), (s, y) => {
        const second: PdbStructure = { ...s, coordinates: Float64Array.from(y.slice(0, s.coordinates.length)), record: { ...s.record, modelNumber: 7 } };
        const first: PdbStructure = { ...s, record: { ...s.record, modelNumber: 3 } };
        expect(readPdb(writePdbModels([first, second]))).toEqual([first, second]);
      }),
      { numRuns: 50 },
    );
  });
});

describe('SDF round trip', () => {
  const dataItems = fc.array(
    fc.record({ name: fc.stringMatching(/^[A-Za-z0-9_ ]{0,10}$/), lines: fc.array(fc.stringMatching(/^[A-Za-z0-9][A-Za-z0-9 .,>]{0,20}[A-Za-z0-9.]$/), { maxLength: 3 }) }),
    { maxLength: 3 },
  );
  const structure = fc
    .integer({ min: 1, max: 10 })
    .chain((n) =>
      fc.record({
        n: fc.constant(n),
        elements: fc.array(element, { minLength: n, maxLength: n }),
        charges: fc.array(fc.oneof(fc.constant(0), fc.integer({ min: -3, max: 3 }), fc.integer({ min: -15, max: 15 })), { minLength: n, maxLength: n }),
        chargeLines: fc.boolean(),
        atoms: fc.array(
          fc.record({
            massDifference: fc.integer({ min: -9, max: 99 }),
            radical: fc.boolean(),
            stereoFields: fc.constantFrom('', '  0'.repeat(10), '  1  0  0  0  0  0  0  0  0  0', '  0  3'),
          }),
          { minLength: n, maxLength: n },
        ),
        x: fc.array(grid(-9999.9999, 99999.9999, 10000), { minLength: 3 * n, maxLength: 3 * n }),
        bonds: bondsOf(n).chain((pairs) =>
          fc.record({
            pairs: fc.constant(pairs),
            orders: fc.array(fc.constantFrom(1, 2, 3, 1.5), { minLength: pairs.length, maxLength: pairs.length }),
            stereo: fc.array(fc.integer({ min: 0, max: 6 }), { minLength: pairs.length, maxLength: pairs.length }),
            trailing: fc.array(fc.constantFrom('', '  0', '  0  0', '  0  1  2'), { minLength: pairs.length, maxLength: pairs.length }),
            fileOrder: fc.shuffledSubarray(pairs.map((_, k) => k), { minLength: pairs.length, maxLength: pairs.length }),
          }),
        ),
        title: words,
        header2: fc.constantFrom('', '  handmade  1202260000  3D', 'x'),
        header3: words,
        chiralFlag: fc.constantFrom(0, 1),
        properties: fc.subarray(['M  ISO  1   1  13', 'V    1 a value', 'A    1', 'alias text']),
        dataItems,
      }),
    )
    .map((g): SdfStructure => {
      const chargeLines = (g.chargeLines && g.charges.some((q) => q !== 0)) || g.charges.some((q) => Math.abs(q) > 3);
      const sorted = sortBonds(g.bonds.pairs);
      const fileIndex = new Map(g.bonds.fileOrder.map((k, position) => [k, position]));
      // A property list is kept only whole: an alias line (A) is always followed by its text.
      const properties = g.properties.includes('A    1') !== g.properties.includes('alias text') ? g.properties.filter((p) => p !== 'A    1' && p !== 'alias text') : g.properties;
      return {
        title: g.title,
        elements: g.elements,
        names: g.elements.map(() => ''),
        formalCharges: Int32Array.from(g.charges),
        coordinates: Float64Array.from(g.x),
        bonds: sorted.bonds,
        bondOrders: Float64Array.from(sorted.order, (k) => g.bonds.orders[k]),
        notes: [],
        format: 'sdf',
        record: {
          format: 'sdf',
          headerLines: [g.title, g.header2, g.header3],
          chiralFlag: g.chiralFlag,
          atoms: g.atoms.map((a, i) => ({ ...a, radical: a.radical && !chargeLines && g.charges[i] === 0 })),
          bonds: sorted.order.map((k) => {
            const [a, b] = g.bonds.pairs[k];
            return { from: a, to: b, stereo: g.bonds.stereo[k], trailing: g.bonds.trailing[k], fileIndex: fileIndex.get(k)! };
          }),
          chargeLines,
          structuralText: [],
          properties,
          dataItems: g.dataItems.map((d) => ({ name: d.name, header: `> <${d.name}>`, lines: d.lines })),
        },
      };
    });

  it('read(write(s)) equals s, for several records', () => {
    fc.assert(
      fc.property(fc.array(structure, { minLength: 1, maxLength: 3 }), (list) => {
        expect(readSdf(writeSdfRecords(list))).toEqual(list);
      }),
      RUNS,
    );
  });
});

describe('XYZ round trip', () => {
  const coordinate = fc.double({ noNaN: true, noDefaultInfinity: true });
  const structure = fc
    .integer({ min: 1, max: 10 })
    .chain((n) =>
      fc.record({
        elements: fc.array(element, { minLength: n, maxLength: n }),
        x: fc.array(coordinate, { minLength: 3 * n, maxLength: 3 * n }),
        comment: fc.stringMatching(/^[ -~]{0,40}$/),
        tails: fc.array(fc.constantFrom('', '1.0', 'a b  c'), { minLength: n, maxLength: n }),
      }),
    )
    .map((g): XyzStructure => ({
      title: g.comment.trim(),
      elements: g.elements,
      names: g.elements.map(() => ''),
      formalCharges: new Int32Array(g.elements.length),
      coordinates: Float64Array.from(g.x),
      bonds: null,
      bondOrders: null,
      notes: [],
      format: 'xyz',
      record: { format: 'xyz', comment: g.comment, atomTails: g.tails },
    }));

  it('read(write(s)) equals s, numbers to the same double, for several frames', () => {
    fc.assert(
      fc.property(fc.array(structure, { minLength: 1, maxLength: 3 }), (list) => {
        expect(readXyz(writeXyzFrames(list))).toEqual(list);
      }),
      RUNS,
    );
  });
});

describe('a structure made in code, written in each format, reads back to the same atoms', () => {
  const made = fc
    .integer({ min: 1, max: 8 })
    .chain((n) =>
      fc.record({
        elements: fc.array(element, { minLength: n, maxLength: n }),
        x: fc.array(fc.double({ min: -999, max: 999, noNaN: true }), { minLength: 3 * n, maxLength: 3 * n }),
        charges: fc.array(fc.integer({ min: -3, max: 3 }), { minLength: n, maxLength: n }),
        bonds: bondsOf(n),
      }),
    )
    .map((g) => newStructure(g.elements, Float64Array.from(g.x), { formalCharges: Int32Array.from(g.charges), bonds: Int32Array.from(g.bonds.flat()), bondOrders: new Float64Array(g.bonds.length).fill(1) }));

  it.each([
    ['pdb', 0.0005 + 1e-9],
    ['sdf', 0.00005 + 1e-9],
    ['xyz', 0],
  ] as const)('%s (coordinates to within half the last decimal written)', (name, tolerance) => {
    const f = STRUCTURE_FORMATS[name];
    fc.assert(
      fc.property(made, (s) => {
        const [t] = f.read(f.write(s));
        expect(t.elements).toEqual(s.elements);
        expect(t.formalCharges).toEqual(name === 'xyz' ? new Int32Array(s.elements.length) : s.formalCharges);
        // XYZ has no bonds; PDB cannot say "no bonds" (no CONECT reads as bonds not given).
        expect(t.bonds).toEqual(name === 'xyz' || (name === 'pdb' && s.bonds!.length === 0) ? null : s.bonds);
        for (let i = 0; i < s.coordinates.length; i++) expect(Math.abs(t.coordinates[i] - s.coordinates[i])).toBeLessThanOrEqual(tolerance);
      }),
      { numRuns: 100 },
    );
  });
});
