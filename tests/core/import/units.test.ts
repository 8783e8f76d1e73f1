// Reference: unit definitions — 1 L = 1000 mL; 760 mmHg = 101.325 kPa (standard atmosphere),
// so 1 kPa = 7.50062 mmHg; 1 international mile = 1.609344 km.
import { describe, expect, test } from 'vitest';
import { inferUnit, normalizeUnit, parseUnit } from '../../../core/import/units';

describe('parseUnit', () => {
  test('the ways carts write mL/min and L/min', () => {
    expect(parseUnit('vo2MlMin', 'ml·min-1')?.factor).toBe(1);
    expect(parseUnit('vo2MlMin', 'l/min')?.factor).toBe(1000);
    expect(parseUnit('vco2MlMin', 'L/min STPD')?.factor).toBe(1000);
    expect(parseUnit('veLMin', 'L/min BTPS')?.factor).toBe(1);
    expect(parseUnit('veLMin', 'mL/min')?.factor).toBe(0.001);
    expect(parseUnit('vo2MlMin', 'ml·kg-1·min-1')?.perKg).toBe(true);
  });

  test('pressure and speed conversions', () => {
    expect(parseUnit('petco2Mmhg', 'kPa')!.factor * 5.0).toBeCloseTo(37.503, 3); // 5 kPa · 7.50062
    expect(parseUnit('peto2Mmhg', 'mmHg')?.factor).toBe(1);
    expect(parseUnit('speedKmh', 'mph')!.factor * 3).toBeCloseTo(4.828, 3); // 3 mph · 1.609344
    expect(parseUnit('speedKmh', 'km/h')?.factor).toBe(1);
    expect(parseUnit('timeS', 'min')?.factor).toBe(60);
    expect(parseUnit('timeS', 'mm:ss')?.colon).toBe(true);
  });

  test('an unknown unit is null', () => {
    expect(parseUnit('vo2MlMin', 'furlongs')).toBeNull();
    expect(parseUnit('hrBpm', 'kPa')).toBeNull();
  });

  test('normalizeUnit removes spacing, middle dots and -1 exponents', () => {
    expect(normalizeUnit('mL · min-1')).toBe('ml/min');
    expect(normalizeUnit('l/min STPD')).toBe('l/min');
  });
});

describe('inferUnit from magnitudes', () => {
  // Resting VO2 is about 250 mL/min and peak VO2 of adults rarely exceeds 6 L/min (common practice):
  // a median below 10 can only be L/min.
  test('gas flows', () => {
    expect(inferUnit('vo2MlMin', 1.2)?.unit.label).toBe('L/min');
    expect(inferUnit('vo2MlMin', 1200)?.unit.label).toBe('mL/min');
  });
  // Normal PetCO2 is about 35–45 mmHg, i.e. 4.7–6 kPa (textbook physiology).
  test('end-tidal pressures', () => {
    expect(inferUnit('petco2Mmhg', 5.1)?.unit.label).toBe('kPa');
    expect(inferUnit('petco2Mmhg', 38)?.unit.label).toBe('mmHg');
  });
  // Resting tidal volume is about 0.5 L (textbook physiology): 500 can only be mL.
  test('tidal volume and ventilation', () => {
    expect(inferUnit('vtL', 500)?.unit.label).toBe('mL');
    expect(inferUnit('vtL', 0.5)?.unit.label).toBe('L');
    expect(inferUnit('veLMin', 35000)?.unit.label).toBe('mL/min');
    expect(inferUnit('veLMin', 35)?.unit.label).toBe('L/min');
  });
});
