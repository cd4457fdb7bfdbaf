/**
 * The checks every kernel must pass, written once and run per kind from
 * that kind's test file: analytic gradient against central differences on
 * random cases, rigid-motion invariance with zero net force and torque, the
 * energies[] output, accumulation into a pre-filled gradient, empty tables,
 * and a many-term table equal to the sum of its one-term tables.
 */
import { describe, expect, it } from 'vitest';
import { KERNELS } from '../../src/terms/kernels.js';
import { KIND_LAYOUTS } from '../../src/terms/table.js';
import type { TermKind, TermTable } from '../../src/terms/table.js';
import { formatGradientCheck } from '../../src/testing/index.js';
import type { GradientCheck } from '../../src/testing/index.js';
import { CASES, PARAMS } from './cases.js';
import { applyMotion, maxAbs, netForce, netTorque, randomRigidMotion } from './geometry.js';
import { createRandom } from './random.js';
import type { Random } from './random.js';
import { checkTerm, evaluate, makeTable, report, singleTerm } from './terms.js';
import type { Row } from './terms.js';

/** How many random cases the gradient check runs per kind. */
const GRADIENT_CASES = 400;
/** How many random rigid motions the invariance checks run per kind. */
const MOTION_CASES = 200;

/** What varies between kinds in {@link describeKernelProperties}. */
export interface KernelPropertyOptions {
  /** Seed of the random cases (distinct per kind so kinds do not share geometries). */
  readonly seed: number;
  /** Largest accepted maxRelError of checkGradient on the random cases. */
  readonly gradientTolerance: number;
  /** False for position restraints, which are tied to fixed points in space. */
  readonly invariant: boolean;
}

/** A table of `terms` random terms of `kind` on a random 12-atom pool. */
export function randomPoolTable(kind: TermKind, rng: Random, terms: number): { x: Float64Array; table: TermTable } {
  const atomsInPool = 12;
  const x = new Float64Array(3 * atomsInPool);
  for (let n = 0; n < x.length; n++) x[n] = rng.uniform(-2.5, 2.5);
  const { arity } = KIND_LAYOUTS[kind];
  const rows: Row[] = [];
  for (let t = 0; t < terms; t++) {
    const atoms: number[] = [];
    while (atoms.length < arity) {
      const a = rng.int(0, atomsInPool - 1);
      if (!atoms.includes(a)) atoms.push(a);
    }
    rows.push({ atoms, params: PARAMS[kind](rng) });
  }
  return { x, table: makeTable(kind, rows) };
}

/** A one-term table holding row `t` of `table`. */
function rowTable(table: TermTable, t: number): TermTable {
  return makeTable(table.kind, [
    {
      atoms: Array.from(table.atoms.subarray(t * table.arity, (t + 1) * table.arity)),
      params: Array.from(table.params.subarray(t * table.width, (t + 1) * table.width)),
    },
  ]);
}

