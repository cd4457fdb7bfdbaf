/**
 * Bonds from coordinates, for structures whose file lists none.
 *
 * Rule: atoms i and j are bonded when r_ij ≤ r_cov(i) + r_cov(j) + t, with
 * single-bond covalent radii from Cordero et al. 2008 (from memory, see
 * `covalent-radii.ts`) and an absolute tolerance t = 0.45 Å by default
 * (common practice). Two hydrogens are bonded only when r ≤ 2 r_cov(H) +
 * min(t, 0.15 Å) = 0.77 Å at the default: H₂ (0.74 Å) is found, while the
 * H···H contacts of crowded structures (≥ 1.5 Å within a CH₂, rarely below
 * 2 Å between molecules) never are.
 *
 * Linear time: atoms are binned into a grid of cubic cells whose side is the
 * longest bond the present elements allow, so each atom is compared only
 * with the atoms of its own and the 26 adjacent cells. When the structure is
 * very sparse (its bounding box would need more than 4N + 64 cells) the
 * cells are made larger, which keeps memory linear and the result exact.
 * @module
 */
import { ModelError } from '../errors.js';
import { covalentRadius } from './covalent-radii.js';
import { checkCoordinates } from './graph.js';

/** Default absolute bond tolerance in Å (common practice). */
export const DEFAULT_BOND_TOLERANCE = 0.45;

/** Largest tolerance in Å used between two hydrogens. */
export const HYDROGEN_PAIR_TOLERANCE = 0.15;

/** Options of {@link perceiveBonds}. */
export interface BondPerceptionOptions {
  /** Absolute tolerance in Å added to the sum of covalent radii; finite, ≥ 0. Default 0.45. */
  readonly tolerance?: number;
}

/**
 * Checks the element list and returns each atom's covalent radius (Å).
 * @throws ModelError `atoms[7] (Xx): no covalent radius` for an unknown element.
 */
export function radiiOf(elements: readonly string[]): Float64Array {
  if (!Array.isArray(elements)) throw new ModelError('elements', 'expected an array of element symbols');
  const radii = new Float64Array(elements.length);
  for (let a = 0; a < elements.length; a++) {
    const r = covalentRadius(elements[a]);
    if (r === undefined) throw new ModelError(`atoms[${a}] (${String(elements[a])})`, 'no covalent radius');
    radii[a] = r;
  }
  return radii;
}

/**
 * Perceives bonds from coordinates by the covalent-radius rule above.
 *
 * @param elements chemical symbols, one per atom (case-sensitive: `Cl`).
 * @param coordinates flat `[x0, y0, z0, x1, …]`, 3N numbers, in Å.
 * @param options `tolerance` in Å (default {@link DEFAULT_BOND_TOLERANCE}).
 * @returns bonded pairs, `2 × B` atom indices, smaller index first, sorted by pair.
 * @throws ModelError for an element without a covalent radius
 *   (`atoms[7] (Xx): no covalent radius`), coordinates of the wrong length or
 *   not finite, or a tolerance that is negative or not finite.
 */
