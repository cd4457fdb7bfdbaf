/**
 * Bend kernels of src/terms/angle.ts: harmonic angle and cosine angle,
 * including the singular geometries near and at 0° and 180°.
 */
import { describe, expect, it } from 'vitest';
import { accumulateCosineAngles, accumulateHarmonicAngles } from '../../src/terms/angle.js';
import type { TermKind } from '../../src/terms/table.js';
import { applyMotion, rad, randomRigidMotion, triangle } from '../helpers/geometry.js';
import { describeKernelProperties } from '../helpers/properties.js';
import { createRandom } from '../helpers/random.js';
import type { Random } from '../helpers/random.js';
import { allFinite, checkTerm, energyFunction, evaluate, report, singleTerm } from '../helpers/terms.js';

describeKernelProperties('harmonic-angle', { seed: 401, gradientTolerance: 1e-9, invariant: true });
describeKernelProperties('cosine-angle', { seed: 501, gradientTolerance: 1e-9, invariant: true });

const ANGLE_KINDS: readonly TermKind[] = ['harmonic-angle', 'cosine-angle'];

/** Random parameters of an angle kind with θ0 in [lo, hi] degrees. */
function angleParams(kind: TermKind, rng: Random, lo = 60, hi = 180): number[] {
  const theta0 = rad(rng.uniform(lo, hi));
  return [rng.uniform(10, 300), kind === 'harmonic-angle' ? theta0 : Math.cos(theta0)];
}

/**
 * Three atoms with one of them `offset` Å off the line through the other
 * two, randomly oriented (no translation, so coordinates stay below 2 and
 * the stencil step stays ≈ step). `folded` puts i and k on the same side of
 * j (θ near 0°); otherwise θ is near 180°.
 */
function nearLine(rng: Random, offset: number, which: 0 | 1 | 2, folded: boolean): Float64Array {
  const r1 = folded ? rng.uniform(0.9, 1.2) : rng.uniform(0.9, 1.5);
  const r2 = folded ? rng.uniform(1.5, 1.8) : rng.uniform(0.9, 1.5);
  const x = new Float64Array([folded ? r1 : -r1, 0, 0, 0, 0, 0, r2, 0, 0]);
  const w = rng.uniform(0, 2 * Math.PI);
  x[3 * which + 1] = offset * Math.cos(w);
  x[3 * which + 2] = offset * Math.sin(w);
  return applyMotion(x, { rotation: randomRigidMotion(rng).rotation, translation: new Float64Array(3) });
}

describe('harmonic-angle', () => {
  it('is ½ k (θ − θ0)² at a triangle built with a known angle', () => {
    const rng = createRandom(41);
    for (let n = 0; n < 100; n++) {
      const theta = rad(rng.uniform(1, 179));
      const [k, theta0] = [rng.uniform(10, 300), rad(rng.uniform(0, 180))];
      const x = applyMotion(triangle(rng.uniform(0.8, 2), rng.uniform(0.8, 2), theta), randomRigidMotion(rng));
      const e = accumulateHarmonicAngles(x, singleTerm('harmonic-angle', [k, theta0]));
      expect(Math.abs(e - 0.5 * k * (theta - theta0) ** 2)).toBeLessThanOrEqual(1e-12 * k);
    }
  });

  it('the gradient has the size 1/|u| · dE/dθ on the end atom i at every angle (no 1/sin θ)', () => {
    for (const deg of [90, 30, 1, 179, 179.999]) {
      const x = triangle(1.25, 1.1, rad(deg));
      const [k, theta0] = [100, rad(100)];
      const { gradient } = evaluate(singleTerm('harmonic-angle', [k, theta0]), x);
      const gi = Math.hypot(gradient[0], gradient[1], gradient[2]);
      expect(gi).toBeCloseTo((k * Math.abs(rad(deg) - theta0)) / 1.25, 10);
      // The force on i is perpendicular to the bond j–i (along the bend only).
      expect(Math.abs(gradient[0])).toBeLessThanOrEqual(1e-12 * gi); // i lies on +x
    }
  });
});

describe('cosine-angle', () => {
  it('is ½ k (cos θ − cos θ0)² at a triangle built with a known angle', () => {
    const rng = createRandom(51);
    for (let n = 0; n < 100; n++) {
      const theta = rad(rng.uniform(0, 180));
      const [k, cos0] = [rng.uniform(10, 300), Math.cos(rad(rng.uniform(0, 180)))];
      const x = applyMotion(triangle(rng.uniform(0.8, 2), rng.uniform(0.8, 2), theta), randomRigidMotion(rng));
      const e = accumulateCosineAngles(x, singleTerm('cosine-angle', [k, cos0]));
      expect(Math.abs(e - 0.5 * k * (Math.cos(theta) - cos0) ** 2)).toBeLessThanOrEqual(1e-12 * k);
    }
  });
});

/**
 * Near the line θ(x) has a cone-shaped singularity, so the stencil must stay
 * on one side of it: its step is a fraction of the offset. With the 4-point
 * stencil the truncation error scales like (step / offset)⁴ and measured
 * ≈ 3e-7 (relative) at step = offset/100; offset/300 brings it to ≈ 4e-9
 * while rounding (≈ ε E / step) stays below 2e-8 even at 1e-5 Å.
 * cos θ, in contrast, is smooth through 0° and 180° (u·v/(|u| |v|) is
 * analytic wherever |u|, |v| > 0), so the cosine angle is checked with the
 * default step, which may cross the line.
 */
