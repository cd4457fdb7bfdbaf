/**
 * Compiling the `nonbonded` block (src/model/nonbonded.ts) and the model's
 * energy with it (src/model/model.ts). Rules from the model-file spec,
 * "Nonbonded pairs": connectivity from `bonds`, else from harmonic-bond and
 * morse-bond terms and fixed-distance constraints; pairs at most
 * `bondSeparation` bonds apart left out; with 2, pairs exactly 3 apart
 * scaled by `scale14`; energies reported as `lennard-jones` and `coulomb`.
 */
import { describe, expect, it } from 'vitest';
import { checkModelGradient } from '../../src/analysis/gradient-check.js';
import { convertModelUnits } from '../../src/model/convert.js';
import { NONBONDED_KINDS } from '../../src/model/kinds.js';
import { parseModel } from '../../src/model/model.js';
import { bondSeparations, compileNonbonded, nonbondedConnectivity } from '../../src/model/nonbonded.js';
import type { ModelFile } from '../../src/model/schema.js';
import { readModelFile } from '../../src/model/validate.js';
import { countedPairCount } from '../../src/terms/nonbonded.js';
import { gradientMatchers } from '../../src/testing/index.js';
import { coulombConstant, type Units } from '../../src/units.js';
import { butane, defaultNonbonded } from '../fixtures/nonbonded-models.js';
import { createRandom } from '../helpers/random.js';

expect.extend(gradientMatchers);

/** Shortest bond paths between all atoms by Floyd–Warshall: independent of the BFS under test. */
function allSeparations(n: number, bonds: readonly (readonly number[])[]): number[][] {
  const d = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => (i === j ? 0 : Infinity)));
  for (const [i, j] of bonds) d[i][j] = d[j][i] = 1;
  for (let k = 0; k < n; k++) for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) d[i][j] = Math.min(d[i][j], d[i][k] + d[k][j]);
  return d;
}

/**
 * The nonbonded energy of a model file by the spec's words, pair by pair:
 * [Lennard-Jones, Coulomb] in the file's units.
 */
function specEnergy(file: ModelFile): [number, number] {
  const nb = file.nonbonded!;
  const n = file.atoms.length;
  const bonds = file.bonds ?? nonbondedPairsOf(file);
  const sep = allSeparations(n, bonds);
  const bs = nb.exclusions?.bondSeparation ?? 2;
  const rc = nb.cutoff ?? Infinity;
  const C = coulombConstant(file.units) / (nb.coulomb?.dielectric ?? 1);
  const lj = (i: number, j: number, r: number) => {
    const p = nb.lennardJones;
    if (p === undefined) return 0;
    const rm = p.combination === 'geometric' ? Math.sqrt(p.rmin[i] * p.rmin[j]) : (p.rmin[i] + p.rmin[j]) / 2;
    return Math.sqrt(p.epsilon[i] * p.epsilon[j]) * ((rm / r) ** 12 - 2 * (rm / r) ** 6);
  };
  const q = (i: number) => file.atoms[i].charge ?? 0;
  const cq = (i: number, j: number, r: number) => (nb.coulomb === undefined ? 0 : (C * q(i) * q(j)) / r);
  let eLJ = 0;
  let eC = 0;
  const x = file.coordinates;
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      if (sep[i][j] <= bs) continue;
      const r = Math.hypot(x[j][0] - x[i][0], x[j][1] - x[i][1], x[j][2] - x[i][2]);
      if (!(r < rc)) continue;
      const one4 = bs === 2 && sep[i][j] === 3;
      const sLJ = one4 ? (nb.exclusions?.scale14?.lennardJones ?? 1) : 1;
      const sC = one4 ? (nb.exclusions?.scale14?.coulomb ?? 1) : 1;
      eLJ += sLJ * (lj(i, j, r) - (rc < Infinity ? lj(i, j, rc) : 0));
      eC += sC * (cq(i, j, r) - (rc < Infinity ? cq(i, j, rc) : 0));
    }
  }
  return [eLJ, eC];
}

function nonbondedPairsOf(file: ModelFile): number[][] {
  const flat = Array.from(nonbondedConnectivity(file));
  const out: number[][] = [];
  for (let m = 0; m < flat.length; m += 2) out.push([flat[m], flat[m + 1]]);
  return out;
}

function expectClose(a: number, b: number, tol: number, label = ''): void {
  expect(Math.abs(a - b), `${label}: ${a} vs ${b}`).toBeLessThanOrEqual(tol * Math.max(1, Math.abs(b)));
}

