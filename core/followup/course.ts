/**
 * Figures derived from the follow-up reports, stated as reported and never as a diagnosis:
 * for each test, the time to reported recovery and the course of each symptom domain; the
 * two tests side by side. Pure functions over the reports in force (after corrections).
 *
 * Time to reported recovery (Twofold's rule, docs/follow-up.md): the earliest follow-up at
 * which the person reports being back to their usual state and after which no follow-up of
 * the same test says otherwise. Follow-ups are spaced, so recovery happened at or before that
 * time and after the latest earlier report of not being back ("by 48 h, not yet at 24 h").
 * When the latest follow-up reports not being back: "not recovered by the last follow-up at N
 * days". Reports at the same hour count in the order they were recorded.
 *
 * Example: day 1 reports at 22 h (not back) and 70 h (back) → recovered by 70 h, not yet at 22 h.
 */
import { DEFAULT_DOMAINS, hoursText, type FollowUpReport, type TestDay } from './report';

export interface FollowUpCorrection {
  readonly seq: number;
  readonly at: string;
  readonly who: string;
  readonly reason: string;
  /** True when this correction struck the report out. */
  readonly struck: boolean;
}

/** A report as now in force, with the log entries behind it. */
export interface RecordedFollowUp {
  /** `seq` of the log entry that first recorded it: the report's number. */
  readonly seq: number;
  readonly at: string;
  readonly who: string;
  readonly role: string;
  /** The report as it now reads; null when struck out. */
  readonly report: FollowUpReport | null;
  /** The report as first recorded. */
  readonly original: FollowUpReport;
  readonly corrections: readonly FollowUpCorrection[];
}

export type Recovery =
  | { readonly kind: 'no-follow-up' }
  | { readonly kind: 'recovered'; readonly byH: number; readonly notYetAtH: number | null }
  | { readonly kind: 'not-recovered'; readonly lastH: number };

export interface ScorePoint {
  readonly afterTestH: number;
  readonly score: number;
  readonly seq: number;
}

export interface DomainCourse {
  readonly domain: string;
  /** Rated follow-ups in time order (unrated ones left out). */
  readonly points: readonly ScorePoint[];
  /** The highest rating and the first time it was given; null when never rated. */
  readonly peak: ScorePoint | null;
  readonly last: ScorePoint | null;
}

export interface DayCourse {
  readonly day: TestDay;
  /** Reports in force for this test, in time order. */
  readonly reports: readonly (RecordedFollowUp & { readonly report: FollowUpReport })[];
  readonly recovery: Recovery;
  readonly domains: readonly DomainCourse[];
}

export interface FollowUpCourse {
  readonly day1: DayCourse;
  readonly day2: DayCourse;
  /** Every domain rated on either day: the default list's order first, then others as first recorded. */
  readonly domains: readonly string[];
}

export function followUpCourse(items: readonly RecordedFollowUp[], listed: readonly string[] = DEFAULT_DOMAINS): FollowUpCourse {
  const inForce = items.filter((i): i is RecordedFollowUp & { report: FollowUpReport } => i.report !== null);
  const seen: string[] = [];
  for (const item of [...inForce].sort((a, b) => a.seq - b.seq)) for (const r of item.report.ratings) if (!seen.includes(r.domain)) seen.push(r.domain);
  const domains = [...listed.filter((d) => seen.includes(d)), ...seen.filter((d) => !listed.includes(d))];
  const day = (d: TestDay): DayCourse => {
    const reports = inForce.filter((i) => i.report.day === d).sort((a, b) => a.report.afterTestH - b.report.afterTestH || a.seq - b.seq);
    return { day: d, reports, recovery: recoveryOf(reports.map((r) => r.report)), domains: domains.map((name) => domainCourse(name, reports)) };
  };
  return { day1: day(1), day2: day(2), domains };
}

/** The recovery rule above, over one test's reports in time order. */
export function recoveryOf(reports: readonly FollowUpReport[]): Recovery {
  if (reports.length === 0) return { kind: 'no-follow-up' };
  const last = reports[reports.length - 1];
  if (!last.backToUsual) return { kind: 'not-recovered', lastH: last.afterTestH };
  let first = reports.length - 1;
  while (first > 0 && reports[first - 1].backToUsual) first--;
  return { kind: 'recovered', byH: reports[first].afterTestH, notYetAtH: first > 0 ? reports[first - 1].afterTestH : null };
}

function domainCourse(domain: string, reports: DayCourse['reports']): DomainCourse {
  const points: ScorePoint[] = [];
  for (const r of reports) {
    const rating = r.report.ratings.find((x) => x.domain === domain);
    if (rating && rating.score !== null) points.push({ afterTestH: r.report.afterTestH, score: rating.score, seq: r.seq });
  }
  let peak: ScorePoint | null = null;
  for (const p of points) if (!peak || p.score > peak.score) peak = p;
  return { domain, points, peak, last: points[points.length - 1] ?? null };
}

/** The recovery in words, as reported. */
export function recoveryText(recovery: Recovery): string {
  switch (recovery.kind) {
    case 'no-follow-up':
      return 'no follow-up recorded';
    case 'recovered':
      return `reported back to usual state by ${hoursText(recovery.byH)}${recovery.notYetAtH === null ? '' : `, not yet at ${hoursText(recovery.notYetAtH)}`}`;
    case 'not-recovered':
      return `not recovered by the last follow-up at ${daysText(recovery.lastH)}`;
  }
}

function daysText(h: number): string {
  const days = h / 24;
  const d = Number.isInteger(days) ? String(days) : days.toFixed(1);
  return `${d} day${d === '1' ? '' : 's'} (${Number.isInteger(h) ? h : h.toFixed(1)} h)`;
}

/** The figures to record with a case's results, so verification recomputes them; empty when nothing was recorded. */
export function courseNumbers(course: FollowUpCourse): Record<string, unknown> {
  if (course.day1.reports.length === 0 && course.day2.reports.length === 0) return {};
  const day = (c: DayCourse) => ({
    reports: c.reports.length,
    recovery: c.recovery.kind,
    recoveredByH: c.recovery.kind === 'recovered' ? c.recovery.byH : null,
    notYetAtH: c.recovery.kind === 'recovered' ? c.recovery.notYetAtH : null,
    lastFollowUpH: c.reports.length ? c.reports[c.reports.length - 1].report.afterTestH : null,
    reportsInForce: c.reports.map((r) => ({ seq: r.seq, afterTestH: r.report.afterTestH, backToUsual: r.report.backToUsual, channel: r.report.channel, reportedBy: r.report.reportedBy, ratings: r.report.ratings })),
    peaks: c.domains.map((d) => ({ domain: d.domain, score: d.peak?.score ?? null, afterTestH: d.peak?.afterTestH ?? null })),
  });
  return { followUp: { day1: day(course.day1), day2: day(course.day2) } };
}
