/**
 * Nonbonded pair kernels: Lennard-Jones and Coulomb over every pair of atoms
 * that is not excluded, optionally within a cutoff.
 *
 * For a pair i < j with d = x_j − x_i and r = |d|:
 *
 * - Lennard-Jones, E = ε_ij [(rmin_ij/r)¹² − 2 (rmin_ij/r)⁶]. With
 *   t = (rmin_ij/r)⁶: E = ε_ij t (t − 2) and dE/dr · 1/r = 12 ε_ij t (1 − t) / r².
 *   ε_ij = √(ε_i ε_j); rmin_ij = √(rmin_i rmin_j) (`geometric`) or
 *   (rmin_i + rmin_j)/2 (`lorentz-berthelot`).
 * - Coulomb, E = k q_i q_j / r with k = C / dielectric (C the Coulomb
 *   constant in the model's units) and dE/dr · 1/r = −k q_i q_j / r³.
 *
 * Each pair's gradient is (dE/dr / r) · d on atom j and its negative on i.
 *
 * **Cutoff.** With a cutoff r_c, only pairs with r < r_c count, and each
 * counts E(r) − E(r_c) (then times its 1-4 scale), so the energy is
 * continuous at r_c; the gradient is that of E, since the shift is a
 * constant. The pairs are found with a cell list rebuilt at each evaluation
 * (cells of side ≥ r_c, so only the 26 neighbouring cells need looking at),
 * at a cost linear in the number of atoms for a given density. Without a
 * cutoff every pair i < j is visited: N(N − 1)/2 of them.
 *
 * **Exclusions.** Each atom has a sorted list of the atoms it must skip
 * (excluded pairs and 1-4 pairs); while the pairs of atom i are visited,
 * those atoms are marked in a per-atom stamp array, so a pair is tested in
 * O(1) and skipped, never computed and subtracted. The 1-4 pairs are then
 * visited from their own list, with their scale factors.
 *
 * **Coincident atoms.** A counted pair at r = 0 adds +Infinity to each kind
 * it interacts by (ε_ij > 0 for Lennard-Jones, q_i q_j ≠ 0 for Coulomb) and
 * nothing to the gradient: the energy there has no finite value. It is +∞
 * even for opposite charges (whose limit would be −∞) because a −∞ would
 * look like a fine step to a line search, while +∞ makes it back off and a
 * minimizer stop with its non-finite reason. A pair with ε_ij = 0 and
 * q_i q_j = 0 adds nothing.
 *
 * **Scratch.** {@link createNonbondedPairs} allocates every work array once:
 * a stamp, cell and order arrays of N entries, cell starts for at most
 * N + 1 cells, and copies of the coordinates, gradient and per-atom
 * parameters in cell order (so the atoms of a cell lie together in memory;
 * about 100 bytes per atom in all). Evaluations never allocate and never
 * throw, and the scratch never needs to grow. When the
 * coordinates span so much space that cells of side r_c would outnumber the
 * atoms, the cells are made larger (still correct, and linear for any
 * geometry that is not mostly empty space).
 * @module
 */
import { addPairGradient } from './bond.js';

/** Lennard-Jones combination rules (model-file spec). */
export type CombinationRule = 'geometric' | 'lorentz-berthelot';

/** Which kinds an evaluation includes: a bit mask. */
export const NONBONDED_LENNARD_JONES = 1;
/** See {@link NONBONDED_LENNARD_JONES}. */
export const NONBONDED_COULOMB = 2;
/** Both kinds (the default). */
export const NONBONDED_ALL = NONBONDED_LENNARD_JONES | NONBONDED_COULOMB;

