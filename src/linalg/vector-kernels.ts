/**
 * Streaming vector kernels for the minimizers: inner products, scaled
 * updates and the fused update-and-inner-product pass of the L-BFGS
 * two-loop recursion, over vectors that all live in one workspace.
 *
 * Two engines compute the same formulas:
 * - `'wasm'` (the default where WebAssembly SIMD is available): the vectors
 *   are views of one `WebAssembly.Memory`, and each kernel is a WebAssembly
 *   loop over two-lane f64 vectors, four numbers per trip with two partial
 *   sums per reduction; the last (length mod 4) entries are done in
 *   JavaScript. At 9,000 coordinates one fused pass takes about a sixth of
 *   the time of the same loop in JavaScript (measured with Node 20), which
 *   is what keeps the minimizer's own work small beside the energy.
 * - `'js'`: plain loops over ordinary `Float64Array`s.
 *
 * Results agree to rounding: sums are accumulated in a different order
 * (four partial sums in `'wasm'`), elementwise results are identical. Each
 * engine is deterministic. Every array handed to a kernel must come from the
 * same workspace's {@link VectorWorkspace.vectors} (for `'wasm'` they are
 * addressed by their offset in its memory); lengths are those of the first
 * array. Kernels never allocate.
 * @module
 */
import { compileModule, F64, I32, instantiate, op, V128, type WasmFunction } from './wasm-encode.js';

/** Which implementation a workspace uses. */
export type VectorEngine = 'wasm' | 'js';

/** The kernels; every vector argument is a vector of the same workspace. */
export interface VectorKernels {
  readonly engine: VectorEngine;
  /** Σ aᵢ bᵢ. */
  dot(a: Float64Array, b: Float64Array): number;
  /** d ← d + c x; returns z · d (the new d). */
  axpyDot(d: Float64Array, c: number, x: Float64Array, z: Float64Array): number;
  /** d ← c g; returns z · d. */
  scaleDot(d: Float64Array, c: number, g: Float64Array, z: Float64Array): number;
  /** d ← d + c x. */
  axpy(d: Float64Array, c: number, x: Float64Array): void;
  /** d ← d + a x + b y (two updates in one pass). */
  axpy2(d: Float64Array, a: number, x: Float64Array, b: number, y: Float64Array): void;
  /** out ← a + c b. */
  axpyTo(out: Float64Array, a: Float64Array, c: number, b: Float64Array): void;
  /** d ← a g + b d. */
  combine(d: Float64Array, a: number, g: Float64Array, b: number): void;
  /** s ← xNew − xOld, y ← gNew − gOld; out[0] = sᵀy, out[1] = yᵀy. */
  differences(
    s: Float64Array,
    y: Float64Array,
    xNew: Float64Array,
    xOld: Float64Array,
    gNew: Float64Array,
    gOld: Float64Array,
    out: Float64Array,
  ): void;
  /** v ← c (v ⊙ h) (elementwise product, scaled). */
  multiplyScaled(v: Float64Array, h: Float64Array, c: number): void;
  /** v ← c v. */
  scale(v: Float64Array, c: number): void;
  /** Σ bᵢ sᵢ tᵢ. */
  weightedDot(b: Float64Array, s: Float64Array, t: Float64Array): number;
  /**
   * The diagonal BFGS update of the diagonal `scale`·b (see
   * `initial-matrix.ts`): with eᵢ = scale·bᵢ,
   * bᵢ ← eᵢ + yᵢ²·invSy − (eᵢsᵢ)²·invSBs, replaced by `base` where the result
   * is not > `floor` or not finite, and hᵢ ← 1 / bᵢ; returns Σ yᵢ² / bᵢ (new bᵢ).
   */
  diagonalUpdate(
    b: Float64Array,
    h: Float64Array,
    s: Float64Array,
    y: Float64Array,
    scale: number,
    invSy: number,
    invSBs: number,
    floor: number,
    base: number,
  ): number;
  /**
   * out[0] = the largest Euclidean norm of the triples (v₃ᵢ, v₃ᵢ₊₁, v₃ᵢ₊₂)
   * (NaN when v holds NaN), out[1] = their RMS, sqrt(Σ vᵢ² / ⌈n/3⌉); a
   * trailing group of 1 or 2 counts as a triple (as `maxAtomNorm` and
   * `rmsAtomNorm` in src/optimize/forces.ts).
   */
  atomNorms(v: Float64Array, out: Float64Array): void;
}

