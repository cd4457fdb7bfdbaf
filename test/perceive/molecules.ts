/**
 * Small molecules built by hand for the perception tests, with the bonds a
 * chemist draws (listed explicitly, so perceived bonds can be compared) and
 * geometry from experimental structures.
 *
 * Geometry sources: bond lengths and angles are FROM MEMORY of the NIST
 * Computational Chemistry Comparison and Benchmark Database (CCCBDB),
 * experimental geometries, rounded; they are recalled, not read, and only
 * need to be realistic to within a few hundredths of an ångström for these
 * tests (bond perception has a 0.45 Å tolerance; the order thresholds are
 * far from these values). Where a ring is idealised (regular polygon) the
 * builder says so.
 */

/** A molecule: symbols, coordinates in Å, and its drawn bonds with orders. */
export interface Molecule {
  readonly name: string;
  readonly elements: string[];
  readonly coordinates: Float64Array;
  /** Drawn bonds, `2 × B`, in the order added. */
  readonly bonds: Int32Array;
  /** Kekulé orders of the drawn bonds (1, 2, 3), same order. */
  readonly orders: Float64Array;
}

type V3 = [number, number, number];
const rad = (d: number): number => (d * Math.PI) / 180;
const add = (a: V3, b: V3): V3 => [a[0] + b[0], a[1] + b[1], a[2] + b[2]];
const sub = (a: V3, b: V3): V3 => [a[0] - b[0], a[1] - b[1], a[2] - b[2]];
const scale = (a: V3, s: number): V3 => [a[0] * s, a[1] * s, a[2] * s];
const dot = (a: V3, b: V3): number => a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
const cross = (a: V3, b: V3): V3 => [a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0]];
const unit = (a: V3): V3 => scale(a, 1 / Math.hypot(a[0], a[1], a[2]));

/** Accumulates atoms and bonds. */
export class Builder {
  readonly elements: string[] = [];
  readonly positions: V3[] = [];
  readonly bondList: [number, number, number][] = [];

  constructor(readonly name: string) {}

  atom(element: string, p: V3): number {
    this.elements.push(element);
    this.positions.push(p);
    return this.elements.length - 1;
  }

  bond(i: number, j: number, order = 1): this {
    this.bondList.push([i, j, order]);
    return this;
  }

  /**
   * A new atom bonded to `centre` at `length` Å, making the angle `angle`
   * (degrees) with the bond centre→`axis`, at azimuth `azimuth` degrees
   * about that bond (measured from a reference direction `ref`, projected).
   */
  substituent(element: string, centre: number, axis: number, length: number, angle: number, azimuth: number, ref: V3 = [0, 0, 1], order = 1): number {
    const c = this.positions[centre];
    const u = unit(sub(this.positions[axis], c));
    let p = sub(ref, scale(u, dot(ref, u)));
    if (Math.hypot(p[0], p[1], p[2]) < 1e-6) p = sub([1, 0, 0], scale(u, u[0]));
    p = unit(p);
    const q = cross(u, p);
    const dir = add(scale(u, Math.cos(rad(angle))), scale(add(scale(p, Math.cos(rad(azimuth))), scale(q, Math.sin(rad(azimuth)))), Math.sin(rad(angle))));
    const a = this.atom(element, add(c, scale(dir, length)));
    this.bond(centre, a, order);
    return a;
  }

  /** Three hydrogens of a methyl on `centre` (bonded to `axis`), tetrahedral, C–H 1.09 Å (common practice). */
  methyl(centre: number, axis: number, length = 1.09, angle = 109.47): void {
    for (const phi of [60, 180, 300]) this.substituent('H', centre, axis, length, angle, phi);
  }

  build(): Molecule {
    const coordinates = new Float64Array(3 * this.positions.length);
    this.positions.forEach((p, a) => coordinates.set(p, 3 * a));
    return {
      name: this.name,
      elements: this.elements.slice(),
      coordinates,
      bonds: Int32Array.from(this.bondList.flatMap(([i, j]) => [i, j])),
      orders: Float64Array.from(this.bondList.map(([, , o]) => o)),
    };
  }
}

