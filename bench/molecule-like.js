// Molecule-like test models for minimizers: branched saturated hydrocarbon
// skeletons of our own invention, written as strainwise model files.
//
// A random tree of carbon atoms (each with at most four neighbours) is filled
// up to four bonds per carbon with hydrogens and placed in 3-D with
// tetrahedral directions, random twists about every bond (so the torsions
// start far from their minima) and a small random displacement of every atom.
// Terms: harmonic bonds, harmonic angles at every atom with two or more
// neighbours, a threefold periodic torsion about every C–C bond, and soft
// repulsive restraints (distance restraints with only a lower bound) between
// atoms at least three bonds apart that stand in for the repulsive wall of a
// nonbonded potential. The numbers are round values of our own choosing in the
// range of common practice for C–C / C–H bonds, not a validated force field.
//
// Plain JavaScript with no imports, so `bench/*.js` (on dist/) and the test
// suite (TypeScript, see molecule-like.d.ts) build the very same models.

/** mulberry32: a small seeded generator (public domain, common practice). */
function seeded(seed) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const CC = { k: 620, r0: 1.53 };
const CH = { k: 680, r0: 1.09 };
const ANGLE = { k: 90, theta0: 109.5 };
const TORSION = { k: 0.16, n: 3, phase: 0 };
const REPULSION_K = 2;
const CONTACT = { CC: 3.4, CH: 3.0, HH: 2.5 };
/** Largest pair distance (at the start geometry) that gets a repulsive restraint in large models. */
const PAIR_RANGE = 7;

function unit(v) {
  const l = Math.hypot(v[0], v[1], v[2]);
  return [v[0] / l, v[1] / l, v[2] / l];
}
function cross(a, b) {
  return [a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0]];
}

/**
 * Build a model file object.
 * @param {{carbons: number, seed: number, branching?: number, shake?: number, allPairs?: boolean, lennardJones?: boolean}} spec
 *   carbons: heavy atoms (about 3× as many atoms in all); branching: chance
 *   that a carbon gets a second carbon child (default 0.25); shake: largest
 *   random displacement per coordinate in Å (default 0.15); allPairs: restrain
 *   every pair at least three bonds apart (default: when ≤ 400 atoms),
 *   otherwise only those within 7 Å at the start; lennardJones: Lennard-Jones
 *   pairs with a 10 Å cutoff instead of the repulsive restraints.
 */
