/**
 * Chart data for reviewing one day's thresholds, drawn from exactly what core computed: the
 * processed series, each method's fitted segments (its evidence), the consensus with its
 * 95% interval, and the threshold as it now stands (automatic or reviewer's).
 * Nothing here computes an estimate; ratios such as VE/VO2 are the plotted quantities.
 */
import { clockAxis, clockHover } from './clock-axis';
import type { MethodOutcome, ThresholdId } from '../../../core/model/analysis';
import type { DayOutcome, ThresholdState } from '../../../core/case/recompute';
import { vslopeView, type VslopePoint } from '../../../core/report/vslope-view';
import { clock } from '../ui/format';
import { OKABE_ITO, SERIES_STYLE, THRESHOLD_COLOUR, THRESHOLD_STYLE, VSLOPE_STYLE, plotlyDash } from './palette';

type Trace = Record<string, unknown>;
type Shape = Record<string, unknown>;

const IDS: readonly ThresholdId[] = ['vt1', 'vt2'];

function ratio(num: readonly number[], den: readonly number[], scale: number): (number | null)[] {
  return num.map((n, i) => (den[i] > 0 ? (n / den[i]) * scale : null));
}

/** Vertical line at x for a threshold, with its interval as a shaded band. */
function markLines(day: DayOutcome, axis: 'time' | 'vo2'): { shapes: Shape[]; annotations: Record<string, unknown>[] } {
  const shapes: Shape[] = [];
  const annotations: Record<string, unknown>[] = [];
  for (const id of IDS) {
    const state: ThresholdState = day[id];
    const colour = THRESHOLD_COLOUR[id];
    const ci = axis === 'time' ? state.automatic.ci95TimeS : state.automatic.ci95Vo2MlMin;
    if (ci) shapes.push({ type: 'rect', xref: 'x', yref: 'paper', x0: ci[0], x1: ci[1], y0: 0, y1: 1, fillcolor: colour, opacity: 0.14, line: { width: 0 }, layer: 'below' });
    if (state.override && state.automatic.at) {
      const x = axis === 'time' ? state.automatic.at.timeS : state.automatic.at.vo2MlMin;
      shapes.push({ type: 'line', xref: 'x', yref: 'paper', x0: x, x1: x, y0: 0, y1: 1, line: { color: colour, width: 1, dash: 'dot' } });
    }
    if (state.effective) {
      const x = axis === 'time' ? state.effective.timeS : state.effective.vo2MlMin;
      shapes.push({ type: 'line', xref: 'x', yref: 'paper', x0: x, x1: x, y0: 0, y1: 1, line: { color: colour, width: 2.5, dash: plotlyDash(THRESHOLD_STYLE[id].dash) } });
      annotations.push({ x, y: 1, xref: 'x', yref: 'paper', yanchor: 'bottom', text: `${id.toUpperCase()}${state.override ? ' (reviewer)' : ''}`, showarrow: false, font: { color: colour, size: 12 } });
    }
  }
  return { shapes, annotations };
}

function methodMarks(methods: readonly MethodOutcome[], axis: 'time' | 'vo2', id: ThresholdId): Trace | null {
  const found = methods.filter((m): m is Extract<MethodOutcome, { found: true }> => m.found);
  if (found.length === 0) return null;
  return {
    type: 'scatter',
    mode: 'markers',
    name: `${id.toUpperCase()} by method`,
    x: found.map((m) => (axis === 'time' ? m.timeS : m.vo2MlMin)),
    yaxis: 'y2',
    y: found.map(() => (id === 'vt1' ? 0.04 : 0.08)),
    text: found.map((m) => m.label),
    customdata: found.map((m) => clock(m.timeS)),
    hovertemplate: axis === 'time' ? '%{text}: %{customdata}<extra></extra>' : '%{text}: VO₂ %{x:.0f} mL/min at %{customdata}<extra></extra>',
    marker: { symbol: id === 'vt1' ? 'triangle-up' : 'diamond', size: 11, color: THRESHOLD_COLOUR[id], line: { color: OKABE_ITO.black, width: 1 } },
  };
}

const markerY2 = { overlaying: 'y', range: [0, 1], visible: false, fixedrange: true };

/**
 * V-slope over the analysed window (core/report/vslope-view.ts, shared with the report): the
 * ramp up to VT2, the ramp above it faint, rest and recovery left out; equal axis scales, the
 * line of identity and the fit's two regression lines named with their slopes.
 */
