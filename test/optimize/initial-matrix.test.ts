import { describe, expect, it } from 'vitest';
import { createInitialMatrix, type InitialMatrixForm } from '../../src/optimize/initial-matrix.js';
import { createRandom } from '../helpers/random.js';

/** yᵀ H0 y for the current H0. */
function yHy(form: ReturnType<typeof createInitialMatrix>, y: Float64Array): number {
  const v = Float64Array.from(y);
  form.apply(v);
  return v.reduce((a, x, i) => a + x * y[i], 0);
}

describe('initial inverse Hessians of L-BFGS', () => {
  const forms: InitialMatrixForm[] = ['scalar', 'diagonal', 'block'];

  it.each(forms)('%s: after each pair, yᵀH0y = sᵀy and H0 stays positive definite', (form) => {
    const rand = createRandom(99);
    const n = 30;
    const h = createInitialMatrix(form, n);
    h.reset();
    // pairs from a fixed SPD quadratic with very different stiffness per coordinate and coupled triples
    const stiff = Float64Array.from({ length: n }, (_, i) => 10 ** (((i * 7) % 5) - 2));
    for (let pair = 0; pair < 25; pair++) {
      const s = Float64Array.from({ length: n }, () => rand.uniform(-1, 1));
      const y = new Float64Array(n);
      for (let a = 0; a < n; a += 3) {
        // a coupled 3×3 block: stiff[a] along (1,1,1)/√3 plus a soft isotropic part
        const m = (s[a] + s[a + 1] + s[a + 2]) / 3;
        for (let p = 0; p < 3; p++) y[a + p] = stiff[a] * m + 0.05 * s[a + p] + stiff[a + p] * 0.01 * s[a + p];
      }
      const sy = s.reduce((acc, v, i) => acc + v * y[i], 0);
      const yy = y.reduce((acc, v) => acc + v * v, 0);
      expect(sy).toBeGreaterThan(0);
      h.update(s, y, sy, yy);
      expect(yHy(h, y)).toBeCloseTo(sy, 8);
      for (let t = 0; t < 5; t++) {
        const v = Float64Array.from({ length: n }, () => rand.uniform(-1, 1));
        expect(yHy(h, v)).toBeGreaterThan(0);
      }
    }
  });

  it('block: learns a stiff direction that is not along an axis (one atom, quadratic f = ½ xᵀAx)', () => {
    // A = 100 u uᵀ + I with u = (1,1,1)/√3: a diagonal H0 cannot represent it, a 3×3 block can.
    const A = (v: number[]) => {
      const m = (v[0] + v[1] + v[2]) / 3;
      return v.map((x) => 100 * m + x);
    };
    const rand = createRandom(5);
    const block = createInitialMatrix('block', 3);
    const diagonal = createInitialMatrix('diagonal', 3);
    block.reset();
    diagonal.reset();
    for (let pair = 0; pair < 60; pair++) {
      const s = [rand.uniform(-1, 1), rand.uniform(-1, 1), rand.uniform(-1, 1)];
      const y = A(s);
      const sy = s.reduce((a, v, i) => a + v * y[i], 0);
      const yy = y.reduce((a, v) => a + v * v, 0);
      block.update(Float64Array.from(s), Float64Array.from(y), sy, yy);
      diagonal.update(Float64Array.from(s), Float64Array.from(y), sy, yy);
    }
    // H0 A should be near a multiple of I for the block form; measure its spread of eigen-directions on the stiff and a soft vector
    const ratio = (h: ReturnType<typeof createInitialMatrix>) => {
      const stiff = Float64Array.from(A([1, 1, 1]));
      h.apply(stiff); // ≈ c (1,1,1)
      const soft = Float64Array.from(A([1, -1, 0]));
      h.apply(soft); // ≈ c (1,−1,0)
      return (stiff[0] / 1) / (soft[0] / 1);
    };
    expect(Math.abs(Math.log(ratio(block)))).toBeLessThan(Math.log(2)); // within 2× of each other
    expect(Math.abs(Math.log(ratio(diagonal)))).toBeGreaterThan(Math.log(10)); // the diagonal cannot
  });

  it('block falls back to diagonal when the length is not a multiple of 3', () => {
    const h = createInitialMatrix('block', 4);
    h.reset();
    const s = Float64Array.from([1, 2, 3, 4]);
    const y = Float64Array.from([2, 4, 6, 8]);
    h.update(s, y, 60, 120);
    const v = Float64Array.from(y);
    h.apply(v);
    for (let i = 0; i < 4; i++) expect(v[i]).toBeCloseTo(s[i], 12);
  });
});
