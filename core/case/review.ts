/**
 * Reviewer actions as log entries. Each function works out the values before and after
 * from the current outcome, so the log states exactly what changed, and appends one
 * chained entry; the caller then recomputes. Who, role, time and reason are required.
 */
import type { ThresholdId } from '../model/analysis';
import { fail, locatedError, type Result } from '../model/errors';
import { appendEntry } from './audit-log';
import type { CaseFile, DayNumber } from './case-file';
import { activeOverrides, firstTimeReaching, overrideKey, pointAtTime } from './overrides';
import type { CaseOutcome } from './recompute';

export interface Reviewer {
  readonly who: string;
  readonly role: string;
  /** ISO 8601 date-time of the action, from the shell's clock. */
  readonly at: string;
}

export type ThresholdValue = { readonly timeS: number } | { readonly vo2MlMin: number };

export function recordOverride<C>(
  caseFile: CaseFile,
  outcome: CaseOutcome<C>,
  reviewer: Reviewer,
  day: DayNumber,
  threshold: ThresholdId,
  value: ThresholdValue,
  reason: string,
): Result<CaseFile> {
  const state = day === 1 ? outcome.day1 : outcome.day2;
  const { series, phases } = state.analysis;
  const where = `day ${day} ${threshold.toUpperCase()}`;
  const point = 'timeS' in value ? pointAtTime(series, phases, value.timeS, where) : firstTimeReaching(series, phases, value.vo2MlMin, where);
  if (!point.ok) return point;
  return appendEntry(caseFile, {
    ...reviewer,
    reason,
    action: { kind: 'set-threshold', day, threshold, givenAs: 'timeS' in value ? 'time' : 'vo2', before: state[threshold].effective, after: point.value },
  });
}

/** Withdraws an override that is still in force; the threshold goes back to what it was before it. */
export function recordWithdrawal<C>(caseFile: CaseFile, outcome: CaseOutcome<C>, reviewer: Reviewer, seq: number, reason: string): Result<CaseFile> {
  const target = caseFile.log.find((e) => e.seq === seq);
  if (!target || target.action.kind !== 'set-threshold') {
    return fail(locatedError('withdraw-unknown', 'case file', null, null, `Reviewer log entry ${seq} is not a threshold change, so there is nothing to withdraw.`));
  }
  const { day, threshold } = target.action;
  const active = activeOverrides(caseFile.log);
  const stillActive = caseFile.log.some((e) => e.action.kind === 'withdraw' && e.action.withdraws === seq) === false;
  if (!stillActive) {
    return fail(locatedError('withdraw-twice', 'case file', null, null, `The threshold change in reviewer log entry ${seq} has already been withdrawn.`));
  }
  const state = (day === 1 ? outcome.day1 : outcome.day2)[threshold];
  const remaining = activeOverrides([...caseFile.log.filter((e) => e.seq !== seq)]).get(overrideKey(day, threshold));
  const after = active.get(overrideKey(day, threshold))?.seq === seq ? (remaining?.point ?? pointOf(state.automatic.at)) : state.effective;
  return appendEntry(caseFile, { ...reviewer, reason, action: { kind: 'withdraw', withdraws: seq, day, threshold, before: state.effective, after } });
}

export function recordSignOff(caseFile: CaseFile, reviewer: Reviewer, statement: string, reason: string): Result<CaseFile> {
  return appendEntry(caseFile, { ...reviewer, reason, action: { kind: 'sign-off', statement } });
}

function pointOf(at: { readonly timeS: number; readonly vo2MlMin: number } | null) {
  return at ? { timeS: at.timeS, vo2MlMin: at.vo2MlMin } : null;
}
