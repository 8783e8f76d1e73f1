// The bootstrap interval (percentile bootstrap, Efron & Tibshirani 1993; moving blocks, Künsch,
// Ann Stat 1989) on the stated model of synthetic-series.ts, whose true VT1 is 1,700 mL/min.
import { describe, expect, it } from 'vitest';
import { DEFAULT_SETTINGS, type Settings } from '../../../core/model/settings';
import { median } from '../../../core/math/stats';
import type { DetectorInput } from '../../../core/thresholds/detector';
import { VT1_METHODS } from '../../../core/thresholds/methods';
import { vo2Curve } from '../../../core/thresholds/read-off';
import { blockLength, combinationInterval, methodAwareInterval, methodReplicates, methodSpread } from '../../../core/thresholds/uncertainty';
import { monotoneCurve } from '../../../core/thresholds/read-off';
import { INC_START_S, TRUE_VT1_VO2, TRUE_VT2_VO2, syntheticSeries, timeAtVo2 } from './synthetic-series';

function interval(noise: number, seed: number, settings: Settings = DEFAULT_SETTINGS) {
  const series = syntheticSeries({ noise, seed });
  const input: DetectorInput = { series, fromS: INC_START_S, toS: timeAtVo2(TRUE_VT2_VO2), settings };
  const outcomes = VT1_METHODS.filter((m) => m.method.startsWith('vslope')).map((m) => m.detect(input));
  const reps = methodReplicates(outcomes, input, 1);
  return reps ? combinationInterval(reps, median, vo2Curve(series, input.fromS, input.toS)) : null;
}

describe('blockLength', () => {
  it('is 1 for residuals that alternate in sign (lag-1 autocorrelation −1)', () => {
    expect(blockLength([1, -1, 1, -1, 1, -1, 1, -1])).toBe(1);
  });
  it('is 2 for residuals in runs of three (+1,+1,+1,−1,−1,−1,…; 60 values)', () => {
    // By hand: lag 1 has 59 pairs, 19 across run boundaries → (40 − 19) / 60 = 0.35 ≥ 0.1;
    // lag 2 has 58 pairs, 38 across boundaries → (20 − 38) / 60 = −0.3 < 0.1 → block length 2.
    const r = Array.from({ length: 60 }, (_, i) => (Math.floor(i / 3) % 2 === 0 ? 1 : -1));
    expect(blockLength(r)).toBe(2);
  });
});

describe('bootstrap interval of VT1', () => {
  it('is the same for the same seed (reproducible from the settings)', () => {
    expect(interval(0.02, 4)).toEqual(interval(0.02, 4));
  });

  it('changes with the bootstrap seed', () => {
    const other = { ...DEFAULT_SETTINGS, thresholds: { ...DEFAULT_SETTINGS.thresholds, bootstrap: { replicates: 200, seed: 7 } } };
    expect(interval(0.02, 4, other)?.ci95Vo2MlMin).not.toEqual(interval(0.02, 4)?.ci95Vo2MlMin);
  });

  it('widens with noise: 4 % noise gives a wider interval than 1 %', () => {
    const narrow = interval(0.01, 2)!.ci95Vo2MlMin;
    const wide = interval(0.04, 2)!.ci95Vo2MlMin;
    expect(wide[1] - wide[0]).toBeGreaterThan(narrow[1] - narrow[0]);
  });

  it('covers the true VT1 in most of 20 noisy seeds (a 95 % interval should, ≥ 15 of 20)', () => {
    let covered = 0;
    for (let seed = 1; seed <= 20; seed++) {
      const ci = interval(0.02, seed)!.ci95Vo2MlMin;
      if (ci[0] <= TRUE_VT1_VO2 && TRUE_VT1_VO2 <= ci[1]) covered++;
    }
    expect(covered).toBeGreaterThanOrEqual(15);
  });

  it('reports the time interval at the VO2 limits (linear model ramp: t = 120 + (VO2 − 800) × 0.3 s)', () => {
    const ci = interval(0.02, 3)!;
    // The series is noisy, so the monotone curve is only close to the model's ramp: within 10 s.
    expect(Math.abs(ci.ci95TimeS[0] - timeAtVo2(ci.ci95Vo2MlMin[0]))).toBeLessThan(10);
    expect(Math.abs(ci.ci95TimeS[1] - timeAtVo2(ci.ci95Vo2MlMin[1]))).toBeLessThan(10);
  });
});

describe('the between-method spread and the reported interval (worked by hand)', () => {
  it('takes the scaled MAD from five estimates, so one far method does not widen it alone', () => {
    // 1,000, 1,020, 1,040, 1,060, 1,400: median 1,040, |deviations| 40, 20, 0, 20, 360 → MAD 20 → 1.4826 · 20 = 29.652.
    expect(methodSpread([1000, 1020, 1040, 1060, 1400])).toBeCloseTo(29.652, 9);
  });

  it('takes the sample SD from fewer than five estimates, and 0 from one', () => {
    expect(methodSpread([1400, 1500, 1600])).toBeCloseTo(100, 9);
    expect(methodSpread([1500])).toBe(0);
  });

  it('adds the bootstrap and the spread in quadrature about the consensus', () => {
    // s_boot = (1,550 − 1,450) / 3.92 = 25.510; s_methods = 100; half = 1.96 · √(25.510² + 100²) = 1.96 · 103.20 = 202.28.
    const curve = monotoneCurve([0, 1000], [0, 3000], 0, 1000);
    const ci = methodAwareInterval({ ci95Vo2MlMin: [1450, 1550], ci95TimeS: [0, 0], replicates: 200 }, 1500, [1400, 1500, 1600], curve);
    const half = 1.96 * Math.sqrt((100 / 3.92) ** 2 + 100 ** 2);
    expect(ci.ci95Vo2MlMin[0]).toBeCloseTo(1500 - half, 9);
    expect(ci.ci95Vo2MlMin[1]).toBeCloseTo(1500 + half, 9);
    expect(half).toBeCloseTo(202.28, 2); // → 1,297.72–1,702.28 mL/min
  });
});

