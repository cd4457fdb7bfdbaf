/**
 * The strain report (src/analysis/strain.ts) for the extension kinds: the
 * reference angle is recovered from the compiled coefficients.
 */
import { describe, expect, it } from 'vitest';
import { mostStrainedTerms } from '../../src/analysis/strain.js';
import { parseModel } from '../../src/model/model.js';
import type { ModelFile } from '../../src/model/schema.js';

/** Four atoms: a pyramidal centre 0 with neighbours 1–3 (all ω = 45° for L = 3; hand-built, see test/terms/inversion.test.ts). */
const FILE: ModelFile = {
  format: 'strainwise-model',
  version: 1,
  units: { length: 'angstrom', energy: 'kcal/mol' },
  atoms: [{ element: 'C' }, { element: 'H' }, { element: 'H' }, { element: 'H' }],
  coordinates: [[0, 0, 0], [1, 0, 0], [0, 1, 0], [-1, -1, 1]],
  terms: [
    { kind: 'cosine-series-angle', atoms: [1, 0, 2], k: 50, theta0: 109.47 },
    { kind: 'periodic-angle', atoms: [1, 0, 3], k: 40, n: 3, theta0: 120 },
    { kind: 'inversion', atoms: [0, 1, 2, 3], k: 6, omega0: 0 },
    { kind: 'inversion', atoms: [0, 1, 2, 3], k: 6, omega0: 30 },
  ],
};

describe('mostStrainedTerms for the extension kinds', () => {
  const model = parseModel(FILE);
  const strained = mostStrainedTerms(model, model.coordinates, 10);
  const of = (term: number) => strained.find((s) => s.term === term);

  it('cosine-series-angle: the angle (90°) and θ0 recovered from the coefficients (109.47°)', () => {
    const s = of(0);
    expect(s?.quantity).toBe('angle');
    expect(s?.value).toBeCloseTo(90, 10);
    expect(s?.reference).toBeCloseTo(109.47, 9);
  });
  it('periodic-angle: the angle, no single reference', () => {
    // angle between (1,0,0) and (−1,−1,1): cos = −1/√3 → 125.26°
    expect(of(1)?.value).toBeCloseTo((Math.acos(-1 / Math.sqrt(3)) * 180) / Math.PI, 10);
    expect(of(1)?.reference).toBeNull();
  });
  it('inversion: the mean |ω| of the three choices (45°, 45°, 35.26° → 41.755°) and ω0', () => {
    const mean = (45 + 45 + (Math.asin(1 / Math.sqrt(3)) * 180) / Math.PI) / 3;
    expect(of(2)?.value).toBeCloseTo(mean, 10);
    expect(of(2)?.reference).toBe(0);
    expect(of(3)?.reference).toBeCloseTo(30, 9);
    expect(of(3)?.deviation).toBeCloseTo(mean - 30, 9);
  });
});
