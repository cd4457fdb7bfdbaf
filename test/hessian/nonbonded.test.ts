/**
 * Nonbonded pair Hessians of src/hessian/nonbonded.ts, through modelHessian,
 * the block-sparse form and hessianVectorProduct, on the butane-like model
 * of test/fixtures/nonbonded-models.ts: Lennard-Jones alone, Coulomb alone,
 * both, both combination rules, 1-4 scale factors ≠ 1, a cutoff (at
 * geometries with no pair near it); plus pair sets made by hand.
 */
import { describe, expect, it } from 'vitest';
import { hessianVectorProduct, modelHessian, modelSparseHessian } from '../../src/hessian/model.js';
import { NonbondedPairHessian } from '../../src/hessian/nonbonded.js';
import { BlockSparseHessian } from '../../src/hessian/sparse.js';
import { parseModel, type Model } from '../../src/model/model.js';
import type { ModelFile } from '../../src/model/schema.js';
import { accumulateNonbonded, accumulateNonbondedAllPairs, createNonbondedPairs } from '../../src/terms/nonbonded.js';
import { butane, defaultNonbonded } from '../fixtures/nonbonded-models.js';
import { createRandom } from '../helpers/random.js';
import { centralHessian, matVec, maxAbs, relativeError, rotate, symmetricEigenvalues } from './support.js';

const LJ = defaultNonbonded().lennardJones!;
type Block = NonNullable<ModelFile['nonbonded']>;

/** The variants, each a `nonbonded` block for butane(). */
const VARIANTS: readonly (readonly [string, Block])[] = [
  ['Lennard-Jones only, Lorentz–Berthelot', { lennardJones: LJ }],
  ['Lennard-Jones only, geometric', { lennardJones: { ...LJ, combination: 'geometric' } }],
  ['Coulomb only', { coulomb: { dielectric: 1 } }],
  ['both, scale14 0.5 / 0.8333 (the fixture default)', defaultNonbonded()],
  [
    'both, geometric, scale14 0.25 / 0.6, dielectric 4',
    {
      lennardJones: { ...LJ, combination: 'geometric' },
      coulomb: { dielectric: 4 },
      exclusions: { bondSeparation: 2, scale14: { lennardJones: 0.25, coulomb: 0.6 } },
    },
  ],
  ['both, 1-4 pairs excluded (bondSeparation 3)', { ...defaultNonbonded(), exclusions: { bondSeparation: 3 } }],
  ['both with cutoff 3.4', { ...defaultNonbonded(), cutoff: 3.4 }],
  ['both, geometric, with cutoff 3.3', { ...defaultNonbonded(), lennardJones: { ...LJ, combination: 'geometric' }, cutoff: 3.3 }],
];

const gradientOf =
  (model: Model) =>
  (y: Float64Array): Float64Array => {
    const g = new Float64Array(y.length);
    model.energy(y, g);
    return g;
  };

/** The smallest |r − cutoff| over all atom pairs (Infinity without a cutoff). */
function cutoffMargin(x: Float64Array, cutoff: number | null | undefined): number {
  if (cutoff == null) return Infinity;
  let margin = Infinity;
  for (let i = 0; i < x.length; i += 3) {
    for (let j = i + 3; j < x.length; j += 3) {
      const r = Math.hypot(x[j] - x[i], x[j + 1] - x[i + 1], x[j + 2] - x[i + 2]);
      margin = Math.min(margin, Math.abs(r - cutoff));
    }
  }
  return margin;
}

/** The fixture geometry, then 12 random displacements of ±0.05 Å per coordinate. */
function geometries(model: Model, seed: number): Float64Array[] {
  const rng = createRandom(seed);
  const x = model.coordinates;
  return [x, ...Array.from({ length: 12 }, () => Float64Array.from(x, (v) => v + rng.uniform(-0.05, 0.05)))];
}

