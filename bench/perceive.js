// Benchmark: bond perception from coordinates + topology perception (bond orders from
// geometry, rings, aromaticity, hybridization, angles, torsions, 1-4 pairs) at 1e3, 1e4, 1e5 atoms.
// Run after `npm run build`:  node bench/perceive.js   (or `npm run bench:perceive`)
//
// Three structures, all built with idealised geometry (common-practice bond lengths and angles):
//   alkane     all-anti C_n H_(2n+2): C–C 1.53 Å, C–H 1.09 Å, tetrahedral angles (a long chain)
//   phenylene  poly(p-phenylene), H–(C6H4)_m–H: hexagons of side 1.40 Å linked by 1.48 Å bonds
//              (a polymer of isolated aromatic rings)
//   acene      a ladder of m fused hexagons (side 1.40 Å, C–H 1.08 Å): one fused block of m rings
// Prints the median of several runs for each step (after one warm-up run); nothing is asserted.
import { performance } from 'node:perf_hooks';
import { perceiveBonds, perceiveTopology } from '../dist/index.js';

// Runs per case (the first is a warm-up for the JIT and is not counted).
const runsFor = (atoms) => (atoms <= 1e4 ? 21 : 6);

function alkane(targetAtoms) {
  const n = Math.max(2, Math.round((targetAtoms - 2) / 3));
  const half = (109.47 / 2) * (Math.PI / 180);
  const step = 1.53 * Math.sin(half);
  const rise = 1.53 * Math.cos(half);
  const elements = [];
  const x = [];
  const c = Math.cos(half);
  const s = Math.sin(half);
  for (let i = 0; i < n; i++) {
    elements.push('C');
    x.push(i * step, i % 2 === 0 ? 0 : rise, 0);
  }
  for (let i = 0; i < n; i++) {
    const up = i % 2 === 0 ? -1 : 1; // away from the neighbours
    const hx = i * step;
    const hy = (i % 2 === 0 ? 0 : rise) + up * c * 1.09;
    for (const z of [1, -1]) {
      elements.push('H');
      x.push(hx, hy, z * s * 1.09);
    }
    if (i === 0 || i === n - 1) {
      elements.push('H');
      x.push(hx + (i === 0 ? -1.09 : 1.09), i % 2 === 0 ? 0 : rise, 0);
    }
  }
  return { name: 'alkane', elements, x: Float64Array.from(x) };
}

function phenylene(targetAtoms) {
  const m = Math.max(1, Math.round((targetAtoms - 2) / 10));
  const side = 1.4;
  const link = 1.48;
  const period = 2 * side + link;
  const elements = [];
  const x = [];
  for (let r = 0; r < m; r++) {
    const cx = r * period;
    for (let k = 0; k < 6; k++) {
      const a = (k * Math.PI) / 3;
      elements.push('C');
      x.push(cx + side * Math.cos(a), side * Math.sin(a), 0);
      const para = k === 0 || k === 3;
      if (!para || (r === 0 && k === 3) || (r === m - 1 && k === 0)) {
        elements.push('H');
        x.push(cx + (side + 1.08) * Math.cos(a), (side + 1.08) * Math.sin(a), 0);
      }
    }
  }
  return { name: 'phenylene', elements, x: Float64Array.from(x) };
}

function acene(targetAtoms) {
  const m = Math.max(1, Math.round((targetAtoms - 6) / 6));
  const side = 1.4;
  const w = side * Math.sqrt(3); // distance between ring centres
  const elements = [];
  const x = [];
  // Top and bottom zigzag rows; shared vertical bonds at x = (k + 1/2) w.
  for (let k = 0; k <= m; k++) {
    const xv = (k - 0.5) * w;
    for (const sgn of [1, -1]) {
      elements.push('C');
      x.push(xv, (sgn * side) / 2, 0);
      if (k === 0 || k === m) {
        elements.push('H');
        const dx = k === 0 ? -1 : 1;
        x.push(xv + dx * 1.08 * Math.cos(Math.PI / 6), (sgn * side) / 2 + sgn * 1.08 * Math.sin(Math.PI / 6), 0);
      }
    }
    if (k < m) {
      for (const sgn of [1, -1]) {
        elements.push('C');
        x.push(k * w, sgn * side, 0);
        elements.push('H');
        x.push(k * w, sgn * (side + 1.08), 0);
      }
    }
  }
  return { name: 'acene', elements, x: Float64Array.from(x) };
}

function median(values) {
  const s = [...values].sort((a, b) => a - b);
  return s[s.length >> 1];
}

function time(fn) {
  const t0 = performance.now();
  const out = fn();
  return [performance.now() - t0, out];
}

console.log('structure   atoms    bonds   rings  bonds-ms  topology-ms  total-ms');
for (const build of [alkane, phenylene, acene]) {
  for (const target of [1e3, 1e4, 1e5]) {
    const { name, elements, x } = build(target);
    const tb = [];
    const tt = [];
    let bonds;
    let topology;
    const runs = runsFor(target);
    for (let r = 0; r < runs; r++) {
      let dt;
      [dt, bonds] = time(() => perceiveBonds(elements, x));
      if (r > 0) tb.push(dt);
      [dt, topology] = time(() => perceiveTopology({ elements, bonds, coordinates: x }));
      if (r > 0) tt.push(dt);
    }
    const b = median(tb);
    const t = median(tt);
    console.log(
      `${name.padEnd(10)} ${String(elements.length).padStart(6)} ${String(bonds.length / 2).padStart(8)} ${String(topology.rings.length).padStart(7)}` +
        `  ${b.toFixed(1).padStart(8)}  ${t.toFixed(1).padStart(11)}  ${(b + t).toFixed(1).padStart(8)}`,
    );
  }
}
