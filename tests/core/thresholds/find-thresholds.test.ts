// The entry point on the stated model of synthetic-series.ts (true VT1 1,700, VT2 2,600 mL/min).
import { describe, expect, it } from 'vitest';
import type { Phases } from '../../../core/model/analysis';
import { DEFAULT_SETTINGS } from '../../../core/model/settings';
import { findThresholds, vt1Window, vt2Bound, KINETIC_LAG_S, VT2_BOUND_MARGIN_S, WARMUP_ANCHOR_S } from '../../../core/thresholds/find-thresholds';
import type { ThresholdEstimate } from '../../../core/thresholds/detector';
import { INC_END_S, INC_START_S, TRUE_VT1_VO2, TRUE_VT2_VO2, syntheticSeries } from './synthetic-series';

const phases: Phases = { phases: [], incrementalStartS: INC_START_S, incrementalEndS: INC_END_S, rampWPerMin: 20, source: 'detected' };

describe('findThresholds', () => {
  it('finds both thresholds on the noise-free model within 3 % (the methods’ own bias, detectors.test.ts)', () => {
    const { vt1, vt2 } = findThresholds(syntheticSeries(), phases, DEFAULT_SETTINGS);
    expect(Math.abs(vt1.consensus!.vo2MlMin - TRUE_VT1_VO2) / TRUE_VT1_VO2).toBeLessThan(0.03);
    expect(Math.abs(vt2.consensus!.vo2MlMin - TRUE_VT2_VO2) / TRUE_VT2_VO2).toBeLessThan(0.03);
    expect(vt1.methods.map((m) => m.method)).toEqual(['vslope-ve', 'vslope', 'vslope-hinge', 've-vo2', 'excess-co2', 'peto2']);
    expect(vt2.methods.map((m) => m.method)).toEqual(['ve-vco2-ratio', 'petco2', 've-vs-vco2']);
  });

  it('searches VT2 after VT1 and gives intervals that contain the consensus on noisy data', () => {
    const { vt1, vt2 } = findThresholds(syntheticSeries({ noise: 0.02, seed: 5 }), phases, DEFAULT_SETTINGS);
    expect(vt2.consensus!.timeS).toBeGreaterThan(vt1.consensus!.timeS);
    for (const t of [vt1, vt2]) {
      const [lo, hi] = t.ci95Vo2MlMin!;
      expect(lo).toBeLessThanOrEqual(hi);
      expect(t.ci95TimeS![0]).toBeLessThanOrEqual(t.ci95TimeS![1]);
      expect(t.spreadVo2MlMin).toBeGreaterThanOrEqual(0);
    }
  });

  it('is deterministic: the same series and settings give the same result', () => {
    const s = syntheticSeries({ noise: 0.03, seed: 9 });
    expect(findThresholds(s, phases, DEFAULT_SETTINGS)).toEqual(findThresholds(s, phases, DEFAULT_SETTINGS));
  });

  it('returns reasons, not a crash, for a series too short to search', () => {
    const s = syntheticSeries();
    const short: Phases = { ...phases, incrementalStartS: 200, incrementalEndS: 220 };
    const { vt1, vt2 } = findThresholds(s, short, DEFAULT_SETTINGS);
    expect(vt1.consensus).toBeNull();
    expect(vt2.consensus).toBeNull();
    expect(vt1.reason).toMatch(/^No method found VT1\./);
    expect(vt1.ci95Vo2MlMin).toBeNull();
  });

  // The window rules stated in find-thresholds.ts (our choice, docs/methods.md "Search windows"),
  // checked point by point against the series' own times.
  it('VT1 window: the last minute of a warm-up joins, the first minute of the ramp is blanked', () => {
    const s = syntheticSeries();
    const withWarmup: Phases = { ...phases, phases: [{ name: 'warmup', startS: INC_START_S - 180, endS: INC_START_S }] };
    const w = vt1Window(s, withWarmup, INC_END_S);
    expect(w.fromS).toBe(INC_START_S - WARMUP_ANCHOR_S);
    expect(w.toS).toBe(INC_END_S);
    s.timeS.forEach((t, i) => {
      const blanked = t > INC_START_S && t < INC_START_S + KINETIC_LAG_S;
      expect(Number.isNaN(w.series.vo2MlMin[i])).toBe(blanked);
      expect(Number.isNaN(w.series.vco2MlMin[i])).toBe(blanked);
      if (blanked) expect(w.series.petco2Mmhg[i]).toBeNull();
    });
    // Without a warm-up phase right before the ramp, the search starts one minute in, unmasked.
    const plain = vt1Window(s, phases, INC_END_S);
    expect(plain.fromS).toBe(INC_START_S + KINETIC_LAG_S);
    expect(plain.series).toBe(s);
  });

  it('VT1 bound: the latest preliminary VT2 method plus the margin, within the phase', () => {
    const outcome = (timeS: number) => ({ method: 'm', label: 'm', source: 's', found: true as const, timeS, vo2MlMin: 2000, evidence: { xName: 't', yName: 'y', window: [0, 1] as [number, number], segments: [], residualSumSquares: 0, points: 10 } });
    const estimate = (times: number[]): ThresholdEstimate => ({ methods: times.map(outcome), consensus: null, ci95Vo2MlMin: null, ci95TimeS: null, spreadVo2MlMin: null, methodsDisagree: false, reason: null });
    // Worked by hand: latest of 500, 560, 530 s is 560; + 30 s margin = 590 s; 890 + 30 is capped at the phase end 900 s.
    expect(vt2Bound(estimate([500, 560, 530]), 900)).toBe(560 + VT2_BOUND_MARGIN_S);
    expect(vt2Bound(estimate([890]), 900)).toBe(900);
    expect(vt2Bound(estimate([]), 900)).toBeNull();
  });
});