/** What {@link createNonbondedPairs} builds a pair set from. Units are the caller's (one consistent system). */
export interface NonbondedParameters {
  /** Number of atoms N. */
  readonly atomCount: number;
  /** Per-atom Lennard-Jones parameters (length N each), or absent for none. */
  readonly lennardJones?: {
    /** rmin_i (length, > 0). */
    readonly rmin: ArrayLike<number>;
    /** ε_i (energy, ≥ 0). */
    readonly epsilon: ArrayLike<number>;
    readonly combination: CombinationRule;
  };
  /** Charges and the prefactor, or absent for no Coulomb term. */
  readonly coulomb?: {
    /** q_i in elementary charges (length N). */
    readonly charges: ArrayLike<number>;
    /** C / dielectric: energy · length per e². */
    readonly constant: number;
  };
  /** Pairs left out entirely, flat `[i0, j0, i1, j1, …]` (any order, repeats allowed). */
  readonly excluded?: ArrayLike<number>;
  /** Pairs counted with the 1-4 scale factors, flat as `excluded` (must not repeat `excluded` pairs). */
  readonly scaled?: ArrayLike<number>;
  /** Scale factors of the `scaled` pairs (default 1 each). */
  readonly scale14?: { readonly lennardJones?: number; readonly coulomb?: number };
  /** Cutoff length (> 0), or null / absent for all pairs. */
  readonly cutoff?: number | null;
}

/**
 * Per-atom arrays in one order (atom order or cell order), as `scan` reads
 * them. `x` and `g` are set at each evaluation (one view object per order,
 * made once, so that evaluating allocates nothing).
 */
interface View {
  x: Float64Array;
  g: Float64Array | undefined;
  readonly sqrtEpsilon: Float64Array;
  readonly size: Float64Array;
  readonly scaledCharge: Float64Array;
  readonly charge: Float64Array;
}

/** Work arrays of one pair set, allocated once. */
interface Workspace {
  /**
   * stamp[b] === a while the pairs of the atom at position a are visited and
   * the atom at position b is on its skip list (positions: atom indices in
   * the all-pairs pass, cell order in the cell pass; −1 initially).
   */
  readonly stamp: Int32Array;
  /** Cell of each atom. */
  readonly cellOf: Int32Array;
  /** The atom at each position of the cell order. */
  readonly cellAtoms: Int32Array;
  /** The position of each atom in the cell order. */
  readonly positionOf: Int32Array;
  /** Start of each cell in the cell order (length maxCells + 1). */
  readonly cellStart: Int32Array;
  /** Largest number of cells. */
  readonly maxCells: number;
  /** Coordinates in cell order (3N), so that a cell's atoms are contiguous in memory. */
  readonly sortedX: Float64Array;
  /** Gradient in cell order (3N), added back into the caller's at the end. */
  readonly sortedGradient: Float64Array;
  /** sqrtEpsilon, size, scaledCharge and charge in cell order. */
  readonly sortedSqrtEpsilon: Float64Array;
  readonly sortedSize: Float64Array;
  readonly sortedScaledCharge: Float64Array;
  readonly sortedCharge: Float64Array;
  /** Energy sums of one evaluation: [Lennard-Jones, Coulomb]. */
  readonly sums: Float64Array;
  /** The cell grid of one evaluation (see {@link cellGrid}). */
  readonly grid: Float64Array;
  /** The view of the arrays in atom order (the all-pairs pass). */
  readonly atomView: View;
  /** The view of the arrays in cell order (the cell pass). */
  readonly cellView: View;
}

/**
 * A compiled set of nonbonded pairs: per-atom parameters, exclusions and
 * scratch space, as the kernels read them. Build it with
 * {@link createNonbondedPairs} (or, from a model file, `compileNonbonded`).
 * The arrays are read-only by convention; the workspace is private scratch.
 */
