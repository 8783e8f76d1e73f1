/**
 * Work arrays reused from call to call, for arrays that never leave the call that asked for
 * them (a fit's sorted points and prefix sums, a monotone fit's blocks, a merge sort's second
 * buffer): the detectors of one analysis make about forty of them, and reuse saves allocating
 * and zeroing each. The contents are whatever the last user left, so a caller writes every
 * entry before it reads it, and one pool serves one call at a time. Past `SCRATCH_MAX_POINTS`
 * entries the arrays are made fresh, so a million-breath test leaves nothing held for the life
 * of the process (our choice: 65,536 points is hours of breathing, 512 kB per array).
 */
export const SCRATCH_MAX_POINTS = 1 << 16;

export interface Scratch {
  buffers: Float64Array[];
}

export function newScratch(): Scratch {
  return { buffers: [] };
}

/** Arrays of the given sizes: views into the pool's buffers, or fresh ones without a pool or past the cap. */
export function scratchArrays(pool: Scratch | undefined, sizes: readonly number[]): Float64Array[] {
  let need = 0;
  for (const k of sizes) need = Math.max(need, k);
  if (!pool || need > SCRATCH_MAX_POINTS) return sizes.map((k) => new Float64Array(k));
  if (pool.buffers.length < sizes.length || pool.buffers[0].length < need) {
    const capacity = Math.min(SCRATCH_MAX_POINTS, Math.max(need, 2 * (pool.buffers[0]?.length ?? 0)));
    pool.buffers = Array.from({ length: Math.max(sizes.length, pool.buffers.length) }, () => new Float64Array(capacity));
  }
  return sizes.map((k, i) => pool.buffers[i].subarray(0, k));
}
