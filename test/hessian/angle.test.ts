/**
 * Bend-angle Hessians of src/hessian/angle.ts near and at 0° and 180°,
 * where ∇²θ grows like 1/sin θ, and their exact values on the line; the
 * cosine-series and periodic angles (polynomials in cos θ) through the line
 * and at their minima.
 */
import { describe, expect, it } from 'vitest';
import { applyMotion, randomRigidMotion, rad, triangle } from '../helpers/geometry.js';
import { createRandom } from '../helpers/random.js';
import { cosineSeriesCoefficients } from '../../src/model/compile.js';
import { PARAMS } from '../helpers/cases.js';
import { report, singleTerm } from '../helpers/terms.js';
import { analytic, maxAbs, numericHessian, relativeError, scaledError, symmetricEigenvalues } from './support.js';

/**
 * Near a line the Hessian's entries are ~ k/(δ r²) and change over a length
 * ~ δ r (δ the angle's distance from 0 or π), so the difference step is
 * taken as 1e-3 δ: the 4-point stencil's truncation error is then
 * ~ (1e-3)⁴ and its rounding ~ ε · 1e3 relative to the entries; measured
 * worst error (max |ΔH| / max(1, max |H|)) ≈ 6e-9. Accepted: 1e-7. The cosine
 * angle is smooth through the line and is differenced with the usual 1e-4;
 * there, with cos θ0 close to −1, H ≈ k (cos θ − cos θ0) ∇²cos θ is tiny, and
 * the measure relative to max(1, |H|) keeps the gradient's absolute rounding
 * (≈ ε k / r, divided by the step) from counting as a relative error.
 */
const NEAR_LINE_TOLERANCE = 1e-7;

describe.each(['harmonic-angle', 'cosine-angle'] as const)('%s near a line', (kind) => {
  for (const delta of [1e-2, 1e-3]) {
    for (const side of ['180°', '0°'] as const) {
      it(`matches differences of the gradient ${delta} rad from ${side} (100 random cases)`, () => {
        const rng = createRandom(kind === 'harmonic-angle' ? 8100 : 8200);
        let worst = 0;
        for (let c = 0; c < 100; c++) {
          const k = rng.uniform(10, 300);
          const theta0 = rng.next() < 0.2 ? Math.PI : rad(rng.uniform(60, 175));
          const params = kind === 'harmonic-angle' ? [k, theta0] : [k, Math.cos(theta0)];
          const theta = side === '180°' ? Math.PI - delta : delta;
          const x = applyMotion(triangle(rng.uniform(0.8, 2), rng.uniform(0.8, 2), theta), randomRigidMotion(rng));
          const table = singleTerm(kind, params);
          const h = analytic(table, x);
          // cos θ is smooth at the line: its Hessian varies on the scale of r, not δ r
          const step = kind === 'harmonic-angle' ? 1e-3 * delta : 1e-4;
          const error = relativeError(h, numericHessian(table, x, step));
          worst = Math.max(worst, error);
          expect(error, `case ${c}`).toBeLessThanOrEqual(NEAR_LINE_TOLERANCE);
        }
        report(`${kind} ${delta} from ${side}: worst error`, worst);
      });
    }
  }
});

