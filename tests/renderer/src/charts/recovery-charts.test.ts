// The Recovery calls timeline draws core's course as given: one chart per domain, each point a
// rating at its hours ÷ 24 days, day 2 dashed (colour never alone), and the reported recovery
// as a line at its day. Expected values are worked from the reports written here.
import { describe, expect, it } from 'vitest';
import { followUpCourse, type RecordedFollowUp } from '../../../../core/followup/course';
import { recoveryCharts } from '../../../../renderer/src/charts/recovery-charts';
import { report } from '../../../core/followup/fixtures';

const items: RecordedFollowUp[] = [report(2, 20, false, { fatigue: 8 }), report(2, 72, true, { fatigue: 3 }), report(1, 22, false, { fatigue: 6, pain: 2 })].map((r, i) => ({ seq: i + 1, at: 'x', who: 'c', role: 'c', report: r, original: r, corrections: [] }));

describe('recovery charts', () => {
  it('draws one chart per domain with both tests and the reported recovery', () => {
    const charts = recoveryCharts(followUpCourse(items));
    expect(charts.map((c) => c.domain)).toEqual(['fatigue', 'pain']);
    const [day1, day2] = charts[0].data as { x: number[]; y: number[]; line: { dash: string } }[];
    expect(day1.x).toEqual([22 / 24]);
    expect(day1.y).toEqual([6]);
    expect(day2.x).toEqual([20 / 24, 3]);
    expect(day2.y).toEqual([8, 3]);
    expect([day1.line.dash, day2.line.dash]).toEqual(['solid', 'dash']);
    const shapes = charts[0].layout.shapes as { x0: number }[];
    expect(shapes.map((s) => s.x0)).toEqual([3]); // day 2 back at 72 h = 3 days; day 1 not recovered
    expect((charts[0].layout.xaxis as { range: number[] }).range).toEqual([0, 3]);
  });
});
