/**
 * `twofold override CASE_FOLDER`: record a reviewer's own placement of a breakpoint in a case
 * folder, withdraw one, or list the reviewer log.
 *
 *   twofold override CASE --day 1|2 --threshold vt1|vt2 (--time-s N | --vo2-ml-min N)
 *                    --reason TEXT --reviewer NAME --role TEXT
 *   twofold override CASE --withdraw SEQ --reason TEXT --reviewer NAME --role TEXT
 *   twofold override CASE --list
 *
 * The case is reopened with its checks (schema, hash chain, each raw copy against its
 * SHA-256), recomputed, the action appended to the hash-chained reviewer log with the time
 * of the action from this shell's clock, recomputed again, and the case file replaced
 * atomically. What the threshold was before and is after (time and VO2) is printed. A VO2
 * maps to the first time on the ramp at which the averaged VO2 reaches it; a time must lie on
 * the incremental phase (core/case/overrides.ts, docs/case-file.md). Source: common practice
 * of manual threshold review; the rules are Twofold's own.
 * The case file is compared with the one read just before it is replaced, so a second writer
 * in between is refused rather than overwritten (a narrow window remains: there is no lock).
 * Exit 0 when the action was recorded (or the list printed), 2 for bad input, 1 otherwise.
 */
import type { CaseFile, DayNumber, ThresholdPoint } from '../../core/case/case-file';
import { currentSignOff } from '../../core/case/overrides';
import type { CaseOutcome, ThresholdState } from '../../core/case/recompute';
import { recordOverride, recordWithdrawal, type Reviewer, type ThresholdValue } from '../../core/case/review';
import type { Comparison } from '../../core/compare/compare-tests';
import type { ThresholdId } from '../../core/model/analysis';
import type { Result } from '../../core/model/errors';
import { describeAction } from '../../core/report/log-text';
import { CASE_FILE_NAME } from '../../host/case-folder';
import { recordCase } from '../../host/report-job';
import { numberFlag, parseFlags } from '../args';
import { badInput, nowStamp, saveRecorded, withCaseFolder, type OpenedCase } from '../case-edit';
import { EXIT_OK, UsageError, type CliIo } from '../io';

const USAGE = `usage: twofold override CASE_FOLDER --day 1|2 --threshold vt1|vt2 (--time-s N | --vo2-ml-min N)
                        --reason TEXT --reviewer NAME --role TEXT
       twofold override CASE_FOLDER --withdraw SEQ --reason TEXT --reviewer NAME --role TEXT
       twofold override CASE_FOLDER --list

  CASE_FOLDER        a case folder (or its ${CASE_FILE_NAME}), as 'twofold report' made it
  --day 1|2          which day's test
  --threshold vt1|vt2
  --time-s N         the breakpoint's time from the start of the recording, s (on the ramp)
  --vo2-ml-min N     or its VO2, mL/min: placed at the first time on the ramp VO2 reaches it
  --withdraw SEQ     withdraw the threshold change in reviewer log entry SEQ
  --reason TEXT      why (required; it is printed in the report)
  --reviewer NAME    who records it (required)
  --role TEXT        their role, e.g. "exercise physiologist" (required)
  --list             print the reviewer log and the thresholds in use; change nothing
`;

const OPTIONS = {
  day: { type: 'string' },
  threshold: { type: 'string' },
  'time-s': { type: 'string' },
  'vo2-ml-min': { type: 'string' },
  withdraw: { type: 'string' },
  reason: { type: 'string' },
  reviewer: { type: 'string' },
  role: { type: 'string' },
  list: { type: 'boolean' },
  help: { type: 'boolean', short: 'h' },
} as const;

type Values = ReturnType<typeof parseFlags<typeof OPTIONS>>['values'];

type Action =
  | { readonly kind: 'set'; readonly day: DayNumber; readonly threshold: ThresholdId; readonly value: ThresholdValue; readonly flag: string }
  | { readonly kind: 'withdraw'; readonly seq: number }
  | { readonly kind: 'list' };

