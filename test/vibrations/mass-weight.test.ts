/** Mass weighting: H(i, j)/√(m_a m_b), exact on a small case; `out` may be the input. */
import { describe, expect, it } from 'vitest';
import { massWeightHessian } from '../../src/vibrations/mass-weight.js';

describe('massWeightHessian', () => {
  it('divides entry (i, j) by √(m_a m_b) (the definition), also in place', () => {
    const masses = Float64Array.of(4, 9);
    const h = Float64Array.from({ length: 36 }, (_, i) => i + 1);
    const w = massWeightHessian(h, masses);
    for (let i = 0; i < 6; i++) {
      for (let j = 0; j < 6; j++) {
        const mi = i < 3 ? 4 : 9;
        const mj = j < 3 ? 4 : 9;
        expect(w[i * 6 + j]).toBeCloseTo(h[i * 6 + j] / Math.sqrt(mi * mj), 14);
      }
    }
    const same = Float64Array.from(h);
    expect(massWeightHessian(same, masses, same)).toBe(same);
    expect(same).toEqual(w);
  });
});
