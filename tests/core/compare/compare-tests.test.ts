// The JSON shape of the comparison (the contract) on hand-built analyses; values
// worked by hand from fixture.ts.
import { describe, expect, it } from 'vitest';
import { compareTests, comparisonJson } from '../../../core/compare/compare-tests';
import { DEFAULT_SETTINGS } from '../../../core/model/settings';
import { buildAnalysis } from './fixture';

describe('compareTests', () => {
  const day1 = buildAnalysis({ sourceName: 'd1.csv', vt1: { vo2MlMin: 1500, workW: 100 } });
  const day2 = buildAnalysis({ sourceName: 'd2.csv', metadata: { testStart: '2026-03-03T10:00:00Z' }, vt1: { vo2MlMin: 1000, workW: 60 } });
  const c = compareTests(day1, day2, DEFAULT_SETTINGS);

  it('is deterministic', () => {
    expect(JSON.stringify(comparisonJson(compareTests(day1, day2, DEFAULT_SETTINGS)))).toBe(JSON.stringify(comparisonJson(c)));
  });

  it('shapes pairing, metrics, matched workloads and summary for the CLI', () => {
    const j = comparisonJson(c) as any;
    expect(j.pairing.interval_h).toBe(25);
    expect(j.pairing.warnings).toEqual([]);
    const vt1 = j.metrics.find((m: any) => m.id === 'vt1_vo2');
    // 1500 → 1000: −500, −33.33 %; 24-h band CV 6 %: −14.91 / +17.53 % → lower on day 2
    expect(vt1).toMatchObject({ day1: 1500, day2: 1000, delta: -500, delta_pct: -33.33, band_low_pct: -14.91, band_high_pct: 17.53, verdict: 'fell', verdict_words: 'lower on day 2', primary: true });
    expect(vt1.band_source).toMatch(/^default: /);
    expect(Object.keys(vt1)).toEqual(expect.arrayContaining(['id', 'day1', 'day2', 'delta', 'delta_pct', 'band_low_pct', 'band_high_pct', 'change_interval_pct', 'band_source', 'verdict', 'reason']));
    expect(j.findings[0]).toMatchObject({ id: 'vt1', verdict: 'fell' });
    expect(j.findings[0].sentence).toMatch(/^VT1 came earlier on day 2: VO2 −33.3 %/);
    expect(Array.isArray(j.matched_workloads)).toBe(true);
    expect(j.matched_workloads[0]).toMatchObject({ work_w: 0, kind: 'step' });
    expect(j.matched_workloads_status).toMatchObject({ available: true, step_w: 10 });
    expect(j.band.retest_interval).toBe('24 h');
    expect(j.refusals).toEqual([]);
    expect(typeof j.summary).toBe('string');
  });

  it('uses a lab band when given and says so per metric', () => {
    const lab = { origin: 'lab-stated' as const, description: 'band stated by the lab: x', population: 'p', retestInterval: '24 h', statistic: 's', source: 'x', entries: { vt1_vo2: { cvPct: 15, source: 'lab audit 2025' } } };
    const row = compareTests(day1, day2, DEFAULT_SETTINGS, lab).metrics.find((m) => m.id === 'vt1_vo2')!;
    expect(row.band).toMatchObject({ origin: 'lab-stated', cvPct: 15 });
    // CV 15 %: band edge exp(−1.96·√2·ln 1.15) − 1 = −32.16 %; the VT1 finding's limit
    // exp(−2.152·√2·ln 1.15) − 1 = exp(−0.42535) − 1 = −34.65 %. −33.3 % lies between → undetermined
    expect(row.band!.lowPct).toBeCloseTo(-32.16, 1);
    expect(row.interval!.limitLowPct).toBeCloseTo(-34.65, 1);
    expect(row.verdict).toBe('open');
  });
});

describe('refusals', () => {
  const day1 = buildAnalysis({ sourceName: 'd1.csv' });
  it('refuses the same file (SHA-256) and the same series for both days', () => {
    const same = compareTests(day1, { ...day1, sourceName: 'copy.csv' }, DEFAULT_SETTINGS, undefined, { day1Sha256: 'ab'.repeat(32), day2Sha256: 'ab'.repeat(32) });
    expect(same.refusals.map((r) => r.code)).toContain('same-file');
    const series = compareTests(day1, { ...day1, sourceName: 'copy.csv' }, DEFAULT_SETTINGS);
    expect(series.refusals.map((r) => r.code)).toContain('same-series');
    expect(series.summary).toMatch(/NOT COMPARED/);
  });

  it('refuses day 2 before day 1 unless confirmed, and day metadata that contradicts the slot', () => {
    const early = buildAnalysis({ sourceName: 'd2.csv', metadata: { testStart: '2026-03-01T08:00:00Z', extra: { day: '1' } }, vt1: { vo2MlMin: 1400 } });
    const c = compareTests(day1, early, DEFAULT_SETTINGS);
    expect(c.refusals.map((r) => r.code).sort()).toEqual(['day-metadata', 'day-order']);
    const confirmed = compareTests(day1, { ...early, metadata: { ...early.metadata, extra: {} } }, DEFAULT_SETTINGS, undefined, { allowOrder: true });
    expect(confirmed.refusals).toEqual([]);
  });
});
