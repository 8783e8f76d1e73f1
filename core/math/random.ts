/**
 * Seeded pseudo-random numbers (mulberry32), so generated data and bootstrap intervals are
 * reproducible: the same seed always gives the same sequence.
 */

export type Random = () => number;

/** mulberry32's state advances by this constant at every draw. */
const STEP = 0x6d2b79f5;

/** Uniform numbers in [0, 1) from a 32-bit seed. */
export function seededRandom(seed: number): Random {
  let state = seed >>> 0;
  return () => {
    state = (state + STEP) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/**
 * The sequence of `seededRandom(seed)` from its (skip + 1)-th number on, without drawing the
 * first `skip`: mulberry32's state after k draws is seed + k · STEP modulo 2³², so the jump is
 * exact (skip a whole number, below 2⁵³). Lets a caller hand out disjoint stretches of one
 * sequence in any order.
 */
export function seededRandomAfter(seed: number, skip: number): Random {
  return seededRandom(((seed >>> 0) + (Math.imul(skip, STEP) >>> 0)) >>> 0);
}

/** Standard normal deviates by the Box–Muller transform. */
export function normalRandom(random: Random): () => number {
  return () => {
    const u = 1 - random();
    const v = random();
    return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
  };
}
