/**
 * The cosine-series angle of src/terms/angle.ts, E = k [C0 + C1 cos θ + C2 cos 2θ]
 * with C2 = 1/(4 sin²θ0), C1 = −4 C2 cos θ0, C0 = C2 (2 cos²θ0 + 1): the
 * general angle form of Rappé et al., J. Am. Chem. Soc. 114 (1992) 10024
 * (the coefficients as the brief states them; the paper's equation from
 * memory), with the file's k being the curvature at θ0.
 */
import { describe, expect, it } from 'vitest';
import { cosineSeriesCoefficients, tableFromRecords } from '../../src/model/compile.js';
import { readModelFile } from '../../src/model/validate.js';
import { accumulateCosineAngles, accumulateCosineSeriesAngles } from '../../src/terms/angle.js';
import { applyMotion, rad, randomRigidMotion, triangle } from '../helpers/geometry.js';
import { describeKernelProperties } from '../helpers/properties.js';
import { createRandom } from '../helpers/random.js';
import { allFinite, checkTerm, evaluate, report, singleTerm } from '../helpers/terms.js';
import { allKindsAngstrom, edited, expectModelError } from '../model/fixtures.js';

describeKernelProperties('cosine-series-angle', { seed: 1101, gradientTolerance: 1e-9, invariant: true });

/** A one-term table from file-style parameters (k per radian², θ0 in degrees). */
function fromFile(k: number, theta0: number) {
  return tableFromRecords('cosine-series-angle', [{ atoms: [0, 1, 2], k, theta0 }]);
}

describe('cosine-series-angle', () => {
  it('is k [C0 + C1 cos θ + C2 cos 2θ] at triangles of known angle (coefficients from the formula, cosines from Math.cos)', () => {
    const rng = createRandom(1111);
    for (let n = 0; n < 200; n++) {
      const theta = rad(rng.uniform(0, 180));
      const [k, theta0] = [rng.uniform(10, 300), rng.uniform(1, 179)];
      const s0 = Math.sin(rad(theta0));
      const c0 = Math.cos(rad(theta0));
      const C2 = 1 / (4 * s0 * s0);
      const expected = k * (C2 * (2 * c0 * c0 + 1) - 4 * C2 * c0 * Math.cos(theta) + C2 * Math.cos(2 * theta));
      const x = applyMotion(triangle(rng.uniform(0.8, 2), rng.uniform(0.8, 2), theta), randomRigidMotion(rng));
      const e = accumulateCosineSeriesAngles(x, fromFile(k, theta0));
      expect(Math.abs(e - expected)).toBeLessThanOrEqual(1e-13 * k * C2 * 10); // terms of size k C2 cancel
    }
  });

  it('has its minimum at θ0: E(θ0) = 0, dE/dθ(θ0) = 0 and d²E/dθ²(θ0) = k', () => {
    for (const theta0 of [60, 90, 104.51, 109.47, 120, 150, 175]) {
      const k = 123;
      const table = fromFile(k, theta0);
      const at = (deg: number) => evaluate(table, triangle(1.1, 1.3, rad(deg))).energy;
      const { energy, gradient } = evaluate(table, triangle(1.1, 1.3, rad(theta0)));
      expect(Math.abs(energy)).toBeLessThanOrEqual(1e-12 * k / Math.sin(rad(theta0)) ** 2);
      expect(Math.max(...Array.from(gradient, Math.abs))).toBeLessThanOrEqual(1e-11 * k / Math.sin(rad(theta0)) ** 2);
      // second difference in θ with h = 1e-3 rad: error O(h²) relative
      const h = 1e-3;
      const curvature = (at(theta0 + (h * 180) / Math.PI) - 2 * at(theta0) + at(theta0 - (h * 180) / Math.PI)) / (h * h);
      expect(curvature / k).toBeCloseTo(1, 4);
      // and it is a minimum: higher on both sides
      expect(at(theta0 - 5)).toBeGreaterThan(0);
      expect(at(Math.min(179.9, theta0 + 5))).toBeGreaterThan(0);
    }
  });

  it('equals the cosine angle ½ k′ (cos θ − cos θ0)² with k′ = k / sin²θ0 (algebra: the series is 2 k C2 (cos θ − cos θ0)²), energy and gradient', () => {
    const rng = createRandom(1112);
    for (let n = 0; n < 200; n++) {
      const [k, theta0] = [rng.uniform(10, 300), rng.uniform(5, 175)];
      const series = fromFile(k, theta0);
      const cosine = singleTerm('cosine-angle', [k / Math.sin(rad(theta0)) ** 2, Math.cos(rad(theta0))]);
      const x = applyMotion(triangle(rng.uniform(0.8, 2), rng.uniform(0.8, 2), rad(rng.uniform(0, 180))), randomRigidMotion(rng));
      const a = evaluate(series, x);
      const b = evaluate(cosine, x);
      const scale = k / Math.sin(rad(theta0)) ** 2;
      expect(Math.abs(a.energy - b.energy)).toBeLessThanOrEqual(1e-11 * scale);
      for (let c = 0; c < 9; c++) expect(Math.abs(a.gradient[c] - b.gradient[c])).toBeLessThanOrEqual(1e-11 * scale);
      expect(accumulateCosineAngles(x, cosine)).toBe(b.energy);
    }
  });

  it('with c2 = 0 the internal series is the linear-in-cos form c0 + c1 cos θ', () => {
    const rng = createRandom(1113);
    for (let n = 0; n < 100; n++) {
      const [c0, c1] = [rng.uniform(-50, 50), rng.uniform(-50, 50)];
      const theta = rad(rng.uniform(0, 180));
      const x = applyMotion(triangle(1.2, 0.9, theta), randomRigidMotion(rng));
      const e = accumulateCosineSeriesAngles(x, singleTerm('cosine-series-angle', [c0, c1, 0]));
      expect(e).toBeCloseTo(c0 + c1 * Math.cos(theta), 11);
    }
  });

  it('the coefficients at θ0 = 120° are C2 = 1/3, C1 = 2/3, C0 = 1/2 (hand-computed: sin²120° = 3/4, cos 120° = −1/2)', () => {
    const [c0, c1, c2] = cosineSeriesCoefficients(120);
    expect(c2).toBeCloseTo(1 / 3, 15);
    expect(c1).toBeCloseTo(2 / 3, 15);
    expect(c0).toBeCloseTo(0.5, 15);
    // θ0 = 90°: C2 = 1/4, C1 = 0 exactly (cos 90° taken as exactly 0), C0 = 1/4
    expect(cosineSeriesCoefficients(90)).toEqual([0.25, 0, 0.25]);
  });

  it('is smooth through 0° and 180°: near and at collinear atoms the gradient matches central differences with the default step', () => {
    const rng = createRandom(1114);
    let worst = 0;
    for (const offset of [1e-2, 1e-4, 1e-6, 0]) {
      for (let n = 0; n < 30; n++) {
        const folded = n % 2 === 1;
        const x = new Float64Array([folded ? 1.1 : -1.1, offset, 0, 0, 0, 0, 1.4, 0, offset * rng.uniform(-1, 1)]);
        const moved = applyMotion(x, { rotation: randomRigidMotion(rng).rotation, translation: new Float64Array(3) });
        const table = fromFile(rng.uniform(10, 300), rng.uniform(30, 170));
        const result = checkTerm(table, moved);
        worst = Math.max(worst, result.maxRelError);
        expect(result.maxRelError, `offset ${offset}, case ${n}`).toBeLessThanOrEqual(1e-8);
      }
    }
    report('cosine-series-angle near-line worst maxRelError', worst);
  });

  it('coincident atoms: finite energy (cos θ taken as 1), zero gradient', () => {
    const table = fromFile(100, 109.47);
    const [C0, C1, C2] = cosineSeriesCoefficients(109.47);
    for (const x of [
      new Float64Array([0, 0, 0, 0, 0, 0, 1, 1, 0]),
      new Float64Array([1, 1, 0, 0, 0, 0, 0, 0, 0]),
      new Float64Array([2, 2, 2, 2, 2, 2, 2, 2, 2]),
    ]) {
      const { energy, gradient } = evaluate(table, x);
      expect(energy).toBeCloseTo(100 * (C0 + C1 + C2), 10);
      expect(allFinite(gradient) && Array.from(gradient).every((g) => g === 0)).toBe(true);
    }
  });
});

