/**
 * Aromaticity (src/perceive/aromaticity.ts) through topology perception.
 * Which rings are aromatic is textbook Hückel 4n + 2 chemistry (common
 * practice): benzene, pyridine, pyrrole, furan, thiophene, naphthalene,
 * azulene, tropylium and cyclopentadienide are; cyclohexene,
 * cyclooctatetraene and cyclopentadiene are not.
 */
import { describe, expect, it } from 'vitest';
import { perceiveBonds } from '../../src/perceive/bonds.js';
import { perceiveTopology } from '../../src/perceive/topology.js';
import type { Topology } from '../../src/perceive/types.js';
import * as M from './molecules.js';

const ofMolecule = (m: M.Molecule): Topology =>
  perceiveTopology({ elements: m.elements, bonds: perceiveBonds(m.elements, m.coordinates), coordinates: m.coordinates });
const ofGraph = (g: M.Graph, charges?: number[]): Topology =>
  perceiveTopology({
    elements: g.elements,
    bonds: g.bonds,
    bondOrders: g.orders,
    formalCharges: charges ? Int32Array.from(g.elements.map((_, a) => charges[a] ?? 0)) : null,
  });
const ring = (k: number, orders: number[]): [number, number, number][] =>
  Array.from({ length: k }, (_, p) => [p, (p + 1) % k, orders[p] ?? 1] as [number, number, number]);

/** Heavy ring atoms aromatic, everything else not; ring bonds 1.5, others keep their order. */
function expectAromaticRings(t: Topology): void {
  for (let a = 0; a < t.atomCount; a++) expect(t.aromaticAtoms[a]).toBe(t.inRing[a]);
  for (let b = 0; b < t.bonds.length / 2; b++) {
    const ringBond = t.inRing[t.bonds[2 * b]] && t.inRing[t.bonds[2 * b + 1]];
    expect(t.aromaticBonds[b]).toBe(ringBond ? 1 : 0);
    if (ringBond) expect(t.bondOrders[b]).toBe(1.5);
    else expect(t.bondOrders[b]).toBe(1);
  }
}

describe('aromaticity from perceived bond orders (geometry)', () => {
  for (const make of [M.benzene, M.pyridine, M.pyrrole, M.furan, M.thiophene, M.naphthalene]) {
    const m = make();
    it(`${m.name} is aromatic: ring atoms and ring bonds (order 1.5)`, () => {
      const t = ofMolecule(m);
      expect(t.rings.length).toBeGreaterThan(0);
      expectAromaticRings(t);
    });
  }
  it('benzene with its hydrogens missing is still aromatic', () => {
    expectAromaticRings(ofMolecule(M.benzene(false)));
  });
  it('cyclopropane, cubane, ethylene have no aromatic atom', () => {
    for (const m of [M.cyclopropane(), M.cubane(), M.ethylene()]) expect(Array.from(ofMolecule(m).aromaticAtoms).every((f) => f === 0)).toBe(true);
  });
});

