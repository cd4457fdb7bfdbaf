/**
 * JSON data at the boundary: strict reading of JSON text, checking that an
 * in-memory value is plain JSON data, copying it, describing it in messages,
 * and writing JSON paths.
 *
 * Reading is stricter than `JSON.parse` in two ways a model file needs: a
 * duplicated key is refused (instead of the last one silently winning), and
 * a number too large for a double (which `JSON.parse` turns into Infinity)
 * is refused. Everything `JSON.parse` refuses is refused too, with the line
 * and column. A key `__proto__` is kept as an ordinary own key.
 * @module
 */

import { type ParseErrorCode, visit } from 'jsonc-parser';
import { ModelError } from '../errors.js';

/** A plain JSON value. */
export type JsonValue = null | boolean | number | string | JsonValue[] | { [key: string]: JsonValue };

/** One step of a JSON path: an object key or an array index. */
export type PathSegment = string | number;

const PARSE_OPTIONS = { disallowComments: true, allowTrailingComma: false, allowEmptyContent: false } as const;

/** The grammar of a JSON number (RFC 8259 §6). */
const JSON_NUMBER = /^-?(?:0|[1-9][0-9]*)(?:\.[0-9]+)?(?:[eE][+-]?[0-9]+)?$/;

const IDENTIFIER = /^[A-Za-z_$][A-Za-z0-9_$]*$/;

/**
 * Write a JSON path: keys joined by dots, indices in brackets, keys that are
 * not identifiers quoted in brackets; the empty path is `''`.
 *
 * Examples: `terms[12].atoms[2]`, `units`, `metadata["a b"]`, `[3]`.
 */
export function formatJsonPath(path: readonly PathSegment[]): string {
  let out = '';
  for (const segment of path) {
    if (typeof segment === 'number') out += `[${segment}]`;
    else if (IDENTIFIER.test(segment)) out += out === '' ? segment : `.${segment}`;
    else out += `[${JSON.stringify(segment)}]`;
  }
  return out;
}

/**
 * A short description of a value for an error message's "got …" part:
 * numbers as written (`-5`, `2.5`, `NaN`), strings quoted (long ones cut to
 * 40 characters), `true`, `null`, `an array`, `an object`, `undefined`,
 * `a function`, `a Date` (for a class instance). Never throws.
 */
export function describeValue(value: unknown): string {
  if (value === null) return 'null';
  switch (typeof value) {
    case 'undefined':
      return 'undefined';
    case 'boolean':
      return String(value);
    case 'number':
      return Object.is(value, -0) ? '-0' : String(value);
    case 'bigint':
      return `the bigint ${value}n`;
    case 'string': {
      const quoted = JSON.stringify(value);
      return quoted.length > 40 ? `${quoted.slice(0, 38)}…"` : quoted;
    }
    case 'symbol':
      return 'a symbol';
    case 'function':
      return 'a function';
    default:
      break;
  }
  if (Array.isArray(value)) return 'an array';
  if (isPlainObject(value)) return 'an object';
  const name = (value as { constructor?: { name?: unknown } }).constructor?.name;
  return typeof name === 'string' && name !== '' ? `${article(name)} ${name}` : 'an object of some class';
}

function article(word: string): string {
  // "a Uint8Array", "a URL": class names starting with U are read "you".
  return /^[AEIO]/.test(word) ? 'an' : 'a';
}

function isPlainObject(value: object): boolean {
  const proto: unknown = Object.getPrototypeOf(value);
  return proto === null || proto === Object.prototype;
}

/** Set an own enumerable property, also for the key `__proto__` (which plain assignment would not). */
function setOwn(target: Record<string, JsonValue>, key: string, value: JsonValue): void {
  if (key === '__proto__') {
    Object.defineProperty(target, key, { value, writable: true, enumerable: true, configurable: true });
  } else {
    target[key] = value;
  }
}

/**
 * Check that `value` is plain JSON data: `null`, booleans, strings, finite
 * numbers, arrays and plain objects (prototype `Object.prototype` or `null`)
 * of those, with no cycles and no symbol keys.
 *
 * @throws {ModelError} at the first value in document order that is not
 *   JSON data (`undefined`, a function, NaN, Infinity, a bigint, a symbol, a
 *   class instance such as a Date or a typed array, a cycle), with its path,
 *   e.g. `atoms[2].mass: expected JSON data, got NaN`.
 */
export function assertJsonData(value: unknown): asserts value is JsonValue {
  checkData(value, [], new Set());
}

