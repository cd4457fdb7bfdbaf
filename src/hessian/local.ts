/**
 * Small dense helpers shared by the Hessian kernels: a term's local Hessian
 * is built in a scratch array, exactly symmetric, and handed to the sink
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
 * How the atoms of a term enter its difference vectors d_s = Σ_a C[a][s] x_a,
 * when every atom enters at most two of them (true of bends and torsions):
 * atom a contributes `c0[a]` to d_{s0[a]} and `c1[a]` to d_{s1[a]}
 * (c1 = 0 when it enters only one). Made once per kind by {@link spreadOf}.
 */
export interface Spread {
  /** Atoms per term. */
  readonly m: number;
  /** Difference vectors per term. */
  readonly nv: number;
  /** First difference vector each atom enters. */
  readonly s0: Int32Array;
  /** Its coefficient (−1 or 1). */
  readonly c0: Float64Array;
  /** Second difference vector each atom enters (0 when none). */
  readonly s1: Int32Array;
  /** Its coefficient (−1, 1, or 0 when none). */
  readonly c1: Float64Array;
}

/**
 * The {@link Spread} of the m×nv coefficient matrix C (row-major, entries
 * −1, 0, 1, at most two nonzero per row).
 */
export function spreadOf(coefficients: readonly number[], m: number, nv: number): Spread {
  const s0 = new Int32Array(m);
  const c0 = new Float64Array(m);
  const s1 = new Int32Array(m);
  const c1 = new Float64Array(m);
  for (let a = 0; a < m; a++) {
    let found = 0;
    for (let s = 0; s < nv; s++) {
      const c = coefficients[a * nv + s];
      if (c === 0) continue;
      if (found === 0) {
        s0[a] = s;
        c0[a] = c;
      } else {
        s1[a] = s;
        c1[a] = c;
      }
      found++;
    }
  }
  return { m, nv, s0, c0, s1, c1 };
}

/** (3·nv)×(3·m) intermediate of {@link expandToAtoms}, sized for torsions. */
const half = new Float64Array(9 * 12);

/**
 * The Hessian over atoms from the Hessian over difference vectors: with
 * d_s = Σ_a C[a][s] x_a, the atom blocks are H_ab = Σ_s Σ_t C[a][s] C[b][t] D_st,
 * D the (3nv)×(3nv) row-major Hessian over the d's. Done as two passes,
 * T = D (C ⊗ I)ᵀ and then H = (C ⊗ I) T, each entry two multiply-adds
 * (see {@link Spread}). Writes `local` ((3m)×(3m), row-major), overwriting
 * it. The result is exactly symmetric: each entry at or above the diagonal
 * is computed once and copied to its mirror (D itself may be off symmetric
 * by rounding; only its upper triangle of atom blocks is then used).
 */
export function expandToAtoms(inner: Float64Array, spread: Spread, local: Float64Array): void {
  const { m, nv, s0, c0, s1, c1 } = spread;
  const di = 3 * nv;
  const dl = 3 * m;
  for (let r = 0; r < di; r++) {
    const row = r * di;
    for (let b = 0; b < m; b++) {
      const u0 = row + 3 * s0[b];
      const u1 = row + 3 * s1[b];
      const w0 = c0[b];
      const w1 = c1[b];
      const out = r * dl + 3 * b;
      half[out] = w0 * inner[u0] + w1 * inner[u1];
      half[out + 1] = w0 * inner[u0 + 1] + w1 * inner[u1 + 1];
      half[out + 2] = w0 * inner[u0 + 2] + w1 * inner[u1 + 2];
    }
  }
  // H = (C ⊗ I) T for columns c ≥ 3a (blocks a ≤ b), each copied to its
  // mirror; in a diagonal block the later write of a pair wins on both sides
  for (let a = 0; a < m; a++) {
    const w0 = c0[a];
    const w1 = c1[a];
    for (let p = 0; p < 3; p++) {
      const h0 = (3 * s0[a] + p) * dl;
      const h1 = (3 * s1[a] + p) * dl;
      const row = (3 * a + p) * dl;
      for (let c = 3 * a; c < dl; c++) {
        const value = w0 * half[h0 + c] + w1 * half[h1 + c];
        local[row + c] = value;
        local[c * dl + 3 * a + p] = value;
      }
    }
  }
}
