/**
 * Structure file formats by file extension: which reader and writer a path
 * calls for.
 * @module
 */
import { readPdb, writePdb, writePdbModels } from './pdb.js';
import { readMol, readSdf, writeMol, writeSdf, writeSdfRecords } from './sdf.js';
import type { Structure } from './structure.js';
import { readXyz, writeXyz, writeXyzFrames } from './xyz.js';

/** A structure file format: its name, extensions, reader and writers. */
export interface StructureFormat {
  /** `pdb`, `xyz`, `sdf` or `mol`. */
  readonly name: 'pdb' | 'xyz' | 'sdf' | 'mol';
  /** The file extensions it is chosen for, lower case with the dot. */
  readonly extensions: readonly string[];
  /** Read every structure in `text` (models, frames, records); throws `StructureError`. */
  readonly read: (text: string) => Structure[];
  /** Write one structure, with `coordinates` (flat, 3N, Å) in place of its own when given; throws `RangeError`. */
  readonly write: (structure: Structure, coordinates?: Float64Array) => string;
  /**
   * Write several structures into one file (models, frames, records); a MOL
   * file takes exactly one. Throws `RangeError`.
   */
  readonly writeAll: (structures: readonly Structure[], coordinates?: readonly (Float64Array | undefined)[]) => string;
}

/** The formats, by name. */
export const STRUCTURE_FORMATS: Readonly<Record<StructureFormat['name'], StructureFormat>> = {
  pdb: { name: 'pdb', extensions: ['.pdb'], read: readPdb, write: writePdb, writeAll: writePdbModels },
  xyz: { name: 'xyz', extensions: ['.xyz'], read: readXyz, write: writeXyz, writeAll: writeXyzFrames },
  sdf: { name: 'sdf', extensions: ['.sdf'], read: readSdf, write: writeSdf, writeAll: writeSdfRecords },
  mol: {
    name: 'mol',
    extensions: ['.mol'],
    read: readMol,
    write: writeMol,
    writeAll: (structures, coordinates) => {
      if (structures.length !== 1) throw new RangeError(`a MOL file holds one structure; got ${structures.length} (write an SDF instead)`);
      return writeMol(structures[0], coordinates?.[0]);
    },
  },
};

/**
 * The structure format a path's extension names, case-insensitively
 * (`.pdb`, `.xyz`, `.sdf`, `.mol`; `molecule.PDB` is PDB), or `undefined`
 * for any other extension or none. Never throws.
 */
export function structureFormatFor(path: string): StructureFormat | undefined {
  const m = /(\.[^./\\]+)$/.exec(path);
  if (!m) return undefined;
  const ext = m[1].toLowerCase();
  return Object.values(STRUCTURE_FORMATS).find((f) => f.extensions.includes(ext));
}