describe.each(VARIANTS)('nonbonded Hessian of butane(): %s', (_name, block) => {
  const model = parseModel(butane(block));
  const size = 3 * model.atomCount;

  it('modelHessian matches 4-point differences of model.energy’s gradient (fixture + 12 perturbed geometries)', () => {
    for (const [c, y] of geometries(model, 31).entries()) {
      // differences across r = cutoff would see the jump there: the stencil moves one
      // coordinate by at most 2 · 1e-4 · max(1, |x|) ≤ 1e-3 here, so keep every pair 2e-3 away
      expect(cutoffMargin(y, block.cutoff), `case ${c}: a pair is close to the cutoff`).toBeGreaterThan(2e-3);
      const h = modelHessian(model, y);
      expect(relativeError(h, centralHessian(gradientOf(model), y, 1e-4)), `case ${c}`).toBeLessThan(1e-8);
    }
  });

  it('translation (block rows sum to zero) and rotation (H·(ω × x) = ω × g), at 4 geometries', () => {
    const rng = createRandom(37);
    for (const y of geometries(model, 38).slice(0, 4)) {
      const h = modelHessian(model, y);
      const g = gradientOf(model)(y);
      const scale = maxAbs(h);
      for (let r = 0; r < size; r++) {
        for (let q = 0; q < 3; q++) {
          let sum = 0;
          for (let b = 0; b < size / 3; b++) sum += h[r * size + 3 * b + q];
          expect(Math.abs(sum)).toBeLessThanOrEqual(1e-13 * scale * model.atomCount);
        }
      }
      const omega = rng.unitVector();
      const left = matVec(h, rotate(omega, y));
      const right = rotate(omega, g);
      const allowed = 1e-13 * (scale * maxAbs(y) * size + maxAbs(g));
      for (let e = 0; e < size; e++) expect(Math.abs(left[e] - right[e])).toBeLessThanOrEqual(allowed);
    }
  });

  it('is exactly symmetric and differs from the bonded-only Hessian (the pairs are there)', () => {
    const x = model.coordinates;
    const h = modelHessian(model, x);
    for (let r = 0; r < size; r++) for (let c = r + 1; c < size; c++) expect(h[r * size + c]).toBe(h[c * size + r]);
    const { nonbonded: _, ...bondedOnly } = butane();
    const bonded = parseModel(bondedOnly);
    expect(bonded.nonbonded).toBeNull();
    expect(relativeError(h, modelHessian(bonded, x))).toBeGreaterThan(1e-6);
  });

  if (block.cutoff != null) {
    it('the cutoff really splits the pairs: some counted pairs are inside it and some outside', () => {
      const inside = modelSparseHessian(model).update(model.coordinates).nonbonded!.count;
      const all = modelSparseHessian(parseModel(butane({ ...block, cutoff: null }))).update(model.coordinates).nonbonded!.count;
      expect(inside).toBeGreaterThan(0);
      expect(inside).toBeLessThan(all);
    });
  }

  it('block-sparse toDense() equals modelHessian bit for bit, at several geometries in turn (one pattern)', () => {
    const sparse = modelSparseHessian(model);
    expect(sparse.nonbonded).not.toBeNull();
    for (const y of geometries(model, 32)) {
      expect(Array.from(sparse.update(y).toDense())).toEqual(Array.from(modelHessian(model, y)));
    }
  });

  it('hessianVectorProduct and sparse.multiply equal H·v (also in place, out = v)', () => {
    const rng = createRandom(33);
    for (const y of geometries(model, 34).slice(0, 4)) {
      const h = modelHessian(model, y);
      const scale = maxAbs(h);
      const sparse = modelSparseHessian(model).update(y);
      for (let c = 0; c < 3; c++) {
        const v = Float64Array.from(y, () => rng.uniform(-1, 1));
        const expected = matVec(h, v);
        const product = hessianVectorProduct(model, y, v);
        const direct = sparse.multiply(v);
        const inPlace = sparse.multiply(Float64Array.from(v), undefined);
        const same = Float64Array.from(v);
        sparse.multiply(same, same);
        for (let e = 0; e < size; e++) {
          // a sum of ≤ 3N products of entries ≤ scale by |v| ≤ 1
          expect(Math.abs(product[e] - expected[e])).toBeLessThanOrEqual(1e-13 * scale * size);
          expect(direct[e]).toBe(product[e]);
          expect(inPlace[e]).toBe(product[e]);
          expect(same[e]).toBe(product[e]);
        }
      }
    }
  });
});

