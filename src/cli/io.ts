/**
 * Reading a model file for a command, turning every failure into an
 * {@link InputError} that names the file.
 * @module
 */
import { readFileSync } from 'node:fs';
import { ModelError } from '../errors.js';
import { parseModel, type Model } from '../model/model.js';
import { InputError } from './errors.js';

/** Read and compile the model at `path`; throws {@link InputError} on any problem. */
export function loadModel(path: string): Model {
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
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
  try {
    return parseModel(text);
  } catch (e) {
    if (e instanceof ModelError) throw new InputError(path, e.message);
    throw e;
  }
}