describe('connectivity', () => {
  const base = butane();
  it('is `bonds` when the file has it', () => {
    const file = readModelFile({ ...base, bonds: [[0, 1], [5, 2]] });
    expect(Array.from(nonbondedConnectivity(file))).toEqual([0, 1, 5, 2]);
  });

  it('else the harmonic-bond and morse-bond terms and fixed-distance constraints, nothing else', () => {
    const file = readModelFile({
      ...base,
      terms: [
        { kind: 'harmonic-bond', atoms: [0, 1], k: 1, r0: 1 },
        { kind: 'urey-bradley', atoms: [0, 1, 2], k: 1, s0: 2 },
        { kind: 'morse-bond', atoms: [2, 1], D: 1, a: 1, r0: 1 },
        { kind: 'distance-restraint', atoms: [3, 4], k: 1, lower: 1, upper: 2 },
        { kind: 'harmonic-angle', atoms: [0, 1, 5], k: 1, theta0: 100 },
      ],
      constraints: [{ kind: 'fixed-distance', atoms: [3, 2] }],
    });
    expect(Array.from(nonbondedConnectivity(file))).toEqual([0, 1, 2, 1, 3, 2]);
  });
});

describe('bondSeparations', () => {
  it('a chain 0-1-2-3-4: each pair’s separation is its index difference, cut at maxDepth', () => {
    const { pairs, separation } = bondSeparations(5, [0, 1, 1, 2, 2, 3, 3, 4], 3);
    const got: string[] = [];
    for (let m = 0; m < separation.length; m++) got.push(`${pairs[2 * m]}-${pairs[2 * m + 1]}:${separation[m]}`);
    expect(got).toEqual(['0-1:1', '0-2:2', '0-3:3', '1-2:1', '1-3:2', '1-4:3', '2-3:1', '2-4:2', '3-4:1']);
  });

  it('a six-ring: the shortest way round counts (para atoms 3 apart, not 3 and 3 both ways twice)', () => {
    const ring = [0, 1, 1, 2, 2, 3, 3, 4, 4, 5, 5, 0];
    const { pairs, separation } = bondSeparations(6, ring, 10);
    expect(separation.length).toBe(15);
    const bySep = [0, 0, 0, 0];
    separation.forEach((s) => bySep[s]++);
    expect(bySep).toEqual([0, 6, 6, 3]);
    expect(Array.from(pairs.subarray(0, 10))).toEqual([0, 1, 0, 2, 0, 3, 0, 4, 0, 5]);
    expect(Array.from(separation.subarray(0, 5))).toEqual([1, 2, 3, 2, 1]);
  });

  it('repeated bonds and either order change nothing; maxDepth 0 gives no pairs; disconnected atoms are never paired', () => {
    const a = bondSeparations(4, [0, 1, 1, 0, 0, 1, 2, 3], 5);
    expect(Array.from(a.pairs)).toEqual([0, 1, 2, 3]);
    expect(Array.from(a.separation)).toEqual([1, 1]);
    expect(bondSeparations(4, [0, 1], 0).pairs.length).toBe(0);
  });

  it('property: equals Floyd–Warshall on random graphs, for every maxDepth', () => {
    const rng = createRandom(4242);
    for (let trial = 0; trial < 40; trial++) {
      const n = rng.int(1, 14);
      const bonds: number[][] = [];
      for (let b = 0; b < rng.int(0, 2 * n); b++) bonds.push([rng.int(0, n - 1), rng.int(0, n - 1)]);
      const d = allSeparations(
        n,
        bonds.filter(([i, j]) => i !== j),
      );
      const depth = rng.int(0, 6);
      const { pairs, separation } = bondSeparations(n, bonds.flat(), depth);
      const expected: string[] = [];
      for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) if (d[i][j] >= 1 && d[i][j] <= depth) expected.push(`${i}-${j}:${d[i][j]}`);
      const got: string[] = [];
      for (let m = 0; m < separation.length; m++) got.push(`${pairs[2 * m]}-${pairs[2 * m + 1]}:${separation[m]}`);
      expect(got).toEqual(expected);
    }
  });
});

