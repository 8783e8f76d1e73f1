/**
 * Reading the report's printed comparison figures back in the locale the case records:
 * every day 1 and day 2 value of the comparison table, formatted as the report formats it,
 * must stand in the PDF's text as a whole token, and that token, read with the locale's
 * decimal mark and thousands separator (core/locale/parse-number.ts), must equal the
 * recomputed value within half its last printed digit. A report printed in another locale
 * than the case records does not pass: `20.9` is not a token of a de-DE report.
 */
import type { Comparison } from '../core/compare/compare-tests';
import { metricDigits } from '../core/report/build-report';
import { localeByTag } from '../core/locale/locales';
import { formatFixed } from '../core/locale/format-number';
import { parseLocaleNumber } from '../core/locale/parse-number';

export interface PrintedCheck {
  readonly ok: boolean;
  readonly checked: number;
  readonly problems: readonly string[];
}

export function checkPrintedNumbers(text: string, comparison: Comparison, localeTag: string | undefined): PrintedCheck {
  const locale = localeByTag(localeTag);
  const tokens = new Set(text.split(/[ \t\r\n\f]+/).filter((t) => t !== ''));
  const problems: string[] = [];
  let checked = 0;
  for (const m of comparison.metrics) {
    const digits = metricDigits(m.unit);
    for (const [day, value] of [[1, m.day1], [2, m.day2]] as const) {
      if (value === null || !Number.isFinite(value)) continue;
      checked++;
      if (m.unit === 's') {
        // Durations are printed as m:ss (e.g. 452 s → 7:32), the same in every locale.
        const whole = Math.round(Math.abs(value));
        const printed = `${value < 0 ? '−' : ''}${Math.floor(whole / 60)}:${String(whole % 60).padStart(2, '0')}`;
        if (!tokens.has(printed)) problems.push(`${m.label}, day ${day}: '${printed}' is not in the report's text`);
        continue;
      }
      const printed = formatFixed(value, digits, locale);
      if (!tokens.has(printed)) {
        problems.push(`${m.label}, day ${day}: '${printed}' is not in the report's text`);
        continue;
      }
      const back = parseLocaleNumber(printed, locale);
      if (back === null || Math.abs(back - value) > 0.5 * 10 ** -digits + 1e-9) problems.push(`${m.label}, day ${day}: '${printed}' reads back as ${String(back)}, recomputed ${value}`);
    }
  }
  return { ok: problems.length === 0 && checked > 0, checked, problems };
}
