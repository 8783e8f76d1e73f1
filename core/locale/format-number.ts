/**
 * Numbers and dates written in a locale (locales.ts): fixed decimals with the locale's
 * decimal mark and thousands separator, a minus sign (U+2212) rather than a hyphen, a dash
 * for a missing value, and ISO 8601 date-times rewritten in the locale's date order with a
 * 24-hour clock and the zone kept (`UTC`, or the offset).
 *
 * Example: formatFixed(12345.678, 1, de-DE) → '12.345,7'; formatFixed(-0.5, 2, fr-FR) → '−0,50';
 * formatDateTime('2026-03-09T09:10:00+01:00', de-DE) → '09.03.2026 09:10 (UTC+01:00)'.
 */
import type { ReportLocale } from './locales';

export const MISSING = '–';

/**
 * Numbers print with bounded digits: a magnitude at or above 10⁹ (a billion; no measured or
 * derived quantity of a CPET comes near it, a VO2 of 1e300 from a broken export does) is not
 * written out but printed as '≥ 10⁹' (or '≤ −10⁹'), in tables, sentences and on screen
 * alike, so a value like 1e300 never prints as "1.41e+299 %", in exponent form or as 300 digits.
 */
export const PRINTABLE_LIMIT = 1e9;

/** '≥ 10⁹' or '≤ −10⁹' for a value beyond the printable range; null for one inside it. */
export function outOfRange(value: number): string | null {
  if (Number.isNaN(value) || Math.abs(value) < PRINTABLE_LIMIT) return null;
  return value > 0 ? '≥ 10⁹' : '≤ −10⁹';
}

/** `value.toFixed(digits)` for a value inside the printable range, else its `outOfRange` text. */
export function boundedFixed(value: number, digits: number): string {
  return outOfRange(value) ?? value.toFixed(digits);
}

/**
 * A number for a message: at most 4 significant digits, never an exponent (below 0.001 it
 * reads 0.000; beyond the printable range '≥ 10⁹'). Example: 1234.56 → '1235'; 0.1234 → '0.1234'.
 */
export function shortNumber(value: number): string {
  if (!Number.isFinite(value)) return outOfRange(value) ?? String(value);
  const a = Math.abs(value);
  return outOfRange(value) ?? (a !== 0 && a < 1e-3 ? value.toFixed(3) : String(Number(value.toPrecision(4))));
}

function group(integer: string, locale: ReportLocale): string {
  if (locale.thousands === '' || integer.length < locale.groupFrom) return integer;
  let out = '';
  for (let i = 0; i < integer.length; i++) {
    if (i > 0 && (integer.length - i) % 3 === 0) out += locale.thousands;
    out += integer[i];
  }
  return out;
}

/** `Math.abs(value)` with `digits` decimals in the locale, without a sign. */
function magnitude(value: number, digits: number, locale: ReportLocale): string {
  const [integer, fraction] = Math.abs(value).toFixed(digits).split('.');
  return fraction === undefined ? group(integer, locale) : `${group(integer, locale)}${locale.decimal}${fraction}`;
}

export function formatFixed(value: number | null | undefined, digits: number, locale: ReportLocale): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return MISSING;
  const beyond = outOfRange(value);
  if (beyond) return beyond;
  const text = magnitude(value, digits, locale);
  return value.toFixed(digits).startsWith('-') ? `−${text}` : text;
}

/** With a `+` or `−` sign; zero at the shown precision has none. */
export function formatSigned(value: number | null | undefined, digits: number, locale: ReportLocale): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return MISSING;
  const beyond = outOfRange(value);
  if (beyond) return beyond;
  const text = magnitude(value, digits, locale);
  if (Number(Math.abs(value).toFixed(digits)) === 0) return text;
  return `${value < 0 ? '−' : '+'}${text}`;
}

/** A whole number (a count, a byte size) in the locale. */
export function formatInteger(value: number, locale: ReportLocale): string {
  return formatFixed(Math.round(value), 0, locale);
}

const ISO = /^(\d{4})-(\d{2})-(\d{2})(?:[T ](\d{2}):(\d{2})(?::(\d{2}))?(?:\.\d+)?(Z|[+-]\d{2}:?\d{2})?)?$/;

/** A calendar date in the locale's order and separator. */
export function formatDate(year: string, month: string, day: string, locale: ReportLocale): string {
  const s = locale.dateSeparator;
  return locale.dateOrder === 'dmy' ? `${day}${s}${month}${s}${year}` : locale.dateOrder === 'mdy' ? `${month}${s}${day}${s}${year}` : `${year}${s}${month}${s}${day}`;
}

/**
 * An ISO 8601 date or date-time in the locale, the wall-clock time as written (no time-zone
 * arithmetic). Text that is not ISO 8601 is returned unchanged; the neutral `en` locale
 * returns every value unchanged, so old reports read as before.
 */
export function formatDateTime(iso: string | null | undefined, locale: ReportLocale): string {
  if (iso === null || iso === undefined) return MISSING;
  if (locale.tag === 'en') return iso;
  const m = ISO.exec(iso.trim());
  if (!m) return iso;
  const date = formatDate(m[1], m[2], m[3], locale);
  if (m[4] === undefined) return date;
  const time = `${m[4]}:${m[5]}${m[6] !== undefined && m[6] !== '00' ? `:${m[6]}` : ''}`;
  const zone = m[7] === undefined ? '' : m[7] === 'Z' ? ' UTC' : ` (UTC${m[7].length === 5 ? `${m[7].slice(0, 3)}:${m[7].slice(3)}` : m[7]})`;
  return `${date} ${time}${zone}`;
}
