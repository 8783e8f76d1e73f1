/**
 * Every `ValuesAt` field read off the processed series at one instant, by linear
 * interpolation between the two neighbouring points (clamped to the first or last point
 * outside the series). RER is VCO2/VO2 of the interpolated values; VO2/kg divides by body
 * mass; % of peak and % of predicted divide by the values passed in (mL/min).
 * An optional variable (HR, work) is null unless both neighbours recorded it.
 * `thresholdVo2MlMin`, when given, is the VO2 the threshold methods found (their consensus):
 * it then stands for VO2 and what derives from it (VO2/kg, % of peak, % of predicted), because
 * the averaged series at that instant carries a breath-noise error of its own (a few % of VO2)
 * that the methods' estimate, fitted over the whole window, does not; the 95 % interval is
 * about that same estimate. RER stays the ratio of the series at the instant.
 *
 * Example: points at 100 s (VO2 1000) and 110 s (VO2 1200) → at 105 s, VO2 1100 mL/min;
 * with peak 2200 mL/min, 50% of peak.
 */
import type { PeakValues, PredictedValues, ProcessedSeries, ValuesAt } from '../model/analysis';
import { percentOf } from '../measures/predicted';

export interface ValuesAtContext {
  readonly peakVo2MlMin: number | null;
  readonly predictedPeakVo2MlMin: number | null;
  readonly weightKg: number | null;
}

/**
 * The context analyzeTest reads its thresholds with: peak VO2, predicted peak VO2 (FRIEND ×
 * body mass when it can be computed, else Hansen/Wasserman), body mass. A reviewer's moved
 * breakpoint should be read with the same context, so the two agree.
 */
export function valuesAtContext(peak: PeakValues, predicted: PredictedValues, weightKg: number | null): ValuesAtContext {
  const friend = predicted.friendVo2MlKgMin;
  return {
    peakVo2MlMin: Number.isFinite(peak.vo2MlMin) ? peak.vo2MlMin : null,
    predictedPeakVo2MlMin: friend !== null && weightKg !== null ? friend * weightKg : predicted.hansenVo2MlMin,
    weightKg,
  };
}

export function valuesAt(series: ProcessedSeries, timeS: number, context: ValuesAtContext, thresholdVo2MlMin?: number): ValuesAt {
  const t = series.timeS;
  let i = 0;
  let f = 0;
  if (t.length > 1) {
    let lo = 0;
    let hi = t.length - 1;
    if (timeS <= t[0]) [i, f] = [0, 0];
    else if (timeS >= t[hi]) [i, f] = [hi - 1, 1];
    else {
      while (hi - lo > 1) {
        const mid = (lo + hi) >> 1;
        if (t[mid] <= timeS) lo = mid;
        else hi = mid;
      }
      i = lo;
      f = (timeS - t[lo]) / (t[hi] - t[lo]);
    }
  }
  const num = (v: readonly number[]) => (t.length > 1 ? v[i] + f * (v[i + 1] - v[i]) : v[0]);
  const opt = (v: readonly (number | null)[]) => {
    if (t.length <= 1) return v[0] ?? null;
    const a = v[i];
    const b = v[i + 1];
    if (a === null || b === null) return f === 0 ? a : f === 1 ? b : null;
    return a + f * (b - a);
  };
  const seriesVo2MlMin = num(series.vo2MlMin);
  const vo2MlMin = thresholdVo2MlMin !== undefined && Number.isFinite(thresholdVo2MlMin) ? thresholdVo2MlMin : seriesVo2MlMin;
  const vco2MlMin = num(series.vco2MlMin);
  const w = context.weightKg;
  return {
    timeS,
    vo2MlMin,
    vo2MlKgMin: w !== null && w > 0 ? vo2MlMin / w : null,
    vco2MlMin,
    workW: opt(series.workW),
    hrBpm: opt(series.hrBpm),
    veLMin: num(series.veLMin),
    rer: vco2MlMin / seriesVo2MlMin,
    pctPeakVo2: percentOf(vo2MlMin, context.peakVo2MlMin),
    pctPredictedPeakVo2: percentOf(vo2MlMin, context.predictedPeakVo2MlMin),
  };
}
