// Page 1's tables as a person reads them: durations in m:ss (issue 13: "times in mm:ss
// everywhere a person reads them"), numbers in the report's locale. Values from fixture.ts.
import { describe, expect, it } from 'vitest';
import { compareTests } from '../../../core/compare/compare-tests';
import { isPrimary } from '../../../core/compare/findings';
import { pageOne } from '../../../core/compare/page-one';
import { localeByTag } from '../../../core/locale/locales';
import { DEFAULT_SETTINGS } from '../../../core/model/settings';
import { buildAnalysis } from './fixture';

describe('pageOne', () => {
  const day1 = buildAnalysis({ sourceName: 'd1.csv', vt1: { vo2MlMin: 1500, workW: 100 } });
  const day2 = buildAnalysis({ sourceName: 'd2.csv', metadata: { testStart: '2026-03-03T10:00:00Z' }, vt1: { vo2MlMin: 1000, workW: 60 } });
  const c = compareTests(day1, day2, DEFAULT_SETTINGS);

  it('writes every duration of the secondary table in m:ss, never bare seconds', () => {
    const page = pageOne(c);
    const timed = c.metrics.filter((m) => m.unit === 's' && !isPrimary(m.id) && m.day1 !== null);
    expect(timed.length).toBeGreaterThan(0);
    for (const m of timed) {
      const row = page.secondary.rows.find((r) => r[0] === m.label)!;
      expect(row[1]).toBe('m:ss');
      // e.g. 452 s → 7:32 (452 = 7 × 60 + 32)
      const s = Math.round(m.day1!);
      expect(row[2]).toBe(`${Math.floor(s / 60)}:${String(s % 60).padStart(2, '0')}`);
    }
  });

  it('writes the primary table in the locale given (de-DE: decimal comma)', () => {
    const de = pageOne(c, localeByTag('de-DE'));
    const vo2 = de.primary.rows.find((r) => r[0].startsWith('VO2 at VT1'))!;
    expect(vo2[1]).toBe('1.500'); // thousands separator "." in de-DE
    expect(vo2[3]).toMatch(/^−33,3$/); // (1000 / 1500 − 1) × 100 = −33.3 %
  });
});
