/**
 * Invented follow-up reports for the demo pair QH-0417 (sample-tests/scenario/demo-scenario.ts):
 * the lab's coordinator asks before leaving, by phone before the second test, and by phone and
 * form over the following two weeks. The course is a scenario assumption in line with what
 * two-day labs commonly hear from people whose day 2 declines: not back to their usual state
 * before the second test, and about twelve days to report being back after it (common
 * practice, see the project brief). Nothing here describes a real person.
 *
 * One report is entered with a slip (72 h typed as 27 h) and corrected in a later entry, so
 * the demo shows a correction with its reason.
 */
import type { FollowUpReport } from '../../core/followup/report';

type Scores = readonly [fatigue: number, thinking: number, pain: number, sleep: number, standing: number, fluLike: number];

const DOMAINS = ['fatigue', 'thinking and memory', 'pain', 'sleep', 'light-headedness on standing', 'flu-like feelings'] as const;

function report(day: 1 | 2, afterTestH: number, channel: FollowUpReport['channel'], backToUsual: boolean, scores: Scores, note: string, reportedBy = 'the person'): FollowUpReport {
  return { version: 1, day, afterTestH, reportedBy, channel, backToUsual, ratings: DOMAINS.map((domain, i) => ({ domain, score: scores[i] })), note };
}

export interface DemoFollowUp {
  readonly report: FollowUpReport;
  readonly reason: string;
  /** When set, the report is first entered with this slip and then corrected. */
  readonly enteredAs?: FollowUpReport;
  readonly correctionReason?: string;
}

export const DEMO_FOLLOW_UPS: readonly DemoFollowUp[] = [
  { report: report(1, 1, 'in-person', false, [5, 2, 2, 0, 3, 1], 'Tired and a little shaky after the test, as before other exertion.'), reason: 'Routine check before leaving the lab.' },
  { report: report(1, 22, 'phone', false, [7, 5, 4, 6, 4, 4], 'Slept badly; heavy legs and sore throat since the evening. Agreed to the second test.'), reason: 'Scheduled call before the day 2 test.' },
  { report: report(2, 20, 'phone', false, [8, 6, 5, 7, 5, 6], 'Stayed in bed most of the day; partner did the shopping.'), reason: 'Scheduled call the day after the second test.' },
  {
    report: report(2, 72, 'phone', false, [8, 7, 5, 6, 5, 5], 'Worse on the second morning than the first; headache.', 'partner'),
    enteredAs: report(2, 27, 'phone', false, [8, 7, 5, 6, 5, 5], 'Worse on the second morning than the first; headache.', 'partner'),
    reason: 'Scheduled call three days after the second test; the person asked their partner to answer.',
    correctionReason: 'Time typed as 27 h; the call was on the third day after the test (72 h).',
  },
  { report: report(2, 168, 'form', false, [6, 5, 3, 4, 3, 2], 'Form returned by post: up for short walks indoors only.'), reason: 'One-week follow-up form.' },
  { report: report(2, 288, 'phone', true, [3, 2, 1, 2, 1, 0], 'Back to usual routine since about day 11.'), reason: 'Follow-up call at twelve days.' },
];
