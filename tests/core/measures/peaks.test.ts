// Peak values as the highest 30 s rolling mean (common practice), on series worked by hand.
import { describe, expect, it } from 'vitest';
import { breath, type Breath } from '../../../core/model/breath-table';
import { metsFromVo2MlKgMin, peakValues, rer } from '../../../core/measures/peaks';

describe('formulas', () => {
  it('METs = VO2/kg ÷ 3.5 (common practice): 24.5 → 7.0', () => {
    expect(metsFromVo2MlKgMin(24.5)).toBeCloseTo(7.0, 12);
  });
  it('RER = VCO2 ÷ VO2 (definition): 2,200 / 2,000 → 1.10', () => {
    expect(rer(2200, 2000)).toBeCloseTo(1.1, 12);
  });
});

describe('peakValues', () => {
  // A breath every 2 s from 0 to 600 s of the incremental phase; VO2 = 1000 + 2·t mL/min,
  // VCO2 = 1.1 × VO2, VE = VO2 / 25 L/min, HR = 100 + 0.1·t bpm, work = t / 4 W; then one
  // recovery breath at 602 s with values higher still, which must not count.
  const breaths: Breath[] = [];
  for (let t = 0; t <= 600; t += 2) {
    const vo2 = 1000 + 2 * t;
    breaths.push(breath({ timeS: t, vo2MlMin: vo2, vco2MlMin: 1.1 * vo2, veLMin: vo2 / 25, hrBpm: 100 + 0.1 * t, workW: t / 4 }));
  }
  breaths.push(breath({ timeS: 602, vo2MlMin: 9000, vco2MlMin: 9900, veLMin: 360, hrBpm: 220, workW: 400 }));
  const peak = peakValues(breaths, { incrementalStartS: 0, incrementalEndS: 600 }, 70, 30);

  it('takes the last full 30 s window of a rising series', () => {
    // Window (570, 600] holds the breaths at 572, 574, …, 600 s (15 breaths), mean time 586 s:
    // VO2 = 1000 + 2 × 586 = 2172 mL/min; VE = 2172 / 25 = 86.88 L/min; HR = 158.6 bpm.
    expect(peak.vo2MlMin).toBeCloseTo(2172, 9);
    expect(peak.veLMin).toBeCloseTo(86.88, 9);
    expect(peak.hrBpm).toBeCloseTo(158.6, 9);
    expect(peak.rer).toBeCloseTo(1.1, 12);
    // VO2/kg = 2172 / 70 = 31.029; METs = 31.029 / 3.5 = 8.865.
    expect(peak.vo2MlKgMin).toBeCloseTo(31.0286, 3);
    expect(peak.mets).toBeCloseTo(8.8653, 3);
    // O2 pulse = mean VO2 / mean HR = 2172 / 158.6 = 13.695 mL/beat (ratio rises with t, so the last window).
    expect(peak.o2PulseMlBeat).toBeCloseTo(13.695, 3);
    // Peak work is the highest load in the phase: 600 / 4 = 150 W (not the recovery breath's 400 W).
    expect(peak.workW).toBe(150);
    expect(peak.exerciseDurationS).toBe(600);
  });

  it('gives null per-kg values without a body mass and null HR without HR', () => {
    const noHr = breaths.map((b) => ({ ...b, hrBpm: null }));
    const p = peakValues(noHr, { incrementalStartS: 0, incrementalEndS: 600 }, null, 30);
    expect([p.vo2MlKgMin, p.mets, p.hrBpm, p.o2PulseMlBeat]).toEqual([null, null, null, null]);
  });
});
