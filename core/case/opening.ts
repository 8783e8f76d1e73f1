/**
 * The opening entry: every case's reviewer log starts with one entry, number 0, written by
 * Twofold when the case is opened, whose `prevHash` is the anchor (the raw files' SHA-256,
 * their column maps, the settings and the clinical inputs, audit-log.ts). So the log is
 * never empty, and swapping a raw file, a setting or a clinical input of a case nobody has
 * reviewed yet breaks the chain just as it does for a reviewed one. Reviewer entries are
 * numbered from 1 after it, as before.
 *
 * Case files written before opening entries existed (version 1) are migrated when they are
 * read (case-text.ts): an empty log gets an opening entry marked `migrated: true` (which the
 * report's log and `twofold override --list` show), and a log that already has entries is
 * kept as it is, since its first entry already chains the inputs. Cases are now written as
 * version 2, which always starts with its opening entry: an empty log there, or one whose
 * first entry is not the opening, is refused. A version 1 case emptied by hand still reads
 * as an old one (marked migrated); what catches that is a later head (a report's build
 * record, core/report/build-record.ts).
 */
import { anchorHash, entryHash } from './audit-log';
import type { AuditEntry, AuditEntryBody, CaseFile } from './case-file';

export const OPENING_WHO = 'Twofold';
export const OPENING_ROLE = 'software, on opening the case';
export const OPENING_REASON = 'Case opened on these two raw files, their column maps, the settings and the clinical inputs; every later entry is chained to this one.';

export function isOpening(entry: AuditEntry | undefined): boolean {
  return entry?.action.kind === 'case-opened';
}

/** The entries a reviewer made: the log without its opening entry. */
export function reviewerEntries(log: readonly AuditEntry[]): readonly AuditEntry[] {
  return isOpening(log[0]) ? log.slice(1) : log;
}

/** The opening entry for a case as it stands (its anchor), at the case's creation time. */
export function openingEntry(caseFile: Omit<CaseFile, 'log'>, migrated: boolean): AuditEntry {
  const body: AuditEntryBody = {
    seq: 0,
    at: caseFile.createdAt,
    who: OPENING_WHO,
    role: OPENING_ROLE,
    action: { kind: 'case-opened', migrated },
    reason: OPENING_REASON,
    prevHash: anchorHash(caseFile),
  };
  const hash = entryHash(body);
  // The body is strings and finite numbers, so canonical JSON cannot fail; mark it if it ever does.
  return { ...body, hash: hash.ok ? hash.value : '0'.repeat(64) };
}

/**
 * The case with its opening entry made again for its current inputs, allowed only while no
 * reviewer has made an entry (column maps and clinical inputs can change until then).
 */
export function resealOpening(caseFile: CaseFile): CaseFile {
  if (reviewerEntries(caseFile.log).length > 0) return caseFile;
  const migrated = caseFile.log[0]?.action.kind === 'case-opened' ? caseFile.log[0].action.migrated : false;
  return { ...caseFile, log: [openingEntry(caseFile, migrated)] };
}
