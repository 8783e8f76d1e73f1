/**
 * The case folder on disk: `twofold-case.json` and `raw/<sha256>.<ext>`, the copies of the
 * two breath files. Raw copies are never overwritten: storing a file whose name is taken by
 * different bytes is refused. The case file is replaced atomically. Loading validates the
 * case (schema and hash chain) and checks each raw copy against its recorded SHA-256.
 */
import { chmodSync, existsSync, mkdirSync, readdirSync, readFileSync, statSync, unlinkSync } from 'node:fs';
import { readProblem } from './read-problem';
import { dirname, join } from 'node:path';
import type { CaseFile, RawInput } from '../core/case/case-file';
import { caseFromText, caseToText } from '../core/case/case-text';
import type { RawBytes } from '../core/case/recompute';
import { sha256Hex } from '../core/case/sha256';
import { fail, locatedError, ok, type LocatedError, type Result } from '../core/model/errors';
import { writeFileAtomic } from './atomic-write';

export const CASE_FILE_NAME = 'twofold-case.json';

export function caseFilePath(folder: string): string {
  return join(folder, CASE_FILE_NAME);
}

/** Copies one raw file into the case folder under its hash; a matching copy already there is kept. */
export function storeRaw(folder: string, input: RawInput, bytes: Uint8Array): Result<string> {
  const target = join(folder, input.storedAs);
  if (sha256Hex(bytes) !== input.sha256) {
    return fail(locatedError('raw-hash-mismatch', input.name, null, null, `The bytes of ${input.name} do not match the SHA-256 the case records for it.`));
  }
  if (existsSync(target)) {
    const existing = readFileSync(target);
    if (sha256Hex(existing) === input.sha256) return ok(target);
    return fail(locatedError('raw-exists-different', target, null, null, `The case folder already holds a different file at ${input.storedAs}; raw files are never replaced, so nothing was written.`));
  }
  privateFolder(dirname(target));
  writeFileAtomic(target, bytes);
  return ok(target);
}

/**
 * Makes `folder` (and any missing parent) readable by this user only, 0700. A folder that
 * already exists with wider bits (made by an older version, or by hand) is narrowed to 0700,
 * as far as the file system lets this user change it.
 */
export function privateFolder(folder: string): void {
  mkdirSync(folder, { recursive: true, mode: 0o700 });
  try {
    if ((statSync(folder).mode & 0o777) !== 0o700) chmodSync(folder, 0o700);
  } catch {
    // Not this user's folder, or a file system without POSIX bits: the files are still 0600.
  }
}

export function saveCase(folder: string, caseFile: CaseFile, raw: RawBytes): Result<string> {
  // Case folders 0700 and files 0600 (writeFileAtomic): clinical data, readable by this user only.
  privateFolder(folder);
  const cut = logOnDiskNotContinued(caseFilePath(folder), caseFile);
  if (cut) return fail(cut);
  for (const [input, bytes] of [[caseFile.inputs.day1, raw.day1], [caseFile.inputs.day2, raw.day2]] as const) {
    const stored = storeRaw(folder, input, bytes);
    if (!stored.ok) return stored;
  }
  const path = caseFilePath(folder);
  writeFileAtomic(path, caseToText(caseFile));
  return ok(path);
}

/**
 * Compare-and-swap on the reviewer log: the log to save must hold every entry of the log on
 * disk, in order, with the same hashes. A save that would drop or replace one (a writer that
 * read the case before another recorded an entry, or a log cut short) is refused.
 */
function logOnDiskNotContinued(path: string, caseFile: CaseFile): LocatedError | null {
  let onDisk: { log?: { hash?: unknown }[] };
  try {
    onDisk = JSON.parse(readFileSync(path, 'utf8')) as typeof onDisk;
  } catch {
    return null; // No case file yet (or an unreadable one, which loading reports).
  }
  const disk = Array.isArray(onDisk?.log) ? onDisk.log : [];
  // An opening entry alone may be made again (new column maps or clinical inputs before any review; core/case/opening.ts).
  const resealed = disk.length === 1 && (disk[0] as { action?: { kind?: unknown } })?.action?.kind === 'case-opened' && caseFile.log[0]?.action.kind === 'case-opened';
  const kept = resealed || disk.every((e, i) => caseFile.log[i]?.hash === e?.hash);
  if (kept) return null;
  return locatedError('case-log-not-continued', path, null, null, `The case file on disk has ${disk.length} reviewer-log entries that this save does not keep (another writer recorded an entry since this case was read, or the log would be cut short); nothing was written. Run the action again.`);
}

/**
 * Temporary files of saves that were killed before their rename (writeFileAtomic names them
 * `.NAME.PID.HEX.tmp`): removed when their process is gone, so they do not pile up.
 */
function removeStaleTemporaries(folder: string): void {
  let names: string[];
  try {
    names = readdirSync(folder);
  } catch {
    return;
  }
  for (const name of names) {
    const m = /^\..+\.(\d+)\.[0-9a-f]{12}\.tmp$/.exec(name);
    if (!m || alive(Number(m[1]))) continue;
    try {
      unlinkSync(join(folder, name));
    } catch {
      // Removed meanwhile, or not ours to remove; harmless.
    }
  }
}

function alive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (error) {
    return (error as NodeJS.ErrnoException).code === 'EPERM';
  }
}

export interface LoadedCase {
  readonly path: string;
  readonly caseFile: CaseFile;
  readonly raw: RawBytes;
}

/** Loads `twofold-case.json` from a folder (or a case file path) with its raw copies. */
export function loadCase(folderOrFile: string): Result<LoadedCase> {
  const path = folderOrFile.endsWith('.json') ? folderOrFile : caseFilePath(folderOrFile);
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (error) {
    return fail(locatedError('case-unreadable', path, null, null, readProblem(error, 'case file')));
  }
  const parsed = caseFromText(text, path);
  if (!parsed.ok) return parsed;
  const folder = dirname(path);
  removeStaleTemporaries(folder);
  removeStaleTemporaries(join(folder, 'raw'));
  // The workbench exports reports into the case folder's reports/ with the same atomic write.
  removeStaleTemporaries(join(folder, 'reports'));
  const read = (input: RawInput): Result<Uint8Array> => {
    const rawPath = join(folder, input.storedAs);
    let bytes: Uint8Array;
    try {
      bytes = readFileSync(rawPath);
    } catch (error) {
      const missing = (error as NodeJS.ErrnoException).code === 'ENOENT';
      return fail(locatedError(missing ? 'raw-missing' : 'raw-unreadable', rawPath, null, null, missing ? `The copy of ${input.name} is missing from the case folder.` : `The copy of ${input.name} in the case folder cannot be read (${readProblem(error, 'raw copy')})`));
    }
    if (sha256Hex(bytes) !== input.sha256) {
      return fail(locatedError('raw-changed', rawPath, null, null, `The copy of ${input.name} in the case folder was changed: its SHA-256 no longer matches the case.`));
    }
    return ok(bytes);
  };
  const day1 = read(parsed.value.inputs.day1);
  if (!day1.ok) return day1;
  const day2 = read(parsed.value.inputs.day2);
  if (!day2.ok) return day2;
  return ok({ path, caseFile: parsed.value, raw: { day1: day1.value, day2: day2.value } });
}
