import { describe, expect, it } from 'vitest';
import { moleculeLikeModel } from '../../bench/molecule-like.js';
import { parseModel } from '../../src/model/model.js';
import { stiffTermPreconditioner } from '../../src/model/preconditioner.js';
import { relaxModel } from '../../src/model/relax.js';
import { minimize } from '../../src/optimize/minimize.js';
import { distance } from '../../src/terms/measure.js';

const UNITS = { length: 'angstrom', energy: 'kcal/mol' } as const;

describe('stiffTermPreconditioner', () => {
  it('is k u uᵀ on the two atoms of one bond plus μ = 0.1 × mean diagonal (vᵀPv checked by hand)', () => {
    const model = parseModel({
      format: 'strainwise-model',
      version: 1,
      units: UNITS,
      atoms: [{ element: 'C' }, { element: 'C' }],
      coordinates: [[0, 0, 0], [0.6, 0.8, 0]],
      terms: [{ kind: 'harmonic-bond', atoms: [0, 1], k: 500, r0: 1.5 }],
    });
    const p = stiffTermPreconditioner(model.atomCount, model.tables, model.frozen);
    expect(p).toBeDefined();
    expect(p!.update(model.coordinates)).toBe(true);
    // P = k [u uᵀ, −u uᵀ; −u uᵀ, u uᵀ] + μ I, trace = 2k, dimension 6 → μ = 0.1·2k/6
    const k = 500;
    const mu = (0.1 * 2 * k) / 6;
    const u = [0.6, 0.8, 0];
    const v = Float64Array.from([0.3, -1.2, 0.5, 2.0, 0.1, -0.7]);
    const along = (v[3] - v[0]) * u[0] + (v[4] - v[1]) * u[1] + (v[5] - v[2]) * u[2];
    const vPv = k * along * along + mu * v.reduce((a, x) => a + x * x, 0);
    const s = new Float64Array(6);
    p!.stretch(v, s);
    expect(s.reduce((a, x) => a + x * x, 0)).toBeCloseTo(vPv, 9);
  });

  it('is undefined for a model without bond or angle terms', () => {
    const model = parseModel({
      format: 'strainwise-model',
      version: 1,
      units: UNITS,
      atoms: [{ element: 'C' }],
      coordinates: [[0, 0, 0]],
      terms: [{ kind: 'position-restraint', atoms: [0], k: 1, x0: [1, 0, 0] }],
    });
    expect(stiffTermPreconditioner(model.atomCount, model.tables, model.frozen)).toBeUndefined();
  });

  it('with frozen atoms and fixed distances: frozen atoms bit-for-bit, constraints to 1e-10, converged', () => {
    const file = moleculeLikeModel({ carbons: 10, seed: 4 });
    const x = file.coordinates;
    const constraints = [
      [0, 1],
      [1, 2],
      [3, 4],
    ].map(([i, j]) => ({ kind: 'fixed-distance', atoms: [i, j], length: 1.52 }));
    // start on the constraints: scale each pair's bond to 1.52 by moving the second atom
    for (const c of constraints) {
      const [i, j] = c.atoms;
      const d = [0, 1, 2].map((p) => x[j][p] - x[i][p]);
      const len = Math.hypot(...d);
      x[j] = [0, 1, 2].map((p) => x[i][p] + (d[p] * 1.52) / len) as [number, number, number];
    }
    const model = parseModel({ ...file, coordinates: x, frozen: [5, 9], constraints });
    const start = model.coordinates;
    const result = relaxModel(model, { maxForce: 1e-3 });
    expect(result.converged).toBe(true);
    for (const a of [5, 9]) for (let p = 0; p < 3; p++) expect(result.x[3 * a + p]).toBe(start[3 * a + p]);
    for (const c of constraints) {
      expect(Math.abs(distance(result.x, c.atoms[0], c.atoms[1]) - 1.52) / 1.52).toBeLessThan(1e-10);
    }
    const plain = relaxModel(model, { maxForce: 1e-3, precondition: false });
    expect(plain.converged).toBe(true);
    expect(result.evaluations).toBeLessThan(plain.evaluations);
  });
});

describe('preconditioned L-BFGS: whitened pairs', () => {
  const model = parseModel(moleculeLikeModel({ carbons: 30, seed: 2 }));
  const fn = (x: Float64Array, g?: Float64Array): number => model.energy(x, g);

  it('rebuilding an unchanged preconditioner (every step) re-whitens the pairs: the same iterates to rounding', () => {
    // A preconditioner frozen at the start geometry: each update rebuilds the same P. Re-whitening
    // gives L⁻¹Πy where the steps kept L⁻¹Πg_new − L⁻¹Πg_old, equal to rounding only.
    const inner = stiffTermPreconditioner(model.atomCount, model.tables, model.frozen)!;
    const start = model.coordinates;
    const fixed = { ...inner, update: () => inner.update(start) };
    for (const maxIterations of [5, 25]) {
      const once = minimize(fn, start, { maxIterations, preconditioner: fixed, preconditionerRefresh: Infinity });
      const always = minimize(fn, start, { maxIterations, preconditioner: fixed, preconditionerRefresh: 1 });
      expect(always.evaluations).toBe(once.evaluations);
      for (let i = 0; i < start.length; i++) expect(Math.abs(always.x[i] - once.x[i])).toBeLessThan(1e-9);
    }
    const once = minimize(fn, start, { maxForce: 1e-3, preconditioner: fixed, preconditionerRefresh: Infinity });
    const always = minimize(fn, start, { maxForce: 1e-3, preconditioner: fixed, preconditionerRefresh: 1 });
    expect(once.converged && always.converged).toBe(true);
    // over a whole run the rounding differences grow into different paths (as any change of rounding does)
    expect(always.evaluations).toBeLessThan(1.5 * once.evaluations);
    expect(once.evaluations).toBeLessThan(1.5 * always.evaluations);
  });

  it('converges with frequent rebuilds, and the two vector engines agree', () => {
    const results = (['wasm', 'js'] as const).map((engine) =>
      relaxModel(model, { maxForce: 1e-3, preconditionerRefresh: 3, engine }),
    );
    for (const r of results) expect(r.converged).toBe(true);
    // different rounding, different paths: the same minimum to what a 1e-3 force criterion allows
    expect(Math.abs(results[0].energy - results[1].energy)).toBeLessThan(1e-4 * Math.max(1, Math.abs(results[1].energy)));
    // and it still needs fewer evaluations than plain L-BFGS
    const plain = relaxModel(model, { maxForce: 1e-3, precondition: false });
    expect(results[0].evaluations).toBeLessThan(plain.evaluations);
  });
});
