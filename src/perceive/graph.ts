/**
 * Small graph helpers shared by the perception steps: the neighbour lists
 * in CSR form and the boundary checks of coordinates. Internal to
 * `perceive/`.
 * @module
 */
import { ModelError } from '../errors.js';

/** Neighbours in CSR form, with the bond index of each neighbour slot. */
export interface NeighbourLists {
  /** Atom a's neighbours are `neighbours[start[a] .. start[a+1]-1]`, ascending. */
  readonly start: Int32Array;
  /** Neighbour atom of each slot. */
  readonly neighbours: Int32Array;
  /** Bond index of each slot (the bond joining the atom and that neighbour). */
  readonly bondOf: Int32Array;
}

/**
 * CSR neighbour lists of `atomCount` atoms from sorted, valid bonds
 * (`2 × B`, smaller index first, sorted by pair). Because the bonds are
 * sorted, each atom's neighbours come out ascending. Never throws.
 */
export function neighbourLists(atomCount: number, bonds: Int32Array): NeighbourLists {
  const bondCount = bonds.length >> 1;
  const start = new Int32Array(atomCount + 1);
  for (let c = 0; c < 2 * bondCount; c++) start[bonds[c] + 1]++;
  for (let a = 0; a < atomCount; a++) start[a + 1] += start[a];
  const fill = start.slice(0, atomCount);
  const neighbours = new Int32Array(2 * bondCount);
  const bondOf = new Int32Array(2 * bondCount);
  // Pass 1: each atom's smaller neighbours (bonds where it is second), in bond order = ascending i.
  for (let b = 0; b < bondCount; b++) {
    const i = bonds[2 * b];
    const j = bonds[2 * b + 1];
    neighbours[fill[j]] = i;
    bondOf[fill[j]++] = b;
  }
  // Pass 2: each atom's larger neighbours (bonds where it is first), ascending j within i.
  for (let b = 0; b < bondCount; b++) {
    const i = bonds[2 * b];
    const j = bonds[2 * b + 1];
    neighbours[fill[i]] = j;
    bondOf[fill[i]++] = b;
  }
  return { start, neighbours, bondOf };
}

/**
 * Checks that `coordinates` holds 3N finite numbers for `atomCount` atoms.
 * @throws ModelError `coordinates: expected 3N = 93 numbers, got 90`, or
 *   `coordinates[14]: not a finite number (NaN)`.
 */
export function checkCoordinates(coordinates: Float64Array, atomCount: number): void {
  if (!(coordinates instanceof Float64Array)) {
    throw new ModelError('coordinates', 'expected a Float64Array [x0, y0, z0, x1, ...]');
  }
  if (coordinates.length !== 3 * atomCount) {
    throw new ModelError('coordinates', `expected 3N = ${3 * atomCount} numbers, got ${coordinates.length}`);
  }
  for (let c = 0; c < coordinates.length; c++) {
    if (!Number.isFinite(coordinates[c])) {
      throw new ModelError(`coordinates[${c}]`, `not a finite number (${coordinates[c]})`);
    }
  }
}

/** Distance in Å between atoms i and j. Never throws. */
export function atomDistance(x: Float64Array, i: number, j: number): number {
  const dx = x[3 * j] - x[3 * i];
  const dy = x[3 * j + 1] - x[3 * i + 1];
  const dz = x[3 * j + 2] - x[3 * i + 2];
  return Math.sqrt(dx * dx + dy * dy + dz * dz);
}

/** Bonds checked and put in canonical order. */
export interface CanonicalBonds {
  /** `2 × B`, smaller index first, sorted by pair. */
  readonly bonds: Int32Array;
  /** `order[s]` = index in the input of the bond now at sorted position `s`. */
  readonly order: Int32Array;
  /** Whether the input was already canonical (then `bonds` is the input itself). */
  readonly unchanged: boolean;
}

/**
 * Checks a bond list against `atomCount` atoms and returns it in canonical
 * order (each pair smaller index first, pairs sorted), in linear time.
 * Places in errors are bond numbers: `bonds[3]` is the pair
 * `bonds[6], bonds[7]` of the flat array.
 * @throws ModelError `bonds: expected an Int32Array of 2 × B atom indices`,
 *   `bonds: expected an even number of indices (2 per bond), got 7`,
 *   `bonds[3]: index 40 is out of range (molecule has 31 atoms)`,
 *   `bonds[3]: atom 5 is bonded to itself`,
 *   `bonds[5]: atoms 1 and 4 are already bonded by bonds[2]`.
 */
