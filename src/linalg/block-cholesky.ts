/**
 * Sparse Cholesky factorization P = Πᵀ L Lᵀ Π of a symmetric positive
 * definite matrix made of 3 × 3 blocks, one block row and column per atom,
 * for matrices whose pattern follows a molecule's bond graph.
 *
 * Setup (once per pattern): a minimum-degree elimination order on the atom
 * graph (A. George and J. W. H. Liu, "The evolution of the minimum degree
 * ordering algorithm", SIAM Review 31 (1989) 1), which for molecules of
 * bounded valence creates little fill, and the pattern of L (the neighbours
 * of each atom when it is eliminated). Numeric factorization (per geometry):
 * right-looking block Cholesky in that order. Solves and products never
 * allocate.
 *
 * Layout: a vector of length 3N is `[x0, y0, z0, x1, …]` by atom (the
 * project's layout); "whitened" vectors (the results of
 * {@link BlockCholesky.whiten}) are in elimination order.
 * @module
 */

import { sweepArrays, type SweepArrays } from './block-sweeps.js';

/** A factorization with a fixed block pattern; refill and refactor it as often as needed. */
export class BlockCholesky {
  /** Atoms (block rows). */
  readonly atoms: number;
  /** `order[p]` is the atom eliminated p-th. */
  readonly order: Int32Array;
  /** `position[a]` is the elimination position of atom a. */
  readonly position: Int32Array;
  /** Column p of L holds rows `rows[start[p] .. start[p+1]-1]` (positions > p). */
  readonly #start: Int32Array;
  readonly #rows: Int32Array;
  /** 9 numbers per stored block of L, row-major. */
  readonly #blocks: Float64Array;
  /** 9 numbers per position: the lower-triangular Cholesky factor of the pivot block (upper part zero). */
  readonly #pivots: Float64Array;
  /** 1 / the diagonal of each pivot factor (3 per position), so the sweeps multiply instead of divide. */
  readonly #inverse: Float64Array;
  /**
   * The fill updates of each column, found once: for column p, for each
   * pair u ≤ t of its stored blocks (in the order the factorization visits
   * them), the block they update (−1 − position for a diagonal block).
   */
  readonly #targets: Int32Array;
  /** The `pairs` array last given to {@link factor} and where each of its blocks goes (see there). */
  #placedPairs: Int32Array | null = null;
  #placement: Int32Array = new Int32Array(0);
  /** Working diagonal blocks (9 per position). */
  readonly #diagonal: Float64Array;
  /** (column position, row position) → block index, for the fill updates. */
  readonly #slot: Map<number, number>;
  readonly #work: Float64Array;
  /** The WebAssembly sweeps and the arrays they share with this object, or null for the JavaScript sweeps. */
  readonly #sweeps: SweepArrays | null;

