/**
 * The two triangular sweeps of {@link BlockCholesky} (forward with L, then
 * backward with Lᵀ, each with the elimination-order permutation) as
 * WebAssembly loops, built at load time with src/linalg/wasm-encode.ts.
 *
 * They are the same scalar formulas as the JavaScript sweeps in
 * block-cholesky.ts, in the same order, so the results are identical to the
 * bit (IEEE 754 double arithmetic, no fused multiply-add in WebAssembly);
 * they run without bounds checks, which on a molecule of 3,000 atoms makes
 * each sweep about twice as fast (measured with Node 20).
 *
 * Layout (all byte addresses in one memory): `order` i32 × N, `start` i32 ×
 * (N + 1), `rows` i32 × blocks, `pivots` f64 × 9N (lower-triangular 3 × 3
 * pivot factors, row-major), `inverse` f64 × 3N (their reciprocal
 * diagonals), `blocks` f64 × 9 × blocks (row-major), and two f64 × 3N
 * vectors.
 * @module
 */
import { compileModule, F64, I32, instantiate, op, type WasmFunction } from './wasm-encode.js';

const { localGet: get, localSet: set, localTee: tee, i32Const: int, i32Add, i32Mul, i32GeS, i32LtS, i32Load, f64Load, f64Store, f64Add, f64Sub, f64Mul, block, loop, end, br, brIf } = op;

/** base + index × size (i32). */
const addr = (base: number[], index: number[], size: number): number[] => [...base, ...index, ...int(size), ...i32Mul, ...i32Add];

// Parameter indices shared by both functions.
const ATOMS = 0, ORDER = 1, START = 2, ROWS = 3, PIVOTS = 4, INVERSE = 5, BLOCKS = 6, VIN = 7, VOUT = 8;
// Locals.
const P = 9, T = 10, TEND = 11, R = 12, O = 13, Q = 14, C = 15, IV = 16, SRC = 17;
const W0 = 18, W1 = 19, W2 = 20, V0 = 21, V1 = 22, V2 = 23;
const LOCALS = [I32, I32, I32, I32, I32, I32, I32, I32, I32, F64, F64, F64, F64, F64, F64];
const PARAMS = [I32, I32, I32, I32, I32, I32, I32, I32, I32];

/** for (p = 0; p < atoms; p++) body */
const forward = (body: number[]): number[] => [
  ...int(0), ...set(P),
  ...block, ...loop,
  ...get(P), ...get(ATOMS), ...i32GeS, ...brIf(1),
  ...body,
  ...get(P), ...int(1), ...i32Add, ...set(P), ...br(0),
  ...end, ...end,
];

/** for (t = start[p]; t < start[p + 1]; t++) body */
const blocksOfColumn = (body: number[]): number[] => [
  ...addr(get(START), get(P), 4), ...tee(T), ...i32Load(4), ...set(TEND),
  ...get(T), ...i32Load(0), ...set(T),
  ...block, ...loop,
  ...get(T), ...get(TEND), ...i32GeS, ...brIf(1),
  // R = &vector[3 rows[t]] (set by the body's caller), O = &blocks[9t]
  ...body,
  ...get(T), ...int(1), ...i32Add, ...set(T), ...br(0),
  ...end, ...end,
];

/** Copy the triple at SRC to the triple at address on the stack top (consumes it into Q). */
const copyTriple = (): number[] => [
  ...set(Q),
  ...get(Q), ...get(SRC), ...f64Load(0), ...f64Store(0),
  ...get(Q), ...get(SRC), ...f64Load(8), ...f64Store(8),
  ...get(Q), ...get(SRC), ...f64Load(16), ...f64Store(16),
];

