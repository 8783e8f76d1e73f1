/**
 * The report's charts, made with vega-lite (compiled to vega, rendered headless by vega's
 * canvas renderer onto a context that records PDF drawing: core/report/pdf-canvas.ts), from the same series and threshold values the tables
 * print. Four kinds: the V-slope plot (core/report/vslope-view.ts: VCO2 against VO2 over the
 * analysed window, equal axis scales, the line of identity, both regression lines with their
 * slopes; Beaver et al. 1986), the ventilatory equivalents and the end-tidal
 * pressures against time with VT1 and VT2 marked (Wasserman et al. 1973), and day 1 and day 2
 * overlaid against workload. Colours and dashes come from core/palette.ts, the palette the
 * workbench uses too. Units: mL/min, mmHg, s (shown as m:ss), W, bpm.
 */
import * as vega from 'vega';
import * as vl from 'vega-lite';
import type { TestAnalysis } from '../model/analysis';
import type { ThresholdPoint } from '../case/case-file';
import type { ReportLocale } from '../locale/locales';
import { DAY_STYLE, INK, SERIES_STYLE, THRESHOLD_STYLE, VSLOPE_STYLE, type LineStyle } from '../palette';
import { vslopeView } from './vslope-view';
import { minSec } from '../locale/min-sec';
import { maxOf, minOf } from '../math/stats';
import { drawingStep, everyNth, thinnedNote } from './thin';
import { PdfCanvas } from './pdf-canvas';
import type { Fonts, Layout } from './layout';

/** The days' colours, from the shared palette (kept under this name for existing callers). */
export const DAY_COLORS = { day1: DAY_STYLE[1].colour, day2: DAY_STYLE[2].colour } as const;
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

/** A chart ready to be placed on a page: its size in pt and its recorded drawing. */
export interface DrawnChart {
  readonly width: number;
  readonly height: number;
  readonly drawing: PdfCanvas;
}

/** vega's own size of a rendered view (vega-view's render-size: the view plus its padding), in px. */
function viewSize(view: vega.View): { width: number; height: number } {
  const inner = view as unknown as { _viewWidth: number; _viewHeight: number };
  const pad = view.padding() as { left: number; right: number; top: number; bottom: number };
  return { width: Math.max(0, inner._viewWidth + pad.left + pad.right), height: Math.max(0, inner._viewHeight + pad.top + pad.bottom) };
}

/**
 * Renders a vega-lite spec headless with vega's canvas renderer onto a recording context
 * (core/report/pdf-canvas.ts), in `fonts`; axis numbers in `locale` when given.
 */
export async function drawChart(spec: Spec, fonts: Fonts, locale?: ReportLocale): Promise<DrawnChart> {
  const localized = locale ? { ...spec, config: { ...((spec.config as Spec | undefined) ?? {}), locale: { number: vegaNumberLocale(locale) } } } : spec;
  const compiled = vl.compile({ $schema: 'https://vega.github.io/schema/vega-lite/v6.json', ...localized } as vl.TopLevelSpec).spec;
  const view = new vega.View(vega.parse(compiled), { renderer: 'none' });
  try {
    const drawing = new PdfCanvas(fonts);
    await view.toCanvas(1, { externalContext: drawing });
    return { ...viewSize(view), drawing };
  } finally {
    view.finalize();
  }
}

/**
 * Places charts side by side, 8 pt apart, `above` pt below the layout's current line (on a
 * new page when the tallest does not fit in its height and 8 pt), and moves the text
 * position `below` pt under them.
 */
