/**
 * `twofold sign-off CASE_FOLDER`: record a reviewer's sign-off statement in a case's
 * hash-chained reviewer log.
 *
 *   twofold sign-off CASE --statement TEXT --reviewer NAME --role TEXT [--reason TEXT]
 *
 * The case is reopened with its checks (schema, hash chain, each raw copy against its
 * SHA-256) and recomputed, so the sign-off is recorded against numbers that reproduce; the
 * entry is appended with the time of the action from this shell's clock, and the case file is
 * replaced atomically (refused when someone else changed it in between). A sign-off covers
 * the case as it stands: a later threshold change or withdrawal ends it (core/case/overrides.ts,
 * `currentSignOff`), and a report without a sign-off in force is marked DRAFT on every page.
 * Source: common practice of a second reviewer signing a test report; the rules are Twofold's own.
 * Exit 0 when the sign-off was recorded, 2 for bad input, 1 otherwise.
 */
import type { CaseFile } from '../../core/case/case-file';
import { currentSignOff } from '../../core/case/overrides';
import { recordSignOff, type Reviewer } from '../../core/case/review';
import { minSec } from '../../core/report/format';
import { CASE_FILE_NAME } from '../../host/case-folder';
import { recordCase } from '../../host/report-job';
import { parseFlags } from '../args';
import { badInput, nowStamp, saveRecorded, withCaseFolder, type SavedCase } from '../case-edit';
import { EXIT_OK, UsageError, type CliIo } from '../io';

const USAGE = `usage: twofold sign-off CASE_FOLDER --statement TEXT --reviewer NAME --role TEXT [--reason TEXT]

  CASE_FOLDER        a case folder (or its ${CASE_FILE_NAME}), as 'twofold report' made it
  --statement TEXT   what the reviewer attests, printed in the report's signature block (required)
  --reviewer NAME    who signs off (required)
  --role TEXT        their role, e.g. "clinical exercise physiologist" (required)
  --reason TEXT      a note for the reviewer log (default: "Sign-off of the case as recomputed")

Then rebuild the report with 'twofold report DAY1 DAY2 --out REPORT.pdf --case CASE_FOLDER':
a report whose case has no sign-off in force is marked DRAFT on every page.
`;

const OPTIONS = {
  statement: { type: 'string' },
  reviewer: { type: 'string' },
  role: { type: 'string' },
  reason: { type: 'string' },
  help: { type: 'boolean', short: 'h' },
} as const;

/** Longest statement accepted: it is printed in one block of the report. */
export const STATEMENT_MAX_CHARS = 1000;
const DEFAULT_REASON = 'Sign-off of the case as recomputed';

function text(value: string | undefined, flag: string, what: string): string {
  const trimmed = value?.trim() ?? '';
  if (trimmed === '') throw new UsageError(`--${flag} is required: ${what}`);
  // Control characters would not print in the report; a line break is the one allowed.
  const bad = [...trimmed].findIndex((c) => c !== '\n' && c.charCodeAt(0) < 32);
  if (bad >= 0) throw new UsageError(`--${flag} has a control character at character ${bad + 1}; use plain text`);
  return trimmed;
}

export async function run(args: string[], io: CliIo): Promise<number> {
  const { values, positionals } = parseFlags(args, OPTIONS);
  if (values.help) {
    io.out(USAGE);
    return EXIT_OK;
  }
  if (positionals.length !== 1) throw new UsageError(`expected one case folder\n\n${USAGE}`);
  const statement = text(values.statement, 'statement', 'a sign-off records what the reviewer attests, e.g. "Thresholds reviewed; day 2 compared with day 1 as shown."');
  if (statement.length > STATEMENT_MAX_CHARS) throw new UsageError(`--statement is ${statement.length} characters long; at most ${STATEMENT_MAX_CHARS} fit the report's signature block`);
  const who = text(values.reviewer, 'reviewer', 'every reviewer action records who took it');
  const role = text(values.role, 'role', 'every reviewer action records the role of who took it');
  const reason = values.reason === undefined ? DEFAULT_REASON : text(values.reason, 'reason', 'leave it out for the default note, or give a note');

  // One writer at a time: the case is read, changed and saved under its lock (cli/case-edit.ts).
  return withCaseFolder(io, positionals[0], true, (opened) => {
    const before = recordCase(opened.caseFile, opened.raw);
    if (!before.ok) return badInput(io, before.error);
    const reviewer: Reviewer = { who, role, at: nowStamp() };
    const appended = recordSignOff(before.value.caseFile, reviewer, statement, reason);
    if (!appended.ok) return badInput(io, { ...appended.error, file: opened.path, message: `${appended.error.message} Nothing was recorded.` });
    const saved = saveRecorded(opened, appended.value);
    if (!saved.ok) return badInput(io, saved.error);
    return report(io, before.value.caseFile, saved.value, statement, positionals[0]);
  });
}

function report(io: CliIo, before: CaseFile, after: SavedCase, statement: string, caseArg: string): number {
  const previous = currentSignOff(before.log);
  const entry = after.caseFile.log[after.caseFile.log.length - 1];
  const lines = [`case     ${after.casePath}`, `entry ${entry.seq}  sign-off by ${entry.who} (${entry.role}) at ${entry.at}`, `         statement: ${statement}`, 'covers:'];
  for (const day of [after.outcome.day1, after.outcome.day2]) {
    for (const id of ['vt1', 'vt2'] as const) {
      const state = day[id];
      const p = state.effective;
      const where = p ? `${minSec(p.timeS)} (m:ss), VO2 ${p.vo2MlMin.toFixed(0)} mL/min` : 'none';
      lines.push(`  day ${day.day} ${id.toUpperCase()}  ${where} (${state.override ? `reviewer, entry ${state.override.seq}` : 'automatic consensus'})`);
    }
  }
  if (previous) lines.push(`note     this sign-off follows the one in entry ${previous.seq}; the report shows the newest`);
  lines.push(`next     rebuild the report with --case ${caseArg}; a later threshold change ends this sign-off`, '');
  io.out(lines.join('\n'));
  return EXIT_OK;
}

