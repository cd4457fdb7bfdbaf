/**
 * Nonbonded pair kernels of src/terms/nonbonded.ts: Lennard-Jones and
 * Coulomb with exclusions, 1-4 scaling, a shifted cutoff and the cell list.
 * The formulas checked against are the model-file spec's
 * (shared/spec/model-file.md, "Nonbonded pairs"), written out here
 * independently of the kernel (Math.pow on the spec's expressions).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  accumulateNonbonded,
  accumulateNonbondedAllPairs,
  countedPairCount,
  createNonbondedPairs,
  NONBONDED_COULOMB,
  NONBONDED_LENNARD_JONES,
  type CombinationRule,
  type NonbondedParameters,
  type NonbondedPairs,
} from '../../src/terms/nonbonded.js';
import { checkGradient, gradientMatchers } from '../../src/testing/index.js';
import { applyMotion, maxAbs, netForce, netTorque, randomRigidMotion } from '../helpers/geometry.js';
import { createRandom, type Random } from '../helpers/random.js';

expect.extend(gradientMatchers);

/** Energy function with the gradient overwritten, as checkGradient wants it. */
function energyOf(pairs: NonbondedPairs, include?: number, allPairs = false) {
  return (x: Float64Array, g?: Float64Array): number => {
    if (g !== undefined) g.fill(0);
    return (allPairs ? accumulateNonbondedAllPairs : accumulateNonbonded)(x, pairs, g, undefined, include);
  };
}

/** Key of an unordered pair. */
const key = (i: number, j: number) => (i < j ? `${i}-${j}` : `${j}-${i}`);

/**
 * The spec's energies written out plainly, over every pair i < j: excluded
 * pairs left out, scaled pairs times scale14, only r < cutoff, each pair
 * shifted by its value at the cutoff. Returns [Lennard-Jones, Coulomb].
 */
function referenceEnergy(p: NonbondedParameters, x: Float64Array): [number, number] {
  const excluded = new Set<string>();
  const scaled = new Set<string>();
  const ex = p.excluded ?? [];
  const sc = p.scaled ?? [];
  for (let m = 0; m < ex.length; m += 2) excluded.add(key(ex[m], ex[m + 1]));
  for (let m = 0; m < sc.length; m += 2) scaled.add(key(sc[m], sc[m + 1]));
  const rc = p.cutoff ?? Infinity;
  const lj = (i: number, j: number, r: number): number => {
    if (p.lennardJones === undefined) return 0;
    const { rmin, epsilon, combination } = p.lennardJones;
    const rm = combination === 'geometric' ? Math.sqrt(rmin[i] * rmin[j]) : (rmin[i] + rmin[j]) / 2;
    const eps = Math.sqrt(epsilon[i] * epsilon[j]);
    return eps * (Math.pow(rm / r, 12) - 2 * Math.pow(rm / r, 6));
  };
  const coulomb = (i: number, j: number, r: number): number =>
    p.coulomb === undefined ? 0 : (p.coulomb.constant * p.coulomb.charges[i] * p.coulomb.charges[j]) / r;
  let eLJ = 0;
  let eC = 0;
  for (let i = 0; i < p.atomCount; i++) {
    for (let j = i + 1; j < p.atomCount; j++) {
      const k = key(i, j);
      if (excluded.has(k)) continue;
      const r = Math.hypot(x[3 * j] - x[3 * i], x[3 * j + 1] - x[3 * i + 1], x[3 * j + 2] - x[3 * i + 2]);
      if (!(r < rc)) continue;
      const sLJ = scaled.has(k) ? (p.scale14?.lennardJones ?? 1) : 1;
      const sC = scaled.has(k) ? (p.scale14?.coulomb ?? 1) : 1;
      const shiftLJ = rc < Infinity ? lj(i, j, rc) : 0;
      const shiftC = rc < Infinity ? coulomb(i, j, rc) : 0;
      eLJ += sLJ * (lj(i, j, r) - shiftLJ);
      eC += sC * (coulomb(i, j, r) - shiftC);
    }
  }
  return [eLJ, eC];
}

interface RandomSystem {
  readonly parameters: NonbondedParameters;
  readonly x: Float64Array;
}

/**
 * Random atoms in a cube of side `box`, none closer than `minGap`, random
 * LJ parameters (rmin 2.5–4, ε 0–0.3; invented, in the range of common
 * force fields) and charges (±0.8), random excluded and scaled pairs.
 * With `cutoff`, no pair lies within `margin` of it (the shifted energy's
 * derivative jumps there).
 */
