/**
 * Every time a person reads on the workbench's charts is m:ss: the axes (ticks at whole
 * minutes) and the hover labels, which plotly would otherwise write in seconds. Checked on
 * core's own analysis of the demo pair: each trace drawn against time carries, for each
 * point, the m:ss of its x worked here by hand (floor(s / 60), then the seconds padded), and
 * no hover template prints a time axis's raw x. V-slope points carry their time too.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { newCase } from '../../../../core/case/new-case';
import { recomputeCase } from '../../../../core/case/recompute';
import { defaultEngine } from '../../../../core/case/default-engine';
import { DEFAULT_SETTINGS } from '../../../../core/model/settings';
import { noClinicalInputs } from '../../../../core/analyze/analyze-test';
import { DEMO_FOLDER, DEMO_PAIR } from '../../../../host/demo-job';
import { endTidalChart, equivalentsChart, vSlopeChart } from '../../../../renderer/src/charts/threshold-charts';
import { overlayCharts } from '../../../../renderer/src/charts/overlay-charts';

interface Trace {
  name: string;
  x: number[];
  customdata?: string[];
  hovertemplate?: string;
  hoverinfo?: string;
}

const byHand = (s: number) => {
  const whole = Math.round(s);
  return `${Math.floor(whole / 60)}:${String(whole % 60).padStart(2, '0')}`;
};

function outcome() {
  const day1 = { name: DEMO_PAIR.day1, bytes: new Uint8Array(readFileSync(join(DEMO_FOLDER, DEMO_PAIR.day1))) };
  const day2 = { name: DEMO_PAIR.day2, bytes: new Uint8Array(readFileSync(join(DEMO_FOLDER, DEMO_PAIR.day2))) };
  const c = newCase('2026-01-01T00:00:00Z', day1, day2, DEFAULT_SETTINGS, { day1: noClinicalInputs(), day2: noClinicalInputs() });
  const o = recomputeCase(c, { day1: day1.bytes, day2: day2.bytes }, defaultEngine);
  if (!o.ok) throw new Error(o.error.message);
  return o.value;
}

describe('time on the charts reads m:ss', () => {
  const o = outcome();

  it('every trace against time hovers with m:ss, never the seconds', () => {
    const timeCharts = [equivalentsChart(o.day1), endTidalChart(o.day2), overlayCharts(o.day1.analysis, o.day2.analysis).find((c) => c.id === 'vo2-time')!];
    for (const chart of timeCharts) {
      const axis = (chart.layout as { xaxis: { title: { text: string }; ticktext: string[] } }).xaxis;
      expect(axis.title.text).toBe('Time (m:ss)');
      expect(axis.ticktext.every((t) => /^\d+:\d\d$/.test(t))).toBe(true);
      const traces = (chart.data as unknown as Trace[]).filter((t) => t.hoverinfo !== 'skip');
      expect(traces.length).toBeGreaterThan(1);
      for (const t of traces) {
        expect(t.hovertemplate, t.name).toContain('%{customdata}');
        expect(t.hovertemplate, t.name).not.toMatch(/%\{x/);
      }
      // Series traces: the label of point i is the m:ss of its x.
      for (const t of traces.filter((tr) => !tr.name.includes('by method') && !tr.name.includes('VT1'))) {
        expect(t.customdata!.length).toBe(t.x.length);
        for (const i of [0, Math.floor(t.x.length / 2), t.x.length - 1]) expect(t.customdata![i]).toBe(byHand(t.x[i]));
      }
    }
    // A method's mark on a time chart: its label is its time, as the method table prints it.
    const marks = (equivalentsChart(o.day1).data as unknown as Trace[]).find((t) => t.name === 'VT1 by method')!;
    marks.x.forEach((x, i) => expect(marks.customdata![i]).toBe(byHand(x)));
  });

  it('charts against work or VO2 name the time of each point in m:ss', () => {
    const v = vSlopeChart(o.day1).data as unknown as Trace[];
    const analysed = v.find((t) => t.name.startsWith('VCO₂ against VO₂'))!;
    const a = o.day1.analysis;
    // The first analysed point is the first averaged point of the incremental phase.
    const first = a.series.timeS.find((t) => t >= a.phases.incrementalStartS)!;
    expect(analysed.customdata![0]).toBe(byHand(first));
    expect(analysed.hovertemplate).toContain('%{customdata}');
    const work = overlayCharts(a, o.day2.analysis).find((c) => c.id === 'vo2-work')!.data as unknown as Trace[];
    expect(work[0].hovertemplate).toMatch(/^%\{customdata\}, %\{x:\.0f\} W, VO₂/);
    expect(work[0].customdata!.every((t) => /^\d+:\d\d$/.test(t))).toBe(true);
  });
});
