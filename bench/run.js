// npm run bench: median time of energy + gradient per kernel at 10^5 and 10^6
// terms, against a baseline written the everyday way with gl-matrix vec3
// objects per atom. Prints medians; nothing here asserts a time.
import { vec3 } from 'gl-matrix';
import { createTable, KERNELS, TERM_KINDS } from '../dist/index.js';

let seed = 12345;
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
    if (kind === 'periodic-dihedral' || kind === 'periodic-angle') t.params[r * t.width + 1] = 3;
    if (kind === 'distance-restraint') { t.params[r * 3 + 1] = 1; t.params[r * 3 + 2] = 1.2; }
  }
  return t;
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

// Baseline: harmonic bonds with gl-matrix vec3 objects, one per atom.
function baselineBonds(points, forces, pairs, k, r0) {
  const d = vec3.create();
  let e = 0;
  for (const f of forces) vec3.set(f, 0, 0, 0);
  for (let t = 0; t < pairs.length; t += 2) {
    const i = pairs[t], j = pairs[t + 1];
    vec3.subtract(d, points[j], points[i]);
    const r = vec3.length(d);
    const dr = r - r0[t >> 1];
    e += 0.5 * k[t >> 1] * dr * dr;
    vec3.scaleAndAdd(forces[j], forces[j], d, (k[t >> 1] * dr) / r);
    vec3.scaleAndAdd(forces[i], forces[i], d, (-k[t >> 1] * dr) / r);
  }
  return e;
}

console.log('strainwise kernels: median of energy + gradient (Node ' + process.version + ')');
console.log('kind                      terms      ms/call   ns/term');
for (const count of [100_000, 1_000_000]) {
  const atoms = count + 4;
  const x = chain(atoms);
  const g = new Float64Array(x.length);
  const repeats = count > 100_000 ? 7 : 21;
  for (const kind of TERM_KINDS) {
    const t = table(kind, count, atoms);
    const ms = median(() => { g.fill(0); KERNELS[kind](x, t, g); }, repeats);
    console.log(`${kind.padEnd(24)} ${String(count).padStart(8)} ${ms.toFixed(3).padStart(11)} ${(1e6 * ms / count).toFixed(1).padStart(9)}`);
  }
  const t = table('harmonic-bond', count, atoms);
  const points = Array.from({ length: atoms }, (_, a) => vec3.fromValues(x[3 * a], x[3 * a + 1], x[3 * a + 2]));
  const forces = Array.from({ length: atoms }, () => vec3.create());
  const k = Array.from({ length: count }, (_, r) => t.params[2 * r]);
  const r0 = Array.from({ length: count }, (_, r) => t.params[2 * r + 1]);
  const pairs = Array.from(t.atoms);
  const ms = median(() => baselineBonds(points, forces, pairs, k, r0), repeats);
  console.log(`${'baseline bond (gl-matrix)'.padEnd(24)} ${String(count).padStart(8)} ${ms.toFixed(3).padStart(11)} ${(1e6 * ms / count).toFixed(1).padStart(9)}`);
}
