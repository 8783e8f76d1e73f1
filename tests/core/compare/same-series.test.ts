// The "same breath series" refusal matches VO2, VCO2 and VE jointly. Two different long tests
// whose whole-number VO2 and VCO2 values share a narrow range repeat each other's values one
// variable at a time (every value of 500–1499 mL/min occurs in both), yet are different tests;
// a copy of one test is still refused.
import { describe, expect, it } from 'vitest';
import { pairRefusals } from '../../../core/compare/refusals';
import { seededRandom } from '../../../core/math/random';
import type { TestAnalysis } from '../../../core/model/analysis';
import { buildAnalysis } from './fixture';

function withSeries(base: TestAnalysis, seed: number, n: number, sourceName: string): TestAnalysis {
  const r = seededRandom(seed);
  const vo2 = Array.from({ length: n }, () => 500 + Math.floor(1000 * r()));
  const vco2 = vo2.map((v) => Math.round(v * (0.85 + 0.2 * r())));
  const ve = vo2.map((v) => Math.round((v / 40) * (0.9 + 0.2 * r()) * 10) / 10);
  return { ...base, sourceName, series: { ...base.series, vo2MlMin: vo2, vco2MlMin: vco2, veLMin: ve } };
}

describe('same-series refusal', () => {
  const day1 = buildAnalysis({ sourceName: 'd1.csv' });
  const day2 = buildAnalysis({ sourceName: 'd2.csv', metadata: { testStart: '2026-03-03T10:00:00Z' } });
  const n = 100_000;
  const a = withSeries(day1, 1, n, 'a.csv');
  const b = withSeries(day2, 2, n, 'b.csv');

  it('per variable, the two long series share nearly every value (the old test would have refused them)', () => {
    const seen = new Set(a.series.vo2MlMin);
    const shared = b.series.vo2MlMin.filter((v) => seen.has(v)).length / n;
    expect(shared).toBeGreaterThan(0.99);
  });
  it('two different long tests are not refused as the same series', () => {
    expect(pairRefusals(a, b).map((x) => x.code)).not.toContain('same-series');
  });
  it('a copy of one test under another name is refused', () => {
    const copy = { ...b, series: a.series };
    expect(pairRefusals(a, copy).map((x) => x.code)).toContain('same-series');
  });
});