function randomSystem(
  rng: Random,
  n: number,
  options: {
    box: number;
    combination?: CombinationRule;
    lj?: boolean;
    coulomb?: boolean;
    cutoff?: number | null;
    scale14?: { lennardJones: number; coulomb: number };
    minGap?: number;
    margin?: number;
  },
): RandomSystem {
  const { box, cutoff = null, minGap = 2, margin = 1e-2 } = options;
  const x = new Float64Array(3 * n);
  for (let a = 0; a < n; a++) {
    for (let attempt = 0; ; attempt++) {
      for (let c = 0; c < 3; c++) x[3 * a + c] = rng.uniform(0, box);
      let ok = true;
      for (let b = 0; b < a && ok; b++) {
        const r = Math.hypot(x[3 * a] - x[3 * b], x[3 * a + 1] - x[3 * b + 1], x[3 * a + 2] - x[3 * b + 2]);
        if (r < minGap || (cutoff !== null && Math.abs(r - cutoff) < margin)) ok = false;
      }
      if (ok || attempt > 1000) break;
    }
  }
  const excluded: number[] = [];
  const scaled: number[] = [];
  const used = new Set<string>();
  for (let m = 0; m < n; m++) {
    const i = rng.int(0, n - 1);
    const j = rng.int(0, n - 1);
    if (i === j || used.has(key(i, j))) continue;
    used.add(key(i, j));
    (rng.next() < 0.5 ? excluded : scaled).push(i, j);
  }
  const parameters: NonbondedParameters = {
    atomCount: n,
    ...(options.lj === false
      ? {}
      : {
          lennardJones: {
            rmin: Array.from({ length: n }, () => rng.uniform(2.5, 4)),
            epsilon: Array.from({ length: n }, () => (rng.next() < 0.1 ? 0 : rng.uniform(0, 0.3))),
            combination: options.combination ?? 'geometric',
          },
        }),
    ...(options.coulomb === false
      ? {}
      : { coulomb: { charges: Array.from({ length: n }, () => rng.uniform(-0.8, 0.8)), constant: 332.0637 } }),
    excluded,
    scaled,
    scale14: options.scale14 ?? { lennardJones: 0.5, coulomb: 0.8333 },
    cutoff,
  };
  return { parameters, x };
}

/** |a − b| ≤ tol · max(1, |b|). */
function expectClose(a: number, b: number, tol: number, label = ''): void {
  expect(Math.abs(a - b), `${label}: ${a} vs ${b}`).toBeLessThanOrEqual(tol * Math.max(1, Math.abs(b)));
}

describe('nonbonded pairs: energies against the spec formulas', () => {
  const cases: [string, Parameters<typeof randomSystem>[2]][] = [
    ['Lennard-Jones only, geometric', { box: 12, coulomb: false }],
    ['Lennard-Jones only, Lorentz–Berthelot', { box: 12, coulomb: false, combination: 'lorentz-berthelot' }],
    ['Coulomb only', { box: 12, lj: false }],
    ['both, geometric, scale14 0.5 / 0.8333', { box: 12 }],
    ['both, Lorentz–Berthelot, scale14 0 / 2', { box: 12, combination: 'lorentz-berthelot', scale14: { lennardJones: 0, coulomb: 2 } }],
    ['both with a cutoff of 6', { box: 14, cutoff: 6 }],
    ['both, Lorentz–Berthelot, cutoff 4.5', { box: 10, cutoff: 4.5, combination: 'lorentz-berthelot' }],
  ];
  for (const [name, options] of cases) {
    it(`${name}: energy per kind equals the plain sum; the gradient matches central differences`, () => {
      const rng = createRandom(name.length * 7919);
      for (let trial = 0; trial < 6; trial++) {
        const { parameters, x } = randomSystem(rng, 24, options);
        const pairs = createNonbondedPairs(parameters);
        const parts = new Float64Array(2);
        const total = accumulateNonbonded(x, pairs, undefined, parts);
        const [eLJ, eC] = referenceEnergy(parameters, x);
        expectClose(parts[0], eLJ, 1e-12, 'lennard-jones');
        expectClose(parts[1], eC, 1e-12, 'coulomb');
        expect(total).toBe(parts[0] + parts[1]);
        const check = checkGradient(energyOf(pairs), x);
        expect(check.maxRelError, `trial ${trial}`).toBeLessThanOrEqual(1e-8);
        expect(energyOf(pairs, NONBONDED_LENNARD_JONES)).toHaveCorrectGradient(x, { tolerance: 1e-8 });
        expect(energyOf(pairs, NONBONDED_COULOMB)).toHaveCorrectGradient(x, { tolerance: 1e-8 });
      }
    });
  }

  it('include selects one kind: the parts add up to the whole, energy and gradient', () => {
    const { parameters, x } = randomSystem(createRandom(5), 20, { box: 10, cutoff: 5 });
    const pairs = createNonbondedPairs(parameters);
    const g = new Float64Array(x.length);
    const gLJ = new Float64Array(x.length);
    const gC = new Float64Array(x.length);
    const e = energyOf(pairs)(x, g);
    const eLJ = energyOf(pairs, NONBONDED_LENNARD_JONES)(x, gLJ);
    const eC = energyOf(pairs, NONBONDED_COULOMB)(x, gC);
    expect(eLJ).not.toBe(0);
    expect(eC).not.toBe(0);
    expectClose(e, eLJ + eC, 1e-13);
    for (let c = 0; c < x.length; c++) expectClose(g[c], gLJ[c] + gC[c], 1e-12);
  });

  it('adds into the gradient instead of overwriting it', () => {
    const { parameters, x } = randomSystem(createRandom(6), 10, { box: 8 });
    const pairs = createNonbondedPairs(parameters);
    const g = new Float64Array(x.length);
    accumulateNonbonded(x, pairs, g);
    const twice = Float64Array.from(g);
    accumulateNonbonded(x, pairs, twice);
    // Equal up to the rounding of adding the pair terms onto a non-zero start.
    expect(maxAbs(g)).toBeGreaterThan(0);
    for (let c = 0; c < x.length; c++) expectClose(twice[c], 2 * g[c], 1e-13);
  });
});

