/**
 * One reviewer action in words, for the report's log table and the CLI.
 *
 * Example: a set-threshold of day 2 VT1 from 6:40 to 6:10 →
 * 'Day 2 VT1 set: 6:40, 1480 mL/min → 6:10, 1395 mL/min (given as a time)'.
 */
import type { ReviewAction, ThresholdPoint } from '../case/case-file';
import { describeFollowUpAction } from '../followup/describe';
import { fixed, minSec, type ReportFormat } from './format';

const NEUTRAL = { fixed, minSec };

function point(p: ThresholdPoint | null, f: Pick<ReportFormat, 'fixed' | 'minSec'>): string {
  return p ? `${f.minSec(p.timeS)}, ${f.fixed(p.vo2MlMin, 0)} mL/min` : 'none';
}

/** `f` writes the numbers in a locale (core/report/format.ts); Twofold's neutral form when absent. */
export function describeAction(action: ReviewAction, f: Pick<ReportFormat, 'fixed' | 'minSec'> = NEUTRAL): string {
  switch (action.kind) {
    case 'set-threshold':
      return `Day ${action.day} ${action.threshold.toUpperCase()} set: ${point(action.before, f)} → ${point(action.after, f)} (given as a ${action.givenAs === 'vo2' ? 'VO₂' : 'time'})`;
    case 'withdraw':
      return `Entry ${action.withdraws} withdrawn (day ${action.day} ${action.threshold.toUpperCase()}): ${point(action.before, f)} → ${point(action.after, f)}`;
    case 'sign-off':
      return `Sign-off: ${action.statement}`;
    case 'follow-up':
    case 'follow-up-correction':
      return describeFollowUpAction(action);
    case 'case-opened':
      return action.migrated ? 'Case opened (entry added when a case file older than opening entries was read)' : 'Case opened: raw files, column maps, settings and clinical inputs chained';
  }
}
