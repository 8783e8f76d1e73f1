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
import type { ProcessedSeries } from '../model/analysis';

export interface MonotoneCurve {
  readonly timeS: readonly number[];
  readonly value: readonly number[];
}

/** Non-decreasing least-squares fit of `value` over time (points outside [fromS, toS] or non-finite are left out). */
export function monotoneCurve(
  timeS: readonly number[],
  value: readonly number[],
  fromS: number,
  toS: number,
): MonotoneCurve {
  const t: number[] = [];
  const v: number[] = [];
  for (let i = 0; i < timeS.length; i++) {
    if (timeS[i] >= fromS && timeS[i] <= toS && Number.isFinite(timeS[i]) && Number.isFinite(value[i])) {
      t.push(timeS[i]);
      v.push(value[i]);
    }
  }
  // Pool adjacent violators: blocks of (mean, weight), merged while a block's mean falls.
  const means: number[] = [];
  const weights: number[] = [];
  for (const x of v) {
    means.push(x);
    weights.push(1);
    while (means.length > 1 && means[means.length - 2] > means[means.length - 1]) {
      const w = weights[weights.length - 2] + weights[weights.length - 1];
      const m = (means[means.length - 2] * weights[weights.length - 2] + means[means.length - 1] * weights[weights.length - 1]) / w;
      means.pop();
      weights.pop();
      means[means.length - 1] = m;
      weights[weights.length - 1] = w;
    }
  }
  // One node per pooled block, at the block's mean time: a strictly increasing broken line,
  // so that nearby VO2 values map to nearby times (the step function would have flats).
  const nodeT: number[] = [];
  let k = 0;
  for (let b = 0; b < means.length; b++) {
    let st = 0;
    for (let j = 0; j < weights[b]; j++) st += t[k + j];
    nodeT.push(st / weights[b]);
    k += weights[b];
  }
  return { timeS: nodeT, value: means };
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

/** The monotone VO2 curve of a series over a window. */
export function vo2Curve(series: ProcessedSeries, fromS: number, toS: number): MonotoneCurve {
  return monotoneCurve(series.timeS, series.vo2MlMin, fromS, toS);
}

/** The monotone VCO2 curve of a series over a window. */
export function vco2Curve(series: ProcessedSeries, fromS: number, toS: number): MonotoneCurve {
  return monotoneCurve(series.timeS, series.vco2MlMin, fromS, toS);
}