describe('exclusions of a butane-like C4H10 (counted by hand)', () => {
  // 14 atoms: 91 pairs. 13 bonds (1-2). 1-3 pairs: Σ over atoms C(degree, 2) = 4 carbons × C(4, 2) = 24.
  // 1-4 pairs: Σ over bonds j–k of (deg j − 1)(deg k − 1) = 3 C–C bonds × 3 × 3 = 27 (no rings, so each once).
  const counts = (bondSeparation: number) => {
    const c = compileNonbonded(readModelFile(butane({ ...defaultNonbonded(), exclusions: { bondSeparation } })))!;
    return { excluded: c.pairs.excludedCount, scaled: c.pairs.scaledPairs.length / 2, counted: countedPairCount(c.pairs) };
  };
  it('bondSeparation 2 (the default): 37 excluded, 27 scaled 1-4 pairs, 54 counted', () => {
    expect(counts(2)).toEqual({ excluded: 37, scaled: 27, counted: 54 });
    const c = compileNonbonded(readModelFile(butane({ lennardJones: defaultNonbonded().lennardJones })))!;
    expect(c.pairs.excludedCount).toBe(37);
    expect(c.pairs.scaledPairs.length / 2).toBe(27);
    // The one C–C 1-4 pair is C0–C3.
    const cc: number[] = [];
    for (let m = 0; m < c.pairs.scaledPairs.length; m += 2) {
      if (c.pairs.scaledPairs[m + 1] < 4) cc.push(c.pairs.scaledPairs[m], c.pairs.scaledPairs[m + 1]);
    }
    expect(cc).toEqual([0, 3]);
  });
  it('bondSeparation 3: 1-4 pairs left out too (64 excluded, 27 counted); 1: 13 and 78; 0: none excluded', () => {
    expect(counts(3)).toEqual({ excluded: 64, scaled: 0, counted: 27 });
    expect(counts(1)).toEqual({ excluded: 13, scaled: 0, counted: 78 });
    expect(counts(0)).toEqual({ excluded: 0, scaled: 0, counted: 91 });
  });
});

