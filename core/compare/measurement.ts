/**
 * Each day's measurement uncertainty of a compared value, as the SD of ln(value). Read from
 * what the analysis already computed, never re-derived:
 *
 * - at a threshold: the threshold's 95 % interval (ThresholdResult.ci95Vo2MlMin for VO2;
 *   ci95TimeS for every other value, read off the processed series at both ends of the time
 *   interval: workload, HR, time from ramp start, VE/VCO2, VE/VO2). SD = |ln hi − ln lo| / (2 · 1.96).
 *   Assumption: the value changes monotonically across the interval (true of VO2, workload,
 *   HR and time; VE/VCO2 near its nadir is understated).
 * - at the peak: the peak is a mean over settings.peaks.windowS (30 s, common practice). Its SD
 *   is the relative SD of the processed series about a straight line over the last such window
 *   of the incremental phase, scaled by √(averaging window / peak window) for the extra
 *   averaging (an approximation: successive averaged points are correlated). For peak VO2 (and
 *   VO2/kg) a floor `PEAK_VO2_FLOOR_SD` is added in quadrature: on development pairs of both
 *   generator families the scatter alone covered the true change's measurement error in only
 *   66–82 % of pairs (the breath noise is correlated, and the peak window is the highest one).
 * - peak workload and exercise duration are set by the ergometer and the clock: SD 0.
 * - VE/VCO2 slope and OUES: no interval in the analysis; null (the band alone applies).
 */
import type { ProcessedSeries, TestAnalysis } from '../model/analysis';
import { linearFit } from '../math/linear-fit';
import { firstIndexWhere } from '../math/sorted';
import { Z95 } from './bands';
import type { MetricId } from './types';

type SeriesKey = 'vo2MlMin' | 'vco2MlMin' | 'veLMin' | 'hrBpm' | 'workW';

/** Linear interpolation of one series at time t; null outside the series or across a gap. */
export function seriesAt(series: ProcessedSeries, key: SeriesKey, t: number): number | null {
  const ts = series.timeS;
  const ys = series[key] as readonly (number | null)[];
  if (ts.length === 0 || t < ts[0] || t > ts[ts.length - 1]) return null;
  // The first index from 1 at or after t (the last one when none is), found by bisection.
  const hi = Math.min(ts.length - 1, firstIndexWhere(ts, (x) => x >= t, 1));
  const lo = Math.max(0, hi - 1);
  const y0 = ys[lo];
  const y1 = ys[hi];
  if (y0 === null || y1 === null) return y0 ?? y1 ?? null;
  const span = ts[hi] - ts[lo];
  return span > 0 ? y0 + ((y1 - y0) * (t - ts[lo])) / span : y0;
}

function sdFromEnds(lo: number | null, hi: number | null): number | null {
  if (lo === null || hi === null || !(lo > 0) || !(hi > 0)) return null;
  return Math.abs(Math.log(hi) - Math.log(lo)) / (2 * Z95);
}

function atTimeValue(test: TestAnalysis, id: MetricId, t: number): number | null {
  const s = test.series;
  switch (id) {
    case 'vt1_work':
    case 'vt2_work':
      return seriesAt(s, 'workW', t);
    case 'vt1_hr':
      return seriesAt(s, 'hrBpm', t);
    case 'vt1_time':
      return t - test.phases.incrementalStartS;
    case 'vt1_ve_vco2': {
      const ve = seriesAt(s, 'veLMin', t);
      const vco2 = seriesAt(s, 'vco2MlMin', t);
      return ve !== null && vco2 ? (1000 * ve) / vco2 : null;
    }
    case 'vt1_ve_vo2': {
      const ve = seriesAt(s, 'veLMin', t);
      const vo2 = seriesAt(s, 'vo2MlMin', t);
      return ve !== null && vo2 ? (1000 * ve) / vo2 : null;
    }
    default:
      return null;
  }
}

