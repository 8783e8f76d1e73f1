/**
 * The build record: a small JSON file embedded in every report beside the case file, with
 * what the report was built with that the case file does not hold (the build time, the
 * reviewer named on it, the kind of signature) and the head of the reviewer log it shows
 * (entry count and last entry's hash). `twofold verify` rebuilds the pages from the case
 * file, the raw files and this record, and compares them with the pages received; a case
 * folder whose log is shorter than, or does not continue, a report's head was cut short.
 *
 * Example: {"format":"twofold-build","version":1,"generatedAt":"2026-03-11T10:00:00Z",
 * "reviewer":"T. Tester","signature":"lab","softwareVersion":"0.1.0",
 * "logHead":{"entries":3,"lastHash":"ab12…"}}
 */
import { z } from 'zod';
import type { CaseFile } from '../case/case-file';
import { fail, locatedError, ok, type Result } from '../model/errors';

export const BUILD_RECORD_NAME = 'twofold-build.json';

export interface LogHead {
  readonly entries: number;
  /** Hash of the last entry; null for an empty log. */
  readonly lastHash: string | null;
}

export interface BuildRecord {
  readonly format: 'twofold-build';
  readonly version: 1;
  readonly generatedAt: string;
  readonly reviewer: string | null;
  readonly signature: 'lab' | 'demonstration' | 'unsigned';
  readonly softwareVersion: string;
  readonly logHead: LogHead;
}

const schema = z.strictObject({
  format: z.literal('twofold-build'),
  version: z.literal(1),
  generatedAt: z.string().min(1).max(64),
  reviewer: z.string().max(500).nullable(),
  signature: z.enum(['lab', 'demonstration', 'unsigned']),
  softwareVersion: z.string().max(64),
  logHead: z.strictObject({ entries: z.number().int().nonnegative(), lastHash: z.string().regex(/^[0-9a-f]{64}$/).nullable() }),
});

export function logHeadOf(caseFile: Pick<CaseFile, 'log'>): LogHead {
  const last = caseFile.log[caseFile.log.length - 1];
  return { entries: caseFile.log.length, lastHash: last ? last.hash : null };
}

export function buildRecordText(record: BuildRecord): string {
  return `${JSON.stringify(record, null, 2)}\n`;
}

export function parseBuildRecord(text: string, file: string): Result<BuildRecord> {
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch {
    return fail(locatedError('build-record-json', file, null, null, 'The build record is not valid JSON.'));
  }
  const parsed = schema.safeParse(data);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    return fail(locatedError('build-record-invalid', file, null, null, `The build record's field ${issue.path.join('.') || '(top level)'} is not valid: ${issue.message}.`));
  }
  return ok(parsed.data);
}

/**
 * Whether a case's log continues a head a report recorded: at least as many entries, and the
 * entry at the head's position has the head's hash. Null when it does; a sentence when not.
 */
export function logShortenedFrom(caseFile: Pick<CaseFile, 'log'>, head: LogHead): string | null {
  if (caseFile.log.length < head.entries) {
    return `The case's reviewer log has ${caseFile.log.length} ${caseFile.log.length === 1 ? 'entry' : 'entries'}, but a report made from it recorded ${head.entries}: entries were removed after that report was made.`;
  }
  if (head.entries > 0 && caseFile.log[head.entries - 1].hash !== head.lastHash) {
    return `The case's reviewer log entry ${head.entries} is not the one a report made from it recorded (hash ${String(head.lastHash).slice(0, 12)}…): the history was rewritten after that report was made.`;
  }
  return null;
}
