import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ModelError } from '../../src/errors.js';
import {
  assertJsonData,
  copyJsonValue,
  describeValue,
  formatJsonPath,
  lineAndColumn,
  parseJsonText,
} from '../../src/model/json.js';
import { expectModelError } from './fixtures.js';

describe('parseJsonText: malformed JSON is refused with line and column', () => {
  // Columns are 1-based and count characters; each expectation was counted by hand.
  const cases: [string, string][] = [
    ['{"a": 1 "b": 2}', 'line 1, column 9: expected a comma or closing brace'],
    ['{"a":1]', 'line 1, column 7: expected a comma or closing brace'],
    ['[1 2]', 'line 1, column 4: expected a comma or closing bracket'],
    ['{\n  "a": 1,\n}', 'line 3, column 1: expected a key in double quotes after the comma (trailing commas are not allowed)'],
    ['[1,]', 'line 1, column 4: expected a value after the comma (trailing commas are not allowed)'],
    ['[1,,2]', 'line 1, column 4: expected a value before this comma'],
    ['{"a": 1 // note\n}', 'line 1, column 9: comments are not allowed in JSON'],
    ['/* note */ {}', 'line 1, column 1: comments are not allowed in JSON'],
    ['', 'line 1, column 1: expected a JSON value, got empty text'],
    ['  \n ', 'line 1, column 1: expected a JSON value, got empty text'],
    ['{"a": NaN}', 'line 1, column 7: unexpected "NaN" (JSON has no NaN or Infinity)'],
    ['[-Infinity]', 'line 1, column 2: unexpected "-Infinity" (JSON has no NaN or Infinity)'],
    ["{'a': 1}", 'line 1, column 2: unexpected "\'a\'" (strings and keys need double quotes)'],
    ['{a: 1}', 'line 1, column 2: unexpected "a"'],
    ['tru', 'line 1, column 1: unexpected "tru"'],
    ['01', 'line 1, column 2: a number may not have a leading zero'],
    ['{"a": [01]}', 'line 1, column 9: a number may not have a leading zero'],
    ['1.', 'line 1, column 1: incomplete number "1."'],
    ['[1e]', 'line 1, column 2: incomplete number "1e"'],
    ['[-]', 'line 1, column 2: unexpected "-" (a minus sign must be followed by a digit)'],
    ['"a\tb"', 'line 1, column 3: control character in a string (write it as an escape such as \\t or \\u0000)'],
    ['"a\nb"', 'line 1, column 3: line break inside a string (write it as \\n)'],
    ['"abc', 'line 1, column 1: unterminated string (no closing double quote)'],
    ['"ab\\x"', 'line 1, column 4: invalid escape in a string (allowed: \\" \\\\ \\/ \\b \\f \\n \\r \\t \\uXXXX)'],
    ['"\\u00zz"', 'line 1, column 2: invalid \\u escape in a string (expected 4 hexadecimal digits)'],
    ['\ufeff{}', 'line 1, column 1: a byte order mark (U+FEFF) is not allowed'],
    ['[\u00a01]', 'line 1, column 2: unexpected character U+00A0 (only space, tab, line feed and carriage return may separate JSON tokens)'],
    ['{} {}', 'line 1, column 4: unexpected text after the end of the JSON value'],
    ['{"a" 1}', 'line 1, column 6: expected a colon after the key'],
    ['{"a":', 'line 1, column 6: unexpected end of text: expected a value'],
    ['[[1,2]', 'line 1, column 7: unexpected end of text: expected a closing bracket'],
    ['{"a":1', 'line 1, column 7: unexpected end of text: expected a closing brace'],
    // Line breaks: \r\n and a lone \r each end one line.
    ['{\r\n"a": 1\r\n"b": 2}', 'line 3, column 1: expected a comma or closing brace'],
    ['{\r"a": 1\r"b": 2}', 'line 3, column 1: expected a comma or closing brace'],
    // A character outside the BMP (two UTF-16 units) is one column.
    ['{"\u{1F600}": 1 "b": 2}', 'line 1, column 9: expected a comma or closing brace'],
    // Valid JSON, but a number too large for a double (JSON.parse would give Infinity).
    ['{"k": [1, 1e400]}', 'line 1, column 11: number 1e400 is too large (beyond the range of a double)'],
  ];
  for (const [text, message] of cases) {
    it(`${JSON.stringify(text)}`, () => {
      const error = expectModelError(() => parseJsonText(text), message);
      expect(error.place).toMatch(/^line \d+, column \d+$/);
      // Each case is one JSON.parse refuses too, except the number beyond a double.
      if (!text.includes('1e400')) expect(() => JSON.parse(text)).toThrow(SyntaxError);
      else expect(JSON.parse(text).k[1]).toBe(Infinity);
    });
  }

  it('refuses everything JSON.parse refuses (a sample of near-misses)', () => {
    const texts = ['{"a":1,}', '[1,]', '.5', '+1', '0x10', '--1', '1 2', 'nul', '"\\ud8"', '{"a" : }', '[', ']', '{}}', 'True'];
    for (const text of texts) {
      expect(() => JSON.parse(text)).toThrow(SyntaxError);
      expect(() => parseJsonText(text)).toThrow(ModelError);
    }
  });

  it('gives up cleanly on absurdly deep nesting', () => {
    expectModelError(() => parseJsonText('['.repeat(200_000) + ']'.repeat(200_000)), 'the JSON is nested too deeply to read');
  });
});

