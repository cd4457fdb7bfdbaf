/**
 * The test stand-in for perception (test/params/topology-fixture.ts): its
 * lists follow the Topology contract of src/perceive/types.ts, with counts
 * checked by hand, and the z-matrix builder places atoms where it is told.
 */
import { describe, expect, it } from 'vitest';
import { bendAngle, distance, torsionAngle } from '../../src/terms/measure.js';
import { reference } from './molecules.js';
import { fromZMatrix } from './topology-fixture.js';

describe('buildTopology', () => {
  it('ethane: 7 bonds, 12 angles (6 H–C–H + 6 H–C–C), 9 torsions, no out-of-plane centres, 9 1-4 pairs', () => {
    const t = reference('ethane').topology;
    expect([t.bondOrders.length, t.angles.length / 3, t.torsions.length / 4, t.impropers.length / 4, t.pairs14.length / 2]).toEqual([7, 12, 9, 0, 9]);
  });
  it('benzene: 12 bonds (6 aromatic), 18 angles, 24 torsions (6 ring C–C × 4), 6 centres, all carbons aromatic', () => {
    const t = reference('benzene').topology;
    expect([t.bondOrders.length, t.angles.length / 3, t.torsions.length / 4, t.impropers.length / 4]).toEqual([12, 18, 24, 6]);
    expect(Array.from(t.aromaticBonds).filter((a) => a === 1)).toHaveLength(6);
    expect(Array.from(t.aromaticAtoms.subarray(0, 6))).toEqual([1, 1, 1, 1, 1, 1]);
    expect(t.hybridization.slice(0, 7)).toEqual([...Array(6).fill('aromatic'), 'none']);
  });
  it('bonds sorted with the smaller index first, angles with i < k, torsions with j < k, neighbours ascending', () => {
    const t = reference('propene').topology;
    for (let b = 0; b < t.bondOrders.length; b++) expect(t.bonds[2 * b]).toBeLessThan(t.bonds[2 * b + 1]);
    for (let a = 0; a < t.angles.length / 3; a++) expect(t.angles[3 * a]).toBeLessThan(t.angles[3 * a + 2]);
    for (let q = 0; q < t.torsions.length / 4; q++) expect(t.torsions[4 * q + 1]).toBeLessThan(t.torsions[4 * q + 2]);
    for (let a = 0; a < t.atomCount; a++) {
      const list = Array.from(t.neighbours.subarray(t.neighbourStart[a], t.neighbourStart[a + 1]));
      expect(list).toEqual([...list].sort((p, q) => p - q));
    }
  });
});

describe('fromZMatrix', () => {
  it('places each atom at its distance, angle and torsion (IUPAC sign)', () => {
    const x = fromZMatrix([['C'], ['C', 0, 1.5], ['C', 1, 1.4, 0, 110], ['C', 2, 1.3, 1, 100, 0, 60], ['C', 3, 1.2, 2, 95, 1, -150]]);
    expect(distance(x, 0, 1)).toBeCloseTo(1.5, 12);
    expect(distance(x, 1, 2)).toBeCloseTo(1.4, 12);
    expect((bendAngle(x, 0, 1, 2) * 180) / Math.PI).toBeCloseTo(110, 10);
    expect(distance(x, 2, 3)).toBeCloseTo(1.3, 12);
    expect((bendAngle(x, 1, 2, 3) * 180) / Math.PI).toBeCloseTo(100, 10);
    expect((torsionAngle(x, 0, 1, 2, 3) * 180) / Math.PI).toBeCloseTo(60, 10);
    expect((torsionAngle(x, 1, 2, 3, 4) * 180) / Math.PI).toBeCloseTo(-150, 10);
  });
});
