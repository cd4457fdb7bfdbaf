/**
 * Evaluations against a mature L-BFGS-B on molecule-like models.
 *
 * Reference: lbfgsb-reference.json, written by bench/lbfgsb/compare.py, which
 * ran scipy's L-BFGS-B (scipy.optimize.minimize(method='L-BFGS-B'), history
 * 10, the version named in the file) on the very same energies
 * (bench/molecule-like.js served by bench/lbfgsb/server.js) and stopped it at
 * the first iterate with largest per-atom force ≤ 1e-3, counting every
 * energy+gradient call.
 */
import { describe, expect, it } from 'vitest';
import { moleculeLikeModel } from '../../bench/molecule-like.js';
import { parseModel } from '../../src/model/model.js';
import { relaxModel } from '../../src/model/relax.js';
import { maxAtomNorm } from '../../src/optimize/forces.js';
import reference from './lbfgsb-reference.json' with { type: 'json' };

const models = reference.models.map((r) => ({ ...r, model: parseModel(moleculeLikeModel({ carbons: r.carbons, seed: r.seed })) }));

describe('L-BFGS against scipy L-BFGS-B on molecule-like models (reference: ' + reference.source + ')', () => {
  it('the reference runs all converged to the same criterion', () => {
    expect(reference.maxForce).toBe(1e-3);
    expect(models.length).toBeGreaterThanOrEqual(15);
    for (const r of models) expect(r.converged).toBe(true);
  });

  it.each(models.map((m) => [`${m.carbons} carbons, seed ${m.seed}`, m] as const))(
    '%s: preconditioned L-BFGS needs at most 0.8× the evaluations, and its result re-evaluates exactly',
    (_, r) => {
      const result = relaxModel(r.model, { maxForce: 1e-3 });
      expect(result.converged).toBe(true);
      expect(result.evaluations).toBeLessThanOrEqual(0.8 * r.evaluations);
      // what was reported is what the returned coordinates give
      const g = new Float64Array(result.x.length);
      expect(r.model.energy(result.x, g)).toBe(result.energy);
      expect(maxAtomNorm(g)).toBe(result.maxForce);
      expect(maxAtomNorm(g)).toBeLessThanOrEqual(1e-3);
      expect(result.energy).toBeLessThan(result.initialEnergy);
    },
  );

  it('plain L-BFGS (no preconditioner) stays below the reference on average', () => {
    let ratio = 0;
    for (const r of models) {
      const result = relaxModel(r.model, { maxForce: 1e-3, precondition: false });
      expect(result.converged).toBe(true);
      ratio += result.evaluations / r.evaluations / models.length;
    }
    expect(ratio).toBeLessThan(0.9);
  });

  it.each(['cg', 'sd'] as const)('%s converges to 1e-2 on the first six models and never raises the energy', (method) => {
    for (const r of models.slice(0, 6)) {
      let last = Infinity;
      let rose = false;
      const result = relaxModel(r.model, {
        method,
        maxForce: 1e-2,
        maxIterations: 100000,
        onIteration: (info) => {
          if (info.energy > last) rose = true;
          last = info.energy;
        },
      });
      expect(result.converged).toBe(true);
      expect(rose).toBe(false);
      expect(result.maxForce).toBeLessThanOrEqual(1e-2);
    }
  });
});
