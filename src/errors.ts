/**
 * Errors raised at the library's boundary (reading and validating input).
 * Kernels and `energy` never throw; everything is checked before they run.
 * @module
 */

/**
 * A model (or other input) broke a rule of its format.
 *
 * `place` names where: a JSON path such as `terms[12].atoms[2]`, or
 * `line 4, column 17` for malformed JSON, or `''` when the whole input is at
 * fault. `message` is the full one-line text, `PLACE: detail` (or just the
 * detail when there is no place), ready to show to a person.
 */
export class ModelError extends Error {
  /** Where the problem is: a JSON path, a line and column, or `''`. */
  readonly place: string;
  /** The problem alone, without the place. */
  readonly detail: string;

  constructor(place: string, detail: string) {
    super(place ? `${place}: ${detail}` : detail);
    this.name = 'ModelError';
    this.place = place;
    this.detail = detail;
  }
}
