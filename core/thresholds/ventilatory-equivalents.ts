/**
 * VT1 by the ventilatory equivalents: the time at which VE/VO2 starts a systematic rise while
 * VE/VCO2 does not rise with it (the extra CO2 of bicarbonate buffering drives ventilation,
 * so ventilation outruns O2 uptake but not CO2 output).
 *
 * Source: Wasserman et al., J Appl Physiol 1973;35:236–43. Units: VE L/min
 * BTPS, VO2 and VCO2 mL/min; the equivalents are dimensionless (VE × 1000 / VO2). Method:
 * continuous two-segment fit of VE/VO2 against time over the window (incremental phase up to
 * a preliminary VT2); the knot is VT1. Assumption (our test of "does not rise"): after the
 * knot, VE/VCO2 rises at less than half the rate of VE/VO2.
 */
import { hingeMethod } from './hinge-method';
import { slopeOverTime, timeSample } from './time-sample';
import { ratio } from './window';

export const veVo2 = hingeMethod({
  method: 've-vo2',
  label: 'Ventilatory equivalents (VE/VO2)',
  source: 'Wasserman et al., J Appl Physiol 1973;35:236–43',
  xName: 'timeS',
  yName: 've/vo2',
  bend: 'rise',
  sample: (input) => timeSample(input, (i) => ratio(input.series.veLMin[i] * 1000, input.series.vo2MlMin[i])),
  accept: (fit, input) => {
    if (fit.slopeAfter <= 0) return 'VE/VO2 does not rise after the break.';
    const s = input.series;
    const veVco2 = slopeOverTime(input, fit.knot, input.toS, (i) => ratio(s.veLMin[i] * 1000, s.vco2MlMin[i]));
    if (veVco2 >= 0.5 * fit.slopeAfter) {
      return 'VE/VCO2 rises together with VE/VO2 after the break, so the rise is not that of VT1.';
    }
    return null;
  },
});

export const detect = veVo2.detect;
