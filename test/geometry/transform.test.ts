import { describe, expect, it } from 'vitest';
import { applyRigidMotion, centre, centreOf, rotationAbout } from '../../src/geometry/transform.js';
import { bendAngle, distance } from '../../src/terms/measure.js';

describe('rigid motions', () => {
  const x = Float64Array.from([0, 0, 0, 1, 0, 0, 1, 1, 0, 0.3, -0.2, 2]);

  it('a quarter turn about z maps x̂ to ŷ (exact by construction)', () => {
    const out = applyRigidMotion(new Float64Array(3), Float64Array.from([1, 0, 0]), rotationAbout([0, 0, 5], Math.PI / 2));
    expect(out[0]).toBeCloseTo(0, 15);
    expect(out[1]).toBeCloseTo(1, 15);
    expect(out[2]).toBe(0);
  });

  it('keeps distances and angles, and may write in place', () => {
    const y = x.slice();
    applyRigidMotion(y, y, rotationAbout([1, 2, 3], 0.7), [5, -1, 2]);
    expect(distance(y, 0, 3)).toBeCloseTo(distance(x, 0, 3), 13);
    expect(bendAngle(y, 0, 1, 2)).toBeCloseTo(bendAngle(x, 0, 1, 2), 13);
    expect(y[0]).toBeCloseTo(5, 13);
  });

  it('centres with and without masses', () => {
    const c = centreOf(new Float64Array(3), x);
    expect(Array.from(c)).toEqual([2.3 / 4, 0.8 / 4, 0.5]);
    const m = centre(new Float64Array(x.length), x, [1, 0, 0, 0]);
    expect(Array.from(m.subarray(0, 3))).toEqual([0, 0, 0]);
    expect(Array.from(centreOf(new Float64Array(3), centre(x.slice(), x)))).toEqual([0, 0, 0].map((v, i) => expect.closeTo(v, 14) as unknown as number));
  });
});