function checkData(value: unknown, path: PathSegment[], ancestors: Set<object>): void {
  const fail = (what: string): never => {
    throw new ModelError(formatJsonPath(path), `expected JSON data, got ${what}`);
  };
  if (value === null || typeof value === 'string' || typeof value === 'boolean') return;
  if (typeof value === 'number') {
    if (!Number.isFinite(value)) fail(describeValue(value));
    return;
  }
  if (typeof value !== 'object') return fail(describeValue(value));
  if (ancestors.has(value)) return fail('a cycle (a value that contains itself)');
  if (Array.isArray(value)) {
    ancestors.add(value);
    for (let i = 0; i < value.length; i++) {
      path.push(i);
      if (!(i in value)) fail('an empty slot (a sparse array)');
      checkData(value[i], path, ancestors);
      path.pop();
    }
    ancestors.delete(value);
    return;
  }
  if (!isPlainObject(value)) return fail(describeValue(value));
  if (Object.getOwnPropertySymbols(value).length > 0) fail('an object with a symbol key');
  ancestors.add(value);
  for (const key of Object.keys(value)) {
    path.push(key);
    checkData((value as Record<string, unknown>)[key], path, ancestors);
    path.pop();
  }
  ancestors.delete(value);
}

/**
 * A deep copy of JSON data: new arrays and new plain objects (prototype
 * `Object.prototype`, keys in the same order, a key `__proto__` kept as an
 * own key). Does not check its input; call {@link assertJsonData} first.
 */
export function copyJsonValue<T extends JsonValue>(value: T): T {
  return copy(value) as T;
}

function copy(value: JsonValue): JsonValue {
  if (value === null || typeof value !== 'object') return value;
  if (Array.isArray(value)) return value.map(copy);
  const out: Record<string, JsonValue> = {};
  for (const key of Object.keys(value)) setOwn(out, key, copy(value[key]));
  return out;
}

/**
 * Line and column (both 1-based) of a UTF-16 offset in `text`. A line ends at
 * `\n`, `\r\n` or a lone `\r`; columns count characters (code points), so a
 * character outside the Basic Multilingual Plane is one column.
 */
export function lineAndColumn(text: string, offset: number): { line: number; column: number } {
  let line = 1;
  let lineStart = 0;
  const end = Math.min(offset, text.length);
  for (let i = 0; i < end; i++) {
    const c = text.charCodeAt(i);
    if (c === 10 || (c === 13 && text.charCodeAt(i + 1) !== 10)) {
      line++;
      lineStart = i + 1;
    }
  }
  let column = 1;
  for (let i = lineStart; i < end; i++) {
    const c = text.charCodeAt(i);
    // Count a surrogate pair once: skip the low half.
    if (c >= 0xdc00 && c <= 0xdfff && i > lineStart) {
      const prev = text.charCodeAt(i - 1);
      if (prev >= 0xd800 && prev <= 0xdbff) continue;
    }
    if (c === 13) continue; // the \r of a \r\n at the very end
    column++;
  }
  return { line, column };
}

function placeAt(text: string, offset: number): string {
  const { line, column } = lineAndColumn(text, offset);
  return `line ${line}, column ${column}`;
}

/**
 * Parse JSON text strictly into a plain value.
 *
 * Accepts exactly the texts `JSON.parse` accepts, minus two: a duplicated key
 * in an object, and a number whose magnitude is too large for a double.
 * Numbers are converted with `Number` of their text, which for the JSON
 * number grammar gives the same double as `JSON.parse`. Objects are plain
 * objects with their keys in document order (`__proto__` kept as an own key).
 *
 * @returns the value.
 * @throws {ModelError} for malformed JSON with place `line L, column C`
 *   (1-based) and a plain detail such as `expected a comma or closing brace`
 *   or `comments are not allowed in JSON`; for a duplicated key with the JSON
 *   path of its object, e.g. `terms[3]: duplicated key "k"` (a duplicated key
 *   of the top-level object has no place); for a number too large, with its
 *   line and column; for text nested too deeply to read (no place). A syntax
 *   error is reported before a duplicated key or a number too large.
 */
export function parseJsonText(text: string): JsonValue {
  try {
    const value = readStrictly(text);
    crossCheckWithJsonParse(text);
    return value;
  } catch (e) {
    if (isStackOverflow(e)) throw new ModelError('', 'the JSON is nested too deeply to read');
    throw e;
  }
}

/** Whether `e` is the engine's "maximum call stack size exceeded". */
export function isStackOverflow(e: unknown): boolean {
  return e instanceof RangeError && /call stack/i.test(e.message);
}

