/**
 * Refuses a breath file whose data cannot be a real test, instead of analysing it with
 * confidence: time that does not advance (every breath within a minute), time that jumps
 * (a gap of more than 10 minutes between two breaths; a test is one continuous recording),
 * or a large share of breaths with impossible values (negated gas volumes, a VO2 of 1e300,
 * HR out of range: more than 20 % of breaths flagged by plausibility.ts). The limits are
 * common practice (ours): a resting phase, ramp and recovery span several minutes, and a
 * gas exchange system samples every breath, a few seconds apart. Each refusal names the line.
 */
import type { Breath, BreathTable } from '../model/breath-table';
import { locatedError, type LocatedError } from '../model/errors';
import type { Settings } from '../model/settings';
import { plausibilityFlags } from './plausibility';
import type { RowFlag } from './types';

export const MIN_SPAN_S = 60;
export const MAX_GAP_S = 600;
export const MAX_IMPLAUSIBLE_SHARE = 0.2;

/** A number for a message: at most 4 significant digits, whatever its size. */
export function shortNumber(x: number): string {
  if (!Number.isFinite(x)) return String(x);
  const a = Math.abs(x);
  return a !== 0 && (a >= 1e6 || a < 1e-3) ? x.toExponential(2) : String(Number(x.toPrecision(4)));
}

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
  const flagged = new Set(flags.filter((f) => f.code.startsWith('implausible-') && f.code !== 'implausible-rpe').map((f) => f.line));
  if (n > 0 && flagged.size / n > MAX_IMPLAUSIBLE_SHARE) {
    const first = flags.find((f) => f.code.startsWith('implausible-') && f.code !== 'implausible-rpe');
    return locatedError('implausible-data', file, first?.line ?? null, first?.column ?? null, `${flagged.size} of ${n} breaths (${Math.round((100 * flagged.size) / n)} %, more than ${100 * MAX_IMPLAUSIBLE_SHARE} %) have values no living subject gives, the first here: ${first?.message ?? ''} The file is not analysed; check the units, the column map and the export.`);
  }
  return null;
}

/** The same check on a table already read (the analysis side, where the import's flags are gone). */
export function implausibleTable(table: BreathTable, settings: Settings, file = table.sourceName): LocatedError | null {
  return implausibleData(table.breaths, plausibilityFlags(table.breaths, [], [], [], settings.import, file), file);
}