/** VOUT = L⁻¹ Π VIN. */
const whiten: WasmFunction = {
  name: 'whiten',
  params: PARAMS,
  results: [],
  locals: LOCALS,
  body: [
    // VOUT[p] = VIN[order[p]]
    ...forward([
      ...addr(get(VIN), [...addr(get(ORDER), get(P), 4), ...i32Load(0)], 24), ...set(SRC),
      ...addr(get(VOUT), get(P), 24), ...copyTriple(),
    ]),
    ...forward([
      ...addr(get(VOUT), get(P), 24), ...set(Q),
      ...addr(get(PIVOTS), get(P), 72), ...set(C),
      ...addr(get(INVERSE), get(P), 24), ...set(IV),
      // w0 = q0 i0; w1 = (q1 − c3 w0) i1; w2 = (q2 − c6 w0 − c7 w1) i2
      ...get(Q), ...f64Load(0), ...get(IV), ...f64Load(0), ...f64Mul, ...set(W0),
      ...get(Q), ...f64Load(8), ...get(C), ...f64Load(24), ...get(W0), ...f64Mul, ...f64Sub, ...get(IV), ...f64Load(8), ...f64Mul, ...set(W1),
      ...get(Q), ...f64Load(16), ...get(C), ...f64Load(48), ...get(W0), ...f64Mul, ...f64Sub,
      ...get(C), ...f64Load(56), ...get(W1), ...f64Mul, ...f64Sub, ...get(IV), ...f64Load(16), ...f64Mul, ...set(W2),
      ...get(Q), ...get(W0), ...f64Store(0),
      ...get(Q), ...get(W1), ...f64Store(8),
      ...get(Q), ...get(W2), ...f64Store(16),
      ...blocksOfColumn([
        ...addr(get(VOUT), [...addr(get(ROWS), get(T), 4), ...i32Load(0)], 24), ...set(R),
        ...addr(get(BLOCKS), get(T), 72), ...set(O),
        // out[r + k] −= B[o + 3k] w0 + B[o + 3k + 1] w1 + B[o + 3k + 2] w2
        ...[0, 1, 2].flatMap((k) => [
          ...get(R), ...get(R), ...f64Load(8 * k),
          ...get(O), ...f64Load(24 * k), ...get(W0), ...f64Mul,
          ...get(O), ...f64Load(24 * k + 8), ...get(W1), ...f64Mul, ...f64Add,
          ...get(O), ...f64Load(24 * k + 16), ...get(W2), ...f64Mul, ...f64Add,
          ...f64Sub, ...f64Store(8 * k),
        ]),
      ]),
    ]),
  ],
};

/** VOUT = Πᵀ L⁻ᵀ VIN; VIN is overwritten with L⁻ᵀ VIN. */
const unwhiten: WasmFunction = {
  name: 'unwhiten',
  params: PARAMS,
  results: [],
  locals: LOCALS,
  body: [
    // for (p = atoms − 1; p ≥ 0; p−−)
    ...get(ATOMS), ...int(1), ...op.i32Sub, ...set(P),
    ...block, ...loop,
    ...get(P), ...int(0), ...i32LtS, ...brIf(1),
    ...addr(get(VIN), get(P), 24), ...set(Q),
    ...get(Q), ...f64Load(0), ...set(W0),
    ...get(Q), ...f64Load(8), ...set(W1),
    ...get(Q), ...f64Load(16), ...set(W2),
    ...blocksOfColumn([
      ...addr(get(VIN), [...addr(get(ROWS), get(T), 4), ...i32Load(0)], 24), ...set(R),
      ...addr(get(BLOCKS), get(T), 72), ...set(O),
      ...get(R), ...f64Load(0), ...set(V0),
      ...get(R), ...f64Load(8), ...set(V1),
      ...get(R), ...f64Load(16), ...set(V2),
      // b_k −= B[o + k] v0 + B[o + 3 + k] v1 + B[o + 6 + k] v2
      ...[W0, W1, W2].flatMap((w, k) => [
        ...get(w),
        ...get(O), ...f64Load(8 * k), ...get(V0), ...f64Mul,
        ...get(O), ...f64Load(24 + 8 * k), ...get(V1), ...f64Mul, ...f64Add,
        ...get(O), ...f64Load(48 + 8 * k), ...get(V2), ...f64Mul, ...f64Add,
        ...f64Sub, ...set(w),
      ]),
    ]),
    ...addr(get(PIVOTS), get(P), 72), ...set(C),
    ...addr(get(INVERSE), get(P), 24), ...set(IV),
    // x2 = b2 i2; x1 = (b1 − c7 x2) i1; x0 = (b0 − c3 x1 − c6 x2) i0
    ...get(W2), ...get(IV), ...f64Load(16), ...f64Mul, ...set(W2),
    ...get(W1), ...get(C), ...f64Load(56), ...get(W2), ...f64Mul, ...f64Sub, ...get(IV), ...f64Load(8), ...f64Mul, ...set(W1),
    ...get(W0), ...get(C), ...f64Load(24), ...get(W1), ...f64Mul, ...f64Sub,
    ...get(C), ...f64Load(48), ...get(W2), ...f64Mul, ...f64Sub, ...get(IV), ...f64Load(0), ...f64Mul, ...set(W0),
    ...get(Q), ...get(W0), ...f64Store(0),
    ...get(Q), ...get(W1), ...f64Store(8),
    ...get(Q), ...get(W2), ...f64Store(16),
    ...get(P), ...int(1), ...op.i32Sub, ...set(P), ...br(0),
    ...end, ...end,
    // VOUT[order[p]] = VIN[p]
    ...forward([
      ...addr(get(VIN), get(P), 24), ...set(SRC),
      ...addr(get(VOUT), [...addr(get(ORDER), get(P), 4), ...i32Load(0)], 24), ...copyTriple(),
    ]),
  ],
};

