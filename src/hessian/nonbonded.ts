/**
 * Hessian of the nonbonded pairs (Lennard-Jones and Coulomb of
 * src/terms/nonbonded.ts), kept as a list of pair blocks.
 *
 * For a counted pair i < j with d = x_j − x_i, r = |d|, u = d/r, the block
 * ∂²E/∂x_j² is K = E''(r) u uᵀ + (E'(r)/r)(I − u uᵀ) = A d dᵀ + B I with
 * A = (E'' − E'/r)/r² and B = E'/r; the pair adds K to the (i, i) and (j, j)
 * blocks and −K to (i, j) and (j, i). Per kind (times the pair's 1-4 scale):
 *
 * - Lennard-Jones ε [(rmin/r)¹² − 2 (rmin/r)⁶], t = (rmin/r)⁶:
 *   B = 12 ε t (1 − t)/r², A = 24 ε t (7t − 4)/r⁴
 *   (E'' = 12 ε (13t² − 7t)/r²);
 * - Coulomb k q_i q_j / r: B = −k q_i q_j/r³, A = 3 k q_i q_j/r⁵ (E'' = 2 k q_i q_j/r³).
 *
 * A cutoff's energy shift is a constant per pair, so shifted pairs have the
 * unshifted derivatives; the jump of E'' at r = r_c (the pair appears or
 * vanishes there) is not represented.
 *
 * **Pair set.** The same as the energy's: every pair i < j not on the skip
 * lists (excluded and 1-4 pairs), then the 1-4 pairs with their scale
 * factors, each counted only when r² < r_c² (every pair without a cutoff).
 * With a cutoff the set depends on the geometry, so it is found again at
 * every {@link NonbondedPairHessian.update}, with a cell list of its own
 * (cells of side ≥ r_c, each atom's pairs looked for in its own and the 26
 * neighbouring cells; cells made larger when they would outnumber the
 * atoms, as the energy kernel does): linear in N for a given density.
 * Without a cutoff every pair i < j is visited in index order, O(N²). A pair
 * at r = 0 (whose energy is +∞ and gradient zero) and a pair with ε_ij = 0
 * and q_i q_j = 0 add no block. The order of the blocks (and so the rounding
 * of their sums) depends on the path taken, not on who reads them: dense and
 * block-sparse assembly read the same list.
 * @module
 */
import { cellGrid, type NonbondedPairs } from '../terms/nonbonded.js';

/** Numbers kept per pair block: A, B, then d = x_j − x_i. */
const PER_PAIR = 5;

/**
 * The nonbonded pair blocks of one pair set at one geometry. Make one per
 * pair set, call {@link update} at each geometry; it then adds into a dense
 * matrix or a product. The arrays grow (by doubling) only when a geometry
 * has more pairs within the cutoff than any before; otherwise nothing is
 * allocated.
 */
export class NonbondedPairHessian {
  /** The pair set differentiated. */
  readonly pairs: NonbondedPairs;
  /** Number of pair blocks found by the last {@link update}. */
  count = 0;
  /** Atoms of each pair block, `[i0, j0, i1, j1, …]` (i < j), length ≥ 2·count. */
  atoms: Int32Array;
  /** Per pair block A, B, d_x, d_y, d_z (K = A d dᵀ + B I), length ≥ 5·count. */
  coefficients: Float64Array;
  /** False when the last {@link update} met a non-finite coordinate (everything then reads NaN). */
  finite = true;

  readonly #stamp: Int32Array;
  /** Cell list scratch: each atom's cell, the atoms in cell order, and each cell's start (≤ N + 1 cells). */
  readonly #cellOf: Int32Array;
  readonly #cellAtoms: Int32Array;
  readonly #cellStart: Int32Array;
  readonly #grid = new Float64Array(9);

  /** A pair Hessian of `pairs` (empty until {@link update}); allocates its scratch once. */
  constructor(pairs: NonbondedPairs) {
    this.pairs = pairs;
    const n = pairs.atomCount;
    const counted = (n * (n - 1)) / 2 - pairs.excludedCount;
    const capacity = Math.max(1, pairs.cutoff === Infinity ? counted : Math.min(counted, 16 * n));
    this.atoms = new Int32Array(2 * capacity);
    this.coefficients = new Float64Array(PER_PAIR * capacity);
    this.#stamp = new Int32Array(n);
    const cells = pairs.cutoff === Infinity ? 0 : n;
    this.#cellOf = new Int32Array(cells);
    this.#cellAtoms = new Int32Array(cells);
    this.#cellStart = new Int32Array(cells === 0 ? 0 : cells + 2);
  }

