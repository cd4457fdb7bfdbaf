/**
 * Topology perception (src/perceive/topology.ts): counts of angles,
 * torsions, out-of-plane centres and 1-4 pairs (counted by hand, comments
 * beside each), relabelling and rigid-motion invariance, input order, and
 * exact error messages.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { perceiveBonds } from '../../src/perceive/bonds.js';
import { perceiveTopology } from '../../src/perceive/topology.js';
import type { Topology } from '../../src/perceive/types.js';
import { applyMotion, randomRigidMotion } from '../helpers/geometry.js';
import { createRandom } from '../helpers/random.js';
import * as M from './molecules.js';
import type { Molecule } from './molecules.js';

const fromGeometry = (m: Molecule): Topology =>
  perceiveTopology({ elements: m.elements, bonds: perceiveBonds(m.elements, m.coordinates), coordinates: m.coordinates });

interface Counts {
  angles: number;
  torsions: number;
  impropers: number;
  pairs14: number;
  rings: number;
}
const counts = (t: Topology): Counts => ({
  angles: t.angles.length / 3,
  torsions: t.torsions.length / 4,
  impropers: t.impropers.length / 4,
  pairs14: t.pairs14.length / 2,
  rings: t.rings.length,
});

describe('perceiveTopology: counts (counted by hand)', () => {
  it('water: 1 angle, nothing else', () => {
    expect(counts(fromGeometry(M.water()))).toEqual({ angles: 1, torsions: 0, impropers: 0, pairs14: 0, rings: 0 });
  });
  it('ethane: 12 angles (6 per carbon), 9 torsions (3 × 3 about C–C), 9 H–H 1-4 pairs', () => {
    expect(counts(fromGeometry(M.ethane()))).toEqual({ angles: 12, torsions: 9, impropers: 0, pairs14: 9, rings: 0 });
  });
  it('ethylene: 6 angles, 4 torsions, 2 out-of-plane centres, 4 1-4 pairs', () => {
    expect(counts(fromGeometry(M.ethylene()))).toEqual({ angles: 6, torsions: 4, impropers: 2, pairs14: 4, rings: 0 });
  });
  it('acetylene: 2 angles, 1 torsion, 1 1-4 pair', () => {
    expect(counts(fromGeometry(M.acetylene()))).toEqual({ angles: 2, torsions: 1, impropers: 0, pairs14: 1, rings: 0 });
  });
  it('benzene: 18 angles, 24 torsions (4 per ring bond), 6 centres, 21 1-4 pairs (3 para C–C, 12 meta H–C, 6 ortho H–H)', () => {
    expect(counts(fromGeometry(M.benzene()))).toEqual({ angles: 18, torsions: 24, impropers: 6, pairs14: 21, rings: 1 });
  });
  it('cyclopropane: 18 angles, 24 torsions (9 − 1 per ring bond: the 3-ring one skipped), 12 H–H 1-4 pairs, ring carbons 1-2/1-3 only', () => {
    const t = fromGeometry(M.cyclopropane());
    expect(counts(t)).toEqual({ angles: 18, torsions: 24, impropers: 0, pairs14: 12, rings: 1 });
    for (let p = 0; p < t.pairs14.length; p++) expect(t.elements[t.pairs14[p]]).toBe('H');
    for (let q = 0; q < t.torsions.length; q += 4) expect(t.torsions[q]).not.toBe(t.torsions[q + 3]);
  });
  it('a chain of 1000 carbon atoms: 998 angles, 997 torsions, 997 1-4 pairs, no ring', () => {
    const bonds = Int32Array.from({ length: 2 * 999 }, (_, c) => (c >> 1) + (c & 1));
    const t = perceiveTopology({ elements: Array(1000).fill('C'), bonds });
    expect(counts(t)).toEqual({ angles: 998, torsions: 997, impropers: 0, pairs14: 997, rings: 0 });
  });
  it('a 1000-carbon alkane from coordinates: angles = Σ C(d, 2), torsions = Σ (d_j − 1)(d_k − 1) (a tree: no ring excludes any)', () => {
    const m = M.alkane(1000);
    const t = fromGeometry(m);
    // 998 inner CH2 have 4 neighbours, the 2 ends 4 too: 1000 × 6 angles.
    expect(t.angles.length / 3).toBe(6000);
    // 999 C–C bonds with 3 × 3 each; C–H bonds none.
    expect(t.torsions.length / 4).toBe(8991);
    expect(t.rings.length).toBe(0);
  });
});

describe('perceiveTopology: layout', () => {
  const t = fromGeometry(M.naphthalene());
  it('angles have i < k, torsions j < k, impropers centre first with three neighbours, 1-4 pairs sorted', () => {
    for (let a = 0; a < t.angles.length; a += 3) expect(t.angles[a]).toBeLessThan(t.angles[a + 2]);
    for (let a = 0; a < t.torsions.length; a += 4) expect(t.torsions[a + 1]).toBeLessThan(t.torsions[a + 2]);
    for (let a = 0; a < t.impropers.length; a += 4) {
      const c = t.impropers[a];
      expect(t.neighbourStart[c + 1] - t.neighbourStart[c]).toBe(3);
      expect(Array.from(t.impropers.subarray(a + 1, a + 4))).toEqual(Array.from(t.neighbours.subarray(t.neighbourStart[c], t.neighbourStart[c + 1])));
    }
    for (let p = 0; p < t.pairs14.length; p += 2) {
      expect(t.pairs14[p]).toBeLessThan(t.pairs14[p + 1]);
      if (p > 0) expect(t.pairs14[p - 2] * 1e6 + t.pairs14[p - 1]).toBeLessThan(t.pairs14[p] * 1e6 + t.pairs14[p + 1]);
    }
  });
  it('neighbour lists are ascending and match the bonds', () => {
    let slots = 0;
    for (let a = 0; a < t.atomCount; a++) {
      for (let s = t.neighbourStart[a]; s < t.neighbourStart[a + 1]; s++) {
        if (s > t.neighbourStart[a]) expect(t.neighbours[s]).toBeGreaterThan(t.neighbours[s - 1]);
        slots++;
      }
    }
    expect(slots).toBe(t.bonds.length);
  });
  it('1-4 pairs are exactly the pairs at shortest-path distance 3 (breadth-first check)', () => {
    const expected: string[] = [];
    for (let a = 0; a < t.atomCount; a++) {
      const dist = new Array<number>(t.atomCount).fill(-1);
      dist[a] = 0;
      const queue = [a];
      for (let h = 0; h < queue.length; h++) {
        const v = queue[h];
        for (let s = t.neighbourStart[v]; s < t.neighbourStart[v + 1]; s++) {
          const w = t.neighbours[s];
          if (dist[w] === -1) {
            dist[w] = dist[v] + 1;
            queue.push(w);
          }
        }
      }
      for (let b = a + 1; b < t.atomCount; b++) if (dist[b] === 3) expected.push(`${a}-${b}`);
    }
    const got: string[] = [];
    for (let p = 0; p < t.pairs14.length; p += 2) got.push(`${t.pairs14[p]}-${t.pairs14[p + 1]}`);
    expect(got).toEqual(expected);
  });
});

/** The topology as sets of strings in the labels of `map` (new index of each old atom). */
function relabelled(t: Topology, map: (a: number) => number): Record<string, string[]> {
  const sorted = (xs: string[]): string[] => xs.sort();
  const key = (...xs: number[]): string => xs.join(',');
  const out: Record<string, string[]> = { bonds: [], angles: [], torsions: [], impropers: [], pairs14: [], rings: [], atoms: [] };
  for (let b = 0; b < t.bonds.length / 2; b++) {
    const [i, j] = [map(t.bonds[2 * b]), map(t.bonds[2 * b + 1])].sort((x, y) => x - y);
    out.bonds.push(`${key(i, j)}:${t.bondOrders[b]}:${t.aromaticBonds[b]}`);
  }
  for (let a = 0; a < t.angles.length; a += 3) {
    const [i, j, k] = [map(t.angles[a]), map(t.angles[a + 1]), map(t.angles[a + 2])];
    out.angles.push(i < k ? key(i, j, k) : key(k, j, i));
  }
  for (let a = 0; a < t.torsions.length; a += 4) {
    const [i, j, k, l] = Array.from(t.torsions.subarray(a, a + 4), map);
    out.torsions.push(j < k ? key(i, j, k, l) : key(l, k, j, i));
  }
  for (let a = 0; a < t.impropers.length; a += 4) {
    const others = Array.from(t.impropers.subarray(a + 1, a + 4), map).sort((x, y) => x - y);
    out.impropers.push(key(map(t.impropers[a]), ...others));
  }
  for (let p = 0; p < t.pairs14.length; p += 2) {
    const [i, j] = [map(t.pairs14[p]), map(t.pairs14[p + 1])].sort((x, y) => x - y);
    out.pairs14.push(key(i, j));
  }
  for (const ring of t.rings) out.rings.push(key(...Array.from(ring, map).sort((x, y) => x - y)));
  for (let a = 0; a < t.atomCount; a++) {
    out.atoms.push(`${map(a)}:${t.elements[a]}:${t.inRing[a]}:${t.aromaticAtoms[a]}:${t.hybridization[a]}`);
  }
  for (const k of Object.keys(out)) sorted(out[k]);
  return out;
}