const HARMONIC_SINGULAR = [
  { offset: 1e-2, tolerance: 2e-8 },
  { offset: 1e-3, tolerance: 2e-8 },
  { offset: 1e-5, tolerance: 1e-7 },
];

describe('angles near 0° and 180°: the gradient follows the true one', () => {
  for (const kind of ANGLE_KINDS) {
    for (const { offset, tolerance } of HARMONIC_SINGULAR) {
      const options = kind === 'harmonic-angle' ? { step: offset / 300, stencil: 4 as const } : {};
      const limit = kind === 'harmonic-angle' ? tolerance : 1e-8;
      const stepText = kind === 'harmonic-angle' ? `step ${offset}/300` : 'the default step';
      it(`${kind}: an atom ${offset} Å off the line (i, j or k; θ near 180° and near 0°), 4-point stencil with ${stepText}, maxRelError ≤ ${limit}`, () => {
        const rng = createRandom(Math.round(-Math.log10(offset)) + (kind === 'harmonic-angle' ? 4100 : 5100));
        let worst = 0;
        for (let n = 0; n < 60; n++) {
          const which = (n % 3) as 0 | 1 | 2;
          const folded = n % 2 === 1;
          const x = nearLine(rng, offset, which, folded);
          const params = angleParams(kind, rng);
          const result = checkTerm(singleTerm(kind, params), x, options);
          worst = Math.max(worst, result.maxRelError);
          expect(result.maxRelError, `case ${n}: x = [${Array.from(x).join(', ')}], params = [${params.join(', ')}]`).toBeLessThanOrEqual(limit);
        }
        report(`${kind} singular offset ${offset} worst maxRelError`, worst);
      });
    }
  }

  it('harmonic-angle: the default step, which crosses the line, would not do (the check has teeth here)', () => {
    const rng = createRandom(4199);
    const x = nearLine(rng, 1e-5, 0, false);
    const table = singleTerm('harmonic-angle', [100, rad(110)]);
    expect(checkTerm(table, x).maxRelError).toBeGreaterThan(1e-3);
    expect(checkTerm(table, x, { step: 1e-5 / 300 }).maxRelError).toBeLessThanOrEqual(1e-7);
  });
});

describe('exactly collinear and coincident atoms: finite energy, zero gradient where undefined', () => {
  const straight = [
    new Float64Array([-1, 0, 0, 0, 0, 0, 2, 0, 0]), // 180° along x
    new Float64Array([-1, -1, -1, 0.5, 0.5, 0.5, 2, 2, 2]), // 180° along the diagonal, vertex off the origin
  ];
  const folded = new Float64Array([1, 0, 0, 0, 0, 0, 2.5, 0, 0]); // 0°

  it('harmonic-angle at exactly 180° and 0°: E = ½ k (θ − θ0)² with θ exactly π or 0, gradient zero', () => {
    const [k, theta0] = [120, rad(109.5)];
    const table = singleTerm('harmonic-angle', [k, theta0]);
    for (const x of straight) {
      const { energy, gradient } = evaluate(table, x);
      expect(energy).toBe(0.5 * k * (Math.PI - theta0) ** 2);
      expect(Array.from(gradient).every((g) => g === 0)).toBe(true);
    }
    const { energy, gradient } = evaluate(table, folded);
    expect(energy).toBe(0.5 * k * theta0 ** 2);
    expect(Array.from(gradient).every((g) => g === 0)).toBe(true);
  });

  it('harmonic-angle with θ0 = 180° at exactly 180°: the zero gradient is the true one', () => {
    const table = singleTerm('harmonic-angle', [120, Math.PI]);
    for (const x of straight) {
      expect(evaluate(table, x).energy).toBe(0);
      expect(energyFunction(table)).toHaveCorrectGradient(x, { tolerance: 1e-9 });
    }
  });

  it('cosine-angle is smooth through 0° and 180°: at exactly collinear atoms its gradient (zero) matches central differences', () => {
    const [k, cos0] = [80, Math.cos(rad(120))];
    const table = singleTerm('cosine-angle', [k, cos0]);
    for (const x of [...straight, folded]) {
      const result = checkTerm(table, x, { tolerance: 1e-9 });
      expect(result.ok).toBe(true);
      expect(Math.max(...Array.from(result.analytic, Math.abs))).toBeLessThanOrEqual(1e-12 * k);
    }
    expect(evaluate(table, straight[0]).energy).toBeCloseTo(0.5 * k * (-1 - cos0) ** 2, 12);
    expect(evaluate(table, folded).energy).toBeCloseTo(0.5 * k * (1 - cos0) ** 2, 12);
  });

  it('coincident atoms (i on j, k on j, all three together): finite energy, zero gradient, for both kinds', () => {
    const geometries = [
      new Float64Array([0, 0, 0, 0, 0, 0, 1, 1, 0]),
      new Float64Array([1, 1, 0, 0, 0, 0, 0, 0, 0]),
      new Float64Array([2, 2, 2, 2, 2, 2, 2, 2, 2]),
    ];
    for (const kind of ANGLE_KINDS) {
      const table = singleTerm(kind, kind === 'harmonic-angle' ? [100, rad(104.5)] : [100, Math.cos(rad(104.5))]);
      for (const x of geometries) {
        const { energy, gradient } = evaluate(table, x);
        expect(Number.isFinite(energy)).toBe(true);
        expect(allFinite(gradient) && Array.from(gradient).every((g) => g === 0)).toBe(true);
      }
    }
  });
});
