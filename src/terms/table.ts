/**
 * Term tables: the flat, struct-of-arrays form every kernel reads.
 *
 * A table holds `count` terms of one kind. Term `t` acts on the atoms
 * `atoms[t*arity .. t*arity+arity-1]` (0-based atom indices into the flat
 * coordinate array, so atom `a` is at `x[3a], x[3a+1], x[3a+2]`) and has the
 * parameters `params[t*width .. t*width+width-1]`, already converted to the
 * kernel's internal form (angles in radians; see each kind's layout in
 * {@link KIND_LAYOUTS}). Kernels are unit-free: energies come out in the
 * units the parameters and coordinates are in.
 * @module
 */

/**
 * The bonded term kinds: the ten of model-file version 1, then the
 * extensions documented in docs/model-file.md (`cosine-series-angle`,
 * `periodic-angle`, `inversion`).
 */
export type TermKind =
  | 'harmonic-bond'
  | 'morse-bond'
  | 'harmonic-angle'
  | 'cosine-angle'
  | 'urey-bradley'
  | 'periodic-dihedral'
  | 'ryckaert-bellemans'
  | 'harmonic-improper'
  | 'position-restraint'
  | 'distance-restraint'
  | 'cosine-series-angle'
  | 'periodic-angle'
  | 'inversion';

/** Every term kind, in the order energies are summed and reported. */
export const TERM_KINDS: readonly TermKind[] = [
  'harmonic-bond',
  'morse-bond',
  'harmonic-angle',
  'cosine-angle',
  'urey-bradley',
  'periodic-dihedral',
  'ryckaert-bellemans',
  'harmonic-improper',
  'position-restraint',
  'distance-restraint',
  'cosine-series-angle',
  'periodic-angle',
  'inversion',
];

/** Atoms per term and the internal parameter columns of one kind. */
export interface KindLayout {
  /** Atoms per term. */
  readonly arity: number;
  /** Names of the internal parameter columns, in order (`width` = length). */
  readonly columns: readonly string[];
}

/**
 * Internal parameter layout of each kind. Angles are radians here (the model
 * file gives degrees), or their cosine and sine where the kernel needs only
 * those; everything else is as in the file.
 *
 * - `harmonic-bond` `[k, r0]`: E = ½ k (r − r0)²
 * - `morse-bond` `[D, a, r0]`: E = D [1 − exp(−a (r − r0))]²
 * - `harmonic-angle` `[k, theta0]`: E = ½ k (θ − θ0)²
 * - `cosine-angle` `[k, cosTheta0]`: E = ½ k (cos θ − cos θ0)²
 * - `urey-bradley` `[k, s0]`: E = ½ k (|x_k − x_i| − s0)² (middle atom unused)
 * - `periodic-dihedral` `[k, n, cosPhase, sinPhase]`: E = k [1 + cos(n φ − phase)]
 *   (the phase kept as its cosine and sine, so the kernel needs no trigonometry)
 * - `ryckaert-bellemans` `[c0..c5]`: E = Σ_m c_m cos^m(φ − π)
 * - `harmonic-improper` `[k, xi0]`: E = ½ k Δ², Δ = φ − ξ0 wrapped into [−π, π)
 * - `position-restraint` `[k, x0, y0, z0, flat]`: E = ½ k max(0, |x_i − x0| − flat)²
 * - `distance-restraint` `[k, lower, upper]`: E = ½ k (lower − r)² below, ½ k (r − upper)² above, 0 between
 * - `cosine-series-angle` [c0, c1, c2] (energies): E = c0 + c1 cos θ + c2 cos 2θ
 *   (the file's k and θ0 become c_m = k C_m, see `writeParameters`)
 * - `periodic-angle` [a, n, sign] : E = a [1 − sign · cos(n θ)], a = k/n², sign = cos(n θ0) = ±1
 * - `inversion` [c0, c1, c2] (energies), atoms [centre, a, b, c]:
 *   E = ⅓ Σ over the three choices of the out-of-plane neighbour of c0 + c1 cos ω + c2 cos 2ω
 */
export const KIND_LAYOUTS: Readonly<Record<TermKind, KindLayout>> = {
  'harmonic-bond': { arity: 2, columns: ['k', 'r0'] },
  'morse-bond': { arity: 2, columns: ['D', 'a', 'r0'] },
  'harmonic-angle': { arity: 3, columns: ['k', 'theta0'] },
  'cosine-angle': { arity: 3, columns: ['k', 'cosTheta0'] },
  'urey-bradley': { arity: 3, columns: ['k', 's0'] },
  'periodic-dihedral': { arity: 4, columns: ['k', 'n', 'cosPhase', 'sinPhase'] },
  'ryckaert-bellemans': { arity: 4, columns: ['c0', 'c1', 'c2', 'c3', 'c4', 'c5'] },
  'harmonic-improper': { arity: 4, columns: ['k', 'xi0'] },
  'position-restraint': { arity: 1, columns: ['k', 'x0', 'y0', 'z0', 'flat'] },
  'distance-restraint': { arity: 2, columns: ['k', 'lower', 'upper'] },
  'cosine-series-angle': { arity: 3, columns: ['c0', 'c1', 'c2'] },
  'periodic-angle': { arity: 3, columns: ['a', 'n', 'sign'] },
  inversion: { arity: 4, columns: ['c0', 'c1', 'c2'] },
};

/** A table of `count` terms of one kind, in flat arrays. */
export interface TermTable {
  /** Which kind of term every row is. */
  readonly kind: TermKind;
  /** Number of terms (rows). */
  readonly count: number;
  /** Atoms per term. */
  readonly arity: number;
  /** Parameters per term. */
  readonly width: number;
  /** Atom indices, `arity × count`, row-major. */
  readonly atoms: Int32Array;
  /** Internal parameters, `width × count`, row-major (see {@link KIND_LAYOUTS}). */
  readonly params: Float64Array;
}

/**
 * Make an empty (zero-filled) table for `count` terms of `kind`; fill its
 * `atoms` and `params` yourself, in the layout of {@link KIND_LAYOUTS}.
 */
export function createTable(kind: TermKind, count: number): TermTable {
  const { arity, columns } = KIND_LAYOUTS[kind];
  return {
    kind,
    count,
    arity,
    width: columns.length,
    atoms: new Int32Array(arity * count),
    params: new Float64Array(columns.length * count),
  };
}

/**
 * A kernel: adds the energy of every term of `table` at coordinates `x`
 * (flat, 3N) and returns their sum. When `gradient` is given (flat, 3N), each
 * term's dE/dx is *added* into it (it is not cleared). When `energies` is
 * given (length ≥ `table.count`), term `t`'s energy is written to
 * `energies[t]`. Never allocates, never throws; at truly undefined directions
 * (coincident or exactly collinear atoms) the term's gradient is zero.
 */
export type Kernel = (
  x: Float64Array,
  table: TermTable,
  gradient?: Float64Array,
  energies?: Float64Array,
) => number;
