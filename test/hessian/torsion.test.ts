/**
 * Torsion Hessians of src/hessian/torsion.ts near collinear bond angles,
 * where they grow like 1/sin² of the angle, on the line itself, and against
 * Wilson's s-vectors at a minimum.
 */
import { describe, expect, it } from 'vitest';
import { applyMotion, chain, randomRigidMotion, rad } from '../helpers/geometry.js';
import { createRandom } from '../helpers/random.js';
import { periodicDihedralParams, report, singleTerm } from '../helpers/terms.js';
import { PARAMS } from '../helpers/cases.js';
import { analytic, maxAbs, numericHessian, relativeError, scaledError, symmetricEigenvalues } from './support.js';

const KINDS = ['periodic-dihedral', 'ryckaert-bellemans', 'harmonic-improper'] as const;

/**
 * With a bond angle δ from 0 or π the entries grow like 1/δ² and change
 * over a length ~ δ r / n (n the multiplicity: φ turns by O(1) when an atom
 * moves by δ r), so the step is 2.5e-4 δ: truncation ~ (2.5e-4 n)⁴ (with
 * 1e-3 δ the error of an n = 6 term was 4e-7 and fell 80-fold with a
 * 4-fold smaller step: truncation, as h⁴ says). The gradient itself carries a
 * relative error ~ ε/δ (from |b1 × b2| ~ δ), which the difference turns into
 * ~ ε · 4e3 / δ of the entries, ≈ 1e-9 at δ = 1e-3. Measured worst ≈ 2e-9;
 * accepted 1e-7.
 */
const NEAR_LINE_TOLERANCE = 1e-7;

describe.each(KINDS)('%s near collinear atoms', (kind) => {
  for (const delta of [1e-2, 1e-3]) {
    for (const which of ['first', 'second', 'both'] as const) {
      it(`matches differences of the gradient with ${which} bond angle${which === 'both' ? 's' : ''} ${delta} rad from a line (80 random cases)`, () => {
        const rng = createRandom(9100 + KINDS.indexOf(kind));
        let worst = 0;
        for (let c = 0; c < 80; c++) {
          const params = PARAMS[kind](rng);
          const near = (): number => (rng.next() < 0.5 ? delta : Math.PI - delta);
          const free = (): number => rad(rng.uniform(30, 150));
          const theta1 = which === 'second' ? free() : near();
          const theta2 = which === 'first' ? free() : near();
          let phi = rng.uniform(-Math.PI, Math.PI);
          if (kind === 'harmonic-improper') phi = params[1] + rng.uniform(-Math.PI + 0.05, Math.PI - 0.05);
          const x = applyMotion(chain(rng.uniform(1, 2), rng.uniform(1, 2), rng.uniform(1, 2), theta1, theta2, phi), randomRigidMotion(rng));
          const table = singleTerm(kind, params);
          const error = relativeError(analytic(table, x), numericHessian(table, x, 2.5e-4 * delta));
          worst = Math.max(worst, error);
          expect(error, `case ${c}: params [${params}]`).toBeLessThanOrEqual(NEAR_LINE_TOLERANCE);
        }
        report(`${kind} ${which} angle ${delta} from a line: worst error`, worst);
      });
    }
  }

  it('grows like 1/sin² of a bond angle toward the line', () => {
    const table = singleTerm(kind, kind === 'periodic-dihedral' ? periodicDihedralParams(2, 2, 0.3) : PARAMS[kind](createRandom(3)));
    const at = (delta: number): number => maxAbs(analytic(table, chain(1.3, 1.5, 1.4, Math.PI - delta, rad(100), 1.0)));
    expect((1e-6 ** 2 * at(1e-6)) / (1e-5 ** 2 * at(1e-5))).toBeCloseTo(1, 3);
  });

  it('is zero where a bond angle is collinear to rounding (as the gradient is)', () => {
    // chain() with θ1 = π puts atom i at (r1 sin π, 0, r1 cos π): |b1 × b2|² ≈ 1e-32 of |b1|²|b2|²
    const x = chain(1.3, 1.5, 1.4, Math.PI, rad(100), 1.0);
    const h = analytic(singleTerm(kind, PARAMS[kind](createRandom(4))), x);
    expect(maxAbs(h)).toBe(0);
  });
});

