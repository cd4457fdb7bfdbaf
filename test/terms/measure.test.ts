/**
 * Internal coordinates of src/terms/measure.ts: distance, bendAngle and
 * torsionAngle, read back from geometries built with known values.
 */
import { describe, expect, it } from 'vitest';
import { bendAngle, distance, torsionAngle } from '../../src/terms/measure.js';
import { applyMotion, chain, rad, randomRigidMotion, triangle } from '../helpers/geometry.js';
import { createRandom } from '../helpers/random.js';
import { evaluate, singleTerm } from '../helpers/terms.js';

/** Smallest difference between two angles, modulo 2π. */
const angleGap = (a: number, b: number): number => Math.abs(Math.atan2(Math.sin(a - b), Math.cos(a - b)));

describe('distance', () => {
  it('is |x_j − x_i| (3-4-12-13, exact by construction) and symmetric', () => {
    const x = new Float64Array([9, 9, 9, 1, 2, 3, 4, 6, 15]);
    expect(distance(x, 1, 2)).toBe(13);
    expect(distance(x, 2, 1)).toBe(13);
    expect(distance(x, 0, 0)).toBe(0);
  });
});

describe('bendAngle', () => {
  it('reads back the angle a triangle was built with, to 1e-14 rad, in any orientation', () => {
    const rng = createRandom(1201);
    for (let n = 0; n < 400; n++) {
      const theta = rng.uniform(0, Math.PI);
      const x = applyMotion(triangle(rng.uniform(0.5, 3), rng.uniform(0.5, 3), theta), randomRigidMotion(rng, 3));
      expect(Math.abs(bendAngle(x, 0, 1, 2) - theta)).toBeLessThanOrEqual(1e-14);
      expect(bendAngle(x, 2, 1, 0)).toBe(bendAngle(x, 0, 1, 2));
    }
  });

  it('is exactly 0, π/2 and π where the geometry says so', () => {
    expect(bendAngle(new Float64Array([1, 0, 0, 0, 0, 0, 3, 0, 0]), 0, 1, 2)).toBe(0);
    expect(bendAngle(new Float64Array([1, 0, 0, 0, 0, 0, 0, 2, 0]), 0, 1, 2)).toBe(Math.PI / 2);
    expect(bendAngle(new Float64Array([-1, -1, -1, 0, 0, 0, 2, 2, 2]), 0, 1, 2)).toBe(Math.PI);
  });

  it('keeps full accuracy 1e-9 rad from 0° and 180°, where acos would lose half the digits', () => {
    for (const theta of [1e-9, Math.PI - 1e-9]) {
      const x = triangle(1.2, 0.9, theta);
      expect(Math.abs(bendAngle(x, 0, 1, 2) - theta)).toBeLessThanOrEqual(1e-15 * Math.max(1, theta));
    }
  });

  it('is the angle the harmonic-angle kernel uses: θ0 = 0 gives ½ k θ²', () => {
    const rng = createRandom(1202);
    for (let n = 0; n < 50; n++) {
      const x = applyMotion(triangle(1, 1.4, rng.uniform(0, Math.PI)), randomRigidMotion(rng));
      const theta = bendAngle(x, 0, 1, 2);
      expect(evaluate(singleTerm('harmonic-angle', [2, 0]), x).energy).toBe(theta * theta);
    }
  });
});

describe('torsionAngle', () => {
  it('reads back the torsion a chain was built with, to 1e-12 rad, in any orientation', () => {
    const rng = createRandom(1203);
    for (let n = 0; n < 400; n++) {
      const phi = rng.uniform(-Math.PI, Math.PI);
      const x = chain(rng.uniform(0.8, 2), rng.uniform(0.8, 2), rng.uniform(0.8, 2), rad(rng.uniform(20, 160)), rad(rng.uniform(20, 160)), phi);
      const moved = applyMotion(x, randomRigidMotion(rng));
      expect(angleGap(torsionAngle(moved, 0, 1, 2, 3), phi)).toBeLessThanOrEqual(1e-12);
    }
  });

  it('lies in (−π, π]: a trans geometry whose raw atan2 gives −π reads π', () => {
    // Trans in the xy plane with j at z = −0: the sine part comes out as −0
    // and atan2(−0, negative) = −π (checked below), which must read as π.
    const x = new Float64Array([1, -0.5, 0, 0, 0, -0, 0, 1.5, 0, -1, 2, 0]);
    const b1 = [x[3] - x[0], x[4] - x[1], x[5] - x[2]];
    const b2 = [x[6] - x[3], x[7] - x[4], x[8] - x[5]];
    const b3 = [x[9] - x[6], x[10] - x[7], x[11] - x[8]];
    const n = [b2[1] * b3[2] - b2[2] * b3[1], b2[2] * b3[0] - b2[0] * b3[2], b2[0] * b3[1] - b2[1] * b3[0]];
    const m = [b1[1] * b2[2] - b1[2] * b2[1], b1[2] * b2[0] - b1[0] * b2[2], b1[0] * b2[1] - b1[1] * b2[0]];
    const raw = Math.atan2(Math.hypot(...b2) * (b1[0] * n[0] + b1[1] * n[1] + b1[2] * n[2]), m[0] * n[0] + m[1] * n[1] + m[2] * n[2]);
    expect(raw).toBe(-Math.PI);
    expect(torsionAngle(x, 0, 1, 2, 3)).toBe(Math.PI);
  });

  it('is the same read backwards (l, k, j, i), and changes sign in a mirror image', () => {
    const rng = createRandom(1204);
    for (let n = 0; n < 200; n++) {
      const x = applyMotion(chain(1.5, 1.5, 1.5, rad(rng.uniform(30, 150)), rad(rng.uniform(30, 150)), rng.uniform(-3, 3)), randomRigidMotion(rng));
      const phi = torsionAngle(x, 0, 1, 2, 3);
      expect(torsionAngle(x, 3, 2, 1, 0)).toBeCloseTo(phi, 13);
      const mirrored = Float64Array.from(x, (v, c) => (c % 3 === 2 ? -v : v));
      expect(torsionAngle(mirrored, 0, 1, 2, 3)).toBeCloseTo(-phi, 13);
    }
  });

  it('is the torsion the harmonic-improper kernel uses: ξ0 = 0 gives ½ k φ²', () => {
    const rng = createRandom(1205);
    for (let n = 0; n < 50; n++) {
      const x = applyMotion(chain(1.5, 1.5, 1.5, rad(100), rad(110), rng.uniform(-3, 3)), randomRigidMotion(rng));
      const phi = torsionAngle(x, 0, 1, 2, 3);
      expect(evaluate(singleTerm('harmonic-improper', [2, 0]), x).energy).toBe(phi * phi);
    }
  });

  it('collinear and coincident atoms give a finite number', () => {
    for (const x of [
      new Float64Array([-1, 0, 0, 0, 0, 0, 1, 0, 0, 2, 1, 0]),
      new Float64Array([1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1]),
    ]) {
      expect(Number.isFinite(torsionAngle(x, 0, 1, 2, 3))).toBe(true);
      expect(Number.isFinite(bendAngle(x, 0, 1, 2))).toBe(true);
    }
  });
});
