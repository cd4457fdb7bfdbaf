/**
 * The rigid motions of a molecule (translations and rotations about its
 * centre of mass) as orthonormal vectors in mass-weighted coordinates, and
 * the linear-molecule test.
 * @module
 */
import { symmetricEigen } from '../linalg/symmetric-eigen.js';

/**
 * A molecule counts as linear when its smallest principal moment of
 * inertia is below this fraction of its largest (spec/cli.md).
 */
export const LINEAR_MOMENT_RATIO = 1e-8;

/** Rigid motions of a structure in mass-weighted coordinates. */
export interface RigidMotions {
  /** 6 for a non-linear molecule, 5 for a linear one, 3 for one atom (or all atoms at one point), 0 for none. */
  readonly count: number;
  /** True when two or more atoms lie on a line (smallest moment < 1e-8 × largest). */
  readonly linear: boolean;
  /**
   * The `count` orthonormal vectors, row-major count×3N: the three
   * translations first (x, y, z), then the rotations about the principal
   * axes (largest moments last). Component c of a translation along axis a
   * is √m δ(c mod 3, a) / √M; of a rotation about axis u, √m (u × (r − R))
   * normalized, R the centre of mass.
   */
  readonly vectors: Float64Array;
  /** Principal moments of inertia, ascending (dalton × length²). */
  readonly moments: Float64Array;
  /** Principal axes, one per row (row-major 3×3), in the order of {@link moments}. */
  readonly axes: Float64Array;
  /** Centre of mass (length). */
  readonly centre: Float64Array;
}

/**
 * The translations and rotations of the structure at `coordinates` (flat,
 * 3N) with `masses` (N, dalton, > 0), as orthonormal mass-weighted vectors.
 * Rotations about principal axes of a body are orthogonal to each other and
 * to the translations (their overlaps are the off-diagonal products of
 * inertia, zero in the principal frame); a modified Gram–Schmidt pass
 * removes what rounding leaves. Never throws for lengths that fit.
 */
export function rigidMotions(coordinates: Float64Array, masses: Float64Array): RigidMotions {
  const atoms = masses.length;
  const n = 3 * atoms;
  const centre = new Float64Array(3);
  let total = 0;
  for (let a = 0; a < atoms; a++) {
    total += masses[a];
    for (let c = 0; c < 3; c++) centre[c] += masses[a] * coordinates[3 * a + c];
  }
  if (atoms > 0) for (let c = 0; c < 3; c++) centre[c] /= total;
  const inertia = new Float64Array(9);
  for (let a = 0; a < atoms; a++) {
    const x = coordinates[3 * a] - centre[0];
    const y = coordinates[3 * a + 1] - centre[1];
    const z = coordinates[3 * a + 2] - centre[2];
    const m = masses[a];
    inertia[0] += m * (y * y + z * z);
    inertia[4] += m * (x * x + z * z);
    inertia[8] += m * (x * x + y * y);
    inertia[1] -= m * x * y;
    inertia[2] -= m * x * z;
    inertia[5] -= m * y * z;
  }
  inertia[3] = inertia[1];
  inertia[6] = inertia[2];
  inertia[7] = inertia[5];
  const principal = symmetricEigen(inertia, 3);
  const moments = principal.values;
  const axes = principal.vectors;
  const largest = moments[2];
  const point = atoms <= 1 || !(largest > 0);
  const linear = !point && moments[0] < LINEAR_MOMENT_RATIO * largest;
  const rotationAxes = atoms === 0 || point ? [] : linear ? [1, 2] : [0, 1, 2];
  const count = atoms === 0 ? 0 : 3 + rotationAxes.length;
  const vectors = new Float64Array(count * n);
  for (let t = 0; t < Math.min(count, 3); t++) {
    for (let a = 0; a < atoms; a++) vectors[t * n + 3 * a + t] = Math.sqrt(masses[a] / total);
  }
  rotationAxes.forEach((axis, r) => {
    const row = (3 + r) * n;
    const ux = axes[3 * axis];
    const uy = axes[3 * axis + 1];
    const uz = axes[3 * axis + 2];
    for (let a = 0; a < atoms; a++) {
      const s = Math.sqrt(masses[a]);
      const x = coordinates[3 * a] - centre[0];
      const y = coordinates[3 * a + 1] - centre[1];
      const z = coordinates[3 * a + 2] - centre[2];
      vectors[row + 3 * a] = s * (uy * z - uz * y);
      vectors[row + 3 * a + 1] = s * (uz * x - ux * z);
      vectors[row + 3 * a + 2] = s * (ux * y - uy * x);
    }
  });
  // Modified Gram–Schmidt, twice (the vectors are orthogonal up to rounding already).
  for (let pass = 0; pass < 2; pass++) {
    for (let r = 0; r < count; r++) {
      const row = r * n;
      for (let s = 0; s < r; s++) {
        let dot = 0;
        for (let j = 0; j < n; j++) dot += vectors[row + j] * vectors[s * n + j];
        for (let j = 0; j < n; j++) vectors[row + j] -= dot * vectors[s * n + j];
      }
      let norm = 0;
      for (let j = 0; j < n; j++) norm += vectors[row + j] * vectors[row + j];
      norm = Math.sqrt(norm);
      for (let j = 0; j < n; j++) vectors[row + j] /= norm;
    }
  }
  return { count, linear, vectors, moments, axes, centre };
}
