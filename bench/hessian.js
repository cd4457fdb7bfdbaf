// npm run bench:hessian: median time of Hessian assembly. Dense (3N)×(3N)
// at 30/100/300/1000 atoms, and block-sparse (symbolic pass once, numeric
// pass per geometry, one Hessian-vector product) at 1e4 and 1e5 terms, and
// nonbonded pair blocks within a cutoff (update and product) at 1e3 and 1e4 atoms.
// Prints medians; nothing here asserts a time.
import { BlockSparseHessian, createNonbondedPairs, createTable, NonbondedPairHessian, tablesHessian } from '../dist/index.js';

let seed = 2468;
const random = () => ((seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648);

function chain(atoms) {
  // a random walk with 1.5-unit steps, so every term sees ordinary geometry
  const x = new Float64Array(3 * atoms);
  for (let a = 1; a < atoms; a++) {
    const u = 2 * random() - 1, t = 2 * Math.PI * random(), s = Math.sqrt(1 - u * u);
    x[3 * a] = x[3 * a - 3] + 1.5 * s * Math.cos(t);
    x[3 * a + 1] = x[3 * a - 2] + 1.5 * s * Math.sin(t);
    x[3 * a + 2] = x[3 * a - 1] + 1.5 * u;
  }
  return x;
}

function table(kind, count, atoms) {
  const t = createTable(kind, count);
  for (let r = 0; r < count; r++) {
    const start = r % (atoms - t.arity);
    for (let a = 0; a < t.arity; a++) t.atoms[r * t.arity + a] = start + a;
    for (let p = 0; p < t.width; p++) t.params[r * t.width + p] = 0.5 + random();
    if (kind === 'periodic-dihedral') t.params[r * t.width + 1] = 3;
  }
  return t;
}

/** A chain molecule's bonded terms: one bond, angle and torsion per atom. */
function molecule(atoms) {
  const n = atoms;
  return [
    table('harmonic-bond', n - 1, n),
    table('harmonic-angle', n - 2, n),
    table('periodic-dihedral', n - 3, n),
  ];
}

function median(f, repeats) {
  f();
  const times = [];
  for (let i = 0; i < repeats; i++) {
    const t0 = process.hrtime.bigint();
    f();
    times.push(Number(process.hrtime.bigint() - t0) / 1e6);
  }
  times.sort((a, b) => a - b);
  return times[times.length >> 1];
}

const ms = (v) => v.toFixed(v < 1 ? 3 : 1).padStart(9);

// warm the kernels up (JIT) before anything is timed
{
  const x = chain(100);
  const tables = molecule(100);
  const out = new Float64Array(9 * 100 * 100);
  for (let i = 0; i < 200; i++) tablesHessian(tables, 100, x, out);
}

console.log('dense assembly (bonds + angles + torsions of a chain, ~3 terms per atom)');
console.log('   atoms    terms  matrix MB   assemble ms   of which clearing ms');
for (const atoms of [30, 100, 300, 1000]) {
  const x = chain(atoms);
  const tables = molecule(atoms);
  const terms = tables.reduce((s, t) => s + t.count, 0);
  const out = new Float64Array(9 * atoms * atoms);
  const repeats = atoms >= 1000 ? 5 : 21;
  const total = median(() => tablesHessian(tables, atoms, x, out), repeats);
  const clear = median(() => out.fill(0), repeats);
  console.log(`${String(atoms).padStart(8)} ${String(terms).padStart(8)} ${(out.length * 8 / 1e6).toFixed(1).padStart(10)} ${ms(total)}     ${ms(clear)}`);
}

console.log('\nblock-sparse (same chain terms; per-term time should stay flat: linear)');
console.log('   terms    atoms   blocks   symbolic ms   update ms   ns/term   multiply ms');
for (const terms of [1e4, 1e5]) {
  const atoms = Math.round(terms / 3) + 3;
  const x = chain(atoms);
  const tables = molecule(atoms);
  const count = tables.reduce((s, t) => s + t.count, 0);
  const t0 = process.hrtime.bigint();
  const sparse = new BlockSparseHessian(tables, atoms);
  const symbolic = Number(process.hrtime.bigint() - t0) / 1e6;
  const update = median(() => sparse.update(x), 11);
  const v = x.map(() => random() - 0.5);
  const out = new Float64Array(v.length);
  const multiply = median(() => sparse.multiply(v, out), 11);
  console.log(
    `${String(count).padStart(8)} ${String(atoms).padStart(8)} ${String(sparse.blockCount).padStart(8)} ${ms(symbolic)}     ${ms(update)}  ${((update * 1e6) / count).toFixed(0).padStart(8)}   ${ms(multiply)}`,
  );
}

console.log('\nnonbonded pair blocks (Lennard-Jones + Coulomb, random atoms at 0.1 atoms/Å³, cutoff 10 Å)');
console.log('   atoms    pairs in cutoff   update ms   multiply ms   ns/pair (update)');
for (const atoms of [1e3, 1e4]) {
  const side = Math.cbrt(atoms / 0.1);
  const x = Float64Array.from({ length: 3 * atoms }, () => side * random());
  const pairs = createNonbondedPairs({
    atomCount: atoms,
    lennardJones: { rmin: new Float64Array(atoms).fill(3.2), epsilon: new Float64Array(atoms).fill(0.15), combination: 'geometric' },
    coulomb: { charges: Float64Array.from({ length: atoms }, (_, a) => (a % 2 === 0 ? 0.4 : -0.4)), constant: 332.0637 },
    cutoff: 10,
  });
  const hessian = new NonbondedPairHessian(pairs);
  const update = median(() => hessian.update(x), 5);
  const v = x.map(() => random() - 0.5);
  const y = new Float64Array(v.length);
  const multiply = median(() => hessian.multiplyAdd(v, y), 5);
  console.log(
    `${String(atoms).padStart(8)} ${String(hessian.count).padStart(18)} ${ms(update)}   ${ms(multiply)}     ${((update * 1e6) / hessian.count).toFixed(0).padStart(8)}`,
  );
}
