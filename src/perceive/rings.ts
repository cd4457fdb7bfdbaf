/**
 * Rings: the smallest set of smallest rings (SSSR), i.e. a minimum cycle
 * basis of the bond graph, with B − N + C rings (C = connected components).
 *
 * 1. Ring bonds and ring systems: the graph is cut into biconnected blocks
 *    (Tarjan's depth-first search, iterative, linear). A block of one bond
 *    is not in a ring; the cycle space is the direct sum of the blocks', so
 *    each block is solved alone with rank E_b − V_b + 1.
 * 2. A block of rank 1 is one simple ring: it is walked, in linear time.
 *    Chains, polymers of isolated rings (polystyrene-like) stay linear.
 * 3. A block of larger rank (fused, bridged, spiro-free cages) gets
 *    candidate cycles, shortest first, and keeps each one that is
 *    independent (over GF(2), as a set of bonds) of those kept before,
 *    until the rank is reached. Candidates: for blocks of up to
 *    {@link HORTON_BLOCK_LIMIT} atoms, Horton's set (for every atom v and
 *    every bond x–y, the shortest paths v→x and v→y closed by x–y, when they
 *    share only v), which always contains a minimum cycle basis (Horton
 *    1987). For larger blocks (ladder polymers, sheets), the shortest ring
 *    through each bond, found by a breadth-first search that stops as soon as
 *    it closes (so it stays local and the whole step near-linear); if those
 *    do not reach the rank, Horton's set is added.
 *
 * Independence is tested by sparse elimination: each kept cycle is stored
 * reduced, keyed by its largest bond index.
 * @module
 */
import type { NeighbourLists } from './graph.js';

/** Blocks with at most this many atoms use Horton's full candidate set. */
export const HORTON_BLOCK_LIMIT = 128;

interface Candidate {
  readonly atoms: Int32Array;
  readonly edges: Int32Array; // bond indices, ascending
}

/**
 * The smallest set of smallest rings of a bond graph. Each ring lists its
 * atoms in ring order, starting at its smallest index and going on towards
 * the smaller of that atom's two ring neighbours. Rings are sorted by size,
 * then by atom sequence. Internal to perceive/ (topology perception exposes
 * the result). `hortonLimit` (default {@link HORTON_BLOCK_LIMIT}) is the
 * largest block solved with Horton's full set; tests lower or raise it to
 * compare the two candidate sets. Never throws.
 */
export function smallestRings(
  atomCount: number,
  bonds: Int32Array,
  lists: NeighbourLists,
  hortonLimit: number = HORTON_BLOCK_LIMIT,
): Int32Array[] {
  const { start, neighbours, bondOf } = lists;
  const bondCount = bonds.length >> 1;
  const n = atomCount;
  // --- biconnected blocks (iterative Tarjan) ---
  const disc = new Int32Array(n).fill(-1);
  const low = new Int32Array(n);
  const parentEdge = new Int32Array(n).fill(-1);
  const cursor = new Int32Array(n);
  const stack = new Int32Array(n);
  const edgeStack = new Int32Array(bondCount);
  const blockOfEdge = new Int32Array(bondCount).fill(-1);
  const blockEdges = new Int32Array(bondCount);
  const blockStart = new Int32Array(bondCount + 1);
  let blockCount = 0;
  let blockFill = 0;
  let time = 0;
  let es = 0;
  for (let r = 0; r < n; r++) {
    if (disc[r] !== -1) continue;
    disc[r] = low[r] = time++;
    cursor[r] = start[r];
    let sp = 0;
    stack[sp++] = r;
    while (sp > 0) {
      const v = stack[sp - 1];
      if (cursor[v] < start[v + 1]) {
        const s = cursor[v]++;
        const w = neighbours[s];
        const e = bondOf[s];
        if (e === parentEdge[v]) continue;
        if (disc[w] === -1) {
          edgeStack[es++] = e;
          parentEdge[w] = e;
          disc[w] = low[w] = time++;
          cursor[w] = start[w];
          stack[sp++] = w;
        } else if (disc[w] < disc[v]) {
          edgeStack[es++] = e;
          if (disc[w] < low[v]) low[v] = disc[w];
        }
      } else {
        sp--;
        if (sp === 0) continue;
        const p = stack[sp - 1];
        if (low[v] < low[p]) low[p] = low[v];
        if (low[v] >= disc[p]) {
          const id = blockCount++;
          let e: number;
          do {
            e = edgeStack[--es];
            blockOfEdge[e] = id;
            blockEdges[blockFill++] = e;
          } while (e !== parentEdge[v]);
          blockStart[blockCount] = blockFill;
        }
      }
    }
  }

  const rings: Int32Array[] = [];
  const seen = new Int32Array(n).fill(-1); // block id that last listed the atom
  const work = new SearchSpace(n);
  const blockVertices: number[] = [];
  for (let id = 0; id < blockCount; id++) {
    const e0 = blockStart[id];
    const e1 = blockStart[id + 1];
    if (e1 - e0 < 3) continue; // a bridge (blocks of two bonds cannot exist without multi-bonds)
    blockVertices.length = 0;
    for (let t = e0; t < e1; t++) {
      const e = blockEdges[t];
      for (let end = 0; end < 2; end++) {
        const a = bonds[2 * e + end];
        if (seen[a] !== id) {
          seen[a] = id;
          blockVertices.push(a);
        }
      }
    }
    const rank = e1 - e0 - blockVertices.length + 1;
    const inBlock = (s: number): boolean => blockOfEdge[bondOf[s]] === id;
    if (rank === 1) {
      rings.push(walkCycle(blockVertices, lists, inBlock));
      continue;
    }
    const kept = new Basis();
    const keys = new Map<number, Int32Array[]>(); // hash of the bond set → bond sets seen
    const consider = (list: Candidate[]): void => {
      list.sort((p, q) => p.atoms.length - q.atoms.length);
      for (const c of list) {
        if (kept.size >= rank) break;
        if (kept.insert(c.edges)) rings.push(canonicalRing(c.atoms));
      }
    };
    const fresh = (c: Candidate | null, out: Candidate[]): void => {
      if (c === null) return;
      let hash = c.edges.length;
      for (let t = 0; t < c.edges.length; t++) hash = Math.imul(hash ^ c.edges[t], 0x9e3779b1) + t;
      const same = keys.get(hash);
      if (same === undefined) keys.set(hash, [c.edges]);
      else if (same.some((edges) => sameEdges(edges, c.edges))) return;
      else same.push(c.edges);
      out.push(c);
    };
    if (blockVertices.length > hortonLimit) {
      const local: Candidate[] = [];
      for (let t = e0; t < e1; t++) fresh(work.shortestCycleThrough(blockEdges[t], bonds, lists, inBlock), local);
      consider(local);
    }
    if (kept.size < rank) {
      const horton: Candidate[] = [];
      for (const v of blockVertices) work.hortonCandidates(v, bonds, lists, inBlock, blockEdges, e0, e1, (c) => fresh(c, horton));
      consider(horton);
    }
  }
  rings.sort(compareRings);
  return rings;
}

