import { describe, expect, it } from 'vitest';
import { BlockCholesky } from '../../src/linalg/block-cholesky.js';
import { createRandom, type Random } from '../helpers/random.js';

/** A random SPD block matrix on a random sparse atom graph: A = Σ over pairs of (random 6×6 Gram blocks) + shift. */
function randomSpd(rand: Random, atoms: number, edges: number) {
  const pairs: number[] = [];
  for (let e = 0; e < edges; e++) {
    const i = rand.int(0, atoms - 1);
    const j = rand.int(0, atoms - 1);
    if (i !== j) pairs.push(i, j);
  }
  const n = 3 * atoms;
  const dense = new Float64Array(n * n);
  const diagonal = new Float64Array(9 * atoms);
  const off = new Float64Array(9 * (pairs.length / 2));
  for (let q = 0; q < pairs.length / 2; q++) {
    const i = pairs[2 * q];
    const j = pairs[2 * q + 1];
    // v vᵀ for a random 6-vector v over the two atoms: positive semidefinite
    const v = Array.from({ length: 6 }, () => rand.uniform(-1, 1));
    const idx = [3 * i, 3 * i + 1, 3 * i + 2, 3 * j, 3 * j + 1, 3 * j + 2];
    for (let r = 0; r < 6; r++) for (let c = 0; c < 6; c++) dense[idx[r] * n + idx[c]] += v[r] * v[c];
    for (let r = 0; r < 3; r++) for (let c = 0; c < 3; c++) {
      diagonal[9 * i + 3 * r + c] += v[r] * v[c];
      diagonal[9 * j + 3 * r + c] += v[3 + r] * v[3 + c];
      off[9 * q + 3 * r + c] += v[r] * v[3 + c];
    }
  }
  for (let a = 0; a < atoms; a++) for (let p = 0; p < 3; p++) {
    dense[(3 * a + p) * n + 3 * a + p] += 0.1;
    diagonal[9 * a + 4 * p] += 0.1;
  }
  return { pairs: Int32Array.from(pairs), dense, diagonal, off, n };
}

function multiply(dense: Float64Array, n: number, v: Float64Array): Float64Array {
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let s = 0;
    for (let j = 0; j < n; j++) s += dense[i * n + j] * v[j];
    out[i] = s;
  }
  return out;
}

