/**
 * Bonds from coordinates (src/perceive/bonds.ts): the drawn bonds of real
 * molecules are found (geometries in molecules.ts, from memory of CCCBDB),
 * the cell list agrees with an all-pairs check, rigid motions change
 * nothing, and bad input is refused with exact messages.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { perceiveBonds } from '../../src/perceive/bonds.js';
import { covalentRadius } from '../../src/perceive/covalent-radii.js';
import { applyMotion, randomRigidMotion } from '../helpers/geometry.js';
import { createRandom } from '../helpers/random.js';
import * as M from './molecules.js';
import type { Molecule } from './molecules.js';

/** Drawn bonds as sorted "i-j" strings. */
function drawn(m: Molecule): string[] {
  const out: string[] = [];
  for (let b = 0; b < m.bonds.length; b += 2) {
    const [i, j] = [m.bonds[b], m.bonds[b + 1]];
    out.push(`${Math.min(i, j)}-${Math.max(i, j)}`);
  }
  return out.sort();
}
function pairs(bonds: Int32Array): string[] {
  const out: string[] = [];
  for (let b = 0; b < bonds.length; b += 2) out.push(`${bonds[b]}-${bonds[b + 1]}`);
  return out.sort();
}

/** All-pairs reference of the same rule (O(N²)). */
function allPairs(elements: string[], x: Float64Array, tolerance = 0.45): Int32Array {
  const out: number[] = [];
  for (let i = 0; i < elements.length; i++) {
    for (let j = i + 1; j < elements.length; j++) {
      const r = Math.hypot(x[3 * j] - x[3 * i], x[3 * j + 1] - x[3 * i + 1], x[3 * j + 2] - x[3 * i + 2]);
      const t = elements[i] === 'H' && elements[j] === 'H' ? Math.min(tolerance, 0.15) : tolerance;
      if (r <= covalentRadius(elements[i])! + covalentRadius(elements[j])! + t) out.push(i, j);
    }
  }
  return Int32Array.from(out);
}

const MOLECULES: (() => Molecule)[] = [
  M.water, M.ethane, M.ethylene, M.acetylene, M.carbonDioxide, M.acetone, M.acetonitrile, M.benzene,
  M.pyridine, M.pyrrole, M.furan, M.thiophene, M.cyclopropane, M.naphthalene, M.cubane, () => M.alkane(12),
];

describe('perceiveBonds', () => {
  for (const make of MOLECULES) {
    const m = make();
    it(`finds exactly the drawn bonds of ${m.name}`, () => {
      const bonds = perceiveBonds(m.elements, m.coordinates);
      expect(pairs(bonds)).toEqual(drawn(m));
    });
  }

  it('counts by formula: ethane 7 bonds, benzene 12, cubane 20, C1000 alkane 3001 (counted by hand: C_nH_(2n+2) has 3n+1)', () => {
    expect(perceiveBonds(M.ethane().elements, M.ethane().coordinates).length / 2).toBe(7);
    expect(perceiveBonds(M.benzene().elements, M.benzene().coordinates).length / 2).toBe(12);
    expect(perceiveBonds(M.cubane().elements, M.cubane().coordinates).length / 2).toBe(20);
    const chain = M.alkane(1000);
    expect(perceiveBonds(chain.elements, chain.coordinates).length / 2).toBe(3001);
  });

  it('returns pairs smaller index first, sorted', () => {
    const m = M.naphthalene();
    const bonds = perceiveBonds(m.elements, m.coordinates);
    for (let b = 0; b < bonds.length; b += 2) {
      expect(bonds[b]).toBeLessThan(bonds[b + 1]);
      if (b > 0) expect(bonds[b - 2] < bonds[b] || (bonds[b - 2] === bonds[b] && bonds[b - 1] < bonds[b + 1])).toBe(true);
    }
  });

  it('bonds H₂ at 0.741 Å (from memory, CCCBDB) but not two hydrogens 1.0 Å apart', () => {
    expect(Array.from(perceiveBonds(['H', 'H'], Float64Array.of(0, 0, 0, 0.741, 0, 0)))).toEqual([0, 1]);
    expect(perceiveBonds(['H', 'H'], Float64Array.of(0, 0, 0, 1.0, 0, 0)).length).toBe(0);
    // C–H at 1.0 Å is bonded (the H–H limit is for hydrogen pairs only).
    expect(perceiveBonds(['C', 'H'], Float64Array.of(0, 0, 0, 1.0, 0, 0)).length).toBe(2);
  });

  it('uses the tolerance: C–C at 1.95 Å bonded at 0.45 Å, not at 0.4 Å (1.52 + t, Cordero radii from memory)', () => {
    const x = Float64Array.of(0, 0, 0, 1.95, 0, 0);
    expect(perceiveBonds(['C', 'C'], x).length).toBe(2);
    expect(perceiveBonds(['C', 'C'], x, { tolerance: 0.4 }).length).toBe(0);
  });

  it('agrees with an all-pairs check on random clouds, dense and sparse (property)', () => {
    const symbols = ['H', 'C', 'N', 'O', 'S', 'Cl', 'Fe'];
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 2 ** 31 - 1 }), fc.integer({ min: 2, max: 120 }), fc.boolean(), (seed, n, sparse) => {
        const rng = createRandom(seed);
        const elements = Array.from({ length: n }, () => rng.pick(symbols));
        const box = sparse ? 1000 : Math.cbrt(n) * 1.6;
        const x = Float64Array.from({ length: 3 * n }, () => rng.uniform(-box, box));
        if (sparse) for (let c = 0; c < 3 * Math.min(n, 10); c++) x[c] = rng.uniform(0, 3);
        expect(pairs(perceiveBonds(elements, x))).toEqual(pairs(allPairs(elements, x)));
      }),
      { numRuns: 150, seed: 71 },
    );
  });

  it('rotating and translating the coordinates does not change the bonds (property)', () => {
    const rng = createRandom(17);
    for (const make of MOLECULES) {
      const m = make();
      const reference = pairs(perceiveBonds(m.elements, m.coordinates));
      for (let t = 0; t < 5; t++) {
        const moved = applyMotion(m.coordinates, randomRigidMotion(rng, 1000));
        expect(pairs(perceiveBonds(m.elements, moved))).toEqual(reference);
      }
    }
  });

  it('handles 0 and 1 atoms', () => {
    expect(perceiveBonds([], new Float64Array(0)).length).toBe(0);
    expect(perceiveBonds(['C'], new Float64Array(3)).length).toBe(0);
  });

  it('refuses bad input with exact messages', () => {
    const x = new Float64Array(9);
    x[3] = 1;
    x[6] = 2;
    expect(() => perceiveBonds(['C', 'C', 'Xx'], x)).toThrow('atoms[2] (Xx): no covalent radius');
    expect(() => perceiveBonds(['C', 'C', 'He'], x)).toThrow('atoms[2] (He): no covalent radius');
    expect(() => perceiveBonds(['C', 'C'], x)).toThrow('coordinates: expected 3N = 6 numbers, got 9');
    const bad = x.slice();
    bad[4] = NaN;
    expect(() => perceiveBonds(['C', 'C', 'C'], bad)).toThrow('coordinates[4]: not a finite number (NaN)');
    expect(() => perceiveBonds(['C', 'C', 'C'], x, { tolerance: -1 })).toThrow('tolerance: expected a finite number of Å ≥ 0, got -1');
  });
});
