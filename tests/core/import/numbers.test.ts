// Reference: values worked by hand; decimal comma as written in continental European
// exports (common practice), thousands point only with a comma decimal.
import { describe, expect, test } from 'vitest';
import { detectDecimal, parseNumber } from '../../../core/import/numbers';

describe('parseNumber', () => {
  test('point and comma decimals', () => {
    expect(parseNumber('1.25', '.')).toBe(1.25);
    expect(parseNumber(' 1,25 ', ',')).toBe(1.25);
    expect(parseNumber('-0,5', ',')).toBe(-0.5);
    expect(parseNumber('1.234,5', ',')).toBe(1234.5); // thousands point: 1 234.5 by hand
    expect(parseNumber('2e3', '.')).toBe(2000);
  });

  test('empty cells and placeholders are null, text is NaN', () => {
    expect(parseNumber('', '.')).toBeNull();
    expect(parseNumber('--', '.')).toBeNull();
    expect(parseNumber('n/a', ',')).toBeNull();
    expect(parseNumber('abc', '.')).toBeNaN();
    expect(parseNumber('1,25', '.')).toBeNaN(); // a comma in a point-decimal file is not a number
    expect(parseNumber('0x10', '.')).toBeNaN();
    expect(parseNumber('1e400', '.')).toBeNaN(); // beyond double range (IEEE 754 max ≈ 1.8e308)
  });
});

describe('detectDecimal', () => {
  test('a comma when cells look like 12,5', () => {
    expect(detectDecimal([['00:03', '0,350', '10,5', '70']])).toBe(',');
    expect(detectDecimal([['3.0', '350', '10.5', '70']])).toBe('.');
    expect(detectDecimal([['3', '350', '10', '70']])).toBe('.');
  });
});

describe('the fast decimal reader agrees with Number exactly', () => {
  // Reference: ECMAScript Number() (correctly rounded decimal to double); the fast path
  // divides an exact integer once by an exact power of ten, which IEEE 754 also rounds correctly.
  test('random decimals with either mark', async () => {
    const fc = (await import('fast-check')).default;
    fc.assert(
      fc.property(fc.integer({ min: -1e12, max: 1e12 }), fc.integer({ min: 0, max: 6 }), fc.constantFrom<'.' | ','>('.', ','), (int, decimals, mark) => {
        const text = (int / 10 ** decimals).toFixed(decimals);
        const written = mark === ',' ? text.replace('.', ',') : text;
        expect(parseNumber(written, mark)).toBe(Number(text));
      }),
      { numRuns: 2000, seed: 3 },
    );
  });
});