describe('aromaticity from given bond orders', () => {
  it('cyclohexene (sp3 ring atoms) and cyclooctatetraene (8 π electrons) are not aromatic', () => {
    for (const g of [M.cyclohexene(), M.cyclooctatetraene()]) {
      const t = ofGraph(g);
      expect(t.rings.length).toBe(1);
      expect(Array.from(t.aromaticAtoms).every((f) => f === 0)).toBe(true);
      // Orders unchanged (compared by atom pair: the topology's bonds are in canonical order).
      const given = new Map<string, number>();
      for (let b = 0; b < g.orders.length; b++) {
        const [i, j] = [g.bonds[2 * b], g.bonds[2 * b + 1]].sort((x, y) => x - y);
        given.set(`${i}-${j}`, g.orders[b]);
      }
      for (let b = 0; b < t.bondOrders.length; b++) expect(t.bondOrders[b]).toBe(given.get(`${t.bonds[2 * b]}-${t.bonds[2 * b + 1]}`));
    }
  });
  it('a saturated ring of lone-pair donors (cyclic S₃, 6 "lone-pair" electrons) is not aromatic: it has no π bond', () => {
    const t = ofGraph(M.graph('trithiirane', ['S', 'S', 'S'], ring(3, [1, 1, 1])));
    expect(Array.from(t.aromaticAtoms)).toEqual([0, 0, 0]);
  });
  it('borazine B₃N₃H₆ drawn with single bonds is aromatic (B 0 + N 2 electrons, 6 in all)', () => {
    const edges: [number, number, number][] = [...ring(6, Array(6).fill(1)), ...Array.from({ length: 6 }, (_, a) => [a, 6 + a, 1] as [number, number, number])];
    const t = ofGraph(M.graph('borazine', ['B', 'N', 'B', 'N', 'B', 'N', 'H', 'H', 'H', 'H', 'H', 'H'], edges));
    expect(Array.from(t.aromaticAtoms.subarray(0, 6))).toEqual([1, 1, 1, 1, 1, 1]);
  });
  it('benzene given with orders 1.5 is aromatic as given', () => {
    expectAromaticRings(ofGraph(M.graph('benzene', Array(6).fill('C'), ring(6, Array(6).fill(1.5)), false)));
  });
  it('cyclopentadiene is not aromatic; its anion (C⁻, 6 π) is', () => {
    const g = M.graph('cyclopentadiene', Array(5).fill('C'), ring(5, [2, 1, 2, 1, 1]), true);
    expect(Array.from(ofGraph(g).aromaticAtoms).some((f) => f === 1)).toBe(false);
    // The anion: C4 (the CH2 carbon) loses a hydrogen: drop the last H bonded to it.
    const anion = M.graph('cyclopentadienide', Array(5).fill('C').concat(Array(5).fill('H')), [
      ...ring(5, [2, 1, 2, 1, 1]),
      [0, 5, 1], [1, 6, 1], [2, 7, 1], [3, 8, 1], [4, 9, 1],
    ]);
    expectAromaticRings(ofGraph(anion, [0, 0, 0, 0, -1]));
  });
  it('tropylium (C7H7⁺, 6 π) is aromatic', () => {
    const g = M.graph('tropylium', Array(7).fill('C'), ring(7, [2, 1, 2, 1, 2, 1, 1]));
    const withH = M.graph('tropylium', g.elements.concat(Array(7).fill('H')), [...ring(7, [2, 1, 2, 1, 2, 1, 1]), ...Array.from({ length: 7 }, (_, a) => [a, 7 + a, 1] as [number, number, number])]);
    expectAromaticRings(ofGraph(withH, [0, 0, 0, 0, 0, 0, 1]));
  });
  it('azulene (5 + 7 rings, 10 π over the fused system) is aromatic through the whole-system rule', () => {
    // 7-ring 0..6, 5-ring 0, 6, 7, 8, 9 with bond 0–6 shared; a Kekulé structure with 0–6 single.
    const edges: [number, number, number][] = [[0, 1, 2], [1, 2, 1], [2, 3, 2], [3, 4, 1], [4, 5, 2], [5, 6, 1], [6, 0, 1], [6, 7, 2], [7, 8, 1], [8, 9, 2], [9, 0, 1]];
    const t = ofGraph(M.graph('azulene', Array(10).fill('C'), edges, true));
    expect(t.rings.map((r) => r.length).sort()).toEqual([5, 7]);
    expectAromaticRings(t);
  });
  it('indane: the benzene ring is aromatic, the fused cyclopentane ring is not', () => {
    // Benzene 0..5, five-ring 0, 5, 6, 7, 8.
    const edges: [number, number, number][] = [...ring(6, [2, 1, 2, 1, 2, 1]), [5, 6, 1], [6, 7, 1], [7, 8, 1], [8, 0, 1]];
    const t = ofGraph(M.graph('indane', Array(9).fill('C'), edges, true));
    for (let a = 0; a < 9; a++) expect(t.aromaticAtoms[a]).toBe(a < 6 ? 1 : 0);
  });
  it('2-pyridone (exocyclic C=O gives 0, N–H 2): aromatic ring, C=O stays double', () => {
    // N0 C1(=O6) C2=C3 C4=C5 N0
    const edges: [number, number, number][] = [[0, 1, 1], [1, 2, 1], [2, 3, 2], [3, 4, 1], [4, 5, 2], [5, 0, 1], [1, 6, 2], [0, 7, 1]];
    const t = ofGraph(M.graph('2-pyridone', ['N', 'C', 'C', 'C', 'C', 'C', 'O', 'H'], edges, true));
    for (let a = 0; a < 6; a++) expect(t.aromaticAtoms[a]).toBe(1);
    expect(t.aromaticAtoms[6]).toBe(0);
    const co = Array.from({ length: t.bonds.length / 2 }, (_, b) => b).find((b) => t.bonds[2 * b] === 1 && t.bonds[2 * b + 1] === 6)!;
    expect(t.bondOrders[co]).toBe(2);
  });
});
