/**
 * projectionForModel (src/constraints/from-model.ts): the model's frozen
 * atoms and constraints, extra frozen atoms, and the refusals.
 */
import { describe, expect, it } from 'vitest';
import { projectionForModel } from '../../src/constraints/from-model.js';
import { ModelError } from '../../src/errors.js';
import { parseModel } from '../../src/model/model.js';
import type { ModelFile } from '../../src/model/schema.js';
import { SPEC_WATER } from '../fixtures/models.js';
import { createRandom } from '../helpers/random.js';
import { distance, perturbed } from './geometries.js';

/** Four atoms on a bent chain (invented coordinates); constraints and frozen atoms added per test. */
function chainFile(extra: Partial<ModelFile> = {}): ModelFile {
  return {
    format: 'strainwise-model',
    version: 1,
    units: { length: 'angstrom', energy: 'kcal/mol' },
    atoms: [{ element: 'C' }, { element: 'C' }, { element: 'C' }, { element: 'C' }],
    coordinates: [
      [0, 0, 0],
      [1.5, 0, 0],
      [2, 1.4, 0],
      [3.5, 1.4, 0.3],
    ],
    terms: [{ kind: 'harmonic-bond', atoms: [0, 1], k: 300, r0: 1.5 }],
    ...extra,
  };
}

/** The ModelError that `run` throws (fails the test when it throws nothing or something else). */
function caught(run: () => unknown): ModelError {
  try {
    run();
  } catch (e) {
    expect(e).toBeInstanceOf(ModelError);
    return e as ModelError;
  }
  throw new Error('expected a ModelError');
}

