/**
 * Time cells: seconds (`754.3`), minutes (`12.57` under a `min` unit), `mm:ss(.s)`,
 * `h:mm:ss(.s)`, a time of day, or a full date-time (`2026-03-02T09:15:03`,
 * `2026-03-02 09:15:03`). Each parses to seconds; a time of day or date-time is later made
 * relative to the first row (read-table.ts).
 *
 * Example: parseClock('12:34.5') → 754.5; parseClock('1:02:03') → 3723.
 */
import { parseNumber, type DecimalMark } from './numbers';
import type { TimeFormat } from './types';

const COLON = /^(\d+):(\d{1,2})(?::(\d{1,2}))?(?:[.,](\d+))?$/;
const DATE_TIME = /^(\d{4})-(\d{2})-(\d{2})[T ](\d{1,2}):(\d{2})(?::(\d{2})(?:[.,](\d+))?)?$/;

/**
 * `m:ss`, `h:mm:ss`, with an optional `.s`/`,s` fraction, read without a regular expression
 * (the common case on every row of a large file); undefined for anything else.
 */
function quickClock(cell: string): number | undefined {
  const n = cell.length;
  let total = 0;
  let part = 0;
  let partDigits = 0;
  let parts = 1;
  let i = 0;
  for (; i < n; i++) {
    const c = cell.charCodeAt(i);
    if (c >= 48 && c <= 57) {
      part = part * 10 + (c - 48);
      partDigits++;
    } else if (c === 58) {
      if (partDigits === 0 || (parts > 1 && (partDigits > 2 || part > 59)) || parts === 3) return undefined;
      total = total * 60 + part;
      part = 0;
      partDigits = 0;
      parts++;
    } else if (c === 46 || c === 44) break;
    else return undefined;
  }
  if (parts < 2 || partDigits === 0 || partDigits > 2 || part > 59) return undefined;
  const whole = total * 60 + part;
  if (i === n) return whole;
  // One exact division, so `12:34.3` gives the same double as `754.3` would.
  let fraction = 0;
  let k = 0;
  for (let j = i + 1; j < n; j++) {
    const c = cell.charCodeAt(j);
    if (c < 48 || c > 57 || k >= 12) return undefined;
    fraction = fraction * 10 + (c - 48);
    k++;
  }
  if (k === 0) return undefined;
  return (whole * 10 ** k + fraction) / 10 ** k;
}

/** Seconds of `mm:ss`, `h:mm:ss`, with optional decimals; NaN when the cell is not in that form. */
export function parseClock(cell: string): number {
  const quick = quickClock(cell);
  if (quick !== undefined) return quick;
  const m = COLON.exec(cell.trim());
  if (!m) return Number.NaN;
  const fraction = m[4] ? Number(`0.${m[4]}`) : 0;
  if (m[3] !== undefined) {
    if (Number(m[2]) > 59 || Number(m[3]) > 59) return Number.NaN;
    return Number(m[1]) * 3600 + Number(m[2]) * 60 + Number(m[3]) + fraction;
  }
  if (Number(m[2]) > 59) return Number.NaN;
  return Number(m[1]) * 60 + Number(m[2]) + fraction;
}

export interface DateTimeCell {
  /** `YYYY-MM-DD`. */
  readonly date: string;
  /** Seconds since that day's midnight. */
  readonly secondOfDay: number;
}

export function parseDateTime(cell: string): DateTimeCell | null {
  const m = DATE_TIME.exec(cell.trim());
  if (!m) return null;
  const fraction = m[7] ? Number(`0.${m[7]}`) : 0;
  return {
    date: `${m[1]}-${m[2]}-${m[3]}`,
    secondOfDay: Number(m[4]) * 3600 + Number(m[5]) * 60 + Number(m[6] ?? 0) + fraction,
  };
}

/** The format of a time column, judged from its first readable cell and its unit. */
export function classifyTime(firstCell: string, unitLabel: string | null, clockName: boolean): TimeFormat | null {
  const s = firstCell.trim();
  if (parseDateTime(s)) return 'date-time';
  const m = COLON.exec(s);
  if (m) {
    const threeParts = m[3] !== undefined;
    // A recording that starts an hour or more "in" is a time of day, not time since start.
    if (clockName || (threeParts && parseClock(s) >= 3600)) return 'clock';
    return threeParts ? 'h:mm:ss' : 'mm:ss';
  }
  if (unitLabel === 'min') return 'minutes';
  if (clockName) return null;
  return 'seconds';
}

/** Seconds of one cell in the column's format; NaN when unreadable, null when empty. */
function isSpace(code: number): boolean {
  return code === 32 || code === 9 || code === 160;
}

export function parseTimeCell(cell: string, format: TimeFormat, decimal: DecimalMark): number | null {
  const n = cell.length;
  // Trim only when needed: this runs on every row of a large file.
  const s = n > 0 && !isSpace(cell.charCodeAt(0)) && !isSpace(cell.charCodeAt(n - 1)) ? cell : cell.trim();
  if (s === '') return null;
  switch (format) {
    case 'date-time': {
      const dt = parseDateTime(s);
      return dt ? dt.secondOfDay : Number.NaN;
    }
    case 'clock':
    case 'mm:ss':
    case 'h:mm:ss':
      return parseClock(s);
    case 'minutes':
    case 'seconds': {
      const n = parseNumber(s, decimal);
      if (n === null) return Number.NaN;
      return format === 'minutes' ? n * 60 : n;
    }
  }
}

/** `12:34` style text of a number of seconds, for messages. */
export function formatSeconds(timeS: number): string {
  const sign = timeS < 0 ? '-' : '';
  const a = Math.abs(timeS);
  const m = Math.floor(a / 60);
  const s = a - m * 60;
  return `${sign}${m}:${s < 10 ? '0' : ''}${s.toFixed(s % 1 === 0 ? 0 : 1)}`;
}
