/**
 * The report's charts as SVG, made with vega-lite (compiled to vega, rendered headless with
 * renderer 'none' and `view.toSVG()`), from the same series and threshold values the tables
 * print. Four kinds: the V-slope plot (VCO2 against VO2 over the incremental phase, with the
 * V-slope method's fitted lines and the threshold used; Beaver, Wasserman & Whipp 1986), the
 * ventilatory equivalents and the end-tidal pressures against time with VT1 and VT2 marked
 * (Wasserman et al. 1973), and day 1 and day 2 overlaid against workload.
 * Units: mL/min, mmHg, s (shown as min), W, bpm.
 */
import * as vega from 'vega';
import * as vl from 'vega-lite';
import type { TestAnalysis } from '../model/analysis';
import type { ThresholdPoint } from '../case/case-file';
import type { ReportLocale } from '../locale/locales';

export const DAY_COLORS = { day1: '#2f5d7c', day2: '#c0612b' } as const;
const FONT = 'DejaVu Sans';

type Spec = Record<string, unknown>;
type Row = Record<string, number | string>;

export interface ChartThresholds {
  readonly vt1: ThresholdPoint | null;
  readonly vt2: ThresholdPoint | null;
}

/**
 * The axis numbers of a chart in a locale (vega's number locale; it groups every thousand,
 * so a locale that leaves four-digit numbers ungrouped gets no grouping on axes, where
 * numbers stay below 10 000).
 */
function vegaNumberLocale(locale: ReportLocale): Record<string, unknown> {
  return { decimal: locale.decimal, thousands: locale.groupFrom <= 4 ? locale.thousands : '', grouping: [3], currency: ['', ''] };
}

/** Renders a vega-lite spec to an SVG string, headless; axis numbers in `locale` when given. */
export async function renderSvg(spec: Spec, locale?: ReportLocale): Promise<string> {
  const localized = locale ? { ...spec, config: { ...((spec.config as Spec | undefined) ?? {}), locale: { number: vegaNumberLocale(locale) } } } : spec;
  const compiled = vl.compile({ $schema: 'https://vega.github.io/schema/vega-lite/v6.json', ...localized } as vl.TopLevelSpec).spec;
  const view = new vega.View(vega.parse(compiled), { renderer: 'none' });
  try {
    return await view.toSVG();
  } finally {
    view.finalize();
  }
}

const CONFIG = {
  font: FONT,
  background: 'white',
  view: { stroke: '#b9c3cf' },
  axis: { labelFontSize: 8, titleFontSize: 8.5, titleFontWeight: 'normal', gridColor: '#e3e8ee', domainColor: '#5b6575', tickColor: '#5b6575' },
  legend: { labelFontSize: 8, titleFontSize: 8, orient: 'top', titleFontWeight: 'normal' },
  title: { fontSize: 9.5, fontWeight: 'bold', anchor: 'start', color: '#1d2430' },
};

function incrementalIndices(a: TestAnalysis): number[] {
  const out: number[] = [];
  for (let i = 0; i < a.series.timeS.length; i++) {
    const t = a.series.timeS[i];
    if (t >= a.phases.incrementalStartS && t <= a.phases.incrementalEndS) out.push(i);
  }
  return out;
}

function rules(marks: { value: number; label: string }[], field: 'x' | 'y'): Spec[] {
  if (marks.length === 0) return [];
  return [
    { data: { values: marks }, mark: { type: 'rule', strokeDash: [4, 3], color: '#1d2430', strokeWidth: 0.8 }, encoding: { [field]: { field: 'value', type: 'quantitative' } } },
    {
      data: { values: marks },
      mark: { type: 'text', align: 'left', dx: 3, dy: -4, fontSize: 8, color: '#1d2430', ...(field === 'x' ? { y: 8 } : { x: 4 }) },
      encoding: { [field]: { field: 'value', type: 'quantitative' }, text: { field: 'label' } },
    },
  ];
}

/** VCO2 against VO2 with the V-slope fit's segments and the VT1 used. */
export function vslopeSpec(a: TestAnalysis, used: ChartThresholds, title: string, width: number, height: number): Spec {
  const upper = used.vt2?.timeS ?? a.phases.incrementalEndS;
  const points: Row[] = incrementalIndices(a)
    .filter((i) => a.series.timeS[i] <= upper)
    .map((i) => ({ vo2: a.series.vo2MlMin[i], vco2: a.series.vco2MlMin[i] }));
  const fit = a.vt1.methods.find((m) => m.found && m.evidence.xName === 'vo2MlMin' && m.evidence.yName === 'vco2MlMin');
  const lines: Row[] = [];
  if (fit && fit.found) {
    fit.evidence.segments.forEach((s, k) => {
      lines.push({ seg: k, vo2: s.x0, vco2: s.intercept + s.slope * s.x0 }, { seg: k, vo2: s.x1, vco2: s.intercept + s.slope * s.x1 });
    });
  }
  const marks = used.vt1 ? [{ value: used.vt1.vo2MlMin, label: `VT1 ${Math.round(used.vt1.vo2MlMin)}` }] : [];
  return {
    width,
    height,
    title,
    config: CONFIG,
    layer: [
      {
        data: { values: points },
        mark: { type: 'point', size: 6, filled: true, opacity: 0.55, color: '#7d8896' },
        encoding: {
          x: { field: 'vo2', type: 'quantitative', title: 'VO₂ (mL/min)', scale: { zero: false } },
          y: { field: 'vco2', type: 'quantitative', title: 'VCO₂ (mL/min)', scale: { zero: false } },
        },
      },
      ...(lines.length > 0
        ? [{ data: { values: lines }, mark: { type: 'line', color: DAY_COLORS.day1, strokeWidth: 1.4 }, encoding: { x: { field: 'vo2', type: 'quantitative' }, y: { field: 'vco2', type: 'quantitative' }, detail: { field: 'seg' } } }]
        : []),
      ...rules(marks, 'x'),
    ],
  };
}

