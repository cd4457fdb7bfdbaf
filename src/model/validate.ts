/**
 * Reading a model file: JSON text or an in-memory value in, a validated,
 * normalised {@link ModelFile} out, or exactly one {@link ModelError}.
 *
 * Checks run in three layers: JSON itself (syntax, duplicated keys, values
 * that are not JSON data), the schema (shape, names, numbers and their
 * ranges), and rules across fields (atom indices in range and not repeated,
 * counts against the number of atoms, `lower ≤ upper`, pairs listed twice,
 * constraints between frozen or coincident atoms). All problems of the last
 * two layers are collected and the first in document order is reported;
 * problems with `format` and then `version` come before everything else,
 * since a file of another format or version would be judged by the wrong
 * rules.
 * @module
 */

import { isElement, standardAtomicWeight } from '../elements.js';
import { ModelError } from '../errors.js';
import { KIND_LAYOUTS, TERM_KINDS, type TermKind } from '../terms/table.js';
import {
  assertJsonData,
  copyJsonValue,
  describeValue,
  formatJsonPath,
  isStackOverflow,
  type JsonValue,
  type PathSegment,
  parseJsonText,
} from './json.js';
import { type MODEL_DEFAULTS, type ModelFile, modelFileSchema } from './schema.js';

/** One problem found: where to report it, where it sits in the document (for ordering), and what is wrong. */
interface Problem {
  /** The path named in the message. */
  readonly place: readonly PathSegment[];
  /** The path that fixes its position in the document (may go one key deeper than `place`). */
  readonly at: readonly PathSegment[];
  readonly detail: string;
}

/**
 * Read and validate a model file.
 *
 * `input` is either the file's JSON text (a string, read strictly: no
 * comments, no trailing commas, no duplicated keys) or an already-parsed
 * value (which must be plain JSON data: no `undefined`, functions, NaN,
 * Infinity or class instances).
 *
 * The result is a deep copy, so later changes to `input` do not affect it,
 * with one normalisation: a `fixed-distance` constraint without `length`
 * gets the distance between its atoms in `coordinates`, so that it is
 * written out explicitly when the model is saved. Every other optional
 * field left out stays out (defaults: {@link MODEL_DEFAULTS}).
 *
 * @returns the validated model file.
 * @throws {ModelError} for the first problem found, never anything else:
 *   malformed JSON (place `line L, column C`), or a rule of the format broken
 *   (place a JSON path such as `terms[12].atoms[2]`, `''` for the top level),
 *   e.g. `terms[12].atoms[2]: index 40 is out of range (model has 31 atoms)`.
 */
export function readModelFile(input: unknown): ModelFile {
  try {
    return read(input);
  } catch (e) {
    if (isStackOverflow(e)) throw new ModelError('', 'the input is nested too deeply to read');
    throw e;
  }
}

function read(input: unknown): ModelFile {
  let value: JsonValue;
  if (typeof input === 'string') {
    value = parseJsonText(input);
  } else {
    assertJsonData(input);
    value = input;
  }
  const problems = [...schemaProblems(value), ...crossFieldProblems(value)];
  const first = earliest(problems, value);
  if (first !== undefined) throw new ModelError(formatJsonPath(first.place), first.detail);
  // Validated above: the copy has exactly the shape of ModelFile.
  const file = copyJsonValue(value) as unknown as ModelFile;
  fillConstraintLengths(file);
  return file;
}

// ---------------------------------------------------------------------------
// Schema problems

function schemaProblems(value: JsonValue): Problem[] {
  const result = modelFileSchema.safeParse(value, { reportInput: true });
  if (result.success) return [];
  return result.error.issues.map((issue) => {
    const path = issue.path.filter((s): s is PathSegment => typeof s !== 'symbol');
    if (issue.code === 'unrecognized_keys') {
      return { place: path, at: [...path, issue.keys[0]], detail: issue.message };
    }
    const last = path[path.length - 1];
    const parentPath = path.slice(0, -1);
    const parent = valueAt(value, parentPath);
    if (typeof last === 'string' && isObject(parent) && !Object.hasOwn(parent, last)) {
      const noun = parentPath.length === 0 ? 'key' : 'field';
      return { place: parentPath, at: path, detail: `missing required ${noun} ${JSON.stringify(last)}` };
    }
    return { place: path, at: path, detail: issue.message };
  });
}

