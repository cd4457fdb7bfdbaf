/**
 * Normal modes: against an independent Hessian, invariance under rigid
 * motions, orthonormality, the zero-mode count (non-linear, linear, one
 * atom, position restraints), imaginary modes, unit systems, errors.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { convertModelUnits } from '../../src/model/convert.js';
import { parseModel, type Model } from '../../src/model/model.js';
import type { Units } from '../../src/units.js';
import { vibrationalAnalysis } from '../../src/vibrations/model-modes.js';
import { normalModes } from '../../src/vibrations/normal-modes.js';
import { rigidMotions } from '../../src/vibrations/rigid-motions.js';
import { applyMotion, randomRigidMotion } from '../helpers/geometry.js';
import { createRandom } from '../helpers/random.js';
import { SPEC_WATER } from '../fixtures/models.js';
import { carbonDioxide, modelFile, torsionBarrierTop, waterAtMinimum } from './models.js';

const KCAL_A: Units = { length: 'angstrom', energy: 'kcal/mol' };

/** An independent Hessian: second differences of the energy alone (no gradient), step h. */
function energyHessian(model: Model, x: Float64Array, h = 1e-3): Float64Array {
  const n = x.length;
  const out = new Float64Array(n * n);
  const y = Float64Array.from(x);
  const e = (i: number, di: number, j: number, dj: number): number => {
    y[i] += di;
    y[j] += dj;
    const v = model.energy(y);
    y[i] = x[i];
    y[j] = x[j];
    return v;
  };
  for (let i = 0; i < n; i++) {
    for (let j = i; j < n; j++) {
      const v = (e(i, h, j, h) - e(i, h, j, -h) - e(i, -h, j, h) + e(i, -h, j, -h)) / (4 * h * h);
      out[i * n + j] = v;
      out[j * n + i] = v;
    }
  }
  return out;
}

function dot(a: Float64Array, b: Float64Array): number {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += a[i] * b[i];
  return s;
}

describe('normalModes on the water model at its minimum', () => {
  const model = parseModel(waterAtMinimum());
  const x = model.coordinates;
  const analysis = vibrationalAnalysis(model);

  it('3 vibrations and 6 zero modes; the same within 0.1% from an independent energy-only Hessian', () => {
    expect(analysis.modes.zeroModes).toBe(6);
    expect(analysis.modes.frequencies.length).toBe(3);
    const independent = normalModes(energyHessian(model, x), model.masses, x, model.units);
    for (let i = 0; i < 3; i++) {
      expect(Math.abs(independent.frequencies[i] / analysis.modes.frequencies[i] - 1)).toBeLessThan(1e-3);
    }
  });

  it('mass-weighted modes are orthonormal and orthogonal to the rigid motions; Cartesian modes have length 1; k = dᵀ H d, μ = 1/Σ q²/m', () => {
    const { modes, massWeightedModes, forceConstants, reducedMasses } = analysis.modes;
    const rigid = rigidMotions(x, model.masses);
    const n = 9;
    for (let i = 0; i < 3; i++) {
      for (let j = 0; j < 3; j++) expect(Math.abs(dot(massWeightedModes[i], massWeightedModes[j]) - (i === j ? 1 : 0))).toBeLessThan(1e-12);
      for (let r = 0; r < rigid.count; r++) expect(Math.abs(dot(massWeightedModes[i], rigid.vectors.subarray(r * n, (r + 1) * n)))).toBeLessThan(1e-12);
      expect(Math.abs(dot(modes[i], modes[i]) - 1)).toBeLessThan(1e-14);
    }
    const h = energyHessian(model, x);
    for (let i = 0; i < 3; i++) {
      const d = modes[i];
      let k = 0;
      for (let r = 0; r < n; r++) for (let c = 0; c < n; c++) k += d[r] * h[r * n + c] * d[c];
      expect(Math.abs(k / forceConstants[i] - 1)).toBeLessThan(1e-3);
      let s = 0;
      for (let c = 0; c < n; c++) s += massWeightedModes[i][c] ** 2 / model.masses[(c / 3) | 0];
      expect(reducedMasses[i]).toBeCloseTo(1 / s, 12);
    }
  });

  it('property: the wavenumbers do not change when the molecule is moved rigidly (common practice: rotational invariance)', () => {
    const h = energyHessian(model, x);
    const reference = normalModes(h, model.masses, x, model.units).frequencies;
    fc.assert(
      fc.property(fc.integer(), (seed) => {
        const y = applyMotion(x, randomRigidMotion(createRandom(seed)));
        const f = vibrationalAnalysis(model, { x: y }).modes.frequencies;
        return f.length === 3 && f.every((v, i) => Math.abs(v / reference[i] - 1) < 1e-3);
      }),
      { numRuns: 10 },
    );
  });

  it('the same wavenumbers in all four unit systems (1e-7 relative)', () => {
    for (const units of [
      { length: 'nanometer', energy: 'kJ/mol' },
      { length: 'nanometer', energy: 'kcal/mol' },
      { length: 'angstrom', energy: 'kJ/mol' },
    ] as Units[]) {
      const f = vibrationalAnalysis(parseModel(convertModelUnits(waterAtMinimum(), units))).modes.frequencies;
      f.forEach((v, i) => expect(Math.abs(v / analysis.modes.frequencies[i] - 1)).toBeLessThan(1e-7));
    }
  });

  it('heavier atoms vibrate slower: D2O wavenumbers are below H2O ones, the stretches by about √2 at most (common practice)', () => {
    const heavy = waterAtMinimum();
    heavy.atoms = heavy.atoms.map((a) => (a.element === 'H' ? { ...a, mass: 2.014 } : a));
    const d2o = vibrationalAnalysis(parseModel(heavy)).modes.frequencies;
    for (let i = 0; i < 3; i++) {
      expect(d2o[i]).toBeLessThan(analysis.modes.frequencies[i]);
      expect(analysis.modes.frequencies[i] / d2o[i]).toBeLessThan(Math.SQRT2);
    }
  });
});

