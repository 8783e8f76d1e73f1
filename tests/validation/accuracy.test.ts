// Accuracy of the whole analysis (default settings) on held-out generated tests of two
// independently built physiological models with known thresholds: family 1
// (sample-tests/generator: first-order VO2, broken-line VCO2 and VE, AR(1) breath noise) and
// family B (sample-tests/kinetic-family: VCO2 lagging VO2, smooth transitions, broad VE/VCO2
// nadir, drift, outliers). Each family in two conditions, reported separately: main (8–12 min
// incremental phases) and hard (5–8 min, or very noisy). Seeds: held out (tests/validation/
// heldout.ts); tuning used only the development seeds.
//
// The requirement (issue 10; anchor: physician-versus-physician agreement of 0 ± 8 %,
// Kaczmarek et al., Multidiscip Respir Med 2019), on the main grid of both families:
// VT1 median |error| ≤ 3 %, p95 ≤ 10 %, median signed error within ±1.5 %; VT2 ≤ 3 %, ≤ 8 %,
// ±1.5 %; work rate at VT1 and VT2 (cycle tests) median ≤ 4 %, p95 ≤ 12 %; the threshold
// interval covers the truth in 93–97 % of tests in every family and condition.
// Every requirement met on the held-out seeds is a plain assertion below. An unmet one is not
// asserted as a requirement (it would fail); it is a regression guard whose name carries the
// measured held-out figure and says "not the requirement", with a round bound above that figure.
// The figures are written in docs/validation.md ("Against the requirement").
import { describe, expect, it } from 'vitest';
import { heldOutSets } from './heldout';
import { measureAll, summarise, type Summary } from './measure';

const results = new Map<string, Summary>();
for (const set of heldOutSets()) results.set(set.name, summarise(measureAll(set.cases)));
const s = (name: string): Summary => {
  const v = results.get(name);
  if (!v) throw new Error(`no held-out set ${name}`);
  return v;
};

describe('held-out sets', () => {
  it('hold 72 tests each, every threshold found in the main grids', () => {
    for (const name of ['family 1, main', 'family 1, hard', 'family B, main', 'family B, hard']) expect(s(name).n).toBe(72);
    for (const name of ['family 1, main', 'family B, main']) expect(s(name).vt1Misses + s(name).vt2Misses).toBe(0);
  });
});

describe('family 1, main grid (requirements met)', () => {
  const m = () => s('family 1, main');
  it('VT1 median |error| ≤ 3 %', () => expect(m().vt1Median).toBeLessThanOrEqual(3));
  it('VT1 median signed error within ±1.5 %', () => expect(Math.abs(m().vt1Bias)).toBeLessThanOrEqual(1.5));
  it('VT2 median |error| ≤ 3 %', () => expect(m().vt2Median).toBeLessThanOrEqual(3));
  it('VT2 p95 ≤ 8 %', () => expect(m().vt2P95).toBeLessThanOrEqual(8));
  it('VT2 median signed error within ±1.5 %', () => expect(Math.abs(m().vt2Bias)).toBeLessThanOrEqual(1.5));
  it('work rate at VT2: median ≤ 4 %, p95 ≤ 12 %', () => {
    expect(m().cycleN).toBeGreaterThanOrEqual(40);
    expect(m().work2Median).toBeLessThanOrEqual(4);
    expect(m().work2P95).toBeLessThanOrEqual(12);
  });
});

describe('family B, main grid (requirements met)', () => {
  const m = () => s('family B, main');
  it('VT2 median |error| ≤ 3 %', () => expect(m().vt2Median).toBeLessThanOrEqual(3));
  it('VT2 median signed error within ±1.5 %', () => expect(Math.abs(m().vt2Bias)).toBeLessThanOrEqual(1.5));
  it('work rate at VT2: median ≤ 4 %, p95 ≤ 12 %', () => {
    expect(m().cycleN).toBeGreaterThanOrEqual(30);
    expect(m().work2Median).toBeLessThanOrEqual(4);
    expect(m().work2P95).toBeLessThanOrEqual(12);
  });
  it('VT2 interval covers the truth in 93–97 % of tests', () => {
    expect(m().vt2CoveragePct).toBeGreaterThanOrEqual(93);
    expect(m().vt2CoveragePct).toBeLessThanOrEqual(97);
  });
});

describe('family B, hard condition (requirements met)', () => {
  const h = () => s('family B, hard');
  it('VT1 interval covers the truth in 93–97 % of tests', () => {
    expect(h().vt1CoveragePct).toBeGreaterThanOrEqual(93);
    expect(h().vt1CoveragePct).toBeLessThanOrEqual(97);
  });
});

describe('bounds that are not the requirement (regression guards, round figures)', () => {
  it('interval coverage VT1 100 / 100 / 97.2 / 94.4 %, VT2 98.6 / 97.2 / 95.8 / 88.9 % (family 1 main, hard, family B main, hard; requirement 93–97 %, met for family B main VT2 and hard VT1 only): guard ≥ 85 % everywhere, not the requirement', () => {
    for (const r of results.values()) {
      expect(r.vt1CoveragePct).toBeGreaterThanOrEqual(85);
      expect(r.vt2CoveragePct).toBeGreaterThanOrEqual(85);
    }
  });
  // Each unmet accuracy target, with the held-out figure measured on 2026-12-02 in its name
  // (docs/validation.md): a round bound above it, so that a regression fails; none of these
  // bounds is the requirement.
  it('family B VT1 median |error| 4.1 % (requirement ≤ 3 %, not met): guard ≤ 5 %, not the requirement', () =>
    expect(s('family B, main').vt1Median).toBeLessThanOrEqual(5));
  it('VT1 p95 10.7 % (family 1) and 10.8 % (family B) (requirement ≤ 10 %, not met): guard ≤ 12 %, not the requirement', () => {
    for (const name of ['family 1, main', 'family B, main']) expect(s(name).vt1P95).toBeLessThanOrEqual(12);
  });
  it('family B VT1 median signed error −1.7 % (requirement within ±1.5 %, not met): guard within ±2.5 %, not the requirement', () =>
    expect(Math.abs(s('family B, main').vt1Bias)).toBeLessThanOrEqual(2.5));
  it('family B VT2 p95 8.4 % (requirement ≤ 8 %, not met): guard ≤ 10 %, not the requirement', () =>
    expect(s('family B, main').vt2P95).toBeLessThanOrEqual(10));
  it('work rate at VT1 median 4.1 % (family 1) and 5.9 % (family B) (requirement ≤ 4 %, not met): guard ≤ 7 %, not the requirement', () => {
    for (const name of ['family 1, main', 'family B, main']) expect(s(name).work1Median).toBeLessThanOrEqual(7);
  });
  it('work rate at VT1 p95 23.1 % (family 1) and 18.8 % (family B) (requirement ≤ 12 %, not met): guard ≤ 30 %, not the requirement', () => {
    for (const name of ['family 1, main', 'family B, main']) expect(s(name).work1P95).toBeLessThanOrEqual(30);
  });
});
