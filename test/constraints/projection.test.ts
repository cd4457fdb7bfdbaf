/**
 * The projection of src/constraints/projection.ts: frozen atoms held
 * bit-for-bit, fixed distances to the spec's 1e-10 relative, the projected
 * gradient free of components along the constraints, idempotence, and the
 * refusal of constraints that cannot all hold.
 */
import { describe, expect, it } from 'vitest';
import { createProjection, type ConstraintProjection } from '../../src/constraints/projection.js';
import { ModelError } from '../../src/errors.js';
import { createRandom, type Random } from '../helpers/random.js';
import {
  alongConstraint,
  chain,
  type ConstrainedCase,
  distance,
  norm,
  perturbed,
  randomVector,
  rigidCube,
  ring,
  star,
  touchingFrozen,
  waterTriangle,
} from './geometries.js';

/** The spec's tolerance of a fixed distance (../shared/spec/model-file.md, "Frozen atoms and constraints"). */
const SPEC_TOLERANCE = 1e-10;
/** The brief's bound on (g_j − g_i)·r̂_ij after projection, relative to |g| (issue 3, section 2). */
const GRADIENT_BOUND = 1e-12;
/** Random geometries per case. */
const TRIALS = 40;

const CASES: readonly ((rng: Random) => ConstrainedCase)[] = [
  (rng) => chain(rng, 2),
  (rng) => chain(rng, 12),
  (rng) => ring(rng, 5),
  (rng) => ring(rng, 6),
  (rng) => waterTriangle(rng),
  (rng) => touchingFrozen(rng),
  (rng) => chain(rng, 6, [0, 5]),
  (rng) => ring(rng, 6, [1]),
  // Ring bonds 0 and 39 are coupled but 39 apart in the list: renumbered for the direct solve.
  (rng) => ring(rng, 40),
  // Linearly dependent constraint directions: the direct factorization finds a zero pivot, conjugate gradients follow.
  (rng) => rigidCube(rng),
  // 30 constraints all coupled through the centre (band wider than BAND_LIMIT): conjugate gradients alone.
  (rng) => star(rng, 30),
];

function projectionOf(c: ConstrainedCase): ConstraintProjection {
  return createProjection({ atomCount: c.atomCount, frozen: c.frozen, distances: c.distances });
}

/** A case, a perturbed copy of its reference and the projection of that copy (which must succeed). */
function projectedSample(rng: Random, make: (rng: Random) => ConstrainedCase, amplitude = 0.1) {
  const c = make(rng);
  const projection = projectionOf(c);
  const x = perturbed(rng, c.reference, amplitude);
  const ok = projection.projectPositions(x, c.reference);
  return { c, projection, x, ok };
}

