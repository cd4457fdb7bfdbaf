/**
 * Structure files on the command line: `strainwise parametrize`, and
 * `minimize`/`energy` taking a PDB, XYZ, SDF or MOL file with nothing else
 * supplied (issue: structures in and out).
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { DEMO_SKETCH } from '../../src/demo/sketch.js';
import { readSdf } from '../../src/io/sdf.js';
import { readPdb } from '../../src/io/pdb.js';
import { parseModel } from '../../src/model/model.js';
import { modelFromStructure } from '../../src/params/from-structure.js';
import { maxAtomNorm } from '../../src/optimize/forces.js';
import { SPEC_WATER } from '../fixtures/models.js';
import { convertModelUnits } from '../../src/model/convert.js';

const dir = mkdtempSync(join(tmpdir(), 'strainwise-structure-'));
function file(name: string, content: string): string {
  const path = join(dir, name);
  writeFileSync(path, content);
  return path;
}
function cli(...args: string[]) {
  const r = spawnSync(process.execPath, ['dist/cli.js', ...args], { encoding: 'utf8' });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

const sketch = file('sketch.mol', DEMO_SKETCH);
/** Water as an XYZ file without bonds (bonds must be perceived): O–H 0.9572 Å, H–O–H 104.52° (NIST CCCBDB experimental, from memory), stretched a little. */
const waterXyz = file('water.xyz', '3\nwater, stretched\nO 0 0 0\nH 1.0 0 0\nH -0.3 0.95 0.05\n');

describe('strainwise parametrize', () => {
  it('writes a model file that reads back, with every generated kind, and summarises it', () => {
    const out = join(dir, 'sketch-model.json');
    const r = cli('parametrize', sketch, '-o', out);
    expect(r.status).toBe(0);
    expect(r.stdout).toContain('19 atoms, 19 bonds');
    expect(r.stdout).toContain('6 aromatic atoms');
    expect(r.stdout).toMatch(/C_R ×6/);
    expect(r.stdout).toContain('not quantitative energies');
    const model = parseModel(readFileSync(out, 'utf8'));
    expect(model.atomCount).toBe(19);
    expect(model.kinds).toEqual(expect.arrayContaining(['harmonic-bond', 'periodic-dihedral', 'inversion', 'lennard-jones']));
  });

  it('--json gives counts; bonds perceived from an XYZ file are said so', () => {
    const out = join(dir, 'water-model.json');
    const r = cli('parametrize', waterXyz, '-o', out, '--json');
    expect(r.status).toBe(0);
    const doc = JSON.parse(r.stdout);
    expect(doc).toMatchObject({ atoms: 3, bonds: 2, perceivedBonds: true, output: out, types: { O_3: 1, H_: 2 } });
    expect(r.stderr).toContain('bonds perceived from coordinates');
  });

  it('refuses bad input with one line naming the file and the place', () => {
    const bad = file('bad.xyz', '3\nbroken\nO 0 0 0\nH 1.0 zero 0\nH 0 1 0\n');
    const r = cli('parametrize', bad, '-o', join(dir, 'x.json'));
    expect(r.status).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
    expect(r.stderr).toMatch(/^strainwise: .*bad\.xyz: line 4/);
    const selenium = file('se.xyz', '3\nH2Se\nSe 0 0 0\nH 1.46 0 0\nH 0 1.46 0\n');
    const s = cli('parametrize', selenium, '-o', join(dir, 'y.json'));
    expect(s.status).toBe(2);
    expect(s.stderr).toMatch(/se\.xyz: atoms\[0\]: .*Se/);
    expect(cli('parametrize', sketch, '-o', join(dir, 'z.sdf')).status).toBe(2);
  });
});

describe('strainwise minimize on a structure file', () => {
  it('MOL in, SDF out: the same atoms and bonds with relaxed coordinates, converged, energies that re-evaluate', () => {
    const out = join(dir, 'clean.sdf');
    const r = cli('minimize', sketch, '-o', out, '--max-force', '1e-3', '--json');
    expect(r.status).toBe(0);
    const doc = JSON.parse(r.stdout);
    expect(doc.converged).toBe(true);
    const [written] = readSdf(readFileSync(out, 'utf8'));
    const [original] = readSdf(DEMO_SKETCH);
    expect(written.elements).toEqual(original.elements);
    expect(Array.from(written.bonds ?? [])).toEqual(Array.from(original.bonds ?? []));
    expect(Array.from(written.bondOrders ?? [])).toEqual(Array.from(original.bondOrders ?? []));
    // re-evaluate the written coordinates with the same generic model (SDF keeps 4 decimals)
    const model = parseModel(modelFromStructure(original).file);
    const g = new Float64Array(3 * model.atomCount);
    const e = model.energy(written.coordinates, g);
    expect(Math.abs(e - doc.finalEnergy)).toBeLessThan(0.05);
    expect(maxAtomNorm(g)).toBeLessThan(0.5); // 1e-4 Å rounding of stiff bonds (k ~ 700) moves forces by up to ~0.1
    expect(doc.finalEnergy).toBeLessThan(doc.initialEnergy);
  });

  it('XYZ in, XYZ out: water relaxes to the generic O–H and H–O–H', () => {
    const out = join(dir, 'water-out.xyz');
    const r = cli('minimize', waterXyz, '-o', out);
    expect(r.status).toBe(0);
    const lines = readFileSync(out, 'utf8').trim().split('\n');
    expect(lines).toHaveLength(5);
    const xyz = lines.slice(2).map((l) => l.trim().split(/\s+/).slice(1).map(Number));
    const d = (a: number[], b: number[]) => Math.hypot(a[0] - b[0], a[1] - b[1], a[2] - b[2]);
    // generic natural length of O_3–H (docs/generic-parameters.md: 0.990 Å; experiment 0.957 Å)
    expect(d(xyz[0], xyz[1])).toBeCloseTo(0.99, 2);
    expect(d(xyz[0], xyz[2])).toBeCloseTo(0.99, 2);
  });

  it('a model file written as PDB: Å coordinates even for a nanometre model', () => {
    const nm = convertModelUnits(SPEC_WATER, { length: 'nanometer', energy: 'kJ/mol' });
    const input = file('water-nm.json', JSON.stringify(nm));
    const out = join(dir, 'water.pdb');
    const r = cli('minimize', input, '-o', out);
    expect(r.status).toBe(0);
    const [pdb] = readPdb(readFileSync(out, 'utf8'));
    expect(pdb.elements).toEqual(['O', 'H', 'H']);
    const x = pdb.coordinates;
    expect(Math.hypot(x[3] - x[0], x[4] - x[1], x[5] - x[2])).toBeGreaterThan(0.5); // Å, not nm
    expect(pdb.bonds).not.toBeNull();
  });

  it('energy and check-gradient take a structure file too', () => {
    const e = cli('energy', sketch, '--json');
    expect(e.status).toBe(0);
    expect(Object.keys(JSON.parse(e.stdout).byKind)).toContain('lennard-jones');
    const c = cli('check-gradient', sketch, '--json');
    expect(c.status).toBe(0);
    expect(JSON.parse(c.stdout).ok).toBe(true);
  });
});
