/**
 * `twofold recovery CASE_FOLDER`: record, correct and list the follow-up reports after each
 * test (how the person says they recovered), in the case's hash-chained reviewer log.
 *
 *   twofold recovery CASE --test 1|2 --hours H --by WHO --how in-person|phone|form --usual yes|no
 *                    [--rate DOMAIN=N …] [--note TEXT] --reviewer NAME --role TEXT [--reason TEXT]
 *   twofold recovery CASE --sheet FILE.csv --reviewer NAME --role TEXT [--reason TEXT]
 *   twofold recovery CASE --correct SEQ [fields to change] --reason TEXT --reviewer NAME --role TEXT
 *   twofold recovery CASE --strike SEQ --reason TEXT --reviewer NAME --role TEXT
 *   twofold recovery CASE --list [--json]
 *
 * A correction is a new log entry naming the report's entry, with a reason; fields not given
 * keep the values in force. The case is reopened with its checks, recomputed (the follow-up
 * figures are recorded with the other numbers, so `twofold verify` recomputes them), and
 * replaced atomically; a case changed by someone else meanwhile is refused. Exit 0 when
 * recorded (or listed), 2 for bad input (a sheet's problem as FILE:LINE:COLUMN), 1 otherwise.
 */
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import type { CaseFile } from '../../core/case/case-file';
import { correctableFollowUp, followUpsOf, recordFollowUp, recordFollowUpCorrection } from '../../core/case/follow-ups';
import { currentSignOff } from '../../core/case/overrides';
import type { Reviewer } from '../../core/case/review';
import { FOLLOW_UP_CAUTION } from '../../core/followup/caution';
import { followUpCourse, recoveryText } from '../../core/followup/course';
import { describeReport } from '../../core/followup/describe';
import { describeAction } from '../../core/report/log-text';
import { readBackToUsual, readChannel, readHours, readScore, readTestDay, type Field } from '../../core/followup/fields';
import { DEFAULT_DOMAINS, FOLLOW_UP_VERSION, type DomainRating, type FollowUpReport } from '../../core/followup/report';
import { readFollowUpSheet } from '../../core/followup/sheet';
import type { Result } from '../../core/model/errors';
import { parseFlags } from '../args';
import { badInput, nowStamp, saveRecorded, withCaseFolder, type OpenedCase } from '../case-edit';
import { EXIT_BAD_INPUT, EXIT_OK, UsageError, type CliIo } from '../io';
import { readProblem } from '../../host/read-problem';

const USAGE = `usage: twofold recovery CASE_FOLDER --test 1|2 --hours H --by WHO --how in-person|phone|form
                        --usual yes|no [--rate DOMAIN=N ...] [--note TEXT]
                        --reviewer NAME --role TEXT [--reason TEXT]
       twofold recovery CASE_FOLDER --sheet FILE.csv --reviewer NAME --role TEXT [--reason TEXT]
       twofold recovery CASE_FOLDER --correct SEQ [any field above] --reason TEXT --reviewer NAME --role TEXT
       twofold recovery CASE_FOLDER --strike SEQ --reason TEXT --reviewer NAME --role TEXT
       twofold recovery CASE_FOLDER --list [--json]

  --test 1|2         which test the report follows
  --hours H          hours from the end of that test (22, 22h, 3d)
  --by WHO           who gave the account, e.g. "the person", "partner"
  --how CHANNEL      in-person, phone or form
  --usual yes|no     whether the person reports being back to their usual state
  --rate DOMAIN=N    a 0-10 rating (0 none, 10 worst imaginable); repeat per domain.
                     Default domains: ${DEFAULT_DOMAINS.join(', ')}; a lab may name others
  --note TEXT        free note, as said or written
  --sheet FILE.csv   several reports from a follow-up sheet (docs/cli.md)
  --correct SEQ      correct the report first recorded in reviewer log entry SEQ
  --strike SEQ       strike out that report (entered in error); the entry stays in the log
  --reason TEXT      why (required for --correct and --strike)
  --reviewer NAME    who records it (required)
  --role TEXT        their role, e.g. "lab coordinator" (required)
  --list             print the reports in force and the time to reported recovery
  --json             with --list: the same as JSON
`;

const OPTIONS = {
  test: { type: 'string' },
  hours: { type: 'string' },
  by: { type: 'string' },
  how: { type: 'string' },
  usual: { type: 'string' },
  rate: { type: 'string', multiple: true },
  note: { type: 'string' },
  sheet: { type: 'string' },
  correct: { type: 'string' },
  strike: { type: 'string' },
  reason: { type: 'string' },
  reviewer: { type: 'string' },
  role: { type: 'string' },
  list: { type: 'boolean' },
  json: { type: 'boolean' },
  help: { type: 'boolean', short: 'h' },
} as const;

