/**
 * The WebAssembly vector kernels (src/linalg/vector-kernels.ts) against the
 * plain JavaScript loops, and against sums computed here in a different way
 * (exact on small integers).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { encodeModule, sleb, uleb } from '../../src/linalg/wasm-encode.js';
import { maxAtomNorm, rmsAtomNorm } from '../../src/optimize/forces.js';
import { jsKernels, vectorWorkspace, wasmKernelsAvailable, type VectorWorkspace } from '../../src/linalg/vector-kernels.js';

/** Runs every kernel once on the workspace's first eight vectors; returns the scalars and copies of the vectors. */
function runAll(ws: VectorWorkspace): { scalars: number[]; vectors: number[][] } {
  const k = ws.kernels;
  const [a, b, c, d, e, f, g, h] = ws.vectors;
  const out = new Float64Array(2);
  const scalars: number[] = [];
  scalars.push(k.dot(a, b));
  scalars.push(k.axpyDot(c, 0.7, a, b));
  scalars.push(k.scaleDot(d, -1.3, a, c));
  k.axpy(e, 0.25, d);
  k.axpy2(e, -0.5, a, 1.5, b);
  k.axpyTo(f, a, 2.5, e);
  k.combine(g, -1, f, 0.5);
  k.differences(h, e, a, b, c, d, out);
  scalars.push(out[0], out[1]);
  k.multiplyScaled(a, b, 0.5);
  k.scale(b, 3);
  scalars.push(k.weightedDot(a, b, c));
  // some entries of the updated diagonal fall below the floor and take the base value
  for (let i = 0; i < c.length; i++) c[i] = Math.abs(c[i]) - (i % 5 === 0 ? 10 : 0);
  scalars.push(k.diagonalUpdate(c, d, a, b, 1.5, 0.9, 1.1, 1e-3, 7));
  k.atomNorms(e, out);
  scalars.push(out[0], out[1]);
  return { scalars, vectors: ws.vectors.map((v) => Array.from(v)) };
}

function fill(ws: VectorWorkspace, values: number[]): void {
  let p = 0;
  for (const v of ws.vectors) for (let i = 0; i < v.length; i++) v[i] = values[p++ % values.length];
}

describe('vector kernels', () => {
  it('compile here: Node 20 has WebAssembly SIMD (the speed of the minimizers relies on it)', () => {
    expect(wasmKernelsAvailable()).toBe(true);
    expect(vectorWorkspace(12, 2).kernels.engine).toBe('wasm');
  });

  it('fall back to JavaScript for fewer than 4 numbers and on request', () => {
    expect(vectorWorkspace(3, 2).kernels.engine).toBe('js');
    expect(vectorWorkspace(100, 2, 'js').kernels).toBe(jsKernels);
  });

  it('give zero-filled vectors of the asked length that do not overlap', () => {
    const ws = vectorWorkspace(13, 3);
    for (const v of ws.vectors) {
      expect(v.length).toBe(13);
      expect(Array.from(v).every((x) => x === 0)).toBe(true);
    }
    ws.vectors[0].fill(1);
    ws.vectors[2].fill(3);
    expect(Array.from(ws.vectors[1]).every((x) => x === 0)).toBe(true);
  });

  it('agree with the JavaScript engine: elementwise results identical, sums to rounding', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 4, max: 70 }),
        fc.array(fc.double({ min: -10, max: 10, noNaN: true }), { minLength: 1, maxLength: 50 }),
        (n, values) => {
          const wasm = vectorWorkspace(n, 8);
          const js = vectorWorkspace(n, 8, 'js');
          fill(wasm, values);
          fill(js, values);
          const w = runAll(wasm);
          const j = runAll(js);
          // The scalars feed the later kernels, so vectors may differ by rounding too.
          for (let s = 0; s < w.scalars.length; s++) {
            const scale = Math.max(1, Math.abs(j.scalars[s]));
            expect(Math.abs(w.scalars[s] - j.scalars[s])).toBeLessThanOrEqual(1e-12 * scale * n);
          }
          for (let v = 0; v < 8; v++) {
            for (let i = 0; i < n; i++) {
              const scale = Math.max(1, Math.abs(j.vectors[v][i]));
              expect(Math.abs(w.vectors[v][i] - j.vectors[v][i])).toBeLessThanOrEqual(1e-12 * scale * n);
            }
          }
        },
      ),
      { numRuns: 150 },
    );
  });

  it('sum exactly on small integers, for every length mod 4 (the JavaScript tail)', () => {
    for (const n of [4, 5, 6, 7, 8, 9, 1001, 1002, 1003]) {
      const ws = vectorWorkspace(n, 4);
      const [a, b, c, d] = ws.vectors;
      for (let i = 0; i < n; i++) {
        a[i] = (i % 7) - 3;
        b[i] = (i % 5) - 2;
      }
      let expected = 0;
      for (let i = 0; i < n; i++) expected += ((i % 7) - 3) * ((i % 5) - 2);
      expect(ws.kernels.dot(a, b)).toBe(expected);
      // c = 2a, then c + 1·b dotted with a: Σ (2a + b) a
      expect(ws.kernels.scaleDot(c, 2, a, a)).toBe(2 * ws.kernels.dot(a, a));
      const out = new Float64Array(2);
      ws.kernels.differences(c, d, a, b, b, a, out); // s = a − b, y = b − a
      let sy = 0;
      for (let i = 0; i < n; i++) sy -= (a[i] - b[i]) ** 2;
      expect(out[0]).toBe(sy);
      expect(out[1]).toBe(-sy);
      expect(d[n - 1]).toBe(b[n - 1] - a[n - 1]);
    }
  });

  it('the diagonal update replaces non-finite and too small entries by the base value', () => {
    for (const engine of ['wasm', 'js'] as const) {
      const ws = vectorWorkspace(8, 4, engine);
      const [b, s, y, h] = ws.vectors;
      b.set([1, 1, 1, 1, 1, 1, 1, 1]);
      s.set([0, 0, 0, 0, 1e200, 0, 0, 0]);
      y.set([0, 1, 0, Infinity, 0, 0, 0, 0]);
      // entry 3: y² = ∞ → base; entry 4: (b s)² = ∞ → −∞ → base
      const r = ws.kernels.diagonalUpdate(b, h, s, y, 1, 1, 1, 0.5, 7);
      expect(Array.from(b)).toEqual([1, 2, 1, 7, 7, 1, 1, 1]);
      expect(Array.from(h)).toEqual([1, 0.5, 1, 1 / 7, 1 / 7, 1, 1, 1]);
      expect(r).toBe(Infinity); // y₃² / 7
    }
  });
});

