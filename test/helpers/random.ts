/**
 * A small seeded random generator for tests (mulberry32): the same seed gives
 * the same sequence on every machine, so every random case can be replayed.
 */

/** A seeded source of random numbers. */
export interface Random {
  /** Uniform in [0, 1). */
  next(): number;
  /** Uniform in [lo, hi). */
  uniform(lo: number, hi: number): number;
  /** Uniform integer in [lo, hi] (both included). */
  int(lo: number, hi: number): number;
  /** One of `items`, uniformly. */
  pick<T>(items: readonly T[]): T;
  /** −1 or +1 with equal odds. */
  sign(): number;
  /** A uniformly distributed unit vector. */
  unitVector(): [number, number, number];
}

/** A {@link Random} started from `seed` (any 32-bit integer). */
export function createRandom(seed: number): Random {
  let state = seed >>> 0;
  const next = (): number => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  const uniform = (lo: number, hi: number): number => lo + (hi - lo) * next();
  return {
    next,
    uniform,
    int: (lo, hi) => lo + Math.floor(next() * (hi - lo + 1)),
    pick: (items) => items[Math.floor(next() * items.length)],
    sign: () => (next() < 0.5 ? -1 : 1),
    unitVector: () => {
      // Uniform on the sphere: z uniform in [−1, 1], azimuth uniform.
      const z = uniform(-1, 1);
      const s = Math.sqrt(1 - z * z);
      const a = uniform(0, 2 * Math.PI);
      return [s * Math.cos(a), s * Math.sin(a), z];
    },
  };
}