export interface NonbondedPairs {
  /** Number of atoms N. */
  readonly atomCount: number;
  /** Whether a Lennard-Jones term was given (it may still be zero everywhere). */
  readonly hasLennardJones: boolean;
  /** Whether a Coulomb term was given. */
  readonly hasCoulomb: boolean;
  /** The combination rule (`geometric` when there is no Lennard-Jones term). */
  readonly combination: CombinationRule;
  /** √ε_i per atom (√energy). */
  readonly sqrtEpsilon: Float64Array;
  /** Per atom: rmin_i³ (`geometric`, so rmin_ij⁶ = product) or rmin_i / 2 (`lorentz-berthelot`, so rmin_ij = sum). */
  readonly size: Float64Array;
  /** Per atom: q_i · C / dielectric (energy · length per e). */
  readonly scaledCharge: Float64Array;
  /** Per atom: q_i (e). */
  readonly charge: Float64Array;
  /** Cutoff length, or Infinity for all pairs. */
  readonly cutoff: number;
  /** Skip lists: atom i skips `skipList[skipStart[i] .. skipStart[i+1]−1]` (sorted, both directions). */
  readonly skipStart: Int32Array;
  /** See {@link skipStart}. */
  readonly skipList: Int32Array;
  /** The 1-4 pairs, flat `[i0, j0, …]` with i < j, sorted. */
  readonly scaledPairs: Int32Array;
  /** Number of excluded pairs (not counting the 1-4 pairs). */
  readonly excludedCount: number;
  /** 1-4 scale factor of Lennard-Jones. */
  readonly scale14LennardJones: number;
  /** 1-4 scale factor of Coulomb. */
  readonly scale14Coulomb: number;
  /** Private scratch space. */
  readonly workspace: Workspace;
}

/** Sorted, de-duplicated `i < j` pairs of a flat pair list, as keys i·N + j. */
function pairKeys(list: ArrayLike<number> | undefined, n: number): number[] {
  const keys: number[] = [];
  if (list === undefined) return keys;
  for (let p = 0; p + 1 < list.length; p += 2) {
    const a = list[p];
    const b = list[p + 1];
    if (a === b) continue;
    keys.push(a < b ? a * n + b : b * n + a);
  }
  keys.sort((x, y) => x - y);
  return keys.filter((k, m) => m === 0 || k !== keys[m - 1]);
}

/**
 * Build a {@link NonbondedPairs} from per-atom parameters and pair lists.
 * Inputs are not validated (the model file is validated when read): give
 * atom indices in [0, N), rmin > 0, ε ≥ 0, finite numbers. Allocates the
 * set's scratch space once. Never throws for well-formed input.
 */
