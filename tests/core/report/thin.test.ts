// Thinning for drawing (core/report/thin.ts), checked against the worked example in its doc
// comment, counted by hand: 12,000 points with a limit of 5,000 → step ⌈12,000 / 5,000⌉ = 3,
// points 0, 3, …, 11,997 (4,000 of them) plus the last, 11,999: 4,001 drawn.
import { describe, expect, it } from 'vitest';
import { drawingStep, everyNth, MAX_DRAWN_POINTS, thinnedNote } from '../../../core/report/thin';
import { maxOf, minOf } from '../../../core/math/stats';

describe('thinning a chart for drawing', () => {
  it('draws every point of an ordinary test (no note)', () => {
    expect(drawingStep([1500, 1400])).toBe(1);
    expect(drawingStep([MAX_DRAWN_POINTS])).toBe(1);
    const items = [1, 2, 3];
    expect(everyNth(items, 1)).toBe(items);
    expect(thinnedNote(1, 3, 3)).toBeNull();
  });

  it('keeps one point in k, from the first, plus the last (worked example)', () => {
    const items = Array.from({ length: 12_000 }, (_, i) => i);
    const step = drawingStep([12_000, 7_000]);
    expect(step).toBe(3);
    const drawn = everyNth(items, step);
    expect(drawn.length).toBe(4001);
    expect(drawn.slice(0, 3)).toEqual([0, 3, 6]);
    expect(drawn.slice(-2)).toEqual([11_997, 11_999]);
    expect(thinnedNote(step, drawn.length, items.length)).toBe('drawn: 1 averaged point in 3 (4,001 of 12,000); every number uses all of them');
  });
});

describe('minOf and maxOf', () => {
  it('give what Math.min / Math.max give, for a million values too', () => {
    const xs = Array.from({ length: 1_000_000 }, (_, i) => Math.sin(i) * 1000);
    expect(minOf(xs)).toBe(xs.reduce((a, b) => Math.min(a, b)));
    expect(maxOf(xs)).toBe(xs.reduce((a, b) => Math.max(a, b)));
    expect(minOf([3, Number.NaN, 1])).toBeNaN();
    expect(minOf([])).toBe(Number.POSITIVE_INFINITY);
    expect(maxOf([])).toBe(Number.NEGATIVE_INFINITY);
  });
});
