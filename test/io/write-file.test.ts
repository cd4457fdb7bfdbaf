import { mkdirSync, mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { writeFileWhole } from '../../src/io/write-file.js';

describe('writeFileWhole', () => {
  it('writes a new file and replaces an existing one, leaving no temporary file', () => {
    const dir = mkdtempSync(join(tmpdir(), 'strainwise-write-'));
    const path = join(dir, 'out.json');
    writeFileWhole(path, 'first');
    expect(readFileSync(path, 'utf8')).toBe('first');
    writeFileSync(path, 'old');
    writeFileWhole(path, 'second');
    expect(readFileSync(path, 'utf8')).toBe('second');
    expect(readdirSync(dir)).toEqual(['out.json']);
  });

  it('throws and leaves nothing behind when the folder does not exist', () => {
    const dir = mkdtempSync(join(tmpdir(), 'strainwise-write-'));
    expect(() => writeFileWhole(join(dir, 'missing', 'out.json'), 'x')).toThrow(/ENOENT/);
    expect(readdirSync(dir)).toEqual([]);
  });

  it('leaves the old file untouched when the target cannot be replaced', () => {
    const dir = mkdtempSync(join(tmpdir(), 'strainwise-write-'));
    const sub = join(dir, 'a-folder');
    mkdirSync(sub);
    writeFileSync(join(sub, 'keep'), 'kept');
    expect(() => writeFileWhole(sub, 'x')).toThrow();
    expect(readFileSync(join(sub, 'keep'), 'utf8')).toBe('kept');
    expect(readdirSync(dir)).toEqual(['a-folder']);
  });
});
