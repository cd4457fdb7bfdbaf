/**
 * The command line as a user runs it: `node dist/cli.js ...` (built before
 * the tests, see test/setup/build-once.ts). Contract: ../shared/spec/cli.md.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync, mkdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseModel } from '../../src/model/model.js';
import { TERM_KINDS } from '../../src/terms/table.js';
import { EVERY_KIND, SPEC_WATER } from '../fixtures/models.js';

const dir = mkdtempSync(join(tmpdir(), 'strainwise-cli-'));
function file(name: string, content: unknown): string {
  const path = join(dir, name);
  writeFileSync(path, typeof content === 'string' ? content : JSON.stringify(content, null, 2));
  return path;
}
function cli(...args: string[]) {
  const r = spawnSync(process.execPath, ['dist/cli.js', ...args], { encoding: 'utf8' });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

const every = file('every.json', EVERY_KIND);
const water = file('water.json', SPEC_WATER);

describe('strainwise energy', () => {
  it('--json prints one document with total, byKind, gradient and units', () => {
    const r = cli('energy', every, '--json');
    expect(r.status).toBe(0);
    expect(r.stderr).toBe('');
    const doc = JSON.parse(r.stdout);
    expect(Object.keys(doc.byKind)).toEqual(TERM_KINDS);
    const sum = Object.values(doc.byKind as Record<string, number>).reduce((s, e) => s + e, 0);
    expect(doc.total).toBeCloseTo(sum, 12);
    expect(doc.units).toEqual({ length: 'angstrom', energy: 'kcal/mol' });
    expect(doc.gradient).toHaveLength(9);
    const m = parseModel(EVERY_KIND);
    const g = new Float64Array(27);
    expect(doc.total).toBe(m.energy(m.coordinates, g));
    expect(doc.gradient.flat()).toEqual(Array.from(g));
  });

  it('the human table lists each kind with its term count, the total, the largest force and strained terms', () => {
    const r = cli('energy', water);
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/harmonic-bond\s+2\s/);
    expect(r.stdout).toMatch(/harmonic-angle\s+1\s/);
    expect(r.stdout).toMatch(/total\s+3\s/);
    expect(r.stdout).toMatch(/largest force: .* kcal\/mol\/Å on atom \d/);
    expect(r.stdout).toMatch(/most strained terms/);
    expect(r.stdout).toMatch(/only as good as the parameters/);
  });
});

describe('strainwise check-gradient', () => {
  it('--json reports the errors, the worst coordinate and ok', () => {
    const r = cli('check-gradient', every, '--json');
    expect(r.status).toBe(0);
    const doc = JSON.parse(r.stdout);
    expect(doc.ok).toBe(true);
    expect(doc.maxRelError).toBeLessThan(1e-9);
    expect(doc.maxAbsError).toBeGreaterThanOrEqual(0);
    expect(['x', 'y', 'z']).toContain(doc.worst.axis);
    expect(TERM_KINDS).toContain(doc.worst.kind);
    expect(Number.isInteger(doc.worst.atom)).toBe(true);
  });

  it('worst is null for a model without terms', () => {
    const r = cli('check-gradient', file('empty.json', { ...SPEC_WATER, terms: [] }), '--json');
    expect(r.status).toBe(0);
    expect(JSON.parse(r.stdout).worst).toBeNull();
  });

  it('human output says the result', () => {
    const r = cli('check-gradient', water);
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/result: gradient correct/);
  });
});

describe('bad input and usage: exit 2, one line on stderr, nothing on stdout', () => {
  const cases: [string, string[], RegExp][] = [
    ['missing file', ['energy', join(dir, 'nope.json')], /^strainwise: .*nope\.json: no such file\n$/],
    ['a folder', ['energy', dir], /^strainwise: .*: is a folder, not a file\n$/],
    ['malformed JSON', ['energy', file('broken.json', '{\n  "format": "strainwise-model",\n  "version": 1,,\n}')], /^strainwise: .*broken\.json: line 3, column \d+: .+\n$/],
    [
      'index out of range',
      ['energy', file('range.json', { ...SPEC_WATER, terms: [{ kind: 'harmonic-bond', atoms: [0, 7], k: 1, r0: 1 }] })],
      /^strainwise: .*range\.json: terms\[0\]\.atoms\[1\]: index 7 is out of range \(model has 3 atoms\)\n$/,
    ],
    ['unknown command', ['relax-it', water], /^strainwise: unknown command "relax-it"/],
    ['unknown option', ['energy', water, '--jsn'], /^strainwise: unknown option '--jsn'\n$/],
    ['no file', ['check-gradient'], /^strainwise: check-gradient needs exactly one FILE, got none\n$/],
    ['two files', ['energy', water, water], /^strainwise: energy needs exactly one FILE, got 2\n$/],
  ];
  for (const [what, args, pattern] of cases) {
    it(what, () => {
      const r = cli(...args, ...(what === 'unknown option' ? [] : ['--json']));
      expect(r.status).toBe(2);
      expect(r.stdout).toBe('');
      expect(r.stderr).toMatch(pattern);
      expect(r.stderr.split('\n').length).toBe(2);
      expect(r.stderr).not.toMatch(/\bat .*\.js:\d+/);
    });
  }
});

describe('--help and --version', () => {
  it('prints usage on stdout with status 0', () => {
    const r = cli('--help');
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/strainwise energy FILE/);
  });
  it('no arguments: usage on stderr, status 2', () => {
    const r = cli();
    expect(r.status).toBe(2);
    expect(r.stdout).toBe('');
  });
});

mkdirSync(join(dir, 'sub'), { recursive: true });

describe('strainwise minimize', () => {
  it('--json reports the run and writes a model file whose energy matches', () => {
    const out = join(dir, 'relaxed.json');
    const r = cli('minimize', every, '-o', out, '--json', '--max-force', '0.001');
    expect(r.status).toBe(0);
    const doc = JSON.parse(r.stdout);
    expect(doc.converged).toBe(true);
    expect(doc.method).toBe('lbfgs');
    expect(doc.output).toBe(out);
    expect(doc.finalEnergy).toBeLessThan(doc.initialEnergy);
    expect(doc.evaluations).toBeGreaterThanOrEqual(doc.iterations);
    const m = parseModel(readFileSync(out, 'utf8'));
    const g = new Float64Array(3 * m.atomCount);
    expect(m.energy(m.coordinates, g)).toBe(doc.finalEnergy);
    let max = 0;
    for (let a = 0; a < m.atomCount; a++) max = Math.max(max, Math.sqrt(g[3 * a] ** 2 + g[3 * a + 1] ** 2 + g[3 * a + 2] ** 2));
    expect(max).toBeLessThanOrEqual(0.001);
    expect(max).toBe(doc.maxForce);
  });

  it('keeps frozen atoms bit-for-bit and fixed distances to 1e-10', () => {
    const file0 = { ...structuredClone(EVERY_KIND), frozen: [0, 1], constraints: [{ kind: 'fixed-distance', atoms: [2, 3], length: 1.43 }] };
    const path = file('held.json', file0);
    const r = cli('minimize', path, '-o', path, '--json', '--method', 'cg');
    expect(r.status).toBe(0);
    const m = parseModel(readFileSync(path, 'utf8'));
    const x = m.coordinates;
    expect(Array.from(x.subarray(0, 6))).toEqual([...EVERY_KIND.coordinates[0], ...EVERY_KIND.coordinates[1]]);
    const r23 = Math.hypot(x[9] - x[6], x[10] - x[7], x[11] - x[8]);
    expect(Math.abs(r23 - 1.43) / 1.43).toBeLessThanOrEqual(1e-10);
  });

  it('exit 1 when not converged, and the output is still written', () => {
    const out = join(dir, 'partial.xyz');
    const r = cli('minimize', every, '-o', out, '--max-iterations', '2', '--json');
    expect(r.status).toBe(1);
    expect(JSON.parse(r.stdout).converged).toBe(false);
    expect(readFileSync(out, 'utf8').split('\n')[0]).toBe('9');
  });

  it('refuses an unknown output extension before any work', () => {
    const r = cli('minimize', every, '-o', join(dir, 'x.mol2'));
    expect(r.status).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr).toMatch(/cannot write "\.mol2" files/);
  });
});