/** Water: O–H 0.9572 Å, H–O–H 104.52° (from memory, CCCBDB experimental). */
export function water(): Molecule {
  const m = new Builder('water');
  const o = m.atom('O', [0, 0, 0]);
  const h = 0.9572;
  const t = rad(104.52 / 2);
  m.bond(o, m.atom('H', [h * Math.sin(t), h * Math.cos(t), 0]));
  m.bond(o, m.atom('H', [-h * Math.sin(t), h * Math.cos(t), 0]));
  return m.build();
}

/** Ethane, staggered: C–C 1.535 Å, C–H 1.094 Å, H–C–C 111.2° (from memory, CCCBDB experimental). */
export function ethane(): Molecule {
  const m = new Builder('ethane');
  const c1 = m.atom('C', [0, 0, 0]);
  const c2 = m.atom('C', [0, 0, 1.535]);
  m.bond(c1, c2);
  for (const phi of [0, 120, 240]) m.substituent('H', c1, c2, 1.094, 111.2, phi, [1, 0, 0]);
  for (const phi of [60, 180, 300]) m.substituent('H', c2, c1, 1.094, 111.2, phi, [1, 0, 0]);
  return m.build();
}

/** Ethylene: C=C 1.339 Å, C–H 1.087 Å, H–C–C 121.3° (from memory, CCCBDB experimental). */
export function ethylene(): Molecule {
  const m = new Builder('ethylene');
  const c1 = m.atom('C', [0, 0, 0]);
  const c2 = m.atom('C', [1.339, 0, 0]);
  m.bond(c1, c2, 2);
  for (const phi of [90, 270]) m.substituent('H', c1, c2, 1.087, 121.3, phi);
  for (const phi of [90, 270]) m.substituent('H', c2, c1, 1.087, 121.3, phi);
  return m.build();
}

/** Acetylene: C≡C 1.203 Å, C–H 1.063 Å, linear (from memory, CCCBDB experimental). */
export function acetylene(): Molecule {
  const m = new Builder('acetylene');
  const c1 = m.atom('C', [0, 0, 0]);
  const c2 = m.atom('C', [1.203, 0, 0]);
  m.bond(c1, c2, 3);
  m.bond(c1, m.atom('H', [-1.063, 0, 0]));
  m.bond(c2, m.atom('H', [1.203 + 1.063, 0, 0]));
  return m.build();
}

/** Carbon dioxide: C=O 1.160 Å, linear (from memory, CCCBDB experimental). */
export function carbonDioxide(): Molecule {
  const m = new Builder('carbon dioxide');
  const c = m.atom('C', [0, 0, 0]);
  m.bond(c, m.atom('O', [1.16, 0, 0]), 2);
  m.bond(c, m.atom('O', [-1.16, 0, 0]), 2);
  return m.build();
}

/** Acetone: C=O 1.213 Å, C–C 1.517 Å, C–C–C 116.7°, methyls tetrahedral (from memory, CCCBDB experimental). */
export function acetone(): Molecule {
  const m = new Builder('acetone');
  const c = m.atom('C', [0, 0, 0]);
  m.atom('O', [0, 1.213, 0]);
  m.bond(c, 1, 2);
  const half = rad(116.7 / 2);
  const c1 = m.atom('C', [-1.517 * Math.sin(half), -1.517 * Math.cos(half), 0]);
  const c3 = m.atom('C', [1.517 * Math.sin(half), -1.517 * Math.cos(half), 0]);
  m.bond(c, c1).bond(c, c3);
  m.methyl(c1, c);
  m.methyl(c3, c);
  return m.build();
}

/** Acetonitrile: C–C 1.458 Å, C≡N 1.157 Å, linear C–C≡N, methyl tetrahedral (from memory, CCCBDB experimental). */
export function acetonitrile(): Molecule {
  const m = new Builder('acetonitrile');
  const c1 = m.atom('C', [0, 0, 0]);
  const c2 = m.atom('C', [0, 0, 1.458]);
  const n = m.atom('N', [0, 0, 1.458 + 1.157]);
  m.bond(c1, c2).bond(c2, n, 3);
  m.methyl(c1, c2, 1.087, 109.7);
  return m.build();
}