// ---------------------------------------------------------------------------
// Rules across fields (run on the raw value, tolerant of a wrong shape: each
// rule looks only at values of the shape it needs; the schema reports the rest)

function crossFieldProblems(value: JsonValue): Problem[] {
  if (!isObject(value)) return [];
  const problems: Problem[] = [];
  const report = (place: readonly PathSegment[], detail: string, at: readonly PathSegment[] = place) =>
    void problems.push({ place, at, detail });
  const atomCount = Array.isArray(value.atoms) ? value.atoms.length : undefined;

  /** Report an index out of range; return whether the index is usable (an in-range integer). */
  const checkIndex = (index: unknown, path: readonly PathSegment[]): index is number => {
    if (!isIndex(index)) return false;
    if (atomCount !== undefined && index >= atomCount) {
      report(path, `index ${index} is out of range (model has ${plural(atomCount, 'atom')})`);
      return false;
    }
    return true;
  };

  checkAtoms(value.atoms, report);
  const coordinates = checkCoordinates(value.coordinates, atomCount, report);
  checkBonds(value.bonds, checkIndex, report);
  checkTerms(value.terms, checkIndex, report);
  checkNonbonded(value.nonbonded, atomCount, report);
  const frozen = checkFrozen(value.frozen, checkIndex, report);
  checkConstraints(value.constraints, frozen, coordinates, checkIndex, report);
  return problems;
}

type Report = (place: readonly PathSegment[], detail: string, at?: readonly PathSegment[]) => void;
type CheckIndex = (index: unknown, path: readonly PathSegment[]) => index is number;

function checkAtoms(atoms: JsonValue | undefined, report: Report): void {
  if (!Array.isArray(atoms)) return;
  atoms.forEach((atom, i) => {
    if (!isObject(atom) || typeof atom.element !== 'string' || Object.hasOwn(atom, 'mass')) return;
    const symbol = atom.element;
    // Unknown symbols are the schema's to report; here only real elements without a weight.
    if (standardAtomicWeight(symbol) === undefined && isElement(symbol)) {
      report(['atoms', i], `element ${symbol} has no standard atomic weight; give "mass"`, ['atoms', i, 'mass']);
    }
  });
}

/** Returns the rows that are valid `[x, y, z]` (or `undefined` for an invalid row), when the count is right. */
function checkCoordinates(
  coordinates: JsonValue | undefined,
  atomCount: number | undefined,
  report: Report,
): (readonly [number, number, number] | undefined)[] | undefined {
  if (!Array.isArray(coordinates)) return undefined;
  if (atomCount !== undefined && coordinates.length !== atomCount) {
    report(['coordinates'], `expected ${plural(atomCount, 'row')} (one per atom), got ${coordinates.length}`);
    return undefined;
  }
  return coordinates.map((row) =>
    Array.isArray(row) && row.length === 3 && row.every(isFiniteNumber)
      ? (row as unknown as readonly [number, number, number])
      : undefined,
  );
}

function checkBonds(bonds: JsonValue | undefined, checkIndex: CheckIndex, report: Report): void {
  if (!Array.isArray(bonds)) return;
  const seen = new Map<string, number>();
  bonds.forEach((pair, b) => {
    if (!Array.isArray(pair) || pair.length !== 2) return;
    const [i, j] = pair;
    const okI = checkIndex(i, ['bonds', b, 0]);
    const okJ = checkIndex(j, ['bonds', b, 1]);
    if (!okI || !okJ) return;
    if (i === j) {
      report(['bonds', b], `a bond needs two different atoms, got ${i}-${j}`);
      return;
    }
    const key = pairKey(i, j);
    const first = seen.get(key);
    if (first !== undefined) {
      report(['bonds', b], `bond ${i}-${j} is listed twice (first at bonds[${first}])`);
    } else {
      seen.set(key, b);
    }
  });
}

const KNOWN_KINDS: ReadonlySet<string> = new Set(TERM_KINDS);

