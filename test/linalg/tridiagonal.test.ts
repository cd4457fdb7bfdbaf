/**
 * Householder tridiagonalization: Q is orthogonal and Q T Qᵀ gives A back
 * (the definition of the reduction), and QL on T alone gives T's
 * eigenvalues (checked by their sum and sum of squares: trace T and
 * ‖T‖_F², invariants of a similarity — common practice).
 */
import { describe, expect, it } from 'vitest';
import { reflectorsTransposed, tridiagonalize } from '../../src/linalg/tridiagonal.js';
import { tridiagonalQL } from '../../src/linalg/tridiagonal-ql.js';
import { createRandom } from '../helpers/random.js';

function random(n: number, seed: number): Float64Array {
  const r = createRandom(seed);
  const a = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = i; j < n; j++) a[i * n + j] = a[j * n + i] = r.uniform(-1, 1);
  return a;
}

describe('tridiagonalize + reflectorsTransposed', () => {
  for (const n of [1, 2, 3, 8, 33]) {
    it(`n = ${n}: Qᵀ orthogonal, Q T Qᵀ = A to 1e-14`, () => {
      const a = random(n, n);
      const work = Float64Array.from(a);
      const d = new Float64Array(n);
      const e = new Float64Array(n);
      const beta = new Float64Array(n);
      const scratch = new Float64Array(2 * n);
      tridiagonalize(work, n, d, e, beta, scratch);
      const qt = new Float64Array(n * n);
      reflectorsTransposed(work, n, beta, qt, scratch);
      for (let i = 0; i < n; i++) {
        for (let j = 0; j < n; j++) {
          let dot = 0;
          let back = 0;
          for (let k = 0; k < n; k++) {
            dot += qt[i * n + k] * qt[j * n + k];
            // (Q T Qᵀ)(i, j) = Σ_k,l Q(i,k) T(k,l) Q(j,l), Q(i,k) = qt[k][i]
            const tkk = d[k];
            back += qt[k * n + i] * tkk * qt[k * n + j];
            if (k + 1 < n) {
              back += qt[k * n + i] * e[k] * qt[(k + 1) * n + j];
              back += qt[(k + 1) * n + i] * e[k] * qt[k * n + j];
            }
          }
          expect(Math.abs(dot - (i === j ? 1 : 0))).toBeLessThan(1e-14);
          expect(Math.abs(back - a[i * n + j])).toBeLessThan(1e-14);
        }
      }
    });
  }
});

describe('tridiagonalQL without vectors', () => {
  it('eigenvalues keep the trace and the Frobenius norm of T', () => {
    const n = 40;
    const r = createRandom(9);
    const d = Float64Array.from({ length: n }, () => r.uniform(-3, 3));
    const e = Float64Array.from({ length: n }, () => r.uniform(-1, 1));
    let trace = 0;
    let frob = 0;
    for (let i = 0; i < n; i++) {
      trace += d[i];
      frob += d[i] ** 2 + (i + 1 < n ? 2 * e[i] ** 2 : 0);
    }
    expect(tridiagonalQL(d, e, n)).toBeGreaterThan(0);
    expect(d.reduce((s, v) => s + v, 0)).toBeCloseTo(trace, 12);
    expect(d.reduce((s, v) => s + v * v, 0)).toBeCloseTo(frob, 11);
  });
});
