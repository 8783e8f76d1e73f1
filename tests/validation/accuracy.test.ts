// Accuracy of the whole analysis on generated tests with known ground truth: the stated
// physiological model of sample-tests/generator (VO2 first-order kinetics, VCO2 a broken line
// of VO2 at the true VT1, VE a broken line of VCO2 at the true VT2, end-tidal pressures from the
// alveolar equations, AR(1) breath noise, isolated outlier breaths). 72 tests: 3 noise levels ×
// with/without outlier breaths × cycle ramps 10/20/30 W/min and a treadmill protocol × 3 seeds.
// The requirement (thresholds work, issue 3): VT1 VO2 median absolute error ≤ 3 % and 95th
// percentile ≤ 8 %; VT2 ≤ 4 % and ≤ 10 %. docs/validation.md has the figures per condition.
//
// Requirements not yet met are written as `it.fails`: they pass while the detectors fall short
// and fail as soon as they meet the requirement, to be turned into plain tests then. The
// regression guards hold the figures measured on 2026-12-01 (docs/validation.md, "VT1 window
// and reported VO2") with a small margin. tests/validation/information-limit.test.ts shows why
// the VT1 p95 cannot reach 8 % on this grid: an oracle told the noise-free VO2 and the true
// window reaches only p95 21 %.
import { describe, expect, it } from 'vitest';
import { runCases, summarise } from './measure';

const results = runCases(3);
const s = summarise(results);

describe('threshold accuracy on 72 generated tests (full pipeline, default settings)', () => {
  it('covers at least 30 seeds across the stated conditions', () => {
    expect(s.n).toBe(72);
    expect(new Set(results.map((r) => r.c.seed)).size).toBe(72);
  });

  it('meets the VT2 median requirement: ≤ 4 %', () => {
    expect(s.vt2Median).toBeLessThanOrEqual(4);
  });

  it.fails('VT1 median ≤ 3 % (requirement; not met: measured 4.9 %)', () => {
    expect(s.vt1Median).toBeLessThanOrEqual(3);
  });

  it.fails('VT1 95th percentile ≤ 8 % (requirement; not met: measured 16.5 %, the oracle 21.0 %)', () => {
    expect(s.vt1P95).toBeLessThanOrEqual(8);
  });

  it('meets the VT2 95th percentile requirement: ≤ 10 % (measured 9.5 %)', () => {
    expect(s.vt2P95).toBeLessThanOrEqual(10);
  });

  it('regression guard: no worse than measured (VT1 4.9 / 16.5 %, VT2 2.4 / 9.5 %, no misses)', () => {
    expect(s.vt1Median).toBeLessThanOrEqual(5.2);
    expect(s.vt1P95).toBeLessThanOrEqual(17.5);
    expect(s.vt2Median).toBeLessThanOrEqual(2.7);
    expect(s.vt1Misses + s.vt2Misses).toBe(0);
  });

  it('95 % interval coverage of the true VO2 (measured VT1 90.3 %, VT2 81.9 %; common practice: near 95 %)', () => {
    expect(s.vt1CoveragePct).toBeGreaterThanOrEqual(88);
    expect(s.vt2CoveragePct).toBeGreaterThanOrEqual(78);
  });

  it('VT1 interval is narrower than before the robust method spread (median width 23.3 % of VO2, was 35.7 %)', () => {
    expect(s.vt1CiWidthPct).toBeLessThanOrEqual(25);
  });

  it('is near-exact at the lowest noise for VT2 (noise ×0.5: median ≤ 2 %)', () => {
    const low = summarise(results.filter((r) => r.c.noiseScale === 0.5));
    expect(low.vt2Median).toBeLessThanOrEqual(2);
  });
});