type Container = 'object' | 'array';

/** An object being built, with its keys so far and the key whose value comes next. */
interface OpenObject {
  readonly kind: 'object';
  readonly value: Record<string, JsonValue>;
  readonly keys: Set<string>;
  key: string;
}

/** An array being built. */
interface OpenArray {
  readonly kind: 'array';
  readonly value: JsonValue[];
}

/**
 * One pass of jsonc-parser's event parser (its tree parser is several times
 * slower on large files): build the value, note the first syntax error with
 * the container it happened in, and the first duplicated key or oversized
 * number; then throw the syntax error, else the other problem.
 */
function readStrictly(text: string): JsonValue {
  const open: (OpenObject | OpenArray)[] = [];
  const path: PathSegment[] = [];
  let root: JsonValue = null;
  let syntax: { code: ParseErrorCode; offset: number; length: number; inside: Container | undefined } | undefined;
  let problem: ModelError | undefined;

  /** Place `value` in the open container (or as the root); returns the segment it went under. */
  const put = (value: JsonValue): PathSegment | undefined => {
    const top = open[open.length - 1];
    if (top === undefined) {
      root = value;
      return undefined;
    }
    if (top.kind === 'array') {
      top.value.push(value);
      return top.value.length - 1;
    }
    setOwn(top.value, top.key, value);
    return top.key;
  };
  const begin = (container: OpenObject | OpenArray) => {
    const segment = put(container.value);
    if (segment !== undefined) path.push(segment);
    open.push(container);
  };
  const end = () => {
    open.pop();
    if (open.length > 0) path.pop();
  };

  visit(
    text,
    {
      onObjectBegin: () => begin({ kind: 'object', value: {}, keys: new Set(), key: '' }),
      onObjectEnd: end,
      onArrayBegin: () => begin({ kind: 'array', value: [] }),
      onArrayEnd: end,
      onObjectProperty: (key: string) => {
        const top = open[open.length - 1];
        if (top?.kind !== 'object') return;
        if (top.keys.has(key) && problem === undefined) {
          problem = new ModelError(formatJsonPath(path), `duplicated key ${JSON.stringify(key)}`);
        }
        top.keys.add(key);
        top.key = key;
      },
      onLiteralValue: (value: unknown, offset: number, length: number) => {
        if (typeof value !== 'number') {
          put(value as null | boolean | string);
          return;
        }
        const raw = text.slice(offset, offset + length);
        const number = Number(raw);
        if (problem === undefined && !JSON_NUMBER.test(raw)) {
          problem = new ModelError(placeAt(text, offset), `invalid number ${JSON.stringify(raw)}`);
        } else if (problem === undefined && !Number.isFinite(number)) {
          problem = new ModelError(placeAt(text, offset), `number ${raw} is too large (beyond the range of a double)`);
        }
        put(number);
      },
      onError: (code: ParseErrorCode, offset: number, length: number) => {
        if (syntax === undefined) syntax = { code, offset, length, inside: open[open.length - 1]?.kind };
      },
    },
    PARSE_OPTIONS,
  );
  if (syntax !== undefined) {
    const { offset, detail } = describeSyntaxError(text, syntax.code, syntax.offset, syntax.length, syntax.inside);
    throw new ModelError(placeAt(text, offset), detail);
  }
  if (problem !== undefined) throw problem;
  return root;
}

/**
 * A guard against any disagreement between the strict parser and the
 * engine's: if `JSON.parse` refuses text that passed, refuse it too.
 */
function crossCheckWithJsonParse(text: string): void {
  try {
    JSON.parse(text);
  } catch (e) {
    const message = e instanceof Error ? e.message : String(e);
    const position = /position (\d+)/.exec(message);
    throw new ModelError(position ? placeAt(text, Number(position[1])) : '', `not valid JSON (${message})`);
  }
}

/** The significant character before `offset` (skipping JSON whitespace), or `''`. */
function previousSignificant(text: string, offset: number): string {
  for (let i = offset - 1; i >= 0; i--) {
    const c = text[i];
    if (c !== ' ' && c !== '\t' && c !== '\n' && c !== '\r') return c;
  }
  return '';
}

/** Whether only JSON whitespace follows `offset`. */
function atEnd(text: string, offset: number): boolean {
  return /^[ \t\n\r]*$/.test(text.slice(offset));
}