describe('BlockCholesky', () => {
  it('solves P u = b on random sparse SPD block matrices (residual at rounding level)', () => {
    const rand = createRandom(2024);
    for (let trial = 0; trial < 40; trial++) {
      const atoms = rand.int(1, 30);
      const { pairs, dense, diagonal, off, n } = randomSpd(rand, atoms, rand.int(0, 3 * atoms));
      const f = new BlockCholesky(atoms, pairs);
      expect(f.factor(diagonal, pairs, off)).toBe(true);
      const b = Float64Array.from({ length: n }, () => rand.uniform(-1, 1));
      const w = new Float64Array(n);
      const u = new Float64Array(n);
      f.whiten(b, w);
      f.unwhiten(w, u); // u = P⁻¹ b
      const r = multiply(dense, n, u);
      let err = 0;
      let scale = 0;
      for (let i = 0; i < n; i++) {
        err = Math.max(err, Math.abs(r[i] - b[i]));
        scale = Math.max(scale, Math.abs(b[i]));
      }
      expect(err).toBeLessThan(1e-9 * scale);
    }
  });

  it('whiten, stretch and unwhiten are L⁻¹Π, LᵀΠ and ΠᵀL⁻ᵀ: ‖whiten(v)‖² = vᵀP⁻¹v and ‖stretch(v)‖² = vᵀPv', () => {
    const rand = createRandom(7);
    for (let trial = 0; trial < 20; trial++) {
      const atoms = rand.int(2, 20);
      const { pairs, dense, diagonal, off, n } = randomSpd(rand, atoms, 2 * atoms);
      const f = new BlockCholesky(atoms, pairs);
      expect(f.factor(diagonal, pairs, off)).toBe(true);
      const v = Float64Array.from({ length: n }, () => rand.uniform(-1, 1));
      const w = new Float64Array(n);
      const s = new Float64Array(n);
      const u = new Float64Array(n);
      f.whiten(v, w);
      f.stretch(v, s);
      const ww = w.reduce((a, x) => a + x * x, 0);
      const ss = s.reduce((a, x) => a + x * x, 0);
      const Pv = multiply(dense, n, v);
      const vPv = v.reduce((a, x, i) => a + x * Pv[i], 0);
      f.unwhiten(Float64Array.from(w), u);
      const vPinvv = v.reduce((a, x, i) => a + x * u[i], 0);
      expect(Math.abs(ss - vPv)).toBeLessThan(1e-10 * vPv);
      expect(Math.abs(ww - vPinvv)).toBeLessThan(1e-10 * vPinvv);
      // unwhiten(whiten(·)) composed with P gives back the vector: stretch then unwhiten of whiten is identity on LᵀΠ
      f.unwhiten(Float64Array.from(s), u); // Πᵀ L⁻ᵀ Lᵀ Π v = v
      for (let i = 0; i < n; i++) expect(u[i]).toBeCloseTo(v[i], 10);
    }
  });

  it('creates no fill on a path (a chain of atoms) and keeps the order deterministic', () => {
    const atoms = 50;
    const pairs = new Int32Array(2 * (atoms - 1));
    for (let a = 0; a + 1 < atoms; a++) {
      pairs[2 * a] = a;
      pairs[2 * a + 1] = a + 1;
    }
    const f = new BlockCholesky(atoms, pairs);
    expect(f.storedBlocks).toBe(atoms - 1);
    expect(Array.from(new BlockCholesky(atoms, pairs).order)).toEqual(Array.from(f.order));
    expect(new Set(f.order).size).toBe(atoms);
  });

  it('refuses a matrix that is not positive definite', () => {
    const pairs = new Int32Array([0, 1]);
    const f = new BlockCholesky(2, pairs);
    const diagonal = new Float64Array(18);
    for (let p = 0; p < 3; p++) {
      diagonal[4 * p] = 1;
      diagonal[9 + 4 * p] = 1;
    }
    const off = new Float64Array(9);
    off[0] = 2; // |off| > diagonal: indefinite
    expect(f.factor(diagonal, pairs, off)).toBe(false);
    off[0] = 0.5;
    expect(f.factor(diagonal, pairs, off)).toBe(true);
  });
});

describe('BlockCholesky: WebAssembly and JavaScript sweeps', () => {
  it('give identical results (the same formulas in the same order)', () => {
    const rand = createRandom(77);
    for (const atoms of [1, 2, 7, 40]) {
      const { pairs, diagonal, off, n } = randomSpd(rand, atoms, 3 * atoms);
      const w = new BlockCholesky(atoms, pairs, 'wasm');
      const j = new BlockCholesky(atoms, pairs, 'js');
      expect(w.factor(diagonal, pairs, off)).toBe(true);
      expect(j.factor(diagonal, pairs, off)).toBe(true);
      const v = Float64Array.from({ length: n }, () => rand.uniform(-1, 1));
      const [a, b, c, d, e, f] = Array.from({ length: 6 }, () => new Float64Array(n));
      w.whiten(v, a);
      j.whiten(v, b);
      expect(Array.from(a)).toEqual(Array.from(b));
      w.unwhiten(Float64Array.from(v), c);
      j.unwhiten(Float64Array.from(v), d);
      expect(Array.from(c)).toEqual(Array.from(d));
      w.stretch(v, e);
      j.stretch(v, f);
      expect(Array.from(e)).toEqual(Array.from(f));
      // and unwhiten ∘ stretch is the identity to rounding (Πᵀ L⁻ᵀ Lᵀ Π v = v)
      w.unwhiten(e, a);
      for (let i = 0; i < n; i++) expect(a[i]).toBeCloseTo(v[i], 10);
    }
  });
});
