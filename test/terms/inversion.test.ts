/**
 * The inversion (out-of-plane) kernel of src/terms/inversion.ts: the mean
 * over the three choices of the out-of-plane neighbour of
 * c0 + c1 cos ω + c2 cos 2ω, ω the angle between the bond I–L and the plane
 * I J K (the inversion term of Rappé et al., J. Am. Chem. Soc. 114 (1992)
 * 10024, from memory), including planar, perpendicular and collinear
 * geometries.
 */
import { describe, expect, it } from 'vitest';
import { cosineSeriesCoefficients, tableFromRecords } from '../../src/model/compile.js';
import { readModelFile } from '../../src/model/validate.js';
import { accumulateInversions } from '../../src/terms/inversion.js';
import { outOfPlaneAngle } from '../../src/terms/measure.js';
import { randomCentre } from '../helpers/cases.js';
import { applyMotion, maxAbs, rad, randomRigidMotion } from '../helpers/geometry.js';
import { describeKernelProperties } from '../helpers/properties.js';
import { createRandom } from '../helpers/random.js';
import { allFinite, checkTerm, evaluate, report, singleTerm } from '../helpers/terms.js';
import { allKindsAngstrom, edited, expectModelError } from '../model/fixtures.js';

describeKernelProperties('inversion', { seed: 1301, gradientTolerance: 1e-8, invariant: true });

function fromFile(k: number, omega0: number) {
  return tableFromRecords('inversion', [{ atoms: [0, 1, 2, 3], k, omega0 }]);
}

/** ω of bond 0–l against the plane 0, j, k, computed another way: asin of the normal's component. */
function omegaByAsin(x: Float64Array, j: number, k: number, l: number): number {
  const v = (a: number) => [x[3 * a] - x[0], x[3 * a + 1] - x[1], x[3 * a + 2] - x[2]];
  const [a, b, d] = [v(j), v(k), v(l)];
  const n = [a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0]];
  return Math.asin((n[0] * d[0] + n[1] * d[1] + n[2] * d[2]) / (Math.hypot(...n) * Math.hypot(...d)));
}

/** A C3v pyramid: centre at 0, three unit bonds at 120° azimuths, each `beta` below the plane z = 0. */
function pyramid(beta: number): Float64Array {
  const x = new Float64Array(12);
  for (let m = 1; m <= 3; m++) {
    const az = rad(120 * (m - 1));
    x.set([Math.cos(beta) * Math.cos(az), Math.cos(beta) * Math.sin(az), -Math.sin(beta)], 3 * m);
  }
  return x;
}

/**
 * A pyramid whose out-of-plane angles are all ω, by bisection on β: ω grows
 * from 0 (planar) to 90° at β = asin(1/√3), where the three bonds are
 * mutually perpendicular, and falls again beyond (the bonds close up).
 */
function pyramidFor(omega: number): Float64Array {
  let lo = 0;
  let hi = Math.asin(1 / Math.sqrt(3));
  for (let it = 0; it < 200; it++) {
    const mid = (lo + hi) / 2;
    if (Math.abs(outOfPlaneAngle(pyramid(mid), 0, 1, 2, 3)) < omega) lo = mid;
    else hi = mid;
  }
  return pyramid((lo + hi) / 2);
}

