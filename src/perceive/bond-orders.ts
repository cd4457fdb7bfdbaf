/**
 * Bond orders (1, 2, 3) for bond graphs whose file gives none, from valence
 * and geometry. The result is one Kekulé structure; aromatic rings are
 * found afterwards (`aromaticity.ts`) and their bonds given order 1.5 by
 * topology perception.
 *
 * The algorithm, in four deterministic steps (docs/perception.md says more):
 *
 * 1. Each atom's unsaturation u = valence − degree, from the standard
 *    valences (H 1, B 3, C 4, N 3, O 2, halogens 1, Si 4, P 3/5, S 2/4/6),
 *    shifted by a formal charge (N⁺ 4, O⁻ 1, C^± 3, B⁻ 4). P, S and the
 *    heavier elements take the smallest allowed valence that covers their
 *    degree plus their terminal O/S neighbours (sulfone S 6, sulfoxide S 4,
 *    phosphate P 5). A neutral N with three neighbours, two of them terminal
 *    O, is read as nitro (valence 4).
 * 2. Geometry caps u where hydrogens may be missing (second-row atoms
 *    only): four or more neighbours → 0; three neighbours not planar (angle
 *    sum < 345°) → 0, planar → 1; two neighbours → 2 if linear (≥ 165°),
 *    else 1. A bond may carry extra order only if its length is at most
 *    0.965 × the sum of covalent radii; a triple only if at most 0.835 ×.
 * 3. Forced choices: an atom whose unsaturation can go to only one
 *    neighbour puts it all there (terminal O, N, sp carbons, ends of
 *    conjugated chains), repeated until nothing is forced. Atoms still
 *    needing two or more extra orders share them one at a time among their
 *    neighbours, shortest bond first.
 * 4. The remaining atoms (each needing one double bond: rings, fused
 *    systems) get a maximum matching — greedy, shortest bond first, then
 *    completed with augmenting paths (Edmonds' blossom search) — so every
 *    Kekulé structure that exists is found.
 * @module
 */
import { ModelError } from '../errors.js';
import { covalentRadius } from './covalent-radii.js';
import { atomDistance, canonicalBonds, checkCoordinates, neighbourLists } from './graph.js';
import type { NeighbourLists } from './graph.js';

/** Ratio r / (r_cov,i + r_cov,j) at or below which a bond may be double. */
export const MULTIPLE_BOND_RATIO = 0.965;
/** Ratio r / (r_cov,i + r_cov,j) at or below which a bond may be triple. */
export const TRIPLE_BOND_RATIO = 0.835;

interface ValenceRule {
  /** Periodic-table group (1, 13 … 17). */
  readonly group: number;
  /** Allowed neutral valences, ascending. */
  readonly valences: readonly number[];
  /** Second-row (or H): geometry caps apply, no expanded octet. */
  readonly small: boolean;
}

const RULES: ReadonlyMap<string, ValenceRule> = new Map<string, ValenceRule>([
  ['H', { group: 1, valences: [1], small: true }],
  ['B', { group: 13, valences: [3], small: true }],
  ['Al', { group: 13, valences: [3], small: false }],
  ['C', { group: 14, valences: [4], small: true }],
  ['Si', { group: 14, valences: [4], small: false }],
  ['Ge', { group: 14, valences: [4], small: false }],
  ['N', { group: 15, valences: [3], small: true }],
  ['P', { group: 15, valences: [3, 5], small: false }],
  ['As', { group: 15, valences: [3, 5], small: false }],
  ['O', { group: 16, valences: [2], small: true }],
  ['S', { group: 16, valences: [2, 4, 6], small: false }],
  ['Se', { group: 16, valences: [2, 4, 6], small: false }],
  ['Te', { group: 16, valences: [2, 4, 6], small: false }],
  ['F', { group: 17, valences: [1], small: true }],
  ['Cl', { group: 17, valences: [1, 3, 5, 7], small: false }],
  ['Br', { group: 17, valences: [1, 3, 5, 7], small: false }],
  ['I', { group: 17, valences: [1, 3, 5, 7], small: false }],
]);

/** Valence shifted by a formal charge q (octet rule: N⁺ 4, O⁻ 1, C^± 3, B⁻ 4, H⁺ 0). */
function chargedValence(rule: ValenceRule, valence: number, q: number): number {
  if (rule.group === 1 || rule.group === 14) return valence - Math.abs(q);
  if (rule.group === 13) return valence - q;
  return valence + q;
}