/** Vectors of one length and the kernels that work on them. */
export interface VectorWorkspace {
  /** `count` zero-filled vectors of length n. */
  readonly vectors: Float64Array<ArrayBuffer>[];
  readonly kernels: VectorKernels;
}

// ---- the JavaScript engine ----

/** The JavaScript engine's kernels (they work on any `Float64Array`s). */
export const jsKernels: VectorKernels = {
  engine: 'js',
  dot(a, b) {
    let s = 0;
    for (let i = 0; i < a.length; i++) s += a[i] * b[i];
    return s;
  },
  axpyDot(d, c, x, z) {
    let s = 0;
    for (let i = 0; i < d.length; i++) {
      const v = d[i] + c * x[i];
      d[i] = v;
      s += z[i] * v;
    }
    return s;
  },
  scaleDot(d, c, g, z) {
    let s = 0;
    for (let i = 0; i < d.length; i++) {
      const v = c * g[i];
      d[i] = v;
      s += z[i] * v;
    }
    return s;
  },
  axpy(d, c, x) {
    for (let i = 0; i < d.length; i++) d[i] += c * x[i];
  },
  axpy2(d, a, x, b, y) {
    for (let i = 0; i < d.length; i++) d[i] += a * x[i] + b * y[i];
  },
  axpyTo(out, a, c, b) {
    for (let i = 0; i < out.length; i++) out[i] = a[i] + c * b[i];
  },
  combine(d, a, g, b) {
    for (let i = 0; i < d.length; i++) d[i] = a * g[i] + b * d[i];
  },
  differences(s, y, xNew, xOld, gNew, gOld, out) {
    differencesTail(s, y, xNew, xOld, gNew, gOld, out, 0, 0, 0);
  },
  multiplyScaled(v, h, c) {
    for (let i = 0; i < v.length; i++) v[i] = c * (v[i] * h[i]);
  },
  scale(v, c) {
    for (let i = 0; i < v.length; i++) v[i] = c * v[i];
  },
  weightedDot(b, s, t) {
    let r = 0;
    for (let i = 0; i < b.length; i++) r += b[i] * s[i] * t[i];
    return r;
  },
  diagonalUpdate(b, h, s, y, scale, invSy, invSBs, floor, base) {
    return diagonalTail(b, h, s, y, scale, invSy, invSBs, floor, base, 0, b.length);
  },
  atomNorms(v, out) {
    atomNormsTail(v, out, 0, 0, 0);
  },
};

/** {@link VectorKernels.differences} from entry `from` on, given the sums so far. */
function differencesTail(
  s: Float64Array,
  y: Float64Array,
  xNew: Float64Array,
  xOld: Float64Array,
  gNew: Float64Array,
  gOld: Float64Array,
  out: Float64Array,
  from: number,
  sySoFar: number,
  yySoFar: number,
): void {
  let sy = sySoFar;
  let yy = yySoFar;
  for (let i = from; i < s.length; i++) {
    const si = xNew[i] - xOld[i];
    const yi = gNew[i] - gOld[i];
    s[i] = si;
    y[i] = yi;
    sy += si * yi;
    yy += yi * yi;
  }
  out[0] = sy;
  out[1] = yy;
}

