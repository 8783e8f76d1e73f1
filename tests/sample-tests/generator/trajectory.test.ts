// The noise-free model against its own stated equations and first-order-system arithmetic
// (worked by hand in each comment), and against the textbook physiology it must show
// (/work/shared/domain.md: V-slope rise at VT1, isocapnic buffering, PetCO2 fall above VT2).
import { describe, expect, test } from 'vitest';
import { linearFit } from '../../../core/math/linear-fit';
import { defaultCycleParams, defaultTreadmillParams, type TestParams } from '../../../sample-tests/generator/params';
import { modelTrajectory, parameterProblems, valueAt, type Trajectory } from '../../../sample-tests/generator/trajectory';
import { generateTest } from '../../../sample-tests/generator/generate-test';

function incrementalIndices(tr: Trajectory, keep: (i: number) => boolean): number[] {
  const out: number[] = [];
  for (let i = 0; i < tr.timeS.length; i++) {
    if (tr.timeS[i] >= tr.incrementalStartS && tr.timeS[i] < tr.exerciseEndS && keep(i)) out.push(i);
  }
  return out;
}

function slope(idx: number[], x: Float64Array, y: Float64Array): number {
  const fit = linearFit(idx.map((i) => x[i]), idx.map((i) => y[i]));
  if (fit === null) throw new Error('no fit');
  return fit.slope;
}

describe('noise-free VCO2 and VE lines', () => {
  const params: TestParams = { ...defaultCycleParams(), vco2SlopeBelowVt1: 0.91, vco2SlopeAboveVt1: 1.27, veSlopeBelowVt2: 27, veSlopeAboveVt2: 41 };
  const tr = modelTrajectory(params);

  test('VCO2-on-VO2 slope below and above VT1 equals s1 and s2', () => {
    // The model defines VCO2 as a broken line of VO2 with these slopes (V-slope model, Beaver et al. 1986).
    const below = incrementalIndices(tr, (i) => tr.vo2MlMin[i] < params.vt1Vo2MlMin - 1);
    const above = incrementalIndices(tr, (i) => tr.vo2MlMin[i] > params.vt1Vo2MlMin + 1);
    expect(slope(below, tr.vo2MlMin, tr.vco2MlMin)).toBeCloseTo(0.91, 9);
    expect(slope(above, tr.vo2MlMin, tr.vco2MlMin)).toBeCloseTo(1.27, 9);
  });

  test('VE-on-VCO2 slope below and above VT2 equals k1 and k2 (L/min per L/min)', () => {
    const vt2Vco2 = tr.veLine.vt2Vco2MlMin;
    const below = incrementalIndices(tr, (i) => tr.vco2MlMin[i] < vt2Vco2 - 1);
    const above = incrementalIndices(tr, (i) => tr.vco2MlMin[i] > vt2Vco2 + 1);
    const vco2L = tr.vco2MlMin.map((v) => v / 1000);
    expect(slope(below, vco2L, tr.veLMin)).toBeCloseTo(27, 8);
    expect(slope(above, vco2L, tr.veLMin)).toBeCloseTo(41, 8);
  });

  test('PetCO2 stays nearly level between VT1 and VT2, then falls (isocapnic buffering, then compensation)', () => {
    // domain.md: PetCO2 level above VT1, falling above VT2. Level taken as a spread under 2.5 mmHg (common practice).
    const between = incrementalIndices(tr, (i) => tr.vo2MlMin[i] >= params.vt1Vo2MlMin && tr.vo2MlMin[i] <= params.vt2Vo2MlMin).map((i) => tr.paco2Mmhg[i]);
    expect(Math.max(...between) - Math.min(...between)).toBeLessThan(2.5);
    const atVt2 = between[between.length - 1];
    const atEnd = valueAt(tr.paco2Mmhg, tr.exerciseEndS);
    expect(atVt2 - atEnd).toBeGreaterThan(3);
  });

  test('PetO2 is at the bottom of its trough at VT1 and rises above it', () => {
    // domain.md: VT1 at the PetO2 nadir, PetO2 rising above it. The trough is flat, so "at the bottom"
    // means within 0.5 mmHg of the lowest incremental PetO2; "rises" means > 3 mmHg by VT2 (common practice tolerances).
    const idx = incrementalIndices(tr, () => true);
    const lowest = Math.min(...idx.map((i) => tr.pao2Mmhg[i]));
    const truth = generateTest(params, 5).truth;
    const atVt1 = valueAt(tr.pao2Mmhg, truth.vt1.timeS);
    expect(atVt1 - lowest).toBeLessThan(0.5);
    expect(valueAt(tr.pao2Mmhg, truth.vt2.timeS) - atVt1).toBeGreaterThan(3);
  });

  test('peak RER of the defaults exceeds 1.10 (a maximal test)', () => {
    // By hand: rest 3.5 × 68 = 238, VCO2 = 0.82 × 238 + 0.95 × (1100 − 238) + 1.4 × (2000 − 1100)
    // = 195.2 + 818.9 + 1260 = 2274.1 → RER 2274.1 / 2000 = 1.137 (threshold 1.10: Balady et al. 2010).
    const d = modelTrajectory(defaultCycleParams());
    const end = d.exerciseEndS;
    expect(valueAt(d.vco2MlMin, end) / valueAt(d.vo2MlMin, end)).toBeCloseTo(1.137, 2);
  });
});