type Values = ReturnType<typeof parseFlags<typeof OPTIONS>>['values'];
const FIELD_FLAGS = ['test', 'hours', 'by', 'how', 'usual', 'rate', 'note'] as const;
const DEFAULT_REASON = 'Follow-up report, recorded as given.';

type Mode = { kind: 'add' } | { kind: 'sheet'; path: string } | { kind: 'correct'; seq: number } | { kind: 'strike'; seq: number } | { kind: 'list' };

function modeOf(values: Values): Mode {
  const fields = FIELD_FLAGS.some((f) => values[f] !== undefined);
  const chosen = [values.sheet !== undefined, values.correct !== undefined, values.strike !== undefined, values.list === true].filter(Boolean).length;
  if (chosen > 1) throw new UsageError(`give one of --sheet, --correct, --strike or --list\n\n${USAGE}`);
  if (values.list) {
    if (fields || values.reason !== undefined || values.reviewer !== undefined || values.role !== undefined) throw new UsageError('--list changes nothing, so it takes no report fields, --reason, --reviewer or --role');
    return { kind: 'list' };
  }
  if (values.json) throw new UsageError('--json goes with --list');
  if (values.sheet !== undefined) {
    if (fields) throw new UsageError('--sheet takes the reports from the file; give no report fields with it');
    return { kind: 'sheet', path: values.sheet };
  }
  const seqOf = (flag: 'correct' | 'strike'): number => {
    const raw = values[flag] as string;
    if (!/^\d+$/.test(raw) || Number(raw) < 1) throw new UsageError(`--${flag} expects a reviewer log entry number (1, 2, …), got '${raw}'`);
    return Number(raw);
  };
  if (values.strike !== undefined) {
    if (fields) throw new UsageError('--strike takes no report fields; to change a report use --correct');
    return { kind: 'strike', seq: seqOf('strike') };
  }
  if (values.correct !== undefined) {
    if (!fields) throw new UsageError('--correct needs at least one field to change (--test, --hours, --by, --how, --usual, --rate, --note)');
    return { kind: 'correct', seq: seqOf('correct') };
  }
  if (!fields) throw new UsageError(`nothing to do\n\n${USAGE}`);
  return { kind: 'add' };
}

function flagField<T>(flag: string, raw: string, read: (t: string) => Field<T>): T {
  const field = read(raw);
  if (!field.ok) throw new UsageError(`--${flag} expects ${field.expected}`);
  return field.value;
}

function ratingsOf(values: Values, base: readonly DomainRating[]): DomainRating[] {
  const ratings = base.map((r) => ({ ...r }));
  for (const item of values.rate ?? []) {
    const at = item.lastIndexOf('=');
    if (at <= 0) throw new UsageError(`--rate expects DOMAIN=N, e.g. --rate fatigue=6 or --rate "thinking and memory=4" (got '${item}')`);
    const domain = item.slice(0, at).trim().toLowerCase();
    const score = flagField(`rate ${domain}`, item.slice(at + 1), readScore);
    const existing = ratings.find((r) => r.domain === domain);
    if (existing) existing.score = score;
    else ratings.push({ domain, score });
  }
  return ratings;
}

/** The report the flags give: a new one (all required fields), or the one in force with the given fields changed. */
function reportOf(values: Values, base: FollowUpReport | null): unknown {
  const need = <T>(flag: 'test' | 'hours' | 'by' | 'how' | 'usual', read: (t: string) => Field<T>, fallback: T | undefined): T => {
    const raw = values[flag];
    if (raw === undefined) {
      if (fallback === undefined) throw new UsageError(`--${flag} is required for a new follow-up (--test, --hours, --by, --how and --usual are)`);
      return fallback;
    }
    return flagField(flag, raw, read);
  };
  return {
    version: FOLLOW_UP_VERSION,
    day: need('test', readTestDay, base?.day),
    afterTestH: need('hours', readHours, base?.afterTestH),
    reportedBy: need('by', (t) => (t.trim() ? { ok: true, value: t.trim() } : { ok: false, expected: "who gave the account, e.g. 'the person'" }), base?.reportedBy),
    channel: need('how', readChannel, base?.channel),
    backToUsual: need('usual', readBackToUsual, base?.backToUsual),
    ratings: ratingsOf(values, base?.ratings ?? []),
    note: values.note ?? base?.note ?? '',
  };
}

function required(values: Values, name: 'reviewer' | 'role' | 'reason'): string {
  const value = values[name]?.trim();
  if (!value) throw new UsageError(`--${name} is required: every entry in the reviewer log records who, in what role${name === 'reason' ? ', and why a report is corrected or struck out' : ''}`);
  return value;
}