describe('harmonic-angle on the line', () => {
  // i on +x at U, j at the origin, k on −x at V (180°) or on +x (0°): exactly collinear.
  const U = 1.1;
  const V = 1.7;
  const linear = new Float64Array([U, 0, 0, 0, 0, 0, -V, 0, 0]);
  const folded = new Float64Array([U, 0, 0, 0, 0, 0, V, 0, 0]);

  it('θ0 = 180° at 180°: E is smooth there and the Hessian is k P ⊗ [[1/U², 1/UV], [1/UV, 1/V²]] over (u, v), matching differences', () => {
    const k = 80;
    const table = singleTerm('harmonic-angle', [k, Math.PI]);
    const h = analytic(table, linear);
    // E = ½ k |δu⊥/U + δv⊥/V|² to second order (derivation in angle.ts): entry (i_y, k_y) = k/(UV) on the (u, v) block.
    expect(h[1 * 9 + 7]).toBeCloseTo(k / (U * V), 12);
    expect(h[1 * 9 + 1]).toBeCloseTo(k / (U * U), 12);
    expect(h[7 * 9 + 7]).toBeCloseTo(k / (V * V), 12);
    expect(h[0]).toBe(0); // no stiffness along the line
    expect(scaledError(h, numericHessian(table, linear, 1e-6))).toBeLessThanOrEqual(1e-8);
  });

  it('θ0 = 0 at 0°: E = ½ k θ² is smooth and the Hessian matches differences (σ = −1 on the cross blocks)', () => {
    const k = 60;
    const table = singleTerm('harmonic-angle', [k, 0]);
    const h = analytic(table, folded);
    expect(h[1 * 9 + 7]).toBeCloseTo(-k / (U * V), 12);
    expect(scaledError(h, numericHessian(table, folded, 1e-6))).toBeLessThanOrEqual(1e-8);
  });

  it('θ0 ≠ 180° at exactly 180°: finite numbers, the E″ part only (the same as for θ0 = 180°)', () => {
    const h = analytic(singleTerm('harmonic-angle', [80, rad(120)]), linear);
    expect(h.every(Number.isFinite)).toBe(true);
    expect(Array.from(h)).toEqual(Array.from(analytic(singleTerm('harmonic-angle', [80, Math.PI]), linear)));
  });

  it('θ0 ≠ 180°: the Hessian grows like 1/sin θ toward the line (the cusp of ½ k (θ − θ0)²)', () => {
    const table = singleTerm('harmonic-angle', [80, rad(120)]);
    const at = (delta: number): number => maxAbs(analytic(table, triangle(U, V, Math.PI - delta)));
    // leading term k (π − θ0) cot θ / U² ∝ 1/δ, the rest bounded: δ · max |H| tends to a constant
    expect(at(1e-3) / at(1e-2)).toBeGreaterThan(9);
    expect((1e-5 * at(1e-5)) / (1e-6 * at(1e-6))).toBeCloseTo(1, 4);
  });

  it('the Hessian at exactly 180° for θ0 = 180° has the eigenvalues of k |δu⊥/U + δv⊥/V|² … plus zero', () => {
    const k = 80;
    const h = analytic(singleTerm('harmonic-angle', [k, Math.PI]), linear);
    const values = symmetricEigenvalues(h, 9);
    // Nonzero part: k (a aᵀ) ⊗ P with a = (1/U, −(1/U + 1/V), 1/V) over atoms (i, j, k): one
    // eigenvalue k |a|² for each of the two perpendicular axes; the other seven are zero.
    const a2 = 1 / (U * U) + (1 / U + 1 / V) ** 2 + 1 / (V * V);
    expect(values[8]).toBeCloseTo(k * a2, 10);
    expect(values[7]).toBeCloseTo(k * a2, 10);
    for (let n = 0; n < 7; n++) expect(Math.abs(values[n])).toBeLessThan(1e-10);
  });

  it('coincident atoms give zero blocks', () => {
    const x = new Float64Array([0, 0, 0, 0, 0, 0, 1, 0, 0]);
    expect(maxAbs(analytic(singleTerm('harmonic-angle', [80, rad(109)]), x))).toBe(0);
    expect(maxAbs(analytic(singleTerm('cosine-angle', [80, -0.3]), x))).toBe(0);
  });
});

describe('cosine-angle on the line', () => {
  it('is smooth through 180° and 0°: matches differences exactly on the line', () => {
    for (const x of [new Float64Array([1.1, 0, 0, 0, 0, 0, -1.7, 0, 0]), new Float64Array([1.1, 0, 0, 0, 0, 0, 1.7, 0, 0])]) {
      const table = singleTerm('cosine-angle', [90, Math.cos(rad(115))]);
      expect(scaledError(analytic(table, x), numericHessian(table, x, 1e-5))).toBeLessThanOrEqual(1e-9);
    }
  });
});

