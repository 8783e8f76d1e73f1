/**
 * Derived measures of one test.
 *
 * - VE/VCO2 slope: ordinary least squares of VE (L/min) on VCO2 (L/min) from the start of
 *   the incremental phase to VT2 (to the end of the phase when VT2 was not found); unitless.
 *   (ATS/ACCP, Am J Respir Crit Care Med 2003;167:211–77.)
 * - OUES: slope b of VO2 (mL/min) = a + b·log10 VE (L/min) over the incremental phase
 *   (Baba et al., J Am Coll Cardiol 1996;28:1567–72).
 * - ΔVO2/ΔWR: slope of VO2 (mL/min) on work (W) over the incremental phase, leaving out its
 *   first 60 s while VO2 catches up with the ramp (VO2 kinetics, mean response time about
 *   40–60 s (memory)); mL/min/W.
 * - Breathing reserve: MVV − peak VE (L/min) and as % of MVV; MVV measured, or FEV1 × 40
 *   when only FEV1 is given (common practice).
 * - HR reserve: predicted HRmax − peak HR (bpm), the chronotropic reserve as CPET reports
 *   use it (ATS/ACCP 2003); not the Karvonen peak − rest.
 * - Weber class by peak VO2/kg: A > 20, B 16–20, C 10–16 (10 ≤ x < 16), D < 10 mL/kg/min
 *   (Weber et al., Circulation 1982;65:1213–23). A value of exactly 20 or 16 is B.
 *
 * Example: peak VO2/kg 17.0 → Weber B.
 */
import type { ProcessedSeries, WeberClass } from '../model/analysis';
import { linearFit } from '../math/linear-fit';
import { indexRangeWithin } from '../math/sorted';

export interface Window {
  readonly fromS: number;
  readonly toS: number;
}

/** The (x, y) pairs inside the window (the series in time order), finite both. Typed arrays: see core/thresholds/window.ts. */
function pairs(series: ProcessedSeries, w: Window, pick: (i: number) => [number, number] | null): [Float64Array, Float64Array] {
  const [first, last] = indexRangeWithin(series.timeS, w.fromS, w.toS);
  const x = new Float64Array(last - first);
  const y = new Float64Array(last - first);
  let k = 0;
  for (let i = first; i < last; i++) {
    const p = pick(i);
    if (p && Number.isFinite(p[0]) && Number.isFinite(p[1])) {
      x[k] = p[0];
      y[k] = p[1];
      k++;
    }
  }
  return [x.subarray(0, k), y.subarray(0, k)];
}

export function veVco2Slope(series: ProcessedSeries, w: Window): number | null {
  const [x, y] = pairs(series, w, (i) => [series.vco2MlMin[i] / 1000, series.veLMin[i]]);
  return linearFit(x, y)?.slope ?? null;
}

export function oues(series: ProcessedSeries, w: Window): number | null {
  const [x, y] = pairs(series, w, (i) => (series.veLMin[i] > 0 ? [Math.log10(series.veLMin[i]), series.vo2MlMin[i]] : null));
  return linearFit(x, y)?.slope ?? null;
}

export function dVo2dWr(series: ProcessedSeries, w: Window): number | null {
  const [x, y] = pairs(series, w, (i) => {
    const work = series.workW[i];
    return work === null ? null : [work, series.vo2MlMin[i]];
  });
  return linearFit(x, y)?.slope ?? null;
}

/** MVV in L/min: measured, else FEV1 (L) × 40 (common practice), else null. */
export function mvvLMin(measuredMvvLMin: number | null, fev1L: number | null): number | null {
  if (measuredMvvLMin !== null) return measuredMvvLMin;
  return fev1L === null ? null : fev1L * 40;
}

export function breathingReserve(mvv: number | null, peakVeLMin: number): { lMin: number | null; pct: number | null } {
  if (mvv === null || !(mvv > 0) || !Number.isFinite(peakVeLMin)) return { lMin: null, pct: null };
  return { lMin: mvv - peakVeLMin, pct: (100 * (mvv - peakVeLMin)) / mvv };
}

export function hrReserve(predictedHrMaxBpm: number | null, peakHrBpm: number | null): number | null {
  return predictedHrMaxBpm === null || peakHrBpm === null ? null : predictedHrMaxBpm - peakHrBpm;
}

export function weberClass(peakVo2MlKgMin: number | null): WeberClass | null {
  if (peakVo2MlKgMin === null || !Number.isFinite(peakVo2MlKgMin)) return null;
  if (peakVo2MlKgMin > 20) return 'A';
  if (peakVo2MlKgMin >= 16) return 'B';
  if (peakVo2MlKgMin >= 10) return 'C';
  return 'D';
}
