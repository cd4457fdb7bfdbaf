/**
 * Format by file extension (our choice: .pdb, .xyz, .sdf, .mol, any letter
 * case; documented in docs/structure-files.md) and the StructureError shape.
 */
import { describe, expect, it } from 'vitest';
import { STRUCTURE_FORMATS, structureFormatFor } from '../../src/io/structure-format.js';
import { newStructure, StructureError } from '../../src/io/structure.js';

describe('structureFormatFor', () => {
  it.each([
    ['a.pdb', 'pdb'],
    ['dir.v2/Ligand.PDB', 'pdb'],
    ['frames.xyz', 'xyz'],
    ['C:\\data\\set.SdF', 'sdf'],
    ['one.mol', 'mol'],
    ['./x.Mol', 'mol'],
  ])('%s → %s', (path, name) => {
    expect(structureFormatFor(path)?.name).toBe(name);
  });

  it.each(['model.json', 'a.ent', 'a.mol2', 'pdb', 'a.pdb.gz', 'dir.pdb/file', ''])('%j has no structure format', (path) => {
    expect(structureFormatFor(path)).toBeUndefined();
  });

  it('each format reads what it writes', () => {
    const s = newStructure(['O', 'H', 'H'], Float64Array.of(0, 0, 0.117, 0, 0.757, -0.469, 0, -0.757, -0.469), {
      title: 'water',
      bonds: Int32Array.of(0, 1, 0, 2),
      bondOrders: Float64Array.of(1, 1),
    });
    for (const f of Object.values(STRUCTURE_FORMATS)) {
      const [t] = f.read(f.write(s));
      expect(t.elements).toEqual(s.elements);
      expect(t.title).toBe('water');
      for (let i = 0; i < 9; i++) expect(t.coordinates[i]).toBeCloseTo(s.coordinates[i], 3);
      expect(f.read(f.writeAll([t]))).toEqual([t]);
    }
  });

  it('a MOL file takes exactly one structure', () => {
    const s = newStructure(['He'], new Float64Array(3));
    expect(() => STRUCTURE_FORMATS.mol.writeAll([s, s])).toThrow('a MOL file holds one structure; got 2 (write an SDF instead)');
    expect(STRUCTURE_FORMATS.sdf.read(STRUCTURE_FORMATS.sdf.writeAll([s, s]))).toHaveLength(2);
    expect(STRUCTURE_FORMATS.pdb.read(STRUCTURE_FORMATS.pdb.writeAll([s, s]))).toHaveLength(2);
    expect(STRUCTURE_FORMATS.xyz.read(STRUCTURE_FORMATS.xyz.writeAll([s, s]))).toHaveLength(2);
  });
});

describe('StructureError', () => {
  it('puts the place before the detail', () => {
    const e = new StructureError(12, 'x', 'expected a number, got "1.2.3"', [31, 38]);
    expect(e.message).toBe('line 12, columns 31-38 (x): expected a number, got "1.2.3"');
    expect(e.name).toBe('StructureError');
    expect(e).toBeInstanceOf(Error);
    expect(new StructureError(4, 'atom count', 'bad').message).toBe('line 4: bad');
    expect(new StructureError(0, '', 'the input is empty').message).toBe('the input is empty');
    expect(new StructureError(3, 'altLoc', 'bad', [17, 17]).message).toBe('line 3, column 17 (altLoc): bad');
  });
});