export function vSlopeChart(day: DayOutcome) {
  const view = vslopeView(day.analysis, { vt1: day.vt1.effective, vt2: day.vt2.effective });
  const xs = (pts: readonly VslopePoint[]) => pts.map((p) => p[0]);
  const ys = (pts: readonly VslopePoint[]) => pts.map((p) => p[1]);
  // Each point's time of the recording in m:ss, so a reviewer can find it on the time charts.
  const hover = (pts: readonly VslopePoint[]) => clockHover(pts.map((p) => p[2]), 'VO₂ %{x:.0f} mL/min, VCO₂ %{y:.0f} mL/min');
  const [lo, hi] = view.range;
  const data: Trace[] = [
    { type: 'scatter', mode: 'markers', name: 'ramp above VT2 (not fitted)', x: xs(view.outside), y: ys(view.outside), marker: { color: VSLOPE_STYLE.outside, size: 4 }, ...hover(view.outside) },
    { type: 'scatter', mode: 'markers', name: 'VCO₂ against VO₂ (analysed window)', x: xs(view.analysed), y: ys(view.analysed), marker: { color: VSLOPE_STYLE.analysed, size: 4, opacity: 0.55 }, ...hover(view.analysed) },
    { type: 'scatter', mode: 'lines', name: 'line of identity (slope 1)', x: [lo, hi], y: [lo, hi], line: { color: VSLOPE_STYLE.identity.colour, width: 1.5, dash: plotlyDash(VSLOPE_STYLE.identity.dash) }, hoverinfo: 'skip' },
  ];
  for (const l of view.lines) {
    const style = l.part === 'below' ? VSLOPE_STYLE.below : VSLOPE_STYLE.above;
    const name = `${l.part === 'below' ? 'below VT1' : 'above VT1'}: slope ${l.slope.toFixed(2)}`;
    data.push({ type: 'scatter', mode: 'lines', name, x: [l.from[0], l.to[0]], y: [l.from[1], l.to[1]], line: { color: style.colour, width: 2.5 }, hovertemplate: `${view.fitLabel ?? 'fit'}, ${name}<extra></extra>` });
  }
  const vt1Marks = methodMarks(day.vt1.automatic.methods, 'vo2', 'vt1');
  if (vt1Marks) data.push(vt1Marks);
  const marks = markLines(day, 'vo2');
  return {
    data,
    layout: {
      title: { text: `V-slope: VCO₂ against VO₂${view.fitLabel ? ` (fit: ${view.fitLabel})` : ''}` },
      xaxis: { title: { text: 'VO₂ (mL/min)' }, range: [lo, hi], constrain: 'domain' },
      yaxis: { title: { text: 'VCO₂ (mL/min)' }, range: [lo, hi], scaleanchor: 'x', scaleratio: 1, constrain: 'domain' },
      yaxis2: markerY2,
      // The plot is square, so the box has room beside it: the legend stands to the right of
      // the plot, one entry a line, away from both axis titles (below and left of the plot).
      legend: { orientation: 'v', x: 1.02, xanchor: 'left', y: 1, yanchor: 'top' },
      ...marks,
    },
  };
}

export function equivalentsChart(day: DayOutcome) {
  const s = day.analysis.series;
  const data: Trace[] = [
    { type: 'scatter', mode: 'lines', name: 'VE/VO₂', x: s.timeS, y: ratio(s.veLMin, s.vo2MlMin, 1000), line: { color: SERIES_STYLE.veVo2.colour, width: 2, dash: plotlyDash(SERIES_STYLE.veVo2.dash) }, ...clockHover(s.timeS, 'VE/VO₂ %{y:.1f}') },
    { type: 'scatter', mode: 'lines', name: 'VE/VCO₂', x: s.timeS, y: ratio(s.veLMin, s.vco2MlMin, 1000), line: { color: SERIES_STYLE.veVco2.colour, width: 2, dash: plotlyDash(SERIES_STYLE.veVco2.dash) }, ...clockHover(s.timeS, 'VE/VCO₂ %{y:.1f}') },
  ];
  for (const id of IDS) {
    const m = methodMarks(day[id].automatic.methods, 'time', id);
    if (m) data.push(m);
  }
  return {
    data,
    layout: {
      title: { text: 'Ventilatory equivalents against time' },
      xaxis: clockAxis(s.timeS[s.timeS.length - 1] ?? 0),
      yaxis: { title: { text: 'VE/VO₂, VE/VCO₂ (L/L, no unit)' } },
      yaxis2: markerY2,
      legend: { orientation: 'h', y: -0.22 },
      ...markLines(day, 'time'),
    },
  };
}

export function endTidalChart(day: DayOutcome) {
  const s = day.analysis.series;
  const data: Trace[] = [
    { type: 'scatter', mode: 'lines', name: 'PetO₂', x: s.timeS, y: s.peto2Mmhg, line: { color: SERIES_STYLE.peto2.colour, width: 2, dash: plotlyDash(SERIES_STYLE.peto2.dash) }, ...clockHover(s.timeS, 'PetO₂ %{y:.0f} mmHg') },
    { type: 'scatter', mode: 'lines', name: 'PetCO₂', x: s.timeS, y: s.petco2Mmhg, line: { color: SERIES_STYLE.petco2.colour, width: 2, dash: plotlyDash(SERIES_STYLE.petco2.dash) }, ...clockHover(s.timeS, 'PetCO₂ %{y:.0f} mmHg') },
  ];
  return {
    data,
    layout: {
      title: { text: 'End-tidal pressures against time' },
      xaxis: clockAxis(s.timeS[s.timeS.length - 1] ?? 0),
      yaxis: { title: { text: 'PetO₂, PetCO₂ (mmHg)' } },
      legend: { orientation: 'h', y: -0.22 },
      ...markLines(day, 'time'),
    },
  };
}
