/**
 * Numbers print with bounded digits (core/locale/format-number.ts): below 10⁹ in full, at or
 * beyond it as '≥ 10⁹' / '≤ −10⁹', never in exponent form. The values are chosen by hand:
 * 1.41e299 is the change % a 1e300 VO2 once printed; 999,999,999.4 is the largest value
 * still written out at 0 decimals.
 */
import { describe, expect, it } from 'vitest';
import { boundedFixed, formatFixed, formatSigned, shortNumber } from '../../../core/locale/format-number';
import { localeByTag } from '../../../core/locale/locales';
import { minSec, signedMinSec } from '../../../core/locale/min-sec';
import { fmt, signed } from '../../../renderer/src/ui/format';

const en = localeByTag('en');
const de = localeByTag('de-DE');

describe('bounded digits', () => {
  it('writes values beyond 10⁹ as a bound, in every formatter', () => {
    expect(formatSigned(1.41e299, 1, en)).toBe('≥ 10⁹');
    expect(formatFixed(-1e300, 0, de)).toBe('≤ −10⁹');
    expect(formatFixed(1e9, 0, en)).toBe('≥ 10⁹');
    expect(formatFixed(999_999_999.4, 0, en)).toBe('999999999');
    expect(boundedFixed(1e300, 2)).toBe('≥ 10⁹');
    expect(boundedFixed(1.1549, 2)).toBe('1.15');
    expect(minSec(1e300)).toBe('≥ 10⁹ s');
    expect(signedMinSec(-1e18)).toBe('≤ −10⁹ s');
    // The workbench's formatters go through the same functions.
    expect(fmt(1e300, 1, 'L/min')).toBe('≥ 10⁹ L/min');
    expect(signed(1.41e299, 1, '%')).toBe('≥ 10⁹ %');
  });

  it('writes a number in a message with at most 4 significant digits and no exponent', () => {
    expect(shortNumber(1e9)).toBe('≥ 10⁹');
    expect(shortNumber(1e18)).toBe('≥ 10⁹');
    expect(shortNumber(123_456_789)).toBe('123500000');
    expect(shortNumber(826.6)).toBe('826.6');
    expect(shortNumber(0.00001)).toBe('0.000');
    expect(shortNumber(-5e-7)).toBe('-0.000');
  });
});
