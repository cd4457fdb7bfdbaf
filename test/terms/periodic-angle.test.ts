/**
 * The periodic angle of src/terms/angle.ts, E = (k/n²) [1 − cos(n θ0) cos(n θ)]
 * with θ0 a whole multiple of 180°/n: the special linear (n = 1),
 * trigonal (n = 3) and square-planar/octahedral (n = 4) bends of Rappé et
 * al., J. Am. Chem. Soc. 114 (1992) 10024 (form E = K/n² [1 − cos nθ], from
 * memory; for n = 1 written with its minimum at 180°).
 */
import { describe, expect, it } from 'vitest';
import { tableFromRecords } from '../../src/model/compile.js';
import { readModelFile } from '../../src/model/validate.js';
import { accumulatePeriodicAngles } from '../../src/terms/angle.js';
import { applyMotion, rad, randomRigidMotion, triangle } from '../helpers/geometry.js';
import { describeKernelProperties } from '../helpers/properties.js';
import { createRandom } from '../helpers/random.js';
import { allFinite, checkTerm, evaluate, report, singleTerm } from '../helpers/terms.js';
import { allKindsAngstrom, edited, expectModelError } from '../model/fixtures.js';

describeKernelProperties('periodic-angle', { seed: 1201, gradientTolerance: 1e-9, invariant: true });

function fromFile(k: number, n: number, theta0: number) {
  return tableFromRecords('periodic-angle', [{ atoms: [0, 1, 2], k, n, theta0 }]);
}

describe('periodic-angle', () => {
  it('is (k/n²)[1 − cos(nθ0) cos(nθ)] at triangles of known angle, n = 1…6, every allowed θ0 (cosines from Math.cos)', () => {
    const rng = createRandom(1211);
    for (let n = 1; n <= 6; n++) {
      for (let m = 0; m <= n; m++) {
        const theta0 = (180 * m) / n;
        for (let c = 0; c < 20; c++) {
          const theta = rad(rng.uniform(0, 180));
          const k = rng.uniform(10, 300);
          const expected = (k / (n * n)) * (1 - Math.cos(n * rad(theta0)) * Math.cos(n * theta));
          const x = applyMotion(triangle(rng.uniform(0.8, 2), rng.uniform(0.8, 2), theta), randomRigidMotion(rng));
          expect(accumulatePeriodicAngles(x, fromFile(k, n, theta0))).toBeCloseTo(expected, 10);
        }
      }
    }
  });

  it('the paper’s special cases: linear k (1 + cos θ), trigonal (k/9)(1 − cos 3θ), square planar (k/16)(1 − cos 4θ); minimum 0 at θ0 with curvature k', () => {
    const k = 50;
    const cases = [
      { n: 1, theta0: 180, f: (t: number) => k * (1 + Math.cos(t)) },
      { n: 3, theta0: 120, f: (t: number) => (k / 9) * (1 - Math.cos(3 * t)) },
      { n: 4, theta0: 90, f: (t: number) => (k / 16) * (1 - Math.cos(4 * t)) },
    ];
    for (const { n, theta0, f } of cases) {
      const table = fromFile(k, n, theta0);
      const at = (deg: number) => evaluate(table, triangle(1.05, 1.2, rad(deg))).energy;
      for (const deg of [30, 75, 100, 135, 160]) expect(at(deg)).toBeCloseTo(f(rad(deg)), 11);
      expect(Math.abs(at(theta0))).toBeLessThanOrEqual(1e-12 * k);
      const h = 1e-3;
      const d = (h * 180) / Math.PI;
      const hi = theta0 === 180 ? theta0 - d : theta0 + d; // at 180° the angle cannot grow: use the even symmetry E(180 + δ) = E(180 − δ)
      const curvature = (at(hi) - 2 * at(theta0) + at(theta0 - d)) / (h * h);
      expect(curvature / k).toBeCloseTo(1, 5);
    }
  });

  it('n = 2 with θ0 = 90° equals the cosine angle with θ0 = 90° and the same k ((k/4)(1 + cos 2θ) = (k/2) cos²θ)', () => {
    const rng = createRandom(1212);
    for (let c = 0; c < 100; c++) {
      const k = rng.uniform(10, 300);
      const x = applyMotion(triangle(1.1, 1.4, rad(rng.uniform(0, 180))), randomRigidMotion(rng));
      const a = evaluate(fromFile(k, 2, 90), x);
      const b = evaluate(singleTerm('cosine-angle', [k, 0]), x);
      expect(a.energy).toBeCloseTo(b.energy, 11);
      for (let i = 0; i < 9; i++) expect(a.gradient[i]).toBeCloseTo(b.gradient[i], 10);
    }
  });

  it('n = 1 with θ0 = 180° equals the cosine series with c0 = c1 = k, c2 = 0 (k (1 + cos θ))', () => {
    const rng = createRandom(1213);
    for (let c = 0; c < 100; c++) {
      const k = rng.uniform(10, 300);
      const x = applyMotion(triangle(1.1, 1.4, rad(rng.uniform(0, 180))), randomRigidMotion(rng));
      const a = evaluate(fromFile(k, 1, 180), x);
      const b = evaluate(singleTerm('cosine-series-angle', [k, k, 0]), x);
      expect(a.energy).toBeCloseTo(b.energy, 11);
      for (let i = 0; i < 9; i++) expect(a.gradient[i]).toBeCloseTo(b.gradient[i], 10);
    }
  });

  it('is smooth through 0° and 180°: near and at collinear atoms the gradient matches central differences with the default step', () => {
    const rng = createRandom(1214);
    let worst = 0;
    for (const offset of [1e-2, 1e-4, 1e-6, 0]) {
      for (let c = 0; c < 30; c++) {
        const folded = c % 2 === 1;
        const x = new Float64Array([folded ? 1.1 : -1.1, offset, 0, 0, 0, 0, 1.4, 0, offset * rng.uniform(-1, 1)]);
        const moved = applyMotion(x, { rotation: randomRigidMotion(rng).rotation, translation: new Float64Array(3) });
        const n = rng.int(1, 6);
        const result = checkTerm(singleTerm('periodic-angle', [rng.uniform(10, 300) / (n * n), n, rng.sign()]), moved);
        worst = Math.max(worst, result.maxRelError);
        expect(result.maxRelError, `offset ${offset}, case ${c}`).toBeLessThanOrEqual(1e-8);
      }
    }
    report('periodic-angle near-line worst maxRelError', worst);
  });

  it('coincident atoms: finite energy (cos θ taken as 1), zero gradient', () => {
    const table = fromFile(90, 3, 120);
    for (const x of [new Float64Array([0, 0, 0, 0, 0, 0, 1, 1, 0]), new Float64Array([2, 2, 2, 2, 2, 2, 2, 2, 2])]) {
      const { energy, gradient } = evaluate(table, x);
      expect(energy).toBeCloseTo((90 / 9) * (1 - 1), 12); // cos(3·120°) = 1, cos(3·0) = 1
      expect(allFinite(gradient) && Array.from(gradient).every((g) => g === 0)).toBe(true);
    }
  });
});