  /**
   * Finds the pairs that count at `x` (flat, 3N; not checked here) and their
   * blocks. Returns `this`. Never throws.
   */
  update(x: Float64Array): this {
    const p = this.pairs;
    const n = p.atomCount;
    this.count = 0;
    this.finite = true;
    for (let c = 0; c < 3 * n; c++) {
      if (!(x[c] - x[c] === 0)) {
        this.finite = false;
        return this;
      }
    }
    const useLJ = p.hasLennardJones;
    const useCoulomb = p.hasCoulomb;
    if (!(useLJ || useCoulomb) || n < 2) return this;
    const rc2 = p.cutoff < Infinity ? p.cutoff * p.cutoff : Infinity;
    const stamp = this.#stamp;
    stamp.fill(-1);
    const { skipStart, skipList } = p;
    const sLJ1 = useLJ ? 1 : 0;
    const sC1 = useCoulomb ? 1 : 0;
    if (rc2 < Infinity) {
      this.#cellPairs(x, sLJ1, sC1, rc2);
    } else {
      for (let i = 0; i < n - 1; i++) {
        for (let k = skipStart[i]; k < skipStart[i + 1]; k++) stamp[skipList[k]] = i;
        for (let j = i + 1; j < n; j++) {
          if (stamp[j] === i) continue;
          this.#pair(x, i, j, sLJ1, sC1, rc2);
        }
      }
    }
    const list = p.scaledPairs;
    const sLJ = useLJ ? p.scale14LennardJones : 0;
    const sC = useCoulomb ? p.scale14Coulomb : 0;
    if (sLJ !== 0 || sC !== 0) {
      for (let m = 0; m < list.length; m += 2) this.#pair(x, list[m], list[m + 1], sLJ, sC, rc2);
    }
    return this;
  }