function required(values: Values, name: 'reason' | 'reviewer' | 'role'): string {
  const value = values[name]?.trim();
  if (!value) throw new UsageError(`--${name} is required: every reviewer action records who, in what role, and why`);
  return value;
}

function actionOf(values: Values): Action {
  const setFlags = (['day', 'threshold', 'time-s', 'vo2-ml-min'] as const).filter((k) => values[k] !== undefined);
  const modes = [setFlags.length > 0, values.withdraw !== undefined, values.list === true].filter(Boolean).length;
  if (modes !== 1) throw new UsageError(`give one of: --day … --threshold … (--time-s | --vo2-ml-min), --withdraw SEQ, or --list\n\n${USAGE}`);
  if (values.list) {
    if (values.reason !== undefined || values.reviewer !== undefined || values.role !== undefined) throw new UsageError('--list changes nothing, so it takes no --reason, --reviewer or --role');
    return { kind: 'list' };
  }
  if (values.withdraw !== undefined) {
    const seq = numberFlag('withdraw', values.withdraw);
    if (seq === undefined || !Number.isInteger(seq) || seq < 1) throw new UsageError(`--withdraw expects a reviewer log entry number (1, 2, …), got '${values.withdraw}'`);
    return { kind: 'withdraw', seq };
  }
  if (values.day !== '1' && values.day !== '2') throw new UsageError(`--day expects 1 or 2, got '${values.day ?? ''}'`);
  const threshold = values.threshold?.toLowerCase();
  if (threshold !== 'vt1' && threshold !== 'vt2') throw new UsageError(`--threshold expects vt1 or vt2, got '${values.threshold ?? ''}'`);
  const timeS = numberFlag('time-s', values['time-s']);
  const vo2MlMin = numberFlag('vo2-ml-min', values['vo2-ml-min']);
  if ((timeS === undefined) === (vo2MlMin === undefined)) throw new UsageError('give the new position either as --time-s N or as --vo2-ml-min N (one of them)');
  if (timeS !== undefined && timeS < 0) throw new UsageError(`--time-s expects a time from the start of the recording (≥ 0 s), got ${timeS}`);
  if (vo2MlMin !== undefined && vo2MlMin <= 0) throw new UsageError(`--vo2-ml-min expects a VO2 above 0 mL/min, got ${vo2MlMin}`);
  const day = values.day === '1' ? 1 : 2;
  if (timeS !== undefined) return { kind: 'set', day, threshold, value: { timeS }, flag: `--time-s ${timeS}` };
  return { kind: 'set', day, threshold, value: { vo2MlMin: vo2MlMin as number }, flag: `--vo2-ml-min ${vo2MlMin}` };
}

export async function run(args: string[], io: CliIo): Promise<number> {
  const { values, positionals } = parseFlags(args, OPTIONS);
  if (values.help) {
    io.out(USAGE);
    return EXIT_OK;
  }
  if (positionals.length !== 1) throw new UsageError(`expected one case folder\n\n${USAGE}`);
  const action = actionOf(values);
  const reviewerFields = action.kind === 'list' ? null : { who: required(values, 'reviewer'), role: required(values, 'role'), reason: required(values, 'reason') };

  // One writer at a time: the case is read, changed and saved under its lock (cli/case-edit.ts).
  return withCaseFolder(io, positionals[0], reviewerFields !== null, (opened) => record(io, opened, action, reviewerFields));
}

