/**
 * Number formatting for the report: fixed decimals, a dash for a missing value, a signed
 * form for changes, and a minus sign (U+2212) rather than a hyphen, as typesetting does.
 * `fixed`, `signed` and `minSec` write Twofold's neutral form (decimal point, no grouping);
 * `reportFormat(locale)` gives the same functions in a lab's locale (core/locale/), with
 * its dates.
 *
 * Example: fixed(1234.56, 0) → '1235'; signed(-3.14159, 1) → '−3.1'; fixed(null) → '–';
 * reportFormat(de-DE).fixed(1234.56, 1) → '1.234,6'.
 */
import { formatDateTime, formatFixed, formatInteger, formatSigned, MISSING } from '../locale/format-number';
import { REPORT_LOCALES, type ReportLocale } from '../locale/locales';
import { minSec } from '../locale/min-sec';

export { MISSING };

const NEUTRAL = REPORT_LOCALES[0];

export function fixed(value: number | null | undefined, digits = 0): string {
  return formatFixed(value, digits, NEUTRAL);
}

export function signed(value: number | null | undefined, digits = 0): string {
  return formatSigned(value, digits, NEUTRAL);
}

/** Seconds as m:ss, e.g. 372 → '6:12' (the one formatter, core/locale/min-sec.ts). */
export { minSec };

/** The decimals a number shows when written in full (0.25 → 2; 3 → 0). */
function decimalsOf(value: number): number {
  const text = String(value);
  return /e/i.test(text) ? 6 : (text.split('.')[1]?.length ?? 0);
}

/** The report's formatting functions in one locale. */
export interface ReportFormat {
  readonly locale: ReportLocale;
  readonly fixed: (value: number | null | undefined, digits?: number) => string;
  readonly signed: (value: number | null | undefined, digits?: number) => string;
  readonly minSec: (seconds: number | null | undefined) => string;
  readonly integer: (value: number) => string;
  /** A number with the decimals it has (a setting, a criterion's bound), in the locale. */
  readonly number: (value: number) => string;
  /** An ISO 8601 date or date-time in the locale (other text unchanged). */
  readonly dateTime: (iso: string | null | undefined) => string;
  /** English sentences made elsewhere (the summary, notes) with their decimal numbers in the locale. */
  readonly prose: (text: string) => string;
}

/**
 * The decimal numbers of a sentence in the locale's decimal mark: `24.3 h` → `24,3 h`.
 * Only a lone `digits.digits` is rewritten, so a version (`0.3.0`), a file name
 * (`day1.csv`) or a year (`2005`) is left as it is.
 */
export function localizeProse(text: string, locale: ReportLocale): string {
  if (locale.decimal === '.') return text;
  return text.replace(/(?<![\w.,])(\d+)\.(\d+)(?![\w.]|,\d)/g, `$1${locale.decimal}$2`);
}

export function reportFormat(locale: ReportLocale): ReportFormat {
  return {
    locale,
    fixed: (value, digits = 0) => formatFixed(value, digits, locale),
    signed: (value, digits = 0) => formatSigned(value, digits, locale),
    minSec: (seconds) => minSec(seconds),
    integer: (value) => formatInteger(value, locale),
    number: (value) => formatFixed(value, decimalsOf(value), locale),
    dateTime: (iso) => formatDateTime(iso, locale),
    prose: (text) => localizeProse(text, locale),
  };
}
