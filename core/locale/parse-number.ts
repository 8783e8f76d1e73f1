/**
 * Reading a number back as a locale wrote it (format-number.ts): thousands separators
 * dropped, the decimal mark made a point, U+2212 read as minus. Anything else is null, so a
 * number printed in another locale is not silently misread: `2.226` in de-DE is 2226, and
 * `2,226` in de-DE is 2.226.
 *
 * Example: parseLocaleNumber('−12.345,7', de-DE) → -12345.7; parseLocaleNumber('1,5', en) → null.
 */
import type { ReportLocale } from './locales';

export function parseLocaleNumber(text: string, locale: ReportLocale): number | null {
  let t = text.trim().replace(/\u2212/g, '-').replace(/^\+/, '');
  const sep = locale.thousands;
  if (sep !== '') {
    const digits = '\\d';
    const grouped = new RegExp(`^-?${digits}{1,3}(${escape(sep === '\u00a0' ? '[\u00a0\u202f ]' : sep, sep === '\u00a0')}${digits}{3})+(${escape(locale.decimal, false)}${digits}+)?$`);
    if (grouped.test(t)) t = sep === '\u00a0' ? t.replace(/[\u00a0\u202f ]/g, '') : t.split(sep).join('');
  }
  if (locale.decimal === ',') {
    if (t.includes('.')) return null;
    t = t.replace(',', '.');
  } else if (t.includes(',')) return null;
  return /^-?\d+(\.\d+)?$/.test(t) ? Number(t) : null;
}

function escape(s: string, isClass: boolean): string {
  return isClass ? s : s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
}
