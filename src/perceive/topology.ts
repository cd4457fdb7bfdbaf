/**
 * Topology perception: from elements and bonds (and, optionally, bond
 * orders, formal charges and coordinates) to the full {@link Topology} —
 * neighbours, angles, torsions, out-of-plane centres, 1-4 pairs, rings,
 * aromaticity and hybridization. Everything is linear in the number of
 * atoms for bounded valence, except ring perception inside large fused
 * blocks (see `rings.ts`).
 * @module
 */
import { ModelError } from '../errors.js';
import { findAromatic } from './aromaticity.js';
import { checkCharges, checkElements, kekuleOrders } from './bond-orders.js';
import { bondBetween, canonicalBonds, checkCoordinates, neighbourLists } from './graph.js';
import type { NeighbourLists } from './graph.js';
import { assignHybridization } from './hybridization.js';
import { smallestRings } from './rings.js';
import type { Topology } from './types.js';

/** What {@link perceiveTopology} reads. */
export interface TopologyInput {
  /** Chemical symbols, one per atom (case-sensitive). N = `elements.length`. */
  readonly elements: readonly string[];
  /** Bonded pairs, `2 × B` atom indices, in any order, each pair once. */
  readonly bonds: Int32Array;
  /**
   * One order per bond of `bonds` (1, 1.5, 2 or 3), or null/absent to
   * perceive them from valence and `coordinates` (all single when there are
   * no coordinates either).
   */
  readonly bondOrders?: Float64Array | null;
  /** Formal charges, one per atom; null/absent means all 0. */
  readonly formalCharges?: Int32Array | null;
  /** Flat `[x0, y0, z0, …]` in Å, or null/absent; only used to perceive bond orders. */
  readonly coordinates?: Float64Array | null;
}

const ORDERS = new Set([1, 1.5, 2, 3]);

/**
 * Perceives the topology of a bond graph.
 *
 * Bonds in the result are in canonical order (smaller index first, sorted);
 * their orders, given or perceived, follow them. Where orders are perceived
 * (one Kekulé structure) and where they are given as 1/2/3, bonds of
 * aromatic rings get order 1.5 in the result.
 *
 * @throws ModelError at the first bad input: `atoms[3]: expected an element
 *   symbol, got 7`; `bonds[3]: index 40 is out of range (molecule has 31
 *   atoms)`; `bonds[3]: atom 5 is bonded to itself`; `bonds[5]: atoms 1 and
 *   4 are already bonded by bonds[2]`; `bondOrders: expected 12 orders (one
 *   per bond), got 11`; `bondOrders[4]: expected 1, 1.5, 2 or 3, got 2.5`;
 *   `formalCharges: expected 31 charges (one per atom), got 30`;
 *   `coordinates: expected 3N = 93 numbers, got 90`.
 */
export function perceiveTopology(input: TopologyInput): Topology {
  if (input === null || typeof input !== 'object') throw new ModelError('', 'expected a topology input object');
  const { elements } = input;
  checkElements(elements);
  const n = elements.length;
  const canonical = canonicalBonds(input.bonds, n);
  const bonds = canonical.unchanged ? canonical.bonds.slice() : canonical.bonds;
  const bondCount = bonds.length >> 1;

  // A copy: the topology never shares the caller's arrays.
  const charges = checkCharges(input.formalCharges, n).slice();
  const coordinates = input.coordinates ?? null;
  if (coordinates !== null) checkCoordinates(coordinates, n);

  const lists = neighbourLists(n, bonds);
  let orders: Float64Array;
  if (input.bondOrders === null || input.bondOrders === undefined) {
    orders = coordinates !== null
      ? kekuleOrders(elements, bonds, lists, coordinates, charges)
      : new Float64Array(bondCount).fill(1);
  } else {
    const given = input.bondOrders;
    if (!(given instanceof Float64Array)) throw new ModelError('bondOrders', 'expected a Float64Array, one per bond');
    if (given.length !== bondCount) {
      throw new ModelError('bondOrders', `expected ${bondCount} orders (one per bond), got ${given.length}`);
    }
    for (let b = 0; b < bondCount; b++) {
      if (!ORDERS.has(given[b])) throw new ModelError(`bondOrders[${b}]`, `expected 1, 1.5, 2 or 3, got ${given[b]}`);
    }
    orders = new Float64Array(bondCount);
    for (let s = 0; s < bondCount; s++) orders[s] = given[canonical.order[s]];
  }

  const rings = smallestRings(n, bonds, lists);
  const inRing = new Uint8Array(n);
  for (const ring of rings) for (const a of ring) inRing[a] = 1;
  const aromatic = findAromatic(elements, lists, orders, charges, rings);
  for (let b = 0; b < bondCount; b++) if (aromatic.bonds[b]) orders[b] = 1.5;
  const hybridization = assignHybridization(elements, lists, orders, charges, aromatic.atoms, aromatic.bonds);

  return {
    atomCount: n,
    elements: elements.slice(),
    bonds,
    bondOrders: orders,
    formalCharges: charges,
    neighbourStart: lists.start,
    neighbours: lists.neighbours,
    angles: listAngles(n, lists),
    torsions: listTorsions(bonds, lists),
    impropers: listImpropers(n, lists),
    pairs14: listPairs14(n, bonds, lists),
    rings,
    inRing,
    aromaticAtoms: aromatic.atoms,
    aromaticBonds: aromatic.bonds,
    hybridization,
  };
}

