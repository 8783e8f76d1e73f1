// Reference: the number and date conventions in core/locale/locales.ts (decimal comma and
// `.` grouping in German, no-break-space grouping from five digits in French and Swedish,
// day.month.year dates); expected strings worked by hand.
import { describe, expect, test } from 'vitest';
import { localeByTag, localeFromEnvironment, resolveLocale } from '../../../core/locale/locales';
import { formatDateTime, formatFixed, formatSigned } from '../../../core/locale/format-number';
import { parseLocaleNumber } from '../../../core/locale/parse-number';
import { fixed, localizeProse, signed } from '../../../core/report/format';

const de = localeByTag('de-DE');
const fr = localeByTag('fr-FR');
const sv = localeByTag('sv-SE');
const us = localeByTag('en-US');
const en = localeByTag('en');

describe('numbers in a locale', () => {
  test('decimal mark, thousands separator and minus sign', () => {
    expect(formatFixed(12345.678, 1, de)).toBe('12.345,7');
    expect(formatFixed(1462, 0, de)).toBe('1.462');
    expect(formatFixed(1462, 0, fr)).toBe('1462'); // French groups from five digits
    expect(formatFixed(12345, 0, fr)).toBe('12\u00a0345');
    expect(formatFixed(-0.5, 2, sv)).toBe('−0,50');
    expect(formatFixed(1234567.5, 1, us)).toBe('1,234,567.5');
    expect(formatSigned(5.383, 2, de)).toBe('+5,38');
    expect(formatSigned(-0.004, 2, de)).toBe('0,00');
    expect(formatFixed(null, 1, de)).toBe('–');
  });

  test('the neutral form is exactly what the report printed before locales existed', () => {
    for (const [v, d] of [[1234.56, 0], [-3.14159, 1], [-0.001, 0], [0, 2], [98765.4321, 3]] as const) {
      expect(fixed(v, d)).toBe(v.toFixed(d).replace(/^-/, '−'));
      expect(formatFixed(v, d, en)).toBe(fixed(v, d));
    }
    expect(signed(-3.14159, 1)).toBe('−3.1');
  });

  test('a printed number reads back in its own locale, and not in another', () => {
    expect(parseLocaleNumber('−12.345,7', de)).toBe(-12345.7);
    expect(parseLocaleNumber('2.226', de)).toBe(2226);
    expect(parseLocaleNumber('2,226', de)).toBe(2.226);
    expect(parseLocaleNumber('12\u00a0345,5', fr)).toBe(12345.5);
    expect(parseLocaleNumber('1,5', en)).toBeNull();
    expect(parseLocaleNumber('20.9', de)).toBeNull();
    for (const v of [0, 1.5, -27.45, 1462, 12345.678, -98765.4]) for (const l of [de, fr, sv, us, en]) expect(parseLocaleNumber(formatFixed(v, 2, l), l)).toBeCloseTo(v, 2);
  });

  test('dates in the locale’s order, the zone kept; the neutral form unchanged', () => {
    expect(formatDateTime('2026-03-09T09:10:00+01:00', de)).toBe('09.03.2026 09:10 (UTC+01:00)');
    expect(formatDateTime('2026-12-02T05:22:37Z', fr)).toBe('02/12/2026 05:22:37 UTC');
    expect(formatDateTime('2026-03-09', us)).toBe('03/09/2026');
    expect(formatDateTime('2026-03-09', sv)).toBe('2026-03-09');
    expect(formatDateTime('2026-03-09T09:10:00+01:00', en)).toBe('2026-03-09T09:10:00+01:00');
    expect(formatDateTime('not a date', de)).toBe('not a date');
  });

  test('decimal numbers in English sentences, and nothing else', () => {
    expect(localizeProse('The tests were 24.3 h apart; peak RER 1.15 (Weir 2005), Twofold 0.3.0, day1.csv.', de)).toBe('The tests were 24,3 h apart; peak RER 1,15 (Weir 2005), Twofold 0.3.0, day1.csv.');
    expect(localizeProse('24.3 h', en)).toBe('24.3 h');
  });
});

describe('which locale', () => {
  test('tags resolve exactly, by language, or not at all', () => {
    expect(resolveLocale('de_DE.UTF-8')?.tag).toBe('de-DE');
    expect(resolveLocale('fr-BE')?.tag).toBe('fr-FR');
    expect(resolveLocale('no')?.tag).toBe('nb-NO');
    expect(resolveLocale('en-IE')?.tag).toBe('en-GB');
    expect(resolveLocale('pt-BR')).toBeNull();
  });

  test('the environment: LC_ALL over LC_NUMERIC over LANG; C and unknown are neutral', () => {
    expect(localeFromEnvironment({ LANG: 'sv_SE.UTF-8' })).toBe('sv-SE');
    expect(localeFromEnvironment({ LC_ALL: 'da_DK.UTF-8', LANG: 'en_US.UTF-8' })).toBe('da-DK');
    expect(localeFromEnvironment({ LC_NUMERIC: 'it_IT', LANG: 'en_US' })).toBe('it-IT');
    expect(localeFromEnvironment({ LANG: 'C.UTF-8' })).toBe('en');
    expect(localeFromEnvironment({})).toBe('en');
    expect(localeFromEnvironment({ LANG: 'pt_BR.UTF-8' })).toBe('en');
  });
});