describe('perceiveTopology: invariance', () => {
  const molecules = [M.acetone, M.acetonitrile, M.naphthalene, M.pyrrole, M.thiophene, M.cyclopropane, M.cubane];

  it('permuting atom order gives the same topology up to relabelling (property, perceived bonds and orders)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: molecules.length - 1 }), fc.integer({ min: 1, max: 2 ** 31 - 1 }), (which, seed) => {
        const m = molecules[which]();
        const n = m.elements.length;
        const rng = createRandom(seed);
        const perm = Array.from({ length: n }, (_, a) => a); // perm[old] = new
        for (let a = n - 1; a > 0; a--) {
          const b = rng.int(0, a);
          [perm[a], perm[b]] = [perm[b], perm[a]];
        }
        const elements = new Array<string>(n);
        const x = new Float64Array(3 * n);
        for (let a = 0; a < n; a++) {
          elements[perm[a]] = m.elements[a];
          x.set(m.coordinates.subarray(3 * a, 3 * a + 3), 3 * perm[a]);
        }
        const original = relabelled(fromGeometry(m), (a) => perm[a]);
        const permuted = relabelled(fromGeometry({ ...m, elements, coordinates: x }), (a) => a);
        if (m.name === 'cubane') {
          // Cubane's SSSR is any 5 of its 6 faces: compare all but the rings.
          expect(permuted.rings.length).toBe(5);
          original.rings = permuted.rings;
        }
        expect(permuted).toEqual(original);
      }),
      { numRuns: 60, seed: 91 },
    );
  });

  it('rotating and translating the coordinates does not change the perceived topology', () => {
    const rng = createRandom(23);
    for (const make of molecules) {
      const m = make();
      const reference = relabelled(fromGeometry(m), (a) => a);
      for (let t = 0; t < 4; t++) {
        const moved = applyMotion(m.coordinates, randomRigidMotion(rng, 500));
        expect(relabelled(fromGeometry({ ...m, coordinates: moved }), (a) => a)).toEqual(reference);
      }
    }
  });

  it('accepts bonds in any order and direction and returns them canonical, orders following', () => {
    const m = M.acetone();
    const pairs: [number, number, number][] = [];
    for (let b = 0; b < m.orders.length; b++) pairs.push([m.bonds[2 * b + 1], m.bonds[2 * b], m.orders[b]]);
    pairs.reverse();
    const t = perceiveTopology({
      elements: m.elements,
      bonds: Int32Array.from(pairs.flatMap(([i, j]) => [i, j])),
      bondOrders: Float64Array.from(pairs.map(([, , o]) => o)),
    });
    const canonical = pairs.map(([i, j, o]) => [Math.min(i, j), Math.max(i, j), o]).sort((p, q) => p[0] - q[0] || p[1] - q[1]);
    expect(Array.from(t.bonds)).toEqual(canonical.flatMap(([i, j]) => [i, j]));
    expect(Array.from(t.bondOrders)).toEqual(canonical.map(([, , o]) => o));
  });

  it('without orders and coordinates, all bonds are single', () => {
    const m = M.ethylene();
    const t = perceiveTopology({ elements: m.elements, bonds: m.bonds });
    expect(Array.from(t.bondOrders)).toEqual([1, 1, 1, 1, 1]);
    expect(Array.from(perceiveTopology({ elements: m.elements, bonds: m.bonds, coordinates: null }).bondOrders)).toEqual([1, 1, 1, 1, 1]);
    // With its coordinates, the same input gets its double bond.
    expect(Array.from(perceiveTopology({ elements: m.elements, bonds: m.bonds, coordinates: m.coordinates }).bondOrders)).toEqual(Array.from(m.orders));
  });

  it('does not keep references to the caller’s arrays', () => {
    const m = M.benzene();
    const orders = m.orders.slice();
    const t = perceiveTopology({ elements: m.elements, bonds: m.bonds, bondOrders: orders });
    expect(t.bonds).not.toBe(m.bonds);
    expect(Array.from(orders)).toEqual(Array.from(m.orders)); // aromatic 1.5 written to a copy
    expect(t.bondOrders[0]).toBe(1.5);
  });
});

