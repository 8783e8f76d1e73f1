/**
 * Bisection on non-decreasing arrays (core/math/sorted.ts) and the two readers that use it,
 * checked against the plain front-to-back scans they replaced, on random sorted arrays with
 * repeated values (the answers must be the same indices, so the same numbers follow).
 */
import { describe, expect, it } from 'vitest';
import { firstIndexWhere, indexRangeWithin } from '../../../core/math/sorted';
import { seriesAt } from '../../../core/compare/measurement';
import type { ProcessedSeries } from '../../../core/model/analysis';
import { seededRandom } from '../../../core/math/random';

function sortedArray(rand: () => number, n: number): number[] {
  const out: number[] = [];
  let x = rand() * 10;
  for (let i = 0; i < n; i++) {
    if (rand() > 0.2) x += rand() * 3; // about one in five values repeats the one before
    out.push(x);
  }
  return out;
}

describe('firstIndexWhere', () => {
  it('finds the same index as a scan from the front, on 2,000 random sorted arrays', () => {
    const rand = seededRandom(7);
    for (let k = 0; k < 2000; k++) {
      const values = sortedArray(rand, 1 + Math.floor(rand() * 40));
      const target = values[Math.floor(rand() * values.length)] + (rand() - 0.5) * 2;
      const from = Math.floor(rand() * values.length);
      let scan = from;
      while (scan < values.length && !(values[scan] >= target)) scan++;
      expect(firstIndexWhere(values, (v) => v >= target, from)).toBe(scan);
    }
  });

  it('gives `to` when no value qualifies and `from` when the first does', () => {
    expect(firstIndexWhere([1, 2, 3], (v) => v >= 10)).toBe(3);
    expect(firstIndexWhere([1, 2, 3], (v) => v >= 0)).toBe(0);
    expect(firstIndexWhere([1, 2, 3], (v) => v >= 0, 2)).toBe(2);
  });
});

describe('seriesAt by bisection', () => {
  /** The reader as it was: a scan from index 1 to the first time at or after t. */
  function scanAt(ts: readonly number[], ys: readonly (number | null)[], t: number): number | null {
    if (ts.length === 0 || t < ts[0] || t > ts[ts.length - 1]) return null;
    let hi = 1;
    while (hi < ts.length - 1 && ts[hi] < t) hi++;
    const lo = Math.max(0, hi - 1);
    const y0 = ys[lo];
    const y1 = ys[hi];
    if (y0 === null || y1 === null) return y0 ?? y1 ?? null;
    const span = ts[hi] - ts[lo];
    return span > 0 ? y0 + ((y1 - y0) * (t - ts[lo])) / span : y0;
  }

  it('reads the same value as the front-to-back scan, gaps and repeated times included', () => {
    const rand = seededRandom(11);
    for (let k = 0; k < 2000; k++) {
      const ts = sortedArray(rand, 1 + Math.floor(rand() * 30));
      const ys = ts.map(() => (rand() < 0.1 ? null : 500 + rand() * 2000));
      const series = { timeS: ts, hrBpm: ys } as unknown as ProcessedSeries;
      const t = ts[0] - 1 + rand() * (ts[ts.length - 1] - ts[0] + 2);
      expect(seriesAt(series, 'hrBpm', t)).toBe(scanAt(ts, ys, t));
    }
  });

  it('interpolates linearly, worked by hand: 10 s → 100, 20 s → 200 gives 150 at 15 s', () => {
    const series = { timeS: [0, 10, 20, 30], hrBpm: [90, 100, 200, 210] } as unknown as ProcessedSeries;
    expect(seriesAt(series, 'hrBpm', 15)).toBe(150);
    expect(seriesAt(series, 'hrBpm', 10)).toBe(100);
    expect(seriesAt(series, 'hrBpm', 31)).toBeNull();
  });
});

describe('indexRangeWithin', () => {
  it('gives the indices a front-to-back filter keeps, on 2,000 random sorted arrays', () => {
    const rand = seededRandom(11);
    for (let k = 0; k < 2000; k++) {
      const values = sortedArray(rand, 1 + Math.floor(rand() * 40));
      const a = values[Math.floor(rand() * values.length)] + (rand() - 0.5) * 2;
      const b = a + rand() * 20 - 2; // sometimes an empty window (b < a)
      const kept = values.flatMap((v, i) => (v >= a && v <= b ? [i] : []));
      const [first, last] = indexRangeWithin(values, a, b);
      expect(Array.from({ length: last - first }, (_, i) => first + i)).toEqual(kept);
    }
  });

  it('includes both ends and ties: [10, 20] of 5, 10, 10, 15, 20, 20, 25 is indices 1 to 5', () => {
    expect(indexRangeWithin([5, 10, 10, 15, 20, 20, 25], 10, 20)).toEqual([1, 6]);
    expect(indexRangeWithin([5, 10, 15], 30, 40)).toEqual([3, 3]);
  });
});