describe('parseJsonText: duplicated keys', () => {
  it('refuses a duplicated top-level key (no place: the top level itself)', () => {
    const e = expectModelError(() => parseJsonText('{"units": 1, "atoms": [], "units": 2}'), 'duplicated key "units"');
    expect(e.place).toBe('');
  });

  it('names the object of a nested duplicate by its JSON path', () => {
    expectModelError(
      () => parseJsonText('{"terms": [{}, {}, {}, {"kind": "harmonic-bond", "k": 1, "k": 2}]}'),
      'terms[3]: duplicated key "k"',
    );
    expectModelError(() => parseJsonText('{"metadata": {"a b": {"x": 1, "x": 1}}}'), 'metadata["a b"]: duplicated key "x"');
  });

  it('compares keys after unescaping', () => {
    expectModelError(() => parseJsonText('{"k": 1, "\\u006b": 2}'), 'duplicated key "k"');
  });

  it('reports a syntax error before a duplicated key', () => {
    expectModelError(() => parseJsonText('{"a": 1, "a": 2,}'), 'line 1, column 17: expected a key in double quotes after the comma (trailing commas are not allowed)');
  });

  it('allows the same key in different objects', () => {
    expect(parseJsonText('[{"k": 1}, {"k": 2}]')).toEqual([{ k: 1 }, { k: 2 }]);
  });
});

describe('parseJsonText: values', () => {
  it('gives exactly what JSON.parse gives for any JSON value', () => {
    fc.assert(
      fc.property(fc.jsonValue(), fc.boolean(), (value, pretty) => {
        const text = JSON.stringify(value, null, pretty ? 2 : undefined);
        expect(parseJsonText(text)).toEqual(JSON.parse(text));
      }),
      { numRuns: 300 },
    );
  });

  it('reads every double exactly as JSON.parse does', () => {
    fc.assert(
      fc.property(fc.double({ noNaN: true, noDefaultInfinity: true }), (x) => {
        const text = JSON.stringify(x);
        expect(Object.is(parseJsonText(text), JSON.parse(text))).toBe(true);
      }),
      { numRuns: 1000 },
    );
    const texts = ['1E+2', '-0', '-0.0e-0', '0.1', '5e-324', '2e-324', '1.7976931348623157e308', '123456789012345678901234567890', '0.30000000000000004'];
    for (const text of texts) expect(Object.is(parseJsonText(text), JSON.parse(text)), text).toBe(true);
  });

  it('keeps a key "__proto__" as an ordinary own key, without touching any prototype', () => {
    const value = parseJsonText('{"__proto__": {"polluted": 1}, "a": {"__proto__": []}}') as Record<string, unknown>;
    expect(Object.keys(value)).toEqual(['__proto__', 'a']);
    expect(Object.getPrototypeOf(value)).toBe(Object.prototype);
    expect(Object.getOwnPropertyDescriptor(value, '__proto__')?.value).toEqual({ polluted: 1 });
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
    expect((value as { polluted?: unknown }).polluted).toBeUndefined();
    expect(value).toEqual(JSON.parse('{"__proto__": {"polluted": 1}, "a": {"__proto__": []}}'));
  });

  it('keeps keys in document order and strings as decoded by JSON', () => {
    const text = '{"z": "\\u00e9\\n\\/", "a": "\\ud83d\\ude00", "m": "\\ud800"}';
    const value = parseJsonText(text);
    expect(Object.keys(value as object)).toEqual(['z', 'a', 'm']);
    expect(value).toEqual(JSON.parse(text));
  });
});