describe('normalModes: how many rigid motions are removed', () => {
  it('linear (CO2-like): 5; bent by 1° it is non-linear: 6', () => {
    const linear = vibrationalAnalysis(parseModel(carbonDioxide()));
    expect(linear.modes.linear).toBe(true);
    expect(linear.modes.zeroModes).toBe(5);
    const bent = carbonDioxide();
    const t = Math.PI / 180;
    bent.coordinates[2] = [1.16 * Math.cos(t), 1.16 * Math.sin(t), 0];
    const b = vibrationalAnalysis(parseModel(bent));
    expect(b.modes.linear).toBe(false);
    expect(b.modes.zeroModes).toBe(6);
    expect(b.modes.frequencies.length).toBe(3);
  });

  it('a free internal rotation (a chain without a torsion term) stays a vibration of ~0 cm⁻¹, orthogonal to the rigid motions', () => {
    const file = torsionBarrierTop();
    file.terms = file.terms.filter((t) => t.kind !== 'periodic-dihedral');
    const model = parseModel(file);
    const a = vibrationalAnalysis(model);
    expect(a.modes.zeroModes).toBe(6);
    expect(a.modes.frequencies.length).toBe(6);
    const free = Array.from(a.modes.frequencies).filter((f) => Math.abs(f) < 1);
    expect(free.length).toBe(1);
    const i = Array.from(a.modes.frequencies).findIndex((f) => Math.abs(f) < 1);
    const rigid = rigidMotions(model.coordinates, model.masses);
    for (let r = 0; r < rigid.count; r++) {
      expect(Math.abs(dot(a.modes.massWeightedModes[i], rigid.vectors.subarray(r * 12, (r + 1) * 12)))).toBeLessThan(1e-12);
    }
  });

  it('one atom: 3 zero modes and no vibrations', () => {
    const m = parseModel(modelFile([{ element: 'Ar' }], Float64Array.of(1, 2, 3), []));
    const a = vibrationalAnalysis(m);
    expect(a.modes.zeroModes).toBe(3);
    expect(a.modes.frequencies.length).toBe(0);
    expect(a.thermo.zeroPointEnergy).toBe(0);
  });

  it('position restraints tie the model to space: 0 zero modes, all 3N modes kept, none projected', () => {
    const file = waterAtMinimum();
    file.terms = [...file.terms, { kind: 'position-restraint', atoms: [0], k: 50, x0: file.coordinates[0] as [number, number, number] }];
    const a = vibrationalAnalysis(parseModel(file));
    expect(a.projectRigid).toBe(false);
    expect(a.modes.zeroModes).toBe(0);
    expect(a.modes.frequencies.length).toBe(9);
    // The restraint holds atom 0 by a spring, not the rotations about it: three modes stay at (nearly) zero.
    const nearZero = Array.from(a.modes.frequencies).filter((f) => Math.abs(f) < 1).length;
    expect(nearZero).toBe(3);
  });
});

describe('normalModes at a saddle point and off a stationary point', () => {
  it('the top of a torsion barrier: one imaginary mode, reported negative, and the energy falls along it', () => {
    const model = parseModel(torsionBarrierTop());
    const a = vibrationalAnalysis(model);
    expect(a.stationary.stationary).toBe(true);
    expect(a.modes.imaginaryCount).toBe(1);
    expect(a.modes.frequencies[0]).toBeLessThan(0);
    expect(a.modes.frequencies[1]).toBeGreaterThan(0);
    const x = model.coordinates;
    const e0 = model.energy(x);
    for (const s of [0.01, -0.01]) {
      const y = Float64Array.from(x, (v, c) => v + s * a.modes.modes[0][c]);
      expect(model.energy(y)).toBeLessThan(e0);
    }
    expect(a.thermo.excludedModes).toBe(1);
  });

  it('the spec water as written is not stationary: the check says so and names the force', () => {
    const a = vibrationalAnalysis(parseModel(SPEC_WATER));
    expect(a.stationary.stationary).toBe(false);
    expect(a.stationary.maxForce).toBeGreaterThan(0.01);
    expect(a.stationary.threshold).toBe(0.01);
  });
});

describe('normalModes: boundary checks', () => {
  const masses = Float64Array.of(1, 2);
  const x = new Float64Array(6);
  it('names what does not fit', () => {
    expect(() => normalModes(new Float64Array(36), masses, new Float64Array(5), KCAL_A)).toThrow('normalModes: coordinates: expected 3N = 6 numbers, got 5');
    expect(() => normalModes(new Float64Array(35), masses, x, KCAL_A)).toThrow('normalModes: hessian: expected (3N)² = 36 numbers, got 35');
    expect(() => normalModes(new Float64Array(36), Float64Array.of(1, 0), x, KCAL_A)).toThrow('normalModes: masses[1]: expected a finite number > 0, got 0');
    const h = new Float64Array(36);
    h[7] = NaN;
    expect(() => normalModes(h, masses, x, KCAL_A)).toThrow('normalModes: hessian[1][1] is NaN, expected a finite number');
  });
});
