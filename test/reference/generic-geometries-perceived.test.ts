/**
 * The same comparison with experiment as generic-geometries.test.ts, but
 * through the path a user takes: a structure (elements and coordinates, with
 * or without the bonds and orders a file would give) → perception
 * (src/perceive) → generic parameters → relaxation. Targets and known misses
 * as there; experimental values and sources in generic-geometries.ts.
 */
import { describe, expect, it } from 'vitest';
import { newStructure } from '../../src/io/structure.js';
import { parseModel } from '../../src/model/model.js';
import { relaxModel } from '../../src/model/relax.js';
import { modelFromStructure } from '../../src/params/from-structure.js';
import { bendAngle, distance } from '../../src/terms/measure.js';
import { fromZMatrix } from '../params/topology-fixture.js';
import { KNOWN_MISSES, REFERENCE_MOLECULES } from './generic-geometries.js';

const BOND_TARGET = 0.04;
const ANGLE_TARGET = 5;

describe.each([
  ['bonds and orders given (as in an SDF file)', true],
  ['nothing but elements and coordinates (as in an XYZ file)', false],
] as const)('generic geometries through perception: %s', (_, withBonds) => {
  for (const m of REFERENCE_MOLECULES) {
    it(`${m.name}: within ${BOND_TARGET} Å and ${ANGLE_TARGET}° of experiment (known misses listed)`, () => {
      const elements = m.zmatrix.map((row) => row[0]);
      const x0 = fromZMatrix(m.zmatrix);
      const structure = newStructure(elements, x0, {
        title: m.name,
        ...(withBonds
          ? { bonds: Int32Array.from(m.bonds.flatMap(([i, j]) => [i, j])), bondOrders: Float64Array.from(m.bonds.map((b) => b[2])) }
          : {}),
      });
      const generated = modelFromStructure(structure);
      // perception found exactly the molecule's bonds
      const found = new Set<string>();
      for (let b = 0; b < generated.topology.bonds.length; b += 2) found.add(`${generated.topology.bonds[b]}-${generated.topology.bonds[b + 1]}`);
      expect(found).toEqual(new Set(m.bonds.map(([i, j]) => `${Math.min(i, j)}-${Math.max(i, j)}`)));
      const model = parseModel(generated.file);
      const result = relaxModel(model, { maxForce: 1e-4, maxIterations: 5000 });
      expect(result.converged, `${m.name}: ${result.reason}`).toBe(true);
      const wrong: string[] = [];
      for (const { atoms, value } of m.reference) {
        const key = `${m.name} ${atoms.map((a) => `${elements[a]}${a}`).join('-')}`;
        const computed =
          atoms.length === 2 ? distance(result.x, atoms[0], atoms[1]) : (bendAngle(result.x, atoms[0], atoms[1], atoms[2]) * 180) / Math.PI;
        const within = Math.abs(computed - value) <= (atoms.length === 2 ? BOND_TARGET : ANGLE_TARGET);
        if (within === (KNOWN_MISSES[key] !== undefined)) wrong.push(`${key}: ${computed.toFixed(4)} vs ${value}`);
      }
      expect(wrong).toEqual([]);
    });
  }
});
