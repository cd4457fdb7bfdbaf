/**
 * Small molecules for the generic-parameter tests, as topologies (built by
 * brute force, test/params/topology-fixture.ts) with starting coordinates:
 * the reference set of test/reference/generic-geometries.ts plus a few
 * more (formamide, hydrogen peroxide, phenol-like fragments are built where
 * a test needs them).
 */
import type { Topology } from '../../src/perceive/types.js';
import { REFERENCE_MOLECULES } from '../reference/generic-geometries.js';
import { buildTopology, fromZMatrix, type MoleculeSpec, type ZRow } from './topology-fixture.js';

/** A topology with coordinates. */
export interface TestMolecule {
  readonly topology: Topology;
  readonly x: Float64Array;
}

/** Topology and coordinates of a molecule written as a z-matrix and bonds. */
export function molecule(zmatrix: readonly ZRow[], bonds: MoleculeSpec['bonds'], extra: Omit<MoleculeSpec, 'elements' | 'bonds'> = {}): TestMolecule {
  const elements = zmatrix.map((row) => row[0]);
  return { topology: buildTopology({ elements, bonds, ...extra }), x: fromZMatrix(zmatrix) };
}

/** A molecule of the reference set by name. */
export function reference(name: string): TestMolecule {
  const m = REFERENCE_MOLECULES.find((r) => r.name === name);
  if (m === undefined) throw new Error(`no reference molecule ${name}`);
  return molecule(m.zmatrix, m.bonds, { hybridization: m.hybridization, rings: m.rings });
}

/** Formamide H2N–CH=O (planar start). */
export function formamide(): TestMolecule {
  return molecule(
    [['C'], ['O', 0, 1.22], ['N', 0, 1.36, 1, 124], ['H', 0, 1.1, 1, 122, 2, 180], ['H', 2, 1.0, 0, 120, 1, 0], ['H', 2, 1.0, 0, 120, 1, 180]],
    [[0, 1, 2], [0, 2, 1], [0, 3, 1], [2, 4, 1], [2, 5, 1]],
  );
}

/** Hydrogen peroxide H–O–O–H (skew start). */
export function hydrogenPeroxide(): TestMolecule {
  return molecule([['O'], ['O', 0, 1.47], ['H', 0, 0.97, 1, 100], ['H', 1, 0.97, 0, 100, 2, 115]], [[0, 1, 1], [0, 2, 1], [1, 3, 1]]);
}
