/**
 * Models and helpers shared by the model-file tests.
 */

import { expect } from 'vitest';
import { ModelError } from '../../src/errors.js';

/**
 * The example of the model-file spec, verbatim.
 * Source: ../shared/spec/model-file.md (the first JSON block).
 */
export const SPEC_EXAMPLE_TEXT = `{
  "format": "strainwise-model",
  "version": 1,
  "units": { "length": "angstrom", "energy": "kcal/mol" },
  "atoms": [
    { "element": "O", "name": "O1" },
    { "element": "H", "name": "H1", "mass": 1.008 },
    { "element": "H", "name": "H2" }
  ],
  "coordinates": [[0, 0, 0], [0.96, 0, 0], [-0.24, 0.93, 0]],
  "bonds": [[0, 1], [0, 2]],
  "terms": [
    { "kind": "harmonic-bond",  "atoms": [0, 1], "k": 1100, "r0": 0.9572 },
    { "kind": "harmonic-bond",  "atoms": [0, 2], "k": 1100, "r0": 0.9572 },
    { "kind": "harmonic-angle", "atoms": [1, 0, 2], "k": 100, "theta0": 104.52 }
  ]
}`;

/** A loosely typed model, for tests that break it on purpose. */
export type Loose = Record<string, any>;

/** The spec example as a fresh object. */
export function specExample(): Loose {
  return JSON.parse(SPEC_EXAMPLE_TEXT) as Loose;
}

/**
 * A small model using every term kind (the ten of version 1 and the three
 * extensions of docs/model-file.md), nonbonded pairs, frozen atoms and a
 * constraint, in ångström and kcal/mol. Five atoms; atoms 0 and 4 are 5 Å
 * apart (a 3-4-5 triangle), so the constraint's default length is exactly 5.
 */
export function allKindsAngstrom(): Loose {
  return {
    format: 'strainwise-model',
    version: 1,
    title: 'every kind',
    units: { length: 'angstrom', energy: 'kcal/mol' },
    atoms: [
      { element: 'C', name: 'C1', type: 'CT', charge: -0.18 },
      { element: 'C', name: 'C2', charge: 0.06 },
      { element: 'C', name: 'C3', charge: 0.06 },
      { element: 'C', name: 'C4', charge: -0.18 },
      { element: 'H', name: 'H1', mass: 2.014, charge: 0.24 },
    ],
    coordinates: [
      [0, 0, 0],
      [1.53, 0, 0],
      [2.04, 1.44, 0],
      [3.57, 1.44, 0.1],
      [3, 4, 0],
    ],
    bonds: [[0, 1], [1, 2], [2, 3], [0, 4]],
    terms: [
      { kind: 'harmonic-bond', atoms: [0, 1], k: 620, r0: 1.53 },
      { kind: 'morse-bond', atoms: [1, 2], D: 88, a: 1.8, r0: 1.53 },
      { kind: 'harmonic-angle', atoms: [0, 1, 2], k: 80, theta0: 109.5 },
      { kind: 'cosine-angle', atoms: [1, 2, 3], k: 60, theta0: 111 },
      { kind: 'urey-bradley', atoms: [0, 1, 2], k: 22, s0: 2.5 },
      { kind: 'periodic-dihedral', atoms: [0, 1, 2, 3], k: -0.2, n: 3, phase: 180 },
      { kind: 'ryckaert-bellemans', atoms: [0, 1, 2, 3], c: [2.2, 2.9, -0.7, -4.4, 0, 0] },
      { kind: 'harmonic-improper', atoms: [1, 0, 2, 3], k: 10, xi0: -35.26 },
      { kind: 'position-restraint', atoms: [3], k: 5, x0: [3.5, 1.4, 0], flat: 0.2 },
      { kind: 'position-restraint', atoms: [2], k: 5, x0: [2, 1.5, 0] },
      { kind: 'distance-restraint', atoms: [0, 3], k: 3, lower: 3, upper: 4.2 },
      { kind: 'cosine-series-angle', atoms: [0, 1, 2], k: 90, theta0: 109.47 },
      { kind: 'periodic-angle', atoms: [1, 2, 3], k: 40, n: 3, theta0: 120 },
      { kind: 'inversion', atoms: [1, 0, 2, 4], k: 6, omega0: 0 },
    ],
    nonbonded: {
      lennardJones: {
        rmin: [3.8, 3.8, 3.8, 3.8, 2.6],
        epsilon: [0.1, 0.1, 0.1, 0.1, 0.02],
        combination: 'lorentz-berthelot',
      },
      coulomb: { dielectric: 4 },
      exclusions: { bondSeparation: 2, scale14: { lennardJones: 0.5, coulomb: 0.8333 } },
      cutoff: 9,
    },
    frozen: [0],
    constraints: [{ kind: 'fixed-distance', atoms: [0, 4] }],
    metadata: { source: 'hand-made', nested: { list: [1, 'two', null, true, { deep: [[]] }] } },
  };
}

