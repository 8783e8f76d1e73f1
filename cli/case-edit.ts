/**
 * The read-record-save of a case folder that the reviewer commands (override, sign-off,
 * recovery) share: the CASE_FOLDER argument, the case opened with every check (under its
 * lock when the command writes, host/case-lock.ts), and a save that recomputes the case,
 * refuses when the file changed on disk meanwhile and replaces it atomically. Each command
 * supplies only what it records and what it prints.
 */
import { existsSync, readFileSync } from 'node:fs';
import type { CaseFile } from '../core/case/case-file';
import type { CaseOutcome, RawBytes } from '../core/case/recompute';
import type { Comparison } from '../core/compare/compare-tests';
import { fail, formatLocated, locatedError, ok, type LocatedError, type Result } from '../core/model/errors';
import { caseFilePath, loadCase, saveCase } from '../host/case-folder';
import { withCaseLock } from '../host/case-lock';
import { recordCase } from '../host/report-job';
import { caseFolderOf } from './case-arg';
import { EXIT_BAD_INPUT, type CliIo } from './io';

export interface OpenedCase {
  readonly folder: string;
  /** The case file's path, for located messages. */
  readonly path: string;
  readonly caseFile: CaseFile;
  readonly raw: RawBytes;
  /** The file's text when it was opened: a save refuses if it changed since. */
  readonly textBefore: string;
}

export interface SavedCase {
  readonly casePath: string;
  readonly caseFile: CaseFile;
  readonly outcome: CaseOutcome<Comparison>;
}

/** A located message on stderr, exit 2. */
export function badInput(io: CliIo, error: LocatedError): number {
  io.err(`${formatLocated(error)}\n`);
  return EXIT_BAD_INPUT;
}

/**
 * Opens the case folder `arg` (a folder, or the twofold-case.json inside it) and runs `body`
 * on it; with `lock`, the whole read-change-save runs under the folder's lock, so concurrent
 * writers wait their turn and none loses an entry.
 */
export async function withCaseFolder(io: CliIo, arg: string, lock: boolean, body: (opened: OpenedCase) => Promise<number> | number): Promise<number> {
  const folder = caseFolderOf(arg, io.cwd);
  const path = caseFilePath(folder);
  if (!existsSync(path)) {
    io.err(`${path}:0:0: There is no case here; 'twofold report DAY1 DAY2 --out REPORT.pdf --case ${arg}' makes one.\n`);
    return EXIT_BAD_INPUT;
  }
  const open = async (): Promise<number> => {
    const loaded = loadCase(folder);
    if (!loaded.ok) return badInput(io, loaded.error);
    const textBefore = readFileSync(path, 'utf8');
    return body({ folder, path, textBefore, caseFile: loaded.value.caseFile, raw: loaded.value.raw });
  };
  if (!lock) return open();
  const locked = await withCaseLock(folder, async () => ok(await open()));
  return locked.ok ? locked.value : badInput(io, locked.error);
}

/** Recomputes `next` (recorded numbers), then saves it atomically unless the file changed on disk since it was opened. */
export function saveRecorded(opened: OpenedCase, next: CaseFile): Result<SavedCase> {
  const after = recordCase(next, opened.raw);
  if (!after.ok) return after;
  if (readFileSync(opened.path, 'utf8') !== opened.textBefore) {
    return fail(locatedError('case-changed', opened.path, null, null, 'The case file was changed by someone else while this was being recorded; nothing was written. Run the command again.'));
  }
  const saved = saveCase(opened.folder, after.value.caseFile, opened.raw);
  if (!saved.ok) return saved;
  return ok({ casePath: saved.value, caseFile: after.value.caseFile, outcome: after.value.outcome });
}

/** The time of an entry, from the computer's clock at the edge; core receives it as a string. */
export function nowStamp(): string {
  return new Date().toISOString().replace(/\.\d{3}Z$/, 'Z');
}
