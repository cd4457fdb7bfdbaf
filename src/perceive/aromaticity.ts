/**
 * Aromaticity by Hückel's 4n + 2 rule on the smallest rings and on whole
 * fused ring systems.
 *
 * The model (docs/perception.md has the table):
 * - A ring whose bonds all have order 1.5 in the input is aromatic as given.
 * - Otherwise each ring atom gives π electrons from one Kekulé structure:
 *   1 for a double bond (or an order-1.5 bond) to an atom of the same ring
 *   system; 0 for an exocyclic double bond to O, S, Se or N (the C=O of a
 *   pyridone) and for an empty p orbital (C⁺ with three neighbours, neutral
 *   B with three); 2 for a lone pair (neutral N, P or As with three
 *   neighbours and only single bonds, as in pyrrole; neutral O, S, Se or Te
 *   with two, as in furan and thiophene; N⁻ with two; C⁻ with three). Any
 *   other atom (sp3, a triple bond, two double bonds, an exocyclic C=C) is
 *   not sp2-able and the ring cannot be aromatic.
 * - A ring is aromatic when all its atoms are sp2-able, at least one of
 *   them is not a lone-pair donor (a ring of N, O, S with single bonds only
 *   has no π bond), and their electrons sum to 4n + 2. Then, for each fused system (rings sharing bonds) that is
 *   not yet wholly aromatic and whose rings are all sp2-able, the electrons
 *   of all its atoms (each counted once) are summed; 4n + 2 makes every ring
 *   of the system aromatic (azulene: 5 + 7 ring atoms, 10 electrons).
 * An atom or bond is aromatic when it lies in an aromatic ring (the ring's
 * own bonds, not exocyclic ones).
 * @module
 */
import { bondBetween } from './graph.js';
import type { NeighbourLists } from './graph.js';

/** Aromatic flags per atom and per bond. */
export interface AromaticFlags {
  /** 1 where the atom is in an aromatic ring. */
  readonly atoms: Uint8Array;
  /** 1 where the bond is in an aromatic ring. */
  readonly bonds: Uint8Array;
}

const LONE_PAIR_3 = new Set(['N', 'P', 'As']);
const LONE_PAIR_2 = new Set(['O', 'S', 'Se', 'Te']);
const EXOCYCLIC_ACCEPTOR = new Set(['O', 'S', 'Se', 'N']);

/**
 * Aromatic atoms and bonds (the model in the module comment). `orders` are
 * per bond (1, 1.5, 2, 3); `rings` as from the SSSR step. Internal to
 * perceive/. Never throws.
 */
export function findAromatic(
  elements: readonly string[],
  lists: NeighbourLists,
  orders: Float64Array,
  charges: Int32Array,
  rings: readonly Int32Array[],
): AromaticFlags {
  const n = elements.length;
  const atoms = new Uint8Array(n);
  const bonds = new Uint8Array(orders.length);
  if (rings.length === 0) return { atoms, bonds };
  const { start, neighbours, bondOf } = lists;

  // Ring bonds, and ring systems (rings sharing a bond) by union–find.
  const ringBonds = rings.map((ring) => {
    const out = new Int32Array(ring.length);
    for (let p = 0; p < ring.length; p++) out[p] = bondBetween(lists, ring[p], ring[(p + 1) % ring.length]);
    return out;
  });
  const system = rings.map((_, r) => r);
  const find = (r: number): number => {
    while (system[r] !== r) {
      system[r] = system[system[r]];
      r = system[r];
    }
    return r;
  };
  const ringOfBond = new Int32Array(orders.length).fill(-1);
  ringBonds.forEach((list, r) => {
    for (const b of list) {
      if (ringOfBond[b] === -1) ringOfBond[b] = r;
      else system[find(r)] = find(ringOfBond[b]);
    }
  });
  const atomSystem = new Int32Array(n).fill(-1);
  rings.forEach((ring, r) => {
    for (const a of ring) atomSystem[a] = find(r);
  });

  // π electrons of each ring atom, −1 when it cannot be part of an aromatic ring.
  const electrons = new Int32Array(n).fill(-1);
  for (let a = 0; a < n; a++) {
    if (atomSystem[a] === -1) continue;
    let doubles = 0;
    let partner = -1;
    let partial = false;
    let triple = false;
    for (let s = start[a]; s < start[a + 1]; s++) {
      const o = orders[bondOf[s]];
      if (o === 2) {
        doubles++;
        partner = neighbours[s];
      } else if (o === 3) triple = true;
      else if (o === 1.5) partial = true;
    }
    const e = elements[a];
    const q = charges[a];
    const d = start[a + 1] - start[a];
    let count = -1;
    if (triple || doubles > 1) count = -1;
    else if (doubles === 1) {
      if (atomSystem[partner] === atomSystem[a]) count = 1;
      else if (EXOCYCLIC_ACCEPTOR.has(elements[partner])) count = 0;
    } else if (partial) count = 1;
    else if (LONE_PAIR_3.has(e)) count = (q === 0 && d === 3) || (q === -1 && d === 2) ? 2 : -1;
    else if (LONE_PAIR_2.has(e)) count = q === 0 && d === 2 ? 2 : -1;
    else if (e === 'C' && d === 3) count = q === -1 ? 2 : q === 1 ? 0 : -1;
    else if (e === 'B' && d === 3 && q === 0) count = 0;
    electrons[a] = count;
  }

  // −1 when an atom is not sp2-able; −2 when every atom only gives a lone pair
  // (a saturated ring of N, O or S, such as a cyclic trisulfide: no π bond at all).
  const ringSum = (ring: Int32Array): number => {
    let sum = 0;
    let pi = false;
    for (const a of ring) {
      if (electrons[a] < 0) return -1;
      if (electrons[a] !== 2) pi = true;
      sum += electrons[a];
    }
    return pi ? sum : -2;
  };
  const aromaticRing = new Uint8Array(rings.length);
  rings.forEach((ring, r) => {
    let allPartial = true;
    for (const b of ringBonds[r]) if (orders[b] !== 1.5) allPartial = false;
    const sum = ringSum(ring);
    if (allPartial || (sum >= 2 && sum % 4 === 2)) aromaticRing[r] = 1;
  });

  // Whole fused systems.
  const members = new Map<number, number[]>();
  rings.forEach((_, r) => {
    const root = find(r);
    const list = members.get(root);
    if (list === undefined) members.set(root, [r]);
    else list.push(r);
  });
  const counted = new Uint8Array(n);
  for (const list of members.values()) {
    if (list.length < 2 || list.every((r) => aromaticRing[r] === 1)) continue;
    if (list.some((r) => ringSum(rings[r]) === -1)) continue;
    let sum = 0;
    for (const r of list) {
      for (const a of rings[r]) {
        if (counted[a]) continue;
        counted[a] = 1;
        sum += electrons[a];
      }
    }
    for (const r of list) for (const a of rings[r]) counted[a] = 0;
    if (sum >= 2 && sum % 4 === 2) for (const r of list) aromaticRing[r] = 1;
  }

  rings.forEach((ring, r) => {
    if (!aromaticRing[r]) return;
    for (const a of ring) atoms[a] = 1;
    for (const b of ringBonds[r]) bonds[b] = 1;
  });
  return { atoms, bonds };
}
