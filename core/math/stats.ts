/** Small descriptive statistics over plain arrays. Empty input gives NaN. */

export function mean(values: readonly number[]): number {
  if (values.length === 0) return Number.NaN;
  let s = 0;
  for (const v of values) s += v;
  return s / values.length;
}

/** Sample standard deviation (n − 1). */
export function sampleSd(values: readonly number[]): number {
  const n = values.length;
  if (n < 2) return Number.NaN;
  const m = mean(values);
  let s = 0;
  for (const v of values) s += (v - m) * (v - m);
  return Math.sqrt(s / (n - 1));
}

/** Quantile by linear interpolation between order statistics (R's type 7). */
export function quantile(values: readonly number[], p: number): number {
  if (values.length === 0) return Number.NaN;
  const sorted = [...values].sort((a, b) => a - b);
  const h = (sorted.length - 1) * p;
  const lo = Math.floor(h);
  const hi = Math.ceil(h);
  return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo]);
}

export function median(values: readonly number[]): number {
  return quantile(values, 0.5);
}

/**
 * The smallest value, as `Math.min(...values)` gives it (NaN if any value is NaN, Infinity
 * when empty), without spreading the array into call arguments, which overflows the call
 * stack for arrays of a few hundred thousand values.
 */
export function minOf(values: ArrayLike<number>): number {
  let m = Number.POSITIVE_INFINITY;
  for (let i = 0; i < values.length; i++) m = Math.min(m, values[i]);
  return m;
}

/** The largest value, as `Math.max(...values)` gives it, for arrays of any length (see minOf). */
export function maxOf(values: ArrayLike<number>): number {
  let m = Number.NEGATIVE_INFINITY;
  for (let i = 0; i < values.length; i++) m = Math.max(m, values[i]);
  return m;
}
