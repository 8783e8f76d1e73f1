/**
 * Refuses a breath file whose data cannot be a real test, instead of analysing it with
 * confidence: time that does not advance (every breath within a minute), time that jumps
 * (a gap of more than 10 minutes between two breaths; a test is one continuous recording),
 * time that runs backwards on more than 20 % of the data rows, or a large share of breaths
 * with impossible values (negated gas volumes, a VO2 or VE of 1e300, HR, work or end-tidal
 * pressures outside physiology: more than 20 % of breaths flagged by plausibility.ts).
 * Below that share, more than 5 % of such breaths still leave the test analysed but its
 * effort verdict indeterminate (`impossibleShareNote`, used by the analysis), the reason
 * stated. The limits are common practice (ours, no published source): a resting phase, ramp
 * and recovery span several minutes; a gas exchange system samples every breath, a few
 * seconds apart; a one-in-five share of impossible rows is an export or unit fault, not
 * noise, and one in twenty is more than the occasional cough or sensor drop-out a clean
 * recording shows. Each refusal names the line.
 */
import type { Breath, BreathTable } from '../model/breath-table';
import { locatedError, type LocatedError } from '../model/errors';
import type { Settings } from '../model/settings';
import { plausibilityFlags } from './plausibility';
import { shortNumber } from '../locale/format-number';
import type { RowFlag } from './types';

export const MIN_SPAN_S = 60;
export const MAX_GAP_S = 600;
export const MAX_IMPLAUSIBLE_SHARE = 0.2;
/** Above this share (and up to MAX_IMPLAUSIBLE_SHARE) the test is analysed with its effort indeterminate. */
export const EFFORT_IMPLAUSIBLE_SHARE = 0.05;

/** Flags that mark a value no living subject gives (a Borg rating off its scale is a typing slip, not counted). */
function impossibleFlags(flags: readonly RowFlag[]): RowFlag[] {
  return flags.filter((f) => f.code.startsWith('implausible-') && f.code !== 'implausible-rpe');
}

export { shortNumber };

/** The source line of a breath when the table records one. */
function lineOf(b: Breath): number | null {
  return b.sourceLine > 0 ? b.sourceLine : null;
}

/** `timeColumn`: 1-based column of the time cells, when the import knows it. */
export function implausibleData(breaths: readonly Breath[], flags: readonly RowFlag[], file: string, timeColumn: number | null = null): LocatedError | null {
  const n = breaths.length;
  if (n >= 20) {
    const span = breaths[n - 1].timeS - breaths[0].timeS;
    if (!(span >= MIN_SPAN_S)) {
      return locatedError('time-not-advancing', file, lineOf(breaths[0]), timeColumn, `All ${n} breaths lie within ${shortNumber(span)} s of each other (from ${shortNumber(breaths[0].timeS)} s to ${shortNumber(breaths[n - 1].timeS)} s); a test lasts minutes, so the time column is wrong (a constant, or the wrong column). The file is not analysed.`);
    }
  }
  for (let i = 1; i < n; i++) {
    const gap = breaths[i].timeS - breaths[i - 1].timeS;
    if (gap > MAX_GAP_S) {
      return locatedError('time-jump', file, lineOf(breaths[i]), timeColumn, `Time jumps by ${shortNumber(gap)} s, from ${shortNumber(breaths[i - 1].timeS)} s to ${shortNumber(breaths[i].timeS)} s, at this breath; a test is one continuous recording, so the time cell or the file is wrong. The file is not analysed.`);
    }
  }
  const impossible = impossibleFlags(flags);
  const flagged = new Set(impossible.map((f) => f.line));
  if (n > 0 && flagged.size / n > MAX_IMPLAUSIBLE_SHARE) {
    const first = impossible[0];
    return locatedError('implausible-data', file, first?.line ?? null, first?.column ?? null, `${flagged.size} of ${n} breaths (${Math.round((100 * flagged.size) / n)} %, more than ${100 * MAX_IMPLAUSIBLE_SHARE} %) have values no living subject gives, the first here: ${first?.message ?? ''} The file is not analysed; check the units, the column map and the export.`);
  }
  return null;
}

/**
 * Rows the import set aside because their time runs backwards (code 'time-backwards', each
 * named in the import notes): more than MAX_IMPLAUSIBLE_SHARE of the data rows means the
 * time column is not the recording's order, so the file is refused at the first such row.
 */
export function backwardTime(rejected: readonly LocatedError[], usedRows: number, file: string): LocatedError | null {
  const back = rejected.filter((r) => r.code === 'time-backwards');
  const rows = usedRows + back.length;
  if (back.length === 0 || back.length / rows <= MAX_IMPLAUSIBLE_SHARE) return null;
  const first = back[0];
  return locatedError('time-not-increasing', file, first.line, first.column, `Time runs backwards on ${back.length} of ${rows} data rows (${Math.round((100 * back.length) / rows)} %, more than ${100 * MAX_IMPLAUSIBLE_SHARE} %), the first here; breaths must be in recording order, so the time column or the file is wrong. The file is not analysed.`);
}

/**
 * The reason a test below the refusal share cannot vouch for its effort: more than
 * EFFORT_IMPLAUSIBLE_SHARE of its breaths carry values outside physiology. Null otherwise.
 * Example: 43 of 430 breaths flagged → 'Effort not judged: 43 of 430 breaths (10 %, more
 * than 5 %) have values outside physiology, the first at line 19 …'.
 */
export function impossibleShareNote(breaths: readonly Breath[], settings: Settings, file: string): string | null {
  const impossible = impossibleFlags(plausibilityFlags(breaths, [], [], [], settings.import, file));
  const lines = new Set(impossible.map((f) => f.line));
  if (breaths.length === 0 || lines.size / breaths.length <= EFFORT_IMPLAUSIBLE_SHARE) return null;
  const first = impossible[0];
  const where = first.line !== null && first.line > 0 ? `, the first at line ${first.line} (${first.message.replace(/\.$/, '')})` : '';
  return `Effort not judged: ${lines.size} of ${breaths.length} breaths (${Math.round((100 * lines.size) / breaths.length)} %, more than ${100 * EFFORT_IMPLAUSIBLE_SHARE} %) have values outside physiology${where}; a recording with so many impossible values cannot show a maximal effort. Check the export, the units and the column map.`;
}

/**
 * Every refusal of this module for one import (its flags, columns and set-aside rows), so the
 * message names the column as well as the line; null when the file may be analysed.
 */
export function refuseImpossible(read: { readonly table: BreathTable; readonly flags: readonly RowFlag[]; readonly columns: readonly { readonly variable: string | null; readonly index: number }[]; readonly rejected: readonly LocatedError[] }, file: string): LocatedError | null {
  const timeColumn = read.columns.find((c) => c.variable === 'timeS')?.index ?? null;
  return implausibleData(read.table.breaths, read.flags, file, timeColumn) ?? backwardTime(read.rejected, read.table.breaths.length, file);
}

/** The same check on a table already read (the analysis side, where the import's flags are gone). */
export function implausibleTable(table: BreathTable, settings: Settings, file = table.sourceName): LocatedError | null {
  return implausibleData(table.breaths, plausibilityFlags(table.breaths, [], [], [], settings.import, file), file);
}