function checkTerms(terms: JsonValue | undefined, checkIndex: CheckIndex, report: Report): void {
  if (!Array.isArray(terms)) return;
  terms.forEach((term, t) => {
    if (!isObject(term) || typeof term.kind !== 'string' || !KNOWN_KINDS.has(term.kind)) return;
    const kind = term.kind as TermKind;
    if (Array.isArray(term.atoms) && term.atoms.length === KIND_LAYOUTS[kind].arity) {
      checkAtomList(term.atoms, ['terms', t, 'atoms'], 'term', checkIndex, report);
    }
    if (kind === 'periodic-angle' && isIndex(term.n) && term.n >= 1 && isFiniteNumber(term.theta0)) {
      const detail = periodicAngleProblem(term.n, term.theta0);
      if (detail !== undefined) report(['terms', t, 'theta0'], detail);
    }
    if (kind === 'distance-restraint' && isFiniteNumber(term.lower) && isFiniteNumber(term.upper) && term.lower > term.upper) {
      const later = Object.keys(term).indexOf('lower') > Object.keys(term).indexOf('upper') ? 'lower' : 'upper';
      report(
        ['terms', t],
        `distance-restraint needs lower ≤ upper, got lower ${describeValue(term.lower)} > upper ${describeValue(term.upper)}`,
        ['terms', t, later],
      );
    }
  });
}

/**
 * A periodic angle's minimum must sit at θ0: θ0 a whole multiple of 180°/n
 * (to 1e-9 of a step), so that cos(n θ0) = ±1. Returns the message, or undefined.
 */
function periodicAngleProblem(n: number, theta0: number): string | undefined {
  const steps = (n * theta0) / 180;
  if (Math.abs(steps - Math.round(steps)) <= 1e-9) return undefined;
  const step = 180 / n;
  const multiples: string[] = [];
  for (let m = 0; m * step <= 180 + 1e-9 && multiples.length < 7; m++) multiples.push(formatDegrees(m * step));
  const list = n <= 6 ? ` (${multiples.slice(0, -1).join(', ')} or ${multiples[multiples.length - 1]})` : '';
  return `periodic-angle with n ${n} needs theta0 a whole multiple of ${formatDegrees(step)}°${list}, got ${describeValue(theta0)}`;
}

function formatDegrees(value: number): string {
  return String(Number(value.toFixed(6)));
}

/** Range and repeats within one term's or constraint's atoms; returns whether all are usable and distinct. */
function checkAtomList(
  atoms: readonly JsonValue[],
  path: readonly PathSegment[],
  owner: 'term' | 'constraint',
  checkIndex: CheckIndex,
  report: Report,
): boolean {
  let ok = true;
  atoms.forEach((index, j) => {
    if (!checkIndex(index, [...path, j])) {
      ok = false;
    } else if (atoms.indexOf(index) < j) {
      report([...path, j], `atom ${index} is repeated in this ${owner}`);
      ok = false;
    }
  });
  return ok;
}

function checkNonbonded(nonbonded: JsonValue | undefined, atomCount: number | undefined, report: Report): void {
  if (atomCount === undefined || !isObject(nonbonded) || !isObject(nonbonded.lennardJones)) return;
  const lj = nonbonded.lennardJones;
  for (const name of ['rmin', 'epsilon'] as const) {
    const list = lj[name];
    if (Array.isArray(list) && list.length !== atomCount) {
      report(
        ['nonbonded', 'lennardJones', name],
        `expected ${plural(atomCount, 'value')} (one per atom), got ${list.length}`,
      );
    }
  }
}

function checkFrozen(frozen: JsonValue | undefined, checkIndex: CheckIndex, report: Report): ReadonlySet<number> {
  const set = new Set<number>();
  if (!Array.isArray(frozen)) return set;
  const firstAt = new Map<number, number>();
  frozen.forEach((index, f) => {
    if (!checkIndex(index, ['frozen', f])) return;
    const first = firstAt.get(index);
    if (first !== undefined) {
      report(['frozen', f], `atom ${index} is listed twice (first at frozen[${first}])`);
    } else {
      firstAt.set(index, f);
      set.add(index);
    }
  });
  return set;
}