describe('perceiveTopology: errors', () => {
  const m = M.water();
  const run = (change: Record<string, unknown>) => () => perceiveTopology({ elements: m.elements, bonds: m.bonds, ...change } as never);
  it('refuses bad input with exact messages', () => {
    expect(run({ bonds: Int32Array.of(0, 1, 0, 40) })).toThrow('bonds[1]: index 40 is out of range (molecule has 3 atoms)');
    expect(run({ bonds: Int32Array.of(0, 1, -1, 2) })).toThrow('bonds[1]: index -1 is out of range (molecule has 3 atoms)');
    expect(run({ bonds: Int32Array.of(0, 1, 1, 1) })).toThrow('bonds[1]: atom 1 is bonded to itself');
    expect(run({ bonds: Int32Array.of(0, 2, 0, 1, 2, 0) })).toThrow('bonds[2]: atoms 0 and 2 are already bonded by bonds[0]');
    expect(run({ bonds: [0, 1] })).toThrow('bonds: expected an Int32Array of 2 × B atom indices');
    expect(run({ bonds: Int32Array.of(0, 1, 2) })).toThrow('bonds: expected an even number of indices (2 per bond), got 3');
    expect(run({ bondOrders: Float64Array.of(1) })).toThrow('bondOrders: expected 2 orders (one per bond), got 1');
    expect(run({ bondOrders: Float64Array.of(1, 2.5) })).toThrow('bondOrders[1]: expected 1, 1.5, 2 or 3, got 2.5');
    expect(run({ formalCharges: Int32Array.of(0, 0) })).toThrow('formalCharges: expected 3 charges (one per atom), got 2');
    expect(run({ coordinates: new Float64Array(8) })).toThrow('coordinates: expected 3N = 9 numbers, got 8');
    expect(run({ elements: ['O', 7, 'H'] })).toThrow('atoms[1]: expected an element symbol, got 7');
    expect(() => perceiveTopology(null as never)).toThrow('expected a topology input object');
  });
  it('names the input position of a bad bond even when the input is not sorted', () => {
    expect(run({ bonds: Int32Array.of(2, 0, 1, 0, 0, 2) })).toThrow('bonds[2]: atoms 0 and 2 are already bonded by bonds[0]');
  });
});
