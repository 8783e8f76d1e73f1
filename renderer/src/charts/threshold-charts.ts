/**
 * Chart data for reviewing one day's thresholds, drawn from exactly what core computed: the
 * processed series, each method's fitted segments (its evidence), the consensus with its
 * 95% interval, and the threshold as it now stands (automatic or reviewer's).
 * Nothing here computes an estimate; ratios such as VE/VO2 are the plotted quantities.
 */
import { clockAxis } from './clock-axis';
import type { MethodOutcome, ProcessedSeries, ThresholdId } from '../../../core/model/analysis';
import type { DayOutcome, ThresholdState } from '../../../core/case/recompute';
import { OKABE_ITO, THRESHOLD_COLOUR } from './palette';

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
      shapes.push({ type: 'line', xref: 'x', yref: 'paper', x0: x, x1: x, y0: 0, y1: 1, line: { color: colour, width: 2.5 } });
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
    hovertemplate: '%{text}: %{x:.0f}<extra></extra>',
    marker: { symbol: id === 'vt1' ? 'triangle-up' : 'diamond', size: 11, color: THRESHOLD_COLOUR[id], line: { color: OKABE_ITO.black, width: 1 } },
  };
}

const markerY2 = { overlaying: 'y', range: [0, 1], visible: false, fixedrange: true };

export function vSlopeChart(day: DayOutcome) {
  const s: ProcessedSeries = day.analysis.series;
  const data: Trace[] = [
    { type: 'scatter', mode: 'markers', name: 'VCO₂ against VO₂', x: s.vo2MlMin, y: s.vco2MlMin, marker: { color: OKABE_ITO.blue, size: 4, opacity: 0.7 }, hovertemplate: 'VO₂ %{x:.0f} mL/min, VCO₂ %{y:.0f} mL/min<extra></extra>' },
  ];
  const fits = day.vt1.automatic.methods.filter((m) => m.found && m.evidence.xName === 'vo2MlMin' && m.evidence.yName === 'vco2MlMin');
  for (const [k, m] of fits.entries()) {
    if (!m.found) continue;
    for (const [i, seg] of m.evidence.segments.entries()) {
      data.push({ type: 'scatter', mode: 'lines', name: `${m.label} fit`, legendgroup: m.method, showlegend: i === 0, x: [seg.x0, seg.x1], y: [seg.intercept + seg.slope * seg.x0, seg.intercept + seg.slope * seg.x1], line: { color: k === 0 ? OKABE_ITO.black : OKABE_ITO.grey, width: 2, dash: k === 0 ? 'solid' : 'dot' }, hovertemplate: `${m.label}: slope ${seg.slope.toFixed(2)}<extra></extra>` });
    }
  }
  const vt1Marks = methodMarks(day.vt1.automatic.methods, 'vo2', 'vt1');
  if (vt1Marks) data.push(vt1Marks);
  const marks = markLines(day, 'vo2');
  return {
    data,
    layout: {
      title: { text: 'V-slope: VCO₂ against VO₂' },
      xaxis: { title: { text: 'VO₂ (mL/min)' } },
      yaxis: { title: { text: 'VCO₂ (mL/min)' } },
      yaxis2: markerY2,
      legend: { orientation: 'h', y: -0.22 },
      ...marks,
    },
  };
}

export function equivalentsChart(day: DayOutcome) {
  const s = day.analysis.series;
  const data: Trace[] = [
    { type: 'scatter', mode: 'lines', name: 'VE/VO₂', x: s.timeS, y: ratio(s.veLMin, s.vo2MlMin, 1000), line: { color: OKABE_ITO.blue, width: 2 } },
    { type: 'scatter', mode: 'lines', name: 'VE/VCO₂', x: s.timeS, y: ratio(s.veLMin, s.vco2MlMin, 1000), line: { color: OKABE_ITO.vermillion, width: 2, dash: 'dash' } },
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
    { type: 'scatter', mode: 'lines', name: 'PetO₂', x: s.timeS, y: s.peto2Mmhg, line: { color: OKABE_ITO.blue, width: 2 } },
    { type: 'scatter', mode: 'lines', name: 'PetCO₂', x: s.timeS, y: s.petco2Mmhg, line: { color: OKABE_ITO.vermillion, width: 2, dash: 'dash' } },
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
