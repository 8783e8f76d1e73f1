// Effort criteria and verdicts on constructed cases. Thresholds: RER ≥ 1.10 (Balady et al.
// 2010), plateau < 150 mL/min or < 2.1 mL/kg/min (Taylor et al. 1955; Howley et al. 1995),
// HR ≥ 85 % predicted, RPE ≥ 17 (Borg 1982; common practice), lactate ≥ 8 mmol/L (common practice).
import { describe, expect, it } from 'vitest';
import { breath, type Breath } from '../../../core/model/breath-table';
import type { PeakValues } from '../../../core/model/analysis';
import { DEFAULT_SETTINGS } from '../../../core/model/settings';
import { assessEffort, vo2PlateauMeasure } from '../../../core/measures/effort';

const PHASE = { incrementalStartS: 0, incrementalEndS: 600 };

/** A 600 s ramp, a breath every 2 s, work 25 W/min from 0 W; VO2 = 500 + 10·W, flat over the last `flatS`. */
function ramp(wPerMin: number, flatS: number): Breath[] {
  const out: Breath[] = [];
  for (let t = 0; t <= 600; t += 2) {
    const w = (wPerMin * t) / 60;
    const vo2 = 500 + 10 * ((wPerMin * Math.min(t, 600 - flatS)) / 60);
    out.push(breath({ timeS: t, vo2MlMin: vo2, vco2MlMin: vo2, veLMin: vo2 / 30, workW: Math.round(w) }));
  }
  return out;
}

function peak(rer: number, hrBpm: number | null): PeakValues {
  return { vo2MlMin: 3000, vo2MlKgMin: 40, vco2MlMin: 3000 * rer, veLMin: 100, rer, hrBpm, o2PulseMlBeat: null, workW: 250, mets: null, exerciseDurationS: 600 };
}

const base = { phases: PHASE, weightKg: null, predictedHrMaxBpm: 180, peakRpe: null, lactateMmolL: null, settings: DEFAULT_SETTINGS.effort };

describe('vo2PlateauMeasure', () => {
  it('measures no rise over a final flat minute of a ramp', () => {
    // VO2 flat from 520 s: the final 60 s (540–600 s) rise by 0 mL/min; slope ratio 0.
    const m = vo2PlateauMeasure(ramp(25, 80), PHASE)!;
    expect(m.protocol).toBe('ramp');
    expect(m.riseMlMin).toBeCloseTo(0, 9);
    expect(m.slopeRatio).toBeCloseTo(0, 9);
  });

  it('measures 250 mL/min per minute on a 25 W/min ramp without a plateau', () => {
    // 10 mL/min/W × 25 W/min = 250 mL/min over the final minute; slope ratio 1.
    const m = vo2PlateauMeasure(ramp(25, 0), PHASE)!;
    expect(m.riseMlMin).toBeCloseTo(250, 9);
    expect(m.slopeRatio).toBeCloseTo(1, 9);
  });

  it('compares the last two stages of a step protocol', () => {
    // 25 W steps every 120 s; VO2 = 500 + 10·W, except the last stage (480–600 s) stays at the
    // previous stage's VO2 + 50: rise = 50 mL/min.
    const steps: Breath[] = [];
    for (let t = 0; t <= 600; t += 2) {
      const w = 25 * (1 + Math.floor(Math.min(t, 599) / 120));
      const vo2 = t >= 480 ? 500 + 10 * 100 + 50 : 500 + 10 * w;
      steps.push(breath({ timeS: t, vo2MlMin: vo2, vco2MlMin: vo2, veLMin: 30, workW: w }));
    }
    const m = vo2PlateauMeasure(steps, PHASE)!;
    expect(m.protocol).toBe('step');
    expect(m.riseMlMin).toBeCloseTo(50, 9);
  });
});

describe('assessEffort', () => {
  it('maximal: RER 1.15 and HR 175 of 180 (97.2 %)', () => {
    const e = assessEffort({ ...base, breaths: ramp(25, 0), peak: peak(1.15, 175) });
    expect(e.verdict).toBe('maximal');
    const hr = e.criteria.find((c) => c.id === 'peak_hr')!;
    expect(hr.value).toBeCloseTo((100 * 175) / 180, 9);
    expect(hr.met).toBe(true);
  });

  it('maximal: RER 1.12 and a plateau (per kg, 70 kg: 0 < 2.1 mL/kg/min)', () => {
    const e = assessEffort({ ...base, weightKg: 70, breaths: ramp(25, 80), peak: peak(1.12, 140) });
    const plateau = e.criteria.find((c) => c.id === 'vo2_plateau')!;
    expect(plateau).toMatchObject({ met: true, threshold: 2.1, unit: 'mL/kg/min' });
    expect(e.verdict).toBe('maximal');
  });

  it('submaximal: RER 1.02, HR 140 of 180 (77.8 %), RPE 14', () => {
    const e = assessEffort({ ...base, peakRpe: 14, breaths: ramp(25, 0), peak: peak(1.02, 140) });
    expect(e.verdict).toBe('submaximal');
    expect(e.criteria.map((c) => [c.id, c.met])).toEqual([
      ['peak_rer', false],
      ['vo2_plateau', false],
      ['peak_hr', false],
      ['peak_rpe', false],
      ['lactate', null],
    ]);
  });

  it('indeterminate: RER 1.12 but nothing else met', () => {
    expect(assessEffort({ ...base, breaths: ramp(25, 0), peak: peak(1.12, 140) }).verdict).toBe('indeterminate');
  });

  it('indeterminate: RER 1.05 while HR, RPE 19 and lactate 9 mmol/L are all met', () => {
    const e = assessEffort({ ...base, peakRpe: 19, lactateMmolL: 9, breaths: ramp(25, 0), peak: peak(1.05, 175) });
    expect(e.verdict).toBe('indeterminate');
    expect(e.reasons[0]).toContain('conflicts');
  });

  it('a slow ramp rising under 150 mL/min per minute is not a plateau unless the slope falls', () => {
    // 10 W/min → 100 mL/min over the final minute (< 150), but the slope has not fallen (ratio 1).
    const e = assessEffort({ ...base, breaths: ramp(10, 0), peak: peak(1.12, 140) });
    const plateau = e.criteria.find((c) => c.id === 'vo2_plateau')!;
    expect(plateau.value).toBeCloseTo(100, 9);
    expect(plateau.met).toBe(false);
  });
});

