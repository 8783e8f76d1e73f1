/**
 * Reviewer overrides read from the log, and the mapping of a reviewer's value to a point on
 * the series. An override is active until withdrawn; withdrawing the newest override of a
 * threshold brings back the one before it (or the automatic estimate), which is what undo
 * means here. A VO2 given by the reviewer maps to the first time on the incremental phase
 * at which the averaged VO2 reaches it, interpolating linearly between averaged points.
 * Units: time s from the start of the recording, VO2 mL/min. Source: common practice of
 * manual threshold review; the mapping rule is Twofold's own, stated in docs/case-file.md.
 */
import type { Phases, ProcessedSeries, ThresholdId } from '../model/analysis';
import { fail, locatedError, ok, type Result } from '../model/errors';
import type { AuditEntry, DayNumber, ThresholdPoint } from './case-file';

export interface ActiveOverride {
  readonly seq: number;
  readonly day: DayNumber;
  readonly threshold: ThresholdId;
  readonly point: ThresholdPoint;
  readonly givenAs: 'time' | 'vo2';
  readonly who: string;
  readonly role: string;
  readonly at: string;
  readonly reason: string;
}

export type OverrideKey = `${DayNumber}:${ThresholdId}`;

export function overrideKey(day: DayNumber, threshold: ThresholdId): OverrideKey {
  return `${day}:${threshold}`;
}

/** The override in force for each day and threshold, after every withdrawal. */
export function activeOverrides(log: readonly AuditEntry[]): ReadonlyMap<OverrideKey, ActiveOverride> {
  const stacks = new Map<OverrideKey, ActiveOverride[]>();
  for (const entry of log) {
    const action = entry.action;
    if (action.kind === 'set-threshold') {
      const key = overrideKey(action.day, action.threshold);
      const stack = stacks.get(key) ?? [];
      stack.push({ seq: entry.seq, day: action.day, threshold: action.threshold, point: action.after, givenAs: action.givenAs, who: entry.who, role: entry.role, at: entry.at, reason: entry.reason });
      stacks.set(key, stack);
    } else if (action.kind === 'withdraw') {
      const stack = stacks.get(overrideKey(action.day, action.threshold)) ?? [];
      const i = stack.findIndex((o) => o.seq === action.withdraws);
      if (i >= 0) stack.splice(i, 1);
    }
  }
  const active = new Map<OverrideKey, ActiveOverride>();
  for (const [key, stack] of stacks) if (stack.length > 0) active.set(key, stack[stack.length - 1]);
  return active;
}

/** The latest sign-off, unless a threshold was changed after it (then it no longer covers what is shown). */
export function currentSignOff(log: readonly AuditEntry[]): AuditEntry | null {
  let signOff: AuditEntry | null = null;
  for (const entry of log) {
    if (entry.action.kind === 'sign-off') signOff = entry;
    else signOff = null;
  }
  return signOff;
}

/** VO2 at a time, interpolated linearly between averaged points. */
export function pointAtTime(series: ProcessedSeries, phases: Phases, timeS: number, file: string): Result<ThresholdPoint> {
  const t = series.timeS;
  if (!Number.isFinite(timeS) || timeS < phases.incrementalStartS || timeS > phases.incrementalEndS || t.length === 0) {
    return fail(locatedError('override-outside-ramp', file, null, null, `A threshold must lie on the incremental phase (${phases.incrementalStartS.toFixed(0)}–${phases.incrementalEndS.toFixed(0)} s); ${timeS} s does not.`));
  }
  for (let i = 0; i < t.length; i++) {
    if (t[i] >= timeS) {
      if (i === 0 || t[i] === timeS) return ok({ timeS, vo2MlMin: series.vo2MlMin[i] });
      const f = (timeS - t[i - 1]) / (t[i] - t[i - 1]);
      return ok({ timeS, vo2MlMin: series.vo2MlMin[i - 1] + f * (series.vo2MlMin[i] - series.vo2MlMin[i - 1]) });
    }
  }
  return ok({ timeS, vo2MlMin: series.vo2MlMin[t.length - 1] });
}

/** The first time on the incremental phase at which VO2 reaches `vo2MlMin`. */
export function firstTimeReaching(series: ProcessedSeries, phases: Phases, vo2MlMin: number, file: string): Result<ThresholdPoint> {
  const t = series.timeS;
  const v = series.vo2MlMin;
  let prev = -1;
  for (let i = 0; i < t.length; i++) {
    if (t[i] < phases.incrementalStartS || t[i] > phases.incrementalEndS) continue;
    if (v[i] >= vo2MlMin) {
      if (prev < 0) return ok({ timeS: t[i], vo2MlMin: v[i] });
      const f = (vo2MlMin - v[prev]) / (v[i] - v[prev]);
      return ok({ timeS: t[prev] + f * (t[i] - t[prev]), vo2MlMin });
    }
    prev = i;
  }
  return fail(locatedError('override-vo2-not-reached', file, null, null, `VO₂ never reaches ${Math.round(vo2MlMin)} mL/min on the incremental phase, so no threshold can be placed there.`));
}