describe('cosine-series-angle in a model file', () => {
  const withTerm = (term: Record<string, unknown>) => edited(allKindsAngstrom(), (m) => { m.terms = [term]; });
  it('reads k and theta0', () => {
    const file = readModelFile(withTerm({ kind: 'cosine-series-angle', atoms: [0, 1, 2], k: 100, theta0: 109.47 }));
    expect(file.terms[0]).toEqual({ kind: 'cosine-series-angle', atoms: [0, 1, 2], k: 100, theta0: 109.47 });
  });
  it('refuses θ0 = 180 and 0, pointing to periodic-angle', () => {
    const what = 'expected an angle in degrees in (0, 180) (for a linear angle use periodic-angle with n 1 and theta0 180)';
    expectModelError(() => readModelFile(withTerm({ kind: 'cosine-series-angle', atoms: [0, 1, 2], k: 100, theta0: 180 })), `terms[0].theta0: ${what}, got 180`);
    expectModelError(() => readModelFile(withTerm({ kind: 'cosine-series-angle', atoms: [0, 1, 2], k: 100, theta0: 0 })), `terms[0].theta0: ${what}, got 0`);
  });
  it('refuses a negative k, a missing theta0, unknown keys and a wrong atom count', () => {
    const base = { kind: 'cosine-series-angle', atoms: [0, 1, 2], k: 100, theta0: 109.47 };
    expectModelError(() => readModelFile(withTerm({ ...base, k: -1 })), 'terms[0].k: expected a finite number ≥ 0, got -1');
    expectModelError(() => readModelFile(withTerm({ kind: base.kind, atoms: base.atoms, k: 1 })), 'terms[0]: missing required field "theta0"');
    expectModelError(() => readModelFile(withTerm({ ...base, c0: 1 })), 'terms[0]: unknown key "c0" (allowed: kind, atoms, k, theta0)');
    expectModelError(() => readModelFile(withTerm({ ...base, atoms: [0, 1] })), 'terms[0].atoms: cosine-series-angle needs 3 atoms, got 2');
  });
});
