/**
 * A preconditioner for minimizing a model: a positive definite model of the
 * stiff part of the Hessian, built from the model's own bond and angle terms.
 *
 * P = Σ k_q ∇q ∇qᵀ + μ I over the bond stretches (harmonic, Morse, Urey–Bradley)
 * and angle bends (harmonic, cosine) of the model, with q the bond length or
 * bend angle and k_q the term's curvature at its minimum (k; 2 D a² for Morse).
 * This is the Gauss–Newton part of those terms' Hessian (the part that does
 * not change sign away from the minimum), the idea behind internal-coordinate
 * model Hessians used to start quasi-Newton geometry optimizations. The shift
 * μ is a tenth of the mean diagonal entry of the sum, so that the soft
 * directions (torsions, restraints, nonbonded) are not given huge steps.
 * Frozen atoms get identity blocks with no coupling.
 *
 * Handed to the minimizer, L-BFGS runs in the coordinates z = Lᵀ Π x where
 * P = Πᵀ L Lᵀ Π (see `BlockCholesky`): stiff bond and angle motions and soft
 * torsional ones then have similar curvature, which on molecule-like models
 * roughly halves the evaluations needed.
 * @module
 */
import { BlockCholesky } from '../linalg/block-cholesky.js';
import type { Preconditioner } from '../optimize/types.js';
import type { TermTable } from '../terms/table.js';

/** Relative shift: μ = SHIFT × (trace / dimension). Chosen on molecule-like test models (bench/molecule-like.js). */
const SHIFT = 0.1;

interface StiffPair {
  /** 'bond': atoms i j (q = r); 'angle': atoms i j k (q = θ at j); 'cos': q = cos θ. */
  readonly kind: 'bond' | 'angle' | 'cos';
  readonly atoms: Int32Array;
  readonly k: Float64Array;
}

/**
 * Build the preconditioner of a model's terms, or `undefined` when the model
 * has no bond or angle terms (nothing to precondition with).
 * @param atomCount - N.
 * @param tables - the model's term tables.
 * @param frozen - atoms that never move.
 */