function checkConstraints(
  constraints: JsonValue | undefined,
  frozen: ReadonlySet<number>,
  coordinates: ReturnType<typeof checkCoordinates>,
  checkIndex: CheckIndex,
  report: Report,
): void {
  if (!Array.isArray(constraints)) return;
  const seen = new Map<string, number>();
  constraints.forEach((constraint, c) => {
    if (!isObject(constraint) || !Array.isArray(constraint.atoms) || constraint.atoms.length !== 2) return;
    const atoms = constraint.atoms;
    if (!checkAtomList(atoms, ['constraints', c, 'atoms'], 'constraint', checkIndex, report)) return;
    const [i, j] = atoms as [number, number];
    const key = pairKey(i, j);
    const first = seen.get(key);
    if (first !== undefined) {
      report(['constraints', c], `pair ${i}-${j} is constrained twice (first at constraints[${first}])`);
      return;
    }
    seen.set(key, c);
    if (frozen.has(i) && frozen.has(j)) {
      report(['constraints', c], `atoms ${i} and ${j} are both frozen; a constraint between two frozen atoms is not allowed`);
      return;
    }
    const ri = coordinates?.[i];
    const rj = coordinates?.[j];
    if (!Object.hasOwn(constraint, 'length') && ri !== undefined && rj !== undefined && distance(ri, rj) === 0) {
      report(
        ['constraints', c],
        `atoms ${i} and ${j} are at the same position, so "length" cannot default to their distance; give "length"`,
        ['constraints', c, 'length'],
      );
    }
  });
}

// ---------------------------------------------------------------------------
// Normalisation

/** Give every `fixed-distance` constraint without `length` the distance between its atoms. */
function fillConstraintLengths(file: ModelFile): void {
  for (const constraint of file.constraints ?? []) {
    if (constraint.length === undefined) {
      const [i, j] = constraint.atoms;
      constraint.length = distance(file.coordinates[i], file.coordinates[j]);
    }
  }
}

// ---------------------------------------------------------------------------
// Ordering

/** The problem that comes first: `format`, then `version`, then document order. */
function earliest(problems: readonly Problem[], root: JsonValue): Problem | undefined {
  let best: Problem | undefined;
  let bestKey: number[] = [];
  for (const problem of problems) {
    const key = [priority(problem.at), ...documentRank(problem.at, root)];
    if (best === undefined || compareRanks(key, bestKey) < 0) {
      best = problem;
      bestKey = key;
    }
  }
  return best;
}

function priority(at: readonly PathSegment[]): number {
  if (at[0] === 'format') return 0;
  if (at[0] === 'version') return 1;
  return 2;
}

/**
 * Position of a path in the document: at each step, the index of the key
 * among its object's keys (a missing key counts as after all of them) or the
 * array index.
 */
function documentRank(at: readonly PathSegment[], root: JsonValue): number[] {
  const ranks: number[] = [];
  let node: JsonValue | undefined = root;
  for (const segment of at) {
    if (Array.isArray(node) && typeof segment === 'number') {
      ranks.push(segment);
      node = node[segment];
    } else if (isObject(node) && typeof segment === 'string') {
      const keys = Object.keys(node);
      const index = keys.indexOf(segment);
      if (index < 0) {
        ranks.push(keys.length);
        break;
      }
      ranks.push(index);
      node = node[segment];
    } else {
      break;
    }
  }
  return ranks;
}

/** Lexicographic; a prefix (an enclosing place) comes first. */
function compareRanks(a: readonly number[], b: readonly number[]): number {
  const n = Math.min(a.length, b.length);
  for (let i = 0; i < n; i++) if (a[i] !== b[i]) return a[i] - b[i];
  return a.length - b.length;
}

// ---------------------------------------------------------------------------
// Small helpers

function isObject(value: JsonValue | undefined): value is { [key: string]: JsonValue } {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

function isIndex(value: unknown): value is number {
  return Number.isSafeInteger(value) && (value as number) >= 0;
}

function isFiniteNumber(value: unknown): value is number {
  return typeof value === 'number' && Number.isFinite(value);
}

function valueAt(root: JsonValue, path: readonly PathSegment[]): JsonValue | undefined {
  let node: JsonValue | undefined = root;
  for (const segment of path) {
    if (Array.isArray(node) && typeof segment === 'number') node = node[segment];
    else if (isObject(node) && typeof segment === 'string' && Object.hasOwn(node, segment)) node = node[segment];
    else return undefined;
  }
  return node;
}

function pairKey(i: number, j: number): string {
  return i < j ? `${i}-${j}` : `${j}-${i}`;
}

function plural(count: number, noun: string): string {
  return `${count} ${noun}${count === 1 ? '' : 's'}`;
}

function distance(a: readonly number[], b: readonly number[]): number {
  return Math.hypot(b[0] - a[0], b[1] - a[1], b[2] - a[2]);
}
