// Reference: seconds worked by hand from the sexagesimal notation (1 h = 3600 s, 1 min = 60 s).
import { describe, expect, test } from 'vitest';
import { classifyTime, parseClock, parseDateTime, parseTimeCell } from '../../../core/import/time-format';

describe('time cells', () => {
  test('mm:ss and h:mm:ss with decimals', () => {
    expect(parseClock('12:34.5')).toBe(754.5); // 12·60 + 34.5
    expect(parseClock('1:02:03')).toBe(3723); // 3600 + 120 + 3
    expect(parseClock('75:30')).toBe(4530); // minutes may exceed 59: 75·60 + 30
    expect(parseClock('0:00:07,25')).toBe(7.25);
    expect(parseClock('12:75')).toBeNaN();
  });

  test('date-times give the second of the day', () => {
    expect(parseDateTime('2026-03-02T09:15:03')).toEqual({ date: '2026-03-02', secondOfDay: 33303 }); // 9·3600 + 15·60 + 3
    expect(parseDateTime('2026-03-02 09:15')).toEqual({ date: '2026-03-02', secondOfDay: 33300 });
  });

  test('minutes and seconds columns', () => {
    expect(parseTimeCell('0,25', 'minutes', ',')).toBe(15);
    expect(parseTimeCell('12.5', 'seconds', '.')).toBe(12.5);
    expect(parseTimeCell('', 'seconds', '.')).toBeNull();
    expect(parseTimeCell('x', 'seconds', '.')).toBeNaN();
  });

  test('a column is a time of day when named so or when it starts an hour or more in', () => {
    expect(classifyTime('00:03', null, false)).toBe('mm:ss');
    expect(classifyTime('0:00:03', null, false)).toBe('h:mm:ss');
    expect(classifyTime('9:10:04', null, false)).toBe('clock');
    expect(classifyTime('00:03', null, true)).toBe('clock');
    expect(classifyTime('2026-03-02T09:15:03', null, false)).toBe('date-time');
    expect(classifyTime('0.05', 'min', false)).toBe('minutes');
    expect(classifyTime('3.2', null, false)).toBe('seconds');
  });
});

describe('the fast clock reader', () => {
  // Reference: the same seconds written as a plain decimal and read by Number().
  test('m:ss.s and h:mm:ss.s give the same double as the seconds written out', async () => {
    const fc = (await import('fast-check')).default;
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 36_000_000 }), (tenths) => {
        const whole = Math.floor(tenths / 10);
        const h = Math.floor(whole / 3600);
        const m = Math.floor((whole % 3600) / 60);
        const s = whole % 60;
        const frac = tenths % 10;
        const expected = Number(`${whole}.${frac}`);
        expect(parseClock(`${h * 60 + m}:${String(s).padStart(2, '0')}.${frac}`)).toBe(expected);
        expect(parseClock(`${h}:${String(m).padStart(2, '0')}:${String(s).padStart(2, '0')},${frac}`)).toBe(expected);
      }),
      { numRuns: 2000, seed: 5 },
    );
  });
  test('malformed clocks are NaN', () => {
    expect(parseClock('1:2:3:4')).toBeNaN();
    expect(parseClock('12:60')).toBeNaN(); // seconds stop at 59
    expect(parseClock('12:34.')).toBeNaN();
    expect(parseClock(':30')).toBeNaN();
  });
});
