/**
 * The one m:ss formatter (core/locale/min-sec.ts), values worked by hand: 372 s = 6 × 60 + 12;
 * 3725 s = 62 × 60 + 5; −287 s = −(4 × 60 + 47). The report, the workbench and the CLI all
 * write times through it, so their forms must be identical.
 */
import { describe, expect, it } from 'vitest';
import { minSec, signedMinSec } from '../../../core/locale/min-sec';
import { minSec as reportMinSec, reportFormat } from '../../../core/report/format';
import { signedMinSec as reportSigned, timeCells } from '../../../core/report/time-text';
import { clock, signedClock } from '../../../renderer/src/ui/format';
import { localeByTag } from '../../../core/locale/locales';

describe('m:ss', () => {
  it('writes seconds as m:ss, rounded to the whole second', () => {
    expect(minSec(372)).toBe('6:12');
    expect(minSec(59.5)).toBe('1:00');
    expect(minSec(59.4)).toBe('0:59');
    expect(minSec(0)).toBe('0:00');
    expect(minSec(3725)).toBe('62:05');
    expect(minSec(null)).toBe('–');
    expect(minSec(Number.NaN)).toBe('–');
  });

  it('writes a negative time with a minus sign, not a floor of minutes (−5 s is −0:05, not −1:55)', () => {
    expect(minSec(-5)).toBe('−0:05');
    expect(minSec(-287)).toBe('−4:47');
    expect(minSec(-0.4)).toBe('0:00');
  });

  it('writes a signed change', () => {
    expect(signedMinSec(-287)).toBe('−4:47');
    expect(signedMinSec(36)).toBe('+0:36');
    expect(signedMinSec(0.4)).toBe('0:00');
    expect(signedMinSec(undefined)).toBe('–');
  });

  it('is the formatter of the report, its locales and the workbench', () => {
    for (const s of [-287, -5, 0, 9.4, 59.5, 61, 372, 1234.5, 3725]) {
      expect(reportMinSec(s)).toBe(minSec(s));
      expect(reportFormat(localeByTag('de-DE')).minSec(s)).toBe(minSec(s));
      expect(clock(s)).toBe(minSec(s));
      expect(reportSigned(s)).toBe(signedMinSec(s));
      expect(signedClock(s)).toBe(signedMinSec(s));
    }
    // The workbench writes a missing time with its em dash.
    expect(clock(null)).toBe('—');
    expect(signedClock(null)).toBe('—');
    expect(timeCells('s', 452, 237, -215)).toEqual({ unit: 'm:ss', day1: '7:32', day2: '3:57', delta: '−3:35' });
  });
});
