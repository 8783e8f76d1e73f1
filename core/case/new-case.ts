/**
 * A new case from two raw breath files: each is named by its SHA-256 and stored in the case
 * folder as raw/<sha256>.<extension>, so the folder is self-contained and a copy can never be
 * confused with another file of the same name. Each file carries the column map it is read
 * with (null when detection alone reads it); the map is part of the case's anchor
 * (audit-log.ts), so it can be set only while the reviewer log holds only its opening entry.
 *
 * Example: a file "day1.csv" whose SHA-256 is ab12… is stored as "raw/ab12….csv".
 */
import type { ColumnMapping } from '../import/mapping';
import type { ClinicalInputs } from '../model/analysis';
import { fail, locatedError, ok, type Result } from '../model/errors';
import type { Settings } from '../model/settings';
import { CASE_FORMAT, CASE_VERSION, type CaseFile, type RawInput } from './case-file';
import { openingEntry, resealOpening, reviewerEntries } from './opening';
import { sha256Hex } from './sha256';

export interface RawFile {
  readonly name: string;
  readonly bytes: Uint8Array;
  /** The column map to read it with; absent or null: detection alone. */
  readonly columnMap?: ColumnMapping | null;
}

/** A bare file name: the last path segment, control characters replaced, at most 255 characters. */
export function bareName(name: string): string {
  const last = name.split(/[\\/]/).filter((p) => p !== '' && p !== '.' && p !== '..').pop() ?? 'breath-file';
  return last.replace(/[\u0000-\u001f]/g, '_').slice(0, 255);
}

export function rawInput(file: RawFile): RawInput {
  const sha256 = sha256Hex(file.bytes);
  const name = bareName(file.name);
  const ext = /\.([A-Za-z0-9]{1,8})$/.exec(file.name)?.[1].toLowerCase();
  return { name, sha256, sizeBytes: file.bytes.length, storedAs: `raw/${sha256}${ext ? `.${ext}` : ''}`, columnMap: file.columnMap ?? null };
}

export function newCase(createdAt: string, day1: RawFile, day2: RawFile, settings: Settings, clinical: { day1: ClinicalInputs; day2: ClinicalInputs }): CaseFile {
  const opened = {
    format: CASE_FORMAT,
    version: CASE_VERSION,
    createdAt,
    inputs: { day1: rawInput(day1), day2: rawInput(day2) },
    settings,
    clinical,
    recorded: null,
  };
  // The log starts with the opening entry, chained to these inputs (opening.ts).
  return { ...opened, log: [openingEntry(opened, false)] };
}

/**
 * The case with each day read by the column map given (null: detection alone). Refused once
 * the reviewer log has an entry: the log is chained to the inputs as they were read, and a
 * different map would give other numbers under the same reviewed history. Recorded results
 * are cleared, since they were computed with the old maps.
 */
export function withColumnMaps(caseFile: CaseFile, maps: { readonly day1: ColumnMapping | null; readonly day2: ColumnMapping | null }, file = 'case file'): Result<CaseFile> {
  if (reviewerEntries(caseFile.log).length > 0) {
    return fail(locatedError('column-map-after-review', file, null, null, 'The column maps of a case cannot change once its reviewer log has an entry: the review was made on the files as they were read. Start a new case to read them another way.'));
  }
  return ok(
    resealOpening({
      ...caseFile,
      inputs: { day1: { ...caseFile.inputs.day1, columnMap: maps.day1 }, day2: { ...caseFile.inputs.day2, columnMap: maps.day2 } },
      recorded: null,
    }),
  );
}