/** The diagonal update over entries [from, to); returns its part of Σ yᵢ² / bᵢ. */
function diagonalTail(
  b: Float64Array,
  h: Float64Array,
  s: Float64Array,
  y: Float64Array,
  scale: number,
  invSy: number,
  invSBs: number,
  floor: number,
  base: number,
  from: number,
  to: number,
): number {
  let r = 0;
  for (let i = from; i < to; i++) {
    const e = scale * b[i];
    const es = e * s[i];
    const yy = y[i] * y[i];
    const next = e + yy * invSy - es * es * invSBs;
    const v = next > floor && next < Infinity ? next : base;
    b[i] = v;
    h[i] = 1 / v;
    r += yy / v;
  }
  return r;
}

/** Finishes {@link VectorKernels.atomNorms} from triple `from` on, given the largest square and the sum so far. */
function atomNormsTail(v: Float64Array, out: Float64Array, from: number, largest: number, sum: number): void {
  const n = v.length;
  let m = largest;
  let t = sum;
  for (let i = from; i < n; i += 3) {
    const a = v[i];
    const b = i + 1 < n ? v[i + 1] : 0;
    const c = i + 2 < n ? v[i + 2] : 0;
    const q = a * a + b * b + c * c;
    m = q !== q || m !== m ? NaN : Math.max(m, q);
    t += q;
  }
  out[0] = Math.sqrt(m);
  out[1] = n === 0 ? 0 : Math.sqrt(t / Math.ceil(n / 3));
}

// ---- the WebAssembly engine ----

/**
 * One streaming loop over byte offsets [0, bytes) of `pointers` arrays, 32
 * bytes (four numbers) per trip as two halves of two lanes each. Parameters:
 * the pointers (i32 byte addresses), the length in bytes (i32, a multiple of
 * 32), then `scalars` f64 values (available splatted). Up to two sums; the
 * first is returned, the second stored as f64 at address 8.
 */
interface Stream {
  name: string;
  pointers: number;
  scalars: number;
  sums: number;
  temps: number;
  /** One half: `offset` is 0 or 16, `half` 0 or 1. */
  step: (c: StreamContext, offset: number, half: number) => number[];
}

interface StreamContext {
  load(pointer: number, offset: number): number[];
  /** Push the address of `pointer` at the current trip (then the value, then `store`). */
  address(pointer: number): number[];
  store(offset: number): number[];
  scalar(j: number): number[];
  /** Local index of sum r for this half. */
  sum(r: number, half: number): number;
  temp(t: number): number;
}

function stream(spec: Stream): WasmFunction {
  const { pointers, scalars, sums, temps } = spec;
  const bytes = pointers;
  const firstScalar = pointers + 1;
  const at = firstScalar + scalars; // byte index local
  const splat0 = at + 1;
  const sum0 = splat0 + scalars;
  const temp0 = sum0 + 2 * sums;
  const locals = [I32, ...new Array<number>(scalars + 2 * sums + temps).fill(V128)];
  const ctx: StreamContext = {
    load: (p, offset) => [...op.localGet(p), ...op.localGet(at), ...op.i32Add, ...op.v128Load(offset)],
    address: (p) => [...op.localGet(p), ...op.localGet(at), ...op.i32Add],
    store: (offset) => op.v128Store(offset),
    scalar: (j) => op.localGet(splat0 + j),
    sum: (r, half) => sum0 + 2 * r + half,
    temp: (t) => temp0 + t,
  };
  const body: number[] = [];
  for (let j = 0; j < scalars; j++) body.push(...op.localGet(firstScalar + j), ...op.f64x2Splat, ...op.localSet(splat0 + j));
  for (let r = 0; r < 2 * sums; r++) body.push(...op.v128Zero, ...op.localSet(sum0 + r));
  body.push(...op.block, ...op.localGet(bytes), ...op.i32Eqz, ...op.brIf(0), ...op.loop);
  body.push(...spec.step(ctx, 0, 0), ...spec.step(ctx, 16, 1));
  body.push(...op.localGet(at), ...op.i32Const(32), ...op.i32Add, ...op.localTee(at), ...op.localGet(bytes), ...op.i32LtU, ...op.brIf(0));
  body.push(...op.end, ...op.end);
  const reduce = (r: number): number[] => [
    ...op.localGet(sum0 + 2 * r),
    ...op.localGet(sum0 + 2 * r + 1),
    ...op.f64x2Add,
    ...op.localTee(sum0 + 2 * r),
    ...op.f64x2ExtractLane(0),
    ...op.localGet(sum0 + 2 * r),
    ...op.f64x2ExtractLane(1),
    ...op.f64Add,
  ];
  if (sums === 2) body.push(...op.i32Const(8), ...reduce(1), ...op.f64Store(0));
  if (sums >= 1) body.push(...reduce(0));
  return {
    name: spec.name,
    params: [...new Array<number>(pointers).fill(I32), I32, ...new Array<number>(scalars).fill(F64)],
    results: sums >= 1 ? [F64] : [],
    locals,
    body,
  };
}