describe('the model with nonbonded pairs', () => {
  it('reports lennard-jones and coulomb after the term kinds; total is energy(x) to the bit', () => {
    const m = parseModel(butane());
    expect(m.kinds).toEqual(['harmonic-bond', 'harmonic-angle', ...NONBONDED_KINDS]);
    const x = m.coordinates;
    const { total, byKind } = m.breakdown(x);
    expect(Object.keys(byKind)).toEqual(m.kinds);
    expect(total).toBe(m.energy(x));
    expect(total).toBe(m.energy(x, new Float64Array(x.length)));
    const [eLJ, eC] = specEnergy(readModelFile(butane()));
    expectClose(byKind['lennard-jones']!, eLJ, 1e-13, 'lennard-jones');
    expectClose(byKind.coulomb!, eC, 1e-13, 'coulomb');
    expect(byKind['lennard-jones']).not.toBe(0);
    expect(byKind.coulomb).not.toBe(0);
  });

  it('kindEnergy gives each kind alone, energy and gradient; they add up to the model’s', () => {
    const m = parseModel(butane());
    const x = m.coordinates;
    const g = new Float64Array(x.length);
    const e = m.energy(x, g);
    const sum = new Float64Array(x.length);
    let eSum = 0;
    const one = new Float64Array(x.length);
    for (const kind of m.kinds) {
      eSum += m.kindEnergy(kind, x, one);
      expect(m.kindEnergy(kind, x)).toBe(m.breakdown(x).byKind[kind]);
      for (let c = 0; c < x.length; c++) sum[c] += one[c];
    }
    expect(m.kindEnergy('torsion-free-kind' as never, x)).toBe(0);
    expectClose(eSum, e, 1e-13);
    for (let c = 0; c < x.length; c++) expectClose(sum[c], g[c], 1e-12);
  });

  it('the spec’s cases: LJ or Coulomb alone, both rules, cutoffs, scale14 ≠ 1, explicit bonds', () => {
    const lj = defaultNonbonded().lennardJones!;
    const variants: ModelFile['nonbonded'][] = [
      { lennardJones: lj },
      { coulomb: { dielectric: 4 } },
      { lennardJones: { ...lj, combination: 'geometric' }, coulomb: { dielectric: 1 }, cutoff: 3.2 },
      { ...defaultNonbonded(), cutoff: 2.9, exclusions: { scale14: { lennardJones: 0.25 } } },
      { ...defaultNonbonded(), exclusions: { bondSeparation: 1 } },
      { ...defaultNonbonded(), exclusions: { bondSeparation: 3 } },
    ];
    for (const nb of variants) {
      const file = readModelFile(butane(nb));
      const m = parseModel(file);
      const x = m.coordinates;
      const [eLJ, eC] = specEnergy(file);
      const { byKind } = m.breakdown(x);
      expectClose(byKind['lennard-jones'] ?? 0, eLJ, 1e-13, JSON.stringify(nb));
      expectClose(byKind.coulomb ?? 0, eC, 1e-13, JSON.stringify(nb));
      expect((y: Float64Array, g?: Float64Array) => m.energy(y, g)).toHaveCorrectGradient(x, { tolerance: 1e-8 });
      // Displaced a little at random: still right (no pair near the cutoff at these seeds).
      const rng = createRandom(99);
      const y = Float64Array.from(x, (v) => v + rng.uniform(-0.05, 0.05));
      expect((z: Float64Array, g?: Float64Array) => m.energy(z, g)).toHaveCorrectGradient(y, { tolerance: 1e-8 });
    }
    // Explicit bonds replace the terms as connectivity: bonds C0–C1 only, so far fewer exclusions.
    const file = readModelFile({ ...butane(), bonds: [[0, 1]] });
    expect(compileNonbonded(file)!.pairs.excludedCount).toBe(1);
    const [eLJ, eC] = specEnergy(file);
    const { byKind } = parseModel(file).breakdown(parseModel(file).coordinates);
    expectClose(byKind['lennard-jones']!, eLJ, 1e-13);
    expectClose(byKind.coulomb!, eC, 1e-13);
  });

  it('a block with neither lennardJones nor coulomb adds no kinds; Coulomb with all charges 0 reports 0', () => {
    const onlyExclusions = parseModel(butane({ exclusions: { bondSeparation: 3 }, cutoff: 5 }));
    expect(onlyExclusions.kinds).toEqual(['harmonic-bond', 'harmonic-angle']);
    expect(onlyExclusions.nonbonded).toBeNull();
    const file = butane({ coulomb: { dielectric: 1 } });
    file.atoms = file.atoms.map(({ charge: _, ...rest }) => rest);
    const neutral = parseModel(file);
    expect(neutral.kinds).toContain('coulomb');
    expect(neutral.breakdown(neutral.coordinates).byKind.coulomb).toBe(0);
  });

  it('the same physical energy in all four unit systems (convertModelUnits)', () => {
    const file = readModelFile(butane({ ...defaultNonbonded(), cutoff: 3.5 }));
    const m0 = parseModel(file);
    const e0 = m0.breakdown(m0.coordinates).byKind;
    const systems: [Units, number][] = [
      [{ length: 'nanometer', energy: 'kJ/mol' }, 4.184],
      [{ length: 'nanometer', energy: 'kcal/mol' }, 1],
      [{ length: 'angstrom', energy: 'kJ/mol' }, 4.184],
    ];
    for (const [units, energyFactor] of systems) {
      const m = parseModel(convertModelUnits(file, units));
      const { byKind } = m.breakdown(m.coordinates);
      // 1 kcal = 4.184 kJ (exact); the constants agree to rounding, so 1e-12 relative.
      expectClose(byKind['lennard-jones']!, e0['lennard-jones']! * energyFactor, 1e-12, `${units.length} ${units.energy} LJ`);
      expectClose(byKind.coulomb!, e0.coulomb! * energyFactor, 1e-12, `${units.length} ${units.energy} Coulomb`);
    }
  });

  it('checkModelGradient passes and can name a nonbonded kind as the worst', () => {
    const m = parseModel(butane());
    const { check, worst } = checkModelGradient(m);
    expect(check.ok).toBe(true);
    expect(m.kinds).toContain(worst!.kind);
    // With only nonbonded energy, the worst coordinate is blamed on one of its kinds.
    const only = butane();
    only.terms = [];
    const m2 = parseModel(only);
    const r = checkModelGradient(m2);
    expect(r.check.ok).toBe(true);
    expect(NONBONDED_KINDS).toContain(r.worst!.kind);
  });

  it('energy allocates nothing that it keeps: the same scratch serves every call, results repeat bit for bit', () => {
    const m = parseModel(butane({ ...defaultNonbonded(), cutoff: 4 }));
    const x = m.coordinates;
    const g1 = new Float64Array(x.length);
    const g2 = new Float64Array(x.length).fill(5);
    const e1 = m.energy(x, g1);
    m.energy(Float64Array.from(x, (v) => v + 0.3), g2);
    const e2 = m.energy(x, g2);
    expect(e2).toBe(e1);
    expect(Array.from(g2)).toEqual(Array.from(g1));
  });
});

describe('coincident atoms in a counted pair', () => {
  it('the model energy is +Infinity (never NaN) and a relaxation stops with its non-finite reason', async () => {
    const { relaxModel } = await import('../../src/model/relax.js');
    const file = butane();
    file.coordinates[13] = [...file.coordinates[0]] as [number, number, number]; // H13 onto C0: 4 bonds apart, a counted pair
    const m = parseModel(file);
    const g = new Float64Array(3 * m.atomCount);
    expect(m.energy(m.coordinates, g)).toBe(Infinity);
    expect(g.every((v) => Number.isFinite(v))).toBe(true);
    const r = relaxModel(m, { maxIterations: 50 });
    expect(r.converged).toBe(false);
    expect(r.reason).toBe('non-finite');
  });
});
