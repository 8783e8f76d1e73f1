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
import { existsSync, readFileSync } from 'node:fs';
import { currentSignOff } from '../../core/case/overrides';
import { recordSignOff, type Reviewer } from '../../core/case/review';
import { formatLocated, type LocatedError } from '../../core/model/errors';
import { minSec } from '../../core/report/format';
import { CASE_FILE_NAME, caseFilePath, loadCase, saveCase } from '../../host/case-folder';
import { recordCase } from '../../host/report-job';
import { parseFlags } from '../args';
import { caseFolderOf } from '../case-arg';
import { EXIT_BAD_INPUT, EXIT_OK, UsageError, type CliIo } from '../io';

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

  const folder = caseFolderOf(positionals[0], io.cwd);
  const path = caseFilePath(folder);
  if (!existsSync(path)) {
    io.err(`${path}:0:0: There is no case here; 'twofold report DAY1 DAY2 --out REPORT.pdf --case ${positionals[0]}' makes one.\n`);
    return EXIT_BAD_INPUT;
  }
  const textBefore = readFileSync(path, 'utf8');
  const loaded = loadCase(folder);
  if (!loaded.ok) return badInput(io, loaded.error);
  const { raw } = loaded.value;
  const before = recordCase(loaded.value.caseFile, raw);
  if (!before.ok) return badInput(io, before.error);

  // The clock sits here, at the edge; core receives the time as a string.
  const reviewer: Reviewer = { who, role, at: new Date().toISOString().replace(/\.\d{3}Z$/, 'Z') };
  const appended = recordSignOff(before.value.caseFile, reviewer, statement, reason);
  if (!appended.ok) return badInput(io, { ...appended.error, file: path, message: `${appended.error.message} Nothing was recorded.` });
  const after = recordCase(appended.value, raw);
  if (!after.ok) return badInput(io, after.error);
  if (readFileSync(path, 'utf8') !== textBefore) {
    io.err(`${path}:0:0: The case file was changed by someone else while the sign-off was being recorded; nothing was written. Run the command again.\n`);
    return EXIT_BAD_INPUT;
  }
  const saved = saveCase(folder, after.value.caseFile, raw);
  if (!saved.ok) return badInput(io, saved.error);

  const previous = currentSignOff(before.value.caseFile.log);
  const entry = after.value.caseFile.log[after.value.caseFile.log.length - 1];
  const lines = [`case     ${saved.value}`, `entry ${entry.seq}  sign-off by ${entry.who} (${entry.role}) at ${entry.at}`, `         statement: ${statement}`, 'covers:'];
  for (const day of [after.value.outcome.day1, after.value.outcome.day2]) {
    for (const id of ['vt1', 'vt2'] as const) {
      const state = day[id];
      const p = state.effective;
      const where = p ? `${minSec(p.timeS)} (m:ss), VO2 ${p.vo2MlMin.toFixed(0)} mL/min` : 'none';
      lines.push(`  day ${day.day} ${id.toUpperCase()}  ${where} (${state.override ? `reviewer, entry ${state.override.seq}` : 'automatic consensus'})`);
    }
  }
  if (previous) lines.push(`note     this sign-off follows the one in entry ${previous.seq}; the report shows the newest`);
  lines.push(`next     rebuild the report with --case ${positionals[0]}; a later threshold change ends this sign-off`, '');
  io.out(lines.join('\n'));
  return EXIT_OK;
}

function badInput(io: CliIo, error: LocatedError): number {
  io.err(`${formatLocated(error)}\n`);
  return EXIT_BAD_INPUT;
}
