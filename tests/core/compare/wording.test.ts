// The summary states the findings (worked by hand from fixture values: 24-h band, CV 6 % at
// VT1, edges −14.9 / +17.5 %), the effort and the band's population and interval; it never
// names a condition (Twofold does not diagnose) and does not repeat the cautions, which keep
// their own box.
import { describe, expect, it } from 'vitest';
import { compareTests } from '../../../core/compare/compare-tests';
import { CAUTIONS } from '../../../core/compare/wording';
import { pageOne } from '../../../core/compare/page-one';
import { DEFAULT_SETTINGS } from '../../../core/model/settings';
import { buildAnalysis } from './fixture';

const d2Start = { testStart: '2026-03-03T09:00:00Z' };

describe('summary wording', () => {
  it('states one VT1 finding with its facets together, the effort, the interval and the band population', () => {
    const day1 = buildAnalysis({ vt1: { vo2MlMin: 1500, workW: 100, hrBpm: 130 } });
    const day2 = buildAnalysis({ metadata: d2Start, vt1: { vo2MlMin: 1200, workW: 75, hrBpm: 120 }, derived: { veVco2Slope: 31 } });
    const s = compareTests(day1, day2, DEFAULT_SETTINGS).summary;
    // The fixture's thresholds carry no interval: the change is stated without one, not as "−20.0 to −20.0".
    expect(s).toMatch(/^VT1 came earlier on day 2: VO2 −20.0 % \(no measurement interval; lower on day 2\), workload −25.0 %/); // 300/1500, 25/100
    expect(s).toContain('HR −10 bpm');
    expect(s).toContain('Both tests met the maximal-effort criteria.');
    expect(s).toContain('The tests were 24.0 h apart.');
    expect(s).toContain('Band: sedentary or healthy control groups of two-day CPET studies, retested 24 h apart');
    expect(s).not.toContain(CAUTIONS);
    expect(s).not.toMatch(/of \d+ metrics/);
    expect(CAUTIONS).toMatch(/does not diagnose/);
    expect(CAUTIONS).toMatch(/prolonged symptom flares/);
    expect(CAUTIONS).toMatch(/local regulations and licensed practice/);
  });

  it('states a change of a load set by the ergometer as exact, with no interval to print', () => {
    // Peak workload is the load the protocol set (no measurement uncertainty): 180 → 144 W is −20.0 %.
    const day2 = buildAnalysis({ metadata: d2Start, peak: { workW: 144 } });
    const c = compareTests(buildAnalysis(), day2, DEFAULT_SETTINGS);
    const row = c.metrics.find((m) => m.id === 'peak_work')!;
    expect(row.interval).not.toBeNull();
    expect([row.interval!.lowPct, row.interval!.highPct]).toEqual([-20, -20]);
    expect(c.summary).toContain('workload −20.0 % (exact, no measurement interval; lower on day 2)');
    expect(row.reason).toMatch(/^change −20\.0 ?% \(exact: the load set by the ergometer/);
    expect(pageOne(c).primary.rows.flat()).toContain('none (exact)');
  });

  it('uses no diagnostic language', () => {
    const day2 = buildAnalysis({ metadata: d2Start, vt1: { vo2MlMin: 900, workW: 40 }, peak: { vo2MlMin: 1800 } });
    const s = compareTests(buildAnalysis(), day2, DEFAULT_SETTINGS).summary;
    expect(s).not.toMatch(/diagnos|disease|disorder|syndrome|patholog|impair|abnormal|ME\/CFS|COVID|consistent with/i);
  });

  it('puts a different subject first, in capitals', () => {
    const s = compareTests(buildAnalysis(), buildAnalysis({ metadata: { ...d2Start, subjectId: 'S-99' } }), DEFAULT_SETTINGS).summary;
    expect(s.startsWith('DIFFERENT SUBJECTS')).toBe(true);
  });

  it('says when a test was not maximal and that the peak could not be compared', () => {
    const s = compareTests(buildAnalysis(), buildAnalysis({ metadata: d2Start, effort: 'submaximal' }), DEFAULT_SETTINGS).summary;
    expect(s).toContain('Effort: day 1 maximal, day 2 submaximal');
    expect(s).toMatch(/Peak values could not be compared \(Peak VO2: peak metric compared only between two maximal efforts/);
  });

  it('reports a reproducing pair as reproduced', () => {
    const s = compareTests(buildAnalysis(), buildAnalysis({ metadata: d2Start }), DEFAULT_SETTINGS).summary;
    expect(s).toMatch(/^VT1 reproduced day 1: VO2 0.0 %/);
    expect(s).toContain('The peak reproduced day 1');
  });
});