describe('cell list against all pairs', () => {
  it('property: over random boxes, densities and cutoffs, the cell list gives the all-pairs energy and gradient', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 2, max: 160 }),
        fc.double({ min: 3, max: 60, noNaN: true }),
        fc.double({ min: 0.5, max: 30, noNaN: true }),
        fc.integer({ min: 0, max: 2 ** 31 - 1 }),
        fc.constantFrom<CombinationRule>('geometric', 'lorentz-berthelot'),
        (n, box, cutoff, seed, combination) => {
          const rng = createRandom(seed);
          // Flat boxes too: one side squeezed, so some axes have a single cell.
          const { parameters, x } = randomSystem(rng, n, { box, cutoff, combination, minGap: 0.3, margin: 0 });
          if (rng.next() < 0.3) for (let a = 0; a < n; a++) x[3 * a + 2] *= 0.01;
          const pairs = createNonbondedPairs(parameters);
          const gCells = new Float64Array(x.length);
          const gAll = new Float64Array(x.length);
          const pc = new Float64Array(2);
          const pa = new Float64Array(2);
          accumulateNonbonded(x, pairs, gCells, pc);
          accumulateNonbondedAllPairs(x, pairs, gAll, pa);
          const scale = Math.max(1, maxAbs(gAll));
          for (let c = 0; c < x.length; c++) {
            if (!(Math.abs(gCells[c] - gAll[c]) <= 1e-12 * scale)) return false;
          }
          const escale = (k: number) => 1e-12 * Math.max(1, Math.abs(pa[k]));
          return Math.abs(pc[0] - pa[0]) <= escale(0) && Math.abs(pc[1] - pa[1]) <= escale(1);
        },
      ),
      { numRuns: 150, seed: 20261202 },
    );
  });

  it('a large sparse spread (more cells of side rc than atoms) still finds every pair', () => {
    // Two tight clusters 1e6 apart with a cutoff of 1: cells are enlarged, not multiplied.
    const rng = createRandom(77);
    const { parameters, x } = randomSystem(rng, 40, { box: 3, cutoff: 1, minGap: 0.4, margin: 0 });
    for (let a = 20; a < 40; a++) x[3 * a] += 1e6;
    const pairs = createNonbondedPairs(parameters);
    const pc = new Float64Array(2);
    const pa = new Float64Array(2);
    accumulateNonbonded(x, pairs, undefined, pc);
    accumulateNonbondedAllPairs(x, pairs, undefined, pa);
    expect(pa[0]).not.toBe(0);
    expectClose(pc[0], pa[0], 1e-12);
    expectClose(pc[1], pa[1], 1e-12);
  });

  it('all atoms on one point of space but one, and a single atom, and no atoms: no failure', () => {
    const p = createNonbondedPairs({ atomCount: 1, coulomb: { charges: [1], constant: 1 }, cutoff: 2 });
    expect(accumulateNonbonded(new Float64Array(3), p)).toBe(0);
    const empty = createNonbondedPairs({ atomCount: 0, coulomb: { charges: [], constant: 1 }, cutoff: 2 });
    expect(accumulateNonbonded(new Float64Array(0), empty)).toBe(0);
  });
});

