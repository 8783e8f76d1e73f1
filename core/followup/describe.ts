/**
 * A follow-up action in words, for the reviewer log table, the CLI and the workbench.
 *
 * Example: 'Follow-up, day 1 test, 22 h: not back to usual state; fatigue 6, pain 3 (the person, phone)'.
 */
import type { FollowUpAction } from './actions';
import { CHANNEL_LABELS, hoursText, type FollowUpReport } from './report';

export function describeReport(report: FollowUpReport): string {
  const rated = report.ratings.filter((r) => r.score !== null).map((r) => `${r.domain} ${r.score}`);
  return `day ${report.day} test, ${hoursText(report.afterTestH)}: ${report.backToUsual ? 'back to usual state' : 'not back to usual state'}${rated.length ? `; ${rated.join(', ')}` : ''} (${report.reportedBy}, ${CHANNEL_LABELS[report.channel]})`;
}

export function describeFollowUpAction(action: FollowUpAction): string {
  if (action.kind === 'follow-up') return `Follow-up, ${describeReport(action.report)}`;
  return action.report === null ? `Follow-up in entry ${action.corrects} struck out` : `Follow-up in entry ${action.corrects} corrected: ${describeReport(action.report)}`;
}