describe('effort options (RER 1.10 or 1.15: Balady et al. 2010, Robergs et al. 2010; HR ≥ 85 % or within 10 bpm: common practice, Howley et al. 1995)', () => {
  const hrOf = (e: ReturnType<typeof assessEffort>) => e.criteria.find((c) => c.id === 'peak_hr')!;

  it('RER 1.12 is maximal with the 1.10 threshold and not with 1.15', () => {
    const at = (rerMin: number) => assessEffort({ ...base, breaths: ramp(25, 0), peak: peak(1.12, 175), settings: { ...DEFAULT_SETTINGS.effort, rerMin } });
    expect(at(1.1).verdict).toBe('maximal');
    const strict = at(1.15);
    expect(strict.criteria[0]).toMatchObject({ met: false, rule: 'peak RER ≥ 1.15', valueText: '1.12' });
    expect(strict.verdict).not.toBe('maximal');
  });

  it('HR 168 of predicted 180: 93.3 % meets 85 %; within 10 bpm needs ≥ 170 bpm, so not met', () => {
    // 168/180 = 93.3 %; 180 − 10 = 170 bpm.
    const pct = hrOf(assessEffort({ ...base, breaths: ramp(25, 0), peak: peak(1.12, 168) }));
    expect(pct).toMatchObject({ met: true, valueText: '93 % (168 bpm)', rule: 'peak HR ≥ 85 % of age-predicted 180 bpm (≥ 153 bpm)' });
    const within = hrOf(assessEffort({ ...base, breaths: ramp(25, 0), peak: peak(1.12, 168), settings: { ...DEFAULT_SETTINGS.effort, hrCriterion: 'within-bpm' } }));
    expect(within).toMatchObject({ met: false, threshold: 170, rule: 'peak HR within 10 bpm of age-predicted 180 bpm (≥ 170 bpm)' });
    const either = hrOf(assessEffort({ ...base, breaths: ramp(25, 0), peak: peak(1.12, 168), settings: { ...DEFAULT_SETTINGS.effort, hrCriterion: 'either' } }));
    expect(either.met).toBe(true);
  });

  it('switched off for beta-blockade: the HR criterion is not assessed and cannot make a test maximal', () => {
    // RER 1.12 with HR 175 of 180 is maximal by default; with the criterion off nothing else is met.
    const e = assessEffort({ ...base, breaths: ramp(25, 0), peak: peak(1.12, 175), settings: { ...DEFAULT_SETTINGS.effort, hrCriterion: 'off' } });
    expect(hrOf(e).met).toBeNull();
    expect(hrOf(e).rule).toContain('switched off');
    expect(e.verdict).toBe('indeterminate');
  });

  it('the RER-alone rule decides by RER; the combination is stated with its source', () => {
    const e = assessEffort({ ...base, breaths: ramp(25, 0), peak: peak(1.12, 140), settings: { ...DEFAULT_SETTINGS.effort, rule: 'rer-alone' } });
    expect(e.verdict).toBe('maximal');
    expect(e.combination).toContain('Balady');
    expect(assessEffort({ ...base, breaths: ramp(25, 0), peak: peak(1.12, 140) }).combination).toContain('common practice');
  });

  it('the plateau rule reads "below", and the ramp slope-ratio part is printed', () => {
    // 70 kg, flat final 80 s: rise 0 mL/kg/min, slope ratio 0.
    const e = assessEffort({ ...base, weightKg: 70, breaths: ramp(25, 80), peak: peak(1.12, 140) });
    const plateau = e.criteria.find((c) => c.id === 'vo2_plateau')!;
    expect(plateau.rule).toBe("rise below 2.1 mL/kg/min over the final minute, and the final minute's slope below 0.50 × the slope over the earlier ramp");
    expect(plateau.detail).toBe('slope ratio 0.00');
    expect(plateau.valueText).toBe('0.0 mL/kg/min');
  });

  it('RPE is printed as the whole number it is, not "18.00"', () => {
    const e = assessEffort({ ...base, peakRpe: 18, breaths: ramp(25, 0), peak: peak(1.12, 140) });
    expect(e.criteria.find((c) => c.id === 'peak_rpe')).toMatchObject({ valueText: '18', rule: 'rating ≥ 17 on the Borg 6–20 scale', met: true });
  });
});