describe('inversion', () => {
  it('at a hand-built centre (bonds (1,0,0), (0,1,0), (−1,−1,1)): ω = 45°, 45°, asin(1/√3); planar-form E = (k/3)[(1 − √(2/3)) + 2 (1 − 1/√2)]', () => {
    // Hand-computed: for L = (−1,−1,1) the plane is z = 0, sin ω = 1/√3; for L = (1,0,0)
    // the normal (0,1,0) × (−1,−1,1) = (1, 0, 1), sin ω = 1/√2; likewise for L = (0,1,0).
    const x = new Float64Array([0, 0, 0, 1, 0, 0, 0, 1, 0, -1, -1, 1]);
    expect(Math.abs(outOfPlaneAngle(x, 0, 1, 2, 3))).toBeCloseTo(Math.asin(1 / Math.sqrt(3)), 14);
    expect(Math.abs(outOfPlaneAngle(x, 0, 2, 3, 1))).toBeCloseTo(Math.PI / 4, 14);
    expect(Math.abs(outOfPlaneAngle(x, 0, 3, 1, 2))).toBeCloseTo(Math.PI / 4, 14);
    const k = 6;
    const expected = (k / 3) * (1 - Math.sqrt(2 / 3) + 2 * (1 - Math.SQRT1_2));
    const table = fromFile(k, 0);
    expect(accumulateInversions(x, table)).toBeCloseTo(expected, 14);
    const moved = applyMotion(x, randomRigidMotion(createRandom(1311)));
    expect(accumulateInversions(moved, table)).toBeCloseTo(expected, 13);
  });

  it('is ⅓ Σ [c0 + c1 cos ω + c2 cos 2ω] over the three choices, with ω from an independent asin (random centres)', () => {
    const rng = createRandom(1312);
    for (let n = 0; n < 200; n++) {
      const x = randomCentre(rng);
      const [c0, c1, c2] = [rng.uniform(-20, 20), rng.uniform(-20, 20), rng.uniform(-20, 20)];
      const f = (w: number) => c0 + c1 * Math.cos(w) + c2 * Math.cos(2 * w);
      const expected = (f(omegaByAsin(x, 1, 2, 3)) + f(omegaByAsin(x, 2, 3, 1)) + f(omegaByAsin(x, 3, 1, 2))) / 3;
      expect(accumulateInversions(x, singleTerm('inversion', [c0, c1, c2]))).toBeCloseTo(expected, 11);
    }
  });

  it('does not depend on the order of the three neighbours (all six orders)', () => {
    const rng = createRandom(1313);
    const orders = [[1, 2, 3], [1, 3, 2], [2, 1, 3], [2, 3, 1], [3, 1, 2], [3, 2, 1]];
    for (let n = 0; n < 50; n++) {
      const x = randomCentre(rng);
      const params = [rng.uniform(-20, 20), rng.uniform(-20, 20), rng.uniform(-20, 20)];
      const energies = orders.map((o) => {
        const t = singleTerm('inversion', params);
        t.atoms.set([0, ...o]);
        return evaluate(t, x);
      });
      for (const e of energies) {
        expect(e.energy).toBeCloseTo(energies[0].energy, 12);
        for (let c = 0; c < 12; c++) expect(e.gradient[c]).toBeCloseTo(energies[0].gradient[c], 11);
      }
    }
  });

  it('planar form (ω0 = 0): zero energy and gradient at a planar centre, curvature k for a symmetric pyramidalisation', () => {
    const k = 6;
    const table = fromFile(k, 0);
    const flat = applyMotion(pyramid(0), randomRigidMotion(createRandom(1314)));
    const { energy, gradient } = evaluate(table, flat);
    expect(Math.abs(energy)).toBeLessThanOrEqual(1e-15);
    expect(maxAbs(gradient)).toBeLessThanOrEqual(1e-14);
    // E(ω) = k (1 − cos ω) for a C3v pyramid: second difference in ω
    const h = 1e-3;
    const at = (w: number) => accumulateInversions(pyramidFor(w), table);
    expect((2 * at(h) - 2 * 0) / (h * h) / k).toBeCloseTo(1, 5); // E(h) + E(−h) = 2E(h) by symmetry
    for (const w of [0.1, 0.3, 0.7]) expect(at(w)).toBeCloseTo(k * (1 - Math.cos(w)), 12);
  });

  it('series form (ω0 > 0): minimum 0 at a pyramid with all ω = ω0, gradient zero there, and (k/(2 sin²ω0))(cos ω − cos ω0)² elsewhere', () => {
    for (const omega0 of [20, 45, 84.4339, 90]) {
      const k = 40;
      const table = fromFile(k, omega0);
      const [C0, C1, C2] = cosineSeriesCoefficients(omega0);
      expect(C2).toBeCloseTo(1 / (4 * Math.sin(rad(omega0)) ** 2), 14);
      expect(C1).toBeCloseTo(-4 * C2 * Math.cos(rad(omega0)), 14);
      expect(C0).toBeCloseTo(C2 * (2 * Math.cos(rad(omega0)) ** 2 + 1), 14);
      if (omega0 < 90) {
        const at = evaluate(table, pyramidFor(rad(omega0)));
        expect(Math.abs(at.energy)).toBeLessThanOrEqual(1e-11 * k);
        expect(maxAbs(at.gradient)).toBeLessThanOrEqual(1e-7 * k);
      }
      for (const w of [0, 0.2, 0.6, 1.2]) {
        const e = accumulateInversions(pyramidFor(w), table);
        const expected = (k / (2 * Math.sin(rad(omega0)) ** 2)) * (Math.cos(w) - Math.cos(rad(omega0))) ** 2;
        expect(e).toBeCloseTo(expected, 8);
      }
    }
  });

  it('nearly planar centres (ω down to 1e-7 rad): the gradient matches central differences with the default step (smooth there)', () => {
    const rng = createRandom(1315);
    let worst = 0;
    for (const w of [1e-2, 1e-4, 1e-7, 0]) {
      for (let n = 0; n < 20; n++) {
        const x = applyMotion(pyramidFor(w), randomRigidMotion(rng));
        const params = n % 2 === 0 ? [6, -6, 0] : cosineSeriesCoefficients(rng.uniform(5, 85)).map((c) => 30 * c);
        const result = checkTerm(singleTerm('inversion', params), x);
        worst = Math.max(worst, result.maxRelError);
        expect(result.maxRelError, `ω ${w}, case ${n}`).toBeLessThanOrEqual(1e-8);
      }
    }
    report('inversion near-planar worst maxRelError', worst);
  });

  it('a bond nearly along the plane’s normal (|ω| → 90°, a cone point when c1 ≠ 0): the gradient follows the true one with a step below the offset', () => {
    const rng = createRandom(1316);
    let worst = 0;
    for (const offset of [1e-2, 1e-3, 1e-5]) {
      for (let n = 0; n < 30; n++) {
        // J, K in the xy plane; L offset from the z axis; the other two choices are ordinary.
        const x = new Float64Array([0, 0, 0, 1.1, 0, 0, -0.5, 1.0, 0, offset * Math.cos(n), offset * Math.sin(n), 1.3]);
        const moved = applyMotion(x, { rotation: randomRigidMotion(rng).rotation, translation: new Float64Array(3) });
        const result = checkTerm(singleTerm('inversion', [6, -6, 0]), moved, { step: offset / 300, stencil: 4 });
        worst = Math.max(worst, result.maxRelError);
        expect(result.maxRelError, `offset ${offset}, case ${n}`).toBeLessThanOrEqual(1e-6);
      }
    }
    report('inversion near-normal worst maxRelError', worst);
  });

  it('exactly along the normal with c1 = 0 (ω0 = 90°): the zero gradient of that choice is the true one', () => {
    const x = new Float64Array([0, 0, 0, 1, 0, 0, 0, 1, 0, 0, 0, 1]); // every choice at ω = 90°
    const result = checkTerm(fromFile(20, 90), x, { tolerance: 1e-9 });
    expect(result.ok).toBe(true);
    expect(maxAbs(result.analytic)).toBeLessThanOrEqual(1e-12);
  });

  it('a nearly collinear J–I–K (plane barely defined): gradient still matches central differences with a small step', () => {
    const rng = createRandom(1317);
    for (const offset of [1e-2, 1e-4]) {
      for (let n = 0; n < 20; n++) {
        const x = new Float64Array([0, 0, 0, 1.2, 0, 0, -1.1, offset, 0, 0.2, 0.9, 0.5]);
        const moved = applyMotion(x, { rotation: randomRigidMotion(rng).rotation, translation: new Float64Array(3) });
        const result = checkTerm(singleTerm('inversion', [6, -6, 0]), moved, { step: offset / 300, stencil: 4 });
        expect(result.maxRelError, `offset ${offset}, case ${n}`).toBeLessThanOrEqual(1e-6);
      }
    }
  });

  it('degenerate centres: all four atoms on a line, or a neighbour on the centre: finite energy, finite gradient, zero where undefined', () => {
    const line = new Float64Array([0, 0, 0, 1, 0, 0, -1, 0, 0, 2, 0, 0]);
    const { energy, gradient } = evaluate(singleTerm('inversion', [6, -6, 0]), line);
    expect(energy).toBe(0); // every choice counts as ω = 0: 6 − 6 = 0
    expect(Array.from(gradient).every((g) => g === 0)).toBe(true);
    const onCentre = new Float64Array([0, 0, 0, 0, 0, 0, 1, 0, 0, 0, 1, 0]);
    const r = evaluate(singleTerm('inversion', [3, 2, 1]), onCentre);
    expect(Number.isFinite(r.energy) && allFinite(r.gradient)).toBe(true);
    expect(r.energy).toBeCloseTo(3 + 2 + 1, 12); // all three choices undefined → ω = 0
  });
});

