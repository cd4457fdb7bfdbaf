/**
 * The projection's properties on generated chains and rings (fast-check):
 * random sizes, frozen atoms, perturbations and gradients, each run replayable
 * from its seed.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { createProjection } from '../../src/constraints/projection.js';
import { createRandom } from '../helpers/random.js';
import { alongConstraint, chain, distance, norm, perturbed, randomVector, ring } from './geometries.js';

/** The spec's tolerance of a fixed distance (../shared/spec/model-file.md, "Frozen atoms and constraints"). */
const SPEC_TOLERANCE = 1e-10;
/** The brief's bound on (g_j − g_i)·r̂_ij after projection, relative to |g| (issue 3, section 2). */
const GRADIENT_BOUND = 1e-12;

const sample = fc.record({
  seed: fc.integer(),
  closed: fc.boolean(),
  size: fc.integer({ min: 3, max: 30 }),
  // Candidate frozen atoms; those next to an already frozen one are dropped (no constraint between two frozen atoms).
  frozen: fc.array(fc.nat(), { maxLength: 4 }),
  amplitude: fc.double({ min: 0, max: 0.1, noNaN: true }),
});

describe('projection properties', () => {
  it('distances to 1e-10, frozen atoms bit-for-bit, gradient free along constraints, positions idempotent', () => {
    fc.assert(
      fc.property(sample, ({ seed, closed, size, frozen, amplitude }) => {
        const rng = createRandom(seed);
        const held = new Set<number>();
        for (const f of frozen) {
          const a = f % size;
          const prev = (a + size - 1) % size;
          const next = (a + 1) % size;
          const neighbours = closed ? [prev, next] : [a - 1, a + 1];
          if (!neighbours.some((b) => held.has(b))) held.add(a);
        }
        const c = closed ? ring(rng, size, [...held]) : chain(rng, size, [...held]);
        const projection = createProjection({ atomCount: size, frozen: c.frozen, distances: c.distances });
        const x = perturbed(rng, c.reference, amplitude);
        expect(projection.projectPositions(x, c.reference)).toBe(true);
        for (const d of c.distances) {
          expect(Math.abs(distance(x, d.i, d.j) - d.length)).toBeLessThanOrEqual(SPEC_TOLERANCE * d.length);
        }
        for (const a of held) {
          for (let k = 0; k < 3; k++) expect(Object.is(x[3 * a + k], c.reference[3 * a + k])).toBe(true);
        }
        const again = x.slice();
        expect(projection.projectPositions(again, x)).toBe(true);
        expect(Array.from(again)).toEqual(Array.from(x)); // exact by construction: nothing to correct
        const g = randomVector(rng, 3 * size);
        const scale = norm(g);
        projection.projectGradient(x, g);
        for (const d of c.distances) expect(Math.abs(alongConstraint(x, g, d))).toBeLessThanOrEqual(GRADIENT_BOUND * scale);
        for (const a of held) for (let k = 0; k < 3; k++) expect(g[3 * a + k]).toBe(0);
      }),
      { numRuns: 300, seed: 20261202 },
    );
  });

  it('x may be its own reference (directions then follow the current bonds)', () => {
    fc.assert(
      fc.property(fc.integer(), fc.integer({ min: 2, max: 20 }), (seed, size) => {
        const rng = createRandom(seed);
        const c = chain(rng, size, [0]);
        const projection = createProjection({ atomCount: size, frozen: c.frozen, distances: c.distances });
        const x = perturbed(rng, c.reference, 0.05);
        const frozenBefore = Array.from(x.subarray(0, 3));
        expect(projection.projectPositions(x, x)).toBe(true);
        expect(Array.from(x.subarray(0, 3))).toEqual(frozenBefore); // copied from itself: unchanged
        for (const d of c.distances) {
          expect(Math.abs(distance(x, d.i, d.j) - d.length)).toBeLessThanOrEqual(SPEC_TOLERANCE * d.length);
        }
      }),
      { numRuns: 100, seed: 20261203 },
    );
  });
});
