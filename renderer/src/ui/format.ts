/**
 * Number formatting for the screens: a value always with its unit, a dash when absent, in
 * the workbench's locale (ui/locale.tsx, core/locale/). The App sets the locale before it
 * renders the screens, so every screen of one render uses the same one.
 */
import { formatDateTime, formatFixed, outOfRange } from '../../../core/locale/format-number';
import { localizeProse } from '../../../core/report/format';
import { localeByTag, type ReportLocale } from '../../../core/locale/locales';
import { minSec, signedMinSec } from '../../../core/locale/min-sec';

let current: ReportLocale = localeByTag('en-GB');

export function setDisplayLocale(tag: string): void {
  current = localeByTag(tag);
}

/** Plotly's `separators`: the decimal mark, then the thousands separator (a space for a no-break space). */
export function chartSeparators(): string {
  const thousands = current.thousands === '' ? (current.decimal === '.' ? ',' : '.') : current.thousands === '\u00a0' ? ' ' : current.thousands;
  return `${current.decimal}${thousands}`;
}

export function fmt(value: number | null | undefined, digits = 0, unit = ''): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  const text = formatFixed(value, digits, current);
  return unit ? `${text} ${unit}` : text;
}

export function signed(value: number | null | undefined, digits = 0, unit = ''): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  const beyond = outOfRange(value);
  if (beyond) return unit ? `${beyond} ${unit}` : beyond;
  return `${value > 0 ? '+' : value < 0 ? '−' : '±'}${fmt(Math.abs(value), digits, unit)}`;
}

/** Seconds as m:ss, by the one formatter the report and the CLI use (core/locale/min-sec.ts): 372 → '6:12'. */
export function clock(timeS: number | null | undefined): string {
  return minSec(timeS, '—');
}

/** A change of time as ±m:ss (core/locale/min-sec.ts): −287 → '−4:47'. */
export function signedClock(seconds: number | null | undefined): string {
  return signedMinSec(seconds, '—');
}

/**
 * A time the reviewer typed: m:ss (or h:mm:ss), or plain seconds. '6:12' → 372, '372' → 372,
 * '6:12.5' → 372.5; null when it is neither.
 */
export function parseClock(text: string): number | null {
  const t = text.trim().replace(',', '.');
  if (/^[0-9]+(\.[0-9]+)?$/.test(t)) return Number(t);
  const m = /^(?:([0-9]+):)?([0-9]+):([0-5][0-9](?:\.[0-9]+)?)$/.exec(t);
  if (!m) return null;
  return Number(m[1] ?? 0) * 3600 + Number(m[2]) * 60 + Number(m[3]);
}

/** An ISO 8601 date-time in the workbench's locale. */
export function when(iso: string | null | undefined): string {
  return iso ? formatDateTime(iso, current) : '—';
}

/** An English sentence made by core (the summary) with its decimal numbers in the workbench's locale. */
export function prose(text: string): string {
  return localizeProse(text, current);
}

