/**
 * Follow-up reports in the reviewer log: recording one, correcting one (a new entry with a
 * reason, never an edit), and reading the reports in force. A correction names the entry
 * that first recorded the report; correcting twice keeps the newest. Who records, their role,
 * the time and a reason are required, as for every reviewer action.
 */
import { courseNumbers, followUpCourse, type FollowUpCorrection, type RecordedFollowUp } from '../followup/course';
import type { FollowUpReport } from '../followup/report';
import { checkFollowUpReport } from '../followup/report-schema';
import { fail, locatedError, ok, type Result } from '../model/errors';
import { appendEntry } from './audit-log';
import type { AuditEntry, CaseFile } from './case-file';
import type { Reviewer } from './review';

export function recordFollowUp(caseFile: CaseFile, recorder: Reviewer, report: unknown, reason: string, file = 'follow-up'): Result<CaseFile> {
  const checked = checkFollowUpReport(report, file);
  if (!checked.ok) return checked;
  return appendEntry(caseFile, { ...recorder, reason, action: { kind: 'follow-up', report: checked.value } });
}

/** The report first recorded in entry `seq`, still in force, or why it cannot be corrected. */
export function correctableFollowUp(log: readonly AuditEntry[], seq: number, file = 'follow-up'): Result<RecordedFollowUp & { readonly report: FollowUpReport }> {
  const item = followUpsOf(log).find((f) => f.seq === seq);
  if (!item) {
    const target = log.find((e) => e.seq === seq);
    const what = target?.action.kind === 'follow-up-correction' ? `a correction of entry ${target.action.corrects}; correct entry ${target.action.corrects} itself` : 'not a follow-up report';
    return fail(locatedError('follow-up-unknown', file, null, null, `Reviewer log entry ${seq} is ${target ? what : 'not in the log'}, so there is nothing to correct.`));
  }
  if (item.report === null) {
    return fail(locatedError('follow-up-struck', file, null, null, `The follow-up in entry ${seq} was struck out in entry ${item.corrections[item.corrections.length - 1].seq}; record a new follow-up instead.`));
  }
  return ok({ ...item, report: item.report });
}

/** Corrects the report first recorded in entry `seq`; `report` null strikes it out (entered in error). */
export function recordFollowUpCorrection(caseFile: CaseFile, recorder: Reviewer, seq: number, report: unknown | null, reason: string, file = 'follow-up'): Result<CaseFile> {
  const target = correctableFollowUp(caseFile.log, seq, file);
  if (!target.ok) return target;
  const item = target.value;
  if (report === null) return appendEntry(caseFile, { ...recorder, reason, action: { kind: 'follow-up-correction', corrects: seq, report: null } });
  const checked = checkFollowUpReport(report, file);
  if (!checked.ok) return checked;
  if (JSON.stringify(checked.value) === JSON.stringify(item.report)) {
    return fail(locatedError('follow-up-unchanged', file, null, null, `The correction of entry ${seq} changes nothing; nothing was recorded.`));
  }
  return appendEntry(caseFile, { ...recorder, reason, action: { kind: 'follow-up-correction', corrects: seq, report: checked.value } });
}

/** Every follow-up report recorded in the log, as now in force, in the order first recorded. */
export function followUpsOf(log: readonly AuditEntry[]): RecordedFollowUp[] {
  const items = new Map<number, { seq: number; at: string; who: string; role: string; report: FollowUpReport | null; original: FollowUpReport; corrections: FollowUpCorrection[] }>();
  for (const entry of log) {
    const action = entry.action;
    if (action.kind === 'follow-up') {
      items.set(entry.seq, { seq: entry.seq, at: entry.at, who: entry.who, role: entry.role, report: action.report, original: action.report, corrections: [] });
    } else if (action.kind === 'follow-up-correction') {
      const item = items.get(action.corrects);
      // A correction of an unknown entry cannot be recorded by these functions; a hand-made one changes nothing.
      if (!item || item.report === null) continue;
      item.report = action.report;
      item.corrections.push({ seq: entry.seq, at: entry.at, who: entry.who, reason: entry.reason, struck: action.report === null });
    }
  }
  return [...items.values()];
}

/** The follow-up figures to record with the results (empty when the log holds none). */
export function followUpNumbers(log: readonly AuditEntry[]): Record<string, unknown> {
  return courseNumbers(followUpCourse(followUpsOf(log)));
}
