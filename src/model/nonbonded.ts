/**
 * Compiling a model file's `nonbonded` block into a pair set: the
 * connectivity, bond separations, exclusions, 1-4 pairs, per-atom
 * parameters and the Coulomb constant of the model's units.
 * @module
 */
import { createNonbondedPairs, type NonbondedPairs } from '../terms/nonbonded.js';
import { coulombConstant } from '../units.js';
import type { NonbondedKind } from './kinds.js';
import { MODEL_DEFAULTS, type ModelFile } from './schema.js';

/**
 * The connectivity bond separations are measured in, flat `[i0, j0, i1, j1, …]`
 * (as written; may repeat a pair): the file's `bonds` when present, else the
 * atom pairs of its `harmonic-bond` and `morse-bond` terms and of its
 * `fixed-distance` constraints (model-file spec).
 */
export function nonbondedConnectivity(file: ModelFile): Int32Array {
  if (file.bonds !== undefined) return Int32Array.from(file.bonds.flat());
  const pairs: number[] = [];
  for (const term of file.terms) {
    if (term.kind === 'harmonic-bond' || term.kind === 'morse-bond') pairs.push(term.atoms[0], term.atoms[1]);
  }
  for (const constraint of file.constraints ?? []) pairs.push(constraint.atoms[0], constraint.atoms[1]);
  return Int32Array.from(pairs);
}

/** Pairs of atoms by bond separation, from {@link bondSeparations}. */
export interface BondSeparations {
  /** Pairs i < j, flat `[i0, j0, …]`, sorted by i then j. */
  readonly pairs: Int32Array;
  /** `separation[m]`: the number of bonds on the shortest path between pair m's atoms (1 … maxDepth). */
  readonly separation: Int32Array;
}

/**
 * Every pair of atoms at most `maxDepth` bonds apart, with its bond
 * separation (the length of the shortest path in the connectivity), by a
 * breadth-first search from each atom that stops at depth `maxDepth`.
 *
 * @param atomCount - N.
 * @param bonds - the connectivity, flat `[i0, j0, …]`, indices in [0, N)
 *   (repeated pairs and either order are fine; pairs i–i are ignored).
 * @param maxDepth - the largest separation wanted (≥ 0).
 * @returns the pairs, sorted. Cost: N searches, each over the atoms within
 *   `maxDepth` bonds. Never throws for valid indices.
 */
export function bondSeparations(atomCount: number, bonds: ArrayLike<number>, maxDepth: number): BondSeparations {
  const n = atomCount;
  // Adjacency in compressed rows.
  const degree = new Int32Array(n + 1);
  for (let b = 0; b + 1 < bonds.length; b += 2) {
    if (bonds[b] === bonds[b + 1]) continue;
    degree[bonds[b]]++;
    degree[bonds[b + 1]]++;
  }
  const start = new Int32Array(n + 1);
  for (let a = 0; a < n; a++) start[a + 1] = start[a] + degree[a];
  const next = start.slice(0, n);
  const neighbours = new Int32Array(start[n]);
  for (let b = 0; b + 1 < bonds.length; b += 2) {
    const i = bonds[b];
    const j = bonds[b + 1];
    if (i === j) continue;
    neighbours[next[i]++] = j;
    neighbours[next[j]++] = i;
  }
  const depth = new Int32Array(n).fill(-1);
  const queue = new Int32Array(n);
  const pairs: number[] = [];
  const separation: number[] = [];
  for (let root = 0; root < n && maxDepth > 0; root++) {
    let head = 0;
    let tail = 0;
    queue[tail++] = root;
    depth[root] = 0;
    while (head < tail) {
      const a = queue[head++];
      if (depth[a] === maxDepth) continue;
      for (let k = start[a]; k < start[a + 1]; k++) {
        const b = neighbours[k];
        if (depth[b] >= 0) continue;
        depth[b] = depth[a] + 1;
        queue[tail++] = b;
      }
    }
    // Collect the pairs root < other, then reset the depths of the atoms reached.
    const found: number[] = [];
    for (let q = 1; q < tail; q++) if (queue[q] > root) found.push(queue[q]);
    found.sort((u, v) => u - v);
    for (const other of found) {
      pairs.push(root, other);
      separation.push(depth[other]);
    }
    for (let q = 0; q < tail; q++) depth[queue[q]] = -1;
  }
  return { pairs: Int32Array.from(pairs), separation: Int32Array.from(separation) };
}

/** A model's compiled `nonbonded` block. */
export interface CompiledNonbonded {
  /** The pair set the kernels read. */
  readonly pairs: NonbondedPairs;
  /** The kinds it reports (`lennard-jones` when given, then `coulomb` when given). */
  readonly kinds: readonly NonbondedKind[];
}

/**
 * Compile `file.nonbonded` (already validated) in the model's own units:
 * exclusions from the connectivity (pairs at most `bondSeparation` bonds
 * apart are left out; with `bondSeparation` 2 the pairs exactly 3 apart are
 * the scaled 1-4 pairs), Lennard-Jones parameters per atom, charges from
 * `atoms[].charge` (default 0) with the prefactor C / dielectric, and the
 * cutoff. Defaults: `bondSeparation` 2, both `scale14` 1, `cutoff` null.
 *
 * @returns null when the block is absent or has neither `lennardJones` nor
 *   `coulomb` (nothing to evaluate).
 */
export function compileNonbonded(file: ModelFile): CompiledNonbonded | null {
  const block = file.nonbonded;
  if (block === undefined || (block.lennardJones === undefined && block.coulomb === undefined)) return null;
  const n = file.atoms.length;
  const bondSeparation = block.exclusions?.bondSeparation ?? MODEL_DEFAULTS.bondSeparation;
  const maxDepth = bondSeparation === 2 ? 3 : bondSeparation;
  const { pairs, separation } = bondSeparations(n, nonbondedConnectivity(file), maxDepth);
  const excluded: number[] = [];
  const scaled: number[] = [];
  for (let m = 0; m < separation.length; m++) {
    const list = separation[m] <= bondSeparation ? excluded : scaled;
    list.push(pairs[2 * m], pairs[2 * m + 1]);
  }
  const lj = block.lennardJones;
  const cq = block.coulomb;
  const kinds: NonbondedKind[] = [];
  if (lj !== undefined) kinds.push('lennard-jones');
  if (cq !== undefined) kinds.push('coulomb');
  const compiled = createNonbondedPairs({
    atomCount: n,
    ...(lj === undefined ? {} : { lennardJones: { rmin: lj.rmin, epsilon: lj.epsilon, combination: lj.combination } }),
    ...(cq === undefined
      ? {}
      : {
          coulomb: {
            charges: file.atoms.map((a) => a.charge ?? 0),
            constant: coulombConstant(file.units) / cq.dielectric,
          },
        }),
    excluded,
    scaled,
    scale14: {
      lennardJones: block.exclusions?.scale14?.lennardJones ?? MODEL_DEFAULTS.scale14,
      coulomb: block.exclusions?.scale14?.coulomb ?? MODEL_DEFAULTS.scale14,
    },
    cutoff: block.cutoff ?? MODEL_DEFAULTS.cutoff,
  });
  return { pairs: compiled, kinds };
}