export function createNonbondedPairs(parameters: NonbondedParameters): NonbondedPairs {
  const n = parameters.atomCount;
  const lj = parameters.lennardJones;
  const cq = parameters.coulomb;
  const combination = lj?.combination ?? 'geometric';
  const sqrtEpsilon = new Float64Array(n);
  const size = new Float64Array(n);
  const charge = new Float64Array(n);
  const scaledCharge = new Float64Array(n);
  for (let a = 0; a < n; a++) {
    if (lj !== undefined) {
      sqrtEpsilon[a] = Math.sqrt(lj.epsilon[a]);
      const r = lj.rmin[a];
      size[a] = combination === 'geometric' ? r * r * r : 0.5 * r;
    }
    if (cq !== undefined) {
      charge[a] = cq.charges[a];
      scaledCharge[a] = cq.charges[a] * cq.constant;
    }
  }
  const excluded = pairKeys(parameters.excluded, n);
  const excludedSet = new Set(excluded);
  const scaled = pairKeys(parameters.scaled, n).filter((k) => !excludedSet.has(k));
  const skipCount = new Int32Array(n + 1);
  for (const keys of [excluded, scaled]) {
    for (const k of keys) {
      skipCount[Math.floor(k / n)]++;
      skipCount[k % n]++;
    }
  }
  const skipStart = new Int32Array(n + 1);
  for (let a = 0; a < n; a++) skipStart[a + 1] = skipStart[a] + skipCount[a];
  const skipList = new Int32Array(skipStart[n]);
  const fill = skipStart.slice(0, n);
  for (const keys of [excluded, scaled]) {
    for (const k of keys) {
      const i = Math.floor(k / n);
      const j = k % n;
      skipList[fill[i]++] = j;
      skipList[fill[j]++] = i;
    }
  }
  for (let a = 0; a < n; a++) skipList.subarray(skipStart[a], skipStart[a + 1]).sort();
  const scaledPairs = new Int32Array(2 * scaled.length);
  scaled.forEach((k, m) => {
    scaledPairs[2 * m] = Math.floor(k / n);
    scaledPairs[2 * m + 1] = k % n;
  });
  const maxCells = n + 1;
  const cutoff = parameters.cutoff ?? Infinity;
  const sortedSqrtEpsilon = new Float64Array(n);
  const sortedSize = new Float64Array(n);
  const sortedScaledCharge = new Float64Array(n);
  const sortedCharge = new Float64Array(n);
  const sortedX = new Float64Array(3 * n);
  const workspace: Workspace = {
    stamp: new Int32Array(n).fill(-1),
    cellOf: new Int32Array(n),
    cellAtoms: new Int32Array(n),
    positionOf: new Int32Array(n),
    cellStart: new Int32Array(maxCells + 1),
    maxCells,
    sortedX,
    sortedGradient: new Float64Array(3 * n),
    sortedSqrtEpsilon,
    sortedSize,
    sortedScaledCharge,
    sortedCharge,
    sums: new Float64Array(2),
    grid: new Float64Array(9),
    atomView: { x: sortedX, g: undefined, sqrtEpsilon, size, scaledCharge, charge },
    cellView: {
      x: sortedX,
      g: undefined,
      sqrtEpsilon: sortedSqrtEpsilon,
      size: sortedSize,
      scaledCharge: sortedScaledCharge,
      charge: sortedCharge,
    },
  };
  return {
    atomCount: n,
    hasLennardJones: lj !== undefined,
    hasCoulomb: cq !== undefined,
    combination,
    sqrtEpsilon,
    size,
    scaledCharge,
    charge,
    cutoff,
    skipStart,
    skipList,
    scaledPairs,
    excludedCount: excluded.length,
    scale14LennardJones: parameters.scale14?.lennardJones ?? 1,
    scale14Coulomb: parameters.scale14?.coulomb ?? 1,
    workspace,
  };
}

/**
 * Number of pairs that count (all N(N − 1)/2 pairs less the excluded ones;
 * the 1-4 pairs count, scaled), before any cutoff.
 */
export function countedPairCount(pairs: NonbondedPairs): number {
  const n = pairs.atomCount;
  return (n * (n - 1)) / 2 - pairs.excludedCount;
}

/** The 13 "forward" neighbour offsets (dx, dy, dz) of a cell: each unordered pair of neighbouring cells once. */
const FORWARD = Int8Array.from([
  1, 0, 0,
  -1, 1, 0, 0, 1, 0, 1, 1, 0,
  -1, -1, 1, 0, -1, 1, 1, -1, 1,
  -1, 0, 1, 0, 0, 1, 1, 0, 1,
  -1, 1, 1, 0, 1, 1, 1, 1, 1,
]);

/** Relative margin by which cells are made larger than the cutoff, against rounding in the cell index. */
const CELL_MARGIN = 1 + 1e-9;


/**
 * Pairs (i, j) for j in [from, to), positions in the view's order: add the
 * energies of those that count (r < cutoff, not stamped as skipped) to
 * `sums` and their gradient to `v.g`. `ic6` = 1/r_c⁶ and `irc` = 1/r_c
 * (0 without cutoff).
 */
