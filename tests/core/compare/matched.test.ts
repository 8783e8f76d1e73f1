// Matched workloads on the noise-free fixture ramp (fixture.ts: VO2 = 500 + slope·W,
// HR = 70 + 0.5·W, RER 0.9, VE/VCO2 30), values worked by hand.
import { describe, expect, it } from 'vitest';
import { matchedWorkloads } from '../../../core/compare/matched';
import { DEFAULT_SETTINGS } from '../../../core/model/settings';
import { buildAnalysis } from './fixture';

describe('matchedWorkloads', () => {
  // day 1: 15 W/min for 720 s → 0–180 W; day 2: ends at 780 s → 0–150 W, VO2 slope 11 mL/min/W.
  const day1 = buildAnalysis({ exactSeries: true,  vt1: { workW: 101.9 } });
  const day2 = buildAnalysis({ exactSeries: true,  endS: 780, slopeMlMinW: 11, vt1: { workW: 80 } });
  const m = matchedWorkloads(day1, day2, DEFAULT_SETTINGS);

  it('steps of 10 W over the common range 0–150 W, plus both VT1 workloads', () => {
    if (!m.available) throw new Error(m.reason);
    expect(m.rangeW).toEqual([0, 150]);
    const steps = m.rows.filter((r) => r.kind === 'step').map((r) => r.workW);
    expect(steps).toEqual([0, 10, 20, 30, 40, 50, 60, 70, 80, 90, 100, 110, 120, 130, 140, 150]);
    expect(m.rows.filter((r) => r.kind !== 'step').map((r) => [r.kind, r.workW])).toEqual([['vt1_day1', 101.9], ['vt1_day2', 80]]);
  });

  it('at 100 W: VO2 1500 vs 1600 mL/min (+6.667%), HR 120 vs 120, RER 0.9, VE/VCO2 30', () => {
    if (!m.available) throw new Error(m.reason);
    const r = m.rows.find((x) => x.kind === 'step' && x.workW === 100)!;
    expect(r.values.vo2MlMin.day1).toBeCloseTo(1500, 9);
    expect(r.values.vo2MlMin.day2).toBeCloseTo(1600, 9);
    expect(r.values.vo2MlMin.deltaPct).toBeCloseTo(6.6667, 3);
    expect(r.values.hrBpm.delta).toBeCloseTo(0, 9);
    expect(r.values.rer.day1).toBeCloseTo(0.9, 12);
    expect(r.values.veVco2.day2).toBeCloseTo(30, 9);
    expect(r.values.veLMin.day1).toBeCloseTo(0.027 * 1500, 9);
  });

  it('interpolates between samples: at 101.9 W, VO2 = 500 + 10·101.9 = 1519 and 500 + 11·101.9 = 1620.9', () => {
    if (!m.available) throw new Error(m.reason);
    const r = m.rows.find((x) => x.kind === 'vt1_day1')!;
    expect(r.values.vo2MlMin.day1).toBeCloseTo(1519, 9);
    expect(r.values.vo2MlMin.day2).toBeCloseTo(1620.9, 9);
  });

  it('reads only the incremental phase: recovery at 0 W after the ramp is never read', () => {
    if (!m.available) throw new Error(m.reason);
    const zero = m.rows.find((x) => x.workW === 0)!;
    // the first sample of the ramp (t = 180 s, 0 W) is rest-level VO2 500, not a recovery value
    expect(zero.values.vo2MlMin.day1).toBeCloseTo(500, 6);
  });

  it('treadmill and missing load: not available, with the reason', () => {
    const tm = matchedWorkloads(day1, buildAnalysis({ exactSeries: true,  metadata: { modality: 'treadmill' }, noWork: true }), DEFAULT_SETTINGS);
    expect(tm).toEqual({ available: false, reason: 'Not available: day 2 on a treadmill, which has no workload in watts.' });
    const noLoad = matchedWorkloads(day1, buildAnalysis({ exactSeries: true,  noWork: true }), DEFAULT_SETTINGS);
    expect(noLoad.available).toBe(false);
  });

  it('reads each workload from a ±10 W local fit: one disturbed sample cannot swing the value', () => {
    // Day 1 ramp, 15 W/min sampled every 5 s (1.25 W apart): 17 samples lie within 30 ± 10 W.
    // A +400 mL/min disturbance on the sample at exactly 30 W (t = 300 s) moved the one-moment
    // reading to 1200 (+50 %); a least-squares line through the 17 samples moves by the
    // disturbance's leverage at the centre, 400/17 = 23.5 mL/min (+2.9 %).
    const noisy = buildAnalysis();
    const i = noisy.series.timeS.indexOf(300);
    const vo2 = [...noisy.series.vo2MlMin];
    vo2[i] += 400;
    const disturbed = { ...noisy, series: { ...noisy.series, vo2MlMin: vo2 } };
    const r = matchedWorkloads(disturbed, day2, DEFAULT_SETTINGS);
    if (!r.available) throw new Error(r.reason);
    expect(r.windowW).toBe(10);
    const at30 = r.rows.find((x) => x.kind === 'step' && x.workW === 30)!;
    expect(at30.reading).toEqual({ day1: 'local-fit', day2: 'local-fit' });
    expect(at30.values.vo2MlMin.day1).toBeCloseTo(800 + 400 / 17, 6);
  });

  it('a held step is read as the mean of the window, and says so', () => {
    // A step protocol: 25 W held for 3 min, then 50 W, 75 W … (VO2 = 500 + 10·W when settled);
    // around 50 W (±10 W) the load is constant, so no line can be fitted: the mean is used.
    const base = buildAnalysis();
    const work = base.series.timeS.map((t) => (t >= 180 && t <= 900 ? 25 * (1 + Math.floor((t - 180) / 180)) : 0));
    const stepSeries = { ...base.series, workW: work, vo2MlMin: work.map((w) => 500 + 10 * w) };
    const stepped = { ...base, series: stepSeries };
    const r = matchedWorkloads(stepped, stepped, DEFAULT_SETTINGS);
    if (!r.available) throw new Error(r.reason);
    const at50 = r.rows.find((x) => x.kind === 'step' && x.workW === 50)!;
    expect(at50.reading.day1).toBe('window-mean');
    expect(at50.values.vo2MlMin.day1).toBeCloseTo(1000, 9);
  });
});
