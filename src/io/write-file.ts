/**
 * Writing an output file whole or not at all.
 * @module
 */
import { closeSync, fsyncSync, openSync, renameSync, unlinkSync, writeSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';

/**
 * Write `text` to `path` so that readers see either the old file or the
 * complete new one, never a part: the text goes to a temporary file in the
 * same folder, is flushed to disk, and is then renamed over `path` (which
 * may be the file the input was read from). On failure the temporary file is
 * removed and the error (a Node `ErrnoException`) is thrown; `path` is then
 * untouched.
 */
export function writeFileWhole(path: string, text: string): void {
  const temporary = join(dirname(path), `.${basename(path)}.${process.pid}.${Date.now().toString(36)}.tmp`);
  let fd: number | undefined;
  try {
    fd = openSync(temporary, 'wx');
    writeSync(fd, text);
    fsyncSync(fd);
    closeSync(fd);
    fd = undefined;
    renameSync(temporary, path);
  } catch (e) {
    if (fd !== undefined) closeSync(fd);
    try {
      unlinkSync(temporary);
    } catch {
      // the temporary file was never made, or is gone already
    }
    throw e;
  }
}