function scan(
  v: View,
  stamp: Int32Array,
  sums: Float64Array,
  geometric: boolean,
  i: number,
  from: number,
  to: number,
  useLJ: boolean,
  useCoulomb: boolean,
  rc2: number,
  ic6: number,
  irc: number,
): void {
  const { x, g, sqrtEpsilon, size, charge } = v;
  const i3 = 3 * i;
  const xi = x[i3];
  const yi = x[i3 + 1];
  const zi = x[i3 + 2];
  const ei = sqrtEpsilon[i];
  const si = size[i];
  const qi = v.scaledCharge[i];
  let eLJ = 0;
  let eC = 0;
  let gxi = 0;
  let gyi = 0;
  let gzi = 0;
  for (let j = from; j < to; j++) {
    const j3 = 3 * j;
    const dx = x[j3] - xi;
    const dy = x[j3 + 1] - yi;
    const dz = x[j3 + 2] - zi;
    const r2 = dx * dx + dy * dy + dz * dz;
    if (!(r2 < rc2) || stamp[j] === i) continue;
    let f = 0;
    if (useLJ) {
      const eps = ei * sqrtEpsilon[j];
      if (eps !== 0) {
        let s6: number;
        if (geometric) {
          s6 = si * size[j];
        } else {
          const s = si + size[j];
          const s2 = s * s;
          s6 = s2 * s2 * s2;
        }
        if (r2 > 0) {
          const ir2 = 1 / r2;
          const t = s6 * ir2 * ir2 * ir2;
          const tc = s6 * ic6;
          eLJ += eps * (t * (t - 2) - tc * (tc - 2));
          f += 12 * eps * t * (1 - t) * ir2;
        } else {
          eLJ += Infinity;
        }
      }
    }
    if (useCoulomb) {
      const qq = qi * charge[j];
      if (qq !== 0) {
        if (r2 > 0) {
          const ir = 1 / Math.sqrt(r2);
          eC += qq * (ir - irc);
          f -= qq * ir * ir * ir;
        } else {
          eC += Infinity;
        }
      }
    }
    if (g !== undefined && f !== 0) {
      const fx = f * dx;
      const fy = f * dy;
      const fz = f * dz;
      g[j3] += fx;
      g[j3 + 1] += fy;
      g[j3 + 2] += fz;
      gxi -= fx;
      gyi -= fy;
      gzi -= fz;
    }
  }
  if (g !== undefined) {
    g[i3] += gxi;
    g[i3 + 1] += gyi;
    g[i3 + 2] += gzi;
  }
  sums[0] += eLJ;
  sums[1] += eC;
}

/** The scaled 1-4 pairs (within the cutoff, shifted, scaled). */
function scaledPairsPass(
  x: Float64Array,
  g: Float64Array | undefined,
  p: NonbondedPairs,
  useLJ: boolean,
  useCoulomb: boolean,
  rc2: number,
  ic6: number,
  irc: number,
): void {
  const list = p.scaledPairs;
  const sLJ = useLJ ? p.scale14LennardJones : 0;
  const sC = useCoulomb ? p.scale14Coulomb : 0;
  if (list.length === 0 || (sLJ === 0 && sC === 0)) return;
  const geometric = p.combination === 'geometric';
  let eLJ = 0;
  let eC = 0;
  for (let m = 0; m < list.length; m += 2) {
    const i = list[m];
    const j = list[m + 1];
    const i3 = 3 * i;
    const j3 = 3 * j;
    const dx = x[j3] - x[i3];
    const dy = x[j3 + 1] - x[i3 + 1];
    const dz = x[j3 + 2] - x[i3 + 2];
    const r2 = dx * dx + dy * dy + dz * dz;
    if (!(r2 < rc2)) continue;
    let f = 0;
    const eps = sLJ * p.sqrtEpsilon[i] * p.sqrtEpsilon[j];
    if (eps !== 0) {
      let s6: number;
      if (geometric) {
        s6 = p.size[i] * p.size[j];
      } else {
        const s = p.size[i] + p.size[j];
        const s2 = s * s;
        s6 = s2 * s2 * s2;
      }
      if (r2 > 0) {
        const ir2 = 1 / r2;
        const t = s6 * ir2 * ir2 * ir2;
        const tc = s6 * ic6;
        eLJ += eps * (t * (t - 2) - tc * (tc - 2));
        f += 12 * eps * t * (1 - t) * ir2;
      } else {
        eLJ += Infinity;
      }
    }
    const qq = sC * p.scaledCharge[i] * p.charge[j];
    if (qq !== 0) {
      if (r2 > 0) {
        const ir = 1 / Math.sqrt(r2);
        eC += qq * (ir - irc);
        f -= qq * ir * ir * ir;
      } else {
        eC += Infinity;
      }
    }
    if (g !== undefined && f !== 0) addPairGradient(g, i3, j3, f, dx, dy, dz);
  }
  const sums = p.workspace.sums;
  sums[0] += eLJ;
  sums[1] += eC;
}