describe('atomNorms', () => {
  it('equals maxAtomNorm and rmsAtomNorm (src/optimize/forces.ts) for every length, NaN included', () => {
    for (const engine of ['wasm', 'js'] as const) {
      for (let n = 1; n <= 14; n++) {
        const ws = vectorWorkspace(n, 1, engine);
        const [v] = ws.vectors;
        for (let i = 0; i < n; i++) v[i] = ((i * 7) % 11) - 5;
        const out = new Float64Array(2);
        ws.kernels.atomNorms(v, out);
        expect(out[0]).toBe(maxAtomNorm(v));
        expect(out[1]).toBeCloseTo(rmsAtomNorm(v), 14);
        v[n - 1] = NaN;
        ws.kernels.atomNorms(v, out);
        expect(out[0]).toBeNaN();
        if (n > 3) {
          v[n - 1] = 0;
          v[0] = NaN; // a NaN before later finite atoms is not lost
          ws.kernels.atomNorms(v, out);
          expect(out[0]).toBeNaN();
        }
      }
    }
  });
});

describe('the WebAssembly encoder', () => {
  it('LEB128 as in the specification (Core 2.0, 5.2.2)', () => {
    expect(uleb(0)).toEqual([0]);
    expect(uleb(127)).toEqual([0x7f]);
    expect(uleb(128)).toEqual([0x80, 0x01]);
    expect(uleb(624485)).toEqual([0xe5, 0x8e, 0x26]); // the worked example of the LEB128 article, from memory
    expect(sleb(-1)).toEqual([0x7f]);
    expect(sleb(63)).toEqual([0x3f]);
    expect(sleb(64)).toEqual([0xc0, 0x00]);
    expect(sleb(-123456)).toEqual([0xc0, 0xbb, 0x78]); // from memory, same article
  });
  it('an empty module is the 8-byte header plus the memory import', () => {
    const bytes = encodeModule([]);
    expect(Array.from(bytes.subarray(0, 8))).toEqual([0x00, 0x61, 0x73, 0x6d, 1, 0, 0, 0]);
    expect(() => new (globalThis as unknown as { WebAssembly: { Module: new (b: Uint8Array) => object } }).WebAssembly.Module(bytes)).not.toThrow();
  });
});