const { f64x2Add: add, f64x2Sub: sub, f64x2Mul: mul, f64x2Div: div, localGet: get, localSet: set, localTee: tee } = op;

/** acc(r) ← acc(r) + value. */
const accumulate = (c: StreamContext, r: number, half: number, value: number[]): number[] => [
  ...get(c.sum(r, half)),
  ...value,
  ...add,
  ...set(c.sum(r, half)),
];

const STREAMS: Stream[] = [
  {
    name: 'dot', pointers: 2, scalars: 0, sums: 1, temps: 0,
    step: (c, o, h) => accumulate(c, 0, h, [...c.load(0, o), ...c.load(1, o), ...mul]),
  },
  {
    // (d, x, z; c): d ← d + c x; Σ z d
    name: 'axpyDot', pointers: 3, scalars: 1, sums: 1, temps: 1,
    step: (c, o, h) => [
      ...c.address(0), ...c.load(0, o), ...c.scalar(0), ...c.load(1, o), ...mul, ...add, ...tee(c.temp(0)), ...c.store(o),
      ...accumulate(c, 0, h, [...c.load(2, o), ...get(c.temp(0)), ...mul]),
    ],
  },
  {
    // (d, g, z; c): d ← c g; Σ z d
    name: 'scaleDot', pointers: 3, scalars: 1, sums: 1, temps: 1,
    step: (c, o, h) => [
      ...c.address(0), ...c.scalar(0), ...c.load(1, o), ...mul, ...tee(c.temp(0)), ...c.store(o),
      ...accumulate(c, 0, h, [...c.load(2, o), ...get(c.temp(0)), ...mul]),
    ],
  },
  {
    // (d, x; c): d ← d + c x
    name: 'axpy', pointers: 2, scalars: 1, sums: 0, temps: 0,
    step: (c, o) => [...c.address(0), ...c.load(0, o), ...c.scalar(0), ...c.load(1, o), ...mul, ...add, ...c.store(o)],
  },
  {
    // (d, x, y; a, b): d ← d + (a x + b y)
    name: 'axpy2', pointers: 3, scalars: 2, sums: 0, temps: 0,
    step: (c, o) => [
      ...c.address(0), ...c.load(0, o),
      ...c.scalar(0), ...c.load(1, o), ...mul, ...c.scalar(1), ...c.load(2, o), ...mul, ...add,
      ...add, ...c.store(o),
    ],
  },
  {
    // (out, a, b; c): out ← a + c b
    name: 'axpyTo', pointers: 3, scalars: 1, sums: 0, temps: 0,
    step: (c, o) => [...c.address(0), ...c.load(1, o), ...c.scalar(0), ...c.load(2, o), ...mul, ...add, ...c.store(o)],
  },
  {
    // (d, g; a, b): d ← a g + b d
    name: 'combine', pointers: 2, scalars: 2, sums: 0, temps: 0,
    step: (c, o) => [...c.address(0), ...c.scalar(0), ...c.load(1, o), ...mul, ...c.scalar(1), ...c.load(0, o), ...mul, ...add, ...c.store(o)],
  },
  {
    // (s, y, xNew, xOld, gNew, gOld): s ← xNew − xOld, y ← gNew − gOld; Σ s y, Σ y y
    name: 'differences', pointers: 6, scalars: 0, sums: 2, temps: 2,
    step: (c, o, h) => [
      ...c.address(0), ...c.load(2, o), ...c.load(3, o), ...sub, ...tee(c.temp(0)), ...c.store(o),
      ...c.address(1), ...c.load(4, o), ...c.load(5, o), ...sub, ...tee(c.temp(1)), ...c.store(o),
      ...accumulate(c, 0, h, [...get(c.temp(0)), ...get(c.temp(1)), ...mul]),
      ...accumulate(c, 1, h, [...get(c.temp(1)), ...get(c.temp(1)), ...mul]),
    ],
  },
  {
    // (v, h; c): v ← c (v h)
    name: 'multiplyScaled', pointers: 2, scalars: 1, sums: 0, temps: 0,
    step: (c, o) => [...c.address(0), ...c.scalar(0), ...c.load(0, o), ...c.load(1, o), ...mul, ...mul, ...c.store(o)],
  },
  {
    name: 'scale', pointers: 1, scalars: 1, sums: 0, temps: 0,
    step: (c, o) => [...c.address(0), ...c.scalar(0), ...c.load(0, o), ...mul, ...c.store(o)],
  },
  {
    name: 'weightedDot', pointers: 3, scalars: 0, sums: 1, temps: 0,
    step: (c, o, h) => accumulate(c, 0, h, [...c.load(0, o), ...c.load(1, o), ...mul, ...c.load(2, o), ...mul]),
  },
  {
    // (b, h, s, y; scale, invSy, invSBs, floor, base, one, infinity)
    name: 'diagonalUpdate', pointers: 4, scalars: 7, sums: 1, temps: 4,
    step: (c, o, h) => [
      // t3 = scale b, t0 = t3 s, t1 = y y
      ...c.scalar(0), ...c.load(0, o), ...mul, ...set(c.temp(3)),
      ...get(c.temp(3)), ...c.load(2, o), ...mul, ...set(c.temp(0)),
      ...c.load(3, o), ...c.load(3, o), ...mul, ...set(c.temp(1)),
      // t2 = t3 + t1 invSy − t0 t0 invSBs
      ...get(c.temp(3)), ...get(c.temp(1)), ...c.scalar(1), ...mul, ...add,
      ...get(c.temp(0)), ...get(c.temp(0)), ...mul, ...c.scalar(2), ...mul, ...sub, ...set(c.temp(2)),
      // t2 = (t2 > floor && t2 < ∞) ? t2 : base
      ...get(c.temp(2)), ...c.scalar(4),
      ...get(c.temp(2)), ...c.scalar(3), ...op.f64x2Gt, ...get(c.temp(2)), ...c.scalar(6), ...op.f64x2Lt, ...op.v128And,
      ...op.v128Bitselect, ...set(c.temp(2)),
      ...c.address(0), ...get(c.temp(2)), ...c.store(o),
      ...c.address(1), ...c.scalar(5), ...get(c.temp(2)), ...div, ...c.store(o),
      ...accumulate(c, 0, h, [...get(c.temp(1)), ...get(c.temp(2)), ...div]),
    ],
  },
];