describe('periodic-angle in a model file', () => {
  const withTerm = (term: Record<string, unknown>) => edited(allKindsAngstrom(), (m) => { m.terms = [term]; });
  it('reads k, n and theta0', () => {
    const term = { kind: 'periodic-angle', atoms: [0, 1, 2], k: 100, n: 3, theta0: 120 };
    expect(readModelFile(withTerm(term)).terms[0]).toEqual(term);
  });
  it('refuses θ0 that is not a whole multiple of 180°/n, listing the allowed values', () => {
    expectModelError(
      () => readModelFile(withTerm({ kind: 'periodic-angle', atoms: [0, 1, 2], k: 100, n: 3, theta0: 109.5 })),
      'terms[0].theta0: periodic-angle with n 3 needs theta0 a whole multiple of 60° (0, 60, 120 or 180), got 109.5',
    );
    expectModelError(
      () => readModelFile(withTerm({ kind: 'periodic-angle', atoms: [0, 1, 2], k: 100, n: 1, theta0: 170 })),
      'terms[0].theta0: periodic-angle with n 1 needs theta0 a whole multiple of 180° (0 or 180), got 170',
    );
    expectModelError(
      () => readModelFile(withTerm({ kind: 'periodic-angle', atoms: [0, 1, 2], k: 100, n: 7, theta0: 100 })),
      'terms[0].theta0: periodic-angle with n 7 needs theta0 a whole multiple of 25.714286°, got 100',
    );
  });
  it('refuses n that is not a whole number ≥ 1 and θ0 outside [0, 180]', () => {
    const base = { kind: 'periodic-angle', atoms: [0, 1, 2], k: 100, n: 3, theta0: 120 };
    expectModelError(() => readModelFile(withTerm({ ...base, n: 0 })), 'terms[0].n: expected an integer ≥ 1, got 0');
    expectModelError(() => readModelFile(withTerm({ ...base, n: 1.5 })), 'terms[0].n: expected an integer ≥ 1, got 1.5');
    expectModelError(() => readModelFile(withTerm({ ...base, theta0: 240 })), 'terms[0].theta0: expected an angle in degrees in [0, 180], got 240');
    expectModelError(() => readModelFile(withTerm({ ...base, phase: 0 })), 'terms[0]: unknown key "phase" (allowed: kind, atoms, k, n, theta0)');
  });
});