type Sweep = (atoms: number, order: number, start: number, rows: number, pivots: number, inverse: number, blocks: number, vin: number, vout: number) => void;

let compiled: object | null | undefined;

/** The arrays of a factor in one WebAssembly memory, and the sweeps over them. */
export interface SweepArrays {
  readonly order: Int32Array;
  readonly start: Int32Array;
  readonly rows: Int32Array;
  readonly pivots: Float64Array;
  readonly inverse: Float64Array;
  readonly blocks: Float64Array;
  /** Input and output vectors of the sweeps (3N each). */
  readonly vin: Float64Array;
  readonly vout: Float64Array;
  /** vout = L⁻¹ Π vin. */
  whiten(): void;
  /** vout = Πᵀ L⁻ᵀ vin (vin overwritten). */
  unwhiten(): void;
}

/** Allocate the arrays for `atoms` atoms and `blocks` stored blocks; null where WebAssembly is not available. */
export function sweepArrays(atoms: number, blocks: number): SweepArrays | null {
  if (compiled === undefined) compiled = compileModule([whiten, unwhiten]);
  if (compiled === null) return null;
  const sizes = [4 * atoms, 4 * (atoms + 1), 4 * blocks, 72 * atoms, 24 * atoms, 72 * blocks, 24 * atoms, 24 * atoms];
  const offsets: number[] = [];
  let total = 0;
  for (const s of sizes) {
    offsets.push(total);
    total += Math.ceil(s / 16) * 16;
  }
  const made = instantiate(compiled, total);
  if (made === null) return null;
  const exports = made.exports as { whiten: Sweep; unwhiten: Sweep };
  const buffer = made.buffer;
  const [oOrder, oStart, oRows, oPivots, oInverse, oBlocks, oIn, oOut] = offsets;
  const run = (f: Sweep): void => f(atoms, oOrder, oStart, oRows, oPivots, oInverse, oBlocks, oIn, oOut);
  return {
    order: new Int32Array(buffer, oOrder, atoms),
    start: new Int32Array(buffer, oStart, atoms + 1),
    rows: new Int32Array(buffer, oRows, blocks),
    pivots: new Float64Array(buffer, oPivots, 9 * atoms),
    inverse: new Float64Array(buffer, oInverse, 3 * atoms),
    blocks: new Float64Array(buffer, oBlocks, 9 * blocks),
    vin: new Float64Array(buffer, oIn, 3 * atoms),
    vout: new Float64Array(buffer, oOut, 3 * atoms),
    whiten: () => run(exports.whiten),
    unwhiten: () => run(exports.unwhiten),
  };
}
