// The bootstrap interval (percentile bootstrap, Efron et al. 1993; moving blocks, Künsch,
// Ann Stat 1989) on the stated model of synthetic-series.ts, whose true VT1 is 1,700 mL/min.
import { describe, expect, it } from 'vitest';
import { DEFAULT_SETTINGS, type Settings } from '../../../core/model/settings';
import { median } from '../../../core/math/stats';
import type { DetectorInput } from '../../../core/thresholds/detector';
import { VT1_METHODS } from '../../../core/thresholds/methods';
import { vo2Curve } from '../../../core/thresholds/read-off';
import { blockLength, combinationInterval, intervalIsStable, methodAwareInterval, methodReplicates, methodSpread } from '../../../core/thresholds/uncertainty';
import { hingeFit, preparePoints } from '../../../core/thresholds/segments';
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


describe('the bootstrap does only the work asked of it (issue 14)', () => {
  const noisy = () => {
    const series = syntheticSeries({ noise: 0.02, seed: 4 });
    return { series, input: { series, fromS: INC_START_S, toS: timeAtVo2(TRUE_VT2_VO2), settings: DEFAULT_SETTINGS } as DetectorInput };
  };
  const withBootstrap = (bootstrap: Settings['thresholds']['bootstrap']): Settings => ({ ...DEFAULT_SETTINGS, thresholds: { ...DEFAULT_SETTINGS.thresholds, bootstrap } });

  it('with the bootstrap off, reads nothing but the settings (no refit, no block length)', () => {
    const { input } = noisy();
    const outcomes = VT1_METHODS.filter((m) => m.method.startsWith('vslope')).map((m) => m.detect(input));
    expect(outcomes.some((o) => o.found)).toBe(true);
    const settings = withBootstrap({ ...DEFAULT_SETTINGS.thresholds.bootstrap, replicates: 0 });
    // Any read of the series (which every refit needs) throws.
    const guarded = new Proxy({ ...input, settings }, {
      get(target, key) {
        if (key !== 'settings') throw new Error(`bootstrap off, yet it read input.${String(key)}`);
        return Reflect.get(target, key);
      },
    });
    expect(methodReplicates(outcomes, guarded, 1)).toBeNull();
  });

  it('draws every replicate without the early stop, and stops at a check (a multiple of 50) with it', () => {
    const { input } = noisy();
    const outcomes = VT1_METHODS.filter((m) => m.method.startsWith('vslope')).map((m) => m.detect(input));
    const all = methodReplicates(outcomes, { ...input, settings: withBootstrap({ replicates: 200, seed: 20260101 }) }, 1)!;
    expect(all.replicates).toHaveLength(200);
    const early = methodReplicates(outcomes, { ...input, settings: withBootstrap({ replicates: 200, seed: 20260101, checkEvery: 50, stableWithinPct: 100 }) }, 1)!;
    // With a tolerance of the whole width the second check (100 replicates) always stops it.
    expect(early.replicates).toHaveLength(100);
    // The early replicates are the first ones of the full run: same seed, same draws.
    expect(early.replicates).toEqual(all.replicates.slice(0, 100));
  });

  it('stops only when both ends moved by at most the tolerance (share of the newer width)', () => {
    // Width 100: tolerance 5 % = 5 mL/min.
    expect(intervalIsStable([1000, 1100], [1004, 1100], 5)).toBe(true);
    expect(intervalIsStable([1000, 1100], [1000, 1106], 5)).toBe(false);
    expect(intervalIsStable([1000, 1100], [1006, 1106], 5)).toBe(false);
  });

  it('fits the same knot whatever fixed value the y sums are centred on (the one-pass resample relies on it)', () => {
    const x = Array.from({ length: 80 }, (_, i) => 500 + 20 * i + (i % 3));
    const y = x.map((v, i) => 0.9 * v + 0.5 * Math.max(0, v - 1300) + ((i * 37) % 11) - 5);
    const p = preparePoints(x, y, true);
    const shift = 123.4;
    const sy = new Float64Array(p.sy.length);
    const sxy = new Float64Array(p.sy.length);
    const syy = new Float64Array(p.sy.length);
    for (let i = 0; i < x.length; i++) {
      const cy = p.y[i] - (p.my + shift);
      sy[i + 1] = sy[i] + cy;
      sxy[i + 1] = sxy[i] + (p.x[i] - p.mx) * cy;
      syy[i + 1] = syy[i] + cy * cy;
    }
    const q = { ...p, my: p.my + shift, sy, sxy, syy };
    const a = hingeFit(p, 5)!;
    const b = hingeFit(q, 5)!;
    expect(b.knot).toBeCloseTo(a.knot, 6);
    expect(b.intercept).toBeCloseTo(a.intercept, 6);
    expect(b.rss).toBeCloseTo(a.rss, 4);
  });
});
