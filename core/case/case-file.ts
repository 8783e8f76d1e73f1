/**
 * The case file: everything needed to reproduce one two-day comparison and its review.
 * Format `twofold-case`, version 2 (version 1 still read), documented in docs/case-file.md. It holds the two raw
 * breath files by SHA-256 (their copies sit beside it in the case folder) with the column
 * map each is read with, the settings, the clinical inputs, the numbers recorded when it
 * was last saved, and the reviewer log: an append-only, hash-chained list of
 * actions. Times are ISO 8601 strings passed in by the shell; core/ has no clock.
 */
import type { ColumnMapping } from '../import/mapping';
import type { ClinicalInputs, ThresholdId } from '../model/analysis';
import type { Settings } from '../model/settings';
import type { FollowUpAction } from '../followup/actions';

export const CASE_FORMAT = 'twofold-case' as const;
/**
 * The version this Twofold writes. Version 2 cases always start with their opening entry
 * (opening.ts), so an empty log in one is refused; version 1 (written before version 2, with or
 * without an opening entry) is still read and keeps its version, since the version is part
 * of the anchor its log is chained to.
 */
export const CASE_VERSION = 2 as const;
/** Every version this Twofold reads. */
export const CASE_VERSIONS_READ = [1, 2] as const;
export type CaseVersion = (typeof CASE_VERSIONS_READ)[number];

export type DayNumber = 1 | 2;

/** One raw breath file, as the lab exported it. */
export interface RawInput {
  /** File name as the user gave it (no folder). */
  readonly name: string;
  readonly sha256: string;
  readonly sizeBytes: number;
  /** Path of the copy inside the case folder, relative to the case file. */
  readonly storedAs: string;
  /**
   * The column map (core/import/mapping.ts) the file is read with, so every recompute reads
   * it the same way; null when detection alone reads it. Absent in case files written before
   * the field existed, which reads as null (`columnMapOf`).
   */
  readonly columnMap?: ColumnMapping | null;
}

/** The column map a raw input is read with: the recorded one, or none. */
export function columnMapOf(input: RawInput): ColumnMapping | null {
  return input.columnMap ?? null;
}

/** A threshold position: the time on the recording and the VO2 there. */
export interface ThresholdPoint {
  readonly timeS: number;
  readonly vo2MlMin: number;
}

export type ReviewAction =
  | {
      readonly kind: 'set-threshold';
      readonly day: DayNumber;
      readonly threshold: ThresholdId;
      /** How the reviewer gave the new position; a VO2 is mapped to a time on the ramp. */
      readonly givenAs: 'time' | 'vo2';
      /** The effective position before this action (automatic or an earlier override); null when there was none. */
      readonly before: ThresholdPoint | null;
      readonly after: ThresholdPoint;
    }
  | {
      readonly kind: 'withdraw';
      /** `seq` of the set-threshold entry withdrawn. */
      readonly withdraws: number;
      readonly day: DayNumber;
      readonly threshold: ThresholdId;
      readonly before: ThresholdPoint | null;
      readonly after: ThresholdPoint | null;
    }
  | {
      /** The opening entry, number 0, chained to the inputs (opening.ts); `migrated` when added to an older case file on reading it. */
      readonly kind: 'case-opened';
      readonly migrated: boolean;
    }
  | {
      readonly kind: 'sign-off';
      /** The statement the reviewer signs, e.g. "Reviewed; thresholds accepted as shown." */
      readonly statement: string;
    }
  // Follow-up reports after each test (core/followup/), chained like every reviewer action.
  | FollowUpAction;

/** The fields of a log entry that its hash covers, everything but `hash` itself. */
export interface AuditEntryBody {
  /** Position in the log: 0 for the opening entry, reviewer entries from 1. */
  readonly seq: number;
  /** ISO 8601 date-time, given by the shell. */
  readonly at: string;
  readonly who: string;
  readonly role: string;
  readonly action: ReviewAction;
  /** Required: why the reviewer did this. */
  readonly reason: string;
  /** Hash of the entry before, or of the case's anchor for the first entry. */
  readonly prevHash: string;
}

export interface AuditEntry extends AuditEntryBody {
  /** SHA-256 of the canonical JSON of the body. */
  readonly hash: string;
}

/** Numbers recorded at save time, flattened to dotted paths, and a digest of the whole result. */
export interface RecordedResults {
  readonly softwareVersion: string;
  /** SHA-256 of the canonical JSON of the full recomputed result. */
  readonly digest: string;
  readonly numbers: Readonly<Record<string, number | string | boolean | null>>;
}

export interface CaseFile {
  readonly format: typeof CASE_FORMAT;
  readonly version: CaseVersion;
  /** ISO 8601 date-time the case was opened, given by the shell. */
  readonly createdAt: string;
  readonly inputs: { readonly day1: RawInput; readonly day2: RawInput };
  readonly settings: Settings;
  readonly clinical: { readonly day1: ClinicalInputs; readonly day2: ClinicalInputs };
  readonly log: readonly AuditEntry[];
  readonly recorded: RecordedResults | null;
  /**
   * The locale (core/locale/locales.ts, e.g. `de-DE`) the report writes its numbers and dates
   * in, and `twofold verify` reads them back in. Presentation only: no number depends on it.
   * Absent in case files written before it existed, which read as the neutral `en`.
   */
  readonly reportLocale?: string;
}
