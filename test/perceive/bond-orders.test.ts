/**
 * Bond orders from valence and geometry (src/perceive/bond-orders.ts).
 * Expected orders are the textbook Lewis structures (common practice);
 * geometries from molecules.ts (from memory of CCCBDB experimental).
 */
import { describe, expect, it } from 'vitest';
import { maximumMatching, perceiveBondOrders } from '../../src/perceive/bond-orders.js';
import { createRandom } from '../helpers/random.js';
import { perceiveBonds } from '../../src/perceive/bonds.js';
import * as M from './molecules.js';
import type { Molecule } from './molecules.js';

const ordersOf = (m: Molecule): number[] => Array.from(perceiveBondOrders(m.elements, m.bonds, m.coordinates));

/** Each atom's sum of (order − 1) over its bonds. */
function extraPerAtom(n: number, bonds: Int32Array, orders: ArrayLike<number>): number[] {
  const out = new Array<number>(n).fill(0);
  for (let b = 0; b < orders.length; b++) {
    out[bonds[2 * b]] += orders[b] - 1;
    out[bonds[2 * b + 1]] += orders[b] - 1;
  }
  return out;
}

describe('perceiveBondOrders', () => {
  for (const make of [M.water, M.ethane, M.ethylene, M.acetylene, M.carbonDioxide, M.acetone, M.acetonitrile, M.cyclopropane, M.cubane]) {
    const m = make();
    it(`gives the Lewis structure of ${m.name} (orders as drawn)`, () => {
      expect(ordersOf(m)).toEqual(Array.from(m.orders));
    });
  }

  it('acetylene 3, CO₂ 2 and 2, acetonitrile C≡N 3, acetone C=O 2 (common practice)', () => {
    expect(ordersOf(M.acetylene())[0]).toBe(3);
    expect(ordersOf(M.carbonDioxide())).toEqual([2, 2]);
    expect(ordersOf(M.acetonitrile())[1]).toBe(3);
    const acetone = ordersOf(M.acetone());
    expect(acetone[0]).toBe(2);
    expect(acetone.slice(1).every((o) => o === 1)).toBe(true);
  });

  for (const make of [M.benzene, M.pyridine, M.naphthalene]) {
    const m = make();
    it(`gives ${m.name} a Kekulé structure: every ring carbon/nitrogen has exactly one double bond`, () => {
      const orders = ordersOf(m);
      const extra = extraPerAtom(m.elements.length, m.bonds, orders);
      m.elements.forEach((e, a) => expect(extra[a]).toBe(e === 'H' ? 0 : 1));
      expect(orders.every((o) => o === 1 || o === 2)).toBe(true);
    });
  }

  it('benzene without hydrogens still gets three alternating double bonds (geometry caps the missing valence)', () => {
    const m = M.benzene(false);
    const orders = ordersOf(m);
    expect(orders.filter((o) => o === 2).length).toBe(3);
    expect(extraPerAtom(6, m.bonds, orders)).toEqual([1, 1, 1, 1, 1, 1]);
  });

  for (const make of [M.pyrrole, M.furan, M.thiophene]) {
    const m = make();
    it(`gives ${m.name} its two C=C double bonds, heteroatom single`, () => {
      expect(ordersOf(m)).toEqual(Array.from(m.orders));
    });
  }

  it('an alkane with its hydrogens stripped stays all single (C–C 1.53 Å is too long for a double bond)', () => {
    const m = M.alkane(6);
    const heavy = m.elements.map((e, a) => (e === 'C' ? a : -1)).filter((a) => a >= 0);
    const x = Float64Array.from(heavy.flatMap((a) => Array.from(m.coordinates.subarray(3 * a, 3 * a + 3))));
    const bonds = perceiveBonds(heavy.map(() => 'C'), x);
    expect(Array.from(perceiveBondOrders(heavy.map(() => 'C'), bonds, x))).toEqual([1, 1, 1, 1, 1]);
  });

  it('returns orders in the order the bonds were given (bonds reversed and shuffled)', () => {
    const m = M.acetone();
    const pairs: [number, number, number][] = [];
    for (let b = 0; b < m.orders.length; b++) pairs.push([m.bonds[2 * b + 1], m.bonds[2 * b], m.orders[b]]);
    pairs.reverse();
    const bonds = Int32Array.from(pairs.flatMap(([i, j]) => [i, j]));
    expect(Array.from(perceiveBondOrders(m.elements, bonds, m.coordinates))).toEqual(pairs.map(([, , o]) => o));
  });

  describe('valence alone (no coordinates), every hydrogen present', () => {
    const g = (symbols: string[], edges: [number, number][], charges?: number[]) => {
      const bonds = Int32Array.from(edges.flat());
      return Array.from(perceiveBondOrders(symbols, bonds, null, charges ? Int32Array.from(charges) : undefined));
    };
    it('dimethyl sulfone: both S=O double (S valence 6)', () => {
      // S0, O1, O2, C3, C4 + 6 H
      const symbols = ['S', 'O', 'O', 'C', 'C', 'H', 'H', 'H', 'H', 'H', 'H'];
      const edges: [number, number][] = [[0, 1], [0, 2], [0, 3], [0, 4], [3, 5], [3, 6], [3, 7], [4, 8], [4, 9], [4, 10]];
      expect(g(symbols, edges).slice(0, 4)).toEqual([2, 2, 1, 1]);
    });
    it('dimethyl sulfoxide: one S=O (S valence 4)', () => {
      const symbols = ['S', 'O', 'C', 'C', 'H', 'H', 'H', 'H', 'H', 'H'];
      const edges: [number, number][] = [[0, 1], [0, 2], [0, 3], [2, 4], [2, 5], [2, 6], [3, 7], [3, 8], [3, 9]];
      expect(g(symbols, edges).slice(0, 3)).toEqual([2, 1, 1]);
    });
    it('phosphoric acid: one P=O (P valence 5)', () => {
      const symbols = ['P', 'O', 'O', 'O', 'O', 'H', 'H', 'H'];
      const edges: [number, number][] = [[0, 1], [0, 2], [0, 3], [0, 4], [2, 5], [3, 6], [4, 7]];
      expect(g(symbols, edges).slice(0, 4)).toEqual([2, 1, 1, 1]);
    });
    it('nitromethane without charges: one N=O, one N–O (read as nitro)', () => {
      const symbols = ['N', 'O', 'O', 'C', 'H', 'H', 'H'];
      const edges: [number, number][] = [[0, 1], [0, 2], [0, 3], [3, 4], [3, 5], [3, 6]];
      const orders = g(symbols, edges);
      expect([orders[0], orders[1]].sort()).toEqual([1, 2]);
    });
    it('nitromethane with its charges (N⁺, O⁻): the neutral O gets the double bond', () => {
      const symbols = ['N', 'O', 'O', 'C', 'H', 'H', 'H'];
      const edges: [number, number][] = [[0, 1], [0, 2], [0, 3], [3, 4], [3, 5], [3, 6]];
      expect(g(symbols, edges, [1, -1, 0, 0, 0, 0, 0]).slice(0, 3)).toEqual([1, 2, 1]);
    });
    it('ammonium and hydroxide with their charges stay single; formaldehyde gets C=O', () => {
      expect(g(['N', 'H', 'H', 'H', 'H'], [[0, 1], [0, 2], [0, 3], [0, 4]], [1, 0, 0, 0, 0])).toEqual([1, 1, 1, 1]);
      expect(g(['C', 'O', 'H', 'H'], [[0, 1], [0, 2], [0, 3]])).toEqual([2, 1, 1]);
    });
    it('carboxylate given as C(O)(O) without charges: one C=O', () => {
      const orders = g(['C', 'O', 'O', 'H'], [[0, 1], [0, 2], [0, 3]]);
      expect(orders.filter((o) => o === 2).length).toBe(1);
    });
    it('an odd ring of sp2 atoms (cyclopentadienyl without charge) leaves one atom unmatched, never a wrong valence', () => {
      const symbols = ['C', 'C', 'C', 'C', 'C', 'H', 'H', 'H', 'H', 'H'];
      const edges: [number, number][] = [[0, 1], [1, 2], [2, 3], [3, 4], [4, 0], [0, 5], [1, 6], [2, 7], [3, 8], [4, 9]];
      const orders = g(symbols, edges);
      expect(orders.filter((o) => o === 2).length).toBe(2);
      const extra = extraPerAtom(10, Int32Array.from(edges.flat()), orders);
      expect(Math.max(...extra)).toBe(1);
    });
    it('an augmenting path is needed: a greedy choice in a fused system is repaired (azulene-like 5–7 system matched fully)', () => {
      // Azulene C10H8 as a graph: 7-ring 0..6, 5-ring 0,6,7,8,9 (bond 0–6 shared).
      const edges: [number, number][] = [[0, 1], [1, 2], [2, 3], [3, 4], [4, 5], [5, 6], [6, 0], [6, 7], [7, 8], [8, 9], [9, 0]];
      const symbols = Array(10).fill('C');
      for (const a of [1, 2, 3, 4, 5, 7, 8, 9]) {
        symbols.push('H');
        edges.push([a, symbols.length - 1]);
      }
      const orders = g(symbols, edges);
      expect(extraPerAtom(symbols.length, Int32Array.from(edges.flat()), orders).slice(0, 10)).toEqual(Array(10).fill(1));
    });
  });

  it('refuses bad input with exact messages', () => {
    const m = M.water();
    expect(() => perceiveBondOrders(m.elements, Int32Array.of(0, 1, 0, 7), m.coordinates)).toThrow(
      'bonds[1]: index 7 is out of range (molecule has 3 atoms)',
    );
    expect(() => perceiveBondOrders(m.elements, Int32Array.of(0, 1, 2, 2), m.coordinates)).toThrow('bonds[1]: atom 2 is bonded to itself');
    expect(() => perceiveBondOrders(m.elements, Int32Array.of(0, 1, 0, 2, 1, 0), m.coordinates)).toThrow(
      'bonds[2]: atoms 0 and 1 are already bonded by bonds[0]',
    );
    expect(() => perceiveBondOrders(m.elements, Int32Array.of(0, 1, 0), m.coordinates)).toThrow(
      'bonds: expected an even number of indices (2 per bond), got 3',
    );
    expect(() => perceiveBondOrders(m.elements, m.bonds, m.coordinates, Int32Array.of(0, 0))).toThrow(
      'formalCharges: expected 3 charges (one per atom), got 2',
    );
    expect(() => perceiveBondOrders(m.elements, m.bonds, new Float64Array(6))).toThrow('coordinates: expected 3N = 9 numbers, got 6');
  });
});

