/**
 * `strainwise modes` as a user runs it (dist/cli.js, built before the
 * tests). Contract: ../shared/spec/cli.md (keys frequencies, zeroModes,
 * maxForce; exit 2 with one line for bad input).
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseModel } from '../../src/model/model.js';
import { vibrationalAnalysis } from '../../src/vibrations/model-modes.js';
import { SPEC_WATER } from '../fixtures/models.js';
import { carbonDioxide, torsionBarrierTop, waterAtMinimum } from '../vibrations/models.js';

const dir = mkdtempSync(join(tmpdir(), 'strainwise-modes-'));
function file(name: string, content: unknown): string {
  const path = join(dir, name);
  writeFileSync(path, typeof content === 'string' ? content : JSON.stringify(content, null, 2));
  return path;
}
function cli(...args: string[]) {
  const r = spawnSync(process.execPath, ['dist/cli.js', ...args], { encoding: 'utf8' });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

const water = file('water.json', waterAtMinimum());
const notStationary = file('spec-water.json', SPEC_WATER);

describe('strainwise modes --json', () => {
  it('frequencies, zeroModes and maxForce (contract), equal to the library, nothing on stderr at a minimum', () => {
    const r = cli('modes', water, '--json');
    expect(r.status).toBe(0);
    expect(r.stderr).toBe('');
    const doc = JSON.parse(r.stdout);
    const lib = vibrationalAnalysis(parseModel(waterAtMinimum()));
    expect(doc.frequencies).toEqual(Array.from(lib.modes.frequencies));
    expect(doc.zeroModes).toBe(6);
    expect(doc.maxForce).toBe(lib.stationary.maxForce);
    expect(doc.stationary).toBe(true);
    expect(doc.linear).toBe(false);
    expect(doc.reducedMasses).toHaveLength(3);
    expect(doc.populations).toHaveLength(3);
    expect(doc.temperature).toBe(298.15);
    expect(doc.thermo.zeroPointEnergy).toBe(lib.thermo.zeroPointEnergy);
    expect(doc.units).toEqual({ length: 'angstrom', energy: 'kcal/mol' });
  });

  it('linear: 5 zero modes; a saddle: the imaginary mode negative, its population null; --temperature is used', () => {
    expect(JSON.parse(cli('modes', file('co2.json', carbonDioxide()), '--json').stdout).zeroModes).toBe(5);
    const doc = JSON.parse(cli('modes', file('saddle.json', torsionBarrierTop()), '--json', '--temperature', '500').stdout);
    expect(doc.frequencies[0]).toBeLessThan(0);
    expect(doc.imaginaryCount).toBe(1);
    expect(doc.populations[0]).toBeNull();
    expect(doc.temperature).toBe(500);
    expect(doc.thermo.excludedModes).toBe(1);
  });

  it('not at a stationary point: a one-line warning on stderr, the document still printed, exit 0', () => {
    const r = cli('modes', notStationary, '--json');
    expect(r.status).toBe(0);
    expect(JSON.parse(r.stdout).stationary).toBe(false);
    const lines = r.stderr.trimEnd().split('\n');
    expect(lines).toHaveLength(1);
    expect(lines[0]).toMatch(/^strainwise: warning: .*spec-water\.json: not at a stationary point \(largest force [\d.]+ kcal\/mol\/Å on atom 0, above 0\.01\)/);
    // A looser threshold silences it.
    expect(cli('modes', notStationary, '--json', '--max-force', '10').stderr).toBe('');
  });
});

describe('strainwise modes (table)', () => {
  it('lists each mode with wavenumber, reduced mass, force constant and ground-state population, then the thermochemistry', () => {
    const r = cli('modes', water);
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/3 atoms, 3 vibrations \(6 rigid motions removed, non-linear\)/);
    expect(r.stdout).toMatch(/mode\s+wavenumber \(cm⁻¹\)\s+reduced mass \(Da\)\s+force constant \(kcal\/mol\/Å²\)\s+in v = 0 at 298\.15 K/);
    expect(r.stdout).toMatch(/^\s+1\s+1656\.33\s+1\.07\d+\s+[\d.]+\s+0\.99\d+$/m);
    expect(r.stdout).toMatch(/zero-point energy\s+[\d.]+\s+kcal\/mol/);
    expect(r.stdout).toMatch(/entropy\s+[\d.e-]+\s+kcal\/mol\/K/);
    expect(r.stdout).toMatch(/free energy H − TS/);
  });

  it('flags an imaginary mode and says it was left out of the thermochemistry', () => {
    const r = cli('modes', file('saddle2.json', torsionBarrierTop()));
    expect(r.stdout).toMatch(/^\s+1\s+-[\d.]+\s.*imaginary$/m);
    expect(r.stdout).toMatch(/1 mode with an imaginary or zero wavenumber left out/);
  });

  it('one atom: no vibrations, 3 rigid motions', () => {
    const one = { ...SPEC_WATER, atoms: [{ element: 'Ar' }], coordinates: [[0, 0, 0]], terms: [], bonds: [] };
    const r = cli('modes', file('argon.json', one), '--json');
    expect(r.status).toBe(0);
    const doc = JSON.parse(r.stdout);
    expect(doc.frequencies).toEqual([]);
    expect(doc.zeroModes).toBe(3);
  });
});

describe('strainwise modes --animate', () => {
  it('K writes 20 frames of N atoms; "all" writes 20 per mode', () => {
    const out = join(dir, 'mode2.xyz');
    const r = cli('modes', water, '--animate', '2', '-o', out);
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/animation written: /);
    const lines = readFileSync(out, 'utf8').trimEnd().split('\n');
    expect(lines.length).toBe(20 * (3 + 2));
    expect(lines[0]).toBe('3');
    expect(lines[1]).toMatch(/^mode 2 3672\.\d+ cm-1 frame 1\/20$/);
    const all = join(dir, 'all.xyz');
    expect(cli('modes', water, '--animate', 'all', '-o', all, '--json').status).toBe(0);
    expect(readFileSync(all, 'utf8').trimEnd().split('\n').length).toBe(3 * 20 * 5);
  });

  it('a bad K, a missing -o, a wrong extension or -o alone: exit 2, one line, nothing written or printed', () => {
    const out = join(dir, 'never.xyz');
    const stderr: string[] = [];
    for (const args of [
      ['--animate', '4', '-o', out],
      ['--animate', '1.5', '-o', out],
      ['--animate', '1'],
      ['--animate', '1', '-o', join(dir, 'never.pdb')],
      ['-o', out],
      ['--temperature', '-3'],
    ]) {
      const r = cli('modes', water, ...args);
      expect(r.status, args.join(' ')).toBe(2);
      expect(r.stdout).toBe('');
      expect(r.stderr.trimEnd().split('\n')).toHaveLength(1);
      expect(r.stderr).toMatch(/^strainwise: /);
      stderr.push(r.stderr);
    }
    expect(existsSync(out)).toBe(false);
    expect(stderr[0]).toBe('strainwise: --animate: there is no mode 4 (the model has 3; give 1 to 3 or "all")\n');
    expect(stderr[1]).toBe('strainwise: --animate: expected a mode number ≥ 1 or "all", got "1.5"\n');
  });

  it('a missing file is exit 2 with the file named', () => {
    const r = cli('modes', join(dir, 'absent.json'));
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/absent\.json: no such file/);
  });
});
