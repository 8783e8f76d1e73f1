/**
 * Number formatting for the screens: a value always with its unit, a dash when absent, in
 * the workbench's locale (ui/locale.tsx, core/locale/). The App sets the locale before it
 * renders the screens, so every screen of one render uses the same one.
 */
import { formatDateTime, formatFixed } from '../../../core/locale/format-number';
import { localizeProse } from '../../../core/report/format';
import { localeByTag, type ReportLocale } from '../../../core/locale/locales';

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
  return `${value > 0 ? '+' : value < 0 ? '−' : '±'}${fmt(Math.abs(value), digits, unit)}`;
}

/** Seconds as m:ss, with the seconds figure beside it. */
export function clock(timeS: number | null | undefined): string {
  if (timeS === null || timeS === undefined || !Number.isFinite(timeS)) return '—';
  const m = Math.floor(timeS / 60);
  const s = Math.round(timeS - m * 60);
  return `${m}:${String(s).padStart(2, '0')} (${Math.round(timeS)} s)`;
}

/** An ISO 8601 date-time in the workbench's locale. */
export function when(iso: string | null | undefined): string {
  return iso ? formatDateTime(iso, current) : '—';
}

/** An English sentence made by core (the summary) with its decimal numbers in the workbench's locale. */
export function prose(text: string): string {
  return localizeProse(text, current);
}

