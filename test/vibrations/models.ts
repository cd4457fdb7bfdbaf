/**
 * Small models for the vibration tests, built at their stationary points
 * from internal coordinates. Parameters are invented for the tests unless a
 * comment names a source.
 */
import type { ModelFile, TermRecord } from '../../src/model/schema.js';
import type { Units } from '../../src/units.js';
import { chain, triangle } from '../helpers/geometry.js';
import { SPEC_WATER } from '../fixtures/models.js';

const DEG = Math.PI / 180;

function rows(x: Float64Array): [number, number, number][] {
  const out: [number, number, number][] = [];
  for (let a = 0; a < x.length; a += 3) out.push([x[a], x[a + 1], x[a + 2]]);
  return out;
}

/** A model file from its parts (kcal/mol and Å unless `units` says otherwise). */
export function modelFile(
  atoms: { element: string; mass?: number }[],
  x: Float64Array,
  terms: TermRecord[],
  units: Units = { length: 'angstrom', energy: 'kcal/mol' },
): ModelFile {
  return { format: 'strainwise-model', version: 1, units, atoms, coordinates: rows(x), terms } as ModelFile;
}

/** The spec's water model (bonds k 1100 at r0 0.9572 Å, angle k 100 at 104.52°) placed exactly at its minimum. */
export function waterAtMinimum(): ModelFile {
  const x = triangle(0.9572, 0.9572, 104.52 * DEG); // H1, O, H2
  const coordinates = rows(Float64Array.of(x[3], x[4], x[5], x[0], x[1], x[2], x[6], x[7], x[8]));
  return { ...structuredClone(SPEC_WATER), coordinates };
}

/** A linear O=C=O model: bonds k at r0, the O–C–O angle held at 180° by a harmonic-angle of curvature kAngle. */
export function carbonDioxide(k = 1600, r0 = 1.16, kAngle = 60): ModelFile {
  return modelFile(
    [{ element: 'O' }, { element: 'C' }, { element: 'O' }],
    Float64Array.of(-r0, 0, 0, 0, 0, 0, r0, 0, 0),
    [
      { kind: 'harmonic-bond', atoms: [0, 1], k, r0 },
      { kind: 'harmonic-bond', atoms: [1, 2], k, r0 },
      { kind: 'harmonic-angle', atoms: [0, 1, 2], k: kAngle, theta0: 180 },
    ],
  );
}

/**
 * A four-carbon chain at the top of its torsion barrier: bonds and angles at
 * their references, a periodic dihedral k [1 + cos φ] with φ = 0 (cis), its
 * maximum, so the structure is a first-order saddle point.
 */
export function torsionBarrierTop(): ModelFile {
  const theta = 112 * DEG;
  const x = chain(1.53, 1.53, 1.53, theta, theta, 0);
  return modelFile(
    [{ element: 'C' }, { element: 'C' }, { element: 'C' }, { element: 'C' }],
    x,
    [
      { kind: 'harmonic-bond', atoms: [0, 1], k: 600, r0: 1.53 },
      { kind: 'harmonic-bond', atoms: [1, 2], k: 600, r0: 1.53 },
      { kind: 'harmonic-bond', atoms: [2, 3], k: 600, r0: 1.53 },
      { kind: 'harmonic-angle', atoms: [0, 1, 2], k: 120, theta0: 112 },
      { kind: 'harmonic-angle', atoms: [1, 2, 3], k: 120, theta0: 112 },
      { kind: 'periodic-dihedral', atoms: [0, 1, 2, 3], k: 2, n: 1, phase: 0 },
    ],
  );
}
