// Averaging on small inputs worked by hand (each expected value computed in the comment).
import { describe, expect, it } from 'vitest';
import { breath, type Breath } from '../../../core/model/breath-table';
import { averageBreaths, interpolateToGrid, rollingBreathMean, rollingTimeMean, timeBinMean } from '../../../core/clean/averaging';

const at = (timeS: number, vo2MlMin: number, hrBpm: number | null = null): Breath =>
  breath({ timeS, vo2MlMin, vco2MlMin: vo2MlMin * 0.9, veLMin: vo2MlMin / 40, hrBpm });

describe('rollingBreathMean', () => {
  it('averages three breaths centred on each, fewer at the ends', () => {
    // (1000+1100)/2 = 1050; (1000+1100+1300)/3 = 1133.33; (1100+1300)/2 = 1200.
    const s = rollingBreathMean([at(0, 1000), at(3, 1100), at(6, 1300)], 3);
    expect(s.vo2MlMin[0]).toBeCloseTo(1050, 9);
    expect(s.vo2MlMin[1]).toBeCloseTo(1133.3333, 3);
    expect(s.vo2MlMin[2]).toBeCloseTo(1200, 9);
    expect(s.timeS[1]).toBeCloseTo(3, 9);
  });
});

describe('rollingTimeMean', () => {
  it('averages the breaths within ± half the window', () => {
    // Window 10 s (± 5 s): at 0 s → breaths 0, 5 → 1100; at 5 s → 0, 5, 10 → 1200;
    // at 10 s → 5, 10 → 1300; at 20 s → 20 alone → 2000.
    const s = rollingTimeMean([at(0, 1000), at(5, 1200), at(10, 1400), at(20, 2000)], 10);
    expect(s.vo2MlMin.map((v) => Math.round(v * 1e6) / 1e6)).toEqual([1100, 1200, 1300, 2000]);
    expect(s.timeS).toEqual([0, 5, 10, 20]);
  });

  it('averages HR over the breaths that recorded it and gives null where none did', () => {
    // At 0 s: HR of breaths 0 (100) and 5 (null) → 100; at 20 s: only breath 20 (null) → null.
    const s = rollingTimeMean([at(0, 1000, 100), at(5, 1200, null), at(10, 1400, 110), at(20, 2000, null)], 10);
    expect(s.hrBpm).toEqual([100, 105, 110, null]);
  });
});

describe('timeBinMean', () => {
  it('gives one point per non-empty bin, at the midpoint', () => {
    // 10 s bins: [0,10) holds 1 s and 4 s → (1000+1200)/2 = 1100 at 5 s; [10,20) holds 12 s and
    // 19 s → (1400+1600)/2 = 1500 at 15 s; [20,30) holds 25 s → 1800 at 25 s.
    const s = timeBinMean([at(1, 1000), at(4, 1200), at(12, 1400), at(19, 1600), at(25, 1800)], 10);
    expect(s.timeS).toEqual([5, 15, 25]);
    expect(s.vo2MlMin).toEqual([1100, 1500, 1800]);
    expect(s.vco2MlMin[0]).toBeCloseTo(990, 9);
  });
});

describe('averageBreaths', () => {
  it('dispatches on the spec kind', () => {
    const breaths = [at(0, 1000), at(3, 1100), at(6, 1300)];
    expect(averageBreaths(breaths, { kind: 'rolling-breaths', breaths: 3 })).toEqual(rollingBreathMean(breaths, 3));
    expect(averageBreaths(breaths, { kind: 'time-bins', binS: 5 }).timeS).toEqual([2.5, 7.5]);
  });
});

describe('interpolateToGrid', () => {
  it('interpolates linearly onto a 1 s grid', () => {
    // 0 s → 1000, 2 s → 1200: the 1 s point is halfway, 1100.
    const s = interpolateToGrid(rollingBreathMean([at(0, 1000, 100), at(2, 1200, 120)], 1), 1);
    expect(s.timeS).toEqual([0, 1, 2]);
    expect(s.vo2MlMin).toEqual([1000, 1100, 1200]);
    expect(s.hrBpm).toEqual([100, 110, 120]);
  });

  it('leaves HR null between a recorded and a missing point', () => {
    const s = interpolateToGrid(rollingBreathMean([at(0, 1000, 100), at(2, 1200, null)], 1), 1);
    expect(s.hrBpm).toEqual([100, null, null]);
  });
});