function peakSd(test: TestAnalysis, key: SeriesKey): number | null {
  const settings = test.provenance.settings;
  const windowS = settings.peaks.windowS;
  const end = test.phases.incrementalEndS;
  const xs: number[] = [];
  const ys: number[] = [];
  const ts = test.series.timeS;
  const values = test.series[key];
  // The window's points in time order, from the first at or after its start.
  for (let i = firstIndexWhere(ts, (t) => t >= end - windowS); i < ts.length && ts[i] <= end; i++) {
    const y = values[i];
    if (y !== null && y > 0) {
      xs.push(ts[i]);
      ys.push(Math.log(y));
    }
  }
  if (xs.length < 4) return null;
  const fit = linearFit(xs, ys);
  if (!fit) return null;
  let ss = 0;
  for (let i = 0; i < xs.length; i++) ss += (ys[i] - (fit.intercept + fit.slope * xs[i])) ** 2;
  const sd = Math.sqrt(ss / (xs.length - 2));
  const avg = settings.clean.averaging;
  const avgS = avg.kind === 'rolling-time' ? avg.windowS : windowS;
  return sd * Math.sqrt(Math.min(1, avgS / windowS));
}

/**
 * SD floor of ln(peak VO2) per day, added in quadrature to the window's scatter. Set on
 * development pairs (family A from seed 9000, family B from 49000; 800 pairs) so that the
 * change's 95 % measurement interval held the true change error in about 95 % of pairs
 * (94–97.5 % per family and kind with 0.014). Our calibration, not a published value.
 */
export const PEAK_VO2_FLOOR_SD = 0.014;

export interface MeasurementSd {
  readonly sd: number | null;
  readonly how: string;
}

/** The measurement SD of ln(value) for one metric on one day. */
export function measurementSd(test: TestAnalysis, id: MetricId): MeasurementSd {
  const threshold = id.startsWith('vt1_') ? test.vt1 : id.startsWith('vt2_') ? test.vt2 : null;
  if (threshold) {
    if (id === 'vt1_vo2' || id === 'vt1_vo2_kg' || id === 'vt2_vo2') {
      const ci = threshold.ci95Vo2MlMin;
      return { sd: ci ? sdFromEnds(ci[0], ci[1]) : null, how: `the ${threshold.id.toUpperCase()} 95 % interval of VO2` };
    }
    const ci = threshold.ci95TimeS;
    const how = `the value at both ends of the ${threshold.id.toUpperCase()} 95 % time interval`;
    return { sd: ci ? sdFromEnds(atTimeValue(test, id, ci[0]), atTimeValue(test, id, ci[1])) : null, how };
  }
  switch (id) {
    case 'peak_vo2':
    case 'peak_vo2_kg': {
      const sd = peakSd(test, 'vo2MlMin');
      return { sd: sd === null ? null : Math.hypot(sd, PEAK_VO2_FLOOR_SD), how: 'the scatter of VO2 over the peak averaging window, with a 1.4 % floor' };
    }
    case 'peak_ve':
      return { sd: peakSd(test, 'veLMin'), how: 'the scatter of VE over the peak averaging window' };
    case 'peak_hr':
      return { sd: peakSd(test, 'hrBpm'), how: 'the scatter of HR over the peak averaging window' };
    case 'peak_o2_pulse': {
      const a = peakSd(test, 'vo2MlMin');
      const b = peakSd(test, 'hrBpm');
      return { sd: a !== null && b !== null ? Math.sqrt(a * a + b * b) : null, how: 'the scatter of VO2 and HR over the peak averaging window' };
    }
    case 'peak_work':
      return { sd: 0, how: 'the load set by the ergometer (no measurement uncertainty)' };
    case 'duration':
      return { sd: 0, how: 'the clock (no measurement uncertainty)' };
    default:
      return { sd: null, how: 'no interval in the analysis (band only)' };
  }
}
