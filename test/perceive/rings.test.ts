/**
 * Smallest set of smallest rings (src/perceive/rings.ts), through topology
 * perception. The ring count of a minimum cycle basis is B − N + C (the
 * cycle rank, a fact of graph theory); sizes are counted by hand. Minimality
 * is checked against an exhaustive minimum cycle basis on small random graphs.
 */
import { describe, expect, it } from 'vitest';
import { perceiveBonds } from '../../src/perceive/bonds.js';
import { canonicalBonds, neighbourLists } from '../../src/perceive/graph.js';
import { HORTON_BLOCK_LIMIT, smallestRings } from '../../src/perceive/rings.js';
import { perceiveTopology } from '../../src/perceive/topology.js';
import type { Topology } from '../../src/perceive/types.js';
import { createRandom } from '../helpers/random.js';
import * as M from './molecules.js';

const sizes = (t: Topology): number[] => t.rings.map((r) => r.length).sort((a, b) => a - b);
const ofGraph = (g: M.Graph): Topology => perceiveTopology({ elements: g.elements, bonds: g.bonds, bondOrders: g.orders });
const ofMolecule = (m: M.Molecule): Topology =>
  perceiveTopology({ elements: m.elements, bonds: perceiveBonds(m.elements, m.coordinates), coordinates: m.coordinates });

function components(n: number, bonds: Int32Array): number {
  const parent = Array.from({ length: n }, (_, a) => a);
  const find = (a: number): number => (parent[a] === a ? a : (parent[a] = find(parent[a])));
  for (let b = 0; b < bonds.length; b += 2) parent[find(bonds[b])] = find(bonds[b + 1]);
  return new Set(parent.map((_, a) => find(a))).size;
}

/** Each ring is a simple cycle of bonded atoms, and the rings are independent over GF(2). */
function expectValidBasis(t: Topology): void {
  const bondIndex = new Map<string, number>();
  for (let b = 0; b < t.bonds.length / 2; b++) bondIndex.set(`${t.bonds[2 * b]}-${t.bonds[2 * b + 1]}`, b);
  const vectors: bigint[] = [];
  for (const ring of t.rings) {
    expect(new Set(ring).size).toBe(ring.length);
    let v = 0n;
    for (let p = 0; p < ring.length; p++) {
      const [i, j] = [ring[p], ring[(p + 1) % ring.length]].sort((x, y) => x - y);
      const b = bondIndex.get(`${i}-${j}`);
      expect(b).toBeDefined();
      v ^= 1n << BigInt(b!);
      expect(t.inRing[ring[p]]).toBe(1);
    }
    vectors.push(v);
  }
  expect(gf2Rank(vectors)).toBe(vectors.length);
}

function gf2Rank(vectors: bigint[]): number {
  const basis = new Map<number, bigint>();
  for (let v of vectors) {
    while (v !== 0n) {
      const top = v.toString(2).length - 1;
      const owner = basis.get(top);
      if (owner === undefined) {
        basis.set(top, v);
        break;
      }
      v ^= owner;
    }
  }
  return basis.size;
}

