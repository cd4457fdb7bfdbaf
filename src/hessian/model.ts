/**
 * Hessians of a whole model: dense, block-sparse, and Hessian-vector products.
 * @module
 */
import type { Model } from '../model/model.js';
import type { NonbondedPairs } from '../terms/nonbonded.js';
import { tablesHessian } from './dense.js';
import { NonbondedPairHessian } from './nonbonded.js';
import { BlockSparseHessian } from './sparse.js';

const pairCache = new WeakMap<NonbondedPairs, NonbondedPairHessian>();

/**
 * The model's Hessian at `x`: a dense symmetric (3N)×(3N) row-major
 * `Float64Array`, entry [3a+p, 3b+q] = ∂²E/∂x_{a,p}∂x_{b,q} (p, q the axes
 * x, y, z), in the model's energy per length². `out` (length (3N)²) is
 * overwritten and returned when given; otherwise a new array is made.
 * Exactly symmetric, bit for bit. Frozen atoms and constraints are not
 * applied (this is the Hessian of the energy alone). Includes the nonbonded
 * pairs when the model has them: the pairs `model.energy` counts at `x`
 * (exclusions, 1-4 scaling, cutoff; see src/hessian/nonbonded.ts), O(N²);
 * with a non-finite coordinate and nonbonded pairs the matrix is all NaN.
 *
 * @throws RangeError if `x.length !== 3 * model.atomCount` or `out` has the wrong length.
 */
export function modelHessian(model: Model, x: Float64Array, out?: Float64Array): Float64Array {
  const matrix = tablesHessian(model.tables, model.atomCount, x, out);
  const pairs = model.nonbonded;
  if (pairs !== null) {
    let hessian = pairCache.get(pairs);
    if (hessian === undefined) {
      hessian = new NonbondedPairHessian(pairs);
      pairCache.set(pairs, hessian);
    }
    hessian.update(x).addToDense(matrix, 3 * model.atomCount);
  }
  return matrix;
}

/**
 * A block-sparse Hessian of `model` (the symbolic pass is done here; call
 * `.update(x)` for each geometry), with the model's nonbonded pairs, when it
 * has them, kept as a pair list beside the bonded pattern. See
 * {@link BlockSparseHessian}.
 */
export function modelSparseHessian(model: Model): BlockSparseHessian {
  return new BlockSparseHessian(model.tables, model.atomCount, model.nonbonded);
}

const cache = new WeakMap<Model, BlockSparseHessian>();

/**
 * H(x)·v for the model, through a block-sparse Hessian whose pattern is
 * built on the first call for a model and kept (weakly) for later ones; the
 * numbers are recomputed at `x` on every call. Written into `out` (length
 * 3N; may be `v`) or a new array, and returned. Cost: one sparse assembly
 * plus one product, linear in the number of terms (plus O(N²) distance
 * tests when the model has nonbonded pairs).
 *
 * @throws RangeError if `x`, `v` or `out` does not have length 3N.
 */
export function hessianVectorProduct(
  model: Model,
  x: Float64Array,
  v: Float64Array,
  out?: Float64Array,
): Float64Array {
  let sparse = cache.get(model);
  if (sparse === undefined) {
    sparse = modelSparseHessian(model);
    cache.set(model, sparse);
  }
  return sparse.update(x).multiply(v, out);
}
