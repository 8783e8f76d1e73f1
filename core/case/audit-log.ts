/**
 * The reviewer log as a hash chain. Each entry's hash is the SHA-256 of the canonical JSON
 * of its body (every field but `hash`), and each body carries the hash of the entry before.
 * The first entry points at the case's anchor: the hash of the inputs' SHA-256s (and the
 * column map a file is read with, when it has one), the settings and the clinical inputs,
 * so swapping a raw file, its column map or a setting also breaks the chain. Editing,
 * removing or reordering any entry changes a hash that a later entry (or the entry itself)
 * has recorded, and `verifyLog` names the first entry that fails.
 * The technique is the ordinary linked hash chain (Haber et al., J Cryptology 1991).
 */
import { canonicalJson } from './canonical-json';
import { sha256Hex } from './sha256';
import { columnMapOf, type AuditEntry, type AuditEntryBody, type CaseFile, type RawInput } from './case-file';
import type { ColumnMapping } from '../import/mapping';
import { fail, locatedError, ok, type LocatedError, type Result } from '../model/errors';

/** What the chain's first entry points at. */
export function anchorHash(caseFile: Pick<CaseFile, 'format' | 'version' | 'createdAt' | 'inputs' | 'settings' | 'clinical'>): string {
  const anchor = {
    format: caseFile.format,
    version: caseFile.version,
    createdAt: caseFile.createdAt,
    inputs: { day1: anchorOfInput(caseFile.inputs.day1), day2: anchorOfInput(caseFile.inputs.day2) },
    settings: caseFile.settings,
    clinical: caseFile.clinical,
  };
  const text = canonicalJson(anchor);
  // Settings and clinical inputs are validated finite numbers, so this cannot fail; keep a visible marker if it ever does.
  return sha256Hex(text.ok ? text.value : `unserialisable:${text.error.message}`);
}

/**
 * A raw input as the anchor covers it: name, SHA-256 and, when one is recorded, the column
 * map it is read with (a map changes the numbers as surely as the bytes do). A day with no
 * map, or a case file older than the field, adds nothing, so their anchors are unchanged.
 */
function anchorOfInput(input: RawInput): { name: string; sha256: string; columnMap?: ColumnMapping } {
  const columnMap = columnMapOf(input);
  return columnMap ? { name: input.name, sha256: input.sha256, columnMap } : { name: input.name, sha256: input.sha256 };
}

export function entryHash(body: AuditEntryBody): Result<string> {
  const { seq, at, who, role, action, reason, prevHash } = body;
  const text = canonicalJson({ seq, at, who, role, action, reason, prevHash });
  return text.ok ? ok(sha256Hex(text.value)) : text;
}

export type NewEntry = Omit<AuditEntryBody, 'seq' | 'prevHash'>;

/** The case with one more entry, chained to the last. Refuses an entry without who, role or reason. */
export function appendEntry(caseFile: CaseFile, entry: NewEntry, file = 'case file'): Result<CaseFile> {
  for (const [field, value] of [['reviewer name', entry.who], ['reviewer role', entry.role], ['reason', entry.reason]] as const) {
    if (value.trim() === '') {
      return fail(locatedError('review-field-missing', file, null, null, `Every reviewer action needs a ${field}; this one has none, so it was not recorded.`));
    }
  }
  const last = caseFile.log[caseFile.log.length - 1];
  const body: AuditEntryBody = {
    seq: last ? last.seq + 1 : 1,
    at: entry.at,
    who: entry.who,
    role: entry.role,
    action: entry.action,
    reason: entry.reason,
    prevHash: last ? last.hash : anchorHash(caseFile),
  };
  const hash = entryHash(body);
  if (!hash.ok) return hash;
  const sealed: AuditEntry = { ...body, hash: hash.value };
  return ok({ ...caseFile, log: [...caseFile.log, sealed] });
}

/**
 * Checks the whole chain. `lineOf(seq)` lets the caller point at the entry's line in the
 * file it read; without it the error has no line.
 */
export function verifyLog(caseFile: CaseFile, file = 'case file', lineOf: (seq: number) => number | null = () => null): Result<true> {
  let expectedPrev = anchorHash(caseFile);
  if (caseFile.log.length === 0) {
    return fail(locatedError('log-empty', file, null, null, 'The reviewer log is empty, but every case starts with an opening entry: entries have been removed, so the history cannot be trusted.'));
  }
  // Version 1 cases opened before opening entries existed start at entry 1 (core/case/opening.ts);
  // a version 2 case always starts with its opening entry, so one that does not was cut.
  if (caseFile.version !== 1 && caseFile.log[0].action.kind !== 'case-opened') {
    return fail(locatedError('log-order', file, lineOf(caseFile.log[0].seq), null, `The reviewer log's first entry is number ${caseFile.log[0].seq}, not the opening entry every version ${caseFile.version} case starts with: entries have been removed, so the history cannot be trusted.`));
  }
  const first = caseFile.log[0].action.kind === 'case-opened' ? 0 : 1;
  for (let i = 0; i < caseFile.log.length; i++) {
    const entry = caseFile.log[i];
    const where = (code: string, message: string): LocatedError => locatedError(code, file, lineOf(entry.seq), null, message);
    if (entry.seq !== i + first || (i > 0 && entry.action.kind === 'case-opened')) {
      return fail(where('log-order', `Reviewer log entry ${i + first} carries number ${entry.seq}${entry.action.kind === 'case-opened' && i > 0 ? ' and is an opening entry' : ''}: entries have been removed or reordered, so the history cannot be trusted.`));
    }
    if (entry.prevHash !== expectedPrev) {
      const what = i === 0 ? 'the raw files, column maps, settings or clinical inputs it was recorded against' : `entry ${i}`;
      return fail(where('log-chain-broken', `Reviewer log entry ${entry.seq} does not follow from ${what}: the history or the inputs were changed after the entry was recorded.`));
    }
    const hash = entryHash(entry);
    if (!hash.ok || hash.value !== entry.hash) {
      return fail(where('log-entry-altered', `Reviewer log entry ${entry.seq} (${entry.at}, ${entry.who}) was edited after it was recorded: its content no longer matches its hash.`));
    }
    expectedPrev = entry.hash;
  }
  return ok(true);
}
