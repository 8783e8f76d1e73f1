/**
 * The mark a reader sees beside every value that a reviewer's placement of a threshold
 * decides: "‡ reviewer-set (log entry 3)". Values read at VT1 or VT2 (VO2, work, HR, time at
 * the threshold, % of peak) follow the threshold, so they carry the mark too.
 */
import type { CaseOutcome, DayOutcome } from '../case/recompute';
import type { ThresholdId } from '../model/analysis';

export const REVIEWER_MARK = '‡';

/** "‡" when the day's threshold is set by a reviewer, else "". */
export function reviewerMark(day: DayOutcome, id: ThresholdId): string {
  return day[id].override ? REVIEWER_MARK : '';
}

/** The note under a table that uses the mark, or null when no value in it is reviewer-set. */
export function reviewerMarkNote(days: readonly DayOutcome[], ids: readonly ThresholdId[] = ['vt1', 'vt2']): string | null {
  const parts: string[] = [];
  for (const d of days) for (const id of ids) {
    const o = d[id].override;
    if (o) parts.push(`day ${d.day} ${id.toUpperCase()} (log entry ${o.seq}, ${o.who})`);
  }
  return parts.length === 0 ? null : `${REVIEWER_MARK} Value read at a threshold set by a reviewer, not at the automatic estimate: ${parts.join('; ')}.`;
}

/** For a comparison metric read at a threshold: the mark when either day's threshold is reviewer-set. */
export function metricReviewerMark(outcome: CaseOutcome<unknown>, threshold: ThresholdId | null): string {
  if (threshold === null) return '';
  return outcome.day1[threshold].override || outcome.day2[threshold].override ? ` ${REVIEWER_MARK}` : '';
}
