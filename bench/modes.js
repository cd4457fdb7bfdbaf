// Benchmark: the symmetric eigensolver (Householder, QL eigenvalues, inverse-iteration eigenvectors,
// back-transformation) and the normal-mode pipeline.
// Run after `npm run build`:  node bench/modes.js [sizes...]   (default sizes 300 1000; e.g. `node bench/modes.js 300 1000 3000`)
//
// For a baseline, when `python3 -c "import numpy"` works, the same matrix is diagonalized by
// numpy.linalg.eigh (LAPACK dsyevd through numpy's BLAS/LAPACK), on one thread
// (OPENBLAS_NUM_THREADS = OMP_NUM_THREADS = MKL_NUM_THREADS = 1) so that it is compared with our
// one thread. Times are the best of a few runs after a warm-up (one run from 1000 up); nothing is asserted.
// "QL vectors" is the fallback method (`method: 'ql'`, every rotation into the vectors), timed up
// to n = 1000 for comparison. The residual and orthogonality columns sample a few eigenvectors.
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { performance } from 'node:perf_hooks';
import { normalModes, symmetricEigen } from '../dist/index.js';

const sizes = process.argv.slice(2).map(Number).filter((n) => Number.isInteger(n) && n > 0);
if (sizes.length === 0) sizes.push(300, 1000);

function rng(seed) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function randomSymmetric(n, seed) {
  const r = rng(seed);
  const a = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = i; j < n; j++) a[i * n + j] = a[j * n + i] = 2 * r() - 1;
  return a;
}

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

/** Largest |v_i · v_j − δ_ij| for i among the first, middle and last eigenvectors, j over all. */
function orthogonality(n, eig) {
  let worst = 0;
  for (const i of [0, n >> 1, n - 1]) {
    for (let j = 0; j < n; j++) {
      let s = 0;
      for (let c = 0; c < n; c++) s += eig.vectors[i * n + c] * eig.vectors[j * n + c];
      worst = Math.max(worst, Math.abs(s - (i === j ? 1 : 0)));
    }
  }
  return worst;
}

/** Largest |A v − λ v| over the first, middle and last eigenpairs, relative to n·max|A|. */
function residual(a, n, eig) {
  let scale = 0;
  for (let i = 0; i < n * n; i++) scale = Math.max(scale, Math.abs(a[i]));
  let worst = 0;
  for (const i of [0, n >> 1, n - 1]) {
    for (let r = 0; r < n; r++) {
      let s = 0;
      for (let c = 0; c < n; c++) s += a[r * n + c] * eig.vectors[i * n + c];
      worst = Math.max(worst, Math.abs(s - eig.values[i] * eig.vectors[i * n + r]));
    }
  }
  return worst / (n * scale);
}

const numpyOk = spawnSync('python3', ['-c', 'import numpy'], { encoding: 'utf8' }).status === 0;
const dir = mkdtempSync(join(tmpdir(), 'strainwise-bench-'));
const PY = `
import sys, time, numpy as np
n, runs = int(sys.argv[2]), int(sys.argv[3])
a = np.fromfile(sys.argv[1], dtype=np.float64).reshape(n, n)
best = float('inf')
for _ in range(runs):
    t = time.perf_counter(); w, v = np.linalg.eigh(a); best = min(best, time.perf_counter() - t)
print(best * 1000)
`;
function numpyTime(a, n, runs) {
  if (!numpyOk) return NaN;
  const path = join(dir, `m${n}.bin`);
  writeFileSync(path, Buffer.from(a.buffer, a.byteOffset, a.byteLength));
  const env = { ...process.env, OPENBLAS_NUM_THREADS: '1', OMP_NUM_THREADS: '1', MKL_NUM_THREADS: '1' };
  const r = spawnSync('python3', ['-c', PY, path, String(n), String(runs)], { encoding: 'utf8', env });
  return r.status === 0 ? Number(r.stdout.trim()) : NaN;
}

console.log(`symmetricEigen (values ascending + orthonormal vectors), node ${process.version}`);
console.log('    n   vectors (ms)   values only (ms)   QL vectors (ms)   residual   orthogonality   numpy eigh 1 thread (ms)   ratio');
try {
  for (const n of sizes) {
    const a = randomSymmetric(n, n);
    const runs = n < 1000 ? 5 : 1;
    if (n < 1000) symmetricEigen(a, n); // warm-up: the first calls run before the compiler has optimized the loops
    const withVectors = best(runs, () => symmetricEigen(a, n));
    const valuesOnly = best(runs, () => symmetricEigen(a, n, { vectors: false }));
    const ql = n <= 1000 ? best(1, () => symmetricEigen(a, n, { method: 'ql' })).ms : NaN;
    const np = numpyTime(a, n, runs);
    console.log(
      `${String(n).padStart(5)}  ${withVectors.ms.toFixed(1).padStart(13)}  ${valuesOnly.ms.toFixed(1).padStart(17)}  ` +
        `${(Number.isNaN(ql) ? '-' : ql.toFixed(1)).padStart(16)}  ${residual(a, n, withVectors.out).toExponential(1).padStart(9)}  ` +
        `${orthogonality(n, withVectors.out).toExponential(1).padStart(14)}  ` +
        `${(Number.isNaN(np) ? 'n/a' : np.toFixed(1)).padStart(25)}  ${Number.isNaN(np) ? '' : (withVectors.ms / np).toFixed(2) + '×'}`,
    );
  }
  console.log('(ratio = our vectors time / numpy eigh; load average at the end: ' + loadavg().map((x) => x.toFixed(2)).join(' ') + ')');

  // The normal-mode pipeline on a synthetic Hessian of 100 atoms (3N = 300): a random
  // positive semi-definite matrix, so the timing covers weighting, removal of the rigid
  // motions, diagonalization and the per-mode quantities.
  const atoms = 100;
  const n = 3 * atoms;
  const r = rng(7);
  const x = Float64Array.from({ length: n }, () => 10 * r() - 5);
  const masses = Float64Array.from({ length: atoms }, () => 1 + 15 * r());
  const b = randomSymmetric(n, 9);
  const h = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let k = 0; k < n; k++) { const bik = b[i * n + k]; for (let j = 0; j < n; j++) h[i * n + j] += bik * b[k * n + j]; }
  const modes = best(3, () => normalModes(h, masses, x, { length: 'angstrom', energy: 'kcal/mol' }));
  console.log(`\nnormalModes, ${atoms} atoms (3N = ${n}): ${modes.ms.toFixed(1)} ms, ${modes.out.frequencies.length} modes, ${modes.out.zeroModes} removed`);
} finally {
  rmSync(dir, { recursive: true, force: true });
}
