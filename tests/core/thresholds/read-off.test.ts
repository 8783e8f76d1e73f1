// Pool-adjacent-violators (Ayer et al., Ann Math Stat 1955;26:641–7): worked by hand below.
import { describe, expect, it } from 'vitest';
import { monotoneCurve, timeAtValue, valueAtTime } from '../../../core/thresholds/read-off';

describe('monotoneCurve', () => {
  it('pools a falling pair into its mean, placed at the pair’s mean time', () => {
    // 1, 3, 2, 4 at t = 0, 1, 2, 3: 3 > 2 violates order → pooled to 2.5 at t = 1.5 (by hand).
    const c = monotoneCurve([0, 1, 2, 3], [1, 3, 2, 4], 0, 3);
    expect(Array.from(c.timeS)).toEqual([0, 1.5, 3]);
    expect(Array.from(c.value)).toEqual([1, 2.5, 4]);
  });

  it('leaves out points outside the window and non-finite values', () => {
    const c = monotoneCurve([0, 1, 2, 3, 4], [1, Number.NaN, 2, 3, 9], 0.5, 3.5);
    expect(Array.from(c.timeS)).toEqual([2, 3]);
  });
});

describe('reading off', () => {
  const c = monotoneCurve([0, 10, 20], [1000, 1200, 1600], 0, 20);
  it('interpolates the value at a time: t = 15 s → 1,400 mL/min (halfway 1,200 → 1,600)', () => {
    expect(valueAtTime(c, 15)).toBeCloseTo(1400, 10);
  });
  it('interpolates the time at a value: 1,300 mL/min → 12.5 s (a quarter of 10 → 20 s)', () => {
    expect(timeAtValue(c, 1300)).toBeCloseTo(12.5, 10);
  });
  it('clamps to the ends and gives NaN for an empty curve', () => {
    expect(timeAtValue(c, 5000)).toBe(20);
    expect(valueAtTime(c, -5)).toBe(1000);
    expect(timeAtValue(monotoneCurve([], [], 0, 1), 1)).toBeNaN();
  });
});