/**
 * Checks optional formal charges (one Int32 per atom) and returns them, or
 * all zeros when absent. Internal to perceive/ (shared with topology).
 * @throws ModelError `formalCharges: expected 31 charges (one per atom), got 30`.
 */
export function checkCharges(formalCharges: Int32Array | null | undefined, atomCount: number): Int32Array {
  if (formalCharges === null || formalCharges === undefined) return new Int32Array(atomCount);
  if (!(formalCharges instanceof Int32Array)) throw new ModelError('formalCharges', 'expected an Int32Array, one per atom');
  if (formalCharges.length !== atomCount) {
    throw new ModelError('formalCharges', `expected ${atomCount} charges (one per atom), got ${formalCharges.length}`);
  }
  return formalCharges;
}

/** Checks that `elements` is an array of strings. Internal to perceive/. */
export function checkElements(elements: readonly string[]): void {
  if (!Array.isArray(elements)) throw new ModelError('elements', 'expected an array of element symbols');
  for (let a = 0; a < elements.length; a++) {
    if (typeof elements[a] !== 'string' || elements[a] === '') {
      throw new ModelError(`atoms[${a}]`, `expected an element symbol, got ${JSON.stringify(elements[a]) ?? String(elements[a])}`);
    }
  }
}

/**
 * Perceives bond orders from valence and geometry (the algorithm in the
 * module comment). Orders are returned for the bonds in the order given.
 *
 * @param elements chemical symbols, one per atom (case-sensitive).
 * @param bonds `2 × B` atom indices (any order; each pair once).
 * @param coordinates flat `[x0, y0, z0, …]` in Å, or `null` to use valence
 *   alone (fine when every hydrogen is present; ties are then broken by
 *   atom index instead of bond length).
 * @param formalCharges one per atom (elementary charges); default all 0.
 * @returns one order per bond (1, 2 or 3), in the order of `bonds`.
 * @throws ModelError on bad bonds (`bonds[3]: index 40 is out of range
 *   (molecule has 31 atoms)`), bad coordinates or charges of the wrong length.
 */
export function perceiveBondOrders(
  elements: readonly string[],
  bonds: Int32Array,
  coordinates: Float64Array | null,
  formalCharges?: Int32Array | null,
): Float64Array {
  checkElements(elements);
  const n = elements.length;
  const canonical = canonicalBonds(bonds, n);
  if (coordinates !== null && coordinates !== undefined) checkCoordinates(coordinates, n);
  const charges = checkCharges(formalCharges, n);
  const sortedOrders = kekuleOrders(elements, canonical.bonds, neighbourLists(n, canonical.bonds), coordinates ?? null, charges);
  if (canonical.unchanged) return sortedOrders;
  const orders = new Float64Array(sortedOrders.length);
  for (let s = 0; s < sortedOrders.length; s++) orders[canonical.order[s]] = sortedOrders[s];
  return orders;
}

/**
 * The algorithm proper, on checked, canonical input. Internal to perceive/
 * (topology perception calls it with its own neighbour lists). Never throws.
 */