/** The one ring of a rank-1 block, walked from its smallest atom. */
function walkCycle(vertices: readonly number[], lists: NeighbourLists, inBlock: (s: number) => boolean): Int32Array {
  const { start, neighbours } = lists;
  let first = vertices[0];
  for (const v of vertices) if (v < first) first = v;
  const ring = new Int32Array(vertices.length);
  ring[0] = first;
  let prev = -1;
  let cur = first;
  for (let p = 1; p < ring.length; p++) {
    let next = -1;
    for (let s = start[cur]; s < start[cur + 1]; s++) {
      if (!inBlock(s) || neighbours[s] === prev) continue;
      // Neighbours are ascending, so at the first atom this takes the smaller one.
      next = neighbours[s];
      break;
    }
    ring[p] = next;
    prev = cur;
    cur = next;
  }
  return ring;
}

/** Rotates/reflects a ring to start at its smallest atom, towards its smaller neighbour. */
function canonicalRing(atoms: Int32Array): Int32Array {
  const m = atoms.length;
  let at = 0;
  for (let p = 1; p < m; p++) if (atoms[p] < atoms[at]) at = p;
  const forward = atoms[(at + 1) % m] < atoms[(at + m - 1) % m];
  const out = new Int32Array(m);
  for (let p = 0; p < m; p++) out[p] = atoms[forward ? (at + p) % m : (at - p + m) % m];
  return out;
}

function compareRings(p: Int32Array, q: Int32Array): number {
  if (p.length !== q.length) return p.length - q.length;
  for (let t = 0; t < p.length; t++) if (p[t] !== q[t]) return p[t] - q[t];
  return 0;
}

/** Cycles kept so far, reduced over GF(2), keyed by their largest bond index. */
class Basis {
  private readonly byPivot = new Map<number, Int32Array>();
  get size(): number {
    return this.byPivot.size;
  }
  /** Adds the cycle if it is independent of those kept; returns whether it was. */
  insert(edges: Int32Array): boolean {
    let v = edges;
    while (v.length > 0) {
      const pivot = v[v.length - 1];
      const owner = this.byPivot.get(pivot);
      if (owner === undefined) {
        this.byPivot.set(pivot, v);
        return true;
      }
      v = symmetricDifference(v, owner);
    }
    return false;
  }
}

function sameEdges(a: Int32Array, b: Int32Array): boolean {
  if (a.length !== b.length) return false;
  for (let t = 0; t < a.length; t++) if (a[t] !== b[t]) return false;
  return true;
}