describe('assertJsonData', () => {
  it('accepts plain JSON data, null-prototype objects and shared (acyclic) references', () => {
    const shared = [1, 2];
    const bare = Object.assign(Object.create(null) as object, { a: 1 });
    expect(() => assertJsonData({ a: [null, true, 'x', -0, 1e300], b: shared, c: shared, d: bare })).not.toThrow();
  });

  const bad: [string, unknown, string][] = [
    ['undefined', { a: { b: undefined } }, 'a.b: expected JSON data, got undefined'],
    ['a function', { f: () => 1 }, 'f: expected JSON data, got a function'],
    ['NaN', { x: [1, Number.NaN] }, 'x[1]: expected JSON data, got NaN'],
    ['Infinity', { x: Infinity }, 'x: expected JSON data, got Infinity'],
    ['-Infinity', [-Infinity], '[0]: expected JSON data, got -Infinity'],
    ['a bigint', { n: 1n }, 'n: expected JSON data, got the bigint 1n'],
    ['a symbol', { s: Symbol('s') }, 's: expected JSON data, got a symbol'],
    ['a Date', { when: new Date(0) }, 'when: expected JSON data, got a Date'],
    ['a Map', { m: new Map() }, 'm: expected JSON data, got a Map'],
    ['a typed array', { coordinates: new Float64Array(3) }, 'coordinates: expected JSON data, got a Float64Array'],
    ['a class instance', { p: new (class Point {})() }, 'p: expected JSON data, got a Point'],
    ['a sparse array', { a: [1, , 3] }, 'a[1]: expected JSON data, got an empty slot (a sparse array)'],
    ['a symbol key', { o: { [Symbol('k')]: 1 } }, 'o: expected JSON data, got an object with a symbol key'],
    ['a top-level undefined', undefined, 'expected JSON data, got undefined'],
  ];
  for (const [name, value, message] of bad) {
    it(`refuses ${name} with its path`, () => {
      expectModelError(() => assertJsonData(value), message);
    });
  }

  it('refuses a cycle', () => {
    const a: Record<string, unknown> = { list: [] };
    (a.list as unknown[]).push(a);
    expectModelError(() => assertJsonData(a), 'list[0]: expected JSON data, got a cycle (a value that contains itself)');
  });
});

describe('copyJsonValue', () => {
  it('copies deeply, keeping values, key order and "__proto__" keys', () => {
    const original = parseJsonText('{"b": [1, {"c": [null]}], "__proto__": {"x": 1}, "a": "s"}');
    const copy = copyJsonValue(original) as Record<string, unknown>;
    expect(copy).toEqual(original);
    expect(Object.keys(copy)).toEqual(['b', '__proto__', 'a']);
    expect(copy.b).not.toBe((original as Record<string, unknown>).b);
    ((original as Record<string, unknown[]>).b[1] as Record<string, unknown[]>).c.push(5);
    expect(copy.b).toEqual([1, { c: [null] }]);
  });
});

describe('formatJsonPath', () => {
  it('writes dots for keys, brackets for indices, and quotes non-identifier keys', () => {
    expect(formatJsonPath([])).toBe('');
    expect(formatJsonPath(['units'])).toBe('units');
    expect(formatJsonPath(['terms', 12, 'atoms', 2])).toBe('terms[12].atoms[2]');
    expect(formatJsonPath(['coordinates', 3, 1])).toBe('coordinates[3][1]');
    expect(formatJsonPath(['metadata', 'a b'])).toBe('metadata["a b"]');
    expect(formatJsonPath(['metadata', 'x-y', 'z'])).toBe('metadata["x-y"].z');
    expect(formatJsonPath(['a b'])).toBe('["a b"]');
    expect(formatJsonPath([0])).toBe('[0]');
    expect(formatJsonPath(['metadata', '1st', '$ok', '_'])).toBe('metadata["1st"].$ok._');
    expect(formatJsonPath(['metadata', 'quote"d'])).toBe('metadata["quote\\"d"]');
  });
});

describe('describeValue', () => {
  it('shows numbers as written, strings quoted, containers by kind', () => {
    expect(describeValue(-5)).toBe('-5');
    expect(describeValue(2.5)).toBe('2.5');
    expect(describeValue(-0)).toBe('-0');
    expect(describeValue(Number.NaN)).toBe('NaN');
    expect(describeValue('bohr')).toBe('"bohr"');
    expect(describeValue(null)).toBe('null');
    expect(describeValue(true)).toBe('true');
    expect(describeValue([1, 2])).toBe('an array');
    expect(describeValue({})).toBe('an object');
    expect(describeValue(undefined)).toBe('undefined');
    expect(describeValue(new Uint8Array(1))).toBe('a Uint8Array');
    expect(describeValue(new Error('x'))).toBe('an Error');
    const long = describeValue('x'.repeat(100));
    expect(long).toBe(`"${'x'.repeat(37)}…"`);
  });
});

describe('lineAndColumn', () => {
  it('counts 1-based lines (\\n, \\r\\n, \\r) and code points', () => {
    expect(lineAndColumn('abc', 0)).toEqual({ line: 1, column: 1 });
    expect(lineAndColumn('abc', 2)).toEqual({ line: 1, column: 3 });
    expect(lineAndColumn('a\nbc', 3)).toEqual({ line: 2, column: 2 });
    expect(lineAndColumn('a\r\nbc', 4)).toEqual({ line: 2, column: 2 });
    expect(lineAndColumn('a\rbc', 3)).toEqual({ line: 2, column: 2 });
    expect(lineAndColumn('\u{1F600}x', 2)).toEqual({ line: 1, column: 2 });
    expect(lineAndColumn('ab', 10)).toEqual({ line: 1, column: 3 });
  });
});
