// Calls worked by hand from the default band (24-h controls; log-scale limits
// exp(±1.96·√2·ln(1 + CV)) − 1, Hopkins 2000, Weir 2005) on hand-built analyses (fixture.ts,
// which has no threshold interval, so the band alone applies).
import { describe, expect, it } from 'vitest';
import { HEALTHY_30D_BAND } from '../../../core/compare/bands';
import { compareMetrics } from '../../../core/compare/metrics';
import { buildAnalysis } from './fixture';

const find = (rows: ReturnType<typeof compareMetrics>, id: string) => rows.find((r) => r.id === id)!;

describe('compareMetrics', () => {
  const day1 = buildAnalysis({ vt1: { vo2MlMin: 1500, workW: 100 } });
  const day2 = buildAnalysis({ vt1: { vo2MlMin: 1200, workW: 70 }, peak: { vo2MlMin: 2300 }, derived: { veVco2Slope: 31 } });

  it('VT1 VO2 1500 → 1200: −20 %, below the 24-h band edge −14.9 % (CV 6 %) → lower on day 2', () => {
    const row = find(compareMetrics(day1, day2), 'vt1_vo2');
    expect(row).toMatchObject({ day1: 1500, day2: 1200, delta: -300, verdict: 'fell', adverseBeyondBand: true });
    expect(row.deltaPct).toBeCloseTo(-20, 10);
    expect(row.band!.lowPct).toBeCloseTo(-14.91, 2);
    expect(row.reason).toMatch(/no measurement interval on day 1 and day 2/);
  });

  it('the same change against Decato (CV 10.4 %, −24.0 %) is reproduced', () => {
    expect(find(compareMetrics(day1, day2, HEALTHY_30D_BAND), 'vt1_vo2').verdict).toBe('held');
  });

  it('VT1 workload 100 → 70 W: −30 %, below −19.2 % (CV 8 %: exp(−1.96·√2·ln 1.08) − 1 = −19.21 %)', () => {
    const row = find(compareMetrics(day1, day2), 'vt1_work');
    expect(row.deltaPct).toBeCloseTo(-30, 10);
    expect(row.band!.lowPct).toBeCloseTo(-19.21, 1);
    expect(row.verdict).toBe('fell');
  });

  it('peak VO2 2500 → 2300: −8 %, inside −12.4 % (CV 4.9 %, Decato) → reproduced', () => {
    expect(find(compareMetrics(day1, day2), 'peak_vo2').verdict).toBe('held');
  });

  it('a rise of the VE/VCO2 slope within its band (28 → 31 = +10.7 % < +23.8 %, CV 8 %) is reproduced', () => {
    const row = find(compareMetrics(day1, day2), 've_vco2_slope');
    expect(row.deltaPct).toBeCloseTo((100 * 3) / 28, 10);
    expect(row).toMatchObject({ verdict: 'held', adverse: 'higher', adverseBeyondBand: false });
  });

  it('a rise of peak VO2 beyond the band is higher on day 2, not adverse', () => {
    const up = buildAnalysis({ peak: { vo2MlMin: 3000 } }); // +20 % over 2500 > +14.2 %
    const row = find(compareMetrics(day1, up), 'peak_vo2');
    expect(row).toMatchObject({ verdict: 'rose', adverseBeyondBand: false });
  });

  it('a wide threshold interval turns a call into undetermined, never into the opposite call', () => {
    const wide = (vo2: number) => buildAnalysis({ vt1: { vo2MlMin: vo2, workW: 100 } });
    const d1 = { ...wide(1500), vt1: { ...wide(1500).vt1, ci95Vo2MlMin: [1100, 1900] as const } };
    const d2 = { ...wide(1200), vt1: { ...wide(1200).vt1, ci95Vo2MlMin: [900, 1500] as const } };
    const row = find(compareMetrics(d1, d2), 'vt1_vo2');
    // s1 = ln(1900/1100)/3.92 = 0.1394, s2 = ln(1500/900)/3.92 = 0.1303, m = 0.1908;
    // the VT1 finding's limit = −2.152·√(0.0824² + 0.1908²) = −2.152 · 0.2078 = −0.4473 → −36.1 %;
    // r = ln 0.8 = −0.223 → not lower
    expect(row.verdict).toBe('open');
    expect(row.interval!.limitLowPct).toBeCloseTo(-36.1, 0);
  });

  it('one rule for the facets of one finding: VO2/kg at VT1 gets the call of VO2 at VT1', () => {
    // Same change (body mass unchanged: −20 %), same interval, same CV (6 %): a change between
    // the secondary 1.96 limit and the finding's 2.152 limit was once "lower" for VO2/kg and
    // "undetermined" for VO2. s = 0.05 per day, m = 0.0707: limits
    // exp(−1.96·√(0.0824² + 0.0707²)) − 1 = −19.1 % and exp(−2.152·0.10859) − 1 = −20.8 %.
    const at = (vo2: number) => {
      const a = buildAnalysis({ vt1: { vo2MlMin: vo2, vo2MlKgMin: vo2 / 70, workW: 100 } });
      return { ...a, vt1: { ...a.vt1, ci95Vo2MlMin: [vo2 * Math.exp(-1.96 * 0.05), vo2 * Math.exp(1.96 * 0.05)] as const } };
    };
    const rows = compareMetrics(at(1500), at(1500 * 0.8));
    expect(find(rows, 'vt1_vo2').interval!.limitLowPct).toBeCloseTo(-20.8, 0);
    expect(find(rows, 'vt1_vo2').verdict).toBe('open');
    expect(find(rows, 'vt1_vo2_kg').verdict).toBe(find(rows, 'vt1_vo2').verdict);
    expect(find(rows, 'vt1_vo2_kg').interval!.limitLowPct).toBeCloseTo(find(rows, 'vt1_vo2').interval!.limitLowPct, 9);
  });

  it('peak metrics are not comparable when either test was not maximal; threshold metrics still are', () => {
    const sub = buildAnalysis({ effort: 'submaximal', vt1: { vo2MlMin: 1200 } });
    const rows = compareMetrics(day1, sub);
    const peak = find(rows, 'peak_vo2');
    expect(peak.verdict).toBe('not_comparable');
    expect(peak.reason).toMatch(/day 2 effort submaximal/);
    expect(find(rows, 'duration').verdict).toBe('not_comparable');
    expect(find(rows, 'vt1_vo2').verdict).toBe('fell');
  });

  it('a threshold not found on one day makes its metrics not comparable, with the reason', () => {
    const none = buildAnalysis({ vt1: null });
    const row = find(compareMetrics(day1, none), 'vt1_vo2');
    expect(row).toMatchObject({ verdict: 'not_comparable', day2: null, delta: null });
    expect(row.reason).toMatch(/VT1 not found on day 2: no method found a breakpoint/);
  });

  it('a treadmill test has no workload in watts, and the row says so', () => {
    const tm = buildAnalysis({ metadata: { modality: 'treadmill' }, vt1: { workW: null }, peak: { workW: null } });
    const row = find(compareMetrics(tm, tm), 'vt1_work');
    expect(row.verdict).toBe('not_comparable');
    expect(row.reason).toBe('no workload in watts on day 1 (treadmill); no workload in watts on day 2 (treadmill)');
  });

  it('peak RER is an effort check: never adverse, and says so', () => {
    const lowRer = buildAnalysis({ peak: { rer: 0.9 } }); // 1.16 → 0.90 = −22.4 %, below −19.2 % (CV 8 %)
    const row = find(compareMetrics(day1, lowRer), 'peak_rer');
    expect(row.effortCheck).toBe(true);
    expect(row.verdict).toBe('fell');
    expect(row.adverseBeyondBand).toBe(false);
    expect(row.reason).toMatch(/effort check, not an outcome/);
  });

  it('VE/VCO2 and VE/VO2 at VT1 are read as VE·1000/VCO2 and VE·1000/VO2', () => {
    // fixture VT1: VE 40 L/min, VCO2 1400, VO2 1500 → 28.571 and 26.667 (by hand)
    const rows = compareMetrics(day1, day1);
    expect(find(rows, 'vt1_ve_vco2').day1).toBeCloseTo(28.571, 3);
    expect(find(rows, 'vt1_ve_vo2').day1).toBeCloseTo(26.667, 3);
    expect(find(rows, 'vt1_time').day1).toBe(600 - 180); // VT1 at 600 s, ramp from 180 s
  });

  it('lists at least the required metric ids', () => {
    const ids = compareMetrics(day1, day2).map((r) => r.id);
    for (const id of ['vt1_vo2', 'vt1_vo2_kg', 'vt1_work', 'vt1_hr', 'vt1_time', 'vt2_vo2', 'vt2_work', 'peak_vo2', 'peak_vo2_kg', 'peak_work', 'peak_hr', 'peak_rer', 've_vco2_slope', 'oues', 'duration']) {
      expect(ids).toContain(id);
    }
  });
});