/** Registers the shared kernel checks for `kind` (see the module comment). */
export function describeKernelProperties(kind: TermKind, options: KernelPropertyOptions): void {
  const kernel = KERNELS[kind];
  const { seed, gradientTolerance, invariant } = options;

  describe(`${kind}: properties every kernel has`, () => {
    it(`analytic gradient matches 4-point central differences on ${GRADIENT_CASES} random cases (maxRelError ≤ ${gradientTolerance})`, () => {
      const rng = createRandom(seed);
      let worst: { result: GradientCheck; n: number; x: Float64Array; params: number[] } | null = null;
      for (let n = 0; n < GRADIENT_CASES; n++) {
        const { x, params } = CASES[kind](rng);
        const result = checkTerm(singleTerm(kind, params), x);
        if (worst === null || !(result.maxRelError <= worst.result.maxRelError)) worst = { result, n, x, params };
      }
      if (worst === null) throw new Error('no cases were run');
      report(`${kind} random gradient worst maxRelError`, worst.result.maxRelError);
      const where = `case ${worst.n}: x = [${Array.from(worst.x).join(', ')}], params = [${worst.params.join(', ')}]\n`;
      expect(worst.result.maxRelError, where + formatGradientCheck(worst.result)).toBeLessThanOrEqual(gradientTolerance);
    });

    it('energy and gradient do not depend on whether the gradient or energies are asked for, and x is not modified', () => {
      const rng = createRandom(seed + 1);
      for (let n = 0; n < 50; n++) {
        const { x, table } = randomPoolTable(kind, rng, 10);
        const before = Float64Array.from(x);
        const plain = kernel(x, table);
        const gradient = new Float64Array(x.length);
        const energies = new Float64Array(table.count);
        expect(kernel(x, table, gradient, energies)).toBe(plain);
        expect(kernel(x, table, undefined, energies)).toBe(plain);
        expect(x).toEqual(before);
      }
    });

    it('energies[] holds each term’s energy, and they sum to the returned total', () => {
      const rng = createRandom(seed + 2);
      for (let n = 0; n < 50; n++) {
        const { x, table } = randomPoolTable(kind, rng, 25);
        const energies = new Float64Array(table.count + 1).fill(-7);
        const total = kernel(x, table, undefined, energies);
        let sum = 0;
        for (let t = 0; t < table.count; t++) {
          sum += energies[t];
          const one = rowTable(table, t);
          expect(energies[t]).toBe(kernel(x, one));
        }
        expect(sum).toBeCloseTo(total, 12);
        expect(Math.abs(sum - total)).toBeLessThanOrEqual(1e-13 * Math.max(1, Math.abs(total)));
        expect(energies[table.count]).toBe(-7); // nothing written past count
      }
    });

    it('adds into the gradient it is given (pre-filled content is kept)', () => {
      const rng = createRandom(seed + 3);
      for (let n = 0; n < 50; n++) {
        const { x, table } = randomPoolTable(kind, rng, 10);
        const own = evaluate(table, x).gradient;
        const prefill = Float64Array.from(x, () => rng.uniform(-100, 100));
        const gradient = Float64Array.from(prefill);
        kernel(x, table, gradient);
        for (let c = 0; c < x.length; c++) {
          expect(Math.abs(gradient[c] - prefill[c] - own[c])).toBeLessThanOrEqual(1e-13 * (Math.abs(prefill[c]) + Math.abs(own[c])));
        }
        // And twice in a row gives twice the term's gradient.
        const twice = new Float64Array(x.length);
        kernel(x, table, twice);
        kernel(x, table, twice);
        const scale = Math.max(1, maxAbs(own));
        for (let c = 0; c < x.length; c++) expect(Math.abs(twice[c] - 2 * own[c])).toBeLessThanOrEqual(1e-13 * scale);
      }
    });

    it('an empty table (count 0) returns 0 and writes nothing', () => {
      const empty = makeTable(kind, []);
      const x = new Float64Array([1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12]);
      const gradient = new Float64Array(12).fill(3);
      const energies = new Float64Array(2).fill(5);
      expect(kernel(x, empty, gradient, energies)).toBe(0);
      expect(kernel(new Float64Array(0), empty)).toBe(0);
      expect(Array.from(gradient)).toEqual(new Array(12).fill(3));
      expect(Array.from(energies)).toEqual([5, 5]);
    });

    it('a table of many terms gives the sum of its one-term tables (energy and gradient)', () => {
      const rng = createRandom(seed + 4);
      for (let n = 0; n < 20; n++) {
        const { x, table } = randomPoolTable(kind, rng, 40);
        const whole = evaluate(table, x);
        let energy = 0;
        const gradient = new Float64Array(x.length);
        for (let t = 0; t < table.count; t++) {
          const one = rowTable(table, t);
          const part = evaluate(one, x);
          energy += part.energy;
          for (let c = 0; c < x.length; c++) gradient[c] += part.gradient[c];
        }
        expect(Math.abs(whole.energy - energy)).toBeLessThanOrEqual(1e-13 * Math.max(1, Math.abs(energy)));
        const scale = Math.max(1, maxAbs(gradient));
        for (let c = 0; c < x.length; c++) expect(Math.abs(whole.gradient[c] - gradient[c])).toBeLessThanOrEqual(1e-13 * scale);
      }
    });

    if (invariant) {
      it(`energy is invariant under ${MOTION_CASES} random rigid motions (rotation and translation)`, () => {
        const rng = createRandom(seed + 5);
        let worst = 0;
        for (let n = 0; n < MOTION_CASES; n++) {
          const { x, params } = CASES[kind](rng);
          const table = singleTerm(kind, params);
          const { energy, gradient } = evaluate(table, x);
          const moved = applyMotion(x, randomRigidMotion(rng));
          // A rigid motion moves each coordinate by rounding only, ≈ 1e-15 of its size.
          const allowed = 2e-14 * (Math.abs(energy) + maxAbs(gradient) * Math.max(1, maxAbs(x), maxAbs(moved)));
          const error = Math.abs(kernel(moved, table) - energy);
          worst = Math.max(worst, error / Math.max(allowed, Number.MIN_VALUE));
          expect(error, `case ${n}`).toBeLessThanOrEqual(allowed);
        }
        report(`${kind} invariance worst error / allowed`, worst);
      });

      it(`net force Σ g_a and net torque Σ x_a × g_a vanish (${MOTION_CASES} random cases)`, () => {
        const rng = createRandom(seed + 6);
        let worstForce = 0;
        let worstTorque = 0;
        for (let n = 0; n < MOTION_CASES; n++) {
          const { x, params } = CASES[kind](rng);
          const { gradient } = evaluate(singleTerm(kind, params), x);
          const g = maxAbs(gradient);
          const force = maxAbs(netForce(gradient)) / Math.max(1, g);
          const torque = maxAbs(netTorque(x, gradient)) / Math.max(1, g * maxAbs(x));
          worstForce = Math.max(worstForce, force);
          worstTorque = Math.max(worstTorque, torque);
          expect(force, `case ${n}`).toBeLessThanOrEqual(1e-14);
          expect(torque, `case ${n}`).toBeLessThanOrEqual(1e-14);
        }
        report(`${kind} net force (relative)`, worstForce);
        report(`${kind} net torque (relative)`, worstTorque);
      });
    }
  });
}
