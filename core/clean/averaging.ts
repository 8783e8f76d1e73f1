/**
 * Averaging of breath-by-breath data into the processed series every detector and chart
 * uses. Three published-practice forms (Robergs et al., Sports Med
 * 2010;40:95–111, compare time- and breath-based averaging and recommend stating the choice):
 *
 * - `rolling-time`: at each breath, the mean of all breaths within ± windowS/2 s of it
 *   (centred, so averaging adds no lag). Default 15 s (common practice).
 * - `time-bins`: consecutive fixed bins [k·binS, (k+1)·binS) s; one point per non-empty bin,
 *   at the bin's midpoint.
 * - `rolling-breaths`: at each breath, the mean of the `breaths` breaths centred on it
 *   (fewer at the ends of the recording).
 *
 * Rolling points keep their breath's own time; bins sit at their midpoints.
 * Units pass through unchanged (s, mL/min, L/min, bpm, W, mmHg). An optional variable is
 * averaged over the breaths that recorded it, and is null where none in the window did.
 *
 * Example: rolling-breaths of 3 on VO2 1000, 1100, 1300 gives 1050, 1133.3, 1200.
 */
import type { Breath } from '../model/breath-table';
import type { ProcessedSeries } from '../model/analysis';
import type { AveragingSpec } from '../model/settings';
import { newScratch, scratchArrays } from '../math/scratch';

type Required = 'timeS' | 'vo2MlMin' | 'vco2MlMin' | 'veLMin';
type Optional = 'hrBpm' | 'workW' | 'peto2Mmhg' | 'petco2Mmhg';
const REQUIRED: readonly Required[] = ['timeS', 'vo2MlMin', 'vco2MlMin', 'veLMin'];
const OPTIONAL: readonly Optional[] = ['hrBpm', 'workW', 'peto2Mmhg', 'petco2Mmhg'];

export function averageBreaths(breaths: readonly Breath[], spec: AveragingSpec): ProcessedSeries {
  switch (spec.kind) {
    case 'rolling-time':
      return rollingTimeMean(breaths, spec.windowS);
    case 'time-bins':
      return timeBinMean(breaths, spec.binS);
    case 'rolling-breaths':
      return rollingBreathMean(breaths, spec.breaths);
  }
}

/** Centred time window: each breath's point averages breaths within ± windowS/2 s. */
export function rollingTimeMean(breaths: readonly Breath[], windowS: number): ProcessedSeries {
  const half = windowS / 2;
  const ranges = indexRanges(breaths.length);
  let lo = 0;
  let hi = 0;
  for (let i = 0; i < breaths.length; i++) {
    const t = breaths[i].timeS;
    while (breaths[lo].timeS < t - half) lo++;
    if (hi < i) hi = i;
    while (hi + 1 < breaths.length && breaths[hi + 1].timeS <= t + half) hi++;
    ranges.lo[i] = lo;
    ranges.hi[i] = hi;
  }
  return { ...meansOverRanges(breaths, ranges), timeS: breathTimes(breaths) };
}

/** Fixed bins of binS seconds; the time of each point is its bin's midpoint. */
export function timeBinMean(breaths: readonly Breath[], binS: number): ProcessedSeries {
  const bins: [number, number][] = [];
  const mids: number[] = [];
  let start = 0;
  while (start < breaths.length) {
    const bin = Math.floor(breaths[start].timeS / binS);
    let end = start;
    while (end + 1 < breaths.length && Math.floor(breaths[end + 1].timeS / binS) === bin) end++;
    bins.push([start, end]);
    mids.push((bin + 0.5) * binS);
    start = end + 1;
  }
  const ranges = indexRanges(bins.length);
  bins.forEach(([from, to], k) => {
    ranges.lo[k] = from;
    ranges.hi[k] = to;
  });
  const series = meansOverRanges(breaths, ranges);
  const timeS = numberArray(mids.length);
  for (let k = 0; k < mids.length; k++) timeS[k] = mids[k];
  return { ...series, timeS };
}

/** Centred window of `count` breaths (for an even count, one more breath after than before). */
export function rollingBreathMean(breaths: readonly Breath[], count: number): ProcessedSeries {
  const before = Math.floor((Math.max(1, count) - 1) / 2);
  const after = Math.max(1, count) - 1 - before;
  const ranges = indexRanges(breaths.length);
  for (let i = 0; i < breaths.length; i++) {
    ranges.lo[i] = Math.max(0, i - before);
    ranges.hi[i] = Math.min(breaths.length - 1, i + after);
  }
  return { ...meansOverRanges(breaths, ranges), timeS: breathTimes(breaths) };
}

/** Each breath's time, in an array of exactly that length. */
function breathTimes(breaths: readonly Breath[]): number[] {
  const t = numberArray(breaths.length);
  for (let i = 0; i < breaths.length; i++) t[i] = breaths[i].timeS;
  return t;
}

/** Inclusive index ranges [lo[k], hi[k]], one per output point. */
interface IndexRanges {
  readonly lo: Int32Array;
  readonly hi: Int32Array;
}

function indexRanges(n: number): IndexRanges {
  return { lo: new Int32Array(n), hi: new Int32Array(n) };
}

