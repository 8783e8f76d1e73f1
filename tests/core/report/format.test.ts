// Report number formatting, against values worked by hand.
import { describe, expect, it } from 'vitest';
import { fixed, minSec, signed } from '../../../core/report/format';
import { describeAction } from '../../../core/report/log-text';

describe('format', () => {
  it('fixed rounds and uses a minus sign', () => {
    expect(fixed(1234.56, 0)).toBe('1235');
    expect(fixed(-3.14159, 2)).toBe('−3.14');
    expect(fixed(null)).toBe('–');
    expect(fixed(Number.NaN)).toBe('–');
  });

  it('signed shows + and −, and no sign for a zero after rounding', () => {
    expect(signed(2.04, 1)).toBe('+2.0');
    expect(signed(-0.04, 1)).toBe('0.0');
    expect(signed(-12.5, 0)).toBe('−13');
  });

  it('minSec writes m:ss (372 s → 6:12, 59.6 s → 1:00)', () => {
    expect(minSec(372)).toBe('6:12');
    expect(minSec(59.6)).toBe('1:00');
  });

  it('describes a threshold change with its values before and after', () => {
    const text = describeAction({ kind: 'set-threshold', day: 2, threshold: 'vt1', givenAs: 'time', before: { timeS: 400, vo2MlMin: 1480 }, after: { timeS: 370, vo2MlMin: 1395.4 } });
    expect(text).toBe('Day 2 VT1 set: 6:40, 1480 mL/min → 6:10, 1395 mL/min (given as a time)');
  });
});

describe('signedMinSec (durations as m:ss)', () => {
  it('writes a signed change in minutes and seconds: −287 s → −4:47, +36 s → +0:36', async () => {
    const { signedMinSec, timeCells } = await import('../../../core/report/time-text');
    expect(signedMinSec(-287)).toBe('−4:47');
    expect(signedMinSec(36)).toBe('+0:36');
    expect(signedMinSec(0.4)).toBe('0:00');
    expect(timeCells('s', 761, 725, -36)).toEqual({ unit: 'm:ss', day1: '12:41', day2: '12:05', delta: '−0:36' });
    expect(timeCells('W', 1, 2, 1)).toBeNull();
  });
});
