import { describe, expect, it } from 'vitest';
import { xyzFrame } from '../../src/io/xyz.js';

describe('xyzFrame', () => {
  it('writes count, comment and one line per atom, numbers that read back exactly', () => {
    // (−0 is written as 0, as JSON.stringify does)
    const x = Float64Array.of(0.1 + 0.2, -1e-17, 3, 1 / 3, 2, 7e-300);
    const text = xyzFrame(['O', 'H'], x, 'two\nlines');
    const lines = text.split('\n');
    expect(lines[0]).toBe('2');
    expect(lines[1]).toBe('two lines');
    expect(lines[2].split(' ')[0]).toBe('O');
    const back = [lines[2], lines[3]].flatMap((l) => l.split(' ').slice(1).map(Number));
    expect(back).toEqual(Array.from(x));
    expect(text.endsWith('\n')).toBe(true);
  });
});