describe('smallest set of smallest rings', () => {
  it('cyclopropane [3], benzene [6], naphthalene [6, 6], pyrrole [5], cubane 5 × [4], norbornane [5, 5] (counted by hand)', () => {
    expect(sizes(ofMolecule(M.cyclopropane()))).toEqual([3]);
    expect(sizes(ofMolecule(M.benzene()))).toEqual([6]);
    expect(sizes(ofMolecule(M.naphthalene()))).toEqual([6, 6]);
    expect(sizes(ofMolecule(M.pyrrole()))).toEqual([5]);
    expect(sizes(ofMolecule(M.cubane()))).toEqual([4, 4, 4, 4, 4]);
    expect(sizes(ofGraph(M.norbornane()))).toEqual([5, 5]);
  });

  it('count is B − N + C for the test molecules', () => {
    for (const m of [M.cubane(), M.naphthalene(), M.cyclopropane(), M.ethane()]) {
      const t = ofMolecule(m);
      expect(t.rings.length).toBe(t.bonds.length / 2 - t.atomCount + components(t.atomCount, t.bonds));
      expectValidBasis(t);
    }
  });

  it('rings start at their smallest atom and go towards its smaller ring neighbour', () => {
    const t = ofMolecule(M.naphthalene());
    for (const ring of t.rings) {
      expect(ring[0]).toBe(Math.min(...ring));
      expect(ring[1]).toBeLessThan(ring[ring.length - 1]);
    }
  });

  it('inRing marks ring atoms only: the hydrogens of benzene are not in a ring', () => {
    const t = ofMolecule(M.benzene());
    t.elements.forEach((e, a) => expect(t.inRing[a]).toBe(e === 'C' ? 1 : 0));
  });

  it('spiro[3.4]octane: a 4-ring and a 5-ring sharing one atom, plus a lone atom (second component)', () => {
    const edges: [number, number, number][] = [[0, 1, 1], [1, 2, 1], [2, 3, 1], [3, 0, 1], [0, 5, 1], [5, 6, 1], [6, 7, 1], [7, 8, 1], [8, 0, 1]];
    const t = ofGraph(M.graph('spiro', Array(9).fill('C'), edges));
    expect(sizes(t)).toEqual([4, 5]);
    expect(t.inRing[0]).toBe(1);
    expect(t.inRing[4]).toBe(0);
  });

  it('bicyclo[2.2.2]octane: two 6-rings (any two of the three)', () => {
    const g = M.graph('bco', Array(8).fill('C'), [[0, 1, 1], [1, 2, 1], [2, 3, 1], [3, 4, 1], [4, 5, 1], [5, 0, 1], [0, 6, 1], [6, 7, 1], [7, 3, 1]]);
    expect(sizes(ofGraph(g))).toEqual([6, 6]);
  });

  it(`a ladder of 100 fused hexagons (${4 * 100 + 2} atoms, one block larger than ${HORTON_BLOCK_LIMIT}): 100 six-rings`, () => {
    // Acene-like: top row t_i, bottom row b_i, i = 0..2m; rungs at even i; hexagon k spans columns 2k..2k+2.
    const m = 100;
    const cols = 2 * m + 1;
    const edges: [number, number, number][] = [];
    for (let i = 0; i + 1 < cols; i++) {
      edges.push([i, i + 1, 1]);
      edges.push([cols + i, cols + i + 1, 1]);
    }
    for (let i = 0; i < cols; i += 2) edges.push([i, cols + i, 1]);
    const t = ofGraph(M.graph('ladder', Array(2 * cols).fill('C'), edges));
    expect(t.rings.length).toBe(m);
    expect(sizes(t).every((s) => s === 6)).toBe(true);
    expectValidBasis(t);
  });

  it('a polymer of 1000 isolated rings (rank-1 blocks) stays exact: 1000 five-rings', () => {
    const edges: [number, number, number][] = [];
    for (let r = 0; r < 1000; r++) {
      const o = 5 * r;
      for (let p = 0; p < 5; p++) edges.push([o + p, o + ((p + 1) % 5), 1]);
      if (r > 0) edges.push([o - 3, o, 1]);
    }
    const t = ofGraph(M.graph('rings', Array(5000).fill('C'), edges));
    expect(t.rings.length).toBe(1000);
    expect(sizes(t).every((s) => s === 5)).toBe(true);
  });

  it('is a minimum cycle basis on random small graphs (total length equal to an exhaustive one; property)', () => {
    const rng = createRandom(77);
    for (let trial = 0; trial < 150; trial++) {
      const n = rng.int(3, 9);
      const edges: [number, number, number][] = [];
      for (let a = 0; a < n; a++) for (let b = a + 1; b < n; b++) if (rng.next() < 0.4) edges.push([a, b, 1]);
      const t = ofGraph(M.graph('random', Array(n).fill('C'), edges));
      expect(t.rings.length).toBe(edges.length - n + components(n, t.bonds));
      expectValidBasis(t);
      const total = t.rings.reduce((s, r) => s + r.length, 0);
      expect(total).toBe(exhaustiveBasisLength(n, t.bonds));
    }
  });
});