function describeSyntaxError(
  text: string,
  code: ParseErrorCode,
  offset: number,
  length: number,
  inside: Container | undefined,
): { offset: number; detail: string } {
  const token = text.slice(offset, offset + length);
  const trailingComma = previousSignificant(text, offset) === ',' && (text[offset] === '}' || text[offset] === ']');
  const leadingZero = /[0-9]/.test(text[offset] ?? '') && /(?:^|[^0-9.eE+-])-?0$/.test(text.slice(0, offset));
  const closer = inside === 'array' ? 'closing bracket' : 'closing brace';
  const at = (detail: string, where = offset) => ({ offset: where, detail });
  switch (code) {
    case 1: // InvalidSymbol
      if (token === '-' && text.startsWith('Infinity', offset + 1)) return at('unexpected "-Infinity" (JSON has no NaN or Infinity)');
      return at(describeUnexpected(token));
    case 2: // InvalidNumberFormat
      return at(`invalid number ${JSON.stringify(token)}`);
    case 3: // PropertyNameExpected
      return at(trailingComma ? 'expected a key in double quotes after the comma (trailing commas are not allowed)' : 'expected a key in double quotes');
    case 4: // ValueExpected
      if (/^[ \t\n\r]*$/.test(text)) return at('expected a JSON value, got empty text', 0);
      if (atEnd(text, offset)) return at('unexpected end of text: expected a value');
      if (trailingComma) return at('expected a value after the comma (trailing commas are not allowed)');
      if (text[offset] === ',') return at('expected a value before this comma');
      return at('expected a value');
    case 5: // ColonExpected
      return at('expected a colon after the key');
    case 6: // CommaExpected
      if (leadingZero) return at('a number may not have a leading zero');
      return at(`expected a comma or ${closer}`);
    case 7: // CloseBraceExpected
      return at(atEnd(text, offset) ? 'unexpected end of text: expected a closing brace' : 'expected a comma or closing brace');
    case 8: // CloseBracketExpected
      return at(atEnd(text, offset) ? 'unexpected end of text: expected a closing bracket' : 'expected a comma or closing bracket');
    case 9: // EndOfFileExpected
      if (leadingZero) return at('a number may not have a leading zero');
      return at('unexpected text after the end of the JSON value');
    case 10: // InvalidCommentToken
    case 11: // UnexpectedEndOfComment
      return at('comments are not allowed in JSON');
    case 12: { // UnexpectedEndOfString
      const end = offset + length;
      if (end < text.length && (text[end] === '\n' || text[end] === '\r')) {
        return at('line break inside a string (write it as \\n)', end);
      }
      return at('unterminated string (no closing double quote)');
    }
    case 13: // UnexpectedEndOfNumber
      return at(`incomplete number ${JSON.stringify(token)}`);
    case 14: // InvalidUnicode
      return at('invalid \\u escape in a string (expected 4 hexadecimal digits)', escapeOffset(text, offset, length));
    case 15: // InvalidEscapeCharacter
      return at('invalid escape in a string (allowed: \\" \\\\ \\/ \\b \\f \\n \\r \\t \\uXXXX)', escapeOffset(text, offset, length));
    case 16: { // InvalidCharacter
      const i = token.search(/[\u0000-\u001f]/);
      return at('control character in a string (write it as an escape such as \\t or \\u0000)', i >= 0 ? offset + i : offset);
    }
    default:
      return at('not valid JSON');
  }
}

/** Offset of the first bad backslash escape in the string token at `offset`, or `offset`. */
function escapeOffset(text: string, offset: number, length: number): number {
  const token = text.slice(offset, offset + length);
  const match = /\\(?:u(?![0-9a-fA-F]{4})|[^"\\/bfnrtu])/.exec(token);
  return match ? offset + match.index : offset;
}

function describeUnexpected(token: string): string {
  const first = token.codePointAt(0) ?? 0;
  if (first === 0xfeff) return 'a byte order mark (U+FEFF) is not allowed';
  if (/^\s/u.test(token)) {
    const hex = first.toString(16).toUpperCase().padStart(4, '0');
    return `unexpected character U+${hex} (only space, tab, line feed and carriage return may separate JSON tokens)`;
  }
  const shown = JSON.stringify(token.length > 30 ? `${token.slice(0, 30)}…` : token);
  if (token.startsWith("'")) return `unexpected ${shown} (strings and keys need double quotes)`;
  if (/^-?(?:NaN|Infinity)$/.test(token)) return `unexpected ${shown} (JSON has no NaN or Infinity)`;
  if (token === '-') return 'unexpected "-" (a minus sign must be followed by a digit)';
  return `unexpected ${shown}`;
}