export function placeChartRow(L: Layout, charts: readonly DrawnChart[], above: number, below: number): void {
  const gap = 8;
  const height = Math.max(...charts.map((c) => c.height));
  L.ensure(height + 8);
  const y = L.doc.y + above;
  let x = L.left;
  for (const c of charts) {
    c.drawing.replay(L.doc, x, y);
    x += c.width + gap;
  }
  L.doc.x = L.left;
  L.doc.y = y + height + below;
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

interface Mark {
  readonly value: number;
  readonly label: string;
  readonly style: LineStyle;
}

function rules(marks: Mark[], field: 'x' | 'y'): Spec[] {
  return marks.flatMap((m) => [
    { data: { values: [m] }, mark: { type: 'rule', strokeDash: [...m.style.dash], color: m.style.colour, strokeWidth: 0.9 }, encoding: { [field]: { field: 'value', type: 'quantitative' } } },
    {
      data: { values: [m] },
      mark: { type: 'text', align: 'left', dx: 3, dy: -4, fontSize: 8, color: INK, ...(field === 'x' ? { y: 8 } : { x: 4 }) },
      encoding: { [field]: { field: 'value', type: 'quantitative' }, text: { field: 'label' } },
    },
  ]);
}

/**
 * A time axis in m:ss with a tick every `stepS` seconds over [lo, hi]; the labels are
 * written by the one m:ss formatter (core/locale/min-sec.ts) and looked up by vega.
 */
export function timeAxis(lo: number, hi: number, stepS = 120): Spec {
  const values: number[] = [];
  for (let t = Math.ceil(lo / stepS) * stepS; t <= hi; t += stepS) values.push(t);
  const labels = values.map((t) => minSec(t));
  return { title: 'time (m:ss)', values, labelExpr: `${JSON.stringify(labels)}[indexof(${JSON.stringify(values)}, datum.value)]` };
}

/**
 * VCO2 against VO2 over the analysed window, square, both axes on one range, the line of
 * identity and the V-slope fit's two regression lines with their slopes in the legend.
 */
export function vslopeSpec(a: TestAnalysis, used: ChartThresholds, title: string, size: number): Spec {
  const view = vslopeView(a, used);
  const scale = { domain: [...view.range], nice: false, zero: false };
  const [lo, hi] = view.range;
  const lineRows: Row[] = [
    { name: 'line of identity (slope 1)', vo2: lo, vco2: lo, k: 0 },
    { name: 'line of identity (slope 1)', vo2: hi, vco2: hi, k: 1 },
  ];
  const names: string[] = ['line of identity (slope 1)'];
  const colours: string[] = [VSLOPE_STYLE.identity.colour];
  const dashes: number[][] = [[...VSLOPE_STYLE.identity.dash]];
  for (const l of view.lines) {
    const name = `${l.part === 'below' ? 'below VT1' : 'above VT1'}: slope ${l.slope.toFixed(2)}`;
    lineRows.push({ name, vo2: l.from[0], vco2: l.from[1], k: 0 }, { name, vo2: l.to[0], vco2: l.to[1], k: 1 });
    names.push(name);
    const style = l.part === 'below' ? VSLOPE_STYLE.below : VSLOPE_STYLE.above;
    colours.push(style.colour);
    dashes.push([...style.dash]);
  }
  const marks: Mark[] = view.vt1Vo2MlMin !== null ? [{ value: view.vt1Vo2MlMin, label: `VT1 ${Math.round(view.vt1Vo2MlMin)}`, style: THRESHOLD_STYLE.vt1 }] : [];
  const step = drawingStep([view.analysed.length + view.outside.length]);
  const analysed = everyNth(view.analysed, step);
  const outside = everyNth(view.outside, step);
  const note = thinnedNote(step, analysed.length + outside.length, view.analysed.length + view.outside.length);
  const subtitle = view.fitLabel ? [`fit: ${view.fitLabel}`, 'faint points: ramp above VT2, not fitted'] : ['no V-slope fit found'];
  if (note) subtitle.push(note);
  const x = { field: 'vo2', type: 'quantitative', title: 'VO₂ (mL/min)', scale };
  const y = { field: 'vco2', type: 'quantitative', title: 'VCO₂ (mL/min)', scale };
  return {
    width: size,
    height: size,
    title: { text: title, subtitle, subtitleFontSize: 7, subtitleColor: '#5b6575' },
    config: { ...CONFIG, legend: { ...CONFIG.legend, orient: 'bottom', direction: 'vertical', symbolType: 'stroke', symbolStrokeWidth: 1.6, labelLimit: 220 } },
    layer: [
      { data: { values: outside.map(([v, c]) => ({ vo2: v, vco2: c })) }, mark: { type: 'point', size: 5, filled: true, color: VSLOPE_STYLE.outside, clip: true }, encoding: { x, y } },
      { data: { values: analysed.map(([v, c]) => ({ vo2: v, vco2: c })) }, mark: { type: 'point', size: 6, filled: true, opacity: 0.5, color: VSLOPE_STYLE.analysed, clip: true }, encoding: { x, y } },
      {
        data: { values: lineRows },
        mark: { type: 'line', strokeWidth: 1.5, clip: true },
        encoding: {
          x,
          y,
          order: { field: 'k', type: 'quantitative' },
          color: { field: 'name', type: 'nominal', title: null, scale: { domain: names, range: colours } },
          strokeDash: { field: 'name', type: 'nominal', title: null, scale: { domain: names, range: dashes } },
        },
      },
      ...rules(marks, 'x'),
    ],
  };
}

/** Two series of one day against time (min), with VT1 and VT2 marked. */
function againstTimeSpec(a: TestAnalysis, used: ChartThresholds, title: string, yTitle: string, series: { name: string; values: readonly (number | null)[]; style: LineStyle }[], width: number, height: number): Spec {
  const rows: Row[] = [];
  const ramp = incrementalIndices(a);
  const step = drawingStep([ramp.length]);
  const drawn = everyNth(ramp, step);
  for (const i of drawn) {
    for (const s of series) {
      const v = s.values[i];
      if (v !== null && Number.isFinite(v)) rows.push({ t: a.series.timeS[i], value: v, series: s.name });
    }
  }
  const marks: Mark[] = [];
  if (used.vt1) marks.push({ value: used.vt1.timeS, label: 'VT1', style: THRESHOLD_STYLE.vt1 });
  if (used.vt2) marks.push({ value: used.vt2.timeS, label: 'VT2', style: THRESHOLD_STYLE.vt2 });
  const ts = rows.map((r) => r.t as number);
  const lo = ts.length > 0 ? minOf(ts) : 0;
  const hi = ts.length > 0 ? maxOf(ts) : 60;
  const note = thinnedNote(step, drawn.length, ramp.length);
  return {
    width,
    height,
    title: note ? { text: title, subtitle: note, subtitleFontSize: 7, subtitleColor: '#5b6575' } : title,
    config: CONFIG,
    layer: [
      {
        data: { values: rows },
        mark: { type: 'line', strokeWidth: 1.1 },
        encoding: {
          x: { field: 't', type: 'quantitative', axis: timeAxis(lo, hi), scale: { zero: false, nice: false, domain: [lo, hi] } },
          y: { field: 'value', type: 'quantitative', title: yTitle, scale: { zero: false } },
          color: { field: 'series', type: 'nominal', title: null, scale: { domain: series.map((s) => s.name), range: series.map((s) => s.style.colour) } },
          strokeDash: { field: 'series', type: 'nominal', title: null, scale: { domain: series.map((s) => s.name), range: series.map((s) => [...s.style.dash]) } },
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
    { name: 'VE/VO₂', values: ratio(s.veLMin, s.vo2MlMin), style: SERIES_STYLE.veVo2 },
    { name: 'VE/VCO₂', values: ratio(s.veLMin, s.vco2MlMin), style: SERIES_STYLE.veVco2 },
  ], width, height);
}

export function endTidalSpec(a: TestAnalysis, used: ChartThresholds, title: string, width: number, height: number): Spec {
  return againstTimeSpec(a, used, title, 'mmHg', [
    { name: 'PetO₂', values: a.series.peto2Mmhg, style: SERIES_STYLE.peto2 },
    { name: 'PetCO₂', values: a.series.petco2Mmhg, style: SERIES_STYLE.petco2 },
  ], width, height);
}

/** One variable of both days against workload, over each incremental phase up to its highest load (the fall of the averaged load into recovery is left out). */
export function overlaySpec(day1: TestAnalysis, day2: TestAnalysis, variable: 'vo2MlMin' | 'hrBpm', title: string, width: number, height: number): Spec {
  const rows: Row[] = [];
  const ramps = ([['day 1', day1], ['day 2', day2]] as const).map(([name, a]) => {
    const ramp = incrementalIndices(a);
    let top = -1;
    for (const i of ramp) if (top < 0 || (a.series.workW[i] ?? -Infinity) > (a.series.workW[top] ?? -Infinity)) top = i;
    return { name, a, upToTop: ramp.filter((i) => i <= top) };
  });
  const step = drawingStep(ramps.map((r) => r.upToTop.length));
  let drawnCount = 0;
  for (const { name, a, upToTop } of ramps) {
    const drawn = everyNth(upToTop, step);
    drawnCount += drawn.length;
    for (const i of drawn) {
      const w = a.series.workW[i];
      const v = a.series[variable][i];
      if (w !== null && v !== null && Number.isFinite(w) && Number.isFinite(v)) rows.push({ work: w, value: v, day: name, t: a.series.timeS[i] });
    }
  }
  const note = thinnedNote(step, drawnCount, ramps.reduce((n, r) => n + r.upToTop.length, 0));
  return {
    width,
    height,
    title: note ? { text: title, subtitle: note, subtitleFontSize: 7, subtitleColor: '#5b6575' } : title,
    config: CONFIG,
    data: { values: rows },
    mark: { type: 'line', strokeWidth: 1.2 },
    encoding: {
      x: { field: 'work', type: 'quantitative', title: 'workload (W)' },
      y: { field: 'value', type: 'quantitative', title: variable === 'vo2MlMin' ? 'VO₂ (mL/min)' : 'HR (bpm)', scale: { zero: false } },
      color: { field: 'day', type: 'nominal', title: null, scale: { domain: ['day 1', 'day 2'], range: [DAY_COLORS.day1, DAY_COLORS.day2] } },
      strokeDash: { field: 'day', type: 'nominal', title: null, scale: { domain: ['day 1', 'day 2'], range: [[...DAY_STYLE[1].dash], [...DAY_STYLE[2].dash]] } },
      order: { field: 't', type: 'quantitative' },
    },
  };
}