export async function run(args: string[], io: CliIo): Promise<number> {
  const { values, positionals } = parseFlags(args, OPTIONS);
  if (values.help) {
    io.out(USAGE);
    return EXIT_OK;
  }
  if (positionals.length !== 1) throw new UsageError(`expected one case folder\n\n${USAGE}`);
  const mode = modeOf(values);
  const recorder = mode.kind === 'list' ? null : { who: required(values, 'reviewer'), role: required(values, 'role') };
  const reason = mode.kind === 'correct' || mode.kind === 'strike' ? required(values, 'reason') : (values.reason?.trim() || DEFAULT_REASON);

  // One writer at a time: the case is read, changed and saved under its lock (cli/case-edit.ts).
  return withCaseFolder(io, positionals[0], recorder !== null, (opened) => record(io, opened, values, mode, recorder, reason));
}

function record(io: CliIo, opened: OpenedCase, values: Values, mode: ReturnType<typeof modeOf>, recorder: { who: string; role: string } | null, reason: string): number {
  const { path, caseFile } = opened;
  if (mode.kind === 'list' || recorder === null) {
    io.out(values.json ? `${JSON.stringify(listJson(caseFile), null, 2)}\n` : listing(path, caseFile));
    return EXIT_OK;
  }
  const stamp: Reviewer = { ...recorder, at: nowStamp() };
  let appended: Result<CaseFile>;
  if (mode.kind === 'add') appended = recordFollowUp(caseFile, stamp, reportOf(values, null), reason, 'command line');
  else if (mode.kind === 'sheet') {
    const sheetPath = resolve(io.cwd, mode.path);
    let text: string;
    try {
      text = readFileSync(sheetPath, 'utf8');
    } catch (error) {
      io.err(`${sheetPath}:0:0: ${readProblem(error, 'follow-up sheet')}\n`);
      return EXIT_BAD_INPUT;
    }
    const rows = readFollowUpSheet(text, sheetPath);
    if (!rows.ok) return badInput(io, rows.error);
    appended = { ok: true, value: caseFile };
    for (const row of rows.value) {
      if (!appended.ok) break;
      appended = recordFollowUp(appended.value, stamp, row.report, reason, sheetPath);
    }
  } else {
    const target = correctableFollowUp(caseFile.log, mode.seq, 'command line');
    appended = target.ok ? recordFollowUpCorrection(caseFile, stamp, mode.seq, mode.kind === 'strike' ? null : reportOf(values, target.value.report), reason, 'command line') : target;
  }
  if (!appended.ok) return badInput(io, { ...appended.error, file: appended.error.file === 'command line' ? path : appended.error.file, message: `${appended.error.message} Nothing was recorded.` });

  const saved = saveRecorded(opened, appended.value);
  if (!saved.ok) return badInput(io, saved.error);
  const added = saved.value.caseFile.log.slice(caseFile.log.length);
  const lines = [`case     ${saved.value.casePath}`];
  for (const e of added) lines.push(`entry ${e.seq}  ${describeAction(e.action)}`, `         by ${e.who} (${e.role}) at ${e.at}; reason: ${e.reason}`);
  const course = followUpCourse(followUpsOf(saved.value.caseFile.log));
  lines.push(`recovery after the day 1 test: ${recoveryText(course.day1.recovery)}`, `recovery after the day 2 test: ${recoveryText(course.day2.recovery)}`);
  const signOff = currentSignOff(caseFile.log);
  if (signOff) lines.push(`note     the sign-off in entry ${signOff.seq} no longer covers what the report shows; a new sign-off is needed`);
  lines.push('');
  io.out(lines.join('\n'));
  return EXIT_OK;
}

function listing(path: string, caseFile: CaseFile): string {
  const items = followUpsOf(caseFile.log);
  const course = followUpCourse(items);
  const lines = [`case     ${path}`, ''];
  if (items.length === 0) lines.push('follow-ups: none recorded');
  for (const day of [course.day1, course.day2]) {
    lines.push(`after the day ${day.day} test: ${recoveryText(day.recovery)}`);
    for (const r of day.reports) {
      lines.push(`  ${r.seq}  ${describeReport(r.report)}${r.report.note ? `; note: ${r.report.note}` : ''}`);
      for (const c of r.corrections) lines.push(`       corrected in entry ${c.seq} by ${c.who} at ${c.at}: ${c.reason}`);
    }
  }
  const struck = items.filter((i) => i.report === null);
  for (const s of struck) {
    const c = s.corrections[s.corrections.length - 1];
    lines.push(`struck out: entry ${s.seq} (${describeReport(s.original)}) in entry ${c.seq} by ${c.who}: ${c.reason}`);
  }
  lines.push('', FOLLOW_UP_CAUTION, '');
  return lines.join('\n');
}

function listJson(caseFile: CaseFile) {
  const items = followUpsOf(caseFile.log);
  const course = followUpCourse(items);
  return {
    followUps: items,
    recovery: { day1: { ...course.day1.recovery, text: recoveryText(course.day1.recovery) }, day2: { ...course.day2.recovery, text: recoveryText(course.day2.recovery) } },
    domains: course.domains,
  };
}
