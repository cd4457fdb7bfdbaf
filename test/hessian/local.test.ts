/**
 * The helpers of src/hessian/local.ts (spreading a Hessian over difference
 * vectors onto atoms, handing blocks to a sink) and the dense sink of
 * src/hessian/sink.ts, against the plain definitions.
 */
import { describe, expect, it } from 'vitest';
import { emitLocal, expandToAtoms, spreadOf } from '../../src/hessian/local.js';
import { DenseSink } from '../../src/hessian/sink.js';
import { createRandom } from '../helpers/random.js';

describe('expandToAtoms', () => {
  it.each([
    ['bend: x_i ↦ u, x_j ↦ −u − v, x_k ↦ v', [1, 0, -1, -1, 0, 1], 3, 2],
    ['torsion: x_i ↦ −b1, x_j ↦ b1 − b2, x_k ↦ b2 − b3, x_l ↦ b3', [-1, 0, 0, 1, -1, 0, 0, 1, -1, 0, 0, 1], 4, 3],
  ] as const)('%s: equals Σ_s Σ_t C[a][s] C[b][t] D_st and is exactly symmetric', (_name, coefficients, m, nv) => {
    const rng = createRandom(19);
    const di = 3 * nv;
    const dl = 3 * m;
    for (let c = 0; c < 20; c++) {
      const inner = new Float64Array(di * di);
      for (let r = 0; r < di; r++) for (let q = r; q < di; q++) inner[r * di + q] = inner[q * di + r] = rng.uniform(-10, 10);
      const local = new Float64Array(dl * dl).fill(Number.NaN);
      expandToAtoms(inner, spreadOf(coefficients, m, nv), local);
      for (let a = 0; a < m; a++) {
        for (let b = 0; b < m; b++) {
          for (let p = 0; p < 3; p++) {
            for (let q = 0; q < 3; q++) {
              let expected = 0;
              for (let s = 0; s < nv; s++) {
                for (let t = 0; t < nv; t++) expected += coefficients[a * nv + s] * coefficients[b * nv + t] * inner[(3 * s + p) * di + 3 * t + q];
              }
              expect(local[(3 * a + p) * dl + 3 * b + q]).toBeCloseTo(expected, 12);
            }
          }
        }
      }
      for (let r = 0; r < dl; r++) for (let q = 0; q < dl; q++) expect(local[r * dl + q]).toBe(local[q * dl + r]);
    }
  });
});

describe('emitLocal and DenseSink', () => {
  it('put block (s, t) of a local matrix at rows 3a…, columns 3b… of the atoms it names, adding', () => {
    // a 2-atom local matrix with entry (r, c) = 100 r + c, on atoms 2 and 0 of a 3-atom system
    const local = Float64Array.from({ length: 36 }, (_, n) => 100 * Math.floor(n / 6) + (n % 6));
    const matrix = new Float64Array(81).fill(1);
    emitLocal(new DenseSink(matrix, 3), local, Int32Array.of(9, 2, 0), 1, [0, 1]);
    const at = (r: number, c: number): number => matrix[r * 9 + c];
    expect(at(6, 6)).toBe(1 + 0); // atom 2 = slot 0: local (0, 0)
    expect(at(6, 0)).toBe(1 + 3); // (atom 2, x) × (atom 0, x): local (0, 3)
    expect(at(2, 7)).toBe(1 + 501); // (atom 0, z) × (atom 2, y): local (5, 1)
    expect(at(3, 3)).toBe(1); // atom 1 untouched
  });
});
