/**
 * Restriction to an orthogonal complement: the spectrum of P A P (P = I − B Bᵀ)
 * is that of the restricted matrix plus k zeros, and lifted vectors are
 * orthogonal to B (true by construction of the projector; computed here
 * with our eigensolver, tested in ./symmetric-eigen.test.ts).
 */
import { describe, expect, it } from 'vitest';
import { restrictToComplement } from '../../src/linalg/complement.js';
import { symmetricEigen } from '../../src/linalg/symmetric-eigen.js';
import { createRandom } from '../helpers/random.js';

function setup(n: number, k: number, seed: number) {
  const r = createRandom(seed);
  const a = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = i; j < n; j++) a[i * n + j] = a[j * n + i] = r.uniform(-1, 1);
  // k orthonormal rows by Gram–Schmidt on random vectors.
  const b = new Float64Array(k * n);
  for (let s = 0; s < k; s++) {
    for (let j = 0; j < n; j++) b[s * n + j] = r.uniform(-1, 1);
    for (let pass = 0; pass < 2; pass++) {
      for (let t = 0; t < s; t++) {
        let d = 0;
        for (let j = 0; j < n; j++) d += b[s * n + j] * b[t * n + j];
        for (let j = 0; j < n; j++) b[s * n + j] -= d * b[t * n + j];
      }
      let norm = 0;
      for (let j = 0; j < n; j++) norm += b[s * n + j] ** 2;
      for (let j = 0; j < n; j++) b[s * n + j] /= Math.sqrt(norm);
    }
  }
  return { a, b };
}

describe('restrictToComplement', () => {
  for (const [n, k] of [
    [9, 6],
    [12, 5],
    [5, 0],
    [4, 4],
  ]) {
    it(`n = ${n}, k = ${k}: spectrum of P A P = restricted spectrum + ${k} zeros; lifted eigenvectors ⟂ B and orthonormal`, () => {
      const { a, b } = setup(n, k, n + k);
      const res = restrictToComplement(a, n, b, k);
      expect(res.size).toBe(n - k);
      const p = new Float64Array(n * n);
      for (let i = 0; i < n; i++) {
        for (let j = 0; j < n; j++) {
          let s = i === j ? 1 : 0;
          for (let t = 0; t < k; t++) s -= b[t * n + i] * b[t * n + j];
          p[i * n + j] = s;
        }
      }
      const pap = new Float64Array(n * n);
      for (let i = 0; i < n; i++)
        for (let j = 0; j < n; j++) {
          let s = 0;
          for (let u = 0; u < n; u++) for (let v = 0; v < n; v++) s += p[i * n + u] * a[u * n + v] * p[v * n + j];
          pap[i * n + j] = s;
        }
      const full = Array.from(symmetricEigen(pap, n).values);
      const restricted = symmetricEigen(res.matrix, res.size);
      const expected = [...Array.from(restricted.values), ...new Array(k).fill(0)].sort((x, y) => x - y);
      expected.forEach((v, i) => expect(Math.abs(full[i] - v)).toBeLessThan(1e-12));
      const lifted: Float64Array[] = [];
      for (let i = 0; i < res.size; i++) {
        lifted.push(res.lift(restricted.vectors.subarray(i * res.size, (i + 1) * res.size), new Float64Array(n)));
      }
      for (let i = 0; i < res.size; i++) {
        for (let t = 0; t < k; t++) {
          let d = 0;
          for (let j = 0; j < n; j++) d += lifted[i][j] * b[t * n + j];
          expect(Math.abs(d)).toBeLessThan(1e-13);
        }
        for (let j = 0; j < res.size; j++) {
          let d = 0;
          for (let c = 0; c < n; c++) d += lifted[i][c] * lifted[j][c];
          expect(Math.abs(d - (i === j ? 1 : 0))).toBeLessThan(1e-13);
        }
        // A v = λ v on the complement: P A v = λ v.
        let worst = 0;
        for (let r = 0; r < n; r++) {
          let s = 0;
          for (let c = 0; c < n; c++) s += pap[r * n + c] * lifted[i][c];
          worst = Math.max(worst, Math.abs(s - restricted.values[i] * lifted[i][r]));
        }
        expect(worst).toBeLessThan(1e-12);
      }
    });
  }

  it('refuses a basis that is not orthonormal and lengths that do not fit', () => {
    expect(() => restrictToComplement(new Float64Array(9), 3, Float64Array.of(1, 1, 0), 1)).toThrow(
      'restrictToComplement: basis rows 0 and 0 are not orthonormal (dot product 2)',
    );
    expect(() => restrictToComplement(new Float64Array(8), 3, new Float64Array(0), 0)).toThrow('restrictToComplement: matrix: expected n² = 9 numbers, got 8');
    expect(() => restrictToComplement(new Float64Array(9), 3, new Float64Array(2), 1)).toThrow('restrictToComplement: basis: expected k×n = 1×3 numbers, got 2');
  });
});
