// Checks the model's equations against worked values of textbook physiology
// (/work/shared/check-values.md: alveolar ventilation and alveolar gas equations),
// Tanaka et al. (JACC 2001) and the ACSM walking equation (memory), each worked by hand below.
import { describe, expect, test } from 'vitest';
import {
  alveolarPco2Mmhg,
  alveolarPo2Mmhg,
  alveolarVentilationLMin,
  cyclingVo2MlMin,
  deadSpaceFraction,
  hrFromVo2Bpm,
  inspiredPo2Mmhg,
  tanakaHrMaxBpm,
  tidalVolumeL,
  vco2FromVo2MlMin,
  veFromVco2LMin,
  walkingVo2MlKgMin,
} from '../../../sample-tests/generator/physiology';

describe('alveolar equations', () => {
  test('PACO2 = 863 × VCO2 / VA: VCO2 1.0 L/min, VA 30 L/min → 28.8 mmHg', () => {
    // 863 × 1.0 / 30 = 28.77 mmHg (check-values.md, textbook physiology)
    expect(alveolarPco2Mmhg(1.0, 30)).toBeCloseTo(28.77, 2);
  });

  test('VA = VE × (1 − VD/VT): VE 40 L/min, VD/VT 0.25 → 30 L/min', () => {
    // 40 × 0.75 = 30 (worked by hand)
    expect(alveolarVentilationLMin(40, 0.25)).toBeCloseTo(30, 10);
  });

  test('PIO2 = (PB − 47) × 0.2093: PB 760 → 149.2 mmHg', () => {
    // 713 × 0.2093 = 149.23 (check-values.md)
    expect(inspiredPo2Mmhg(760)).toBeCloseTo(149.23, 2);
  });

  test('PAO2 full form: PB 760, PACO2 40, R 0.8 → 101.3 mmHg', () => {
    // 149.23 − 40 × (0.2093 + 0.7907/0.8) = 149.23 − 40 × 1.19768 = 101.32 (check-values.md)
    expect(alveolarPo2Mmhg(inspiredPo2Mmhg(760), 40, 0.8)).toBeCloseTo(101.32, 1);
  });

  test('PAO2 at a lower barometric pressure: PB 745, PACO2 40, R 1.0 → 106.1 mmHg', () => {
    // PIO2 = 698 × 0.2093 = 146.09; PAO2 = 146.09 − 40 × (0.2093 + 0.7907) = 106.09 (worked by hand)
    expect(alveolarPo2Mmhg(inspiredPo2Mmhg(745), 40, 1.0)).toBeCloseTo(106.09, 1);
  });
});

describe('broken lines', () => {
  const line = { vo2RestMlMin: 250, rerRest: 0.8, vt1Vo2MlMin: 1250, slopeBelowVt1: 0.9, slopeAboveVt1: 1.3 };

  test('VCO2 at rest is RERrest × VO2rest: 0.8 × 250 = 200 mL/min', () => {
    expect(vco2FromVo2MlMin(250, line)).toBeCloseTo(200, 10);
  });

  test('VCO2 at VT1 and above: 200 + 0.9 × 1000 = 1100; then + 1.3 × 500 = 1750 mL/min', () => {
    // worked by hand from the line's definition
    expect(vco2FromVo2MlMin(1250, line)).toBeCloseTo(1100, 10);
    expect(vco2FromVo2MlMin(1750, line)).toBeCloseTo(1750, 10);
  });

  test('VE: 2 + 26 × 1.5 = 41 L/min below VT2; above it 2 + 26 × 2 + 45 × 0.5 = 76.5 L/min', () => {
    // worked by hand; VT2 at VCO2 2.0 L/min
    const ve = { interceptLMin: 2, slopeBelowVt2: 26, slopeAboveVt2: 45, vt2Vco2MlMin: 2000 };
    expect(veFromVco2LMin(1500, ve)).toBeCloseTo(41, 10);
    expect(veFromVco2LMin(2500, ve)).toBeCloseTo(76.5, 10);
  });
});

describe('other relations', () => {
  test('Tanaka HRmax 208 − 0.7 × age: 40 → 180, 60 → 166 bpm', () => {
    // check-values.md (Tanaka et al. 2001)
    expect(tanakaHrMaxBpm(40)).toBeCloseTo(180, 10);
    expect(tanakaHrMaxBpm(60)).toBeCloseTo(166, 10);
  });

  test('ACSM walking equation: 4.8 km/h at 10 % → 25.9 mL/kg/min', () => {
    // 80 m/min: 0.1 × 80 + 1.8 × 80 × 0.10 + 3.5 = 8 + 14.4 + 3.5 = 25.9 (ACSM, memory)
    expect(walkingVo2MlKgMin(4.8, 10)).toBeCloseTo(25.9, 10);
  });

  test('cycling VO2: rest 245 + unloaded 245 + 10 × 100 W = 1490 mL/min', () => {
    // worked by hand; gain 10 mL/min/W (ATS/ACCP 2003, memory)
    expect(cyclingVo2MlMin(100, 245, 245, 10)).toBeCloseTo(1490, 10);
  });

  test('HR linear in VO2: halfway through the VO2 range is halfway through the HR range', () => {
    // rest 250 → 70 bpm, peak 2250 → 170 bpm; VO2 1250 → 120 bpm (worked by hand)
    expect(hrFromVo2Bpm(1250, 250, 2250, 70, 170)).toBeCloseTo(120, 10);
  });

  test('VD/VT falls in a straight line from its resting to its peak value', () => {
    // f = 0.5: 0.32 − (0.32 − 0.15) × 0.5 = 0.235 (worked by hand)
    expect(deadSpaceFraction(250, 250, 2250, 0.32, 0.15)).toBeCloseTo(0.32, 10);
    expect(deadSpaceFraction(1250, 250, 2250, 0.32, 0.15)).toBeCloseTo(0.235, 10);
    expect(deadSpaceFraction(2250, 250, 2250, 0.32, 0.15)).toBeCloseTo(0.15, 10);
  });

  test('tidal volume starts at its resting value and saturates toward VTmax', () => {
    // VE − VErest = scale: 2.2 − 1.6 × e^(−1) = 1.6114 L (worked by hand)
    expect(tidalVolumeL(8, 8, 0.6, 2.2, 25)).toBeCloseTo(0.6, 10);
    expect(tidalVolumeL(33, 8, 0.6, 2.2, 25)).toBeCloseTo(1.6114, 3);
  });
});