describe('cutoffs', () => {
  it('a cutoff beyond every distance gives the Hessian of no cutoff, bit for bit (the shift is a constant)', () => {
    // one cell then holds every atom, in index order, so the blocks come in the same order too
    const x = parseModel(butane()).coordinates;
    const far = parseModel(butane({ ...defaultNonbonded(), cutoff: 50 }));
    const none = parseModel(butane({ ...defaultNonbonded(), cutoff: null }));
    expect(far.energy(x)).not.toBe(none.energy(x)); // the shift is really applied
    expect(Array.from(modelHessian(far, x))).toEqual(Array.from(modelHessian(none, x)));
  });

  it('the pair set follows the geometry: a pair moved across the cutoff enters and leaves the sparse form', () => {
    // two atoms on the x axis, no bonded terms; cutoff 3
    const pairs = createNonbondedPairs({
      atomCount: 2,
      lennardJones: { rmin: [2, 2], epsilon: [0.2, 0.2], combination: 'geometric' },
      coulomb: { charges: [0.4, -0.3], constant: 332 },
      cutoff: 3,
    });
    const sparse = new BlockSparseHessian([], 2, pairs);
    const inside = new Float64Array([0, 0, 0, 2.5, 0, 0]);
    const outside = new Float64Array([0, 0, 0, 3.5, 0, 0]);
    expect(sparse.update(inside).nonbonded!.count).toBe(1);
    expect(maxAbs(sparse.toDense())).toBeGreaterThan(0);
    expect(sparse.update(outside).nonbonded!.count).toBe(0);
    expect(maxAbs(sparse.toDense())).toBe(0);
    expect(maxAbs(sparse.multiply(new Float64Array([1, 2, 3, 4, 5, 6])))).toBe(0);
    expect(sparse.update(inside).nonbonded!.count).toBe(1);
  });

  it('more pairs within the cutoff than the initial room: the lists grow and stay right', () => {
    const rng = createRandom(35);
    const n = 60; // 1770 pairs, more than the initial room of 16 N = 960
    const x = Float64Array.from({ length: 3 * n }, () => rng.uniform(0, 6));
    const common = {
      atomCount: n,
      lennardJones: {
        rmin: Array.from({ length: n }, () => rng.uniform(1, 2)),
        epsilon: Array.from({ length: n }, () => rng.uniform(0, 0.2)),
        combination: 'lorentz-berthelot' as const,
      },
      coulomb: { charges: Array.from({ length: n }, () => rng.uniform(-0.5, 0.5)), constant: 332 },
    };
    const withCutoff = new NonbondedPairHessian(createNonbondedPairs({ ...common, cutoff: 100 }));
    const without = new NonbondedPairHessian(createNonbondedPairs(common));
    expect(withCutoff.atoms.length).toBe(2 * 16 * n);
    withCutoff.update(x);
    without.update(x);
    expect(withCutoff.count).toBe((n * (n - 1)) / 2);
    const size = 3 * n;
    const a = new Float64Array(size * size);
    const b = new Float64Array(size * size);
    withCutoff.addToDense(a, size);
    without.addToDense(b, size);
    expect(Array.from(a)).toEqual(Array.from(b));
  });
});