describe('projectPositions', () => {
  CASES.forEach((make, m) => {
    it(`holds every distance to 1e-10 relative and frozen atoms bit-for-bit: ${make(createRandom(1)).name}`, () => {
      const rng = createRandom(1000 + m);
      for (let t = 0; t < TRIALS; t++) {
        const { c, projection, x, ok } = projectedSample(rng, make);
        expect(ok).toBe(true);
        for (const d of c.distances) {
          expect(Math.abs(distance(x, d.i, d.j) - d.length)).toBeLessThanOrEqual(SPEC_TOLERANCE * d.length);
        }
        for (const a of c.frozen) {
          for (let k = 0; k < 3; k++) expect(Object.is(x[3 * a + k], c.reference[3 * a + k])).toBe(true);
        }
        expect(projection.satisfied(x)).toBe(true);
      }
    });
  });

  it('leaves atoms outside every constraint where they were, bit-for-bit (exact by construction)', () => {
    const rng = createRandom(7);
    const c = touchingFrozen(rng);
    const x = perturbed(rng, c.reference, 0.1);
    const before = x.slice(18, 21); // atom 6: free, in no constraint
    expect(projectionOf(c).projectPositions(x, c.reference)).toBe(true);
    expect(Array.from(x.subarray(18, 21))).toEqual(Array.from(before));
  });

  it('is idempotent: a projected point is left bit-for-bit unchanged (exact by construction)', () => {
    const rng = createRandom(8);
    CASES.forEach((make) => {
      const { c, projection, x, ok } = projectedSample(rng, make);
      expect(ok).toBe(true);
      const again = x.slice();
      expect(projection.projectPositions(again, x)).toBe(true);
      expect(Array.from(again)).toEqual(Array.from(x));
      // And with the original reference for the directions.
      const third = x.slice();
      expect(projection.projectPositions(third, c.reference)).toBe(true);
      expect(Array.from(third)).toEqual(Array.from(x));
    });
  });

  it('frozen atoms only: copies them from reference and touches nothing else', () => {
    const projection = createProjection({ atomCount: 3, frozen: [2, 0] });
    const reference = new Float64Array([1, 2, 3, 4, 5, 6, 7, 8, 9]);
    const x = new Float64Array([0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9]);
    expect(projection.projectPositions(x, reference)).toBe(true);
    expect(Array.from(x)).toEqual([1, 2, 3, 0.4, 0.5, 0.6, 7, 8, 9]);
    expect(Array.from(projection.frozen)).toEqual([0, 2]);
  });

  it('a constraint to a frozen atom moves only the free atom, along the reference bond', () => {
    // Reference: atom 0 frozen at the origin, atom 1 at (2, 0, 0); length 2.
    // x moves atom 1 to (3, 0, 0): corrections along (1, 0, 0) bring it back towards (2, 0, 0)
    // (Newton steps on |d|² = 4, stopped within the spec's 1e-10 relative); y and z stay 0.
    const projection = createProjection({ atomCount: 2, frozen: [0], distances: [{ i: 0, j: 1, length: 2 }] });
    const reference = new Float64Array([0, 0, 0, 2, 0, 0]);
    const x = new Float64Array([0.5, 0.5, 0.5, 3, 0, 0]);
    expect(projection.projectPositions(x, reference)).toBe(true);
    expect(Array.from(x.subarray(0, 3))).toEqual([0, 0, 0]);
    expect(Math.abs(x[3] - 2)).toBeLessThanOrEqual(SPEC_TOLERANCE * 2);
    expect(x[4]).toBe(0);
    expect(x[5]).toBe(0);
  });

  it('returns false when the bond has turned perpendicular to its reference direction (denominator 0)', () => {
    // Reference bond along x, current bond along y: d·s = 0 exactly (exact by construction).
    const projection = createProjection({ atomCount: 2, distances: [{ i: 0, j: 1, length: 1 }] });
    const reference = new Float64Array([0, 0, 0, 1, 0, 0]);
    const x = new Float64Array([0, 0, 0, 0, 2, 0]);
    expect(projection.projectPositions(x, reference)).toBe(false);
  });

  it('returns false on a non-finite coordinate', () => {
    const projection = createProjection({ atomCount: 2, distances: [{ i: 0, j: 1, length: 1 }] });
    const reference = new Float64Array([0, 0, 0, 1, 0, 0]);
    expect(projection.projectPositions(new Float64Array([0, 0, 0, NaN, 0, 0]), reference)).toBe(false);
    expect(projection.projectPositions(new Float64Array([0, 0, 0, Infinity, 0, 0]), reference)).toBe(false);
  });

  it('returns false when the iteration cap is reached (a triangle breaking the triangle inequality)', () => {
    // Lengths 1, 1, 3: 3 > 1 + 1, so no three points satisfy them (triangle inequality).
    const projection = createProjection({
      atomCount: 3,
      maxIterations: 50,
      distances: [
        { i: 0, j: 1, length: 1 },
        { i: 1, j: 2, length: 1 },
        { i: 0, j: 2, length: 3 },
      ],
    });
    const x = new Float64Array([0, 0, 0, 1, 0, 0, 0, 1, 0]);
    expect(projection.projectPositions(x.slice(), x)).toBe(false);
  });
});