/** The same kinds in nanometre and kJ/mol (values chosen independently; only validity matters). */
export function allKindsNanometer(): Loose {
  const m = allKindsAngstrom();
  m.units = { length: 'nanometer', energy: 'kJ/mol' };
  m.coordinates = [
    [0, 0, 0],
    [0.153, 0, 0],
    [0.204, 0.144, 0],
    [0.357, 0.144, 0.01],
    [0.3, 0.4, 0],
  ];
  m.terms = [
    { kind: 'harmonic-bond', atoms: [0, 1], k: 259408, r0: 0.153 },
    { kind: 'morse-bond', atoms: [1, 2], D: 368, a: 18, r0: 0.153 },
    { kind: 'harmonic-angle', atoms: [0, 1, 2], k: 335, theta0: 109.5 },
    { kind: 'cosine-angle', atoms: [1, 2, 3], k: 250, theta0: 111 },
    { kind: 'urey-bradley', atoms: [0, 1, 2], k: 9205, s0: 0.25 },
    { kind: 'periodic-dihedral', atoms: [0, 1, 2, 3], k: 0.8, n: 1, phase: 0 },
    { kind: 'ryckaert-bellemans', atoms: [0, 1, 2, 3], c: [9.28, 12.16, -13.12, -3.06, 26.24, -31.5] },
    { kind: 'harmonic-improper', atoms: [1, 0, 2, 3], k: 41.8, xi0: 0 },
    { kind: 'position-restraint', atoms: [3], k: 1000, x0: [0.35, 0.14, 0], flat: 0 },
    { kind: 'distance-restraint', atoms: [0, 3], k: 1000, lower: 0.3, upper: 0.3 },
    { kind: 'cosine-series-angle', atoms: [0, 1, 2], k: 380, theta0: 120 },
    { kind: 'periodic-angle', atoms: [1, 2, 3], k: 200, n: 1, theta0: 180 },
    { kind: 'inversion', atoms: [1, 0, 2, 4], k: 90, omega0: 84.4339 },
  ];
  m.nonbonded = {
    lennardJones: { rmin: [0.38, 0.38, 0.38, 0.38, 0.26], epsilon: [0.4, 0.4, 0.4, 0.4, 0.08], combination: 'geometric' },
    cutoff: null,
  };
  return m;
}

/**
 * A chain of `n` carbon atoms 1.5 Å apart along x, with a bond, a
 * harmonic-bond term and (after all the bond terms) a harmonic-angle term
 * for each consecutive pair and triple. With n = 31, `terms[12]` is the bond
 * term 12-13 and `terms[30]` the first angle.
 */
export function chain(n = 31): Loose {
  const atoms = Array.from({ length: n }, () => ({ element: 'C' }));
  const coordinates = Array.from({ length: n }, (_, i) => [1.5 * i, 0, 0]);
  const bonds = Array.from({ length: n - 1 }, (_, i) => [i, i + 1]);
  const terms: Loose[] = [
    ...bonds.map(([i, j]) => ({ kind: 'harmonic-bond', atoms: [i, j], k: 300, r0: 1.5 })),
    ...Array.from({ length: n - 2 }, (_, i) => ({ kind: 'harmonic-angle', atoms: [i, i + 1, i + 2], k: 60, theta0: 180 })),
  ];
  return {
    format: 'strainwise-model',
    version: 1,
    units: { length: 'angstrom', energy: 'kcal/mol' },
    atoms,
    coordinates,
    bonds,
    terms,
  };
}

/**
 * Assert that `run` throws a ModelError whose message is exactly `message`,
 * and return it.
 */
export function expectModelError(run: () => unknown, message: string): ModelError {
  expect(run).toThrow(ModelError);
  try {
    run();
  } catch (e) {
    expect((e as ModelError).message).toBe(message);
    return e as ModelError;
  }
  throw new Error('unreachable');
}

/** A modified copy of `base`. */
export function edited(base: Loose, change: (m: Loose) => void): Loose {
  const m = structuredClone(base);
  change(m);
  return m;
}