  /**
   * The unscaled pairs within the cutoff, by cells: atoms sorted into cells
   * of side ≥ r_c over the coordinates' bounding box, and for each atom i
   * the atoms j > i of its own and the 26 neighbouring cells that are not
   * on its skip list. `x` must be finite.
   */
  #cellPairs(x: Float64Array, sLJ: number, sC: number, rc2: number): void {
    const p = this.pairs;
    const n = p.atomCount;
    const cellOf = this.#cellOf;
    const cellAtoms = this.#cellAtoms;
    const cellStart = this.#cellStart;
    const stamp = this.#stamp;
    const { skipStart, skipList } = p;
    const grid = this.#grid;
    cellGrid(x, n, p.cutoff, n, grid);
    const minX = grid[0], minY = grid[1], minZ = grid[2];
    const nx = grid[3], ny = grid[4], nz = grid[5];
    const fx = grid[6], fy = grid[7], fz = grid[8];
    const cells = nx * ny * nz;
    // counting sort by cell: cellStart[c + 1] counts, then prefix sums
    cellStart.fill(0, 0, cells + 2);
    for (let a = 0; a < n; a++) {
      const cx = Math.min(nx - 1, Math.floor((x[3 * a] - minX) * fx));
      const cy = Math.min(ny - 1, Math.floor((x[3 * a + 1] - minY) * fy));
      const cz = Math.min(nz - 1, Math.floor((x[3 * a + 2] - minZ) * fz));
      const c = (cz * ny + cy) * nx + cx;
      cellOf[a] = c;
      cellStart[c + 2]++;
    }
    for (let c = 0; c < cells; c++) cellStart[c + 2] += cellStart[c + 1];
    // cellStart[c + 1] runs through cell c while placing; afterwards it is cell c's start
    for (let a = 0; a < n; a++) cellAtoms[cellStart[cellOf[a] + 1]++] = a;
    for (let i = 0; i < n; i++) {
      for (let k = skipStart[i]; k < skipStart[i + 1]; k++) stamp[skipList[k]] = i;
      const c = cellOf[i];
      const cx = c % nx;
      const cy = Math.floor(c / nx) % ny;
      const cz = Math.floor(c / (nx * ny));
      for (let oz = Math.max(0, cz - 1); oz <= Math.min(nz - 1, cz + 1); oz++) {
        for (let oy = Math.max(0, cy - 1); oy <= Math.min(ny - 1, cy + 1); oy++) {
          for (let ox = Math.max(0, cx - 1); ox <= Math.min(nx - 1, cx + 1); ox++) {
            const other = (oz * ny + oy) * nx + ox;
            for (let m = cellStart[other]; m < cellStart[other + 1]; m++) {
              const j = cellAtoms[m];
              if (j <= i || stamp[j] === i) continue;
              this.#pair(x, i, j, sLJ, sC, rc2);
            }
          }
        }
      }
    }
  }

  /** One pair with Lennard-Jones scaled by `sLJ` and Coulomb by `sC` (0: left out). */
  #pair(x: Float64Array, i: number, j: number, sLJ: number, sC: number, rc2: number): void {
    const p = this.pairs;
    const i3 = 3 * i;
    const j3 = 3 * j;
    const dx = x[j3] - x[i3];
    const dy = x[j3 + 1] - x[i3 + 1];
    const dz = x[j3 + 2] - x[i3 + 2];
    const r2 = dx * dx + dy * dy + dz * dz;
    if (!(r2 < rc2) || !(r2 > 0)) return;
    const ir2 = 1 / r2;
    let a = 0;
    let b = 0;
    const eps = sLJ * p.sqrtEpsilon[i] * p.sqrtEpsilon[j];
    if (eps !== 0) {
      let s6: number;
      if (p.combination === 'geometric') {
        s6 = p.size[i] * p.size[j];
      } else {
        const s = p.size[i] + p.size[j];
        const s2 = s * s;
        s6 = s2 * s2 * s2;
      }
      const t = s6 * ir2 * ir2 * ir2;
      b += 12 * eps * t * (1 - t) * ir2;
      a += 24 * eps * t * (7 * t - 4) * ir2 * ir2;
    }
    const qq = sC * p.scaledCharge[i] * p.charge[j];
    if (qq !== 0) {
      const ir = Math.sqrt(ir2);
      const ir3 = ir * ir2;
      b -= qq * ir3;
      a += 3 * qq * ir3 * ir2;
    }
    if (a === 0 && b === 0) return;
    if (this.count * 2 === this.atoms.length) this.#grow();
    const m = this.count++;
    this.atoms[2 * m] = i;
    this.atoms[2 * m + 1] = j;
    const c = this.coefficients;
    const o = PER_PAIR * m;
    c[o] = a;
    c[o + 1] = b;
    c[o + 2] = dx;
    c[o + 3] = dy;
    c[o + 4] = dz;
  }

  /** Doubles the capacity of the pair arrays, keeping their contents. */
  #grow(): void {
    const atoms = new Int32Array(2 * this.atoms.length);
    atoms.set(this.atoms);
    const coefficients = new Float64Array(2 * this.coefficients.length);
    coefficients.set(this.coefficients);
    this.atoms = atoms;
    this.coefficients = coefficients;
  }

  /**
   * Adds the pair blocks into `matrix`, dense row-major (3N)×(3N), row
   * length `size` = 3N. Each block's entries are A (d_p d_q) + B δ_pq, so
   * the sum stays exactly symmetric. Fills the matrix with NaN after an
   * update at a non-finite coordinate.
   */
  addToDense(matrix: Float64Array, size: number): void {
    if (!this.finite) {
      matrix.fill(NaN);
      return;
    }
    const c = this.coefficients;
    for (let m = 0; m < this.count; m++) {
      const ri = 3 * this.atoms[2 * m];
      const rj = 3 * this.atoms[2 * m + 1];
      const o = PER_PAIR * m;
      const a = c[o];
      const b = c[o + 1];
      for (let p = 0; p < 3; p++) {
        const dp = c[o + 2 + p];
        for (let q = 0; q < 3; q++) {
          const k = a * (dp * c[o + 2 + q]) + (p === q ? b : 0);
          matrix[(ri + p) * size + ri + q] += k;
          matrix[(rj + p) * size + rj + q] += k;
          matrix[(ri + p) * size + rj + q] -= k;
          matrix[(rj + p) * size + ri + q] -= k;
        }
      }
    }
  }

  /**
   * Adds H_pairs·v into `y` (both flat, length 3N, distinct arrays): per
   * block, with w = v_j − v_i, K w = A d (d·w) + B w is added to y_j and
   * subtracted from y_i. Fills `y` with NaN after an update at a non-finite
   * coordinate.
   */
  multiplyAdd(v: Float64Array, y: Float64Array): void {
    if (!this.finite) {
      y.fill(NaN);
      return;
    }
    const c = this.coefficients;
    for (let m = 0; m < this.count; m++) {
      const i3 = 3 * this.atoms[2 * m];
      const j3 = 3 * this.atoms[2 * m + 1];
      const o = PER_PAIR * m;
      const a = c[o];
      const b = c[o + 1];
      const dx = c[o + 2];
      const dy = c[o + 3];
      const dz = c[o + 4];
      const wx = v[j3] - v[i3];
      const wy = v[j3 + 1] - v[i3 + 1];
      const wz = v[j3 + 2] - v[i3 + 2];
      const s = a * (dx * wx + dy * wy + dz * wz);
      const kx = s * dx + b * wx;
      const ky = s * dy + b * wy;
      const kz = s * dz + b * wz;
      y[j3] += kx;
      y[j3 + 1] += ky;
      y[j3 + 2] += kz;
      y[i3] -= kx;
      y[i3 + 1] -= ky;
      y[i3 + 2] -= kz;
    }
  }
}