/** An array that will hold only numbers (its own making place; see meansOverRanges). */
function numberArray(n: number): number[] {
  return new Array<number>(n);
}

/** An array that will hold numbers and nulls. */
function nullableArray(n: number): (number | null)[] {
  return new Array<number | null>(n);
}

const SUMS_SCRATCH = newScratch();
const COUNTS_SCRATCH = newScratch();

/**
 * Means of every variable over inclusive index ranges, by prefix sums: one pass over the
 * breaths fills every variable's running sums (and counts, for optional ones), then each
 * range is a difference of two sums.
 */
function meansOverRanges(breaths: readonly Breath[], ranges: IndexRanges): ProcessedSeries {
  const n = breaths.length;
  // The running sums and counts live only in this call: reused work arrays (core/math/scratch.ts),
  // each first entry set here, every later one written before it is read. Counts are whole
  // numbers, exact in doubles.
  const sums = scratchArrays(SUMS_SCRATCH, [...REQUIRED, ...OPTIONAL].map(() => n + 1));
  const counts = scratchArrays(COUNTS_SCRATCH, OPTIONAL.map(() => n + 1));
  for (const a of sums) a[0] = 0;
  for (const a of counts) a[0] = 0;
  const r = REQUIRED.length;
  for (let i = 0; i < n; i++) {
    const b = breaths[i];
    for (let k = 0; k < r; k++) sums[k][i + 1] = sums[k][i] + (b[REQUIRED[k]] ?? 0);
    for (let k = 0; k < OPTIONAL.length; k++) {
      const v = b[OPTIONAL[k]];
      sums[r + k][i + 1] = sums[r + k][i] + (v ?? 0);
      counts[k][i + 1] = counts[k][i] + (v === null ? 0 : 1);
    }
  }
  const { lo, hi } = ranges;
  const points = lo.length;
  const out: Record<string, (number | null)[]> = {};
  // Each output is made at its final length and filled (growing it by push copies a large
  // array several times over), by one of two makers: V8 learns what the arrays of one making
  // place hold, and an array of numbers made where others got nulls would be made boxed
  // (about 24 instead of 8 bytes a point, kept as long as the case is open).
  REQUIRED.forEach((key, k) => {
    const sum = sums[k];
    const means = numberArray(points);
    for (let p = 0; p < points; p++) means[p] = (sum[hi[p] + 1] - sum[lo[p]]) / (hi[p] - lo[p] + 1);
    out[key] = means;
  });
  OPTIONAL.forEach((key, k) => {
    const sum = sums[r + k];
    const count = counts[k];
    let gaps = false;
    for (let p = 0; p < points && !gaps; p++) gaps = count[hi[p] + 1] === count[lo[p]];
    if (!gaps) {
      const means = numberArray(points);
      for (let p = 0; p < points; p++) means[p] = (sum[hi[p] + 1] - sum[lo[p]]) / (count[hi[p] + 1] - count[lo[p]]);
      out[key] = means;
      return;
    }
    const means = nullableArray(points);
    for (let p = 0; p < points; p++) {
      const c = count[hi[p] + 1] - count[lo[p]];
      means[p] = c === 0 ? null : (sum[hi[p] + 1] - sum[lo[p]]) / c;
    }
    out[key] = means;
  });
  return out as unknown as ProcessedSeries;
}

/**
 * Linear interpolation of a series onto an even grid every `stepS` seconds, from its first
 * to its last time, for methods that need even spacing. An optional variable is null at a
 * grid point unless both neighbouring points recorded it.
 *
 * Example: times 0 and 2 s with VO2 1000 and 1200 → grid 0, 1, 2 s with 1000, 1100, 1200.
 */
export function interpolateToGrid(series: ProcessedSeries, stepS = 1): ProcessedSeries {
  const t = series.timeS;
  if (t.length === 0) return series;
  const grid: number[] = [];
  const steps = Math.floor((t[t.length - 1] - t[0]) / stepS + 1e-9);
  for (let k = 0; k <= steps; k++) grid.push(t[0] + k * stepS);
  const at: { i: number; f: number }[] = [];
  let i = 0;
  for (const x of grid) {
    while (i + 1 < t.length - 1 && t[i + 1] <= x) i++;
    const j = Math.min(i + 1, t.length - 1);
    const span = t[j] - t[i];
    at.push({ i, f: span > 0 ? Math.min(1, Math.max(0, (x - t[i]) / span)) : 0 });
  }
  const out: Record<string, (number | null)[]> = { timeS: grid };
  for (const key of REQUIRED.slice(1)) {
    const v = series[key as Exclude<Required, 'timeS'>];
    out[key] = at.map(({ i: k, f }) => v[k] + f * (v[Math.min(k + 1, v.length - 1)] - v[k]));
  }
  for (const key of OPTIONAL) {
    const v = series[key];
    out[key] = at.map(({ i: k, f }) => {
      const a = v[k];
      const b = v[Math.min(k + 1, v.length - 1)];
      if (a === null || b === null) return f === 0 ? a : f === 1 ? b : null;
      return a + f * (b - a);
    });
  }
  return out as unknown as ProcessedSeries;
}
