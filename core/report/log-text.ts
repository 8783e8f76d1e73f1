/**
 * One reviewer action in words, for the report's log table and the CLI.
 *
 * Example: a set-threshold of day 2 VT1 from 6:40 to 6:10 →
 * 'Day 2 VT1 set: 6:40, 1480 mL/min → 6:10, 1395 mL/min (given as a time)'.
 */
import type { ReviewAction, ThresholdPoint } from '../case/case-file';
import { fixed, minSec } from './format';

function point(p: ThresholdPoint | null): string {
  return p ? `${minSec(p.timeS)}, ${fixed(p.vo2MlMin, 0)} mL/min` : 'none';
}

export function describeAction(action: ReviewAction): string {
  switch (action.kind) {
    case 'set-threshold':
      return `Day ${action.day} ${action.threshold.toUpperCase()} set: ${point(action.before)} → ${point(action.after)} (given as a ${action.givenAs === 'vo2' ? 'VO₂' : 'time'})`;
    case 'withdraw':
      return `Entry ${action.withdraws} withdrawn (day ${action.day} ${action.threshold.toUpperCase()}): ${point(action.before)} → ${point(action.after)}`;
    case 'sign-off':
      return `Sign-off: ${action.statement}`;
    case 'case-opened':
      return action.migrated ? 'Case opened (entry added when a case file older than opening entries was read)' : 'Case opened: raw files, column maps, settings and clinical inputs chained';
  }
}
