/**
 * Points of the processed series inside a search window, for one derived quantity.
 * A point is used when its time lies in [fromS, toS] and the quantity is a finite number;
 * the caller reports how many were used (evidence `points`), so nothing disappears unseen.
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
  const timeS: number[] = [];
  const value: number[] = [];
  for (let i = 0; i < series.timeS.length; i++) {
    const t = series.timeS[i];
    if (!(t >= fromS && t <= toS)) continue;
    const v = quantity(i);
    if (v === null || !Number.isFinite(v)) continue;
    timeS.push(t);
    value.push(v);
  }
  return { timeS, value };
}

/** Ratio a/b, null when b is not positive (a ventilatory equivalent needs a positive uptake). */
export function ratio(a: number, b: number): number | null {
  return b > 0 ? a / b : null;
}
