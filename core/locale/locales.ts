/**
 * How a lab writes numbers and dates, per locale: the decimal mark, the thousands separator
 * and from how many integer digits it is used, and the order and separator of a date. Plain
 * data, so a report looks the same on every machine (the platform's Intl tables differ
 * between versions, e.g. in the space French groups digits with) and `twofold verify` can
 * read the printed numbers back exactly.
 *
 * The conventions are the ones each country's labs commonly print (common practice; the
 * digit-grouping thresholds follow national style guides as recalled (memory): Spanish and
 * the Nordic languages leave four-digit numbers ungrouped, French too).
 * `en` is Twofold's own neutral form, the default and the reading of old cases: decimal
 * point, no grouping, ISO 8601 dates (`2026-03-09 09:10`).
 */

export interface ReportLocale {
  /** BCP 47 tag, e.g. `de-DE`. */
  readonly tag: string;
  /** The locale's name in English. */
  readonly name: string;
  readonly decimal: '.' | ',';
  /** The thousands separator ('' for none). U+00A0 is a no-break space. */
  readonly thousands: '' | ',' | '.' | '\u00a0' | "'";
  /** Integer digits from which the thousands separator is written (5: `1234`, `12 345`). */
  readonly groupFrom: number;
  readonly dateOrder: 'ymd' | 'dmy' | 'mdy';
  readonly dateSeparator: '-' | '.' | '/';
}

const NBSP = '\u00a0';

export const REPORT_LOCALES: readonly ReportLocale[] = [
  { tag: 'en', name: 'neutral (ISO dates, decimal point)', decimal: '.', thousands: '', groupFrom: 99, dateOrder: 'ymd', dateSeparator: '-' },
  { tag: 'en-GB', name: 'English (United Kingdom)', decimal: '.', thousands: ',', groupFrom: 4, dateOrder: 'dmy', dateSeparator: '/' },
  { tag: 'en-US', name: 'English (United States)', decimal: '.', thousands: ',', groupFrom: 4, dateOrder: 'mdy', dateSeparator: '/' },
  { tag: 'de-DE', name: 'German (Germany)', decimal: ',', thousands: '.', groupFrom: 4, dateOrder: 'dmy', dateSeparator: '.' },
  { tag: 'de-AT', name: 'German (Austria)', decimal: ',', thousands: NBSP, groupFrom: 4, dateOrder: 'dmy', dateSeparator: '.' },
  { tag: 'de-CH', name: 'German (Switzerland)', decimal: '.', thousands: "'", groupFrom: 4, dateOrder: 'dmy', dateSeparator: '.' },
  { tag: 'fr-FR', name: 'French (France)', decimal: ',', thousands: NBSP, groupFrom: 5, dateOrder: 'dmy', dateSeparator: '/' },
  { tag: 'es-ES', name: 'Spanish (Spain)', decimal: ',', thousands: '.', groupFrom: 5, dateOrder: 'dmy', dateSeparator: '/' },
  { tag: 'it-IT', name: 'Italian (Italy)', decimal: ',', thousands: '.', groupFrom: 4, dateOrder: 'dmy', dateSeparator: '/' },
  { tag: 'nl-NL', name: 'Dutch (Netherlands)', decimal: ',', thousands: '.', groupFrom: 4, dateOrder: 'dmy', dateSeparator: '-' },
  { tag: 'sv-SE', name: 'Swedish (Sweden)', decimal: ',', thousands: NBSP, groupFrom: 5, dateOrder: 'ymd', dateSeparator: '-' },
  { tag: 'da-DK', name: 'Danish (Denmark)', decimal: ',', thousands: '.', groupFrom: 4, dateOrder: 'dmy', dateSeparator: '.' },
  { tag: 'nb-NO', name: 'Norwegian (Norway)', decimal: ',', thousands: NBSP, groupFrom: 5, dateOrder: 'dmy', dateSeparator: '.' },
];

export const DEFAULT_LOCALE_TAG = 'en';

/** The language's usual country, for a tag that names only a language (`de` → `de-DE`). */
const LANGUAGE_DEFAULT: Readonly<Record<string, string>> = { de: 'de-DE', fr: 'fr-FR', es: 'es-ES', it: 'it-IT', nl: 'nl-NL', sv: 'sv-SE', da: 'da-DK', nb: 'nb-NO', no: 'nb-NO', nn: 'nb-NO' };

/**
 * The locale a tag names: exactly (case and `_`/`-` ignored, an encoding such as `.UTF-8`
 * dropped), else its language's usual country (`fr-BE` → fr-FR, `en-IE` → en-GB); null when
 * Twofold has no locale for its language.
 *
 * Example: resolveLocale('de_DE.UTF-8')?.tag → 'de-DE'; resolveLocale('pt-BR') → null.
 */
export function resolveLocale(tag: string): ReportLocale | null {
  const clean = tag.trim().replace(/[.@].*$/, '').replace(/_/g, '-');
  const exact = REPORT_LOCALES.find((l) => l.tag.toLowerCase() === clean.toLowerCase());
  if (exact) return exact;
  const language = clean.split('-')[0].toLowerCase();
  if (language === 'en') return REPORT_LOCALES.find((l) => l.tag === (clean.toLowerCase() === 'en-us' ? 'en-US' : 'en-GB')) ?? null;
  const fallback = LANGUAGE_DEFAULT[language];
  return fallback ? (REPORT_LOCALES.find((l) => l.tag === fallback) ?? null) : null;
}

export function localeByTag(tag: string | null | undefined): ReportLocale {
  return (tag ? resolveLocale(tag) : null) ?? REPORT_LOCALES[0];
}

/**
 * The locale of a process environment, given as plain strings by the shell: `LC_ALL`, then
 * `LC_NUMERIC`, then `LANG` (POSIX precedence). `C`, `POSIX`, unset, or a language Twofold
 * has no locale for give the neutral `en`.
 *
 * Example: localeFromEnvironment({ LANG: 'sv_SE.UTF-8' }) → 'sv-SE'.
 */
export function localeFromEnvironment(env: Readonly<Record<string, string | undefined>>): string {
  const raw = [env.LC_ALL, env.LC_NUMERIC, env.LANG].find((v) => v !== undefined && v !== '');
  if (!raw || /^(C|POSIX)([.@]|$)/i.test(raw)) return DEFAULT_LOCALE_TAG;
  return resolveLocale(raw)?.tag ?? DEFAULT_LOCALE_TAG;
}