/** Two series of one day against time (min), with VT1 and VT2 marked. */
function againstTimeSpec(a: TestAnalysis, used: ChartThresholds, title: string, yTitle: string, series: { name: string; values: readonly (number | null)[] }[], width: number, height: number): Spec {
  const rows: Row[] = [];
  for (const i of incrementalIndices(a)) {
    for (const s of series) {
      const v = s.values[i];
      if (v !== null && Number.isFinite(v)) rows.push({ min: a.series.timeS[i] / 60, value: v, series: s.name });
    }
  }
  const marks: { value: number; label: string }[] = [];
  if (used.vt1) marks.push({ value: used.vt1.timeS / 60, label: 'VT1' });
  if (used.vt2) marks.push({ value: used.vt2.timeS / 60, label: 'VT2' });
  return {
    width,
    height,
    title,
    config: CONFIG,
    layer: [
      {
        data: { values: rows },
        mark: { type: 'line', strokeWidth: 1.1 },
        encoding: {
          x: { field: 'min', type: 'quantitative', title: 'time (min)', scale: { zero: false } },
          y: { field: 'value', type: 'quantitative', title: yTitle, scale: { zero: false } },
          color: { field: 'series', type: 'nominal', title: null, scale: { range: [DAY_COLORS.day1, DAY_COLORS.day2] } },
        },
      },
      ...rules(marks, 'x'),
    ],
  };
}

export function equivalentsSpec(a: TestAnalysis, used: ChartThresholds, title: string, width: number, height: number): Spec {
  const s = a.series;
  const ratio = (num: readonly number[], den: readonly number[]) => num.map((v, i) => (den[i] > 0 ? (1000 * v) / den[i] : null));
  return againstTimeSpec(a, used, title, 'VE/VO₂, VE/VCO₂', [
    { name: 'VE/VO₂', values: ratio(s.veLMin, s.vo2MlMin) },
    { name: 'VE/VCO₂', values: ratio(s.veLMin, s.vco2MlMin) },
  ], width, height);
}

export function endTidalSpec(a: TestAnalysis, used: ChartThresholds, title: string, width: number, height: number): Spec {
  return againstTimeSpec(a, used, title, 'mmHg', [
    { name: 'PetO₂', values: a.series.peto2Mmhg },
    { name: 'PetCO₂', values: a.series.petco2Mmhg },
  ], width, height);
}

/** One variable of both days against workload, over each incremental phase up to its highest load (the fall of the averaged load into recovery is left out). */
export function overlaySpec(day1: TestAnalysis, day2: TestAnalysis, variable: 'vo2MlMin' | 'hrBpm', title: string, width: number, height: number): Spec {
  const rows: Row[] = [];
  for (const [name, a] of [['day 1', day1], ['day 2', day2]] as const) {
    const ramp = incrementalIndices(a);
    let top = -1;
    for (const i of ramp) if (top < 0 || (a.series.workW[i] ?? -Infinity) > (a.series.workW[top] ?? -Infinity)) top = i;
    for (const i of ramp) {
      if (i > top) break;
      const w = a.series.workW[i];
      const v = a.series[variable][i];
      if (w !== null && v !== null && Number.isFinite(w) && Number.isFinite(v)) rows.push({ work: w, value: v, day: name, t: a.series.timeS[i] });
    }
  }
  return {
    width,
    height,
    title,
    config: CONFIG,
    data: { values: rows },
    mark: { type: 'line', strokeWidth: 1.2 },
    encoding: {
      x: { field: 'work', type: 'quantitative', title: 'workload (W)' },
      y: { field: 'value', type: 'quantitative', title: variable === 'vo2MlMin' ? 'VO₂ (mL/min)' : 'HR (bpm)', scale: { zero: false } },
      color: { field: 'day', type: 'nominal', title: null, scale: { domain: ['day 1', 'day 2'], range: [DAY_COLORS.day1, DAY_COLORS.day2] } },
      order: { field: 't', type: 'quantitative' },
    },
  };
}
