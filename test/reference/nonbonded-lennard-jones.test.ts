/**
 * Lennard-Jones pairs against outside values. The form
 * E = ε [(rmin/r)¹² − 2 (rmin/r)⁶] is the model-file spec's; its minimum −ε
 * at r = rmin and its zero at rmin · 2^(−1/6) (= σ of the equivalent
 * 4ε [(σ/r)¹² − (σ/r)⁶] form) follow from it and are common practice.
 */
import { describe, expect, it } from 'vitest';
import { parseModel } from '../../src/model/model.js';
import { relaxModel } from '../../src/model/relax.js';
import { accumulateNonbonded, createNonbondedPairs } from '../../src/terms/nonbonded.js';
import { AVOGADRO, KJ_PER_KCAL } from '../../src/units.js';

const pair = (r: number) => new Float64Array([0, 0, 0, 0, r, 0]);

describe('Lennard-Jones shape (spec formula; common practice)', () => {
  const rmin = 3.7;
  const eps = 0.25; // invented
  const set = createNonbondedPairs({
    atomCount: 2,
    lennardJones: { rmin: [rmin, rmin], epsilon: [eps, eps], combination: 'geometric' },
  });
  it('minimum −ε at rmin, with zero force there', () => {
    const g = new Float64Array(6);
    expect(accumulateNonbonded(pair(rmin), set, g)).toBeCloseTo(-eps, 15);
    expect(Math.abs(g[4])).toBeLessThan(1e-15);
    expect(accumulateNonbonded(pair(rmin * 0.999), set)).toBeGreaterThan(-eps);
    expect(accumulateNonbonded(pair(rmin * 1.001), set)).toBeGreaterThan(-eps);
  });
  it('zero crossing at rmin · 2^(−1/6) = σ, repulsive inside and attractive outside', () => {
    const sigma = rmin * Math.pow(2, -1 / 6);
    expect(Math.abs(accumulateNonbonded(pair(sigma), set))).toBeLessThan(1e-14);
    expect(accumulateNonbonded(pair(sigma * 0.99), set)).toBeGreaterThan(0);
    expect(accumulateNonbonded(pair(sigma * 1.01), set)).toBeLessThan(0);
  });
  it('equals the σ form 4ε[(σ/r)¹² − (σ/r)⁶] at any r; both combination rules agree for like atoms', () => {
    const lb = createNonbondedPairs({
      atomCount: 2,
      lennardJones: { rmin: [rmin, rmin], epsilon: [eps, eps], combination: 'lorentz-berthelot' },
    });
    const sigma = rmin * Math.pow(2, -1 / 6);
    for (const r of [3, 3.5, 4, 5, 8, 12]) {
      const sigmaForm = 4 * eps * (Math.pow(sigma / r, 12) - Math.pow(sigma / r, 6));
      expect(accumulateNonbonded(pair(r), set)).toBeCloseTo(sigmaForm, 13);
      expect(accumulateNonbonded(pair(r), lb)).toBeCloseTo(sigmaForm, 13);
    }
  });
});

describe('argon dimer (ε/k_B ≈ 120 K, σ ≈ 3.4 Å: textbook values, from memory)', () => {
  // k_B · N_A = R = 1.380649e-23 J/K × 6.02214076e23 /mol (CODATA 2018, both exact).
  const R = (1.380649e-23 * AVOGADRO) / 1000; // kJ/(mol K)
  const epsKcal = (120 * R) / KJ_PER_KCAL; // ≈ 0.2385 kcal/mol
  const rmin = 3.4 * Math.pow(2, 1 / 6); // ≈ 3.816 Å
  const model = (cutoff: number | null) =>
    parseModel({
      format: 'strainwise-model',
      version: 1,
      units: { length: 'angstrom', energy: 'kcal/mol' },
      atoms: [{ element: 'Ar' }, { element: 'Ar' }],
      coordinates: [
        [0, 0, 0],
        [4.5, 0, 0],
      ],
      terms: [],
      nonbonded: { lennardJones: { rmin: [rmin, rmin], epsilon: [epsKcal, epsKcal], combination: 'geometric' }, cutoff },
    });
  it('the well depth is 120 K · R = 0.998 kJ/mol = 0.2385 kcal/mol, at 2^(1/6) σ = 3.816 Å', () => {
    expect(epsKcal).toBeCloseTo(0.2385, 4);
    expect(rmin).toBeCloseTo(3.816, 3);
    const relaxed = relaxModel(model(null), { maxForce: 1e-8 });
    expect(relaxed.converged).toBe(true);
    const x = relaxed.x;
    expect(Math.hypot(x[3] - x[0], x[4] - x[1], x[5] - x[2])).toBeCloseTo(rmin, 6);
    expect(relaxed.energy).toBeCloseTo(-epsKcal, 12);
  });
  it('with a 10 Å cutoff the minimum stays at rmin and the well is ε less E(10 Å)', () => {
    const relaxed = relaxModel(model(10), { maxForce: 1e-8 });
    const x = relaxed.x;
    expect(Math.hypot(x[3] - x[0], x[4] - x[1], x[5] - x[2])).toBeCloseTo(rmin, 6);
    const t = Math.pow(rmin / 10, 6);
    expect(relaxed.energy).toBeCloseTo(-epsKcal - epsKcal * (t * t - 2 * t), 12);
  });
});

describe('four Lennard-Jones atoms', () => {
  it('relax to a regular tetrahedron with all six pairs at rmin: E = −6ε (true by construction of the formula)', () => {
    const eps = 0.3;
    const rmin = 3;
    const m = parseModel({
      format: 'strainwise-model',
      version: 1,
      units: { length: 'angstrom', energy: 'kcal/mol' },
      atoms: Array.from({ length: 4 }, () => ({ element: 'Ar' })),
      coordinates: [
        [0, 0, 0],
        [3.2, 0.1, 0],
        [1.4, 2.7, 0.2],
        [1.6, 0.9, 2.5],
      ],
      terms: [],
      nonbonded: { lennardJones: { rmin: Array(4).fill(rmin), epsilon: Array(4).fill(eps), combination: 'lorentz-berthelot' } },
    });
    const r = relaxModel(m, { maxForce: 1e-9 });
    expect(r.converged).toBe(true);
    expect(r.energy).toBeCloseTo(-6 * eps, 12);
    for (let i = 0; i < 4; i++) {
      for (let j = i + 1; j < 4; j++) {
        expect(Math.hypot(r.x[3 * j] - r.x[3 * i], r.x[3 * j + 1] - r.x[3 * i + 1], r.x[3 * j + 2] - r.x[3 * i + 2])).toBeCloseTo(rmin, 6);
      }
    }
  });
});
