/**
 * The embedded example: a made-up, chloroethanol-like chain of nine atoms
 * (Cl–CH2–CH2–O–H) held a little away from rest, with one or more terms of
 * every kind. The parameters are illustrative values chosen for this demo,
 * not taken from any force field: do not use them for real work.
 * @module
 */
import type { ModelFile } from '../model/schema.js';

/** The demo model file (Å, kcal/mol). Atoms: 0 Cl, 1 C1, 2 C2, 3 O, 4 H on O, 5–6 H on C1, 7–8 H on C2. */
export const DEMO_MODEL: ModelFile = {
  format: 'strainwise-model',
  version: 1,
  title: 'demo: a chloroethanol-like chain, slightly strained (illustrative parameters)',
  units: { length: 'angstrom', energy: 'kcal/mol' },
  atoms: [
    { element: 'Cl', name: 'Cl' },
    { element: 'C', name: 'C1' },
    { element: 'C', name: 'C2' },
    { element: 'O', name: 'O' },
    { element: 'H', name: 'HO' },
    { element: 'H', name: 'H1a' },
    { element: 'H', name: 'H1b' },
    { element: 'H', name: 'H2a' },
    { element: 'H', name: 'H2b' },
  ],
  coordinates: [
    [-0.6122, -0.7109, 1.5245],
    [0, 0, 0],
    [1.53, 0, 0],
    [2.0073, -1.348, 0],
    [1.6726, -1.7845, 0.7989],
    [-0.3629, -0.5935, -0.8392],
    [-0.3629, 1.0243, -0.0848],
    [1.8883, 0.5224, 0.887],
    [1.8883, 0.5224, -0.887],
  ],
  bonds: [
    [1, 0],
    [1, 2],
    [2, 3],
    [3, 4],
    [1, 5],
    [1, 6],
    [2, 7],
    [2, 8],
  ],
  terms: [
    { kind: 'harmonic-bond', atoms: [1, 0], k: 440, r0: 1.78 },
    { kind: 'harmonic-bond', atoms: [1, 2], k: 620, r0: 1.526 },
    { kind: 'harmonic-bond', atoms: [2, 3], k: 640, r0: 1.41 },
    { kind: 'harmonic-bond', atoms: [1, 5], k: 680, r0: 1.09 },
    { kind: 'harmonic-bond', atoms: [1, 6], k: 680, r0: 1.09 },
    { kind: 'harmonic-bond', atoms: [2, 7], k: 680, r0: 1.09 },
    { kind: 'harmonic-bond', atoms: [2, 8], k: 680, r0: 1.09 },
    { kind: 'morse-bond', atoms: [3, 4], D: 110, a: 2.2, r0: 0.96 },
    { kind: 'harmonic-angle', atoms: [0, 1, 2], k: 130, theta0: 110.5 },
    { kind: 'harmonic-angle', atoms: [1, 2, 3], k: 140, theta0: 109 },
    { kind: 'harmonic-angle', atoms: [5, 1, 0], k: 70, theta0: 107.5 },
    { kind: 'harmonic-angle', atoms: [6, 1, 0], k: 70, theta0: 107.5 },
    { kind: 'harmonic-angle', atoms: [5, 1, 2], k: 70, theta0: 110.5 },
    { kind: 'harmonic-angle', atoms: [6, 1, 2], k: 70, theta0: 110.5 },
    { kind: 'harmonic-angle', atoms: [7, 2, 1], k: 70, theta0: 110 },
    { kind: 'harmonic-angle', atoms: [8, 2, 1], k: 70, theta0: 110 },
    { kind: 'harmonic-angle', atoms: [7, 2, 3], k: 70, theta0: 109.5 },
    { kind: 'harmonic-angle', atoms: [8, 2, 3], k: 70, theta0: 109.5 },
    { kind: 'cosine-angle', atoms: [2, 3, 4], k: 110, theta0: 108.5 },
    { kind: 'urey-bradley', atoms: [5, 1, 6], k: 40, s0: 1.78 },
    { kind: 'urey-bradley', atoms: [7, 2, 8], k: 40, s0: 1.78 },
    { kind: 'periodic-dihedral', atoms: [0, 1, 2, 3], k: 0.6, n: 3, phase: 0 },
    { kind: 'periodic-dihedral', atoms: [0, 1, 2, 3], k: 0.9, n: 1, phase: 180 },
    { kind: 'periodic-dihedral', atoms: [5, 1, 2, 7], k: 0.15, n: 3, phase: 0 },
    { kind: 'ryckaert-bellemans', atoms: [1, 2, 3, 4], c: [0.45, 0.8, -0.3, -0.6, 0.4, -0.2] },
    { kind: 'harmonic-improper', atoms: [5, 6, 0, 1], k: 12, xi0: 35 },
    { kind: 'position-restraint', atoms: [0], k: 5, x0: [-0.45, -0.7109, 1.5245], flat: 0.1 },
    { kind: 'distance-restraint', atoms: [0, 4], k: 10, lower: 2.7, upper: 3.2 },
  ],
  metadata: { scenario: 'invented for the strainwise demo' },
};
