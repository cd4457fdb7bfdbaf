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
});
