// npm run bench:nonbonded: median time of one energy + gradient of the
// nonbonded pairs (Lennard-Jones + Coulomb) through Model.energy, for a
// water-like liquid box (three-site molecules of our own invention on a
// jittered lattice at 0.0334 molecules/Å³, about the density of liquid water)
// with a 10 Å cutoff at 10^3, 10^4 and 10^5 atoms, and over all pairs (no
// cutoff) at 10^3 and 3·10^3 atoms. Prints medians; nothing here asserts a time.
import { parseModel } from '../dist/index.js';

let seed = 2026;
const random = () => ((seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648);

/** A model of `molecules` three-site molecules (O–H 1 Å, H–O–H 104.5°) in a cube, bonds only, no terms. */
function liquid(molecules, cutoff) {
  const spacing = Math.cbrt(1 / 0.0334); // Å per molecule along each axis
  const side = Math.ceil(Math.cbrt(molecules));
  const atoms = [];
  const coordinates = [];
  const bonds = [];
  const rmin = [];
  const epsilon = [];
  const half = (104.5 / 2) * (Math.PI / 180);
  for (let m = 0; m < molecules; m++) {
    const ix = m % side, iy = Math.floor(m / side) % side, iz = Math.floor(m / (side * side));
    const o = [ix, iy, iz].map((i) => (i + 0.3 * (random() - 0.5)) * spacing);
    // a random orientation: two orthonormal vectors u, v
    const u = [random() - 0.5, random() - 0.5, random() - 0.5];
    const nu = Math.hypot(...u);
    u.forEach((c, k) => (u[k] = c / nu));
    const w = [random() - 0.5, random() - 0.5, random() - 0.5];
    const dot = w[0] * u[0] + w[1] * u[1] + w[2] * u[2];
    const v = w.map((c, k) => c - dot * u[k]);
    const nv = Math.hypot(...v);
    v.forEach((c, k) => (v[k] = c / nv));
    const h1 = o.map((c, k) => c + Math.cos(half) * u[k] + Math.sin(half) * v[k]);
    const h2 = o.map((c, k) => c + Math.cos(half) * u[k] - Math.sin(half) * v[k]);
    const base = 3 * m;
    atoms.push({ element: 'O', charge: -0.82 }, { element: 'H', charge: 0.41 }, { element: 'H', charge: 0.41 });
    coordinates.push(o, h1, h2);
    bonds.push([base, base + 1], [base, base + 2]);
    rmin.push(3.55, 1, 1);
    epsilon.push(0.155, 0, 0);
  }
  return parseModel({
    format: 'strainwise-model',
    version: 1,
    units: { length: 'angstrom', energy: 'kcal/mol' },
    atoms,
    coordinates,
    bonds,
    terms: [],
    nonbonded: {
      lennardJones: { rmin, epsilon, combination: 'lorentz-berthelot' },
      coulomb: { dielectric: 1 },
      cutoff,
    },
  });
}

/** Medians of wall time and of this process's CPU time (which a busy machine inflates less), in ms. */
function median(f, repeats) {
  f();
  const wall = [];
  const cpu = [];
  for (let i = 0; i < repeats; i++) {
    const c0 = process.cpuUsage();
    const t0 = process.hrtime.bigint();
    f();
    wall.push(Number(process.hrtime.bigint() - t0) / 1e6);
    const c = process.cpuUsage(c0);
    cpu.push((c.user + c.system) / 1000);
  }
  const mid = (a) => a.sort((u, v) => u - v)[a.length >> 1];
  return { wall: mid(wall), cpu: mid(cpu) };
}

function run(label, molecules, cutoff, repeats) {
  const model = liquid(molecules, cutoff);
  const x = model.coordinates;
  const g = new Float64Array(x.length);
  let e = 0;
  const { wall, cpu } = median(() => (e = model.energy(x, g)), repeats);
  const n = model.atomCount;
  console.log(
    `${label.padEnd(12)} ${String(n).padStart(7)} atoms  wall ${wall.toFixed(2).padStart(9)} ms  ` +
      `cpu ${cpu.toFixed(1).padStart(8)} ms  ${((cpu * 1e6) / n).toFixed(0).padStart(6)} ns/atom (cpu)  E = ${e.toFixed(3)} kcal/mol`,
  );
}

console.log('nonbonded energy + gradient (Lennard-Jones + Coulomb), median');
run('cutoff 10 Å', 334, 10, 15);
run('cutoff 10 Å', 3334, 10, 7);
run('cutoff 10 Å', 33334, 10, 3);
run('all pairs', 334, null, 15);
run('all pairs', 1000, null, 7);