function record(io: CliIo, opened: OpenedCase, action: ReturnType<typeof actionOf>, reviewerFields: { who: string; role: string; reason: string } | null): number {
  const { path, raw } = opened;
  const before = recordCase(opened.caseFile, raw);
  if (!before.ok) return badInput(io, before.error);

  if (action.kind === 'list' || reviewerFields === null) {
    io.out(listing(path, before.value.caseFile, before.value.outcome));
    return EXIT_OK;
  }

  const reviewer: Reviewer = { who: reviewerFields.who, role: reviewerFields.role, at: nowStamp() };
  const appended: Result<CaseFile> =
    action.kind === 'set'
      ? recordOverride(before.value.caseFile, before.value.outcome, reviewer, action.day, action.threshold, action.value, reviewerFields.reason)
      : recordWithdrawal(before.value.caseFile, before.value.outcome, reviewer, action.seq, reviewerFields.reason);
  if (!appended.ok) {
    const flag = action.kind === 'set' ? action.flag : `--withdraw ${action.seq}`;
    return badInput(io, { ...appended.error, file: path, message: `${flag}: ${appended.error.message} Nothing was recorded.` });
  }
  const saved = saveRecorded(opened, appended.value);
  if (!saved.ok) return badInput(io, saved.error);

  const entry = saved.value.caseFile.log[saved.value.caseFile.log.length - 1];
  const day = entry.action.kind === 'set-threshold' || entry.action.kind === 'withdraw' ? entry.action.day : null;
  const threshold = entry.action.kind === 'set-threshold' || entry.action.kind === 'withdraw' ? entry.action.threshold : null;
  const lines = [`case     ${saved.value.casePath}`, `entry ${entry.seq}  ${describeAction(entry.action)}`, `         by ${entry.who} (${entry.role}) at ${entry.at}; reason: ${entry.reason}`];
  if (day !== null && threshold !== null) {
    const was = dayOf(before.value.outcome, day)[threshold];
    const now = dayOf(saved.value.outcome, day)[threshold];
    lines.push(`day ${day} ${threshold.toUpperCase()}  before: ${pointText(was.effective)} (${sourceText(was)})`, `           after:  ${pointText(now.effective)} (${sourceText(now)})${valuesText(saved.value.outcome, day, threshold)}`);
  }
  const signOff = currentSignOff(before.value.caseFile.log);
  if (signOff) lines.push(`note     the sign-off in entry ${signOff.seq} no longer covers the thresholds shown; a new sign-off is needed`);
  lines.push('');
  io.out(lines.join('\n'));
  return EXIT_OK;
}

function dayOf(outcome: CaseOutcome<Comparison>, day: DayNumber) {
  return day === 1 ? outcome.day1 : outcome.day2;
}

function pointText(p: ThresholdPoint | null): string {
  if (!p) return 'none';
  const whole = Math.round(p.timeS);
  return `${p.timeS.toFixed(1)} s (${Math.floor(whole / 60)}:${String(whole % 60).padStart(2, '0')}), VO2 ${p.vo2MlMin.toFixed(0)} mL/min`;
}

function sourceText(state: ThresholdState): string {
  return state.override ? `reviewer, entry ${state.override.seq}` : state.effective ? 'automatic consensus' : 'no automatic estimate';
}

/** HR and work read off the series at the threshold as now used, the figures a pacing decision looks at. */
function valuesText(outcome: CaseOutcome<Comparison>, day: DayNumber, threshold: ThresholdId): string {
  const at = dayOf(outcome, day).analysis[threshold].at;
  if (!at) return '';
  const hr = at.hrBpm === null ? 'HR not recorded' : `HR ${at.hrBpm.toFixed(0)} bpm`;
  const work = at.workW === null ? 'work not recorded' : `work ${at.workW.toFixed(0)} W`;
  return `; ${hr}, ${work}`;
}

function listing(path: string, caseFile: CaseFile, outcome: CaseOutcome<Comparison>): string {
  const lines = [`case     ${path}`, '', 'thresholds in use:'];
  for (const day of [1, 2] as const) {
    for (const id of ['vt1', 'vt2'] as const) {
      const state = dayOf(outcome, day)[id];
      lines.push(`  day ${day} ${id.toUpperCase()}  ${pointText(state.effective)} (${sourceText(state)})`);
    }
  }
  lines.push('', caseFile.log.length === 0 ? 'reviewer log: no entries' : 'reviewer log:');
  for (const e of caseFile.log) lines.push(`  ${e.seq}  ${e.at}  ${e.who} (${e.role})  ${describeAction(e.action)}  reason: ${e.reason}`);
  lines.push('');
  return lines.join('\n');
}
