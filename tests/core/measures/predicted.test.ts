// Predicted values against the published equations, each worked by hand in the comments.
import { describe, expect, it } from 'vitest';
import { CM_PER_IN, KG_PER_LB, friendVo2MlKgMin, hansenVo2MlMin, hrMaxFox, hrMaxTanaka, percentOf, predictedHrMax } from '../../../core/measures/predicted';

describe('age-predicted HRmax', () => {
  it('Fox et al. 1971: 220 − 40 = 180 bpm', () => {
    expect(hrMaxFox(40)).toBe(180);
  });
  it('Tanaka et al., JACC 2001: 208 − 0.7·40 = 180; 208 − 0.7·60 = 166 bpm', () => {
    expect(hrMaxTanaka(40)).toBeCloseTo(180, 12);
    expect(hrMaxTanaka(60)).toBeCloseTo(166, 12);
    expect(predictedHrMax(60, 'fox')).toBe(160);
  });
});

describe('FRIEND (de Souza e Silva et al., Eur J Prev Cardiol 2018;25:742–50)', () => {
  it('woman, 45 y, 150 lb, 65 in, cycle → 28.43 mL/kg/min', () => {
    // 45.2 − 0.35·45 − 10.9·2 − 0.15·150 + 0.68·65 − 0.46·2 = 45.2 − 15.75 − 21.8 − 22.5 + 44.2 − 0.92 = 28.43
    const v = friendVo2MlKgMin({ ageY: 45, sex: 'F', weightKg: 150 * KG_PER_LB, heightCm: 65 * CM_PER_IN, modality: 'cycle' });
    expect(v).toBeCloseTo(28.43, 10);
  });
  it('man, 40 y, 180 lb, 70 in, treadmill → 40.44 mL/kg/min', () => {
    // 45.2 − 14 − 10.9 − 27 + 47.6 − 0.46 = 40.44
    const v = friendVo2MlKgMin({ ageY: 40, sex: 'M', weightKg: 180 * KG_PER_LB, heightCm: 70 * CM_PER_IN, modality: 'treadmill' });
    expect(v).toBeCloseTo(40.44, 10);
  });
});

describe('Hansen/Wasserman (Hansen et al. 1984; equations from memory, verify)', () => {
  it('man, 50 y, 175 cm, 70 kg, cycle: 70 × (50.72 − 0.372·50) = 2248.4 mL/min (memory)', () => {
    // Predicted weight 0.79·175 − 60.7 = 77.55 kg > 70 kg, so the actual 70 kg is used.
    expect(hansenVo2MlMin({ ageY: 50, sex: 'M', heightCm: 175, weightKg: 70, modality: 'cycle' })).toBeCloseTo(2248.4, 9);
  });
  it('woman, 50 y, 165 cm, 80 kg, cycle: (64.45 + 43) × (22.78 − 8.5) = 1534.386 mL/min (memory)', () => {
    // Predicted weight 0.65·165 − 42.8 = 64.45 kg < 80 kg, so 64.45 kg is used.
    expect(hansenVo2MlMin({ ageY: 50, sex: 'F', heightCm: 165, weightKg: 80, modality: 'cycle' })).toBeCloseTo(1534.386, 6);
  });
});

describe('percentOf', () => {
  it('25 of 28.43 is 87.9 %; missing inputs give null', () => {
    expect(percentOf(25, 28.43)).toBeCloseTo(87.935, 3);
    expect(percentOf(null, 28.43)).toBeNull();
    expect(percentOf(25, 0)).toBeNull();
  });
});
