/**
 * Timeline charts of the follow-up reports as vega-lite specs: one small chart per symptom
 * domain, the ratings (0–10) after the day 1 and the day 2 test against days since the end
 * of that test, each test in its day colour, with a dashed rule where the person reported
 * being back to their usual state. The same figures the follow-up table prints. No legend
 * per chart: the page prints one key for all of them.
 */
import type { FollowUpCourse } from '../followup/course';
import { DAY_COLORS } from './charts';

type Spec = Record<string, unknown>;

const CONFIG = {
  font: 'DejaVu Sans',
  background: 'white',
  view: { stroke: '#b9c3cf' },
  axis: { labelFontSize: 7, titleFontSize: 7.5, titleFontWeight: 'normal', gridColor: '#e3e8ee', domainColor: '#5b6575', tickColor: '#5b6575' },
  legend: { labelFontSize: 7, titleFontSize: 7, orient: 'top', titleFontWeight: 'normal' },
  title: { fontSize: 8.5, fontWeight: 'bold', anchor: 'start', color: '#1d2430' },
};

/** The days axis runs to the last follow-up of either test (at least 2 days). */
export function timelineDays(course: FollowUpCourse): number {
  const last = Math.max(0, ...[course.day1, course.day2].flatMap((d) => d.reports.map((r) => r.report.afterTestH)));
  return Math.max(2, Math.ceil(last / 24));
}

export function domainTimelineSpec(course: FollowUpCourse, domain: string, width: number, height: number): Spec {
  const rows: Record<string, number | string>[] = [];
  for (const day of [course.day1, course.day2]) {
    const d = day.domains.find((x) => x.domain === domain);
    for (const p of d?.points ?? []) rows.push({ days: p.afterTestH / 24, score: p.score, test: `day ${day.day} test` });
  }
  const recovered = [course.day1, course.day2].flatMap((d) => (d.recovery.kind === 'recovered' ? [{ days: d.recovery.byH / 24, test: `day ${d.day} test` }] : []));
  const color = { field: 'test', type: 'nominal', title: null, legend: null, scale: { domain: ['day 1 test', 'day 2 test'], range: [DAY_COLORS.day1, DAY_COLORS.day2] } };
  const x = { field: 'days', type: 'quantitative', title: 'days after the test', scale: { domain: [0, timelineDays(course)] } };
  return {
    width,
    height,
    title: domain,
    config: CONFIG,
    layer: [
      { data: { values: rows }, mark: { type: 'line', point: { size: 10 }, strokeWidth: 1.2 }, encoding: { x, y: { field: 'score', type: 'quantitative', title: 'rating 0–10', scale: { domain: [0, 10] } }, color } },
      ...(recovered.length ? [{ data: { values: recovered }, mark: { type: 'rule', strokeDash: [4, 3], strokeWidth: 0.9 }, encoding: { x, color } }] : []),
    ],
  };
}
