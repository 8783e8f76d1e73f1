/**
 * What a V-slope chart shows, computed once for the workbench and the report (Beaver et
 * al., J Appl Physiol 1986;60:2020–7): VCO2 against VO2 over the analysed
 * window (the incremental phase up to VT2, or to its end without a VT2), the ramp above VT2
 * kept as faint context, rest, unloaded pedalling and recovery left out; the two regression
 * lines of the V-slope fit with their slopes; the line of identity (slope 1); and one range
 * for both axes, so a slope of 1 is drawn at 45° and the bend is not flattened.
 * Units: mL/min on both axes.
 */
import type { ThresholdPoint } from '../case/case-file';
import type { LineSegment, MethodOutcome, TestAnalysis } from '../model/analysis';
import { maxOf, minOf } from '../math/stats';

export interface VslopeLine {
  readonly part: 'below' | 'above';
  readonly slope: number;
  readonly from: readonly [number, number];
  readonly to: readonly [number, number];
}

/** [VO2 mL/min, VCO2 mL/min, time s]: the time is for a hover label, not a plotted axis. */
export type VslopePoint = readonly [number, number, number];

export interface VslopeView {
  /** Points inside the analysed window: [VO2, VCO2, time of the recording in s]. */
  readonly analysed: readonly VslopePoint[];
  /** Ramp points above VT2 (outside the fitted window), drawn faint. */
  readonly outside: readonly VslopePoint[];
  readonly windowS: readonly [number, number];
  readonly lines: readonly VslopeLine[];
  /** Label of the method whose fit is drawn, or null when no V-slope fit was found. */
  readonly fitLabel: string | null;
  /** The one range for both axes, mL/min. */
  readonly range: readonly [number, number];
  readonly vt1Vo2MlMin: number | null;
}

/** The V-slope fit to draw: the two-regression V-slope first, then the hinge, then any VCO2-on-VO2 fit. */
function fitToDraw(methods: readonly MethodOutcome[]): Extract<MethodOutcome, { found: true }> | null {
  const fits = methods.filter((m): m is Extract<MethodOutcome, { found: true }> => m.found && m.evidence.xName === 'vo2MlMin' && m.evidence.yName === 'vco2MlMin' && m.evidence.segments.length >= 2);
  return fits.find((m) => m.method === 'vslope') ?? fits.find((m) => m.method === 'vslope-hinge') ?? fits[0] ?? null;
}

function lineOf(part: VslopeLine['part'], s: LineSegment): VslopeLine {
  return { part, slope: s.slope, from: [s.x0, s.intercept + s.slope * s.x0], to: [s.x1, s.intercept + s.slope * s.x1] };
}

/** Rounds a range outward to a step of 250 mL/min, so the ticks fall on round numbers. */
function roundOut(lo: number, hi: number): [number, number] {
  const step = 250;
  return [Math.floor(lo / step) * step, Math.ceil(hi / step) * step];
}

export function vslopeView(a: TestAnalysis, used: { readonly vt1: ThresholdPoint | null; readonly vt2: ThresholdPoint | null }): VslopeView {
  const { timeS, vo2MlMin, vco2MlMin } = a.series;
  const start = a.phases.incrementalStartS;
  const end = a.phases.incrementalEndS;
  const upper = used.vt2 && used.vt2.timeS > start ? Math.min(used.vt2.timeS, end) : end;
  const analysed: VslopePoint[] = [];
  const outside: VslopePoint[] = [];
  for (let i = 0; i < timeS.length; i++) {
    const t = timeS[i];
    if (t < start || t > end || !Number.isFinite(vo2MlMin[i]) || !Number.isFinite(vco2MlMin[i])) continue;
    (t <= upper ? analysed : outside).push([vo2MlMin[i], vco2MlMin[i], t]);
  }
  const fit = fitToDraw(a.vt1.methods);
  const segments = fit ? [...fit.evidence.segments].sort((p, q) => p.x0 - q.x0) : [];
  const lines = segments.length >= 2 ? [lineOf('below', segments[0]), lineOf('above', segments[segments.length - 1])] : [];
  const all = [...analysed, ...outside].flatMap((p) => [p[0], p[1]]);
  const lo = all.length > 0 ? minOf(all) : 0;
  const hi = all.length > 0 ? maxOf(all) : 1000;
  return { analysed, outside, windowS: [start, upper], lines, fitLabel: fit ? fit.label : null, range: roundOut(lo, hi), vt1Vo2MlMin: used.vt1?.vo2MlMin ?? null };
}
