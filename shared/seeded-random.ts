// Seeded pseudo-random numbers in [0, 1) for the demo data generator, tests and benchmarks, so
// every run and every machine makes the same numbers. Never for anything that must be unguessable.

/** mulberry32 (Tommy Ettinger's 32-bit generator, common practice for small seeded streams). */
export function mulberry32(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4_294_967_296;
  };
}

/** The linear congruential generator of Numerical Recipes (a = 1664525, c = 1013904223, m = 2^32). */
export function lcg(seed: number): () => number {
  let state = seed;
  return () => {
    state = (1664525 * state + 1013904223) % 2 ** 32;
    return state / 2 ** 32;
  };
}
