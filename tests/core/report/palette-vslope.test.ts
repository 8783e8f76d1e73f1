// The shared palette (core/palette.ts; Okabe et al. 2008 colours) and the V-slope view
// (core/report/vslope-view.ts; Beaver et al., J Appl Physiol 1986): verdicts by
// harm with words, day 2 apart from the ventilatory equivalents, the report's chart spec and
// the workbench's chart spec using the same colours, and the V-slope drawn over the analysed
// window only with one range for both axes, the line of identity and both fitted slopes.
import { describe, expect, it } from 'vitest';
import { DAY_STYLE, SERIES_STYLE, verdictStyle } from '../../../core/palette';
import { equivalentsSpec, vslopeSpec } from '../../../core/report/charts';
import { vslopeView } from '../../../core/report/vslope-view';
import { equivalentsChart, vSlopeChart } from '../../../renderer/src/charts/threshold-charts';
import { demoReport } from './fixture';

describe('palette', () => {
  it('colours a verdict by harm, not by direction, and always gives words', () => {
    // A favourable fall (e.g. VE/VCO2 slope lower on day 2) must not take the alarm colour.
    expect(verdictStyle('fell', false).colour).not.toBe(verdictStyle('fell', true).colour);
    expect(verdictStyle('fell', true).colour).toBe(verdictStyle('rose', true).colour);
    expect(verdictStyle('rose', true).words).toContain('adverse');
    expect(verdictStyle('fell', false).words).toContain('favourable');
    expect(verdictStyle('held', false).harm).toBe('neutral');
  });

  it('day 2 shares neither colour nor dash with a ventilatory equivalent', () => {
    for (const s of [SERIES_STYLE.veVo2, SERIES_STYLE.veVco2]) {
      expect(s.colour).not.toBe(DAY_STYLE[2].colour);
      expect(s.colour).not.toBe(DAY_STYLE[1].colour);
    }
    expect(SERIES_STYLE.veVo2.colour).not.toBe(SERIES_STYLE.veVco2.colour);
  });
});

describe('V-slope and equivalents charts', () => {
  it('report and workbench draw VE/VO2 and VE/VCO2 in the same colours', async () => {
    const { outcome } = await demoReport();
    const day = outcome.day1;
    const used = { vt1: day.vt1.effective, vt2: day.vt2.effective };
    const spec = equivalentsSpec(day.analysis, used, 't', 200, 120) as { layer: { encoding?: { color?: { scale: { domain: string[]; range: string[] } } } }[] };
    const scale = spec.layer[0].encoding!.color!.scale;
    const screen = equivalentsChart(day).data as unknown as { name: string; line: { color: string } }[];
    for (const name of ['VE/VO₂', 'VE/VCO₂']) {
      expect(scale.range[scale.domain.indexOf(name)]).toBe(screen.find((t) => t.name === name)!.line.color);
    }

    const view = vslopeView(day.analysis, used);
    // Only the incremental phase up to VT2 is analysed: rest and recovery are left out.
    const { timeS } = day.analysis.series;
    const inWindow = timeS.filter((t) => t >= day.analysis.phases.incrementalStartS && t <= (used.vt2?.timeS ?? Infinity)).length;
    expect(view.analysed.length).toBe(inWindow);
    expect(view.windowS[0]).toBe(day.analysis.phases.incrementalStartS);
    expect(view.analysed.length + view.outside.length).toBeLessThan(timeS.length);
    // Both regression lines, the one below the breakpoint flatter than the one above (slope near 1, then > 1).
    expect(view.lines.map((l) => l.part)).toEqual(['below', 'above']);
    expect(view.lines[1].slope).toBeGreaterThan(view.lines[0].slope + 0.1);
    // One range for both axes, covering every plotted VO2 and VCO2.
    const all = [...view.analysed, ...view.outside].flatMap((p) => [p[0], p[1]]);
    expect(view.range[0]).toBeLessThanOrEqual(Math.min(...all));
    expect(view.range[1]).toBeGreaterThanOrEqual(Math.max(...all));

    const vs = vslopeSpec(day.analysis, used, 'v', 150) as { width: number; height: number; layer: { encoding?: { x?: { scale?: { domain: number[] } }; y?: { scale?: { domain: number[] } }; color?: { scale: { domain: string[] } } } }[] };
    expect(vs.width).toBe(vs.height);
    expect(vs.layer[0].encoding!.x!.scale!.domain).toEqual(vs.layer[0].encoding!.y!.scale!.domain);
    const names = vs.layer[2].encoding!.color!.scale.domain;
    expect(names[0]).toBe('line of identity (slope 1)');
    expect(names[1]).toBe(`below VT1: slope ${view.lines[0].slope.toFixed(2)}`);
    expect(names[2]).toBe(`above VT1: slope ${view.lines[1].slope.toFixed(2)}`);

    const screenV = vSlopeChart(day) as unknown as { data: { name: string }[]; layout: { xaxis: { range: number[] }; yaxis: { range: number[]; scaleanchor: string } } };
    expect(screenV.layout.yaxis.scaleanchor).toBe('x');
    expect(screenV.layout.xaxis.range).toEqual(screenV.layout.yaxis.range);
    expect(screenV.data.map((t) => t.name)).toContain(`above VT1: slope ${view.lines[1].slope.toFixed(2)}`);
  }, 120_000);
});
