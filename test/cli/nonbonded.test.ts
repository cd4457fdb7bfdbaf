/**
 * The command line on a model with nonbonded pairs: `energy` reports
 * `lennard-jones` and `coulomb` in byKind (spec: model-file.md, "Nonbonded
 * pairs") and in its table; `check-gradient` passes on it. Runs dist/cli.js.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseModel } from '../../src/model/model.js';
import { butane, defaultNonbonded } from '../fixtures/nonbonded-models.js';

const dir = mkdtempSync(join(tmpdir(), 'strainwise-cli-nonbonded-'));
function file(name: string, content: unknown): string {
  const path = join(dir, name);
  writeFileSync(path, JSON.stringify(content, null, 2));
  return path;
}
function cli(...args: string[]) {
  const r = spawnSync(process.execPath, ['dist/cli.js', ...args], { encoding: 'utf8' });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

const path = file('butane.json', butane({ ...defaultNonbonded(), cutoff: 6 }));

describe('strainwise energy with nonbonded pairs', () => {
  it('--json: byKind has lennard-jones and coulomb after the term kinds; total and gradient are the library’s', () => {
    const r = cli('energy', path, '--json');
    expect(r.status).toBe(0);
    const doc = JSON.parse(r.stdout);
    expect(Object.keys(doc.byKind)).toEqual(['harmonic-bond', 'harmonic-angle', 'lennard-jones', 'coulomb']);
    const m = parseModel(butane({ ...defaultNonbonded(), cutoff: 6 }));
    const { byKind, total } = m.breakdown(m.coordinates);
    expect(doc.byKind).toEqual(byKind);
    expect(doc.total).toBe(total);
    const g = new Float64Array(3 * m.atomCount);
    m.energy(m.coordinates, g);
    expect(doc.gradient.flat()).toEqual(Array.from(g));
    // 91 pairs less 37 excluded (see test/model/nonbonded.test.ts).
    expect(doc.termCounts['lennard-jones']).toBe(54);
    expect(doc.termCounts.coulomb).toBe(54);
  });

  it('the table has a row per nonbonded kind with its pair count', () => {
    const r = cli('energy', path);
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/lennard-jones\s+54 pairs\s+-?\d/);
    expect(r.stdout).toMatch(/coulomb\s+54 pairs\s+-?\d/);
  });
});

describe('strainwise check-gradient with nonbonded pairs', () => {
  it('passes, and names a kind of the model as the worst', () => {
    const r = cli('check-gradient', path, '--json');
    expect(r.status).toBe(0);
    const doc = JSON.parse(r.stdout);
    expect(doc.ok).toBe(true);
    expect(['harmonic-bond', 'harmonic-angle', 'lennard-jones', 'coulomb']).toContain(doc.worst.kind);
  });

  it('without terms, the worst coordinate is blamed on a nonbonded kind', () => {
    const only = butane();
    only.terms = [];
    const r = cli('check-gradient', file('only.json', only), '--json');
    expect(r.status).toBe(0);
    expect(['lennard-jones', 'coulomb']).toContain(JSON.parse(r.stdout).worst.kind);
  });
});