export function kekuleOrders(
  elements: readonly string[],
  bonds: Int32Array,
  lists: NeighbourLists,
  coordinates: Float64Array | null,
  charges: Int32Array,
): Float64Array {
  const n = elements.length;
  const bondCount = bonds.length >> 1;
  const { start, neighbours, bondOf } = lists;
  const degree = (a: number): number => start[a + 1] - start[a];
  const extra = new Int32Array(bondCount); // order − 1
  const capacity = new Int32Array(bondCount); // largest allowed extra order
  const ratio = new Float64Array(bondCount); // r / (r_cov,i + r_cov,j); 1 without coordinates
  const unsat = new Int32Array(n);

  // Step 1: valence.
  const rules: (ValenceRule | undefined)[] = elements.map((e) => RULES.get(e));
  const terminalAcceptor = (b: number): boolean =>
    degree(b) === 1 && (elements[b] === 'O' || elements[b] === 'S') && charges[b] === 0;
  for (let a = 0; a < n; a++) {
    const rule = rules[a];
    if (rule === undefined) continue;
    const d = degree(a);
    let terminal = 0;
    let terminalO = 0;
    for (let s = start[a]; s < start[a + 1]; s++) {
      if (terminalAcceptor(neighbours[s])) {
        terminal++;
        if (elements[neighbours[s]] === 'O') terminalO++;
      }
    }
    let valence: number;
    if (rule.valences.length > 1) {
      const wanted = d + terminal;
      const allowed = rule.valences.map((v) => chargedValence(rule, v, charges[a]));
      valence = allowed.find((v) => v >= wanted) ?? allowed[allowed.length - 1];
    } else if (elements[a] === 'N' && charges[a] === 0 && d === 3 && terminalO >= 2) {
      valence = 4; // nitro, read without its charges
    } else {
      valence = chargedValence(rule, rule.valences[0], charges[a]);
    }
    unsat[a] = Math.max(0, valence - d);
  }

  // Step 2: geometry.
  for (let b = 0; b < bondCount; b++) {
    const i = bonds[2 * b];
    const j = bonds[2 * b + 1];
    if (rules[i] === undefined || rules[j] === undefined || elements[i] === 'H' || elements[j] === 'H') continue;
    if (coordinates === null) {
      ratio[b] = 1;
      capacity[b] = 2;
      continue;
    }
    const rr = atomDistance(coordinates, i, j) / ((covalentRadius(elements[i]) ?? 1) + (covalentRadius(elements[j]) ?? 1));
    ratio[b] = rr;
    capacity[b] = rr <= TRIPLE_BOND_RATIO ? 2 : rr <= MULTIPLE_BOND_RATIO ? 1 : 0;
  }
  if (coordinates !== null) {
    for (let a = 0; a < n; a++) {
      const rule = rules[a];
      if (rule === undefined || !rule.small || unsat[a] === 0) continue;
      unsat[a] = Math.min(unsat[a], geometricCap(coordinates, a, neighbours, start[a], start[a + 1]));
    }
  }

  // Step 3: forced choices.
  const available = (s: number): boolean => {
    const b = bondOf[s];
    return unsat[neighbours[s]] > 0 && extra[b] < capacity[b];
  };
  const queue = new Int32Array(n + 2 * bondCount + 1);
  const queued = new Uint8Array(n);
  let head = 0;
  let tail = 0;
  for (let a = 0; a < n; a++) {
    if (unsat[a] > 0) {
      queue[tail++] = a;
      queued[a] = 1;
    }
  }
  const ring = queue.length;
  while (head !== tail) {
    const a = queue[head];
    head = (head + 1) % ring;
    queued[a] = 0;
    if (unsat[a] === 0) continue;
    let only = -1;
    let count = 0;
    for (let s = start[a]; s < start[a + 1]; s++) {
      if (available(s)) {
        count++;
        only = s;
      }
    }
    if (count !== 1) continue;
    const b = neighbours[only];
    const e = bondOf[only];
    const k = Math.min(unsat[a], unsat[b], capacity[e] - extra[e]);
    extra[e] += k;
    unsat[a] -= k;
    unsat[b] -= k;
    // b's neighbours may now be forced.
    for (let s = start[b]; s < start[b + 1]; s++) {
      const c = neighbours[s];
      if (unsat[c] > 0 && queued[c] === 0) {
        queue[tail] = c;
        tail = (tail + 1) % ring;
        queued[c] = 1;
      }
    }
    if (unsat[a] > 0 && queued[a] === 0) {
      queue[tail] = a;
      tail = (tail + 1) % ring;
      queued[a] = 1;
    }
  }
  // Atoms needing two or more: one unit at a time, shortest bond first.
  const slots: number[] = [];
  for (let a = 0; a < n; a++) {
    if (unsat[a] < 2) continue;
    slots.length = 0;
    for (let s = start[a]; s < start[a + 1]; s++) if (available(s)) slots.push(s);
    slots.sort((p, q) => ratio[bondOf[p]] - ratio[bondOf[q]] || p - q);
    let progress = true;
    while (unsat[a] > 0 && progress) {
      progress = false;
      for (const s of slots) {
        if (unsat[a] === 0) break;
        if (!available(s)) continue;
        extra[bondOf[s]]++;
        unsat[a]--;
        unsat[neighbours[s]]--;
        progress = true;
      }
    }
  }

  // Step 4: maximum matching of the atoms that still need one double bond.
  matchRemaining(n, lists, unsat, extra, capacity, ratio);

  const orders = new Float64Array(bondCount);
  for (let b = 0; b < bondCount; b++) orders[b] = 1 + extra[b];
  return orders;
}