export function canonicalBonds(bonds: Int32Array, atomCount: number): CanonicalBonds {
  if (!(bonds instanceof Int32Array)) throw new ModelError('bonds', 'expected an Int32Array of 2 × B atom indices');
  if (bonds.length % 2 !== 0) {
    throw new ModelError('bonds', `expected an even number of indices (2 per bond), got ${bonds.length}`);
  }
  const bondCount = bonds.length >> 1;
  let canonical = true;
  for (let b = 0; b < bondCount; b++) {
    const i = bonds[2 * b];
    const j = bonds[2 * b + 1];
    const bad = i < 0 || i >= atomCount ? i : j < 0 || j >= atomCount ? j : null;
    if (bad !== null) throw new ModelError(`bonds[${b}]`, `index ${bad} is out of range (molecule has ${atomCount} atoms)`);
    if (i === j) throw new ModelError(`bonds[${b}]`, `atom ${i} is bonded to itself`);
    if (canonical && (i > j || (b > 0 && (bonds[2 * b - 2] > i || (bonds[2 * b - 2] === i && bonds[2 * b - 1] >= j))))) {
      canonical = false;
    }
  }
  const order = new Int32Array(bondCount);
  if (canonical) {
    for (let b = 0; b < bondCount; b++) order[b] = b;
    return { bonds, order, unchanged: true };
  }
  // Counting sort by the smaller index, then insertion sort by the larger within each group.
  const start = new Int32Array(atomCount + 1);
  for (let b = 0; b < bondCount; b++) start[Math.min(bonds[2 * b], bonds[2 * b + 1]) + 1]++;
  for (let a = 0; a < atomCount; a++) start[a + 1] += start[a];
  const fill = start.slice(0, atomCount);
  for (let b = 0; b < bondCount; b++) order[fill[Math.min(bonds[2 * b], bonds[2 * b + 1])]++] = b;
  const larger = (b: number): number => Math.max(bonds[2 * b], bonds[2 * b + 1]);
  for (let a = 0; a < atomCount; a++) {
    for (let p = start[a] + 1; p < start[a + 1]; p++) {
      const v = order[p];
      let q = p - 1;
      while (q >= start[a] && (larger(order[q]) > larger(v) || (larger(order[q]) === larger(v) && order[q] > v))) {
        order[q + 1] = order[q];
        q--;
      }
      order[q + 1] = v;
    }
  }
  const sorted = new Int32Array(2 * bondCount);
  for (let s = 0; s < bondCount; s++) {
    const b = order[s];
    sorted[2 * s] = Math.min(bonds[2 * b], bonds[2 * b + 1]);
    sorted[2 * s + 1] = larger(b);
  }
  checkDuplicates(sorted, order);
  return { bonds: sorted, order, unchanged: false };
}

function checkDuplicates(sorted: Int32Array, order: Int32Array): void {
  for (let s = 1; s < order.length; s++) {
    if (sorted[2 * s] === sorted[2 * s - 2] && sorted[2 * s + 1] === sorted[2 * s - 1]) {
      // Equal pairs are adjacent and ordered by input index: s−1 came first.
      throw new ModelError(
        `bonds[${order[s]}]`,
        `atoms ${sorted[2 * s]} and ${sorted[2 * s + 1]} are already bonded by bonds[${order[s - 1]}]`,
      );
    }
  }
}

/** The bond joining atoms a and b (binary search in a's ascending list), or −1. Never throws. */
export function bondBetween(lists: NeighbourLists, a: number, b: number): number {
  let lo = lists.start[a];
  let hi = lists.start[a + 1] - 1;
  while (lo <= hi) {
    const mid = (lo + hi) >> 1;
    const v = lists.neighbours[mid];
    if (v === b) return lists.bondOf[mid];
    if (v < b) lo = mid + 1;
    else hi = mid - 1;
  }
  return -1;
}