describe('cutoff', () => {
  const rmin = 3.5;
  const eps = 0.2;
  const rc = 8;
  const pair = (r: number) => new Float64Array([0, 0, 0, r, 0, 0]);
  const lj = createNonbondedPairs({
    atomCount: 2,
    lennardJones: { rmin: [rmin, rmin], epsilon: [eps, eps], combination: 'geometric' },
    cutoff: rc,
  });
  const cq = createNonbondedPairs({ atomCount: 2, coulomb: { charges: [0.5, -0.7], constant: 332.0637 }, cutoff: rc });

  it('the energy is continuous at the cutoff: E → 0 from below, 0 at and beyond it', () => {
    for (const p of [lj, cq]) {
      const below = accumulateNonbonded(pair(rc * (1 - 1e-12)), p);
      const g = new Float64Array(6);
      accumulateNonbonded(pair(rc * (1 - 1e-12)), p, g);
      // |E(rc − δ)| ≈ |dE/dr| δ: the first-order bound, with a factor 2 for rounding.
      expect(Math.abs(below)).toBeLessThanOrEqual(2 * Math.abs(g[3]) * rc * 1e-12 + 1e-15);
      expect(accumulateNonbonded(pair(rc), p)).toBe(0);
      expect(accumulateNonbonded(pair(rc * (1 + 1e-12)), p)).toBe(0);
      expect(accumulateNonbonded(pair(20), p)).toBe(0);
    }
  });

  it('inside the cutoff: energy shifted by its value at rc, gradient unshifted', () => {
    const r = 4.2;
    const t = Math.pow(rmin / r, 6);
    const tc = Math.pow(rmin / rc, 6);
    const g = new Float64Array(6);
    const e = accumulateNonbonded(pair(r), lj, g);
    expectClose(e, eps * (t * t - 2 * t) - eps * (tc * tc - 2 * tc), 1e-14);
    // dE/dr = 12 ε (t − t²) / r, the derivative of the unshifted energy.
    expectClose(g[3], (12 * eps * (t - t * t)) / r, 1e-13);
    expect(g[0]).toBe(-g[3]);
    const gc = new Float64Array(6);
    const ec = accumulateNonbonded(pair(r), cq, gc);
    expectClose(ec, 332.0637 * 0.5 * -0.7 * (1 / r - 1 / rc), 1e-14);
    expectClose(gc[3], (-332.0637 * 0.5 * -0.7) / (r * r), 1e-13);
  });
});

describe('exclusions and 1-4 pairs', () => {
  // Four atoms on a line 2 apart: pairs 0-1 excluded, 0-3 scaled.
  const x = new Float64Array([0, 0, 0, 2, 0, 0, 4, 0, 0, 6, 0, 0]);
  const base: NonbondedParameters = {
    atomCount: 4,
    coulomb: { charges: [1, -1, 0.5, 2], constant: 10 },
    lennardJones: { rmin: [3, 3, 3, 3], epsilon: [0.1, 0.1, 0.1, 0.1], combination: 'geometric' },
    excluded: [1, 0],
    scaled: [3, 0],
    scale14: { lennardJones: 0.25, coulomb: 0.5 },
  };

  it('an excluded pair adds nothing and a scaled pair adds its scale times its energy, per kind', () => {
    const parts = new Float64Array(2);
    accumulateNonbonded(x, createNonbondedPairs(base), undefined, parts);
    // By hand: Coulomb pairs 0-2 (r 4), 1-2 (2), 1-3 (4), 2-3 (2), and 0-3 (6) × 0.5.
    const c = 10 * ((1 * 0.5) / 4 + (-1 * 0.5) / 2 + (-1 * 2) / 4 + (0.5 * 2) / 2 + (0.5 * (1 * 2)) / 6);
    expectClose(parts[1], c, 1e-14);
    const l = (r: number) => 0.1 * (Math.pow(3 / r, 12) - 2 * Math.pow(3 / r, 6));
    expectClose(parts[0], l(4) + l(2) + l(4) + l(2) + 0.25 * l(6), 1e-14);
  });

  it('pairs given twice or in both lists count once; excluded wins over scaled; counted pairs = 6 − 1', () => {
    const p = createNonbondedPairs({ ...base, excluded: [1, 0, 0, 1, 2, 2], scaled: [3, 0, 0, 3, 1, 0] });
    expect(p.excludedCount).toBe(1);
    expect(Array.from(p.scaledPairs)).toEqual([0, 3]);
    expect(countedPairCount(p)).toBe(5);
    const a = new Float64Array(2);
    const b = new Float64Array(2);
    accumulateNonbonded(x, p, undefined, a);
    accumulateNonbonded(x, createNonbondedPairs(base), undefined, b);
    expect(Array.from(a)).toEqual(Array.from(b));
    expect(Array.from(p.skipList.subarray(p.skipStart[0], p.skipStart[1]))).toEqual([1, 3]);
  });

  it('scale14 0 for both kinds leaves the scaled pair out entirely', () => {
    const zero = createNonbondedPairs({ ...base, scale14: { lennardJones: 0, coulomb: 0 } });
    const none = createNonbondedPairs({ ...base, excluded: [1, 0, 3, 0], scaled: [] });
    const g0 = new Float64Array(12);
    const g1 = new Float64Array(12);
    expect(accumulateNonbonded(x, zero, g0)).toBe(accumulateNonbonded(x, none, g1));
    expect(Array.from(g0)).toEqual(Array.from(g1));
  });
});