/** Angle p–a–q in degrees (atan2 form, accurate near 0° and 180°). Never throws. */
function angleAt(x: Float64Array, a: number, p: number, q: number): number {
  const ux = x[3 * p] - x[3 * a], uy = x[3 * p + 1] - x[3 * a + 1], uz = x[3 * p + 2] - x[3 * a + 2];
  const vx = x[3 * q] - x[3 * a], vy = x[3 * q + 1] - x[3 * a + 1], vz = x[3 * q + 2] - x[3 * a + 2];
  const cx = uy * vz - uz * vy, cy = uz * vx - ux * vz, cz = ux * vy - uy * vx;
  return (Math.atan2(Math.sqrt(cx * cx + cy * cy + cz * cz), ux * vx + uy * vy + uz * vz) * 180) / Math.PI;
}

/** Largest number of π bonds the geometry allows a second-row atom (step 2). */
function geometricCap(x: Float64Array, a: number, neighbours: Int32Array, s0: number, s1: number): number {
  const d = s1 - s0;
  if (d >= 4) return 0;
  if (d <= 1) return 3;
  const p = neighbours[s0];
  const q = neighbours[s0 + 1];
  if (d === 2) return angleAt(x, a, p, q) >= 165 ? 2 : 1;
  const r = neighbours[s0 + 2];
  return angleAt(x, a, p, q) + angleAt(x, a, q, r) + angleAt(x, a, p, r) >= 345 ? 1 : 0;
}

/**
 * Step 4: atoms with unsat ≥ 1 joined by bonds with spare capacity form a
 * graph; a maximum matching of it becomes double bonds. Per connected
 * component: greedy (shortest bond first), then Edmonds' augmenting-path
 * search with blossom contraction from each unmatched atom.
 */
function matchRemaining(
  n: number,
  lists: NeighbourLists,
  unsat: Int32Array,
  extra: Int32Array,
  capacity: Int32Array,
  ratio: Float64Array,
): void {
  const { start, neighbours, bondOf } = lists;
  const usable = (s: number): boolean => unsat[neighbours[s]] > 0 && extra[bondOf[s]] < capacity[bondOf[s]];
  const local = new Int32Array(n).fill(-1);
  const members: number[] = [];
  for (let root = 0; root < n; root++) {
    if (unsat[root] === 0 || local[root] !== -1) continue;
    // Component by breadth-first search.
    members.length = 0;
    members.push(root);
    local[root] = 0;
    for (let h = 0; h < members.length; h++) {
      const a = members[h];
      for (let s = start[a]; s < start[a + 1]; s++) {
        if (!usable(s)) continue;
        const c = neighbours[s];
        if (local[c] === -1) {
          local[c] = members.length;
          members.push(c);
        }
      }
    }
    const m = members.length;
    if (m === 1) continue;
    // Local CSR, neighbours ordered by bond length (then atom index).
    const adjStart = new Int32Array(m + 1);
    for (let v = 0; v < m; v++) {
      const a = members[v];
      let c = 0;
      for (let s = start[a]; s < start[a + 1]; s++) if (usable(s)) c++;
      adjStart[v + 1] = adjStart[v] + c;
    }
    const adj = new Int32Array(adjStart[m]);
    const adjSlot = new Int32Array(adjStart[m]);
    for (let v = 0; v < m; v++) {
      const a = members[v];
      const t0 = adjStart[v];
      let t1 = t0;
      // Insertion by (bond length ratio, neighbour index): a few neighbours each.
      for (let s = start[a]; s < start[a + 1]; s++) {
        if (!usable(s)) continue;
        let t = t1++;
        while (t > t0) {
          const prev = adjSlot[t - 1];
          const dr = ratio[bondOf[prev]] - ratio[bondOf[s]];
          if (dr < 0 || (dr === 0 && neighbours[prev] < neighbours[s])) break;
          adjSlot[t] = prev;
          t--;
        }
        adjSlot[t] = s;
      }
      for (let t = t0; t < t1; t++) adj[t] = local[neighbours[adjSlot[t]]];
    }
    const match = maximumMatching(m, adjStart, adj);
    for (let v = 0; v < m; v++) {
      const w = match[v];
      if (w <= v) continue;
      for (let t = adjStart[v]; t < adjStart[v + 1]; t++) {
        if (adj[t] === w) {
          extra[bondOf[adjSlot[t]]]++;
          break;
        }
      }
    }
    for (let v = 0; v < m; v++) {
      if (match[v] !== -1) unsat[members[v]]--;
    }
  }
}

