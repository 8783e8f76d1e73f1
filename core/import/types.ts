/**
 * What an import returns besides the breath table: how each column was read, the rows that
 * could not be used (each with its place and reason), per-row flags, and warnings.
 * Nothing read from the file disappears without a line here.
 */
import { BREATH_VARIABLES, type BreathTable, type BreathVariable } from '../model/breath-table';
import type { LocatedError } from '../model/errors';
import type { Settings } from '../model/settings';
import type { ColumnMapping } from './mapping';
import type { LanguageCode } from './header-words/types';

/**
 * What a column can carry: a breath variable, or one of three extras an import understands
 * (VO2 per kg of body weight, the cart's own RER, a sparse Borg RPE column).
 */
export type ColumnVariable = BreathVariable | 'vo2MlKgMin' | 'rer' | 'rpe';

export const COLUMN_VARIABLES: readonly ColumnVariable[] = [...BREATH_VARIABLES, 'vo2MlKgMin', 'rer', 'rpe'];

/** How one column of the file was read. */
export interface ColumnReport {
  /** 1-based cell index in the header row. */
  readonly index: number;
  /** The header cell as written in the file. */
  readonly header: string;
  /** The variable the column feeds, or null when it was ignored. */
  readonly variable: ColumnVariable | null;
  /** The unit the values were read in (e.g. `L/min`, `mm:ss`), null for unitless or ignored columns. */
  readonly unit: string | null;
  /** True when the file gave no unit and it was inferred (see warnings). */
  readonly unitInferred: boolean;
  /** Why the column was ignored or how it was chosen, in a short sentence. */
  readonly note: string | null;
}

export type TimeFormat = 'seconds' | 'minutes' | 'mm:ss' | 'h:mm:ss' | 'clock' | 'date-time';

/** How the file was laid out, as detected (or as the mapping said). */
export interface FileLayout {
  readonly kind: 'text' | 'workbook';
  readonly encoding: string;
  /** Cell delimiter of a text file, null for a workbook. */
  readonly delimiter: ',' | ';' | '\t' | null;
  readonly decimal: '.' | ',';
  /** 1-based line (or worksheet row) of the header. */
  readonly headerLine: number;
  /** 1-based line of the units row under the header, null when there is none. */
  readonly unitsLine: number | null;
  readonly sheet: string | null;
  readonly timeFormat: TimeFormat;
  /**
   * The languages whose header words the header row is written in (core/import/header-words/),
   * several when their words tie; empty when it names only trade abbreviations (VO2, VCO2...).
   */
  readonly languages: readonly LanguageCode[];
}

/** A value on a usable row that deserves a second look (implausible, disagreeing RER, unreadable optional cell). */
export interface RowFlag extends LocatedError {
  readonly timeS: number;
  readonly variable: ColumnVariable;
  /** The value as read, in canonical units; null when the cell could not be read. */
  readonly value: number | null;
}

/** A line of the metadata block that was kept as free text (not a `key: value` pair). */
export interface PreambleLine {
  readonly line: number;
  readonly text: string;
}

export interface ImportResult {
  readonly table: BreathTable;
  readonly layout: FileLayout;
  readonly columns: readonly ColumnReport[];
  /** Rows that gave no breath, each with line, column and reason. */
  readonly rejected: readonly LocatedError[];
  readonly flags: readonly RowFlag[];
  /** File-level remarks: inferred units, ignored duplicates, unreadable metadata. */
  readonly warnings: readonly LocatedError[];
  readonly preamble: readonly PreambleLine[];
  /** Total rows under the header (breaths + RPE-only rows + rejected), blank lines excluded. */
  readonly dataRows: number;
}

export interface ImportOptions {
  /** The file name as the user gave it; every located error names it. */
  readonly sourceName: string;
  readonly settings?: Settings;
  /** A column map that overrides detection (see mapping.ts). */
  readonly mapping?: ColumnMapping | null;
  /** Worksheet of a workbook to read; the first one when absent. */
  readonly sheet?: string | null;
  /** From this many breaths on the table is kept in columns (core/import/breath-store.ts); tests set it low. */
  readonly compactFromBreaths?: number;
}
