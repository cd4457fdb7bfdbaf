/**
 * Small dense helpers shared by the Hessian kernels: a term's local Hessian
 * is built in a scratch array, made exactly symmetric, and handed to the sink
 * block by block.
 * @module
 */
import type { HessianSink } from './sink.js';

/**
 * Hands the local Hessian `local` of one term to `sink`: `local` is a
 * (3m)×(3m) row-major matrix over the term's used atoms, atom s of them
 * being `atoms[base + slots[s]]`. Calls `sink.add` for every ordered pair
 * (s, t), s then t increasing, as {@link HessianSink} requires.
 */
export function emitLocal(
  sink: HessianSink,
  local: Float64Array,
  atoms: Int32Array,
  base: number,
  slots: readonly number[],
): void {
  const m = slots.length;
  const stride = 3 * m;
  for (let s = 0; s < m; s++) {
    const a = atoms[base + slots[s]];
    for (let t = 0; t < m; t++) {
      sink.add(a, atoms[base + slots[t]], local, 3 * s * stride + 3 * t, stride);
    }
  }
}

/**
 * Makes the `dim`×`dim` row-major `matrix` exactly symmetric in place: each
 * pair of mirrored entries is replaced by their mean (the same rounded
 * number on both sides, since addition commutes).
 */
export function symmetrize(matrix: Float64Array, dim: number): void {
  for (let r = 0; r < dim; r++) {
    for (let c = r + 1; c < dim; c++) {
      const mean = 0.5 * (matrix[r * dim + c] + matrix[c * dim + r]);
      matrix[r * dim + c] = mean;
      matrix[c * dim + r] = mean;
    }
  }
}

/**
 * The Hessian over atoms from the Hessian over difference vectors. When the
 * energy is a function of `nv` vectors d_s = Σ_a C[a][s] x_a (C with entries
 * −1, 0, 1, m atoms), the atom blocks are
 * H_ab = Σ_s Σ_t C[a][s] C[b][t] D_st, D the (3nv)×(3nv) Hessian over the
 * d's. Writes `local` ((3m)×(3m), row-major), overwriting it.
 */
export function expandToAtoms(
  inner: Float64Array,
  nv: number,
  coefficients: readonly number[],
  m: number,
  local: Float64Array,
): void {
  const di = 3 * nv;
  const dl = 3 * m;
  for (let a = 0; a < m; a++) {
    for (let b = 0; b < m; b++) {
      for (let p = 0; p < 3; p++) {
        for (let q = 0; q < 3; q++) {
          let sum = 0;
          for (let s = 0; s < nv; s++) {
            const ca = coefficients[a * nv + s];
            if (ca === 0) continue;
            for (let t = 0; t < nv; t++) {
              const cb = coefficients[b * nv + t];
              if (cb === 0) continue;
              const value = inner[(3 * s + p) * di + 3 * t + q];
              sum += ca * cb === 1 ? value : -value;
            }
          }
          local[(3 * a + p) * dl + 3 * b + q] = sum;
        }
      }
    }
  }
}
