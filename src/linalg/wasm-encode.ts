/**
 * A minimal WebAssembly binary encoder: just enough to build the project's
 * vector kernels (src/linalg/vector-kernels.ts) at load time from readable
 * instruction lists, with no build step and no binary blob in the sources.
 *
 * Encodings follow the WebAssembly Core Specification 2.0 (W3C, 2022),
 * chapter 5 "Binary format", and the fixed-width SIMD proposal merged into
 * it (opcode prefix 0xFD).
 * @module
 */

/** Unsigned LEB128. */
export function uleb(value: number): number[] {
  const out: number[] = [];
  let v = value >>> 0;
  do {
    let b = v & 0x7f;
    v >>>= 7;
    if (v !== 0) b |= 0x80;
    out.push(b);
  } while (v !== 0);
  return out;
}

/** Signed LEB128 (32-bit values). */
export function sleb(value: number): number[] {
  const out: number[] = [];
  let v = value | 0;
  for (;;) {
    const b = v & 0x7f;
    v >>= 7;
    if ((v === 0 && (b & 0x40) === 0) || (v === -1 && (b & 0x40) !== 0)) {
      out.push(b);
      return out;
    }
    out.push(b | 0x80);
  }
}

/** Value types. */
export const I32 = 0x7f;
export const F64 = 0x7c;
export const V128 = 0x7b;

/** One function of a module. */
export interface WasmFunction {
  /** Export name. */
  name: string;
  params: number[];
  results: number[];
  /** Extra locals after the parameters, one type per local. */
  locals: number[];
  /** The instructions (without the final `end`). */
  body: number[];
}

function vec(items: number[][]): number[] {
  const out = uleb(items.length);
  for (const item of items) out.push(...item);
  return out;
}

function section(id: number, bytes: number[]): number[] {
  return [id, ...uleb(bytes.length), ...bytes];
}

function name(s: string): number[] {
  const bytes = Array.from(new TextEncoder().encode(s));
  return [...uleb(bytes.length), ...bytes];
}

/**
 * A module that imports its memory as `env.memory` (at least `minPages`
 * pages of 64 KiB) and exports every function under its name.
 */
export function encodeModule(functions: readonly WasmFunction[], minPages = 1): Uint8Array {
  const types = section(
    1,
    vec(functions.map((f) => [0x60, ...vec(f.params.map((t) => [t])), ...vec(f.results.map((t) => [t]))])),
  );
  const imports = section(2, vec([[...name('env'), ...name('memory'), 0x02, 0x00, ...uleb(minPages)]]));
  const declared = section(3, vec(functions.map((_, i) => uleb(i))));
  const exports = section(7, vec(functions.map((f, i) => [...name(f.name), 0x00, ...uleb(i)])));
  const code = section(
    10,
    vec(
      functions.map((f) => {
        // locals as runs of equal types
        const runs: number[][] = [];
        for (const t of f.locals) {
          const last = runs[runs.length - 1];
          if (last !== undefined && last[1] === t) last[0]++;
          else runs.push([1, t]);
        }
        const body = [...vec(runs.map(([c, t]) => [...uleb(c), t])), ...f.body, 0x0b];
        return [...uleb(body.length), ...body];
      }),
    ),
  );
  return new Uint8Array([0x00, 0x61, 0x73, 0x6d, 0x01, 0x00, 0x00, 0x00, ...types, ...imports, ...declared, ...exports, ...code]);
}

/** The part of the WebAssembly JavaScript API the project uses (declared here: its `lib` has no DOM types). */
export interface WasmApi {
  Module: new (bytes: Uint8Array) => object;
  Instance: new (module: object, imports: object) => { exports: unknown };
  Memory: new (descriptor: { initial: number; maximum?: number }) => { buffer: ArrayBuffer };
}

/** The engine's WebAssembly API, or undefined where there is none. */
export const wasmApi: WasmApi | undefined = (globalThis as { WebAssembly?: WasmApi }).WebAssembly;

/** Compile functions into a module, or null when this engine cannot (no WebAssembly, or no SIMD). */
export function compileModule(functions: readonly WasmFunction[]): object | null {
  if (wasmApi === undefined) return null;
  try {
    return new wasmApi.Module(encodeModule(functions));
  } catch {
    return null;
  }
}

/**
 * A fixed-size memory of at least `bytes` bytes and an instance of `module`
 * on it, or null when the engine refuses (for example more than it allows).
 */
export function instantiate(module: object, bytes: number): { buffer: ArrayBuffer; exports: unknown } | null {
  if (wasmApi === undefined) return null;
  const pages = Math.max(1, Math.ceil(bytes / 65536));
  try {
    const memory = new wasmApi.Memory({ initial: pages, maximum: pages });
    const instance = new wasmApi.Instance(module, { env: { memory } });
    return { buffer: memory.buffer, exports: instance.exports };
  } catch {
    return null;
  }
}

const simd = (code: number): number[] => [0xfd, ...uleb(code)];

/** Instructions (each a byte list), named after the specification's mnemonics. */
export const op = {
  localGet: (i: number): number[] => [0x20, ...uleb(i)],
  localSet: (i: number): number[] => [0x21, ...uleb(i)],
  localTee: (i: number): number[] => [0x22, ...uleb(i)],
  i32Const: (v: number): number[] => [0x41, ...sleb(v)],
  i32Add: [0x6a],
  i32Sub: [0x6b],
  i32LtU: [0x49],
  i32GeU: [0x4f],
  i32Eqz: [0x45],
  i32Mul: [0x6c],
  i32LtS: [0x48],
  i32GeS: [0x4e],
  i32Load: (offset: number): number[] => [0x28, 0x02, ...uleb(offset)],
  f64Load: (offset: number): number[] => [0x2b, 0x03, ...uleb(offset)],
  f64Const: (v: number): number[] => [0x44, ...new Uint8Array(new Float64Array([v]).buffer)],
  f64Add: [0xa0],
  f64Sub: [0xa1],
  f64Mul: [0xa2],
  f64Div: [0xa3],
  f64Max: [0xa5],
  f64Store: (offset: number): number[] => [0x39, 0x03, ...uleb(offset)],
  block: [0x02, 0x40],
  loop: [0x03, 0x40],
  end: [0x0b],
  br: (depth: number): number[] => [0x0c, ...uleb(depth)],
  brIf: (depth: number): number[] => [0x0d, ...uleb(depth)],
  /** v128.load with alignment hint 8 bytes (the arrays are Float64Array views). */
  v128Load: (offset: number): number[] => [...simd(0x00), 0x03, ...uleb(offset)],
  v128Store: (offset: number): number[] => [...simd(0x0b), 0x03, ...uleb(offset)],
  v128Zero: [...simd(0x0c), ...new Array<number>(16).fill(0)],
  v128And: simd(0x4e),
  v128Bitselect: simd(0x52),
  f64x2Splat: simd(0x14),
  f64x2ExtractLane: (lane: number): number[] => [...simd(0x21), lane],
  f64x2Lt: simd(0x49),
  f64x2Gt: simd(0x4a),
  f64x2Add: simd(0xf0),
  f64x2Sub: simd(0xf1),
  f64x2Mul: simd(0xf2),
  f64x2Div: simd(0xf3),
};
