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

// The refusal's rule written out the plain way (as it was first built): a point is the text
// `VO2|VCO2|VE`, and at least half the points of the longer series occur in the other. The
// hashed table must decide exactly as this does, −0 and NaN included (their text is "0" and "NaN").
function sameByText(a: TestAnalysis['series'], b: TestAnalysis['series']): boolean {
  const key = (s: TestAnalysis['series'], i: number) => `${s.vo2MlMin[i]}|${s.vco2MlMin[i]}|${s.veLMin[i]}`;
  const seen = new Set<string>();
  for (let i = 0; i < a.vo2MlMin.length; i++) seen.add(key(a, i));
  let equal = 0;
  for (let i = 0; i < b.vo2MlMin.length; i++) if (seen.has(key(b, i))) equal++;
  return a.vo2MlMin.length > 0 && b.vo2MlMin.length > 0 && equal >= 0.5 * Math.max(a.vo2MlMin.length, b.vo2MlMin.length);
}

describe('same-series refusal decides as the text rule does', () => {
  const day1 = buildAnalysis({ sourceName: 'd1.csv' });
  const day2 = buildAnalysis({ sourceName: 'd2.csv', metadata: { testStart: '2026-03-03T10:00:00Z' } });
  const values = [0, -0, Number.NaN, 1, 2, 1.5, Infinity, -Infinity, 1e300, 5e-324];
  it('on 2,000 random small series over values that collide (−0 / 0, NaN, repeats)', () => {
    const r = seededRandom(11);
    const pick = () => values[Math.floor(r() * values.length)];
    let refused = 0;
    for (let trial = 0; trial < 2000; trial++) {
      const n1 = 1 + Math.floor(r() * 6);
      const n2 = 1 + Math.floor(r() * 6);
      const series = (n: number) => ({ vo2MlMin: Array.from({ length: n }, () => values[Math.floor(r() * 4)]), vco2MlMin: Array.from({ length: n }, () => (r() < 0.7 ? 1 : pick())), veLMin: Array.from({ length: n }, () => (r() < 0.7 ? 2 : pick())) });
      const a = { ...day1, series: { ...day1.series, ...series(n1) } };
      const b = { ...day2, series: { ...day2.series, ...series(n2) } };
      const expected = sameByText(a.series, b.series);
      expect(pairRefusals(a, b).some((x) => x.code === 'same-series')).toBe(expected);
      if (expected) refused++;
    }
    // Both outcomes occur, so the comparison is not vacuous.
    expect(refused).toBeGreaterThan(100);
    expect(refused).toBeLessThan(1900);
  });
});
