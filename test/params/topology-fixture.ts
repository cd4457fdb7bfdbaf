/**
 * A brute-force Topology builder for the generic-parameter tests, standing
 * in for perception (src/perceive/, written elsewhere): angles, torsions,
 * out-of-plane centres and 1-4 pairs by nested loops over the bond graph;
 * bond orders, aromatic atoms and rings given by the test; hybridization
 * from the bond orders unless the test gives it. Also a z-matrix builder
 * for starting coordinates.
 */
import type { Hybridization, Topology } from '../../src/perceive/types.js';

/** A molecule as the tests write it. */
export interface MoleculeSpec {
  /** Chemical symbols. */
  readonly elements: readonly string[];
  /** Bonds [i, j, order]; order 1.5 marks an aromatic bond. */
  readonly bonds: readonly (readonly [number, number, number])[];
  /** Hybridization per atom where the default (see {@link defaultHybridization}) is not wanted. */
  readonly hybridization?: Readonly<Record<number, Hybridization>>;
  /** Rings (atom indices in ring order); default none. */
  readonly rings?: readonly (readonly number[])[];
}

/**
 * The default hybridization of an atom: H and the halogens `none`; an atom
 * with an aromatic (1.5) bond `aromatic`; a triple bond or two double bonds
 * `sp`; one double bond `sp2`; else `sp3`.
 */
export function defaultHybridization(element: string, orders: readonly number[]): Hybridization {
  if (['H', 'F', 'Cl', 'Br', 'I'].includes(element)) return 'none';
  if (orders.includes(1.5)) return 'aromatic';
  if (orders.includes(3) || orders.filter((o) => o === 2).length >= 2) return 'sp';
  if (orders.includes(2)) return 'sp2';
  return 'sp3';
}

/** A Topology of `spec`, with every derived list built by brute force. */
export function buildTopology(spec: MoleculeSpec): Topology {
  const n = spec.elements.length;
  const sorted = spec.bonds
    .map(([i, j, o]) => [Math.min(i, j), Math.max(i, j), o] as const)
    .sort((a, b) => a[0] - b[0] || a[1] - b[1]);
  const adjacency: number[][] = Array.from({ length: n }, () => []);
  const orderAt: number[][] = Array.from({ length: n }, () => []);
  for (const [i, j, o] of sorted) {
    adjacency[i].push(j);
    adjacency[j].push(i);
    orderAt[i].push(o);
    orderAt[j].push(o);
  }
  for (const list of adjacency) list.sort((a, b) => a - b);
  const bonded = (i: number, j: number) => adjacency[i].includes(j);

  const neighbourStart = new Int32Array(n + 1);
  for (let a = 0; a < n; a++) neighbourStart[a + 1] = neighbourStart[a] + adjacency[a].length;
  const neighbours = Int32Array.from(adjacency.flat());

  const angles: number[] = [];
  for (let j = 0; j < n; j++) {
    for (const i of adjacency[j]) for (const k of adjacency[j]) if (i < k) angles.push(i, j, k);
  }
  const torsions: number[] = [];
  for (const [j, k] of sorted) {
    for (const i of adjacency[j]) {
      if (i === k) continue;
      for (const l of adjacency[k]) {
        if (l === j || l === i || bonded(i, l)) continue; // none in a 3-ring
        torsions.push(i, j, k, l);
      }
    }
  }
  const impropers: number[] = [];
  for (let c = 0; c < n; c++) if (adjacency[c].length === 3) impropers.push(c, ...adjacency[c]);

  const pairs14: number[] = [];
  for (let a = 0; a < n; a++) {
    const dist = new Array<number>(n).fill(Infinity);
    dist[a] = 0;
    const queue = [a];
    while (queue.length > 0) {
      const v = queue.shift() as number;
      for (const w of adjacency[v]) if (dist[w] === Infinity) { dist[w] = dist[v] + 1; queue.push(w); }
    }
    for (let b = a + 1; b < n; b++) if (dist[b] === 3) pairs14.push(a, b);
  }

  const rings = (spec.rings ?? []).map((r) => Int32Array.from(r));
  const inRing = new Uint8Array(n);
  for (const r of rings) for (const a of r) inRing[a] = 1;
  const aromaticBonds = Uint8Array.from(sorted, ([, , o]) => (o === 1.5 ? 1 : 0));
  const aromaticAtoms = new Uint8Array(n);
  sorted.forEach(([i, j, o]) => {
    if (o === 1.5) aromaticAtoms[i] = aromaticAtoms[j] = 1;
  });
  const hybridization = spec.elements.map((e, a) => spec.hybridization?.[a] ?? defaultHybridization(e, orderAt[a]));

  return {
    atomCount: n,
    elements: spec.elements,
    bonds: Int32Array.from(sorted.flatMap(([i, j]) => [i, j])),
    bondOrders: Float64Array.from(sorted, ([, , o]) => o),
    formalCharges: new Int32Array(n),
    neighbourStart,
    neighbours,
    angles: Int32Array.from(angles),
    torsions: Int32Array.from(torsions),
    impropers: Int32Array.from(impropers),
    pairs14: Int32Array.from(pairs14),
    rings,
    inRing,
    aromaticAtoms,
    aromaticBonds,
    hybridization,
  };
}

/**
 * One z-matrix row: an element, then (for the second atom on) the atom it is
 * bonded to and the distance (Å), (third on) an angle atom and the angle
 * (degrees), (fourth on) a dihedral atom and the torsion (degrees, IUPAC sign).
 */
export type ZRow = readonly [string, number?, number?, number?, number?, number?, number?];

/** Flat coordinates (Å) from z-matrix rows (first atom at the origin, second on +x, third in the xy plane). */
export function fromZMatrix(rows: readonly ZRow[]): Float64Array {
  const x = new Float64Array(3 * rows.length);
  const p = (a: number) => [x[3 * a], x[3 * a + 1], x[3 * a + 2]];
  rows.forEach((row, m) => {
    if (m === 0) return;
    const [, a, r, b, theta, c, phi] = row as [string, number, number, number, number, number, number];
    const t = ((theta ?? 0) * Math.PI) / 180;
    if (m === 1) {
      x.set([r, 0, 0], 3);
      return;
    }
    if (m === 2) {
      const [ax, ay] = p(a);
      const [bx, by] = p(b);
      const u = Math.atan2(by - ay, bx - ax);
      x.set([ax + r * Math.cos(u + t), ay + r * Math.sin(u + t), 0], 6);
      return;
    }
    // natural extension reference frame: a bonded, b angle, c dihedral
    const A = p(a);
    const B = p(b);
    const C = p(c);
    const f = ((phi ?? 0) * Math.PI) / 180;
    const bc = norm(sub(A, B));
    const nrm = norm(cross(sub(B, C), bc));
    const m2 = cross(nrm, bc);
    const d2 = [-r * Math.cos(t), r * Math.sin(t) * Math.cos(f), r * Math.sin(t) * Math.sin(f)];
    for (let q = 0; q < 3; q++) x[3 * m + q] = A[q] + d2[0] * bc[q] + d2[1] * m2[q] + d2[2] * nrm[q];
  });
  return x;
}

function sub(a: number[], b: number[]): number[] {
  return [a[0] - b[0], a[1] - b[1], a[2] - b[2]];
}
function cross(a: number[], b: number[]): number[] {
  return [a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0]];
}
function norm(a: number[]): number[] {
  const l = Math.hypot(a[0], a[1], a[2]);
  return [a[0] / l, a[1] / l, a[2] / l];
}
