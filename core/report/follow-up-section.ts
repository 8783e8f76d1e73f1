/**
 * The report's follow-up page: recovery after each test as the person reported it. The
 * caution first (these are the person's own account; the interpretation is the
 * clinician's), then day 1 and day 2 side by side (time to reported recovery, each domain's
 * highest and latest rating), a timeline chart per domain, and every report in force with
 * who gave it and how, and any correction with its reason. Nothing is printed when the case
 * records no follow-up.
 */
import type { CaseFile } from '../case/case-file';
import { followUpsOf } from '../case/follow-ups';
import { followUpCourse, recoveryText, type DayCourse, type FollowUpCourse } from '../followup/course';
import { FOLLOW_UP_CAUTION } from '../followup/caution';
import { CHANNEL_LABELS, hoursText } from '../followup/report';
import { DAY_COLORS, drawChart, placeChartRow } from './charts';
import { domainTimelineSpec } from './follow-up-charts';
import { ACCENT, MUTED, WARN, type Layout } from './layout';

/** The course of a case's follow-ups, or null when there are none. */
export function caseFollowUpCourse(caseFile: CaseFile): FollowUpCourse | null {
  const course = followUpCourse(followUpsOf(caseFile.log));
  return course.day1.reports.length + course.day2.reports.length === 0 ? null : course;
}

/** One line for the summary's secondary findings, or null when no follow-up is recorded. */
export function followUpSummaryLine(caseFile: CaseFile): string | null {
  const course = caseFollowUpCourse(caseFile);
  if (!course) return null;
  return `Recovery as reported by the person (follow-up page): after the day 1 test, ${recoveryText(course.day1.recovery)}; after the day 2 test, ${recoveryText(course.day2.recovery)}.`;
}

export async function followUpSection(L: Layout, caseFile: CaseFile, intervalH: number | null): Promise<void> {
  const course = caseFollowUpCourse(caseFile);
  if (!course) return;
  L.doc.addPage();
  L.heading('Recovery after each test, as reported');
  L.notice('Reported, not measured', FOLLOW_UP_CAUTION, ACCENT);
  sideBySide(L, course);
  await timelines(L, course);
  reportTable(L, course, intervalH);
}

function peakText(d: DayCourse, domain: string): string {
  const c = d.domains.find((x) => x.domain === domain);
  if (!c || !c.peak || !c.last) return 'not rated';
  return `highest ${c.peak.score} at ${hoursText(c.peak.afterTestH)}; latest ${c.last.score} at ${hoursText(c.last.afterTestH)}`;
}

function sideBySide(L: Layout, course: FollowUpCourse): void {
  L.subheading('Day 1 and day 2 side by side');
  const rows: string[][] = [
    ['Follow-ups', `${course.day1.reports.length}`, `${course.day2.reports.length}`],
    ['Time to reported recovery', recoveryText(course.day1.recovery), recoveryText(course.day2.recovery)],
    ...course.domains.map((d) => [`${d} (0–10)`, peakText(course.day1, d), peakText(course.day2, d)]),
  ];
  L.table(
    [
      { header: '', width: 0.26 },
      { header: 'After the day 1 test', width: 0.37 },
      { header: 'After the day 2 test', width: 0.37 },
    ],
    rows,
    { size: 7.5 },
  );
  L.paragraph('Hours count from the end of each test. Recovery is the first follow-up at which the person reported being back to their usual state with no later follow-up of that test saying otherwise; it happened by then, and after the follow-up before it.', { size: 7, color: MUTED });
}

async function timelines(L: Layout, course: FollowUpCourse): Promise<void> {
  if (course.domains.length === 0) return;
  L.subheading('Ratings over time, per domain');
  const { doc } = L;
  doc.font(L.fonts.regular).fontSize(7.5).fillColor(DAY_COLORS.day1).text('—— after the day 1 test', L.left, doc.y, { continued: true });
  doc.fillColor(DAY_COLORS.day2).text('      —— after the day 2 test', { continued: true });
  doc.fillColor(MUTED).text('      dashed rule: reported back to usual state');
  const perRow = 3;
  const w = (L.width - 8 * (perRow - 1)) / perRow - 42;
  for (let i = 0; i < course.domains.length; i += perRow) {
    const charts = await Promise.all(course.domains.slice(i, i + perRow).map((d) => drawChart(domainTimelineSpec(course, d, w, 70), L.fonts)));
    placeChartRow(L, charts, 2, 4);
  }
}

/** Column headers for the default domains, short enough for a narrow column; the side-by-side table names them in full. */
const SHORT_HEADERS: Readonly<Record<string, string>> = {
  'thinking and memory': 'thinking, memory',
  'light-headedness on standing': 'light-headed standing',
  'flu-like feelings': 'flu-like',
};

function reportTable(L: Layout, course: FollowUpCourse, intervalH: number | null): void {
  L.subheading('Every follow-up in force');
  const reports = [...course.day1.reports, ...course.day2.reports];
  const domainShare = course.domains.length ? Math.min(0.08, 0.48 / course.domains.length) : 0;
  const noteShare = 1 - 0.04 - 0.05 - 0.07 - 0.12 - 0.07 - domainShare * course.domains.length;
  L.table(
    [
      { header: '#', width: 0.04 },
      { header: 'Test', width: 0.05 },
      { header: 'After', width: 0.07 },
      { header: 'Reported by, how', width: 0.12 },
      { header: 'Usual state', width: 0.07 },
      ...course.domains.map((d) => ({ header: SHORT_HEADERS[d] ?? d, width: domainShare, align: 'center' as const })),
      { header: 'Note; corrections', width: noteShare },
    ],
    reports.map((r) => [
      String(r.seq),
      `day ${r.report.day}`,
      hoursText(r.report.afterTestH),
      `${r.report.reportedBy}, ${CHANNEL_LABELS[r.report.channel]}`,
      r.report.backToUsual ? 'back' : 'not back',
      ...course.domains.map((d) => {
        const s = r.report.ratings.find((x) => x.domain === d)?.score;
        return s === undefined || s === null ? '–' : String(s);
      }),
      [r.report.note, ...r.corrections.map((c) => `corrected in entry ${c.seq} by ${c.who}: ${c.reason}`)].filter((t) => t !== '').join(' · ') || '–',
    ]),
    { size: 6.5 },
  );
  L.paragraph('Ratings: 0 none to 10 worst imaginable, as the person rated them; – not asked. # is the reviewer log entry that first recorded the report; entries are hash-chained, and a correction is a new entry with its reason.', { size: 7, color: MUTED });
  if (intervalH !== null && course.day1.reports.some((r) => r.report.afterTestH > intervalH)) {
    L.paragraph(`Follow-ups of the day 1 test later than ${intervalH.toFixed(1)} h were given after the day 2 test had begun, so they reflect both tests.`, { size: 7.5, color: WARN });
  }
}