/**
 * Maximum matching of a general graph (CSR, `m` vertices): greedy start in
 * adjacency order, then one augmenting-path search per unmatched vertex
 * (Edmonds 1965, blossom contraction). `match[v]` is v's partner or −1.
 * Internal to perceive/ (exported for its tests). Never throws.
 */
export function maximumMatching(m: number, adjStart: Int32Array, adj: Int32Array): Int32Array {
  const match = new Int32Array(m).fill(-1);
  for (let v = 0; v < m; v++) {
    if (match[v] !== -1) continue;
    for (let t = adjStart[v]; t < adjStart[v + 1]; t++) {
      const w = adj[t];
      if (match[w] === -1) {
        match[v] = w;
        match[w] = v;
        break;
      }
    }
  }
  // Search state, reset only where a search touched it (so each search costs
  // the size of the tree it grows, not m).
  const parent = new Int32Array(m).fill(-1);
  const base = new Int32Array(m);
  for (let i = 0; i < m; i++) base[i] = i;
  const used = new Uint8Array(m);
  const inBlossom = new Int32Array(m);
  const onPath = new Int32Array(m);
  const queue = new Int32Array(m);
  const touched = new Int32Array(m);
  const isTouched = new Uint8Array(m);
  let touchedCount = 0;
  let stamp = 0;
  const touch = (i: number): void => {
    if (!isTouched[i]) {
      isTouched[i] = 1;
      touched[touchedCount++] = i;
    }
  };

  const commonBase = (a0: number, b0: number): number => {
    const tag = ++stamp;
    let a = a0;
    for (;;) {
      a = base[a];
      onPath[a] = tag;
      if (match[a] === -1) break;
      a = parent[match[a]];
    }
    let b = b0;
    for (;;) {
      b = base[b];
      if (onPath[b] === tag) return b;
      b = parent[match[b]];
    }
  };
  const markPath = (v0: number, b: number, child0: number, tag: number): void => {
    let v = v0;
    let child = child0;
    while (base[v] !== b) {
      inBlossom[base[v]] = tag;
      inBlossom[base[match[v]]] = tag;
      parent[v] = child;
      touch(v);
      child = match[v];
      v = parent[match[v]];
    }
  };
  const augmentFrom = (root: number): number => {
    for (let t = 0; t < touchedCount; t++) {
      const i = touched[t];
      used[i] = 0;
      parent[i] = -1;
      base[i] = i;
      isTouched[i] = 0;
    }
    touchedCount = 0;
    used[root] = 1;
    touch(root);
    let qh = 0;
    let qt = 0;
    queue[qt++] = root;
    while (qh < qt) {
      const v = queue[qh++];
      for (let t = adjStart[v]; t < adjStart[v + 1]; t++) {
        const to = adj[t];
        if (base[v] === base[to] || match[v] === to) continue;
        if (to === root || (match[to] !== -1 && parent[match[to]] !== -1)) {
          const cb = commonBase(v, to);
          const tag = ++stamp;
          markPath(v, cb, to, tag);
          markPath(to, cb, v, tag);
          // Every vertex of a blossom is already in the tree, i.e. touched.
          for (let u = 0; u < touchedCount; u++) {
            const i = touched[u];
            if (inBlossom[base[i]] === tag) {
              base[i] = cb;
              if (!used[i]) {
                used[i] = 1;
                queue[qt++] = i;
              }
            }
          }
        } else if (parent[to] === -1) {
          parent[to] = v;
          touch(to);
          if (match[to] === -1) return to;
          const mt = match[to];
          if (!used[mt]) {
            used[mt] = 1;
            touch(mt);
            queue[qt++] = mt;
          }
        }
      }
    }
    return -1;
  };
  for (let root = 0; root < m; root++) {
    if (match[root] !== -1) continue;
    let v = augmentFrom(root);
    while (v !== -1) {
      const pv = parent[v];
      const ppv = match[pv];
      match[v] = pv;
      match[pv] = v;
      v = ppv;
    }
  }
  return match;
}