describe('the cell list of the cutoff path', () => {
  /** 120 atoms at random in a 14 Å box, with bonds i–(i+1) giving exclusions and 1-4 pairs. */
  function cluster(seed: number, cutoff: number) {
    const rng = createRandom(seed);
    const n = 120;
    const x = Float64Array.from({ length: 3 * n }, () => rng.uniform(0, 14));
    const excluded: number[] = [];
    const scaled: number[] = [];
    for (let i = 0; i + 1 < n; i++) excluded.push(i, i + 1);
    for (let i = 0; i + 2 < n; i++) excluded.push(i, i + 2);
    for (let i = 0; i + 3 < n; i++) scaled.push(i, i + 3);
    const pairs = createNonbondedPairs({
      atomCount: n,
      lennardJones: {
        rmin: Array.from({ length: n }, () => rng.uniform(1, 2)),
        epsilon: Array.from({ length: n }, () => rng.uniform(0.01, 0.2)),
        combination: 'geometric',
      },
      coulomb: { charges: Array.from({ length: n }, () => rng.uniform(-0.5, 0.5)), constant: 332 },
      excluded,
      scaled,
      scale14: { lennardJones: 0.5, coulomb: 0.75 },
      cutoff,
    });
    return { x, pairs, excluded, scaled, n };
  }

  it('finds exactly the counted pairs within the cutoff (compared with a plain double loop), over many cells', () => {
    for (const [seed, cutoff] of [
      [41, 3],
      [42, 4.5],
      [43, 1.2],
    ] as const) {
      const { x, pairs, excluded, scaled, n } = cluster(seed, cutoff);
      const hessian = new NonbondedPairHessian(pairs).update(x);
      const found = new Set<string>();
      for (let m = 0; m < hessian.count; m++) {
        const key = `${hessian.atoms[2 * m]}-${hessian.atoms[2 * m + 1]}`;
        expect(found.has(key), `pair ${key} twice`).toBe(false);
        found.add(key);
      }
      const skip = new Set<string>();
      for (let e = 0; e < excluded.length; e += 2) skip.add(`${excluded[e]}-${excluded[e + 1]}`);
      const expected = new Set<string>();
      for (let i = 0; i < n; i++) {
        for (let j = i + 1; j < n; j++) {
          const r = Math.hypot(x[3 * j] - x[3 * i], x[3 * j + 1] - x[3 * i + 1], x[3 * j + 2] - x[3 * i + 2]);
          if (r < cutoff && !skip.has(`${i}-${j}`)) expected.add(`${i}-${j}`);
        }
      }
      expect(scaled.length).toBeGreaterThan(0);
      expect(expected.size).toBeGreaterThan(10);
      expect(expected.size).toBeLessThan((n * (n - 1)) / 2 - excluded.length / 2);
      expect([...found].sort()).toEqual([...expected].sort());
    }
  });

  it('its Hessian matches differences of the cell-list energy gradient (model-free, 120 atoms)', () => {
    const { x, pairs } = cluster(44, 3);
    // the stencil below moves a coordinate by at most 2 · 1e-5 · 14 < 3e-4: no pair crosses r = 3
    expect(cutoffMargin(x, 3)).toBeGreaterThan(1e-3);
    const size = x.length;
    const hessian = new NonbondedPairHessian(pairs).update(x);
    const h = new Float64Array(size * size);
    hessian.addToDense(h, size);
    const numeric = centralHessian(
      (y) => {
        const g = new Float64Array(y.length);
        accumulateNonbonded(y, pairs, g);
        return g;
      },
      x,
      1e-5,
    );
    expect(relativeError(h, numeric)).toBeLessThan(1e-7);
  });
});