/** Total length of a minimum cycle basis: all simple cycles, shortest first, kept when independent. */
function exhaustiveBasisLength(n: number, bonds: Int32Array): number {
  const adj: number[][] = Array.from({ length: n }, () => []);
  const index = new Map<string, number>();
  for (let b = 0; b < bonds.length / 2; b++) {
    const [i, j] = [bonds[2 * b], bonds[2 * b + 1]];
    adj[i].push(j);
    adj[j].push(i);
    index.set(`${i}-${j}`, b);
  }
  const cycles: { length: number; v: bigint }[] = [];
  const seen = new Set<bigint>();
  const path: number[] = [];
  const onPath = new Uint8Array(n);
  const extend = (startAt: number, v: number): void => {
    for (const w of adj[v]) {
      if (w === startAt && path.length >= 3) {
        let vec = 0n;
        const cyc = [...path];
        for (let p = 0; p < cyc.length; p++) {
          const [i, j] = [cyc[p], cyc[(p + 1) % cyc.length]].sort((x, y) => x - y);
          vec ^= 1n << BigInt(index.get(`${i}-${j}`)!);
        }
        if (!seen.has(vec)) {
          seen.add(vec);
          cycles.push({ length: cyc.length, v: vec });
        }
      } else if (w > startAt && !onPath[w]) {
        onPath[w] = 1;
        path.push(w);
        extend(startAt, w);
        path.pop();
        onPath[w] = 0;
      }
    }
  };
  for (let s = 0; s < n; s++) {
    path.push(s);
    onPath[s] = 1;
    extend(s, s);
    path.pop();
    onPath[s] = 0;
  }
  cycles.sort((a, b) => a.length - b.length);
  const kept: bigint[] = [];
  let total = 0;
  for (const c of cycles) {
    if (gf2Rank([...kept, c.v]) > kept.length) {
      kept.push(c.v);
      total += c.length;
    }
  }
  return total;
}

describe('large blocks: shortest ring per bond versus Horton’s full set', () => {
  it('gives bases of the same total length on random fused graphs of 150–250 atoms (property)', () => {
    const rng = createRandom(303);
    for (let trial = 0; trial < 6; trial++) {
      // A random "molecule-like" fused block: a long ring with random chords between atoms
      // at most 6 apart along it (so rings stay small, as in fused polycycles).
      const n = rng.int(150, 250);
      const pairs = new Set<string>();
      const edges: number[] = [];
      const addEdge = (i: number, j: number): void => {
        const [a, b] = i < j ? [i, j] : [j, i];
        if (a === b || pairs.has(`${a}-${b}`)) return;
        pairs.add(`${a}-${b}`);
        edges.push(a, b);
      };
      for (let a = 0; a < n; a++) addEdge(a, (a + 1) % n);
      for (let c = 0; c < n / 4; c++) {
        const a = rng.int(0, n - 1);
        addEdge(a, (a + rng.int(3, 6)) % n);
      }
      const canonical = canonicalBonds(Int32Array.from(edges), n).bonds;
      const lists = neighbourLists(n, canonical);
      const local = smallestRings(n, canonical, lists, HORTON_BLOCK_LIMIT);
      const horton = smallestRings(n, canonical, lists, Infinity);
      expect(local.length).toBe(canonical.length / 2 - n + 1);
      expect(local.reduce((s, r) => s + r.length, 0)).toBe(horton.reduce((s, r) => s + r.length, 0));
    }
  });
});