export function perceiveBonds(
  elements: readonly string[],
  coordinates: Float64Array,
  options: BondPerceptionOptions = {},
): Int32Array {
  const tolerance = options.tolerance ?? DEFAULT_BOND_TOLERANCE;
  if (typeof tolerance !== 'number' || !Number.isFinite(tolerance) || tolerance < 0) {
    throw new ModelError('tolerance', `expected a finite number of Å ≥ 0, got ${String(tolerance)}`);
  }
  const radii = radiiOf(elements);
  const n = elements.length;
  checkCoordinates(coordinates, n);
  if (n < 2) return new Int32Array(0);

  const isH = new Uint8Array(n);
  let maxRadius = 0;
  for (let a = 0; a < n; a++) {
    if (elements[a] === 'H') isH[a] = 1;
    if (radii[a] > maxRadius) maxRadius = radii[a];
  }
  const hhTolerance = Math.min(tolerance, HYDROGEN_PAIR_TOLERANCE);
  const x = coordinates;

  // Bounding box.
  let minX = Infinity, minY = Infinity, minZ = Infinity;
  let maxX = -Infinity, maxY = -Infinity, maxZ = -Infinity;
  for (let a = 0; a < n; a++) {
    const px = x[3 * a], py = x[3 * a + 1], pz = x[3 * a + 2];
    if (px < minX) minX = px;
    if (px > maxX) maxX = px;
    if (py < minY) minY = py;
    if (py > maxY) maxY = py;
    if (pz < minZ) minZ = pz;
    if (pz > maxZ) maxZ = pz;
  }
  // Cell side: the longest possible bond, enlarged if the grid would be too big.
  let side = Math.max(2 * maxRadius + tolerance, 1e-6);
  const maxCells = 4 * n + 64;
  let nx = 0, ny = 0, nz = 0;
  for (;;) {
    nx = Math.floor((maxX - minX) / side) + 1;
    ny = Math.floor((maxY - minY) / side) + 1;
    nz = Math.floor((maxZ - minZ) / side) + 1;
    if (nx * ny * nz <= maxCells) break;
    side *= Math.max(1.01, Math.cbrt((nx * ny * nz) / maxCells));
  }
  const cellCount = nx * ny * nz;

  // Counting sort of atoms into cells.
  const cellOf = new Int32Array(n);
  const cellStart = new Int32Array(cellCount + 1);
  for (let a = 0; a < n; a++) {
    const cx = Math.min(nx - 1, Math.floor((x[3 * a] - minX) / side));
    const cy = Math.min(ny - 1, Math.floor((x[3 * a + 1] - minY) / side));
    const cz = Math.min(nz - 1, Math.floor((x[3 * a + 2] - minZ) / side));
    const c = (cz * ny + cy) * nx + cx;
    cellOf[a] = c;
    cellStart[c + 1]++;
  }
  for (let c = 0; c < cellCount; c++) cellStart[c + 1] += cellStart[c];
  const cellFill = cellStart.slice(0, cellCount);
  const cellAtoms = new Int32Array(n);
  for (let a = 0; a < n; a++) cellAtoms[cellFill[cellOf[a]]++] = a;

  let out = new Int32Array(Math.max(16, 4 * n));
  let count = 0; // number of ints written
  const found = new Int32Array(n); // scratch: larger partners of atom i
  for (let i = 0; i < n; i++) {
    const c = cellOf[i];
    const cx = c % nx;
    const cy = Math.floor(c / nx) % ny;
    const cz = Math.floor(c / (nx * ny));
    const xi = x[3 * i], yi = x[3 * i + 1], zi = x[3 * i + 2];
    const ri = radii[i];
    let m = 0;
    for (let dz = -1; dz <= 1; dz++) {
      const z = cz + dz;
      if (z < 0 || z >= nz) continue;
      for (let dy = -1; dy <= 1; dy++) {
        const y = cy + dy;
        if (y < 0 || y >= ny) continue;
        for (let dx = -1; dx <= 1; dx++) {
          const xc = cx + dx;
          if (xc < 0 || xc >= nx) continue;
          const cell = (z * ny + y) * nx + xc;
          for (let s = cellStart[cell], e = cellStart[cell + 1]; s < e; s++) {
            const j = cellAtoms[s];
            if (j <= i) continue;
            const ddx = x[3 * j] - xi, ddy = x[3 * j + 1] - yi, ddz = x[3 * j + 2] - zi;
            const cut = ri + radii[j] + (isH[i] & isH[j] ? hhTolerance : tolerance);
            if (ddx * ddx + ddy * ddy + ddz * ddz <= cut * cut) found[m++] = j;
          }
        }
      }
    }
    if (m === 0) continue;
    // Insertion sort of the (few) partners.
    for (let p = 1; p < m; p++) {
      const v = found[p];
      let q = p - 1;
      while (q >= 0 && found[q] > v) {
        found[q + 1] = found[q];
        q--;
      }
      found[q + 1] = v;
    }
    if (count + 2 * m > out.length) {
      const bigger = new Int32Array(Math.max(2 * out.length, count + 2 * m));
      bigger.set(out.subarray(0, count));
      out = bigger;
    }
    for (let p = 0; p < m; p++) {
      out[count++] = i;
      out[count++] = found[p];
    }
  }
  return out.slice(0, count);
}
