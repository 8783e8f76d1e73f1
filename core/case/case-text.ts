/**
 * The case file to and from text. Saving writes indented JSON with one key per line (so a
 * located error can point at a line, and a diff reads well); loading parses, checks the
 * format and version, validates with the zod schema, migrates a version 1 case file older
 * than opening entries (an empty log gets one, marked migrated; opening.ts), refuses an empty
 * log in a version 2 case (which always starts with its opening entry), and checks the
 * reviewer log's hash chain. Anything wrong comes back as a located error, never as an exception.
 */
import { fail, locatedError, ok, type Result } from '../model/errors';
import { verifyLog } from './audit-log';
import { CASE_FORMAT, CASE_VERSION, CASE_VERSIONS_READ, type CaseFile } from './case-file';
import { caseSchema } from './case-schema';
import { openingEntry } from './opening';

export function caseToText(caseFile: CaseFile): string {
  return `${JSON.stringify(caseFile, null, 2)}\n`;
}

export function caseFromText(text: string, file: string): Result<CaseFile> {
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch (error) {
    const message = error instanceof Error ? error.message : '';
    const lc = /line (\d+) column (\d+)/.exec(message);
    const position = /position (\d+)/.exec(message);
    // Without a position the text ended early: the place is its end.
    const { line, column } = lc ? { line: Number(lc[1]), column: Number(lc[2]) } : lineColumn(text, position ? Number(position[1]) : text.length);
    return fail(locatedError('case-not-json', file, line, column, `This case file is not valid JSON (${message.replace(/\s*\(line \d+ column \d+\)/, '')}); it may be damaged or not a Twofold case file.`));
  }
  const head = data as { format?: unknown; version?: unknown } | null;
  if (!head || typeof head !== 'object' || head.format !== CASE_FORMAT) {
    return fail(locatedError('case-wrong-format', file, 1, 1, `This is not a Twofold case file (expected "format": "${CASE_FORMAT}").`));
  }
  if (!(CASE_VERSIONS_READ as readonly unknown[]).includes(head.version)) {
    return fail(locatedError('case-version', file, lineOfKey(text, 'version', 0), null, `This case file is version ${String(head.version)}; this Twofold reads versions ${CASE_VERSIONS_READ.join(' and ')} (it writes version ${CASE_VERSION}).`));
  }
  const parsed = caseSchema.safeParse(data);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    const path = issue.path.map(String).join('.');
    const place = placeOfPath(text, issue.path);
    return fail(locatedError('case-invalid', file, place?.line ?? null, place?.column ?? null, `The case file's field ${path || '(top level)'} is not valid: ${issue.message}.`));
  }
  const read = parsed.data as CaseFile;
  // A version 1 case file from before opening entries, with an empty log, is migrated
  // (opening.ts); a version 2 case always has its opening entry, so an empty log there was cut.
  if (read.log.length === 0 && read.version !== 1) {
    return fail(locatedError('log-empty', file, lineOfKey(text, 'log', 0), null, `The reviewer log is empty, but a version ${read.version} case always starts with its opening entry: entries have been removed, so the history cannot be trusted.`));
  }
  const caseFile = read.log.length === 0 ? { ...read, log: [openingEntry(read, true)] } : read;
  const chain = verifyLog(caseFile, file, (seq) => lineOfEntry(text, seq));
  if (!chain.ok) return chain;
  return ok(caseFile);
}

function lineColumn(text: string, offset: number): { line: number; column: number } {
  const before = text.slice(0, offset);
  const line = before.split('\n').length;
  return { line, column: offset - before.lastIndexOf('\n') };
}

/** 1-based line of the first `"key":` at or after `from`, or null. */
function lineOfKey(text: string, key: string, from: number): number | null {
  const i = text.indexOf(`"${key}":`, from);
  return i < 0 ? null : lineColumn(text, i).line;
}

/**
 * Line and column (1-based) of the key a schema issue names, found by following its path
 * key by key through the text (each key searched after the one before; array indices are
 * stepped over), so `inputs.day2.name` points at day 2's name, not day 1's. Null when the
 * path has no key (an issue with the whole file) or a key is not in the text.
 */
function placeOfPath(text: string, path: readonly PropertyKey[]): { line: number; column: number } | null {
  let at = 0;
  let found = -1;
  for (const key of path) {
    if (typeof key !== 'string') continue;
    found = text.indexOf(`"${key}":`, at);
    if (found < 0) return null;
    at = found + key.length + 3;
  }
  return found < 0 ? null : lineColumn(text, found);
}

/** Line of the log entry numbered `seq`, as `caseToText` lays it out. */
function lineOfEntry(text: string, seq: number): number | null {
  const logAt = text.indexOf('"log":');
  if (logAt < 0) return null;
  const match = new RegExp(`"seq":\\s*${seq}\\b`).exec(text.slice(logAt));
  return match ? lineColumn(text, logAt + match.index).line : null;
}
