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
    // 1500 → 1000: −500, −33.33%; band 10.4 × 2.77186 = 28.83% → decline
    expect(vt1).toMatchObject({ day1: 1500, day2: 1000, delta: -500, delta_pct: -33.33, band_pct: 28.83, verdict: 'decline' });
    expect(vt1.band_source).toMatch(/^default: Decato/);
    expect(Object.keys(vt1)).toEqual(expect.arrayContaining(['id', 'day1', 'day2', 'delta', 'delta_pct', 'band_pct', 'band_source', 'verdict', 'reason']));
    expect(Array.isArray(j.matched_workloads)).toBe(true);
    expect(j.matched_workloads[0]).toMatchObject({ work_w: 0, kind: 'step' });
    expect(j.matched_workloads_status).toMatchObject({ available: true, step_w: 10 });
    expect(j.band.kind).toBe('mdc95');
    expect(typeof j.summary).toBe('string');
  });

  it('uses a lab band when given and says so per metric', () => {
    const lab = { origin: 'lab-stated' as const, description: 'band stated by the lab: x', entries: { vt1_vo2: { cvPct: 15, source: 'lab audit 2025' } } };
    const row = compareTests(day1, day2, DEFAULT_SETTINGS, lab).metrics.find((m) => m.id === 'vt1_vo2')!;
    expect(row.band).toMatchObject({ origin: 'lab-stated', cvPct: 15 });
    expect(row.band!.halfWidthPct).toBeCloseTo(41.578, 3); // 15 × 2.77186
    expect(row.verdict).toBe('within'); // 33.3% < 41.6%
  });
});