describe('projectGradient', () => {
  CASES.forEach((make, m) => {
    it(`removes every component along the constraints and zeroes frozen atoms: ${make(createRandom(1)).name}`, () => {
      const rng = createRandom(2000 + m);
      for (let t = 0; t < TRIALS; t++) {
        const { c, projection, x, ok } = projectedSample(rng, make);
        expect(ok).toBe(true);
        const g = randomVector(rng, 3 * c.atomCount);
        const scale = norm(g);
        projection.projectGradient(x, g);
        for (const d of c.distances) {
          expect(Math.abs(alongConstraint(x, g, d))).toBeLessThanOrEqual(GRADIENT_BOUND * scale);
        }
        for (const a of c.frozen) {
          for (let k = 0; k < 3; k++) expect(g[3 * a + k]).toBe(0);
        }
      }
    });
  });

  it('is an orthogonal projection: (g − Pg)·Pv = 0 and P(Pg) = Pg, to 1e-12 relative', () => {
    const rng = createRandom(3000);
    CASES.forEach((make) => {
      for (let t = 0; t < 10; t++) {
        const { c, projection, x } = projectedSample(rng, make);
        const g = randomVector(rng, 3 * c.atomCount);
        const pg = g.slice();
        projection.projectGradient(x, pg);
        const pv = randomVector(rng, 3 * c.atomCount);
        projection.projectGradient(x, pv);
        let dot = 0;
        for (let k = 0; k < g.length; k++) dot += (g[k] - pg[k]) * pv[k];
        expect(Math.abs(dot)).toBeLessThanOrEqual(GRADIENT_BOUND * norm(g) * norm(pv));
        const ppg = pg.slice();
        projection.projectGradient(x, ppg);
        for (let k = 0; k < g.length; k++) expect(Math.abs(ppg[k] - pg[k])).toBeLessThanOrEqual(GRADIENT_BOUND * norm(g));
      }
    });
  });

  it('one constraint between free atoms: subtracts the mean of the two along-bond components (hand-checked)', () => {
    // Bond along x; g_i = (1, 2, 3), g_j = (5, 0, 0): (g_j − g_i)·x̂ = 4, λ = 4 / 2 = 2,
    // so g_i → (1 + 2, 2, 3) and g_j → (5 − 2, 0, 0). All values exact in binary.
    const projection = createProjection({ atomCount: 2, distances: [{ i: 0, j: 1, length: 1 }] });
    const x = new Float64Array([0, 0, 0, 1, 0, 0]);
    const g = new Float64Array([1, 2, 3, 5, 0, 0]);
    projection.projectGradient(x, g);
    expect(Array.from(g)).toEqual([3, 2, 3, 3, 0, 0]);
  });

  it('a constraint to a frozen atom removes the free atom\'s whole along-bond component (hand-checked)', () => {
    // Atom 0 frozen; bond along y; g_1 = (1, 4, −2) → (1, 0, −2); g_0 → 0.
    const projection = createProjection({ atomCount: 2, frozen: [0], distances: [{ i: 0, j: 1, length: 2 }] });
    const x = new Float64Array([0, 0, 0, 0, 2, 0]);
    const g = new Float64Array([7, 7, 7, 1, 4, -2]);
    projection.projectGradient(x, g);
    expect(Array.from(g)).toEqual([0, 0, 0, 1, 0, -2]);
  });
});

describe('satisfied and largestViolation', () => {
  it('name the constraint furthest from its length (values exact by construction)', () => {
    // Atoms at 0, (1,0,0), (0,1,0): distances 1, √2, 1 against lengths 1, 1, 3.
    const projection = createProjection({
      atomCount: 3,
      distances: [
        { i: 0, j: 1, length: 1 },
        { i: 1, j: 2, length: 1 },
        { i: 0, j: 2, length: 3 },
      ],
    });
    const x = new Float64Array([0, 0, 0, 1, 0, 0, 0, 1, 0]);
    expect(projection.satisfied(x)).toBe(false);
    expect(projection.largestViolation(x)).toEqual({ constraint: 2, violation: 2, relative: 2 / 3 });
    // A chain listed out of order (renumbered inside): indices still refer to the list given.
    // Atoms at x = 0, 1, 2, 3, 4; only distances[2] (3-4, length 1.5) is off, by 0.5.
    const shuffled = createProjection({
      atomCount: 5,
      distances: [
        { i: 2, j: 3, length: 1 },
        { i: 0, j: 1, length: 1 },
        { i: 3, j: 4, length: 1.5 },
        { i: 1, j: 2, length: 1 },
      ],
    });
    const line = new Float64Array([0, 0, 0, 1, 0, 0, 2, 0, 0, 3, 0, 0, 4, 0, 0]);
    expect(shuffled.largestViolation(line)).toEqual({ constraint: 2, violation: 0.5, relative: 0.5 / 1.5 });
    const none = createProjection({ atomCount: 1 });
    expect(none.satisfied(new Float64Array(3))).toBe(true);
    expect(none.largestViolation(new Float64Array(3))).toEqual({ constraint: -1, violation: 0, relative: 0 });
  });
});

