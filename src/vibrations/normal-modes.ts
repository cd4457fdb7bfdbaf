/**
 * Harmonic normal modes from a Cartesian Hessian: mass weighting, removal
 * of the rigid motions, diagonalization, wavenumbers in cm⁻¹.
 * @module
 */
import { restrictToComplement } from '../linalg/complement.js';
import { symmetricEigen } from '../linalg/symmetric-eigen.js';
import { wavenumberPerRootCurvature, type Units } from '../units.js';
import { massWeightHessian } from './mass-weight.js';
import { rigidMotions } from './rigid-motions.js';

/** Options of {@link normalModes}. */
export interface NormalModeOptions {
  /**
   * Remove the translations and rotations (default true). Set it to false
   * when the energy is not invariant under them, e.g. a model with position
   * restraints: then all 3N modes are kept and `zeroModes` is 0.
   */
  readonly projectRigid?: boolean;
}

/** The harmonic normal modes of a structure. */
export interface NormalModes {
  /** Number of atoms N. */
  readonly atomCount: number;
  /**
   * Wavenumbers in cm⁻¹, ascending, one per mode (3N − zeroModes of them).
   * An imaginary wavenumber (negative curvature) is given as a negative
   * number: −√|λ| in the same units.
   */
  readonly frequencies: Float64Array;
  /** How many rigid motions were removed: 6, 5 (linear), 3 (one atom), or 0 (`projectRigid: false`). */
  readonly zeroModes: number;
  /** Whether the structure counts as linear (smallest principal moment < 1e-8 × largest). */
  readonly linear: boolean;
  /** How many of {@link frequencies} are negative (imaginary). */
  readonly imaginaryCount: number;
  /** Eigenvalues λ of the mass-weighted Hessian, ascending, in energy/length² per dalton (model units). */
  readonly eigenvalues: Float64Array;
  /**
   * Per mode, the Cartesian displacement pattern (flat, 3N) normalized to
   * Euclidean length 1: d = M^{−½} q / |M^{−½} q|. The sign is arbitrary.
   */
  readonly modes: readonly Float64Array[];
  /**
   * Per mode, the eigenvector q of the mass-weighted Hessian (flat, 3N),
   * of length 1; these are orthonormal to each other and to the removed
   * rigid motions. Same sign as {@link modes}.
   */
  readonly massWeightedModes: readonly Float64Array[];
  /** Per mode, the reduced mass μ = 1 / |M^{−½} q|² in dalton. */
  readonly reducedMasses: Float64Array;
  /** Per mode, the force constant k = μ λ = dᵀ H d in the model's energy/length². */
  readonly forceConstants: Float64Array;
}

/**
 * The harmonic normal modes of a structure from its Cartesian Hessian.
 *
 * The mass-weighted Hessian M^{−½} H M^{−½} is restricted to the orthogonal
 * complement of the rigid motions about the centre of mass (3 translations
 * and 3 rotations, 2 for a linear molecule, none for one atom; see
 * {@link rigidMotions}) — the same as diagonalizing P H P with the
 * projector P = I − B Bᵀ and dropping the rigid space, which here is
 * exactly the space removed, never chosen by eigenvalue — and
 * diagonalized. Each eigenvalue λ gives the wavenumber
 * ν̃ = sign(λ) √|λ| / (2π c) (cm⁻¹, CODATA 2018 constants, see
 * `wavenumberPerRootCurvature`).
 *
 * @param hessian - row-major (3N)×(3N), symmetric (upper triangle used after weighting), in `units` energy/length².
 * @param masses - N masses in dalton.
 * @param coordinates - flat 3N, in `units` length.
 * @param units - the model's units.
 * @throws RangeError when lengths do not fit, or a mass is not a finite
 *   number > 0, or a Hessian entry or coordinate is not finite.
 */
export function normalModes(
  hessian: Float64Array,
  masses: Float64Array,
  coordinates: Float64Array,
  units: Units,
  options: NormalModeOptions = {},
): NormalModes {
  const atoms = masses.length;
  const n = 3 * atoms;
  if (coordinates.length !== n) throw new RangeError(`normalModes: coordinates: expected 3N = ${n} numbers, got ${coordinates.length}`);
  if (hessian.length !== n * n) throw new RangeError(`normalModes: hessian: expected (3N)² = ${n * n} numbers, got ${hessian.length}`);
  for (let a = 0; a < atoms; a++) {
    if (!(Number.isFinite(masses[a]) && masses[a] > 0)) throw new RangeError(`normalModes: masses[${a}]: expected a finite number > 0, got ${masses[a]}`);
  }
  for (let i = 0; i < n; i++) {
    if (!Number.isFinite(coordinates[i])) throw new RangeError(`normalModes: coordinates[${i}] is ${coordinates[i]}, expected a finite number`);
  }
  for (let i = 0; i < n * n; i++) {
    if (!Number.isFinite(hessian[i])) {
      throw new RangeError(`normalModes: hessian[${Math.floor(i / n)}][${i % n}] is ${hessian[i]}, expected a finite number`);
    }
  }
  const weighted = massWeightHessian(hessian, masses);
  const project = options.projectRigid !== false;
  const rigid = rigidMotions(coordinates, masses);
  const zeroModes = project ? rigid.count : 0;
  let values: Float64Array;
  const massWeightedModes: Float64Array[] = [];
  if (project) {
    const restricted = restrictToComplement(weighted, n, rigid.vectors, zeroModes);
    const eigen = symmetricEigen(restricted.matrix, restricted.size);
    values = eigen.values;
    for (let i = 0; i < restricted.size; i++) {
      massWeightedModes.push(restricted.lift(eigen.vectors.subarray(i * restricted.size, (i + 1) * restricted.size), new Float64Array(n)));
    }
  } else {
    const eigen = symmetricEigen(weighted, n);
    values = eigen.values;
    for (let i = 0; i < n; i++) massWeightedModes.push(eigen.vectors.slice(i * n, (i + 1) * n));
  }
  const count = values.length;
  const factor = wavenumberPerRootCurvature(units);
  const frequencies = new Float64Array(count);
  const reducedMasses = new Float64Array(count);
  const forceConstants = new Float64Array(count);
  const modes: Float64Array[] = [];
  let imaginaryCount = 0;
  for (let i = 0; i < count; i++) {
    const lambda = values[i];
    frequencies[i] = Math.sign(lambda) * Math.sqrt(Math.abs(lambda)) * factor;
    if (frequencies[i] < 0) imaginaryCount++;
    const q = massWeightedModes[i];
    const d = new Float64Array(n);
    let norm2 = 0;
    for (let c = 0; c < n; c++) {
      d[c] = q[c] / Math.sqrt(masses[(c / 3) | 0]);
      norm2 += d[c] * d[c];
    }
    const scale = 1 / Math.sqrt(norm2);
    for (let c = 0; c < n; c++) d[c] *= scale;
    modes.push(d);
    reducedMasses[i] = 1 / norm2;
    forceConstants[i] = lambda / norm2;
  }
  return {
    atomCount: atoms,
    frequencies,
    zeroModes,
    linear: rigid.linear,
    imaginaryCount,
    eigenvalues: Float64Array.from(values),
    modes,
    massWeightedModes,
    reducedMasses,
    forceConstants,
  };
}
