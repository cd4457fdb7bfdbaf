/**
 * Usage and input errors of the command line: they exit with status 2 and
 * one line `strainwise: FILE: PLACE: message` on stderr.
 * @module
 */

/** A problem with how the command was called (bad option, missing file name). */
export class UsageError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'UsageError';
  }
}

/** A problem with an input file, named by path (and place, inside the message). */
export class InputError extends Error {
  /** The file as given on the command line. */
  readonly file: string;
  constructor(file: string, message: string) {
    super(message);
    this.name = 'InputError';
    this.file = file;
  }
}
