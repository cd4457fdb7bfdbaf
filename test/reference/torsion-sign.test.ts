/**
 * The sign of the torsion angle. IUPAC (Gold Book, "torsion angle"; Basic
 * terminology of stereochemistry, IUPAC Recommendations 1996, Pure Appl.
 * Chem. 68 (1996) 2193): looking along the bond j→k, the torsion angle of
 * i–j–k–l is positive when the front bond j–i must turn clockwise (by less
 * than 180°) to eclipse the rear bond k–l; cis (syn-periplanar) is 0,
 * trans (anti-periplanar) 180°.
 */
import { describe, expect, it } from 'vitest';
import { torsionAngle } from '../../src/terms/measure.js';
import { deg } from '../helpers/geometry.js';
import { evaluate, periodicDihedralParams, singleTerm } from '../helpers/terms.js';

/**
 * A butane-like carbon chain built by hand: C–C bonds of 1.53 Å
 * (sqrt(1.44² + 0.51²) = 1.528 for the outer ones), bond angles near 109.5°.
 * j is at the origin and k on the +z axis, so "looking along j→k" means
 * looking in the +z direction, from below the xy plane. For a viewer looking
 * along +z with +y up, +x points to the viewer's LEFT (right = forward × up
 * = z × y = −x). The front bond j–i points along +x: 9 o'clock. The rear
 * bond k–l projects onto the xy plane at the azimuth φ from +x towards +y;
 * for φ = +60° that is (0.72, 1.247): up and still to the left, 11 o'clock.
 * Turning 9 o'clock to 11 o'clock is clockwise, by 60°: φ = +60°, IUPAC.
 */
function butane(cosPhi: number, sinPhi: number): Float64Array {
  return new Float64Array([
    1.44, 0, -0.51, // i: front carbon's substituent, along +x
    0, 0, 0, // j
    0, 0, 1.53, // k
    1.44 * cosPhi, 1.44 * sinPhi, 1.53 + 0.51, // l
  ]);
}

const SQRT3_2 = Math.sqrt(3) / 2;
const GEOMETRIES = {
  cis: butane(1, 0), // l straight above i: eclipsed, 0° exactly
  trans: butane(-1, 0), // l opposite i: 180° exactly
  plus60: butane(0.5, SQRT3_2), // 11 o'clock seen along j→k: clockwise from i
  minus60: butane(0.5, -SQRT3_2), // 7 o'clock: counter-clockwise from i
};

describe('torsion angle sign (IUPAC)', () => {
  it('cis reads exactly 0°, trans exactly 180°, and the clockwise case +60°, its mirror −60°', () => {
    expect(torsionAngle(GEOMETRIES.cis, 0, 1, 2, 3)).toBe(0);
    expect(torsionAngle(GEOMETRIES.trans, 0, 1, 2, 3)).toBe(Math.PI);
    expect(deg(torsionAngle(GEOMETRIES.plus60, 0, 1, 2, 3))).toBeCloseTo(60, 12);
    expect(deg(torsionAngle(GEOMETRIES.minus60, 0, 1, 2, 3))).toBeCloseTo(-60, 12);
  });

  it('the periodic-dihedral energy reads the same signs: k [1 + cos(φ − 90°)] = k (1 + sin φ)', () => {
    const k = 2;
    const term = singleTerm('periodic-dihedral', periodicDihedralParams(k, 1, Math.PI / 2));
    const energy = (x: Float64Array): number => evaluate(term, x).energy;
    expect(energy(GEOMETRIES.plus60)).toBeCloseTo(k * (1 + SQRT3_2), 12);
    expect(energy(GEOMETRIES.minus60)).toBeCloseTo(k * (1 - SQRT3_2), 12);
    expect(energy(GEOMETRIES.cis)).toBeCloseTo(k, 12);
    expect(energy(GEOMETRIES.trans)).toBeCloseTo(k, 12);
  });

  it('a threefold term k [1 + cos 3φ] is highest eclipsed (cis) and zero staggered (±60°, trans) — common practice for an sp3–sp3 bond', () => {
    const k = 1.4;
    const term = singleTerm('periodic-dihedral', periodicDihedralParams(k, 3, 0));
    expect(evaluate(term, GEOMETRIES.cis).energy).toBeCloseTo(2 * k, 12);
    for (const x of [GEOMETRIES.trans, GEOMETRIES.plus60, GEOMETRIES.minus60]) {
      expect(Math.abs(evaluate(term, x).energy)).toBeLessThanOrEqual(1e-12);
    }
  });
});
