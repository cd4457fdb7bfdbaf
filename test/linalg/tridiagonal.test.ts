/**
 * Householder tridiagonalization: Q is orthogonal and Q T Qᵀ gives A back
 * (the definition of the reduction), and QL on T alone gives T's
 * eigenvalues (checked by their sum and sum of squares: trace T and
 * ‖T‖_F², invariants of a similarity — common practice). The
 * back-transformation applied to rows equals the product with the explicit
 * Q (the definition Q = H_0 ⋯ H_{n−2}).
 */
import { describe, expect, it } from 'vitest';
import { applyReflectorsToRows, reflectorsTransposed, tridiagonalize } from '../../src/linalg/tridiagonal.js';
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

describe('applyReflectorsToRows', () => {
  // Sizes around the four-reflector passes (n − 1 reflectors: remainders 0 … 3), row counts
  // around the three-row groups, and 101 rows at n = 101 (more than one tile of 96 rows).
  const cases: Array<[number, number]> = [];
  for (let n = 1; n <= 12; n++) for (const count of [1, 2, 3, 4, 5, 7]) cases.push([n, count]);
  cases.push([40, 40], [101, 101]);
  for (const blockDiagonal of [false, true]) {
    it(`z ← Q z row by row equals the product with the explicit Q${blockDiagonal ? ' (some reflectors zero)' : ''}`, () => {
      for (const [n, count] of cases) {
        const a = random(n, 100 + n);
        if (blockDiagonal) {
          // Two diagonal blocks: the rows of the first block reach the second only through
          // zeros, so some steps have nothing to reflect (beta = 0).
          const h = n >> 1;
          for (let i = 0; i < h; i++) for (let j = h; j < n; j++) a[i * n + j] = a[j * n + i] = 0;
        }
        const work = Float64Array.from(a);
        const d = new Float64Array(n);
        const e = new Float64Array(n);
        const beta = new Float64Array(n);
        const scratch = new Float64Array(2 * n);
        tridiagonalize(work, n, d, e, beta, scratch);
        if (blockDiagonal && n >= 4) expect(beta.slice(0, n - 2).some((b) => b === 0)).toBe(true);
        const qt = new Float64Array(n * n);
        reflectorsTransposed(work, n, beta, qt, scratch);
        const rows = random(Math.max(n, count), 7 * n + count).slice(0, count * n);
        const expected = new Float64Array(count * n);
        for (let r = 0; r < count; r++) {
          for (let i = 0; i < n; i++) {
            let s = 0;
            for (let k = 0; k < n; k++) s += qt[k * n + i] * rows[r * n + k]; // Q(i, k) = qt[k][i]
            expected[r * n + i] = s;
          }
        }
        applyReflectorsToRows(work, n, beta, rows, count);
        for (let i = 0; i < count * n; i++) expect(Math.abs(rows[i] - expected[i])).toBeLessThan(1e-13);
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
