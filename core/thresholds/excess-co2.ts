/**
 * VT1 by excess CO2: excess CO2 = VCO2²/VO2 − VCO2 (mL/min), the CO2 produced beyond what
 * aerobic metabolism at the current RER would give; it stays near its baseline below VT1 and
 * rises once bicarbonate buffers lactate. VT1 is where it departs from baseline.
 *
 * Source: Gaskill et al., Med Sci Sports Exerc 2001;33:1841–8 (worked value: VO2 2,000,
 * VCO2 2,200 → 220 mL/min). Units: mL/min. Method: continuous two-segment fit of excess CO2
 * against time over the incremental phase up to a preliminary VT2; the knot is VT1.
 * Assumption: the baseline may drift; the rise after the knot must be positive.
 */
import { hingeMethod } from './hinge-method';
import { timeSample } from './time-sample';

/** VCO2²/VO2 − VCO2, mL/min; null when VO2 is not positive. */
export function excessCo2MlMin(vo2MlMin: number, vco2MlMin: number): number | null {
  return vo2MlMin > 0 ? (vco2MlMin * vco2MlMin) / vo2MlMin - vco2MlMin : null;
}

export const excessCo2 = hingeMethod({
  method: 'excess-co2',
  label: 'Excess CO2',
  source: 'Gaskill et al., Med Sci Sports Exerc 2001;33:1841–8',
  xName: 'timeS',
  yName: 'excess-co2',
  bend: 'rise',
  sample: (input) => timeSample(input, (i) => excessCo2MlMin(input.series.vo2MlMin[i], input.series.vco2MlMin[i])),
  accept: (fit) => (fit.slopeAfter <= 0 ? 'Excess CO2 does not rise after the break.' : null),
});

export const detect = excessCo2.detect;
