// The summary states the numbers (worked by hand from fixture values) and the cautions of
// the project brief; it never names a condition (Twofold does not diagnose: common practice).
import { describe, expect, it } from 'vitest';
import { compareTests } from '../../../core/compare/compare-tests';
import { CAUTIONS } from '../../../core/compare/wording';
import { DEFAULT_SETTINGS } from '../../../core/model/settings';
import { buildAnalysis } from './fixture';

const typical = { ...DEFAULT_SETTINGS, compare: { ...DEFAULT_SETTINGS.compare, bandKind: 'typical' as const } };
const d2Start = { testStart: '2026-03-03T09:00:00Z' };

describe('summary wording', () => {
  it('names the declines beyond the band by how much, the effort, the band kind and source, and ends with the cautions', () => {
    const day1 = buildAnalysis({ vt1: { vo2MlMin: 1500 } });
    const day2 = buildAnalysis({ metadata: d2Start, vt1: { vo2MlMin: 1200 }, derived: { veVco2Slope: 31 } });
    const s = compareTests(day1, day2, typical).summary;
    expect(s).toContain('VO2 at VT1 20.0% lower on day 2 (band ±10.4%)'); // 300/1500 = 20%
    expect(s).toContain('VE/VCO2 slope 10.7% higher on day 2 (band ±8.0%)'); // 3/28 = 10.7%
    expect(s).toContain('Both tests met the maximal-effort criteria.');
    expect(s).toContain('The tests were 24.0 h apart.');
    expect(s).toContain('Band: typical variation');
    expect(s).toContain("source: Twofold's default table");
    expect(s.endsWith(CAUTIONS)).toBe(true);
    expect(CAUTIONS).toMatch(/does not diagnose/);
    expect(CAUTIONS).toMatch(/prolonged symptom flares/);
    expect(CAUTIONS).toMatch(/local regulations and licensed practice/);
  });

  it('uses no diagnostic language outside the caution', () => {
    const day2 = buildAnalysis({ metadata: d2Start, vt1: { vo2MlMin: 900, workW: 40 }, peak: { vo2MlMin: 1800 } });
    const s = compareTests(buildAnalysis(), day2, DEFAULT_SETTINGS).summary.replace(CAUTIONS, '');
    expect(s).not.toMatch(/diagnos|disease|disorder|syndrome|patholog|impair|abnormal|ME\/CFS|COVID|consistent with/i);
  });

  it('puts a different subject first, in capitals', () => {
    const s = compareTests(buildAnalysis(), buildAnalysis({ metadata: { ...d2Start, subjectId: 'S-99' } }), DEFAULT_SETTINGS).summary;
    expect(s.startsWith('DIFFERENT SUBJECTS')).toBe(true);
  });

  it('says when a test was not maximal and what could not be compared', () => {
    const s = compareTests(buildAnalysis(), buildAnalysis({ metadata: d2Start, effort: 'submaximal', vt2: null }), DEFAULT_SETTINGS).summary;
    expect(s).toContain('Effort: day 1 maximal, day 2 submaximal');
    expect(s).toMatch(/Not compared: .*VO2 at VT2 \(VT2 not found on day 2/);
    expect(s).toMatch(/Peak VO2 \(peak metric compared only between two maximal efforts/);
  });

  it('reports a reproducing pair as all within the band (mdc95)', () => {
    const s = compareTests(buildAnalysis(), buildAnalysis({ metadata: d2Start }), DEFAULT_SETTINGS).summary;
    expect(s).toContain('No metric changed beyond its band in the adverse direction.');
    expect(s).toContain('18 of 18 metrics lie within their band.'); // 19 metrics less the RER effort check
    expect(s).toContain('Band: minimal detectable change');
  });
});
