/**
 * Times as a person reads them (m:ss, as the report writes them) and as a reviewer types
 * them, worked by hand: 372 s = 6 min 12 s.
 */
import { describe, expect, it } from 'vitest';
import { clock, parseClock } from '../../../../renderer/src/ui/format';
import { minSec } from '../../../../core/report/format';
import { clockAxis } from '../../../../renderer/src/charts/clock-axis';
import { thresholdOfMetric } from '../../../../renderer/src/ui/reviewer-mark';
import { placeOf } from '../../../../renderer/src/ui/notices';

describe('m:ss on screen', () => {
  it('writes seconds as m:ss, rounding to the second, exactly as the report does', () => {
    expect(clock(372)).toBe('6:12');
    expect(clock(59.6)).toBe('1:00');
    expect(clock(0)).toBe('0:00');
    expect(clock(3725)).toBe('62:05');
    expect(clock(null)).toBe('—');
    for (const s of [0, 9.4, 59.5, 61, 372, 1234.5]) expect(clock(s)).toBe(minSec(s));
  });

  it('reads a typed time as m:ss, h:mm:ss or plain seconds', () => {
    expect(parseClock('6:12')).toBe(372);
    expect(parseClock(' 6:12.5 ')).toBe(372.5);
    expect(parseClock('1:02:03')).toBe(3723);
    expect(parseClock('372')).toBe(372);
    expect(parseClock('6:75')).toBeNull();
    expect(parseClock('six')).toBeNull();
  });

  it('labels a time axis at whole minutes in m:ss', () => {
    const axis = clockAxis(700);
    // 700 s = 11.7 min (at most 12 steps of 1 min): ticks every minute, 0:00 … 11:00.
    expect(axis.tickvals).toEqual([0, 60, 120, 180, 240, 300, 360, 420, 480, 540, 600, 660]);
    expect(axis.ticktext[0]).toBe('0:00');
    expect(axis.ticktext[11]).toBe('11:00');
    // 725 s = 12.1 min: more than 12 steps of 1 min, so every 2 min.
    expect(clockAxis(725).ticktext).toEqual(['0:00', '2:00', '4:00', '6:00', '8:00', '10:00', '12:00']);
    // 30 min: every 5 min.
    expect(clockAxis(1800).ticktext).toEqual(['0:00', '5:00', '10:00', '15:00', '20:00', '25:00', '30:00']);
  });
});

describe('marks and places', () => {
  it('ties threshold metrics to their threshold and no other', () => {
    expect(thresholdOfMetric('vt1_vo2')).toBe('vt1');
    expect(thresholdOfMetric('vt2_work')).toBe('vt2');
    expect(thresholdOfMetric('peak_vo2')).toBeNull();
  });

  it('names a file with its line, and a subject that is no file plainly', () => {
    expect(placeOf({ code: 'x', file: 'day2.csv', line: 14, column: 3, message: '' })).toBe('In day2.csv, line 14, column 3');
    expect(placeOf({ code: 'x', file: 'reviewer', line: null, column: null, message: '' })).toBe('Reviewer');
    expect(placeOf({ code: 'x', file: 'new case', line: null, column: null, message: '' })).toBe('New case');
  });
});
