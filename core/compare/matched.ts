/**
 * The two days at matched workloads: VO2, HR, VE, RER and VE/VCO2 at each common workload
 * step and at each day's VT1 workload, read from each day's processed series.
 *
 * Method (common practice; the window rule is Twofold's own): only the incremental phase is
 * used (phases.incrementalStartS to incrementalEndS), so recovery, where the load falls, is
 * never read. The load is made non-decreasing by a running maximum, so a momentary dip of
 * the averaged load is not read twice. A value at a target workload W is read from every ramp
 * point whose load lies within W ± one workload step (settings.compare.workloadStepW, 10 W by
 * default), not from one moment of the series, so breath-to-breath noise does not decide it:
 * - 'local-fit': a least-squares line of the variable on load through those points,
 *   evaluated at W, when there are at least 3 points spanning at least half a step of load
 *   (a ramp);
 * - 'window-mean': the mean of those points, when the load does not vary enough within the
 *   window to fit a line (a held step of a step protocol);
 * - 'none': no point within the window.
 * Each row says which reading each day got. Common steps are the multiples of the workload
 * step inside the range both days covered. Treadmill tests have no workload in watts: the
 * table is then not available.
 * Units: W, mL/min, bpm, L/min; RER and VE/VCO2 unitless (VE in L/min × 1000 / VCO2 mL/min).
 */
import type { ProcessedSeries, TestAnalysis } from '../model/analysis';
import type { Settings } from '../model/settings';
import { linearFit } from '../math/linear-fit';
import { maxOf, mean, minOf } from '../math/stats';
import { firstIndexWhere } from '../math/sorted';

export type MatchedVariable = 'vo2MlMin' | 'hrBpm' | 'veLMin' | 'rer' | 'veVco2';
export const MATCHED_VARIABLES: readonly MatchedVariable[] = ['vo2MlMin', 'hrBpm', 'veLMin', 'rer', 'veVco2'];

export interface MatchedValue {
  readonly day1: number | null;
  readonly day2: number | null;
  readonly delta: number | null;
  readonly deltaPct: number | null;
}

/** How a day's value at a workload was read (module comment). */
export type MatchedReading = 'local-fit' | 'window-mean' | 'none';

export interface MatchedRow {
  readonly workW: number;
  /** `step`: a common workload step; `vt1_day1` / `vt1_day2`: that day's VT1 workload. */
  readonly kind: 'step' | 'vt1_day1' | 'vt1_day2';
  readonly values: Readonly<Record<MatchedVariable, MatchedValue>>;
  /** How each day's VO2 at this workload was read (the other variables are read the same way). */
  readonly reading: { readonly day1: MatchedReading; readonly day2: MatchedReading };
}

export type MatchedWorkloads =
  | {
      readonly available: true;
      readonly rangeW: readonly [number, number];
      readonly stepW: number;
      /** Half-width of the load window a value is read from, W. */
      readonly windowW: number;
      readonly rows: readonly MatchedRow[];
    }
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

/** Fewest points, and least spread of load (as a share of the window's half-width), for a local fit. */
const FIT_MIN_POINTS = 3;
const FIT_MIN_SPREAD = 0.5;

/** How the value at `targetW` is read, and the value (see the module comment); null outside the ramp. */
function readAtWork(ramp: RampSeries, variable: MatchedVariable, targetW: number, halfW: number): { value: number | null; reading: MatchedReading } {
  const w = ramp.workW;
  if (w.length === 0 || targetW < w[0] || targetW > w[w.length - 1]) return { value: null, reading: 'none' };
  const y = ramp.values[variable];
  const xs: number[] = [];
  const ys: number[] = [];
  // The load is a running maximum, so the points within the window are one run of the ramp:
  // from the first whose distance below the target is at most halfW to the last within it.
  for (let i = firstIndexWhere(w, (x) => x - targetW >= -halfW); i < w.length && w[i] - targetW <= halfW; i++) {
    const v = y[i];
    if (v !== null && Number.isFinite(v)) {
      xs.push(w[i]);
      ys.push(v);
    }
  }
  if (xs.length === 0) return { value: null, reading: 'none' };
  const spread = maxOf(xs) - minOf(xs);
  const fit = xs.length >= FIT_MIN_POINTS && spread >= FIT_MIN_SPREAD * halfW ? linearFit(xs, ys) : null;
  if (fit) return { value: fit.intercept + fit.slope * targetW, reading: 'local-fit' };
  return { value: mean(ys), reading: 'window-mean' };
}

function pair(day1: number | null, day2: number | null): MatchedValue {
  const delta = day1 !== null && day2 !== null ? day2 - day1 : null;
  const deltaPct = delta !== null && day1 !== null && day1 !== 0 ? (100 * delta) / Math.abs(day1) : null;
  return { day1, day2, delta, deltaPct };
}

function row(r1: RampSeries, r2: RampSeries, workW: number, kind: MatchedRow['kind'], halfW: number): MatchedRow {
  const values = {} as Record<MatchedVariable, MatchedValue>;
  const reading = { day1: 'none' as MatchedReading, day2: 'none' as MatchedReading };
  for (const v of MATCHED_VARIABLES) {
    const a = readAtWork(r1, v, workW, halfW);
    const b = readAtWork(r2, v, workW, halfW);
    values[v] = pair(a.value, b.value);
    if (v === 'vo2MlMin') Object.assign(reading, { day1: a.reading, day2: b.reading });
  }
  return { workW, kind, values, reading };
}

/** The reading rule in one sentence, for the report and the command line. */
export function matchedReadingText(windowW: number): string {
  return `Each value is read from the ramp points within ±${windowW.toFixed(0)} W of the workload: a least-squares line on workload through them (local fit), or their mean where the load is held (window mean); recovery is never read.`;
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
  const windowW = stepW;
  const rows: MatchedRow[] = [];
  if (stepW > 0) {
    // Small epsilon so a step exactly at either end of the range is kept despite rounding.
    const first = Math.ceil(lo / stepW - 1e-9);
    const last = Math.floor(hi / stepW + 1e-9);
    for (let k = first; k <= last; k++) rows.push(row(r1, r2, k * stepW + 0, 'step', windowW));
  }
  const vt1Work1 = day1.vt1.at?.workW ?? null;
  const vt1Work2 = day2.vt1.at?.workW ?? null;
  if (vt1Work1 !== null) rows.push(row(r1, r2, vt1Work1, 'vt1_day1', windowW));
  if (vt1Work2 !== null) rows.push(row(r1, r2, vt1Work2, 'vt1_day2', windowW));
  return { available: true, rangeW: [lo, hi], stepW, windowW, rows };
}
