/**
 * Points of the processed series inside a search window, for one derived quantity.
 * A point is used when its time lies in [fromS, toS] and the quantity is a finite number;
 * the caller reports how many were used (evidence `points`), so nothing disappears unseen.
 * Assumption: the series is in time order (the import refuses rows whose time runs backwards).
 */
import type { ProcessedSeries } from '../model/analysis';

export interface WindowPoints {
  readonly timeS: number[];
  readonly value: number[];
}

export function windowPoints(
  series: ProcessedSeries,
  fromS: number,
  toS: number,
  quantity: (i: number) => number | null,
): WindowPoints {
  const t = series.timeS;
  // The series is in time order: the window is one run of indices, found by bisection, and the
  // arrays are sized for it once (no growth while filling).
  const first = firstAtOrAfter(t, fromS);
  let last = first;
  while (last < t.length && t[last] <= toS) last++;
  const timeS: number[] = new Array(Math.max(0, last - first));
  const value: number[] = new Array(Math.max(0, last - first));
  let k = 0;
  for (let i = first; i < last; i++) {
    const ti = t[i];
    if (!(ti >= fromS && ti <= toS)) continue;
    const v = quantity(i);
    if (v === null || !Number.isFinite(v)) continue;
    timeS[k] = ti;
    value[k] = v;
    k++;
  }
  timeS.length = k;
  value.length = k;
  return { timeS, value };
}

/** First index whose time is at or after `s` (times in increasing order; length when none). */
function firstAtOrAfter(t: readonly number[], s: number): number {
  let lo = 0;
  let hi = t.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (t[mid] < s) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** Ratio a/b, null when b is not positive (a ventilatory equivalent needs a positive uptake). */
export function ratio(a: number, b: number): number | null {
  return b > 0 ? a / b : null;
}