describe('first-order VO2 kinetics', () => {
  const params = defaultCycleParams();
  const tr = modelTrajectory(params);

  test('one time constant after the step from rest to unloaded pedalling, VO2 covers 63.2 % of the step', () => {
    // Rest 3.5 × 68 = 238 mL/min; unloaded 238 + 238 = 476; at 180 + 45 s: 238 + (1 − e^−1) × 238 = 388.4 mL/min.
    expect(valueAt(tr.vo2MlMin, 180 + 45)).toBeCloseTo(238 + (1 - Math.exp(-1)) * 238, 0);
  });

  test('on a ramp VO2 lags the demand by τ: VT1 work = (VT1 − rest − unloaded)/gain + rate·τ/60', () => {
    // First-order response to a ramp: x(t) = demand(t − τ) once transients fade (linear-systems arithmetic).
    // (1100 − 476)/10 + 15 × 45/60 = 62.4 + 11.25 = 73.65 W, at 360 + 60 × 73.65/15 = 654.6 s.
    const { truth } = generateTest(params, 1);
    expect(truth.vt1.workW).toBeCloseTo(73.65, 0);
    expect(truth.vt1.timeS).toBeCloseTo(654.6, 0);
    // VT2 1650: (1650 − 476)/10 + 11.25 = 128.65 W.
    expect(truth.vt2.workW).toBeCloseTo(128.65, 0);
  });

  test('without a plateau the test ends when VO2 reaches its stated peak', () => {
    // (2000 − 476)/10 + 11.25 = 163.65 W at 360 + 60 × 163.65/15 = 1014.6 s (worked by hand).
    expect(tr.exerciseEndS).toBeCloseTo(1014.6, 0);
    expect(Math.max(...tr.vo2MlMin)).toBeCloseTo(2000, 0);
  });

  test('with a plateau VO2 never exceeds its peak and the test ends plateauS after the demand reaches it', () => {
    // Demand reaches 2000 at (2000 − 476)/10 = 152.4 W, i.e. 360 + 609.6 = 969.6 s; + 90 s → 1059.6 s.
    const p = modelTrajectory({ ...params, plateauS: 90 });
    expect(p.exerciseEndS).toBeCloseTo(1059.6, 0);
    expect(Math.max(...p.vo2MlMin)).toBeLessThanOrEqual(2000);
    // 90 s = 2 τ after the demand crossed: the lag of 112.5 mL/min shrinks to about e^−2 of it, so VO2 > 1970.
    expect(Math.max(...p.vo2MlMin)).toBeGreaterThan(1970);
  });
});

describe('truth matches the protocol', () => {
  test('cycle ramp: work at each threshold is warmupW + rate × (t − start)/60', () => {
    const params = { ...defaultCycleParams(), protocol: { kind: 'cycle-ramp', restS: 120, warmupS: 180, warmupW: 20, rampWPerMin: 25, recoveryS: 120, recoveryW: 20 } } as const;
    const { truth } = generateTest(params, 2);
    for (const t of [truth.vt1, truth.vt2]) {
      expect(t.workW).toBeCloseTo(20 + (25 * (t.timeS - 300)) / 60, 9);
      expect(t.timeS).toBeGreaterThan(truth.phases.incrementalStartS);
      expect(t.timeS).toBeLessThan(truth.phases.exerciseEndS);
    }
    expect(truth.phases.incrementalStartS).toBe(300);
    expect(truth.vt1.timeS).toBeLessThan(truth.vt2.timeS);
  });

  test('cycle steps: work at a threshold is a whole step above the warm-up load', () => {
    const params: TestParams = {
      ...defaultCycleParams(),
      protocol: { kind: 'cycle-steps', restS: 180, warmupS: 180, warmupW: 0, stepW: 25, stepS: 120, recoveryS: 180, recoveryW: 0 },
    };
    const { truth } = generateTest(params, 3);
    for (const t of [truth.vt1, truth.vt2]) {
      const stage = Math.floor((t.timeS - 360) / 120) + 1;
      expect(t.workW).toBe(25 * stage);
    }
  });

  test('treadmill: no work at the thresholds; speed and grade are those of the step then', () => {
    const params = defaultTreadmillParams();
    const { truth, table } = generateTest(params, 4);
    const step = Math.floor((truth.vt1.timeS - 360) / 60);
    expect(truth.vt1.workW).toBeNull();
    expect(truth.vt1.speedKmh).toBeCloseTo(3.0 + 0.3 * step, 9);
    expect(truth.vt1.gradePct).toBeCloseTo(2 + 1.5 * step, 9);
    expect(table.metadata.modality).toBe('treadmill');
    expect(table.breaths.every((b) => b.workW === null && b.speedKmh !== null)).toBe(true);
  });
});

describe('parameter checks', () => {
  test('a VT1 above VT2 is refused with a sentence naming the order', () => {
    const problems = parameterProblems({ ...defaultCycleParams(), vt1Vo2MlMin: 1800, vt2Vo2MlMin: 1700 });
    expect(problems.join(' ')).toMatch(/VT1 \(1800\) < VT2 \(1700\)/);
    expect(() => modelTrajectory({ ...defaultCycleParams(), vt1Vo2MlMin: 1800, vt2Vo2MlMin: 1700 })).toThrow(/VT1/);
  });

  test('a warm-up that already passes VT1 is refused', () => {
    // Warm-up 100 W: 476 + 1000 = 1476 mL/min > VT1 1100.
    expect(() => modelTrajectory({ ...defaultCycleParams(), protocol: { ...defaultCycleParams().protocol, warmupW: 100 } as TestParams['protocol'] })).toThrow(/before the incremental phase/);
  });
});
