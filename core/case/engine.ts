/**
 * The analysis steps the case needs, passed in as functions so that the case logic depends
 * on a contract rather than on particular modules (the shells pass `defaultEngine`).
 */
import type { ColumnMapping } from '../import/mapping';
import type { ClinicalInputs, TestAnalysis, ValuesAt } from '../model/analysis';
import type { BreathTable } from '../model/breath-table';
import type { Result } from '../model/errors';
import type { Settings } from '../model/settings';

export interface Engine<C> {
  /** Reads one raw breath file (bytes as stored in the case folder) with the column map the case records for it. */
  readonly readTable: (name: string, bytes: Uint8Array, settings: Settings, columnMap: ColumnMapping | null) => Result<BreathTable>;
  readonly analyzeTest: (table: BreathTable, settings: Settings, clinical: ClinicalInputs) => Result<TestAnalysis>;
  /** Every value read off the processed series at `timeS`. */
  readonly valuesAt: (analysis: TestAnalysis, timeS: number) => ValuesAt;
  readonly compareTests: (day1: TestAnalysis, day2: TestAnalysis, settings: Settings) => C;
  /**
   * SHA-256 (hex) of a raw file's bytes, checked against the case's record before each
   * recompute. Optional: without it the bytes are hashed every time (core/case/sha256.ts). A
   * shell that holds the bytes in memory and never changes them may remember the digest.
   */
  readonly rawDigest?: (bytes: Uint8Array) => string;
}