/**
 * A planar ring of `symbols` as a regular polygon of side `side` Å, with a
 * hydrogen on every atom whose symbol is in `withH`, radially outward at
 * `hLength` Å. Orders: Kekulé pattern `orders` (one per ring bond, bond p
 * joins atoms p and p+1).
 */
function regularRing(name: string, symbols: string[], side: number, orders: number[], withH: (s: string, p: number) => number | null): Molecule {
  const m = new Builder(name);
  const k = symbols.length;
  const radius = side / (2 * Math.sin(Math.PI / k));
  const atoms = symbols.map((s, p) => m.atom(s, [radius * Math.cos((2 * Math.PI * p) / k), radius * Math.sin((2 * Math.PI * p) / k), 0]));
  for (let p = 0; p < k; p++) m.bond(atoms[p], atoms[(p + 1) % k], orders[p]);
  symbols.forEach((s, p) => {
    const h = withH(s, p);
    if (h === null) return;
    const a = (2 * Math.PI * p) / k;
    m.bond(atoms[p], m.atom('H', [(radius + h) * Math.cos(a), (radius + h) * Math.sin(a), 0]));
  });
  return m.build();
}

/** Benzene: regular hexagon, C–C 1.397 Å, C–H 1.084 Å (from memory, CCCBDB experimental). */
export function benzene(withHydrogens = true): Molecule {
  return regularRing('benzene', ['C', 'C', 'C', 'C', 'C', 'C'], 1.397, [2, 1, 2, 1, 2, 1], () => (withHydrogens ? 1.084 : null));
}

/** Pyridine, idealised as a regular hexagon of side 1.39 Å (experimental C–N 1.34, C–C 1.39, from memory), C–H 1.08 Å. */
export function pyridine(): Molecule {
  return regularRing('pyridine', ['N', 'C', 'C', 'C', 'C', 'C'], 1.39, [2, 1, 2, 1, 2, 1], (s) => (s === 'C' ? 1.08 : null));
}

/**
 * A five-membered ring X1–C2=C3–C4=C5–X1 with mirror symmetry: X–C `a`,
 * C2=C3 `b`, C3–C4 `c` (Å), angle C5–X–C2 `alpha` degrees; H on each C
 * (1.08 Å) and on X when `xh` is given, along the outer bisector.
 */
function fiveRing(name: string, x: string, a: number, b: number, c: number, alpha: number, xh: number | null): Molecule {
  const m = new Builder(name);
  const s = Math.sin(rad(alpha / 2));
  const h = a * Math.cos(rad(alpha / 2)) + Math.sqrt(b * b - (a * s - c / 2) ** 2);
  const pX: V3 = [0, h, 0];
  const p2: V3 = [a * s, h - a * Math.cos(rad(alpha / 2)), 0];
  const p5: V3 = [-p2[0], p2[1], 0];
  const p3: V3 = [c / 2, 0, 0];
  const p4: V3 = [-c / 2, 0, 0];
  const ix = m.atom(x, pX);
  const i2 = m.atom('C', p2);
  const i3 = m.atom('C', p3);
  const i4 = m.atom('C', p4);
  const i5 = m.atom('C', p5);
  m.bond(ix, i2).bond(i2, i3, 2).bond(i3, i4).bond(i4, i5, 2).bond(i5, ix);
  const ring = [ix, i2, i3, i4, i5];
  const outward = (p: number): V3 => {
    const here = m.positions[ring[p]];
    const prev = m.positions[ring[(p + 4) % 5]];
    const next = m.positions[ring[(p + 1) % 5]];
    return unit(add(unit(sub(here, prev)), unit(sub(here, next))));
  };
  if (xh !== null) m.bond(ix, m.atom('H', add(pX, scale(outward(0), xh))));
  for (let p = 1; p < 5; p++) m.bond(ring[p], m.atom('H', add(m.positions[ring[p]], scale(outward(p), 1.08))));
  return m.build();
}