describe('projectionForModel', () => {
  it('returns undefined for a model with neither frozen atoms nor constraints', () => {
    expect(projectionForModel(parseModel(SPEC_WATER))).toBeUndefined();
  });

  it('takes the model\'s frozen atoms, and extra ones from the option (merged, sorted)', () => {
    const model = parseModel(chainFile({ frozen: [3, 1] }));
    expect(Array.from(projectionForModel(model)?.frozen ?? [])).toEqual([1, 3]);
    const more = projectionForModel(model, undefined, { frozen: [0, 3] });
    expect(Array.from(more?.frozen ?? [])).toEqual([0, 1, 3]);
    const onlyExtra = projectionForModel(parseModel(SPEC_WATER), undefined, { frozen: [2] });
    expect(Array.from(onlyExtra?.frozen ?? [])).toEqual([2]);
    expect(onlyExtra?.constraintCount).toBe(0);
  });

  it('holds the model\'s constraints, with lengths defaulted from the coordinates, to 1e-10 relative', () => {
    const model = parseModel(
      chainFile({
        frozen: [0],
        constraints: [
          { kind: 'fixed-distance', atoms: [0, 1] },
          { kind: 'fixed-distance', atoms: [1, 2] },
          { kind: 'fixed-distance', atoms: [2, 3], length: 1.55 },
        ],
      }),
    );
    const x0 = model.coordinates;
    const projection = projectionForModel(model);
    expect(projection?.constraintCount).toBe(3);
    // Start from the model's coordinates projected once, then perturb and project again.
    const reference = x0.slice();
    expect(projection?.projectPositions(reference, x0)).toBe(true);
    const rng = createRandom(11);
    for (let t = 0; t < 20; t++) {
      const x = perturbed(rng, reference, 0.1);
      expect(projection?.projectPositions(x, reference)).toBe(true);
      // Lengths: 1.5 (atoms 0-1 of chainFile), |(0.5, 1.4, 0)| = √2.21, and the file's 1.55.
      const expected = [1.5, Math.sqrt(2.21), 1.55];
      [
        [0, 1],
        [1, 2],
        [2, 3],
      ].forEach(([i, j], c) => {
        expect(Math.abs(distance(x, i, j) - expected[c])).toBeLessThanOrEqual(1e-10 * expected[c]);
      });
      expect(Array.from(x.subarray(0, 3))).toEqual([0, 0, 0]); // frozen atom 0, bit-for-bit
    }
  });

  it('refuses constraints that cannot all hold from the given coordinates, in the model\'s length unit', () => {
    // Frozen atoms 0 and 2 are 5 apart; lengths 1 + 1 < 5. Atom 1 at (1, 0, 0): the largest
    // violation is |4 − 1| = 3 in constraints[1] (exact by construction).
    const file = (length: 'angstrom' | 'nanometer'): ModelFile => ({
      ...chainFile(),
      units: { length, energy: 'kJ/mol' },
      atoms: [{ element: 'C' }, { element: 'C' }, { element: 'C' }],
      coordinates: [
        [0, 0, 0],
        [1, 0, 0],
        [5, 0, 0],
      ],
      frozen: [0, 2],
      constraints: [
        { kind: 'fixed-distance', atoms: [0, 1], length: 1 },
        { kind: 'fixed-distance', atoms: [1, 2], length: 1 },
      ],
    });
    const message = (unit: string): string =>
      `constraints: cannot all be satisfied from the given coordinates (largest violation 3 ${unit} in constraints[1])`;
    const angstrom = caught(() => projectionForModel(parseModel(file('angstrom'))));
    expect(angstrom.place).toBe('constraints');
    expect(angstrom.message).toBe(message('Å'));
    expect(caught(() => projectionForModel(parseModel(file('nanometer')))).message).toBe(message('nm'));
  });

  it('checks the coordinates it is given rather than the file\'s, and does not modify them', () => {
    // In the file, frozen atoms 0 and 2 are 1.5 apart, within reach of lengths 1 + 1.
    // The given x moves atom 2 to (5, 0, 0) and atom 1 to (1, 0, 0): violations 0 and
    // |4 − 1| = 3, so constraints[1] by 3 (exact by construction).
    const model = parseModel(
      chainFile({
        atoms: [{ element: 'C' }, { element: 'C' }, { element: 'C' }],
        coordinates: [
          [0, 0, 0],
          [1, 0.5, 0],
          [1.5, 0, 0],
        ],
        frozen: [0, 2],
        constraints: [
          { kind: 'fixed-distance', atoms: [0, 1], length: 1 },
          { kind: 'fixed-distance', atoms: [1, 2], length: 1 },
        ],
      }),
    );
    expect(projectionForModel(model)?.constraintCount).toBe(2);
    const x = new Float64Array([0, 0, 0, 1, 0, 0, 5, 0, 0]);
    expect(caught(() => projectionForModel(model, x)).message).toBe(
      'constraints: cannot all be satisfied from the given coordinates (largest violation 3 Å in constraints[1])',
    );
    expect(Array.from(x)).toEqual([0, 0, 0, 1, 0, 0, 5, 0, 0]);
  });

  it('refuses an extra frozen atom that ties a constraint between two frozen atoms', () => {
    const model = parseModel(chainFile({ frozen: [0], constraints: [{ kind: 'fixed-distance', atoms: [0, 1] }] }));
    const e = caught(() => projectionForModel(model, undefined, { frozen: [1] }));
    expect(e.place).toBe('constraints[0]');
    expect(e.message).toBe(
      'constraints[0]: atoms 0 and 1 are both frozen; a constraint between two frozen atoms is not allowed',
    );
  });

  it('refuses coordinates of the wrong length and extra frozen atoms out of range', () => {
    const model = parseModel(chainFile({ frozen: [0] }));
    expect(() => projectionForModel(model, new Float64Array(9))).toThrow(
      new RangeError('coordinates: expected 3N = 12 numbers, got 9'),
    );
    expect(() => projectionForModel(model, undefined, { frozen: [4] })).toThrow(
      new RangeError('frozen[0]: index 4 is out of range (model has 4 atoms)'),
    );
  });
});