/** Raw exports: byte addresses and byte lengths, see {@link Stream}. */
interface WasmExports {
  dot(a: number, b: number, bytes: number): number;
  axpyDot(d: number, x: number, z: number, bytes: number, c: number): number;
  scaleDot(d: number, g: number, z: number, bytes: number, c: number): number;
  axpy(d: number, x: number, bytes: number, c: number): void;
  axpy2(d: number, x: number, y: number, bytes: number, a: number, b: number): void;
  axpyTo(out: number, a: number, b: number, bytes: number, c: number): void;
  combine(d: number, g: number, bytes: number, a: number, b: number): void;
  differences(s: number, y: number, xn: number, xo: number, gn: number, go: number, bytes: number): number;
  multiplyScaled(v: number, h: number, bytes: number, c: number): void;
  scale(v: number, bytes: number, c: number): void;
  weightedDot(b: number, s: number, t: number, bytes: number): number;
  diagonalUpdate(
    b: number, h: number, s: number, y: number, bytes: number,
    scale: number, invSy: number, invSBs: number, floor: number, base: number, one: number, inf: number,
  ): number;
  atomNorms(v: number, bytes: number): number;
}

/**
 * (v, bytes) → the largest of x² + y² + z² over the triples in [0, bytes)
 * (NaN propagates through f64.max), with Σ stored as f64 at address 8.
 */