/** Pyrrole: N–C 1.370, C2=C3 1.382, C3–C4 1.417 Å, C–N–C 109.8°, N–H 1.00 Å (from memory, CCCBDB experimental). */
export const pyrrole = (): Molecule => fiveRing('pyrrole', 'N', 1.37, 1.382, 1.417, 109.8, 1.0);
/** Furan: O–C 1.362, C=C 1.361, C–C 1.431 Å, C–O–C 106.6° (from memory, CCCBDB experimental). */
export const furan = (): Molecule => fiveRing('furan', 'O', 1.362, 1.361, 1.431, 106.6, null);
/** Thiophene: S–C 1.714, C=C 1.370, C–C 1.423 Å, C–S–C 92.2° (from memory, CCCBDB experimental). */
export const thiophene = (): Molecule => fiveRing('thiophene', 'S', 1.714, 1.37, 1.423, 92.2, null);

/** Cyclopropane: C–C 1.510 Å, C–H 1.083 Å, H–C–H 114.6° (from memory, CCCBDB experimental). */
export function cyclopropane(): Molecule {
  const m = new Builder('cyclopropane');
  const r = 1.51 / Math.sqrt(3);
  const cs = [0, 1, 2].map((p) => m.atom('C', [r * Math.cos((2 * Math.PI * p) / 3), r * Math.sin((2 * Math.PI * p) / 3), 0]));
  m.bond(cs[0], cs[1]).bond(cs[1], cs[2]).bond(cs[2], cs[0]);
  const t = rad(114.6 / 2);
  cs.forEach((c, p) => {
    const a = (2 * Math.PI * p) / 3;
    const base = m.positions[c];
    for (const z of [1, -1]) {
      m.bond(c, m.atom('H', [base[0] + 1.083 * Math.cos(t) * Math.cos(a), base[1] + 1.083 * Math.cos(t) * Math.sin(a), z * 1.083 * Math.sin(t)]));
    }
  });
  return m.build();
}

/** Naphthalene idealised as two regular hexagons of side 1.40 Å sharing a bond, C–H 1.084 Å. */
export function naphthalene(): Molecule {
  const m = new Builder('naphthalene');
  const s = 1.4;
  const cx = (s * Math.sqrt(3)) / 2;
  // Shared bond C0–C1 on the y axis; left ring C0 C2 C3 C4 C5 C1, right ring C0 C6 C7 C8 C9 C1.
  const at = (centre: number, deg: number): V3 => [centre + s * Math.cos(rad(deg)), s * Math.sin(rad(deg)), 0];
  const c0 = m.atom('C', [0, s / 2, 0]);
  const c1 = m.atom('C', [0, -s / 2, 0]);
  const left = [90, 150, 210, 270].map((d) => m.atom('C', at(-cx, d)));
  const right = [90, 30, -30, -90].map((d) => m.atom('C', at(cx, d)));
  // Kekulé structure with the shared bond double.
  m.bond(c0, c1, 2);
  m.bond(c0, left[0]).bond(left[0], left[1], 2).bond(left[1], left[2]).bond(left[2], left[3], 2).bond(left[3], c1);
  m.bond(c0, right[0]).bond(right[0], right[1], 2).bond(right[1], right[2]).bond(right[2], right[3], 2).bond(right[3], c1);
  const hOn = (c: number, centre: number): void => {
    const p = m.positions[c];
    const dir = unit([p[0] - centre, p[1], 0]);
    m.bond(c, m.atom('H', add(p, scale(dir, 1.084))));
  };
  left.forEach((c) => hOn(c, -cx));
  right.forEach((c) => hOn(c, cx));
  return m.build();
}

/** Cubane: a cube of C–C 1.571 Å with C–H 1.097 Å along the body diagonals (from memory, experimental). */
export function cubane(): Molecule {
  const m = new Builder('cubane');
  const a = 1.571 / 2;
  const corners: V3[] = [];
  for (const x of [-1, 1]) for (const y of [-1, 1]) for (const z of [-1, 1]) corners.push([x, y, z]);
  const cs = corners.map((c) => m.atom('C', scale(c, a)));
  for (let p = 0; p < 8; p++) {
    for (let q = p + 1; q < 8; q++) {
      const d = sub(corners[p], corners[q]);
      if (Math.abs(d[0]) + Math.abs(d[1]) + Math.abs(d[2]) === 2) m.bond(cs[p], cs[q]);
    }
  }
  corners.forEach((c, p) => m.bond(cs[p], m.atom('H', add(scale(c, a), scale(unit(c), 1.097)))));
  return m.build();
}