describe('singular and bad input', () => {
  it('coincident atoms in a counted pair: +Infinity for each kind that interacts, zero gradient, never NaN', () => {
    const x = new Float64Array([1, 2, 3, 1, 2, 3, 5, 2, 3]);
    const p = createNonbondedPairs({
      atomCount: 3,
      lennardJones: { rmin: [3, 3, 3], epsilon: [0.1, 0.2, 0], combination: 'lorentz-berthelot' },
      coulomb: { charges: [1, -1, 0], constant: 332 },
    });
    const parts = new Float64Array(2);
    const g = new Float64Array(9);
    const e = accumulateNonbonded(x, p, g, parts);
    expect(parts[0]).toBe(Infinity);
    expect(parts[1]).toBe(Infinity); // opposite charges: still +∞ (see the module comment)
    expect(e).toBe(Infinity);
    // Atom 2 has ε = 0 and q = 0: nothing between it and the others; the coincident pair adds no gradient.
    expect(Array.from(g).every((v) => v === 0)).toBe(true);
  });

  it('coincident atoms that do not interact (ε_ij = 0, q_i q_j = 0) add nothing', () => {
    const x = new Float64Array([0, 0, 0, 0, 0, 0]);
    const p = createNonbondedPairs({
      atomCount: 2,
      lennardJones: { rmin: [3, 3], epsilon: [0, 0.2], combination: 'geometric' },
      coulomb: { charges: [0, 1], constant: 332 },
      cutoff: 5,
    });
    expect(accumulateNonbonded(x, p)).toBe(0);
  });

  it('a NaN or infinite coordinate gives NaN for each kind and leaves the gradient alone', () => {
    for (const cutoff of [null, 4]) {
      const p = createNonbondedPairs({
        atomCount: 3,
        lennardJones: { rmin: [3, 3, 3], epsilon: [0.1, 0.1, 0.1], combination: 'geometric' },
        cutoff,
      });
      for (const bad of [NaN, Infinity]) {
        const x = new Float64Array([0, 0, 0, 3, 0, 0, bad, 0, 0]);
        const g = new Float64Array(9).fill(7);
        const parts = new Float64Array(2);
        expect(accumulateNonbonded(x, p, g, parts)).toBeNaN();
        expect(parts[0]).toBeNaN();
        expect(parts[1]).toBe(0);
        expect(Array.from(g).every((v) => v === 7)).toBe(true);
      }
    }
  });
});

describe('symmetry', () => {
  it('rigid motions leave the energy unchanged; net force and net torque are zero', () => {
    const rng = createRandom(2718);
    for (const cutoff of [null, 6]) {
      for (let trial = 0; trial < 10; trial++) {
        const { parameters, x } = randomSystem(rng, 30, { box: 12, cutoff });
        const pairs = createNonbondedPairs(parameters);
        const g = new Float64Array(x.length);
        const e = accumulateNonbonded(x, pairs, g);
        const scale = Math.max(1, maxAbs(g));
        for (const v of netForce(g)) expect(Math.abs(v)).toBeLessThanOrEqual(1e-12 * scale);
        for (const v of netTorque(x, g)) expect(Math.abs(v)).toBeLessThanOrEqual(1e-11 * scale * 12);
        const moved = applyMotion(x, randomRigidMotion(rng));
        // A pair near the cutoff could cross it after rounding; the margin of 1e-2 keeps them clear.
        expectClose(accumulateNonbonded(moved, pairs), e, 1e-11);
      }
    }
  });
});
