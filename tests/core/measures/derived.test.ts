// Derived measures on data built from known lines; OLS cross-checked by solving the normal
// equations with mathjs (a general linear-algebra library).
import { describe, expect, it } from 'vitest';
import { lusolve } from 'mathjs';
import type { ProcessedSeries } from '../../../core/model/analysis';
import { breathingReserve, dVo2dWr, hrReserve, mvvLMin, oues, veVco2Slope, weberClass } from '../../../core/measures/derived';
import { normalRandom, seededRandom } from '../../../core/math/random';

/** A series of n points, 5 s apart, from per-point values. */
function series(n: number, f: (i: number) => { vo2: number; vco2: number; ve: number; work?: number }): ProcessedSeries {
  const pts = Array.from({ length: n }, (_, i) => f(i));
  return {
    timeS: pts.map((_, i) => i * 5),
    vo2MlMin: pts.map((p) => p.vo2),
    vco2MlMin: pts.map((p) => p.vco2),
    veLMin: pts.map((p) => p.ve),
    hrBpm: pts.map(() => null),
    workW: pts.map((p) => p.work ?? null),
    peto2Mmhg: pts.map(() => null),
    petco2Mmhg: pts.map(() => null),
  };
}

describe('OUES (Baba et al., JACC 1996;28:1567–72)', () => {
  it('recovers b exactly when VO2 = a + b·log10 VE', () => {
    // VO2 = 300 + 1800·log10(VE) for VE from 20 to 100 L/min → OUES = 1800 by construction.
    const s = series(81, (i) => ({ ve: 20 + i, vo2: 300 + 1800 * Math.log10(20 + i), vco2: 1000 }));
    expect(oues(s, { fromS: 0, toS: 400 })).toBeCloseTo(1800, 8);
  });

  it('agrees with the normal equations solved by mathjs on noisy data', () => {
    const noise = normalRandom(seededRandom(7));
    const s = series(120, (i) => ({ ve: 15 + i * 0.8, vo2: 200 + 2000 * Math.log10(15 + i * 0.8) + 40 * noise(), vco2: 1000 }));
    const x = s.veLMin.map(Math.log10);
    const y = s.vo2MlMin;
    const sum = (v: readonly number[]) => v.reduce((a, b) => a + b, 0);
    // [n Σx; Σx Σx²] [a; b] = [Σy; Σxy]
    const solution = lusolve([[x.length, sum(x)], [sum(x), sum(x.map((v) => v * v))]], [sum(y), sum(x.map((v, i) => v * y[i]))]) as number[][];
    expect(oues(s, { fromS: 0, toS: 1e9 })).toBeCloseTo(solution[1][0], 6);
  });
});

describe('VE/VCO2 slope (ATS/ACCP 2003)', () => {
  it('fits only up to VT2', () => {
    // VE = 5 + 28·VCO2(L/min) until 300 s (point 60), then 5 + 28·VCO2 + 60·(VCO2 − VCO2 at 300 s):
    // the slope to VT2 is 28; over the whole test it would be steeper.
    const s = series(100, (i) => {
      const vco2L = 0.5 + i * 0.03;
      const knee = 0.5 + 60 * 0.03;
      return { vo2: 1000, vco2: vco2L * 1000, ve: 5 + 28 * vco2L + (i > 60 ? 60 * (vco2L - knee) : 0) };
    });
    expect(veVco2Slope(s, { fromS: 0, toS: 300 })).toBeCloseTo(28, 9);
    expect(veVco2Slope(s, { fromS: 0, toS: 495 })!).toBeGreaterThan(35);
  });
});

describe('ΔVO2/ΔWR', () => {
  it('is the slope of VO2 on work: VO2 = 500 + 10·W → 10 mL/min/W', () => {
    const s = series(60, (i) => ({ work: 20 + i * 2, vo2: 500 + 10 * (20 + i * 2), vco2: 1000, ve: 30 }));
    expect(dVo2dWr(s, { fromS: 60, toS: 295 })).toBeCloseTo(10, 9);
  });
});

describe('breathing reserve, HR reserve', () => {
  it('MVV = FEV1 × 40 (common practice): FEV1 3.0 L → 120 L/min; reserve 120 − 90 = 30 L/min, 25 %', () => {
    expect(mvvLMin(null, 3.0)).toBe(120);
    expect(mvvLMin(140, 3.0)).toBe(140);
    expect(breathingReserve(120, 90)).toEqual({ lMin: 30, pct: 25 });
    expect(breathingReserve(null, 90)).toEqual({ lMin: null, pct: null });
  });
  it('HR reserve = predicted HRmax − peak HR: 180 − 165 = 15 bpm', () => {
    expect(hrReserve(180, 165)).toBe(15);
    expect(hrReserve(null, 165)).toBeNull();
  });
});

describe('Weber class (Weber et al., Circulation 1982)', () => {
  it('17.0 → B, and the boundaries A > 20, B 16–20, C 10–16, D < 10', () => {
    expect(weberClass(17.0)).toBe('B');
    expect([20.1, 20, 16, 15.9, 10, 9.9].map(weberClass)).toEqual(['A', 'B', 'B', 'C', 'C', 'D']);
    expect(weberClass(null)).toBeNull();
  });
});
