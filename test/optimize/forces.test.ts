/** Per-atom force measures of src/optimize/forces.ts. */
import { describe, expect, it } from 'vitest';
import { maxAtomNorm, rmsAtomNorm } from '../../src/optimize/forces.js';

describe('maxAtomNorm and rmsAtomNorm', () => {
  // Triples (3, 4, 0) → 5, (0, 0, 12) → 12, trailing (1) → 1 (exact by construction).
  const v = new Float64Array([3, 4, 0, 0, 0, 12, 1]);
  it('take consecutive triples as atoms, with a trailing partial group', () => {
    expect(maxAtomNorm(v)).toBe(12);
    expect(rmsAtomNorm(v)).toBeCloseTo(Math.sqrt((25 + 144 + 1) / 3), 15);
  });
  it('are 0 for an empty array and never order rms above max', () => {
    expect(maxAtomNorm(new Float64Array(0))).toBe(0);
    expect(rmsAtomNorm(new Float64Array(0))).toBe(0);
    expect(rmsAtomNorm(v)).toBeLessThanOrEqual(maxAtomNorm(v));
  });
  it('report NaN when the array holds NaN', () => {
    expect(maxAtomNorm(new Float64Array([1, NaN, 0]))).toBeNaN();
    expect(maxAtomNorm(new Float64Array([NaN, 0, 0, 5, 0, 0]))).toBeNaN(); // a later finite atom must not hide it
  });
});