export function stiffTermPreconditioner(
  atomCount: number,
  tables: readonly TermTable[],
  frozen: Int32Array = new Int32Array(0),
): Preconditioner | undefined {
  const parts: StiffPair[] = [];
  for (const t of tables) {
    const { atoms, params, count, width } = t;
    if (count === 0) continue;
    if (t.kind === 'harmonic-bond' || t.kind === 'morse-bond') {
      const k = new Float64Array(count);
      for (let r = 0; r < count; r++) {
        k[r] = t.kind === 'harmonic-bond' ? params[r * width] : 2 * params[r * width] * params[r * width + 1] ** 2;
      }
      parts.push({ kind: 'bond', atoms, k });
    } else if (t.kind === 'urey-bradley') {
      const pairAtoms = new Int32Array(2 * count);
      const k = new Float64Array(count);
      for (let r = 0; r < count; r++) {
        pairAtoms[2 * r] = atoms[3 * r];
        pairAtoms[2 * r + 1] = atoms[3 * r + 2];
        k[r] = params[r * width];
      }
      parts.push({ kind: 'bond', atoms: pairAtoms, k });
    } else if (t.kind === 'harmonic-angle' || t.kind === 'cosine-angle') {
      const k = new Float64Array(count);
      for (let r = 0; r < count; r++) k[r] = params[r * width];
      parts.push({ kind: t.kind === 'harmonic-angle' ? 'angle' : 'cos', atoms, k });
    }
  }
  if (parts.length === 0) return undefined;
  const isFrozen = new Uint8Array(atomCount);
  for (let f = 0; f < frozen.length; f++) isFrozen[frozen[f]] = 1;

  // The block pattern: one off-diagonal block per pair of atoms in a term.
  const pairList: number[] = [];
  const pairIndex = new Map<number, number>();
  const pairOf = (i: number, j: number): number => {
    if (isFrozen[i] || isFrozen[j]) return -1;
    const a = Math.min(i, j);
    const b = Math.max(i, j);
    const key = a * atomCount + b;
    let q = pairIndex.get(key);
    if (q === undefined) {
      q = pairList.length / 2;
      pairIndex.set(key, q);
      pairList.push(a, b);
    }
    return q;
  };
  const slots: Int32Array[] = parts.map((part) => {
    const arity = part.kind === 'bond' ? 2 : 3;
    const count = part.k.length;
    const s = new Int32Array(count * (arity === 2 ? 1 : 3));
    for (let r = 0; r < count; r++) {
      const a = part.atoms.subarray(arity * r, arity * r + arity);
      if (arity === 2) s[r] = pairOf(a[0], a[1]);
      else {
        s[3 * r] = pairOf(a[0], a[1]);
        s[3 * r + 1] = pairOf(a[1], a[2]);
        s[3 * r + 2] = pairOf(a[0], a[2]);
      }
    }
    return s;
  });
  const pairs = Int32Array.from(pairList);
  const factor = new BlockCholesky(atomCount, pairs);
  const diagonal = new Float64Array(9 * atomCount);
  const off = new Float64Array(9 * (pairs.length / 2));
  const grad = new Float64Array(9); // ∇q for up to three atoms
  const gradAtoms = new Int32Array(3);

  /** Add k ∇q∇qᵀ for the atoms in gradAtoms[0..m-1] with ∇q in grad. */
  const addOuter = (k: number, m: number, pairSlots: Int32Array, base: number): void => {
    for (let u = 0; u < m; u++) {
      const a = gradAtoms[u];
      if (!isFrozen[a]) {
        const d = 9 * a;
        for (let r = 0; r < 3; r++) for (let c = 0; c < 3; c++) diagonal[d + 3 * r + c] += k * grad[3 * u + r] * grad[3 * u + c];
      }
      for (let v = u + 1; v < m; v++) {
        // slot of (atoms u, v): bonds have one; angles (0,1), (1,2), (0,2)
        const q = m === 2 ? pairSlots[base] : pairSlots[base + (u === 0 ? (v === 1 ? 0 : 2) : 1)];
        if (q < 0) continue;
        const b = gradAtoms[v];
        // block (row min(a,b), col max(a,b))
        const o = 9 * q;
        const ru = a < b ? u : v;
        const rv = a < b ? v : u;
        for (let r = 0; r < 3; r++) for (let c = 0; c < 3; c++) off[o + 3 * r + c] += k * grad[3 * ru + r] * grad[3 * rv + c];
      }
    }
  };

  const assemble = (x: Float64Array): boolean => {
    diagonal.fill(0);
    off.fill(0);
    for (let pi = 0; pi < parts.length; pi++) {
      const part = parts[pi];
      const s = slots[pi];
      const A = part.atoms;
      for (let r = 0; r < part.k.length; r++) {
        const k = part.k[r];
        if (!(k > 0)) continue;
        if (part.kind === 'bond') {
          const i = A[2 * r], j = A[2 * r + 1];
          let dx = x[3 * j] - x[3 * i], dy = x[3 * j + 1] - x[3 * i + 1], dz = x[3 * j + 2] - x[3 * i + 2];
          const len = Math.sqrt(dx * dx + dy * dy + dz * dz);
          if (!(len > 0)) continue;
          dx /= len; dy /= len; dz /= len;
          gradAtoms[0] = i; gradAtoms[1] = j;
          grad[0] = -dx; grad[1] = -dy; grad[2] = -dz;
          grad[3] = dx; grad[4] = dy; grad[5] = dz;
          addOuter(k, 2, s, r);
        } else {
          const i = A[3 * r], j = A[3 * r + 1], l = A[3 * r + 2];
          const ax = x[3 * i] - x[3 * j], ay = x[3 * i + 1] - x[3 * j + 1], az = x[3 * i + 2] - x[3 * j + 2];
          const bx = x[3 * l] - x[3 * j], by = x[3 * l + 1] - x[3 * j + 1], bz = x[3 * l + 2] - x[3 * j + 2];
          const ra = Math.sqrt(ax * ax + ay * ay + az * az), rb = Math.sqrt(bx * bx + by * by + bz * bz);
          if (!(ra > 0 && rb > 0)) continue;
          const ux = ax / ra, uy = ay / ra, uz = az / ra;
          const vx = bx / rb, vy = by / rb, vz = bz / rb;
          const cos = ux * vx + uy * vy + uz * vz;
          const cx = uy * vz - uz * vy, cy = uz * vx - ux * vz, cz = ux * vy - uy * vx;
          const sin = Math.sqrt(cx * cx + cy * cy + cz * cz);
          // ∇_i cos θ = (v − cos u)/|a|, ∇_k cos θ = (u − cos v)/|b|; ∇θ = −∇cos θ / sin θ.
          let scale: number;
          if (part.kind === 'cos') scale = 1;
          else {
            if (!(sin > 1e-3)) continue; // near-linear: ∇θ undefined; leave the term out
            scale = -1 / sin;
          }
          gradAtoms[0] = i; gradAtoms[1] = j; gradAtoms[2] = l;
          grad[0] = (scale * (vx - cos * ux)) / ra; grad[1] = (scale * (vy - cos * uy)) / ra; grad[2] = (scale * (vz - cos * uz)) / ra;
          grad[6] = (scale * (ux - cos * vx)) / rb; grad[7] = (scale * (uy - cos * vy)) / rb; grad[8] = (scale * (uz - cos * vz)) / rb;
          grad[3] = -grad[0] - grad[6]; grad[4] = -grad[1] - grad[7]; grad[5] = -grad[2] - grad[8];
          addOuter(k, 3, s, 3 * r);
        }
      }
    }
    let trace = 0;
    let moving = 0;
    for (let a = 0; a < atomCount; a++) {
      if (isFrozen[a]) continue;
      trace += diagonal[9 * a] + diagonal[9 * a + 4] + diagonal[9 * a + 8];
      moving += 3;
    }
    const mu = moving > 0 && trace > 0 ? (SHIFT * trace) / moving : 1;
    for (let a = 0; a < atomCount; a++) {
      const d = 9 * a;
      if (isFrozen[a]) {
        diagonal.fill(0, d, d + 9);
        diagonal[d] = diagonal[d + 4] = diagonal[d + 8] = mu;
      } else {
        diagonal[d] += mu;
        diagonal[d + 4] += mu;
        diagonal[d + 8] += mu;
      }
    }
    return factor.factor(diagonal, pairs, off);
  };

  return {
    update: assemble,
    whiten: (v, out) => factor.whiten(v, out),
    unwhiten: (w, out) => factor.unwhiten(w, out),
    stretch: (v, out) => factor.stretch(v, out),
  };
}