function symmetricDifference(a: Int32Array, b: Int32Array): Int32Array {
  const out = new Int32Array(a.length + b.length);
  let i = 0;
  let j = 0;
  let k = 0;
  while (i < a.length && j < b.length) {
    if (a[i] < b[j]) out[k++] = a[i++];
    else if (a[i] > b[j]) out[k++] = b[j++];
    else {
      i++;
      j++;
    }
  }
  while (i < a.length) out[k++] = a[i++];
  while (j < b.length) out[k++] = b[j++];
  return out.slice(0, k);
}

/** Breadth-first search scratch space, reset only where it was touched. */
class SearchSpace {
  private readonly depth: Int32Array;
  private readonly parent: Int32Array;
  private readonly parentBond: Int32Array;
  private readonly mark: Int32Array;
  private readonly queue: Int32Array;
  private stamp = 0;
  private touched = 0;

  constructor(n: number) {
    this.depth = new Int32Array(n).fill(-1);
    this.parent = new Int32Array(n).fill(-1);
    this.parentBond = new Int32Array(n).fill(-1);
    this.mark = new Int32Array(n);
    this.queue = new Int32Array(n);
  }

  private reset(): void {
    for (let t = 0; t < this.touched; t++) {
      const a = this.queue[t];
      this.depth[a] = -1;
      this.parent[a] = -1;
      this.parentBond[a] = -1;
    }
    this.touched = 0;
  }

  /** The shortest cycle through bond e inside the block (search stops when it closes). */
  shortestCycleThrough(e: number, bonds: Int32Array, lists: NeighbourLists, inBlock: (s: number) => boolean): Candidate | null {
    const { start, neighbours, bondOf } = lists;
    const a = bonds[2 * e];
    const b = bonds[2 * e + 1];
    this.reset();
    const { depth, parent, parentBond, queue } = this;
    depth[a] = 0;
    queue[0] = a;
    let tail = 1;
    let found = false;
    for (let h = 0; h < tail && !found; h++) {
      const v = queue[h];
      for (let s = start[v]; s < start[v + 1]; s++) {
        if (!inBlock(s) || bondOf[s] === e) continue;
        const w = neighbours[s];
        if (depth[w] !== -1) continue;
        depth[w] = depth[v] + 1;
        parent[w] = v;
        parentBond[w] = bondOf[s];
        queue[tail++] = w;
        if (w === b) {
          found = true;
          break;
        }
      }
    }
    this.touched = tail;
    if (!found) return null;
    const atoms = new Int32Array(depth[b] + 1);
    const edges = new Int32Array(depth[b] + 1);
    let v = b;
    for (let p = depth[b]; p >= 0; p--) {
      atoms[p] = v;
      if (p > 0) edges[p] = parentBond[v];
      v = parent[v];
    }
    edges[0] = e;
    edges.sort();
    return { atoms, edges };
  }

  /** Horton's candidates rooted at v: shortest paths v→x, v→y closed by the block bond x–y. */
  hortonCandidates(
    v: number,
    bonds: Int32Array,
    lists: NeighbourLists,
    inBlock: (s: number) => boolean,
    blockEdges: Int32Array,
    e0: number,
    e1: number,
    emit: (c: Candidate) => void,
  ): void {
    const { start, neighbours, bondOf } = lists;
    this.reset();
    const { depth, parent, parentBond, queue, mark } = this;
    depth[v] = 0;
    queue[0] = v;
    let tail = 1;
    for (let h = 0; h < tail; h++) {
      const u = queue[h];
      for (let s = start[u]; s < start[u + 1]; s++) {
        if (!inBlock(s)) continue;
        const w = neighbours[s];
        if (depth[w] !== -1) continue;
        depth[w] = depth[u] + 1;
        parent[w] = u;
        parentBond[w] = bondOf[s];
        queue[tail++] = w;
      }
    }
    this.touched = tail;
    for (let t = e0; t < e1; t++) {
      const e = blockEdges[t];
      const x = bonds[2 * e];
      const y = bonds[2 * e + 1];
      if (parentBond[x] === e || parentBond[y] === e) continue;
      // Paths v→x and v→y must share only v.
      const tag = ++this.stamp;
      for (let u = x; u !== v; u = parent[u]) mark[u] = tag;
      let disjoint = true;
      for (let u = y; u !== v; u = parent[u]) {
        if (mark[u] === tag) {
          disjoint = false;
          break;
        }
      }
      if (!disjoint) continue;
      const length = depth[x] + depth[y] + 1;
      const atoms = new Int32Array(length);
      const edges = new Int32Array(length);
      // v … x (x's path reversed), then y … (towards v, v excluded).
      let p = depth[x];
      let k = 0;
      for (let u = x; u !== v; u = parent[u]) {
        atoms[p--] = u;
        edges[k++] = parentBond[u];
      }
      atoms[0] = v;
      p = depth[x] + 1;
      for (let u = y; u !== v; u = parent[u]) {
        atoms[p++] = u;
        edges[k++] = parentBond[u];
      }
      edges[k++] = e;
      edges.sort();
      emit({ atoms, edges });
    }
  }
}
