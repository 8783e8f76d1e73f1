// Verdicts worked by hand from the band table (Decato et al. 2018 CVs; MDC95 = 2.77 × CV,
// Weir 2005) on hand-built analyses (fixture.ts).
import { describe, expect, it } from 'vitest';
import { compareMetrics } from '../../../core/compare/metrics';
import { buildAnalysis } from './fixture';

const find = (rows: ReturnType<typeof compareMetrics>, id: string) => rows.find((r) => r.id === id)!;

describe('compareMetrics', () => {
  const day1 = buildAnalysis({ vt1: { vo2MlMin: 1500, workW: 100 } });
  const day2 = buildAnalysis({ vt1: { vo2MlMin: 1200, workW: 70 }, peak: { vo2MlMin: 2300 }, derived: { veVco2Slope: 31 } });

  it('VT1 VO2 1500 → 1200: Δ −300 mL/min, −20%; beyond ±10.4% (typical), within ±28.8% (mdc95)', () => {
    const typical = find(compareMetrics(day1, day2, 'typical'), 'vt1_vo2');
    expect(typical).toMatchObject({ day1: 1500, day2: 1200, delta: -300, verdict: 'decline', adverseBeyondBand: true });
    expect(typical.deltaPct).toBeCloseTo(-20, 10);
    expect(typical.band!.halfWidthPct).toBe(10.4);
    const mdc = find(compareMetrics(day1, day2, 'mdc95'), 'vt1_vo2');
    expect(mdc.verdict).toBe('within'); // 20 < 10.4 × 2.7719 = 28.83
    expect(mdc.band!.halfWidthPct).toBeCloseTo(28.83, 2);
  });

  it('VT1 workload 100 → 70 W: −30%, beyond the mdc95 band ±22.17% (8 × 2.77186 = 22.175, common practice CV)', () => {
    const row = find(compareMetrics(day1, day2, 'mdc95'), 'vt1_work');
    expect(row.deltaPct).toBeCloseTo(-30, 10);
    expect(row.band!.halfWidthPct).toBeCloseTo(22.175, 3);
    expect(row.verdict).toBe('decline');
  });

  it('peak VO2 2500 → 2300: −8%, beyond ±4.9% typical (Decato), within ±13.6% mdc95', () => {
    expect(find(compareMetrics(day1, day2, 'typical'), 'peak_vo2').verdict).toBe('decline');
    expect(find(compareMetrics(day1, day2, 'mdc95'), 'peak_vo2').verdict).toBe('within');
  });

  it('a rise of the VE/VCO2 slope is its adverse direction: 28 → 31 = +10.71% > 8%', () => {
    const row = find(compareMetrics(day1, day2, 'typical'), 've_vco2_slope');
    expect(row.deltaPct).toBeCloseTo((100 * 3) / 28, 10);
    expect(row).toMatchObject({ verdict: 'rise', adverse: 'higher', adverseBeyondBand: true });
  });

  it('a rise of peak VO2 is beyond the band but not adverse', () => {
    const up = buildAnalysis({ peak: { vo2MlMin: 2800 } }); // +12% over 2500
    const row = find(compareMetrics(day1, up, 'typical'), 'peak_vo2');
    expect(row).toMatchObject({ verdict: 'rise', adverseBeyondBand: false });
  });

  it('peak metrics are not comparable when either test was not maximal; threshold metrics still are', () => {
    const sub = buildAnalysis({ effort: 'submaximal', vt1: { vo2MlMin: 1200 } });
    const rows = compareMetrics(day1, sub, 'mdc95');
    const peak = find(rows, 'peak_vo2');
    expect(peak.verdict).toBe('not_comparable');
    expect(peak.reason).toMatch(/day 2 effort submaximal/);
    expect(find(rows, 'duration').verdict).toBe('not_comparable');
    expect(find(rows, 'vt1_vo2').verdict).toBe('within');
  });

  it('a threshold not found on one day makes its metrics not comparable, with the reason', () => {
    const none = buildAnalysis({ vt1: null });
    const row = find(compareMetrics(day1, none, 'mdc95'), 'vt1_vo2');
    expect(row).toMatchObject({ verdict: 'not_comparable', day2: null, delta: null });
    expect(row.reason).toMatch(/VT1 not found on day 2: no method found a breakpoint/);
  });

  it('a treadmill test has no workload in watts, and the row says so', () => {
    const tm = buildAnalysis({ metadata: { modality: 'treadmill' }, vt1: { workW: null }, peak: { workW: null } });
    const row = find(compareMetrics(tm, tm, 'mdc95'), 'vt1_work');
    expect(row.verdict).toBe('not_comparable');
    expect(row.reason).toBe('no workload in watts on day 1 (treadmill); no workload in watts on day 2 (treadmill)');
  });

  it('peak RER is an effort check: never adverse, and says so', () => {
    const lowRer = buildAnalysis({ peak: { rer: 1.0 } }); // 1.16 → 1.00 = −13.8%
    const row = find(compareMetrics(day1, lowRer, 'typical'), 'peak_rer');
    expect(row.effortCheck).toBe(true);
    expect(row.verdict).toBe('decline');
    expect(row.adverseBeyondBand).toBe(false);
    expect(row.reason).toMatch(/effort check, not an outcome/);
  });

  it('VE/VCO2 and VE/VO2 at VT1 are read as VE·1000/VCO2 and VE·1000/VO2', () => {
    // fixture VT1: VE 40 L/min, VCO2 1400, VO2 1500 → 28.571 and 26.667 (by hand)
    const rows = compareMetrics(day1, day1, 'typical');
    expect(find(rows, 'vt1_ve_vco2').day1).toBeCloseTo(28.571, 3);
    expect(find(rows, 'vt1_ve_vo2').day1).toBeCloseTo(26.667, 3);
    expect(find(rows, 'vt1_time').day1).toBe(600 - 180); // VT1 at 600 s, ramp from 180 s
  });

  it('lists at least the required metric ids', () => {
    const ids = compareMetrics(day1, day2, 'mdc95').map((r) => r.id);
    for (const id of ['vt1_vo2', 'vt1_vo2_kg', 'vt1_work', 'vt1_hr', 'vt1_time', 'vt2_vo2', 'vt2_work', 'peak_vo2', 'peak_vo2_kg', 'peak_work', 'peak_hr', 'peak_rer', 've_vco2_slope', 'oues', 'duration']) {
      expect(ids).toContain(id);
    }
  });
});
