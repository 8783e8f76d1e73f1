/**
 * Points of the processed series inside a search window, for one derived quantity.
 * A point is used when its time lies in [fromS, toS] and the quantity is a finite number;
 * the caller reports how many were used (evidence `points`), so nothing disappears unseen.
 * Assumption: the series is in time order (the import refuses rows whose time runs backwards).
 */
import { indexRangeWithin } from '../math/sorted';
import type { ProcessedSeries } from '../model/analysis';

export interface WindowPoints {
  readonly timeS: Float64Array;
  readonly value: Float64Array;
}

export function windowPoints(
  series: ProcessedSeries,
  fromS: number,
  toS: number,
  quantity: (i: number) => number | null,
): WindowPoints {
  const t = series.timeS;
  // The series is in time order: the window is one run of indices, found by bisection, and the
  // arrays are sized for it once. Typed arrays: a plain array of more than 16k numbers is a
  // large object to V8, on freshly mapped pages whose faults made a 32,000-breath analysis
  // dearer per breath than a 4,000-breath one; a typed array's store is reused memory.
  const [first, last] = indexRangeWithin(t, fromS, toS);
  const timeS = new Float64Array(last - first);
  const value = new Float64Array(last - first);
  let k = 0;
  for (let i = first; i < last; i++) {
    const v = quantity(i);
    if (v === null || !Number.isFinite(v)) continue;
    timeS[k] = t[i];
    value[k] = v;
    k++;
  }
  // A view only when some points were left out (a view is one more object per array).
  return k === timeS.length ? { timeS, value } : { timeS: timeS.subarray(0, k), value: value.subarray(0, k) };
}

/** Ratio a/b, null when b is not positive (a ventilatory equivalent needs a positive uptake). */
export function ratio(a: number, b: number): number | null {
  return b > 0 ? a / b : null;
}
