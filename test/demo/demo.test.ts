import { spawnSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import { TERM_KINDS } from '../../src/terms/table.js';
import { parseModel } from '../../src/model/model.js';
import { DEMO_MODEL } from '../../src/demo/model.js';

/** The ten kinds of model-file version 1 (shared/spec/model-file.md); the demo shows these, not the extensions. */
const VERSION_1_KINDS = TERM_KINDS.slice(0, 10);

describe('the demo (npm start)', () => {
  it('uses every term kind of version 1, each with non-zero energy at its coordinates', () => {
    expect(VERSION_1_KINDS).not.toContain('inversion');
    expect(VERSION_1_KINDS).toContain('distance-restraint');
    const model = parseModel(DEMO_MODEL);
    expect(model.kinds).toEqual(VERSION_1_KINDS);
    const { byKind } = model.breakdown(model.coordinates);
    for (const kind of VERSION_1_KINDS) expect(byKind[kind]).toBeGreaterThan(0);
  });

  it('prints the energy table and a passing gradient check', () => {
    const r = spawnSync(process.execPath, ['dist/demo.js'], { encoding: 'utf8' });
    expect(r.status).toBe(0);
    for (const kind of VERSION_1_KINDS) expect(r.stdout).toContain(kind);
    expect(r.stdout).toMatch(/total\s+28\s/);
    expect(r.stdout).toContain('result: gradient correct');
    expect(r.stdout).toContain('illustrative parameters');
    expect(r.stdout).toMatch(/converged after \d+ steps/);
  });

  it('takes the sketched structure the whole way: topology, generic types, relaxed geometry', () => {
    const r = spawnSync(process.execPath, ['dist/demo.js'], { encoding: 'utf8' });
    expect(r.status).toBe(0);
    expect(r.stdout).toContain('topology: 19 atoms, 19 bonds, 1 ring (6 aromatic atoms)');
    expect(r.stdout).toMatch(/atom types: C_R ×6, C_3 ×2, O_3 ×1, Cl ×1, H_ ×9/);
    expect(r.stdout).toMatch(/relaxed: converged after \d+ steps/);
    // the drawn 1.5 Å ring bonds relax towards benzene's 1.397 Å (NIST CCCBDB experimental, from memory), within the generic method's 0.04 Å
    const m = /ring C–C mean [\d.]+ → ([\d.]+) Å/.exec(r.stdout);
    expect(m).not.toBeNull();
    expect(Math.abs(Number(m![1]) - 1.397)).toBeLessThan(0.04);
    expect(r.stdout).toContain('not quantitative energies');
  });
});
