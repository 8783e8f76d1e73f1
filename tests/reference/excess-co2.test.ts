// Reference: Gaskill et al., Med Sci Sports Exerc 2001;33:1841–8, excess CO2 = VCO2²/VO2 − VCO2;
// worked value from check-values.md: VO2 2,000, VCO2 2,200 → 4,840,000 / 2,000 − 2,200 = 220 mL/min.
import { describe, expect, it } from 'vitest';
import { excessCo2MlMin } from '../../core/thresholds/excess-co2';

describe('excess CO2', () => {
  it('VO2 2,000 and VCO2 2,200 mL/min give 220 mL/min', () => {
    expect(excessCo2MlMin(2000, 2200)).toBeCloseTo(220, 10);
  });
  it('is zero at RER 1 (VO2 = VCO2 = 1,500) and negative below it (1,500 / 1,200 → −240)', () => {
    expect(excessCo2MlMin(1500, 1500)).toBe(0);
    expect(excessCo2MlMin(1500, 1200)).toBeCloseTo(960 - 1200, 10); // 1,440,000 / 1,500 = 960
  });
  it('is undefined (null) without a positive VO2', () => {
    expect(excessCo2MlMin(0, 300)).toBeNull();
  });
});
