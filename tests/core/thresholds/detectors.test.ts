// Each detector on a series from the stated model in synthetic-series.ts (true VT1 1,700 and
// VT2 2,600 mL/min by construction). V-slope and VE-vs-VCO2 fit the very broken lines the model
// is built from, so they must recover the breakpoint exactly. The other methods fit straight
// lines to curved quantities (ratios, end-tidal pressures from the alveolar equations), so
// their knots land within a few percent; we hold them to 5 % (our bound, stated here).
import { describe, expect, it } from 'vitest';
import { DEFAULT_SETTINGS } from '../../../core/model/settings';
import type { MethodOutcome } from '../../../core/model/analysis';
import type { DetectorInput } from '../../../core/thresholds/detector';
import { VT1_METHODS, VT2_METHODS } from '../../../core/thresholds/methods';
import { INC_END_S, INC_START_S, TRUE_VT1_VO2, TRUE_VT2_VO2, syntheticSeries, timeAtVo2 } from './synthetic-series';

const clean = syntheticSeries();
const vt1Input: DetectorInput = { series: clean, fromS: INC_START_S, toS: timeAtVo2(TRUE_VT2_VO2), settings: DEFAULT_SETTINGS };
const vt2Input: DetectorInput = { series: clean, fromS: timeAtVo2(TRUE_VT1_VO2), toS: INC_END_S, settings: DEFAULT_SETTINGS };

function run(method: string, input: DetectorInput): MethodOutcome {
  const entry = [...VT1_METHODS, ...VT2_METHODS].find((m) => m.method === method)!;
  return entry.detect(input);
}

function vo2Of(o: MethodOutcome): number {
  if (!o.found) throw new Error(`${o.method} found nothing: ${o.reason}`);
  return o.vo2MlMin;
}

describe('VT1 detectors on the noise-free model', () => {
  it.each(['vslope', 'vslope-hinge'])('%s recovers VT1 = 1,700 mL/min at 390 s exactly', (method) => {
    const o = run(method, vt1Input);
    expect(vo2Of(o)).toBeCloseTo(TRUE_VT1_VO2, 3);
    // 120 s + (1,700 − 800) / 2,400 × 720 s = 390 s (model's linear VO2 ramp, by hand).
    if (o.found) expect(o.timeS).toBeCloseTo(390, 3);
  });

  it('vslope-hinge reports slopes 0.92 below and 1.37 above (the model’s VCO2 line)', () => {
    const o = run('vslope-hinge', vt1Input);
    expect(o.found).toBe(true);
    if (!o.found) return;
    expect(o.evidence.segments[0].slope).toBeCloseTo(0.92, 6);
    expect(o.evidence.segments[1].slope).toBeCloseTo(1.37, 6);
    expect(o.evidence.residualSumSquares).toBeLessThan(1e-6);
    // VT2 at 120 + (2,600 − 800) / 2,400 × 720 = 660 s; 2-s points 120…660 s inclusive: 540 / 2 + 1
    expect(o.evidence.points).toBe(271);
  });

  it.each(['ve-vo2', 'excess-co2', 'peto2'])('%s finds VT1 within 5 %% of 1,700 mL/min', (method) => {
    expect(Math.abs(vo2Of(run(method, vt1Input)) - TRUE_VT1_VO2) / TRUE_VT1_VO2).toBeLessThan(0.05);
  });
});

describe('VT2 detectors on the noise-free model', () => {
  it('ve-vs-vco2 recovers VT2 = 2,600 mL/min exactly', () => {
    expect(vo2Of(run('ve-vs-vco2', vt2Input))).toBeCloseTo(TRUE_VT2_VO2, 1);
  });
  it.each(['ve-vco2-ratio', 'petco2'])('%s finds VT2 within 5 %% of 2,600 mL/min', (method) => {
    expect(Math.abs(vo2Of(run(method, vt2Input)) - TRUE_VT2_VO2) / TRUE_VT2_VO2).toBeLessThan(0.05);
  });
});

describe('detectors on noisy data (2 % Gaussian noise, 10 seeds)', () => {
  it('vslope-hinge stays within 8 % of VT1 and ve-vs-vco2 within 5 % of VT2 in every seed', () => {
    for (let seed = 1; seed <= 10; seed++) {
      const series = syntheticSeries({ noise: 0.02, seed });
      const o1 = run('vslope-hinge', { ...vt1Input, series });
      const o2 = run('ve-vs-vco2', { ...vt2Input, series });
      expect(Math.abs(vo2Of(o1) - TRUE_VT1_VO2) / TRUE_VT1_VO2).toBeLessThan(0.08);
      expect(Math.abs(vo2Of(o2) - TRUE_VT2_VO2) / TRUE_VT2_VO2).toBeLessThan(0.05);
    }
  });
});

describe('detectors say why they found nothing', () => {
  it('end-tidal methods report missing PetO2/PetCO2', () => {
    const series = syntheticSeries({ endTidal: false });
    for (const [method, input] of [['peto2', vt1Input], ['petco2', vt2Input]] as const) {
      const o = run(method, { ...input, series });
      expect(o.found).toBe(false);
      if (!o.found) expect(o.reason).toMatch(/No end-tidal data/);
    }
  });

  it('every method reports too few points in a 20-s window (10 points < 16 needed)', () => {
    for (const m of [...VT1_METHODS, ...VT2_METHODS]) {
      const o = m.detect({ series: clean, fromS: 400, toS: 418, settings: DEFAULT_SETTINGS });
      expect(o.found).toBe(false);
      if (!o.found && m.method !== 'peto2' && m.method !== 'petco2') expect(o.reason).toMatch(/Too few points/);
    }
  });

  it('V-slope finds no VT1 where VCO2 is one straight line of VO2 (slope 0.95)', () => {
    const series = syntheticSeries({ noVt1: true });
    for (const method of ['vslope', 'vslope-hinge']) {
      const o = run(method, { ...vt1Input, series });
      expect(o.found).toBe(false);
    }
  });

  it('does not crash on an empty series', () => {
    const empty = { timeS: [], vo2MlMin: [], vco2MlMin: [], veLMin: [], hrBpm: [], workW: [], peto2Mmhg: [], petco2Mmhg: [] };
    for (const m of [...VT1_METHODS, ...VT2_METHODS]) expect(m.detect({ series: empty, fromS: 0, toS: 100, settings: DEFAULT_SETTINGS }).found).toBe(false);
  });
});