/** Angles i–j–k, vertex j ascending, then i < k ascending. */
function listAngles(n: number, lists: NeighbourLists): Int32Array {
  const { start, neighbours } = lists;
  let count = 0;
  for (let j = 0; j < n; j++) {
    const d = start[j + 1] - start[j];
    count += (d * (d - 1)) / 2;
  }
  const out = new Int32Array(3 * count);
  let w = 0;
  for (let j = 0; j < n; j++) {
    for (let p = start[j]; p < start[j + 1]; p++) {
      for (let q = p + 1; q < start[j + 1]; q++) {
        out[w++] = neighbours[p];
        out[w++] = j;
        out[w++] = neighbours[q];
      }
    }
  }
  return out;
}

/** Torsions i–j–k–l about each bond j–k (j < k, bond order), i ≠ l. */
function listTorsions(bonds: Int32Array, lists: NeighbourLists): Int32Array {
  const { start, neighbours } = lists;
  const bondCount = bonds.length >> 1;
  let count = 0;
  for (let b = 0; b < bondCount; b++) {
    const j = bonds[2 * b];
    const k = bonds[2 * b + 1];
    for (let p = start[j]; p < start[j + 1]; p++) {
      const i = neighbours[p];
      if (i === k) continue;
      for (let q = start[k]; q < start[k + 1]; q++) {
        const l = neighbours[q];
        if (l !== j && l !== i) count++;
      }
    }
  }
  const out = new Int32Array(4 * count);
  let w = 0;
  for (let b = 0; b < bondCount; b++) {
    const j = bonds[2 * b];
    const k = bonds[2 * b + 1];
    for (let p = start[j]; p < start[j + 1]; p++) {
      const i = neighbours[p];
      if (i === k) continue;
      for (let q = start[k]; q < start[k + 1]; q++) {
        const l = neighbours[q];
        if (l === j || l === i) continue;
        out[w++] = i;
        out[w++] = j;
        out[w++] = k;
        out[w++] = l;
      }
    }
  }
  return out;
}

/** One out-of-plane entry per atom with exactly three neighbours: centre, then its neighbours ascending. */
function listImpropers(n: number, lists: NeighbourLists): Int32Array {
  const { start, neighbours } = lists;
  let count = 0;
  for (let a = 0; a < n; a++) if (start[a + 1] - start[a] === 3) count++;
  const out = new Int32Array(4 * count);
  let w = 0;
  for (let a = 0; a < n; a++) {
    if (start[a + 1] - start[a] !== 3) continue;
    out[w++] = a;
    out[w++] = neighbours[start[a]];
    out[w++] = neighbours[start[a] + 1];
    out[w++] = neighbours[start[a] + 2];
  }
  return out;
}

/**
 * Pairs whose shortest path is exactly three bonds: ends of torsions that
 * are neither bonded nor share a neighbour, each pair once, smaller first,
 * sorted.
 */
function listPairs14(n: number, bonds: Int32Array, lists: NeighbourLists): Int32Array {
  const { start, neighbours } = lists;
  const bondCount = bonds.length >> 1;
  const sharesNeighbour = (i: number, l: number): boolean => {
    let p = start[i];
    let q = start[l];
    while (p < start[i + 1] && q < start[l + 1]) {
      if (neighbours[p] === neighbours[q]) return true;
      if (neighbours[p] < neighbours[q]) p++;
      else q++;
    }
    return false;
  };
  // Candidates (smaller, larger), grouped by the smaller atom by counting sort,
  // then sorted and de-duplicated within each group.
  let cap = 0;
  for (let b = 0; b < bondCount; b++) {
    const dj = start[bonds[2 * b] + 1] - start[bonds[2 * b]];
    const dk = start[bonds[2 * b + 1] + 1] - start[bonds[2 * b + 1]];
    cap += (dj - 1) * (dk - 1);
  }
  const first = new Int32Array(cap);
  const second = new Int32Array(cap);
  let m = 0;
  for (let b = 0; b < bondCount; b++) {
    const j = bonds[2 * b];
    const k = bonds[2 * b + 1];
    for (let p = start[j]; p < start[j + 1]; p++) {
      const i = neighbours[p];
      if (i === k) continue;
      for (let q = start[k]; q < start[k + 1]; q++) {
        const l = neighbours[q];
        if (l === j || l === i) continue;
        if (bondBetween(lists, i, l) !== -1 || sharesNeighbour(i, l)) continue;
        first[m] = i < l ? i : l;
        second[m++] = i < l ? l : i;
      }
    }
  }
  const groupStart = new Int32Array(n + 1);
  for (let t = 0; t < m; t++) groupStart[first[t] + 1]++;
  for (let a = 0; a < n; a++) groupStart[a + 1] += groupStart[a];
  const fill = groupStart.slice(0, n);
  const grouped = new Int32Array(m);
  for (let t = 0; t < m; t++) grouped[fill[first[t]]++] = second[t];
  const out = new Int32Array(2 * m);
  let w = 0;
  for (let a = 0; a < n; a++) {
    const g0 = groupStart[a];
    const g1 = groupStart[a + 1];
    for (let p = g0 + 1; p < g1; p++) {
      const v = grouped[p];
      let q = p - 1;
      while (q >= g0 && grouped[q] > v) {
        grouped[q + 1] = grouped[q];
        q--;
      }
      grouped[q + 1] = v;
    }
    for (let p = g0; p < g1; p++) {
      if (p > g0 && grouped[p] === grouped[p - 1]) continue;
      out[w++] = a;
      out[w++] = grouped[p];
    }
  }
  return out.slice(0, w);
}