  /**
   * @param atoms - number of atoms N (the matrix is 3N × 3N).
   * @param pairs - `2 × P` atom pairs whose off-diagonal block may be non-zero
   *   (order and repeats do not matter; i = j pairs are ignored).
   * @param engine - `'wasm'`: the sweeps run as WebAssembly loops where
   *   available (src/linalg/block-sweeps.ts; identical results); `'js'`: in
   *   JavaScript. Default: `'wasm'` from 32 atoms on (below, copying in and
   *   out of its memory costs more than it saves).
   */
  constructor(atoms: number, pairs: Int32Array, engine: 'wasm' | 'js' = atoms >= 32 ? 'wasm' : 'js') {
    this.atoms = atoms;
    const adjacency: Set<number>[] = Array.from({ length: atoms }, () => new Set<number>());
    for (let p = 0; p + 1 < pairs.length; p += 2) {
      const i = pairs[p];
      const j = pairs[p + 1];
      if (i === j) continue;
      adjacency[i].add(j);
      adjacency[j].add(i);
    }
    // Minimum degree with a lazy bucket queue; ties broken by atom index (deterministic).
    const order = new Int32Array(atoms);
    const position = new Int32Array(atoms).fill(-1);
    const columns: number[][] = new Array(atoms);
    const buckets: number[][] = [];
    const push = (a: number): void => {
      const d = adjacency[a].size;
      (buckets[d] ??= []).push(a);
    };
    for (let a = atoms - 1; a >= 0; a--) push(a);
    let lowest = 0;
    for (let p = 0; p < atoms; p++) {
      let a = -1;
      for (;;) {
        while (lowest < buckets.length && (buckets[lowest] === undefined || buckets[lowest].length === 0)) lowest++;
        const candidate = buckets[lowest].pop() as number;
        if (position[candidate] === -1 && adjacency[candidate].size === lowest) {
          a = candidate;
          break;
        }
      }
      order[p] = a;
      position[a] = p;
      const nb = [...adjacency[a]];
      columns[p] = nb;
      for (const u of nb) {
        const set = adjacency[u];
        set.delete(a);
        for (const v of nb) if (v !== u) set.add(v);
        push(u);
        if (set.size < lowest) lowest = set.size;
      }
      adjacency[a].clear();
    }
    const start = new Int32Array(atoms + 1);
    for (let p = 0; p < atoms; p++) start[p + 1] = start[p] + columns[p].length;
    const rows = new Int32Array(start[atoms]);
    const slot = new Map<number, number>();
    for (let p = 0; p < atoms; p++) {
      const list = columns[p].map((a) => position[a]).sort((x, y) => x - y);
      for (let t = 0; t < list.length; t++) {
        rows[start[p] + t] = list[t];
        slot.set(p * atoms + list[t], start[p] + t);
      }
    }
    const sweeps = engine === 'wasm' && atoms > 0 ? sweepArrays(atoms, rows.length) : null;
    this.#sweeps = sweeps;
    if (sweeps !== null) {
      sweeps.order.set(order);
      sweeps.start.set(start);
      sweeps.rows.set(rows);
    }
    this.order = sweeps?.order ?? order;
    this.position = position;
    this.#start = sweeps?.start ?? start;
    this.#rows = sweeps?.rows ?? rows;
    this.#blocks = sweeps?.blocks ?? new Float64Array(9 * rows.length);
    this.#pivots = sweeps?.pivots ?? new Float64Array(9 * atoms);
    this.#diagonal = new Float64Array(9 * atoms);
    this.#slot = slot;
    this.#work = new Float64Array(3 * atoms);
    this.#inverse = sweeps?.inverse ?? new Float64Array(3 * atoms);
    let updates = 0;
    for (let p = 0; p < atoms; p++) {
      const c = start[p + 1] - start[p];
      updates += (c * (c + 1)) / 2;
    }
    const targets = new Int32Array(updates);
    let u = 0;
    for (let p = 0; p < atoms; p++) {
      for (let t = start[p]; t < start[p + 1]; t++) {
        const i = rows[t];
        for (let v = start[p]; v <= t; v++) {
          const k = rows[v];
          targets[u++] = i === k ? -1 - i : (slot.get(k * atoms + i) as number);
        }
      }
    }
    this.#targets = targets;
  }

