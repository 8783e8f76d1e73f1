/**
 * Seeded pseudo-random numbers (mulberry32), so generated data and bootstrap intervals are
 * reproducible: the same seed always gives the same sequence.
 */

export type Random = () => number;

/** Uniform numbers in [0, 1) from a 32-bit seed. */
export function seededRandom(seed: number): Random {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Standard normal deviates by the Box–Muller transform. */
export function normalRandom(random: Random): () => number {
  return () => {
    const u = 1 - random();
    const v = random();
    return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
  };
}