describe('inversion in a model file', () => {
  const withTerm = (term: Record<string, unknown>) => edited(allKindsAngstrom(), (m) => { m.terms = [term]; });
  it('reads k and omega0', () => {
    const term = { kind: 'inversion', atoms: [1, 0, 2, 3], k: 6, omega0: 0 };
    expect(readModelFile(withTerm(term)).terms[0]).toEqual(term);
  });
  it('refuses ω0 outside [0, 90], four atoms only, repeated atoms', () => {
    const base = { kind: 'inversion', atoms: [1, 0, 2, 3], k: 6, omega0: 0 };
    expectModelError(() => readModelFile(withTerm({ ...base, omega0: 95 })), 'terms[0].omega0: expected an angle in degrees in [0, 90], got 95');
    expectModelError(() => readModelFile(withTerm({ ...base, omega0: -1 })), 'terms[0].omega0: expected an angle in degrees in [0, 90], got -1');
    expectModelError(() => readModelFile(withTerm({ ...base, atoms: [1, 0, 2] })), 'terms[0].atoms: inversion needs 4 atoms, got 3');
    expectModelError(() => readModelFile(withTerm({ ...base, atoms: [1, 0, 2, 0] })), 'terms[0].atoms[3]: atom 0 is repeated in this term');
    expectModelError(() => readModelFile(withTerm({ ...base, c: [1, -1, 0] })), 'terms[0]: unknown key "c" (allowed: kind, atoms, k, omega0)');
  });
});