/** Every pair i < j, in index order (used without a cutoff, and on request with one). */
function allPairsPass(
  x: Float64Array,
  g: Float64Array | undefined,
  p: NonbondedPairs,
  useLJ: boolean,
  useCoulomb: boolean,
  rc2: number,
  ic6: number,
  irc: number,
): void {
  const n = p.atomCount;
  const { stamp, sums } = p.workspace;
  const { skipStart, skipList } = p;
  const geometric = p.combination === 'geometric';
  const view = p.workspace.atomView;
  view.x = x;
  view.g = g;
  stamp.fill(-1);
  for (let i = 0; i < n - 1; i++) {
    for (let k = skipStart[i]; k < skipStart[i + 1]; k++) stamp[skipList[k]] = i;
    scan(view, stamp, sums, geometric, i, i + 1, n, useLJ, useCoulomb, rc2, ic6, irc);
  }
  // Hold no reference to the caller's arrays between evaluations.
  view.x = p.workspace.sortedX;
  view.g = undefined;
}

/**
 * The cell grid of a cell list over the coordinates' bounding box: cells of
 * side ≥ cutoff (with a margin against rounding), made larger while there
 * would be more than `maxCells`. Writes into `grid` (length ≥ 9)
 * [minX, minY, minZ, nx, ny, nz, fx, fy, fz]: the box's low corner, the cell
 * counts per axis, and the factors that turn an offset from the corner into
 * a cell coordinate (cell = min(n − 1, floor((x − min) · f))). The first `n`
 * atoms of `x` are used and must be finite. Never allocates.
 */
export function cellGrid(x: Float64Array, n: number, cutoff: number, maxCells: number, grid: Float64Array): void {
  let minX = Infinity;
  let minY = Infinity;
  let minZ = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  let maxZ = -Infinity;
  for (let a = 0; a < n; a++) {
    const xa = x[3 * a];
    const ya = x[3 * a + 1];
    const za = x[3 * a + 2];
    if (xa < minX) minX = xa;
    if (xa > maxX) maxX = xa;
    if (ya < minY) minY = ya;
    if (ya > maxY) maxY = ya;
    if (za < minZ) minZ = za;
    if (za > maxZ) maxZ = za;
  }
  const spanX = maxX - minX;
  const spanY = maxY - minY;
  const spanZ = maxZ - minZ;
  // Cells of side ≥ cutoff (with a margin against rounding), made larger while there would be too many.
  let side = cutoff * CELL_MARGIN;
  let nx = 1;
  let ny = 1;
  let nz = 1;
  for (let round = 0; round < 4000; round++) {
    nx = Math.max(1, Math.floor(spanX / side));
    ny = Math.max(1, Math.floor(spanY / side));
    nz = Math.max(1, Math.floor(spanZ / side));
    if (nx * ny * nz <= maxCells) break;
    side *= 1.25;
  }
  if (!(nx * ny * nz <= maxCells)) nx = ny = nz = 1;
  grid[0] = minX;
  grid[1] = minY;
  grid[2] = minZ;
  grid[3] = nx;
  grid[4] = ny;
  grid[5] = nz;
  grid[6] = spanX > 0 ? nx / spanX : 0;
  grid[7] = spanY > 0 ? ny / spanY : 0;
  grid[8] = spanZ > 0 ? nz / spanZ : 0;
}