describe('refusal of constraints that cannot all hold', () => {
  function refusal(run: () => unknown): ModelError {
    try {
      run();
    } catch (e) {
      expect(e).toBeInstanceOf(ModelError);
      return e as ModelError;
    }
    throw new Error('expected a ModelError');
  }

  it('a triangle breaking the triangle inequality', () => {
    // Lengths 1, 1, 3 (3 > 1 + 1); at the start the distances are 1, √2, 1, so the
    // largest violation is |1 − 3| = 2 in constraints[2] (exact by construction).
    const e = refusal(() =>
      createProjection({
        atomCount: 3,
        distances: [
          { i: 0, j: 1, length: 1 },
          { i: 1, j: 2, length: 1 },
          { i: 0, j: 2, length: 3 },
        ],
        start: new Float64Array([0, 0, 0, 1, 0, 0, 0, 1, 0]),
      }),
    );
    expect(e.place).toBe('constraints');
    expect(e.message).toBe(
      'constraints: cannot all be satisfied from the given coordinates (largest violation 2 length units in constraints[2])',
    );
  });

  it('a chain between two frozen atoms further apart than the sum of its lengths', () => {
    // Frozen atoms 0 and 2 are 5 apart; lengths 1 + 1 < 5. Atom 1 at (1, 0, 0): violations
    // |1 − 1| = 0 and |4 − 1| = 3, so constraints[1] by 3 (exact by construction).
    const e = refusal(() =>
      createProjection({
        atomCount: 3,
        frozen: [0, 2],
        distances: [
          { i: 0, j: 1, length: 1 },
          { i: 1, j: 2, length: 1 },
        ],
        start: new Float64Array([0, 0, 0, 1, 0, 0, 5, 0, 0]),
        lengthUnit: 'Å',
      }),
    );
    expect(e.message).toBe('constraints: cannot all be satisfied from the given coordinates (largest violation 3 Å in constraints[1])');
  });

  it('accepts satisfiable start coordinates and leaves them unmodified', () => {
    const rng = createRandom(9);
    const c = ring(rng, 6, [2]);
    const start = perturbed(rng, c.reference, 0.05);
    const copy = start.slice();
    const projection = createProjection({ atomCount: 6, frozen: c.frozen, distances: c.distances, start });
    expect(projection.constraintCount).toBe(6);
    expect(Array.from(start)).toEqual(Array.from(copy));
  });
});

describe('options', () => {
  const refused = (options: Parameters<typeof createProjection>[0], message: string): void => {
    expect(() => createProjection(options)).toThrow(new RangeError(message));
  };

  it('refuses what cannot be a constraint set, naming the place', () => {
    refused({ atomCount: 2, frozen: [2] }, 'frozen[0]: index 2 is out of range (2 atoms)');
    refused({ atomCount: 2, frozen: [1, 1] }, 'frozen[1]: atom 1 is listed twice');
    refused({ atomCount: 2, distances: [{ i: 0, j: 3, length: 1 }] }, 'distances[0]: index 3 is out of range (2 atoms)');
    refused({ atomCount: 2, distances: [{ i: 1, j: 1, length: 1 }] }, 'distances[0]: atom 1 is constrained to itself');
    refused({ atomCount: 2, distances: [{ i: 0, j: 1, length: 0 }] }, 'distances[0]: expected a length > 0, got 0');
    refused(
      { atomCount: 3, distances: [{ i: 0, j: 1, length: 1 }, { i: 2, j: 0, length: 1 }, { i: 1, j: 0, length: 2 }] },
      'distances[2]: pair 1-0 is constrained twice (first at distances[0])',
    );
    refused(
      { atomCount: 2, frozen: [0, 1], distances: [{ i: 0, j: 1, length: 1 }] },
      'distances[0]: atoms 0 and 1 are both frozen; a constraint between two frozen atoms is not allowed',
    );
    refused({ atomCount: 2, tolerance: 0 }, 'tolerance: expected a number in (0, 1), got 0');
    refused({ atomCount: 2, maxIterations: 0 }, 'maxIterations: expected a positive integer, got 0');
    refused({ atomCount: 2, start: new Float64Array(5) }, 'start: expected 3N = 6 numbers, got 5');
  });

  it('reports its counts and tolerance', () => {
    const p = createProjection({ atomCount: 4, frozen: [3], distances: [{ i: 0, j: 1, length: 1 }], tolerance: 1e-8 });
    expect([p.atomCount, p.constraintCount, p.tolerance, Array.from(p.frozen)]).toEqual([4, 1, 1e-8, [3]]);
    expect(createProjection({ atomCount: 1 }).tolerance).toBe(1e-10); // the spec's default
  });
});
