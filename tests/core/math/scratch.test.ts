// Reused work arrays (core/math/scratch.ts): what a caller may rely on, checked by identity of
// the underlying buffers and by the sizes asked for.
import { describe, expect, it } from 'vitest';
import { newScratch, SCRATCH_MAX_POINTS, scratchArrays } from '../../../core/math/scratch';

describe('scratchArrays', () => {
  it('gives views of the asked sizes into buffers reused by the next call', () => {
    const pool = newScratch();
    const [a, b] = scratchArrays(pool, [10, 11]);
    expect([a.length, b.length]).toEqual([10, 11]);
    const [c, d] = scratchArrays(pool, [5, 3]);
    expect([c.length, d.length]).toEqual([5, 3]);
    // The same memory: a write through the second view shows in the first.
    c[0] = 42;
    expect(a[0]).toBe(42);
    expect(c.buffer).toBe(a.buffer);
    expect(d.buffer).toBe(b.buffer);
  });

  it('grows for a larger request and keeps every buffer at least that size', () => {
    const pool = newScratch();
    scratchArrays(pool, [100, 100]);
    const [x, y, z] = scratchArrays(pool, [1000, 1000, 1001]);
    expect([x.length, y.length, z.length]).toEqual([1000, 1000, 1001]);
    expect(pool.buffers.length).toBe(3);
    for (const buffer of pool.buffers) expect(buffer.length).toBeGreaterThanOrEqual(1001);
  });

  it('makes fresh arrays past the cap and without a pool, and holds none of them', () => {
    const pool = newScratch();
    const [big] = scratchArrays(pool, [SCRATCH_MAX_POINTS + 1]);
    expect(big.length).toBe(SCRATCH_MAX_POINTS + 1);
    expect(pool.buffers).toEqual([]);
    const [free] = scratchArrays(undefined, [7]);
    expect(Array.from(free)).toEqual([0, 0, 0, 0, 0, 0, 0]);
  });
});
