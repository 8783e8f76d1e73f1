/**
 * Reading a threshold off the series: the time at which VO2 (or VCO2) reaches a value, and the
 * VO2 at a time, within the incremental phase.
 *
 * Averaged VO2 still wobbles breath to breath, so a first crossing would jump early on a
 * chance peak. We read instead from the isotonic (non-decreasing) least-squares fit of the
 * variable against time, by the pool-adjacent-violators algorithm (Ayer et al., Ann Math
 * Stat 1955;26:641–7; Barlow et al., Statistical Inference under Order Restrictions, 1972),
 * which is exact, linear in time and assumes only that uptake does not fall during an
 * incremental test. The curve joins the pooled blocks' means, each placed at its block's mean
 * time, by straight lines (our choice, so the curve has no flat steps). Units: s and mL/min.
 */
import { newScratch, scratchArrays } from '../math/scratch';
import { indexRangeWithin } from '../math/sorted';
import type { ProcessedSeries } from '../model/analysis';

export interface MonotoneCurve {
  readonly timeS: ArrayLike<number>;
  readonly value: ArrayLike<number>;
}

/** Work arrays of `monotoneCurve` (core/math/scratch.ts). */
const CURVE_SCRATCH = newScratch();

/** Non-decreasing least-squares fit of `value` over time (points outside [fromS, toS] or non-finite are left out; times in increasing order). */
export function monotoneCurve(
  timeS: ArrayLike<number>,
  value: ArrayLike<number>,
  fromS: number,
  toS: number,
): MonotoneCurve {
  // The times are in increasing order: the window is one run of indices, found by bisection,
  // and the typed scratch is sized for it once (no array growth per point).
  const [first, last] = indexRangeWithin(timeS, fromS, toS);
  const size = last - first;
  const [t, means, weights] = scratchArrays(CURVE_SCRATCH, [size, size, size]);
  let n = 0;
  // Pool adjacent violators: a stack of blocks (mean, weight), merged while a block's mean falls.
  let blocks = 0;
  for (let i = first; i < last; i++) {
    const ti = timeS[i];
    const x = value[i];
    if (!Number.isFinite(ti) || !Number.isFinite(x)) continue;
    t[n++] = ti;
    means[blocks] = x;
    weights[blocks] = 1;
    blocks++;
    while (blocks > 1 && means[blocks - 2] > means[blocks - 1]) {
      const w = weights[blocks - 2] + weights[blocks - 1];
      means[blocks - 2] = (means[blocks - 2] * weights[blocks - 2] + means[blocks - 1] * weights[blocks - 1]) / w;
      weights[blocks - 2] = w;
      blocks--;
    }
  }
  // One node per pooled block, at the block's mean time: a strictly increasing broken line,
  // so that nearby VO2 values map to nearby times (the step function would have flats).
  const nodeT = new Float64Array(blocks);
  let k = 0;
  for (let b = 0; b < blocks; b++) {
    let st = 0;
    for (let j = 0; j < weights[b]; j++) st += t[k + j];
    nodeT[b] = st / weights[b];
    k += weights[b];
  }
  return { timeS: nodeT, value: means.slice(0, blocks) };
}

/** Curve value at a time (clamped to the curve's ends); NaN for an empty curve. */
export function valueAtTime(curve: MonotoneCurve, timeS: number): number {
  const { timeS: t, value: v } = curve;
  if (t.length === 0) return Number.NaN;
  if (timeS <= t[0]) return v[0];
  if (timeS >= t[t.length - 1]) return v[v.length - 1];
  let lo = 0;
  let hi = t.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (t[mid] <= timeS) lo = mid;
    else hi = mid;
  }
  const f = t[hi] === t[lo] ? 0 : (timeS - t[lo]) / (t[hi] - t[lo]);
  return v[lo] + f * (v[hi] - v[lo]);
}

/** First time the curve reaches a value (clamped to the curve's ends); NaN for an empty curve. */
export function timeAtValue(curve: MonotoneCurve, value: number): number {
  const { timeS: t, value: v } = curve;
  if (t.length === 0) return Number.NaN;
  if (value <= v[0]) return t[0];
  if (value > v[v.length - 1]) return t[t.length - 1];
  let lo = 0;
  let hi = v.length - 1;
  // Invariant: v[lo] < value ≤ v[hi].
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (v[mid] < value) lo = mid;
    else hi = mid;
  }
  const f = (value - v[lo]) / (v[hi] - v[lo]);
  return t[lo] + f * (t[hi] - t[lo]);
}

/**
 * The curves already made, per VO2 array (a series is never changed once made; the search
 * windows' blanked copies are new arrays) and window: the detectors of one analysis ask for
 * the same curve a dozen times. A curve has about a fifth of the window's points (pooled
 * blocks), and goes with its series.
 */
const VO2_CURVES = new WeakMap<readonly number[], Map<string, { timeS: readonly number[]; curve: MonotoneCurve }>>();

/** The monotone VO2 curve of a series over a window. */
export function vo2Curve(series: ProcessedSeries, fromS: number, toS: number): MonotoneCurve {
  let byWindow = VO2_CURVES.get(series.vo2MlMin);
  if (!byWindow) VO2_CURVES.set(series.vo2MlMin, (byWindow = new Map()));
  const key = `${fromS}|${toS}`;
  const known = byWindow.get(key);
  if (known && known.timeS === series.timeS) return known.curve;
  const curve = monotoneCurve(series.timeS, series.vo2MlMin, fromS, toS);
  byWindow.set(key, { timeS: series.timeS, curve });
  return curve;
}

/** The monotone VCO2 curve of a series over a window. */
export function vco2Curve(series: ProcessedSeries, fromS: number, toS: number): MonotoneCurve {
  return monotoneCurve(series.timeS, series.vco2MlMin, fromS, toS);
}
