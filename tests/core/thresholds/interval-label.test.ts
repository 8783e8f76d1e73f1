// The interval's label states the held-out coverage where it fell outside 93–97 %
// (core/thresholds/interval-label.ts; figures in docs/validation.md, "The interval").
import { describe, expect, it } from 'vitest';
import { intervalLabel, MEASURED_COVERAGE_PCT } from '../../../core/thresholds/interval-label';
import { methodAwareInterval } from '../../../core/thresholds/uncertainty';
import { monotoneCurve } from '../../../core/thresholds/read-off';

describe('interval label', () => {
  it('names the measured coverage where it is outside 93–97 %', () => {
    // Held-out coverage on 504 tests per cell (docs/validation.md): VT1 usual 92.2–97.8 % → the
    // range is stated, rounded to whole percent; short ramps VT1 96.5–98.0 %, VT2 90.4–96.0 %.
    expect(MEASURED_COVERAGE_PCT.vt1.usual).toEqual([92.2, 97.8]);
    expect(intervalLabel('vt1', false)).toBe('interval (held 92–98% of generated tests)');
    expect(intervalLabel('vt1', true)).toBe('interval (held 97–98% of generated tests with short ramps)');
    expect(intervalLabel('vt2', false)).toBe('interval (held 93–98% of generated tests)');
    expect(intervalLabel('vt2', true)).toBe('interval (held 90–96% of generated tests with short ramps)');
  });
  it('says "95% interval" only where every measured figure lies in 93–97 %', () => {
    for (const id of ['vt1', 'vt2'] as const) {
      for (const short of [false, true]) {
        const [lo, hi] = MEASURED_COVERAGE_PCT[id][short ? 'short' : 'usual'];
        expect(intervalLabel(id, short) === '95% interval').toBe(lo >= 93 && hi <= 97);
      }
    }
  });
});

describe('calibrated interval', () => {
  it('scales the bootstrap and method SDs and adds a floor, by hand', () => {
    const curve = monotoneCurve([0, 100], [1000, 2000], 0, 100);
    // s_boot = (1,550 − 1,450) / 3.92 = 25.51; SD of 1,400/1,500/1,600 = 100; floor 3 % of 1,500 = 45.
    // a = 3, b = 0.5: √(76.53² + 50² + 45²) = 101.9; × 1.96 = 199.7.
    const ci = methodAwareInterval({ ci95Vo2MlMin: [1450, 1550], ci95TimeS: [45, 55], replicates: 200 }, 1500, [1400, 1500, 1600], curve, { boot: 3, methods: 0.5, floorPct: 3, shortRamp: 1 });
    expect(ci.ci95Vo2MlMin[0]).toBeCloseTo(1500 - 199.7, 0);
    expect(ci.ci95Vo2MlMin[1]).toBeCloseTo(1500 + 199.7, 0);
    expect(ci.parts?.floorSdMlMin).toBeCloseTo(45, 9);
    // The short-ramp factor multiplies the whole half-width.
    const short = methodAwareInterval({ ci95Vo2MlMin: [1450, 1550], ci95TimeS: [45, 55], replicates: 200 }, 1500, [1400, 1500, 1600], curve, { boot: 3, methods: 0.5, floorPct: 3, shortRamp: 2 }, true);
    expect(short.ci95Vo2MlMin[1] - 1500).toBeCloseTo(2 * 199.7, 0);
  });
});