/**
 * The cell-list pass: sort the atoms into cells of side ≥ cutoff, copy
 * coordinates and parameters into that order (so each cell's atoms are
 * contiguous in memory), and visit each cell's own pairs and those with its
 * 13 forward neighbours. The coordinates must be finite.
 */
function cellPass(
  x: Float64Array,
  gradient: Float64Array | undefined,
  p: NonbondedPairs,
  useLJ: boolean,
  useCoulomb: boolean,
  rc2: number,
  ic6: number,
  irc: number,
): void {
  const n = p.atomCount;
  const w = p.workspace;
  const { cellOf, cellAtoms, positionOf, cellStart, maxCells, stamp, sums } = w;
  const grid = w.grid;
  cellGrid(x, n, p.cutoff, maxCells, grid);
  const minX = grid[0], minY = grid[1], minZ = grid[2];
  const nx = grid[3], ny = grid[4], nz = grid[5];
  const fx = grid[6], fy = grid[7], fz = grid[8];
  const cells = nx * ny * nz;
  cellStart.fill(0, 0, cells + 1);
  for (let a = 0; a < n; a++) {
    const cx = Math.min(nx - 1, Math.floor((x[3 * a] - minX) * fx));
    const cy = Math.min(ny - 1, Math.floor((x[3 * a + 1] - minY) * fy));
    const cz = Math.min(nz - 1, Math.floor((x[3 * a + 2] - minZ) * fz));
    const c = (cz * ny + cy) * nx + cx;
    cellOf[a] = c;
    cellStart[c + 1]++;
  }
  for (let c = 0; c < cells; c++) cellStart[c + 1] += cellStart[c];
  // Place each atom; cellStart[c] runs ahead and is shifted back afterwards.
  for (let a = 0; a < n; a++) {
    const m = cellStart[cellOf[a]]++;
    cellAtoms[m] = a;
    positionOf[a] = m;
  }
  for (let c = cells; c > 0; c--) cellStart[c] = cellStart[c - 1];
  cellStart[0] = 0;
  const { sortedX, sortedGradient, sortedSqrtEpsilon, sortedSize, sortedScaledCharge, sortedCharge } = w;
  for (let m = 0; m < n; m++) {
    const a = cellAtoms[m];
    sortedX[3 * m] = x[3 * a];
    sortedX[3 * m + 1] = x[3 * a + 1];
    sortedX[3 * m + 2] = x[3 * a + 2];
    sortedSqrtEpsilon[m] = p.sqrtEpsilon[a];
    sortedSize[m] = p.size[a];
    sortedScaledCharge[m] = p.scaledCharge[a];
    sortedCharge[m] = p.charge[a];
    stamp[m] = -1;
  }
  if (gradient !== undefined) sortedGradient.fill(0);
  const view = w.cellView;
  view.g = gradient === undefined ? undefined : sortedGradient;
  const geometric = p.combination === 'geometric';
  const { skipStart, skipList } = p;
  for (let cz = 0; cz < nz; cz++) {
    for (let cy = 0; cy < ny; cy++) {
      for (let cx = 0; cx < nx; cx++) {
        const c = (cz * ny + cy) * nx + cx;
        const end = cellStart[c + 1];
        for (let m = cellStart[c]; m < end; m++) {
          const i = cellAtoms[m];
          for (let k = skipStart[i]; k < skipStart[i + 1]; k++) stamp[positionOf[skipList[k]]] = m;
          scan(view, stamp, sums, geometric, m, m + 1, end, useLJ, useCoulomb, rc2, ic6, irc);
          for (let o = 0; o < 39; o += 3) {
            const ox = cx + FORWARD[o];
            const oy = cy + FORWARD[o + 1];
            const oz = cz + FORWARD[o + 2];
            if (ox < 0 || ox >= nx || oy < 0 || oy >= ny || oz >= nz) continue;
            const c2 = (oz * ny + oy) * nx + ox;
            scan(view, stamp, sums, geometric, m, cellStart[c2], cellStart[c2 + 1], useLJ, useCoulomb, rc2, ic6, irc);
          }
        }
      }
    }
  }
  if (gradient !== undefined) {
    for (let m = 0; m < n; m++) {
      const a = 3 * cellAtoms[m];
      gradient[a] += sortedGradient[3 * m];
      gradient[a + 1] += sortedGradient[3 * m + 1];
      gradient[a + 2] += sortedGradient[3 * m + 2];
    }
  }
}

