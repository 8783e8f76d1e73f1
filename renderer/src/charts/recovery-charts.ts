/**
 * The recovery timeline for the Recovery calls screen: one small plotly chart per symptom
 * domain, ratings 0–10 against days after each test, day 1 solid and day 2 dashed (colour
 * never carries meaning alone), and a dotted line where the person reported being back to
 * their usual state. Drawn from core's course (core/followup/course.ts); no figure is made here.
 */
import type { FollowUpCourse } from '../../../core/followup/course';
import { DAY_COLOUR } from './palette';

export interface RecoveryChart {
  readonly domain: string;
  readonly data: unknown[];
  readonly layout: Record<string, unknown>;
}

export function recoveryCharts(course: FollowUpCourse): RecoveryChart[] {
  const lastH = Math.max(0, ...[course.day1, course.day2].flatMap((d) => d.reports.map((r) => r.report.afterTestH)));
  const maxDays = Math.max(2, Math.ceil(lastH / 24));
  return course.domains.map((domain) => {
    const data = [course.day1, course.day2].map((day) => {
      const points = day.domains.find((d) => d.domain === domain)?.points ?? [];
      return {
        type: 'scatter',
        mode: 'lines+markers',
        name: `after day ${day.day} test`,
        x: points.map((p) => p.afterTestH / 24),
        y: points.map((p) => p.score),
        text: points.map((p) => `entry ${p.seq}: ${p.score} at ${p.afterTestH} h`),
        hoverinfo: 'text',
        line: { color: DAY_COLOUR[day.day], dash: day.day === 2 ? 'dash' : 'solid', width: 2 },
        marker: { color: DAY_COLOUR[day.day], size: 7 },
      };
    });
    const shapes = [course.day1, course.day2].flatMap((day) =>
      day.recovery.kind === 'recovered' ? [{ type: 'line', x0: day.recovery.byH / 24, x1: day.recovery.byH / 24, y0: 0, y1: 10, line: { color: DAY_COLOUR[day.day], dash: 'dot', width: 1.5 } }] : [],
    );
    return {
      domain,
      data,
      layout: {
        title: { text: domain, font: { size: 13 } },
        height: 210,
        margin: { l: 44, r: 10, t: 34, b: 40 },
        showlegend: false,
        xaxis: { title: { text: 'days after the test' }, range: [0, maxDays], zeroline: false },
        yaxis: { title: { text: '0–10' }, range: [-0.3, 10.3], dtick: 2 },
        shapes,
      },
    };
  });
}