describe.each(['cosine-series-angle', 'periodic-angle'] as const)('%s through the line (a polynomial in cos θ)', (kind) => {
  // Smooth at 0° and 180°: the Hessian varies on the scale of r, so the usual step 1e-4 serves
  // (as for the cosine angle above); accepted 1e-8 as in kernels.test.ts (2e-8 there).
  for (const theta of [rad(180), Math.PI - 1e-3, Math.PI - 1e-2, 1e-2, 1e-3, 0]) {
    it(`matches differences of the gradient at θ = π·${(theta / Math.PI).toFixed(5)} (100 random cases)`, () => {
      const rng = createRandom(kind === 'cosine-series-angle' ? 8300 : 8400);
      let worst = 0;
      for (let c = 0; c < 100; c++) {
        const params = PARAMS[kind](rng);
        const x = applyMotion(triangle(rng.uniform(0.8, 2), rng.uniform(0.8, 2), theta), randomRigidMotion(rng));
        const table = singleTerm(kind, params);
        const h = analytic(table, x);
        expect(h.every(Number.isFinite)).toBe(true);
        const error = relativeError(h, numericHessian(table, x, 1e-4));
        worst = Math.max(worst, error);
        expect(error, `case ${c}: params [${params}]`).toBeLessThanOrEqual(1e-8);
      }
      report(`${kind} at θ = ${theta}: worst error`, worst);
    });
  }

  it('coincident atoms give zero blocks', () => {
    const x = new Float64Array([0, 0, 0, 0, 0, 0, 1, 0, 0]);
    expect(maxAbs(analytic(singleTerm(kind, kind === 'periodic-angle' ? [30, 3, 1] : [10, 20, 5]), x))).toBe(0);
  });
});

describe('polynomial bends at their minima equal the harmonic angle with the same k and θ0', () => {
  // At θ = θ0, E′ = 0 and E″(θ0) = k for the cosine series with c_m = k C_m (C2 = 1/(4 sin²θ0),
  // C1 = −4 C2 cos θ0: E″ = 4 k C2 sin²θ0 = k, derived from the layout in src/terms/table.ts)
  // and for the periodic angle with a = k/n², sign = cos(n θ0) (E″ = a n² sign cos(n θ0) = k);
  // so both Hessians are k ∇θ ∇θᵀ, the harmonic angle's at its minimum.
  const cases: [string, number, number[]][] = [
    ['cosine series, θ0 = 109.5°', 109.5, cosineSeriesCoefficients(109.5).map((c) => 90 * c)],
    ['cosine series, θ0 = 60°', 60, cosineSeriesCoefficients(60).map((c) => 90 * c)],
    ['periodic n = 3, θ0 = 120°', 120, [90 / 9, 3, 1]],
    ['periodic n = 4, θ0 = 90°', 90, [90 / 16, 4, 1]],
    ['periodic n = 2, θ0 = 90° (sign −1)', 90, [90 / 4, 2, -1]],
  ];
  for (const [label, theta0, params] of cases) {
    it(label, () => {
      const kind = label.startsWith('cosine') ? 'cosine-series-angle' : 'periodic-angle';
      const rng = createRandom(8500);
      const x = applyMotion(triangle(1.1, 1.4, rad(theta0)), randomRigidMotion(rng));
      const h = analytic(singleTerm(kind, params), x);
      const reference = analytic(singleTerm('harmonic-angle', [90, rad(theta0)]), x);
      expect(scaledError(h, reference)).toBeLessThan(1e-12);
    });
  }

  it('periodic n = 1 (θ0 = 180°) exactly on the line equals the harmonic angle with θ0 = 180° there', () => {
    // a [1 + cos θ] = ½ a (π − θ)² + O((π − θ)⁴): the same second-order form k P ⊗ [[1/U², 1/UV], [1/UV, 1/V²]]
    const x = new Float64Array([1.1, 0, 0, 0, 0, 0, -1.7, 0, 0]);
    const h = analytic(singleTerm('periodic-angle', [80, 1, -1]), x);
    const reference = analytic(singleTerm('harmonic-angle', [80, Math.PI]), x);
    expect(scaledError(h, reference)).toBeLessThan(1e-14);
  });
});