/** Whether the first n atoms' coordinates are all finite. */
function allFinite(x: Float64Array, n: number): boolean {
  for (let c = 0; c < 3 * n; c++) if (!(x[c] - x[c] === 0)) return false;
  return true;
}

function evaluate(
  x: Float64Array,
  p: NonbondedPairs,
  gradient: Float64Array | undefined,
  parts: Float64Array | undefined,
  include: number,
  cells: boolean,
): number {
  const sums = p.workspace.sums;
  sums[0] = 0;
  sums[1] = 0;
  const useLJ = p.hasLennardJones && (include & NONBONDED_LENNARD_JONES) !== 0;
  const useCoulomb = p.hasCoulomb && (include & NONBONDED_COULOMB) !== 0;
  if ((useLJ || useCoulomb) && p.atomCount > 1) {
    const rc = p.cutoff;
    const finite = rc < Infinity;
    const rc2 = finite ? rc * rc : Infinity;
    const ic6 = finite ? 1 / (rc2 * rc2 * rc2) : 0;
    const irc = finite ? 1 / rc : 0;
    if (!allFinite(x, p.atomCount)) {
      sums[0] = useLJ ? NaN : 0;
      sums[1] = useCoulomb ? NaN : 0;
    } else {
      if (finite && cells) cellPass(x, gradient, p, useLJ, useCoulomb, rc2, ic6, irc);
      else allPairsPass(x, gradient, p, useLJ, useCoulomb, rc2, ic6, irc);
      scaledPairsPass(x, gradient, p, useLJ, useCoulomb, rc2, ic6, irc);
    }
  }
  if (parts !== undefined) {
    parts[0] = sums[0];
    parts[1] = sums[1];
  }
  return sums[0] + sums[1];
}

/**
 * Add the nonbonded energy of `pairs` at `x` (flat, 3N) and return it:
 * Lennard-Jones plus Coulomb, over the pairs that count (see the module
 * comment), with a cell list when there is a cutoff and over all pairs
 * i < j when there is none.
 *
 * @param x - coordinates, flat `[x0, y0, z0, …]`, length 3N.
 * @param pairs - the pair set.
 * @param gradient - when given (length 3N), dE/dx is ADDED into it.
 * @param parts - when given (length ≥ 2), parts[0] is set to the
 *   Lennard-Jones energy and parts[1] to the Coulomb energy.
 * @param include - which kinds to evaluate: {@link NONBONDED_LENNARD_JONES},
 *   {@link NONBONDED_COULOMB} or both ({@link NONBONDED_ALL}, the default).
 * @returns the energy (in the units of the parameters). With a non-finite
 *   coordinate (NaN or ±Infinity), NaN for each kind evaluated and nothing
 *   added to `gradient`. Never allocates, never throws.
 */
export function accumulateNonbonded(
  x: Float64Array,
  pairs: NonbondedPairs,
  gradient?: Float64Array,
  parts?: Float64Array,
  include: number = NONBONDED_ALL,
): number {
  return evaluate(x, pairs, gradient, parts, include, true);
}

/**
 * As {@link accumulateNonbonded}, but always visiting every pair i < j and
 * testing the cutoff on each: the reference the cell list is tested
 * against, and a choice for small systems. O(N²).
 */
export function accumulateNonbondedAllPairs(
  x: Float64Array,
  pairs: NonbondedPairs,
  gradient?: Float64Array,
  parts?: Float64Array,
  include: number = NONBONDED_ALL,
): number {
  return evaluate(x, pairs, gradient, parts, include, false);
}