describe('maximumMatching (the augmenting-path step)', () => {
  /** Size of a maximum matching by exhaustive search (tiny graphs only). */
  function bruteForce(m: number, edges: [number, number][]): number {
    let best = 0;
    const used = new Uint8Array(m);
    const go = (e: number, size: number): void => {
      if (size + (edges.length - e) <= best) return;
      if (e === edges.length) {
        best = Math.max(best, size);
        return;
      }
      const [a, b] = edges[e];
      if (!used[a] && !used[b]) {
        used[a] = used[b] = 1;
        go(e + 1, size + 1);
        used[a] = used[b] = 0;
      }
      go(e + 1, size);
    };
    go(0, 0);
    return best;
  }

  it('finds a maximum matching of random small graphs, odd cycles included (checked exhaustively)', () => {
    const rng = createRandom(5);
    for (let t = 0; t < 300; t++) {
      const m = rng.int(2, 11);
      const edges: [number, number][] = [];
      for (let a = 0; a < m; a++) for (let b = a + 1; b < m; b++) if (rng.next() < 0.3) edges.push([a, b]);
      // Shuffle the adjacency order so the greedy start is often poor.
      const adjacency: number[][] = Array.from({ length: m }, () => []);
      for (const [a, b] of edges) {
        adjacency[a].push(b);
        adjacency[b].push(a);
      }
      for (const list of adjacency) list.sort(() => rng.next() - 0.5);
      const adjStart = new Int32Array(m + 1);
      adjacency.forEach((list, v) => (adjStart[v + 1] = adjStart[v] + list.length));
      const adj = Int32Array.from(adjacency.flat());
      const match = maximumMatching(m, adjStart, adj);
      let size = 0;
      for (let v = 0; v < m; v++) {
        if (match[v] === -1) continue;
        expect(match[match[v]]).toBe(v);
        expect(adjacency[v]).toContain(match[v]);
        if (match[v] > v) size++;
      }
      expect(size).toBe(bruteForce(m, edges));
    }
  });
});
