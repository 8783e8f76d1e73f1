/**
 * The worker's patch of a view against the one it posted before (renderer/src/engine/view-patch.ts):
 * applied to the page's copy it gives the new view exactly, it carries only what changed, and
 * unchanged parts keep their identity. Reference: the worked example in the module's comment,
 * and structural equality (vitest's toEqual) of the result with the new value.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { applyPatch, diffValue } from '../../../../renderer/src/engine/view-patch';

describe('view patches', () => {
  it('gives the worked example of the module comment', () => {
    expect(diffValue({ a: 1, b: { c: [1, 2] } }, { a: 1, b: { c: [1, 2, 3] } })).toEqual({ keys: { b: { keys: { c: { items: { 2: { set: 3 } }, length: 3 } } } } });
  });

  it('is null for the same value, and a NaN equals a NaN', () => {
    const v = { x: [1, { y: Number.NaN }] };
    expect(diffValue(v, v)).toBeNull();
    expect(diffValue(v, { x: [1, { y: Number.NaN }] })).toBeNull();
  });

  it('leaves unchanged parts as the page already has them', () => {
    const series = { timeS: [0, 1, 2], vo2MlMin: [300, 310, 320] };
    const before = { day1: { series, vt1: { vo2MlMin: 1000 } }, day2: { series: { ...series }, vt1: { vo2MlMin: 900 } }, log: [{ seq: 0 }] };
    const after = { ...before, day2: { ...before.day2, vt1: { vo2MlMin: 850 } }, log: [...before.log, { seq: 1 }] };
    const patch = diffValue(before, after);
    expect(patch).toEqual({ keys: { day2: { keys: { vt1: { keys: { vo2MlMin: { set: 850 } } } } }, log: { items: { 1: { set: { seq: 1 } } }, length: 2 } } });
    const applied = applyPatch(before, patch);
    expect(applied).toEqual(after);
    expect(applied.day1).toBe(before.day1);
    expect(applied.day2.series).toBe(before.day2.series);
    expect(applied.log[0]).toBe(before.log[0]);
  });

  it('drops keys and shortens arrays', () => {
    const before = { a: 1, b: 2, list: [1, 2, 3, 4] };
    const after = { a: 1, list: [1, 2, 3] };
    expect(applyPatch(before, diffValue(before, after))).toEqual(after);
    expect(applyPatch(before, diffValue(before, after))).not.toHaveProperty('b');
  });

  it('rebuilds any JSON-like value from any other (property check)', () => {
    const value = fc.jsonValue({ maxDepth: 4 });
    fc.assert(
      fc.property(value, value, (a, b) => {
        expect(applyPatch(a, diffValue(a, b))).toEqual(b);
      }),
      { numRuns: 300, seed: 14 },
    );
  });
});