export function moleculeLikeModel(spec) {
  const rand = seeded(spec.seed);
  const branching = spec.branching ?? 0.25;
  const shake = spec.shake ?? 0.15;
  // 1. carbon tree: breadth-first growth with a cap of three children per carbon (four bonds).
  const parent = [-1];
  const children = [[]];
  let frontier = [0];
  while (parent.length < spec.carbons) {
    const next = [];
    for (const c of frontier) {
      if (parent.length >= spec.carbons) break;
      const want = rand() < branching ? 2 : 1;
      for (let w = 0; w < want && parent.length < spec.carbons && children[c].length < 3; w++) {
        const id = parent.length;
        parent.push(c);
        children.push([]);
        children[c].push(id);
        next.push(id);
      }
    }
    if (next.length === 0) next.push(frontier[frontier.length - 1]);
    // keep the tree long rather than bushy: continue mostly from one or two tips
    frontier = next.length > 2 ? next.slice(0, 2) : next;
  }
  // 2. atoms, bonds, placement.
  const elements = [];
  const xyz = [];
  const bonds = [];
  const carbonAtom = new Array(spec.carbons);
  const cells = new Map();
  const cellOf = (p) => `${Math.floor(p[0] / 4)},${Math.floor(p[1] / 4)},${Math.floor(p[2] / 4)}`;
  const addAtom = (el, p) => {
    const id = elements.length;
    elements.push(el);
    xyz.push(p);
    const key = cellOf(p);
    if (!cells.has(key)) cells.set(key, []);
    cells.get(key).push(id);
    return id;
  };
  const nearest = (p, skip) => {
    let best = Infinity;
    const cx = Math.floor(p[0] / 4), cy = Math.floor(p[1] / 4), cz = Math.floor(p[2] / 4);
    for (let dx = -1; dx <= 1; dx++) for (let dy = -1; dy <= 1; dy++) for (let dz = -1; dz <= 1; dz++) {
      const list = cells.get(`${cx + dx},${cy + dy},${cz + dz}`);
      if (!list) continue;
      for (const a of list) {
        if (a === skip) continue;
        const q = xyz[a];
        best = Math.min(best, Math.hypot(q[0] - p[0], q[1] - p[1], q[2] - p[2]));
      }
    }
    return best;
  };
  carbonAtom[0] = addAtom('C', [0, 0, 0]);
  const up = new Array(spec.carbons); // unit vector from each carbon towards its parent
  up[0] = unit([rand() - 0.5, rand() - 0.5, rand() - 0.5]);
  // tetrahedral directions around −u: cos(109.47°) = −1/3 with u
  const tetra = (u, twist) => {
    let a = Math.abs(u[0]) < 0.9 ? [1, 0, 0] : [0, 1, 0];
    const e1 = unit(cross(u, a));
    const e2 = cross(u, e1);
    const out = [];
    for (let m = 0; m < 3; m++) {
      const t = twist + (2 * Math.PI * m) / 3;
      const c = Math.cos(t), s = Math.sin(t);
      const r = Math.sqrt(8) / 3;
      out.push(unit([-u[0] / 3 + r * (c * e1[0] + s * e2[0]), -u[1] / 3 + r * (c * e1[1] + s * e2[1]), -u[2] / 3 + r * (c * e1[2] + s * e2[2])]));
    }
    return out;
  };
  const order = [0];
  for (let q = 0; q < order.length; q++) {
    const c = order[q];
    const at = carbonAtom[c];
    const p = xyz[at];
    // the root's parent direction gets a hydrogen
    if (c === 0) {
      const h = addAtom('H', [p[0] + CH.r0 * up[0][0], p[1] + CH.r0 * up[0][1], p[2] + CH.r0 * up[0][2]]);
      bonds.push([at, h, CH]);
    }
    // choose the twist that keeps the new atoms farthest from the others
    let bestDirs = null;
    let bestGap = -1;
    for (let tryNo = 0; tryNo < 12; tryNo++) {
      const dirs = tetra(up[c], 2 * Math.PI * rand());
      let gap = Infinity;
      for (let m = 0; m < children[c].length; m++) {
        const d = dirs[m];
        gap = Math.min(gap, nearest([p[0] + CC.r0 * d[0], p[1] + CC.r0 * d[1], p[2] + CC.r0 * d[2]], at));
      }
      if (children[c].length === 0) gap = 0;
      if (gap > bestGap) {
        bestGap = gap;
        bestDirs = dirs;
      }
      if (gap > 2.6) break;
    }
    for (let m = 0; m < 3; m++) {
      const d = bestDirs[m];
      if (m < children[c].length) {
        const child = children[c][m];
        carbonAtom[child] = addAtom('C', [p[0] + CC.r0 * d[0], p[1] + CC.r0 * d[1], p[2] + CC.r0 * d[2]]);
        up[child] = [-d[0], -d[1], -d[2]];
        bonds.push([at, carbonAtom[child], CC]);
        order.push(child);
      } else {
        const h = addAtom('H', [p[0] + CH.r0 * d[0], p[1] + CH.r0 * d[1], p[2] + CH.r0 * d[2]]);
        bonds.push([at, h, CH]);
      }
    }
  }
  const n = elements.length;
  for (const p of xyz) for (let k = 0; k < 3; k++) p[k] += shake * (2 * rand() - 1);

  // 3. terms.
  const neighbours = Array.from({ length: n }, () => []);
  for (const [a, b] of bonds) {
    neighbours[a].push(b);
    neighbours[b].push(a);
  }
  const terms = [];
  for (const [a, b, p] of bonds) terms.push({ kind: 'harmonic-bond', atoms: [a, b], k: p.k, r0: p.r0 });
  for (let j = 0; j < n; j++) {
    const nb = neighbours[j];
    for (let u = 0; u < nb.length; u++) for (let v = u + 1; v < nb.length; v++) {
      terms.push({ kind: 'harmonic-angle', atoms: [nb[u], j, nb[v]], k: ANGLE.k, theta0: ANGLE.theta0 });
    }
  }
  for (const [j, k] of bonds) {
    if (elements[j] !== 'C' || elements[k] !== 'C') continue;
    for (const i of neighbours[j]) {
      if (i === k) continue;
      for (const l of neighbours[k]) {
        if (l === j) continue;
        terms.push({ kind: 'periodic-dihedral', atoms: [i, j, k, l], k: TORSION.k, n: TORSION.n, phase: TORSION.phase });
      }
    }
  }
  const file = {
    format: 'strainwise-model',
    version: 1,
    title: `molecule-like test model: ${spec.carbons} carbons, seed ${spec.seed}`,
    units: { length: 'angstrom', energy: 'kcal/mol' },
    atoms: elements.map((element) => ({ element })),
    coordinates: xyz,
    terms,
  };
  if (spec.lennardJones) {
    // Lennard-Jones pairs instead of the repulsive restraints (round values of our own: rmin C 3.8 Å,
    // H 2.9 Å; ε C 0.1, H 0.04 kcal/mol), 1-2 and 1-3 pairs left out, a 10 Å shifted cutoff.
    file.title += ', Lennard-Jones pairs';
    file.bonds = bonds.map(([a, b]) => [a, b]);
    file.nonbonded = {
      lennardJones: {
        rmin: elements.map((e) => (e === 'C' ? 3.8 : 2.9)),
        epsilon: elements.map((e) => (e === 'C' ? 0.1 : 0.04)),
        combination: 'lorentz-berthelot',
      },
      exclusions: { bondSeparation: 2, scale14: { lennardJones: 0.5, coulomb: 1 } },
      cutoff: 10,
    };
    return file;
  }
  // bond separation up to 2 by breadth-first search from every atom
  const allPairs = spec.allPairs ?? n <= 400;
  const near = new Uint8Array(n);
  for (let i = 0; i < n; i++) {
    const marked = [i];
    near[i] = 1;
    for (const a of neighbours[i]) {
      if (!near[a]) { near[a] = 1; marked.push(a); }
      for (const b of neighbours[a]) if (!near[b]) { near[b] = 1; marked.push(b); }
    }
    for (let j = i + 1; j < n; j++) {
      if (near[j]) continue;
      const pi = xyz[i], pj = xyz[j];
      if (!allPairs && Math.hypot(pi[0] - pj[0], pi[1] - pj[1], pi[2] - pj[2]) > PAIR_RANGE) continue;
      const key = elements[i] === 'C' ? (elements[j] === 'C' ? 'CC' : 'CH') : elements[j] === 'C' ? 'CH' : 'HH';
      terms.push({ kind: 'distance-restraint', atoms: [i, j], k: REPULSION_K, lower: CONTACT[key], upper: 1e6 });
    }
    for (const a of marked) near[a] = 0;
  }
  return file;
}
