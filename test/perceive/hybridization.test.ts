/**
 * Hybridization (src/perceive/hybridization.ts), by the documented rules.
 * Expected values are textbook (common practice): sp3 alkane carbon, sp2
 * alkene and carbonyl, sp alkyne, nitrile and CO₂ carbon, conjugated amide
 * nitrogen sp2, halogens and hydrogen none.
 */
import { describe, expect, it } from 'vitest';
import { perceiveBonds } from '../../src/perceive/bonds.js';
import { perceiveTopology } from '../../src/perceive/topology.js';
import type { Hybridization, Topology } from '../../src/perceive/types.js';
import * as M from './molecules.js';

const ofMolecule = (m: M.Molecule): Topology =>
  perceiveTopology({ elements: m.elements, bonds: perceiveBonds(m.elements, m.coordinates), coordinates: m.coordinates });
const ofGraph = (symbols: string[], edges: [number, number, number][]): Topology =>
  perceiveTopology({
    elements: symbols,
    bonds: Int32Array.from(edges.flatMap(([i, j]) => [i, j])),
    bondOrders: Float64Array.from(edges.map(([, , o]) => o)),
  });
const heavy = (t: Topology): Hybridization[] => t.hybridization.filter((_, a) => t.elements[a] !== 'H');

describe('hybridization', () => {
  it('ethane sp3, ethylene sp2, acetylene sp; hydrogens none', () => {
    expect(ofMolecule(M.ethane()).hybridization).toEqual(['sp3', 'sp3', ...Array(6).fill('none')]);
    expect(heavy(ofMolecule(M.ethylene()))).toEqual(['sp2', 'sp2']);
    expect(heavy(ofMolecule(M.acetylene()))).toEqual(['sp', 'sp']);
  });
  it('CO₂: C sp, O sp2; acetonitrile: CH₃ sp3, C and N sp; acetone: C=O carbon and O sp2, methyls sp3; water O sp3', () => {
    expect(heavy(ofMolecule(M.carbonDioxide()))).toEqual(['sp', 'sp2', 'sp2']);
    expect(heavy(ofMolecule(M.acetonitrile()))).toEqual(['sp3', 'sp', 'sp']);
    expect(heavy(ofMolecule(M.acetone()))).toEqual(['sp2', 'sp2', 'sp3', 'sp3']);
    expect(heavy(ofMolecule(M.water()))).toEqual(['sp3']);
  });
  it('aromatic atoms are "aromatic": benzene carbons, pyrrole N and C', () => {
    expect(heavy(ofMolecule(M.benzene()))).toEqual(Array(6).fill('aromatic'));
    expect(heavy(ofMolecule(M.pyrrole()))).toEqual(Array(5).fill('aromatic'));
  });
  it('formamide N is sp2 (next to C=O); methylamine N is sp3; aniline-like N next to an aromatic ring is sp2', () => {
    // H2N–CH=O: N0 C1 O2 H3 H4 H5
    expect(ofGraph(['N', 'C', 'O', 'H', 'H', 'H'], [[0, 1, 1], [1, 2, 2], [0, 3, 1], [0, 4, 1], [1, 5, 1]]).hybridization.slice(0, 3)).toEqual(['sp2', 'sp2', 'sp2']);
    expect(ofGraph(['N', 'C', 'H', 'H', 'H', 'H', 'H'], [[0, 1, 1], [0, 2, 1], [0, 3, 1], [1, 4, 1], [1, 5, 1], [1, 6, 1]]).hybridization[0]).toBe('sp3');
    const ring: [number, number, number][] = Array.from({ length: 6 }, (_, p) => [p, (p + 1) % 6, p % 2 === 0 ? 2 : 1]);
    const aniline = ofGraph(['C', 'C', 'C', 'C', 'C', 'C', 'N'], [...ring, [0, 6, 1]]);
    expect(aniline.hybridization[6]).toBe('sp2');
    expect(aniline.hybridization[0]).toBe('aromatic');
  });
  it('allene centre sp, ends sp2; sulfone S sp3; SO₂ S sp2; chloromethane Cl none', () => {
    expect(ofGraph(['C', 'C', 'C'], [[0, 1, 2], [1, 2, 2]]).hybridization).toEqual(['sp2', 'sp', 'sp2']);
    expect(ofGraph(['S', 'O', 'O', 'C', 'C'], [[0, 1, 2], [0, 2, 2], [0, 3, 1], [0, 4, 1]]).hybridization[0]).toBe('sp3');
    expect(ofGraph(['S', 'O', 'O'], [[0, 1, 2], [0, 2, 2]]).hybridization[0]).toBe('sp2');
    expect(ofGraph(['C', 'Cl', 'H', 'H', 'H'], [[0, 1, 1], [0, 2, 1], [0, 3, 1], [0, 4, 1]]).hybridization.slice(0, 2)).toEqual(['sp3', 'none']);
  });
  it('a lone atom, a metal and borane: none, none, sp2', () => {
    expect(ofGraph(['C'], []).hybridization).toEqual(['none']);
    expect(ofGraph(['Fe', 'C'], [[0, 1, 1]]).hybridization[0]).toBe('none');
    expect(ofGraph(['B', 'H', 'H', 'H'], [[0, 1, 1], [0, 2, 1], [0, 3, 1]]).hybridization[0]).toBe('sp2');
  });
});
