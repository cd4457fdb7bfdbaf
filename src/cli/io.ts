/**
 * Reading a command's input file, turning every failure into an
 * {@link InputError} that names the file. A model file is read as it is; a
 * structure file (.pdb, .xyz, .sdf, .mol) is perceived and given generic
 * parameters first.
 * @module
 */
import { readFileSync } from 'node:fs';
import { ModelError } from '../errors.js';
import { structureFormatFor, type StructureFormat } from '../io/structure-format.js';
import { StructureError, type Structure } from '../io/structure.js';
import { parseModel, type Model } from '../model/model.js';
import { modelFromStructure, type StructureModel } from '../params/from-structure.js';
import { InputError } from './errors.js';

/** What a command read. */
export interface LoadedInput {
  /** The model to work on (for a structure file: its generic-parameter model). */
  readonly model: Model;
  /** For a structure file: its format, the structure used (the first) and how many the file holds. */
  readonly structure?: {
    readonly format: StructureFormat;
    readonly structure: Structure;
    readonly count: number;
    readonly generated: StructureModel;
  };
}

function readText(path: string): string {
  try {
    return readFileSync(path, 'utf8');
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    const why =
      code === 'ENOENT'
        ? 'no such file'
        : code === 'EISDIR'
          ? 'is a folder, not a file'
          : code === 'EACCES'
            ? 'permission denied'
            : `cannot be read (${code ?? 'unknown error'})`;
    throw new InputError(path, why);
  }
}

/**
 * Read `path`: a structure file by its extension, anything else as a model
 * file. Throws {@link InputError} on any problem (with the line for a
 * structure file, the place for a model file or a refused atom).
 */
export function loadInput(path: string): LoadedInput {
  const text = readText(path);
  const format = structureFormatFor(path);
  try {
    if (format === undefined) return { model: parseModel(text) };
    const structures = format.read(text);
    const structure = structures[0];
    const generated = modelFromStructure(structure);
    return { model: parseModel(generated.file), structure: { format, structure, count: structures.length, generated } };
  } catch (e) {
    if (e instanceof ModelError || e instanceof StructureError) throw new InputError(path, e.message);
    throw e;
  }
}

/** Read and compile the model at `path` (see {@link loadInput}); throws {@link InputError} on any problem. */
export function loadModel(path: string): Model {
  return loadInput(path).model;
}
