// Benchmark: the full vibrational analysis of molecule-like models (bench/molecule-like.js, relaxed
// first so the structure is a minimum) at about 30, 100, 300 and 1000 atoms: Hessian assembly
// (dense, analytic), then normal modes (mass weighting, removal of rigid motions, symmetric
// eigen-decomposition, per-mode quantities). Run after `npm run build`:  node bench/vibrations.js
// Best of three runs (one from 1000 atoms up); nothing is asserted.
import { performance } from 'node:perf_hooks';
import { modelHessian, normalModes, parseModel, relaxModel } from '../dist/index.js';
import { moleculeLikeModel } from './molecule-like.js';

function best(runs, f) {
  let t = Infinity;
  let out;
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    out = f();
    t = Math.min(t, performance.now() - t0);
  }
  return { ms: t, out };
}

console.log(`full vibrational analysis, node ${process.version}`);
console.log('atoms   terms   3N    Hessian (ms)   modes incl. eigen (ms)   total (ms)   imaginary   zero modes');
for (const carbons of [10, 33, 100, 333]) {
  const model = parseModel(moleculeLikeModel({ carbons, seed: 1 }));
  const relaxed = relaxModel(model, { maxForce: 1e-3, maxIterations: 50000 });
  const x = relaxed.x;
  const runs = model.atomCount < 900 ? 3 : 1;
  const hessian = best(runs, () => modelHessian(model, x));
  const modes = best(runs, () => normalModes(hessian.out, model.masses, x, model.units));
  const imaginary = modes.out.frequencies.filter((f) => f < 0).length;
  console.log(
    `${String(model.atomCount).padStart(5)}  ${String(model.termCount).padStart(6)}  ${String(3 * model.atomCount).padStart(4)}  ` +
      `${hessian.ms.toFixed(1).padStart(13)}  ${modes.ms.toFixed(1).padStart(23)}  ${(hessian.ms + modes.ms).toFixed(1).padStart(11)}  ` +
      `${String(imaginary).padStart(10)}  ${String(modes.out.zeroModes).padStart(11)}${relaxed.converged ? '' : '  (not relaxed to 1e-3)'}`,
  );
}
