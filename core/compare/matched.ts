/**
 * The two days at matched workloads: VO2, HR, VE, RER and VE/VCO2 at each common workload
 * step and at each day's VT1 workload, read from each day's processed series.
 *
 * Method (common practice): only the incremental phase is used (phases.incrementalStartS to
 * incrementalEndS), so recovery, where the load falls, is never read. On it, a variable is
 * linearly interpolated at the first moment the load reaches the target workload (load made
 * non-decreasing by a running maximum, so a momentary dip of the averaged load is not read
 * twice). Common steps are the multiples of settings.compare.workloadStepW inside the range
 * both days covered. Assumes a ramp; on a step protocol this reads the moment a step is first
 * reached. Treadmill tests have no workload in watts: the table is then not available.
 * Units: W, mL/min, bpm, L/min; RER and VE/VCO2 unitless (VE in L/min × 1000 / VCO2 mL/min).
 */
import type { ProcessedSeries, TestAnalysis } from '../model/analysis';
import type { Settings } from '../model/settings';

export type MatchedVariable = 'vo2MlMin' | 'hrBpm' | 'veLMin' | 'rer' | 'veVco2';
export const MATCHED_VARIABLES: readonly MatchedVariable[] = ['vo2MlMin', 'hrBpm', 'veLMin', 'rer', 'veVco2'];

export interface MatchedValue {
  readonly day1: number | null;
  readonly day2: number | null;
  readonly delta: number | null;
  readonly deltaPct: number | null;
}

export interface MatchedRow {
  readonly workW: number;
  /** `step`: a common workload step; `vt1_day1` / `vt1_day2`: that day's VT1 workload. */
  readonly kind: 'step' | 'vt1_day1' | 'vt1_day2';
  readonly values: Readonly<Record<MatchedVariable, MatchedValue>>;
}

export type MatchedWorkloads =
  | { readonly available: true; readonly rangeW: readonly [number, number]; readonly stepW: number; readonly rows: readonly MatchedRow[] }
  | { readonly available: false; readonly reason: string };

interface RampSeries {
  readonly workW: number[];
  readonly values: Record<MatchedVariable, (number | null)[]>;
}

function rampOf(series: ProcessedSeries, fromS: number, toS: number): RampSeries {
  const workW: number[] = [];
  const values: Record<MatchedVariable, (number | null)[]> = { vo2MlMin: [], hrBpm: [], veLMin: [], rer: [], veVco2: [] };
  let runningMax = -Infinity;
  for (let i = 0; i < series.timeS.length; i++) {
    const t = series.timeS[i];
    const w = series.workW[i];
    if (t < fromS || t > toS || w === null || !Number.isFinite(w)) continue;
    runningMax = Math.max(runningMax, w);
    workW.push(runningMax);
    const vo2 = series.vo2MlMin[i];
    const vco2 = series.vco2MlMin[i];
    const ve = series.veLMin[i];
    values.vo2MlMin.push(vo2);
    values.hrBpm.push(series.hrBpm[i]);
    values.veLMin.push(ve);
    values.rer.push(vo2 > 0 ? vco2 / vo2 : null);
    values.veVco2.push(vco2 > 0 ? (1000 * ve) / vco2 : null);
  }
  return { workW, values };
}

/** Value at the first moment the (non-decreasing) load reaches `targetW`; null outside the ramp. */
function valueAtWork(ramp: RampSeries, variable: MatchedVariable, targetW: number): number | null {
  const w = ramp.workW;
  if (w.length === 0 || targetW < w[0] || targetW > w[w.length - 1]) return null;
  const y = ramp.values[variable];
  let i = 0;
  while (w[i] < targetW) i++;
  if (w[i] === targetW || i === 0) return y[i];
  const y0 = y[i - 1];
  const y1 = y[i];
  if (y0 === null || y1 === null) return null;
  const f = (targetW - w[i - 1]) / (w[i] - w[i - 1]);
  return y0 + f * (y1 - y0);
}

function pair(day1: number | null, day2: number | null): MatchedValue {
  const delta = day1 !== null && day2 !== null ? day2 - day1 : null;
  const deltaPct = delta !== null && day1 !== null && day1 !== 0 ? (100 * delta) / Math.abs(day1) : null;
  return { day1, day2, delta, deltaPct };
}

function row(r1: RampSeries, r2: RampSeries, workW: number, kind: MatchedRow['kind']): MatchedRow {
  const values = {} as Record<MatchedVariable, MatchedValue>;
  for (const v of MATCHED_VARIABLES) values[v] = pair(valueAtWork(r1, v, workW), valueAtWork(r2, v, workW));
  return { workW, kind, values };
}

export function matchedWorkloads(day1: TestAnalysis, day2: TestAnalysis, settings: Settings): MatchedWorkloads {
  const treadmill = [day1.metadata.modality === 'treadmill' ? 'day 1' : null, day2.metadata.modality === 'treadmill' ? 'day 2' : null].filter(Boolean);
  if (treadmill.length > 0) return { available: false, reason: `Not available: ${treadmill.join(' and ')} on a treadmill, which has no workload in watts.` };
  const r1 = rampOf(day1.series, day1.phases.incrementalStartS, day1.phases.incrementalEndS);
  const r2 = rampOf(day2.series, day2.phases.incrementalStartS, day2.phases.incrementalEndS);
  const noLoad = [r1.workW.length < 2 ? 'day 1' : null, r2.workW.length < 2 ? 'day 2' : null].filter(Boolean);
  if (noLoad.length > 0) return { available: false, reason: `Not available: no workload recorded during the incremental phase on ${noLoad.join(' and ')}.` };
  const lo = Math.max(r1.workW[0], r2.workW[0]);
  const hi = Math.min(r1.workW[r1.workW.length - 1], r2.workW[r2.workW.length - 1]);
  if (!(hi > lo)) return { available: false, reason: 'Not available: the two days share no workload range during the incremental phase.' };
  const stepW = settings.compare.workloadStepW;
  const rows: MatchedRow[] = [];
  if (stepW > 0) {
    // Small epsilon so a step exactly at either end of the range is kept despite rounding.
    const first = Math.ceil(lo / stepW - 1e-9);
    const last = Math.floor(hi / stepW + 1e-9);
    for (let k = first; k <= last; k++) rows.push(row(r1, r2, k * stepW + 0, 'step'));
  }
  const vt1Work1 = day1.vt1.at?.workW ?? null;
  const vt1Work2 = day2.vt1.at?.workW ?? null;
  if (vt1Work1 !== null) rows.push(row(r1, r2, vt1Work1, 'vt1_day1'));
  if (vt1Work2 !== null) rows.push(row(r1, r2, vt1Work2, 'vt1_day2'));
  return { available: true, rangeW: [lo, hi], stepW, rows };
}
