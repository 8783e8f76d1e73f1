/**
 * Overlays of day 1 and day 2 from each day's processed series: VO2 and HR against work, and
 * VO2 against time, each day's VT1 (as it now stands) marked. Day 1 solid blue, day 2 dashed
 * orange, so the days differ by line style as well as colour.
 */
import { clockAxis, clockHover } from './clock-axis';
import type { ProcessedSeries, TestAnalysis } from '../../../core/model/analysis';
import { DAY_COLOUR, DAY_STYLE, plotlyDash } from './palette';

type Key = 'vo2MlMin' | 'hrBpm';

/**
 * Against work, only the rising part of the ramp is drawn: up to the first moment the averaged
 * load reaches its highest value, so the fall of the load at the end (smoothed by the
 * averaging window) is not drawn as a line back across the chart.
 */
function rampPart(a: TestAnalysis, key: Key, x: 'workW' | 'timeS') {
  const s: ProcessedSeries = a.series;
  const xs: number[] = [];
  const ys: number[] = [];
  const ts: number[] = [];
  let lastIndex = s.timeS.length - 1;
  if (x === 'workW') {
    let best = -Infinity;
    for (let i = 0; i < s.timeS.length; i++) {
      const w = s.workW[i];
      if (s.timeS[i] >= a.phases.incrementalStartS && s.timeS[i] <= a.phases.incrementalEndS && w !== null && w > best) [best, lastIndex] = [w, i];
    }
  }
  for (let i = 0; i <= lastIndex; i++) {
    const t = s.timeS[i];
    if (x === 'workW' && t < a.phases.incrementalStartS) continue;
    const xv = x === 'workW' ? s.workW[i] : t;
    const yv = s[key][i];
    if (xv === null || yv === null) continue;
    xs.push(xv);
    ys.push(yv);
    ts.push(t);
  }
  return { xs, ys, ts };
}

/** The hovered value in words, its time of the recording in m:ss (plotly would write the seconds). */
function hoverOf(key: Key, x: 'workW' | 'timeS', ts: readonly number[]) {
  const value = key === 'vo2MlMin' ? 'VO₂ %{y:.0f} mL/min' : 'HR %{y:.0f} bpm';
  return clockHover(ts, x === 'workW' ? `%{x:.0f} W, ${value}` : value);
}

function trace(a: TestAnalysis, day: 1 | 2, key: Key, x: 'workW' | 'timeS') {
  const { xs, ys, ts } = rampPart(a, key, x);
  return { type: 'scatter', mode: 'lines', name: `Day ${day}`, x: xs, y: ys, line: { color: DAY_COLOUR[day], width: 2, dash: plotlyDash(DAY_STYLE[day].dash) }, ...hoverOf(key, x, ts) };
}

function vt1Mark(a: TestAnalysis, day: 1 | 2, key: Key, x: 'workW' | 'timeS') {
  const at = a.vt1.at;
  if (!at) return null;
  const xv = x === 'workW' ? at.workW : at.timeS;
  const yv = key === 'vo2MlMin' ? at.vo2MlMin : at.hrBpm;
  if (xv === null || yv === null) return null;
  return { type: 'scatter', mode: 'markers+text', name: `Day ${day} VT1`, x: [xv], y: [yv], text: [`VT1 d${day}`], textposition: 'top left', ...hoverOf(key, x, [at.timeS]), marker: { color: DAY_COLOUR[day], size: 12, symbol: day === 1 ? 'circle' : 'square', line: { color: '#000', width: 1 } } };
}

const SPECS: readonly { id: string; key: Key; x: 'workW' | 'timeS'; title: string; xTitle: string; yTitle: string }[] = [
  { id: 'vo2-work', key: 'vo2MlMin', x: 'workW', title: 'VO₂ against work', xTitle: 'Work (W)', yTitle: 'VO₂ (mL/min)' },
  { id: 'hr-work', key: 'hrBpm', x: 'workW', title: 'HR against work', xTitle: 'Work (W)', yTitle: 'HR (bpm)' },
  { id: 'vo2-time', key: 'vo2MlMin', x: 'timeS', title: 'VO₂ against time', xTitle: 'Time (m:ss)', yTitle: 'VO₂ (mL/min)' },
];

const lastTime = (a: TestAnalysis) => a.series.timeS[a.series.timeS.length - 1] ?? 0;

export function overlayCharts(day1: TestAnalysis, day2: TestAnalysis) {
  return SPECS.map((spec) => ({
    id: spec.id,
    label: `${spec.title}, both days`,
    data: [trace(day1, 1, spec.key, spec.x), trace(day2, 2, spec.key, spec.x), vt1Mark(day1, 1, spec.key, spec.x), vt1Mark(day2, 2, spec.key, spec.x)].filter((t) => t !== null),
    layout: { title: { text: spec.title }, xaxis: spec.x === 'timeS' ? clockAxis(Math.max(lastTime(day1), lastTime(day2))) : { title: { text: spec.xTitle } }, yaxis: { title: { text: spec.yTitle } }, legend: { orientation: 'h', y: -0.25 } },
  }));
}
