/**
 * What topology perception produces from a bond graph: the shared shape that
 * structure readers feed and generic parameter assignment reads.
 *
 * Arrays are flat and 0-based, like term tables: bond `b` joins atoms
 * `bonds[2b]` and `bonds[2b+1]` (always the smaller index first, bonds sorted
 * by that pair); angle `a` is `angles[3a..3a+2]` = i–j–k with the vertex `j`
 * in the middle; torsion `t` is `torsions[4t..4t+3]` = i–j–k–l about the
 * central bond j–k; out-of-plane centre `c` is `impropers[4c..4c+3]` with
 * the trigonal centre FIRST, then its three neighbours.
 * @module
 */

/** Hybridization as the generic force field types it. */
export type Hybridization = 'sp' | 'sp2' | 'sp3' | 'aromatic' | 'none';

/** A molecule's bonded topology, perceived once and read many times. */
export interface Topology {
  /** Number of atoms N. */
  readonly atomCount: number;
  /** Chemical symbols, one per atom (`C`, `Cl`). */
  readonly elements: readonly string[];
  /** Bonded pairs, `2 × B`, smaller index first, sorted. */
  readonly bonds: Int32Array;
  /**
   * Bond orders, one per bond: 1, 2 or 3, or 1.5 for a bond in an aromatic
   * ring (as read from a file, or perceived; see the perception docs).
   */
  readonly bondOrders: Float64Array;
  /** Formal charges in elementary charges, one per atom (0 where unknown). */
  readonly formalCharges: Int32Array;
  /** Neighbours in CSR form: atom a's are `neighbours[neighbourStart[a] .. neighbourStart[a+1]-1]`, ascending. */
  readonly neighbourStart: Int32Array;
  /** See {@link neighbourStart}. */
  readonly neighbours: Int32Array;
  /** Angles i–j–k (vertex in the middle), `3 × A`, each once (i < k). */
  readonly angles: Int32Array;
  /** Proper torsions i–j–k–l, `4 × T`, each once (j < k), none in a 3-ring. */
  readonly torsions: Int32Array;
  /** Out-of-plane centres: `[centre, n1, n2, n3]`, `4 × C`, one per atom with exactly three neighbours. */
  readonly impropers: Int32Array;
  /** Pairs exactly three bonds apart (shortest path), `2 × P`, smaller first, sorted. */
  readonly pairs14: Int32Array;
  /** Smallest set of smallest rings, each an array of atom indices in ring order. */
  readonly rings: readonly Int32Array[];
  /** 1 where the atom is in any ring, else 0. */
  readonly inRing: Uint8Array;
  /** 1 where the atom is aromatic, else 0. */
  readonly aromaticAtoms: Uint8Array;
  /** 1 where the bond (same index as {@link bonds}) is aromatic, else 0. */
  readonly aromaticBonds: Uint8Array;
  /** Each atom's hybridization, from its element, neighbours and bond orders. */
  readonly hybridization: readonly Hybridization[];
}
