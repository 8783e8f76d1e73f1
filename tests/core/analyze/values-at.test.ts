// valuesAt: linear interpolation on a two-point series, values worked by hand.
import { describe, expect, it } from 'vitest';
import type { ProcessedSeries } from '../../../core/model/analysis';
import { valuesAt, valuesAtContext } from '../../../core/analyze/values-at';

const series: ProcessedSeries = {
  timeS: [100, 110, 120],
  vo2MlMin: [1000, 1200, 1300],
  vco2MlMin: [900, 1140, 1300],
  veLMin: [30, 36, 40],
  hrBpm: [120, 130, null],
  workW: [80, 90, 100],
  peto2Mmhg: [null, null, null],
  petco2Mmhg: [null, null, null],
};

describe('valuesAt', () => {
  it('interpolates halfway between two points', () => {
    // At 105 s: VO2 (1000+1200)/2 = 1100; VCO2 1020; RER 1020/1100 = 0.92727; VE 33; HR 125; work 85.
    // % of peak 1100/2200 = 50 %; % of predicted 1100/2750 = 40 %; VO2/kg 1100/55 = 20.
    const v = valuesAt(series, 105, { peakVo2MlMin: 2200, predictedPeakVo2MlMin: 2750, weightKg: 55 });
    expect(v).toMatchObject({ timeS: 105, vo2MlMin: 1100, vco2MlMin: 1020, veLMin: 33, hrBpm: 125, workW: 85, pctPeakVo2: 50, pctPredictedPeakVo2: 40, vo2MlKgMin: 20 });
    expect(v.rer).toBeCloseTo(1020 / 1100, 12);
  });

  it('gives null HR between a recorded and a missing point, and nulls without context', () => {
    const v = valuesAt(series, 115, { peakVo2MlMin: null, predictedPeakVo2MlMin: null, weightKg: null });
    expect(v.hrBpm).toBeNull();
    expect(v.vo2MlMin).toBe(1250);
    expect([v.pctPeakVo2, v.pctPredictedPeakVo2, v.vo2MlKgMin]).toEqual([null, null, null]);
  });

  it('clamps outside the series', () => {
    const ctx = { peakVo2MlMin: null, predictedPeakVo2MlMin: null, weightKg: null };
    expect(valuesAt(series, 50, ctx).vo2MlMin).toBe(1000);
    expect(valuesAt(series, 500, ctx).vo2MlMin).toBe(1300);
    expect(valuesAt(series, 120, ctx).workW).toBe(100);
  });
});

describe('valuesAtContext', () => {
  it('prefers FRIEND × body mass, else Hansen', () => {
    const peak = { vo2MlMin: 2000 } as Parameters<typeof valuesAtContext>[0];
    const both = { hrMaxBpm: 180, friendVo2MlKgMin: 30, hansenVo2MlMin: 1800, pctPredictedFriend: null, pctPredictedHansen: null };
    // FRIEND 30 mL/kg/min × 70 kg = 2100 mL/min.
    expect(valuesAtContext(peak, both, 70)).toEqual({ peakVo2MlMin: 2000, predictedPeakVo2MlMin: 2100, weightKg: 70 });
    expect(valuesAtContext(peak, { ...both, friendVo2MlKgMin: null }, 70).predictedPeakVo2MlMin).toBe(1800);
  });

  it('takes the threshold VO2 the methods found, when given, for VO2 and what derives from it', () => {
    // At 105 s with the methods' VO2 1,150: VO2/kg 1150/50 = 23; % of peak 1150/2300 = 50 %;
    // RER stays the series ratio 1020/1100; VCO2, VE, HR and work are read at 105 s as before.
    const v = valuesAt(series, 105, { peakVo2MlMin: 2300, predictedPeakVo2MlMin: null, weightKg: 50 }, 1150);
    expect(v).toMatchObject({ vo2MlMin: 1150, vo2MlKgMin: 23, pctPeakVo2: 50, vco2MlMin: 1020, veLMin: 33, hrBpm: 125, workW: 85 });
    expect(v.rer).toBeCloseTo(1020 / 1100, 12);
  });
});