/** Unit vector from atom a to atom b and the distance. */
function unit(x: Float64Array, a: number, b: number): { e: number[]; r: number } {
  const d = [0, 1, 2].map((c) => x[3 * b + c] - x[3 * a + c]);
  const r = Math.hypot(d[0], d[1], d[2]);
  return { e: d.map((v) => v / r), r };
}
const crossOf = (a: number[], b: number[]): number[] => [a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0]];
const dotOf = (a: number[], b: number[]): number => a[0] * b[0] + a[1] * b[1] + a[2] * b[2];

/**
 * Wilson's s-vectors of the torsion 1–2–3–4 (Wilson, Decius & Cross,
 * Molecular Vibrations, McGraw-Hill 1955, §4-1; written from memory, and
 * checked here only up to the overall sign, which s sᵀ does not see):
 * s1 = −(e12 × e23)/(r12 sin²φ2), s4 = −(e43 × e32)/(r43 sin²φ3),
 * s2 = (r23 − r12 cos φ2)/(r23 r12 sin φ2) · (e12 × e23)/sin φ2 + cos φ3/(r23 sin φ3) · (e43 × e32)/sin φ3,
 * s3 = (r23 − r43 cos φ3)/(r23 r43 sin φ3) · (e43 × e32)/sin φ3 + cos φ2/(r23 sin φ2) · (e12 × e23)/sin φ2,
 * φ2, φ3 the bond angles at atoms 2 and 3, e_ab the unit vector from a to b.
 */
function wilsonTorsion(x: Float64Array): number[] {
  const { e: e12, r: r12 } = unit(x, 0, 1);
  const { e: e23, r: r23 } = unit(x, 1, 2);
  const { e: e43, r: r43 } = unit(x, 3, 2);
  const e21 = e12.map((v) => -v);
  const e32 = e23.map((v) => -v);
  const cos2 = dotOf(e21, e23);
  const cos3 = -dotOf(e32, e43); // the angle at 3 is between e32 and e34 = −e43
  const sin2 = Math.sqrt(1 - cos2 * cos2);
  const sin3 = Math.sqrt(1 - cos3 * cos3);
  const a = crossOf(e12, e23);
  const b = crossOf(e43, e32);
  const s1 = a.map((v) => -v / (r12 * sin2 * sin2));
  const s4 = b.map((v) => -v / (r43 * sin3 * sin3));
  const s2 = a.map((v, c) => (((r23 - r12 * cos2) / (r23 * r12 * sin2)) * v) / sin2 + ((cos3 / (r23 * sin3)) * b[c]) / sin3);
  const s3 = b.map((v, c) => (((r23 - r43 * cos3) / (r23 * r43 * sin3)) * v) / sin3 + ((cos2 / (r23 * sin2)) * a[c]) / sin2);
  return [...s1, ...s2, ...s3, ...s4];
}

describe('periodic-dihedral at a minimum against Wilson’s s-vectors', () => {
  it('H = E″ s sᵀ (E′ = 0), rank one with eigenvalue E″ |s|², E″ = k n² (50 random chains)', () => {
    const rng = createRandom(9200);
    for (let c = 0; c < 50; c++) {
      const k = rng.uniform(0.5, 5);
      const n = rng.int(1, 4);
      // minimum of k [1 + cos(n φ − phase)] where n φ − phase = π
      const phase = rng.uniform(-Math.PI, Math.PI);
      const phi = (Math.PI + phase) / n;
      const x = applyMotion(
        chain(rng.uniform(1, 2), rng.uniform(1, 2), rng.uniform(1, 2), rad(rng.uniform(40, 150)), rad(rng.uniform(40, 150)), phi),
        randomRigidMotion(rng),
      );
      const h = analytic(singleTerm('periodic-dihedral', periodicDihedralParams(k, n, phase)), x);
      const s = wilsonTorsion(x);
      const curvature = k * n * n;
      const expected = new Float64Array(144);
      for (let r = 0; r < 12; r++) for (let q = 0; q < 12; q++) expected[r * 12 + q] = curvature * s[r] * s[q];
      expect(scaledError(expected, h), `case ${c}`).toBeLessThanOrEqual(1e-10);
      const values = symmetricEigenvalues(h, 12);
      expect(values[11] / (curvature * s.reduce((sum, v) => sum + v * v, 0))).toBeCloseTo(1, 10);
      for (let m = 0; m < 11; m++) expect(Math.abs(values[m])).toBeLessThanOrEqual(1e-9 * values[11]);
    }
  });
});