  /**
   * Where each block of `pairs` goes in L: slot + 1 when stored as given,
   * −(slot + 1) when stored transposed, 0 for i = j. Cached for the last
   * `pairs` array (a preconditioner refills the same pattern many times).
   */
  #place(pairs: Int32Array): Int32Array {
    if (this.#placedPairs === pairs && this.#placement.length === pairs.length >> 1) return this.#placement;
    const atoms = this.atoms;
    const placement = new Int32Array(pairs.length >> 1);
    for (let q = 0; 2 * q + 1 < pairs.length; q++) {
      const i = pairs[2 * q];
      const j = pairs[2 * q + 1];
      if (i === j) continue;
      const pi = this.position[i];
      const pj = this.position[j];
      // row = later position, column = earlier one
      placement[q] = pi > pj ? 1 + (this.#slot.get(pj * atoms + pi) as number) : -1 - (this.#slot.get(pi * atoms + pj) as number);
    }
    this.#placedPairs = pairs;
    this.#placement = placement;
    return placement;
  }

  /** Stored blocks of L (a measure of fill). */
  get storedBlocks(): number {
    return this.#rows.length;
  }

  /**
   * Factor the matrix given by its diagonal blocks (`9 × N`, block a at
   * `9a`, row-major) and the off-diagonal blocks `offDiagonal` (9 per pair,
   * block (i, j) of pair q = (pairs[2q], pairs[2q+1]), row i, column j).
   * @returns false when a pivot is not positive definite (the matrix is not
   *   SPD to working precision); the factor is then unusable.
   */
  factor(diagonal: Float64Array, pairs: Int32Array, offDiagonal: Float64Array): boolean {
    const atoms = this.atoms;
    const D = this.#diagonal;
    const B = this.#blocks;
    const C = this.#pivots;
    const start = this.#start;
    const rows = this.#rows;
    B.fill(0);
    for (let a = 0; a < atoms; a++) {
      const p = this.position[a];
      for (let e = 0; e < 9; e++) D[9 * p + e] = diagonal[9 * a + e];
    }
    // Place each off-diagonal block at (column = earlier position, row = later position).
    const placement = this.#place(pairs);
    for (let q = 0; q < placement.length; q++) {
      const where = placement[q];
      const o = 9 * q;
      if (where > 0) {
        // row i, column j: block (i, j) as given
        const s = 9 * (where - 1);
        for (let e = 0; e < 9; e++) B[s + e] += offDiagonal[o + e];
      } else if (where < 0) {
        // row j, column i: the transpose of block (i, j)
        const s = 9 * (-1 - where);
        for (let r = 0; r < 3; r++) for (let c = 0; c < 3; c++) B[s + 3 * r + c] += offDiagonal[o + 3 * c + r];
      }
    }
    const inverse = this.#inverse;
    const targets = this.#targets;
    let next = 0;
    for (let p = 0; p < atoms; p++) {
      // pivot: C C^T = D_p
      const d = 9 * p;
      const l00 = D[d];
      if (!(l00 > 0)) return false;
      const c00 = Math.sqrt(l00);
      const c10 = D[d + 3] / c00;
      const c20 = D[d + 6] / c00;
      const l11 = D[d + 4] - c10 * c10;
      if (!(l11 > 1e-14 * l00)) return false;
      const c11 = Math.sqrt(l11);
      const c21 = (D[d + 7] - c20 * c10) / c11;
      const l22 = D[d + 8] - c20 * c20 - c21 * c21;
      if (!(l22 > 1e-14 * l00)) return false;
      const c22 = Math.sqrt(l22);
      C[d] = c00; C[d + 1] = 0; C[d + 2] = 0;
      C[d + 3] = c10; C[d + 4] = c11; C[d + 5] = 0;
      C[d + 6] = c20; C[d + 7] = c21; C[d + 8] = c22;
      const i00 = 1 / c00, i11 = 1 / c11, i22 = 1 / c22;
      inverse[3 * p] = i00; inverse[3 * p + 1] = i11; inverse[3 * p + 2] = i22;
      // L_ip = W_ip C^{-T}: solve X C^T = W row by row (forward substitution on each row)
      for (let t = start[p]; t < start[p + 1]; t++) {
        const o = 9 * t;
        for (let r = 0; r < 3; r++) {
          const w0 = B[o + 3 * r], w1 = B[o + 3 * r + 1], w2 = B[o + 3 * r + 2];
          const x0 = w0 * i00;
          const x1 = (w1 - c10 * x0) * i11;
          const x2 = (w2 - c20 * x0 - c21 * x1) * i22;
          B[o + 3 * r] = x0; B[o + 3 * r + 1] = x1; B[o + 3 * r + 2] = x2;
        }
      }
      // Update: W_ik -= L_ip L_kp^T for rows i ≥ k of column p.
      for (let t = start[p]; t < start[p + 1]; t++) {
        const oi = 9 * t;
        for (let u = start[p]; u <= t; u++) {
          const ok = 9 * u;
          const target = targets[next++];
          // W −= L_ip L_kpᵀ into a diagonal block (target < 0) or an off-diagonal one
          const M = target < 0 ? D : B;
          const m = target < 0 ? 9 * (-1 - target) : 9 * target;
          for (let r = 0; r < 3; r++) {
            const a0 = B[oi + 3 * r], a1 = B[oi + 3 * r + 1], a2 = B[oi + 3 * r + 2];
            for (let c = 0; c < 3; c++) {
              M[m + 3 * r + c] -= a0 * B[ok + 3 * c] + a1 * B[ok + 3 * c + 1] + a2 * B[ok + 3 * c + 2];
            }
          }
        }
      }
    }
    return true;
  }

  /** out = L⁻¹ Π v (out in elimination order); `out` may not be `v`. */
  whiten(v: Float64Array, out: Float64Array): void {
    const sweeps = this.#sweeps;
    if (sweeps !== null) {
      sweeps.vin.set(v);
      sweeps.whiten();
      out.set(sweeps.vout);
      return;
    }
    const atoms = this.atoms;
    for (let p = 0; p < atoms; p++) {
      const a = this.order[p];
      out[3 * p] = v[3 * a];
      out[3 * p + 1] = v[3 * a + 1];
      out[3 * p + 2] = v[3 * a + 2];
    }
    const C = this.#pivots;
    const B = this.#blocks;
    const start = this.#start;
    const rows = this.#rows;
    const inv = this.#inverse;
    for (let p = 0; p < atoms; p++) {
      const d = 9 * p;
      const w0 = out[3 * p] * inv[3 * p];
      const w1 = (out[3 * p + 1] - C[d + 3] * w0) * inv[3 * p + 1];
      const w2 = (out[3 * p + 2] - C[d + 6] * w0 - C[d + 7] * w1) * inv[3 * p + 2];
      out[3 * p] = w0; out[3 * p + 1] = w1; out[3 * p + 2] = w2;
      for (let t = start[p]; t < start[p + 1]; t++) {
        const o = 9 * t;
        const r = 3 * rows[t];
        out[r] -= B[o] * w0 + B[o + 1] * w1 + B[o + 2] * w2;
        out[r + 1] -= B[o + 3] * w0 + B[o + 4] * w1 + B[o + 5] * w2;
        out[r + 2] -= B[o + 6] * w0 + B[o + 7] * w1 + B[o + 8] * w2;
      }
    }
  }

  /** out = Πᵀ L⁻ᵀ w (w in elimination order, out by atom); `w` may be used as scratch and left changed. */
  unwhiten(w: Float64Array, out: Float64Array): void {
    const sweeps = this.#sweeps;
    if (sweeps !== null) {
      sweeps.vin.set(w);
      sweeps.unwhiten();
      out.set(sweeps.vout);
      return;
    }
    const atoms = this.atoms;
    const inv = this.#inverse;
    const C = this.#pivots;
    const B = this.#blocks;
    const start = this.#start;
    const rows = this.#rows;
    for (let p = atoms - 1; p >= 0; p--) {
      let b0 = w[3 * p], b1 = w[3 * p + 1], b2 = w[3 * p + 2];
      for (let t = start[p]; t < start[p + 1]; t++) {
        const o = 9 * t;
        const r = 3 * rows[t];
        const v0 = w[r], v1 = w[r + 1], v2 = w[r + 2];
        b0 -= B[o] * v0 + B[o + 3] * v1 + B[o + 6] * v2;
        b1 -= B[o + 1] * v0 + B[o + 4] * v1 + B[o + 7] * v2;
        b2 -= B[o + 2] * v0 + B[o + 5] * v1 + B[o + 8] * v2;
      }
      const d = 9 * p;
      const x2 = b2 * inv[3 * p + 2];
      const x1 = (b1 - C[d + 7] * x2) * inv[3 * p + 1];
      const x0 = (b0 - C[d + 3] * x1 - C[d + 6] * x2) * inv[3 * p];
      w[3 * p] = x0; w[3 * p + 1] = x1; w[3 * p + 2] = x2;
    }
    for (let p = 0; p < atoms; p++) {
      const a = this.order[p];
      out[3 * a] = w[3 * p];
      out[3 * a + 1] = w[3 * p + 1];
      out[3 * a + 2] = w[3 * p + 2];
    }
  }

  /** out = Lᵀ Π v (out in elimination order); `out` may not be `v`. */
  stretch(v: Float64Array, out: Float64Array): void {
    const atoms = this.atoms;
    const w = this.#work;
    for (let p = 0; p < atoms; p++) {
      const a = this.order[p];
      w[3 * p] = v[3 * a];
      w[3 * p + 1] = v[3 * a + 1];
      w[3 * p + 2] = v[3 * a + 2];
    }
    const C = this.#pivots;
    const B = this.#blocks;
    const start = this.#start;
    const rows = this.#rows;
    for (let p = 0; p < atoms; p++) {
      const d = 9 * p;
      const v0 = w[3 * p], v1 = w[3 * p + 1], v2 = w[3 * p + 2];
      let b0 = C[d] * v0 + C[d + 3] * v1 + C[d + 6] * v2;
      let b1 = C[d + 4] * v1 + C[d + 7] * v2;
      let b2 = C[d + 8] * v2;
      for (let t = start[p]; t < start[p + 1]; t++) {
        const o = 9 * t;
        const r = 3 * rows[t];
        const u0 = w[r], u1 = w[r + 1], u2 = w[r + 2];
        b0 += B[o] * u0 + B[o + 3] * u1 + B[o + 6] * u2;
        b1 += B[o + 1] * u0 + B[o + 4] * u1 + B[o + 7] * u2;
        b2 += B[o + 2] * u0 + B[o + 5] * u1 + B[o + 8] * u2;
      }
      out[3 * p] = b0; out[3 * p + 1] = b1; out[3 * p + 2] = b2;
    }
  }
}