describe('pair sets made by hand', () => {
  it('a Lennard-Jones pair at r = rmin: E″ = 72 ε/rmin² along the axis, nothing across; eigenvalues {0 ×5, 2E″}', () => {
    // E = ε (t² − 2t), t = (rmin/r)⁶: E″(rmin) = ε (156 − 84)/rmin² = 72 ε/rmin², E′(rmin) = 0 (derived from the formula)
    const eps = 0.3;
    const rmin = 3.1;
    const pairs = createNonbondedPairs({ atomCount: 2, lennardJones: { rmin: [rmin, rmin], epsilon: [eps, eps], combination: 'lorentz-berthelot' } });
    const hessian = new NonbondedPairHessian(pairs).update(new Float64Array([0, 0, 0, 0, 0, rmin]));
    const h = new Float64Array(36);
    hessian.addToDense(h, 6);
    const k = (72 * eps) / (rmin * rmin);
    expect(h[2 * 6 + 2]).toBeCloseTo(k, 12);
    expect(h[2 * 6 + 5]).toBeCloseTo(-k, 12);
    expect(Math.abs(h[0])).toBeLessThan(1e-13);
    const values = symmetricEigenvalues(h, 6);
    for (let m = 0; m < 5; m++) expect(Math.abs(values[m])).toBeLessThan(1e-12);
    expect(values[5]).toBeCloseTo(2 * k, 11);
  });

  it('a Coulomb pair: 2kq₁q₂/r³ along the axis, −kq₁q₂/r³ across (E = kq₁q₂/r)', () => {
    const kq = 332 * 0.5 * -0.25;
    const r = 2.2;
    const pairs = createNonbondedPairs({ atomCount: 2, coulomb: { charges: [0.5, -0.25], constant: 332 } });
    const hessian = new NonbondedPairHessian(pairs).update(new Float64Array([0, 0, 0, r, 0, 0]));
    const h = new Float64Array(36);
    hessian.addToDense(h, 6);
    expect(h[3 * 6 + 3]).toBeCloseTo((2 * kq) / r ** 3, 12);
    expect(h[4 * 6 + 4]).toBeCloseTo(-kq / r ** 3, 12);
    expect(h[0 * 6 + 3]).toBeCloseTo((-2 * kq) / r ** 3, 12);
  });

  it('excluded pairs, 1-4 scale 0 and zero parameters add no block; coincident atoms add none either', () => {
    const x = new Float64Array([0, 0, 0, 1.5, 0, 0, 0, 1.7, 0, 0, 0, 0]);
    const pairs = createNonbondedPairs({
      atomCount: 4,
      lennardJones: { rmin: [2, 2, 2, 2], epsilon: [0.1, 0.1, 0.1, 0], combination: 'geometric' },
      excluded: [0, 1],
      scaled: [1, 2],
      scale14: { lennardJones: 0 },
    });
    const hessian = new NonbondedPairHessian(pairs).update(x);
    // left: (0, 2) only; (0, 1) excluded, (1, 2) scaled by 0, every pair with atom 3 has ε = 0, and (0, 3) coincide
    expect(Array.from(hessian.atoms.subarray(0, 2 * hessian.count))).toEqual([0, 2]);
  });

  it('agrees with differences of the all-pairs gradient on random clusters with 1-4 pairs and a cutoff', () => {
    const rng = createRandom(36);
    for (let c = 0; c < 20; c++) {
      const n = 8;
      const x = Float64Array.from({ length: 3 * n }, () => rng.uniform(0, 5));
      const pairs = createNonbondedPairs({
        atomCount: n,
        lennardJones: {
          rmin: Array.from({ length: n }, () => rng.uniform(1, 2)),
          epsilon: Array.from({ length: n }, () => rng.uniform(0, 0.2)),
          combination: rng.next() < 0.5 ? 'geometric' : 'lorentz-berthelot',
        },
        coulomb: { charges: Array.from({ length: n }, () => rng.uniform(-0.5, 0.5)), constant: 332 },
        excluded: [0, 1, 1, 2, 2, 3],
        scaled: [0, 3, 4, 5],
        scale14: { lennardJones: rng.uniform(0, 1), coulomb: rng.uniform(0, 1) },
        cutoff: 4,
      });
      if (cutoffMargin(x, 4) < 1e-2) continue;
      const hessian = new NonbondedPairHessian(pairs).update(x);
      const h = new Float64Array(9 * n * n);
      hessian.addToDense(h, 3 * n);
      const numeric = centralHessian(
        (y) => {
          const g = new Float64Array(y.length);
          accumulateNonbondedAllPairs(y, pairs, g);
          return g;
        },
        x,
        1e-5,
      );
      expect(relativeError(h, numeric), `case ${c}`).toBeLessThan(1e-7);
    }
  });

  it('a non-finite coordinate makes the pair part NaN (as the energy is NaN)', () => {
    const model = parseModel(butane());
    const y = Float64Array.from(model.coordinates);
    y[4] = NaN;
    expect(Number.isNaN(model.energy(y))).toBe(true);
    expect(modelHessian(model, y).every(Number.isNaN)).toBe(true);
    expect(hessianVectorProduct(model, y, new Float64Array(y.length).fill(1)).every(Number.isNaN)).toBe(true);
  });

  it('the sparse constructor refuses a pair set over another number of atoms', () => {
    const pairs = createNonbondedPairs({ atomCount: 3, coulomb: { charges: [1, 1, 1], constant: 1 } });
    expect(() => new BlockSparseHessian([], 4, pairs)).toThrow(new RangeError('nonbonded: its pair set has 3 atoms, expected 4'));
  });
});