function atomNormsFunction(): WasmFunction {
  const V = 0, BYTES = 1, AT = 2, LARGEST = 3, SUM = 4, SQ = 5, A = 6;
  const square = (offset: number): number[] => [...get(V), ...get(AT), ...op.i32Add, ...op.f64Load(offset), ...op.localTee(A), ...get(A), ...op.f64Mul];
  return {
    name: 'atomNorms',
    params: [I32, I32],
    results: [F64],
    locals: [I32, F64, F64, F64, F64],
    body: [
      ...op.block, ...get(BYTES), ...op.i32Eqz, ...op.brIf(0), ...op.loop,
      ...square(0), ...square(8), ...op.f64Add, ...square(16), ...op.f64Add, ...set(SQ),
      ...get(LARGEST), ...get(SQ), ...op.f64Max, ...set(LARGEST),
      ...get(SUM), ...get(SQ), ...op.f64Add, ...set(SUM),
      ...get(AT), ...op.i32Const(24), ...op.i32Add, ...op.localTee(AT), ...get(BYTES), ...op.i32LtU, ...op.brIf(0),
      ...op.end, ...op.end,
      ...op.i32Const(8), ...get(SUM), ...op.f64Store(0),
      ...get(LARGEST),
    ],
  };
}

let compiled: object | null | undefined;

/** The compiled module, or null where WebAssembly (with SIMD) is not available. */
function wasmModule(): object | null {
  if (compiled === undefined) compiled = compileModule([...STREAMS.map(stream), atomNormsFunction()]);
  return compiled;
}

/** Whether the `'wasm'` engine can be used here. */
export function wasmKernelsAvailable(): boolean {
  return wasmModule() !== null;
}

/** Bytes reserved at the start of the memory (the second sum of a kernel is stored at 8). */
const RESERVED = 64;