/**
 * An all-anti alkane chain C_n H_(2n+2): C–C 1.53 Å, C–H 1.09 Å, all
 * angles tetrahedral (common practice, idealised).
 */
export function alkane(n: number): Molecule {
  const m = new Builder(`alkane ${n}`);
  const half = rad(109.47 / 2);
  const step = 1.53 * Math.sin(half);
  const rise = 1.53 * Math.cos(half);
  const carbons: number[] = [];
  for (let i = 0; i < n; i++) carbons.push(m.atom('C', [i * step, i % 2 === 0 ? 0 : rise, 0]));
  for (let i = 0; i + 1 < n; i++) m.bond(carbons[i], carbons[i + 1]);
  const virtual = (i: number): V3 => [i * step, ((i % 2) + 2) % 2 === 0 ? 0 : rise, 0];
  for (let i = 0; i < n; i++) {
    const here = m.positions[carbons[i]];
    const prev = i > 0 ? m.positions[carbons[i - 1]] : virtual(i - 1);
    const next = i + 1 < n ? m.positions[carbons[i + 1]] : virtual(i + 1);
    const out = unit(add(unit(sub(here, prev)), unit(sub(here, next))));
    const c = Math.cos(rad(109.47 / 2));
    const s = Math.sin(rad(109.47 / 2));
    for (const z of [1, -1]) m.bond(carbons[i], m.atom('H', add(here, scale(add(scale(out, c), [0, 0, z * s]), 1.09))));
    // Ends: a third hydrogen where the chain would continue.
    if (i === 0 || i === n - 1) {
      const along = unit(sub(i === 0 ? prev : next, here));
      m.bond(carbons[i], m.atom('H', add(here, scale(along, 1.09))));
    }
  }
  return m.build();
}

/** A molecule given only as a graph (no coordinates): symbols, bonds, orders. */
export interface Graph {
  readonly name: string;
  readonly elements: string[];
  readonly bonds: Int32Array;
  readonly orders: Float64Array;
}

/** A graph from `symbols` and `[i, j, order]` triples; hydrogens are added to fill C valence 4 when `fill` is set. */
export function graph(name: string, symbols: string[], edges: [number, number, number][], fill = false): Graph {
  const elements = symbols.slice();
  const list = edges.slice();
  if (fill) {
    const used = new Array<number>(symbols.length).fill(0);
    for (const [i, j, o] of edges) {
      used[i] += o;
      used[j] += o;
    }
    symbols.forEach((s, a) => {
      if (s !== 'C') return;
      for (let k = used[a]; k < 4; k++) {
        elements.push('H');
        list.push([a, elements.length - 1, 1]);
      }
    });
  }
  return {
    name,
    elements,
    bonds: Int32Array.from(list.flatMap(([i, j]) => [i, j])),
    orders: Float64Array.from(list.map(([, , o]) => o)),
  };
}

const ring = (k: number, orders: number[]): [number, number, number][] =>
  Array.from({ length: k }, (_, p) => [p, (p + 1) % k, orders[p] ?? 1] as [number, number, number]);

/** Cyclohexene C6H10 (one double bond), graph only. */
export const cyclohexene = (): Graph => graph('cyclohexene', Array(6).fill('C'), ring(6, [2]), true);
/** Cyclooctatetraene C8H8 (alternating), graph only. */
export const cyclooctatetraene = (): Graph => graph('cyclooctatetraene', Array(8).fill('C'), ring(8, [2, 1, 2, 1, 2, 1, 2, 1]), true);
/** Norbornane C7H12: C1–C2–C3–C4–C5–C6–C1 with the bridge C1–C7–C4, graph only. */
export const norbornane = (): Graph =>
  graph('norbornane', Array(7).fill('C'), [[0, 1, 1], [1, 2, 1], [2, 3, 1], [3, 4, 1], [4, 5, 1], [5, 0, 1], [0, 6, 1], [6, 3, 1]], true);
