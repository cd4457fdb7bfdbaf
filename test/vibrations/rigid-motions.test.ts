/**
 * Rigid motions in mass-weighted coordinates: counts, orthonormality, and
 * that an actual small rotation or translation of the structure lies in
 * their span (true by construction: rigid motions are what they span).
 */
import { describe, expect, it } from 'vitest';
import { rigidMotions, LINEAR_MOMENT_RATIO } from '../../src/vibrations/rigid-motions.js';
import { rotationAbout } from '../helpers/geometry.js';
import { createRandom } from '../helpers/random.js';

function randomStructure(atoms: number, seed: number): { x: Float64Array; masses: Float64Array } {
  const r = createRandom(seed);
  return {
    x: Float64Array.from({ length: 3 * atoms }, () => r.uniform(-2, 2)),
    masses: Float64Array.from({ length: atoms }, () => r.uniform(1, 40)),
  };
}

/** Part of the mass-weighted vector v outside the span of the rows of `vectors`. */
function outsideSpan(v: Float64Array, vectors: Float64Array, count: number): number {
  const n = v.length;
  const rest = Float64Array.from(v);
  for (let r = 0; r < count; r++) {
    let d = 0;
    for (let j = 0; j < n; j++) d += rest[j] * vectors[r * n + j];
    for (let j = 0; j < n; j++) rest[j] -= d * vectors[r * n + j];
  }
  return Math.hypot(...rest) / Math.hypot(...v);
}

describe('rigidMotions', () => {
  it('orthonormal, 6 for a general structure; a small rotation and a translation lie in their span', () => {
    for (const seed of [1, 2, 3]) {
      const { x, masses } = randomStructure(7, seed);
      const rm = rigidMotions(x, masses);
      expect(rm.count).toBe(6);
      expect(rm.linear).toBe(false);
      const n = x.length;
      for (let a = 0; a < 6; a++) {
        for (let b = 0; b < 6; b++) {
          let d = 0;
          for (let j = 0; j < n; j++) d += rm.vectors[a * n + j] * rm.vectors[b * n + j];
          expect(Math.abs(d - (a === b ? 1 : 0))).toBeLessThan(1e-13);
        }
      }
      const rot = rotationAbout([0.3, -0.5, Math.sqrt(1 - 0.34)], 1e-6); // column-major 3×3
      const move = new Float64Array(n);
      for (let a = 0; a < 7; a++) {
        for (let c = 0; c < 3; c++) {
          const moved = rot[c] * x[3 * a] + rot[3 + c] * x[3 * a + 1] + rot[6 + c] * x[3 * a + 2] + 0.5e-6 * (c + 1);
          move[3 * a + c] = (moved - x[3 * a + c]) * Math.sqrt(masses[a]);
        }
      }
      expect(outsideSpan(move, rm.vectors, 6)).toBeLessThan(1e-6);
    }
  });

  it('collinear atoms: linear, 5; one atom: 3; no atoms: 0; all atoms at one point: 3', () => {
    const line = rigidMotions(Float64Array.of(0, 0, 0, 1, 1, 1, 3, 3, 3, -2, -2, -2), Float64Array.of(1, 12, 16, 2));
    expect(line.linear).toBe(true);
    expect(line.count).toBe(5);
    expect(rigidMotions(Float64Array.of(1, 2, 3), Float64Array.of(4)).count).toBe(3);
    expect(rigidMotions(new Float64Array(0), new Float64Array(0)).count).toBe(0);
    expect(rigidMotions(Float64Array.of(1, 1, 1, 1, 1, 1), Float64Array.of(1, 2)).count).toBe(3);
  });

  it('the linear test is the moment ratio 1e-8 (spec/cli.md), on either side of it', () => {
    expect(LINEAR_MOMENT_RATIO).toBe(1e-8);
    // Three unit masses at −1, 0, +1 on x, the middle one moved off the line by y: moments about
    // the line ≈ (2/3) y², perpendicular ≈ 2, so the ratio is about y²/3.
    const at = (y: number) => rigidMotions(Float64Array.of(-1, 0, 0, 0, y, 0, 1, 0, 0), Float64Array.of(1, 1, 1));
    expect(at(1e-5).linear).toBe(true); // ratio ≈ 3e-11
    expect(at(1e-3).linear).toBe(false); // ratio ≈ 3e-7
    expect(at(1e-3).count).toBe(6);
  });

  it('moments are the principal moments of inertia about the centre of mass (a two-atom case: μ r², common practice)', () => {
    const rm = rigidMotions(Float64Array.of(0, 0, 0, 0, 0, 2), Float64Array.of(1, 3));
    expect(rm.moments[0]).toBeCloseTo(0, 14);
    expect(rm.moments[2]).toBeCloseTo(0.75 * 4, 13);
    expect(Array.from(rm.centre)).toEqual([0, 0, 1.5]);
  });
});