function wasmWorkspace(module: object, n: number, count: number): VectorWorkspace | null {
  // Each vector starts on a 64-byte boundary.
  const stride = Math.ceil((8 * n) / 64) * 64;
  const made = instantiate(module, RESERVED + stride * count);
  if (made === null) return null; // e.g. more memory than the engine allows: use the JS engine
  const w = made.exports as WasmExports;
  const buffer = made.buffer;
  const vectors: Float64Array<ArrayBuffer>[] = [];
  for (let k = 0; k < count; k++) vectors.push(new Float64Array(buffer, RESERVED + k * stride, n));
  const second = new Float64Array(buffer, 8, 1);
  const body = n & ~3; // done in WebAssembly; the rest here
  const bytes = 8 * body;
  const triples = n - (n % 3); // atomNorms: whole triples in WebAssembly
  const tripleBytes = 8 * triples;
  const kernels: VectorKernels = {
    engine: 'wasm',
    dot(a, b) {
      let s = w.dot(a.byteOffset, b.byteOffset, bytes);
      for (let i = body; i < n; i++) s += a[i] * b[i];
      return s;
    },
    axpyDot(d, c, x, z) {
      let s = w.axpyDot(d.byteOffset, x.byteOffset, z.byteOffset, bytes, c);
      for (let i = body; i < n; i++) {
        const v = d[i] + c * x[i];
        d[i] = v;
        s += z[i] * v;
      }
      return s;
    },
    scaleDot(d, c, g, z) {
      let s = w.scaleDot(d.byteOffset, g.byteOffset, z.byteOffset, bytes, c);
      for (let i = body; i < n; i++) {
        const v = c * g[i];
        d[i] = v;
        s += z[i] * v;
      }
      return s;
    },
    axpy(d, c, x) {
      w.axpy(d.byteOffset, x.byteOffset, bytes, c);
      for (let i = body; i < n; i++) d[i] += c * x[i];
    },
    axpy2(d, a, x, b, y) {
      w.axpy2(d.byteOffset, x.byteOffset, y.byteOffset, bytes, a, b);
      for (let i = body; i < n; i++) d[i] += a * x[i] + b * y[i];
    },
    axpyTo(out, a, c, b) {
      w.axpyTo(out.byteOffset, a.byteOffset, b.byteOffset, bytes, c);
      for (let i = body; i < n; i++) out[i] = a[i] + c * b[i];
    },
    combine(d, a, g, b) {
      w.combine(d.byteOffset, g.byteOffset, bytes, a, b);
      for (let i = body; i < n; i++) d[i] = a * g[i] + b * d[i];
    },
    differences(s, y, xNew, xOld, gNew, gOld, out) {
      const sy = w.differences(s.byteOffset, y.byteOffset, xNew.byteOffset, xOld.byteOffset, gNew.byteOffset, gOld.byteOffset, bytes);
      differencesTail(s, y, xNew, xOld, gNew, gOld, out, body, sy, second[0]);
    },
    multiplyScaled(v, h, c) {
      w.multiplyScaled(v.byteOffset, h.byteOffset, bytes, c);
      for (let i = body; i < n; i++) v[i] = c * (v[i] * h[i]);
    },
    scale(v, c) {
      w.scale(v.byteOffset, bytes, c);
      for (let i = body; i < n; i++) v[i] = c * v[i];
    },
    weightedDot(b, s, t) {
      let r = w.weightedDot(b.byteOffset, s.byteOffset, t.byteOffset, bytes);
      for (let i = body; i < n; i++) r += b[i] * s[i] * t[i];
      return r;
    },
    diagonalUpdate(b, h, s, y, scale, invSy, invSBs, floor, base) {
      const r = w.diagonalUpdate(b.byteOffset, h.byteOffset, s.byteOffset, y.byteOffset, bytes, scale, invSy, invSBs, floor, base, 1, Infinity);
      return r + diagonalTail(b, h, s, y, scale, invSy, invSBs, floor, base, body, n);
    },
    atomNorms(v, out) {
      const largest = w.atomNorms(v.byteOffset, tripleBytes);
      atomNormsTail(v, out, triples, largest, second[0]);
    },
  };
  return { vectors, kernels };
}

/**
 * `count` vectors of length `n` and the kernels over them. `engine` defaults
 * to `'wasm'` where available; when the WebAssembly engine cannot be set up
 * (no WebAssembly, no SIMD, or not enough memory for it) the JavaScript
 * engine is used, so check `kernels.engine` to see which one you got.
 */
export function vectorWorkspace(n: number, count: number, engine: VectorEngine = 'wasm'): VectorWorkspace {
  if (engine === 'wasm' && n >= 4) {
    const module = wasmModule();
    const ws = module === null ? null : wasmWorkspace(module, n, count);
    if (ws !== null) return ws;
  }
  const vectors: Float64Array<ArrayBuffer>[] = [];
  for (let k = 0; k < count; k++) vectors.push(new Float64Array(n));
  return { vectors, kernels: jsKernels };
}
