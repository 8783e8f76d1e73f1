/**
 * VT2 (respiratory compensation point) by the ventilatory equivalent for CO2: the time at which
 * VE/VCO2, flat or falling after VT1, starts to rise (ventilation outruns CO2 output to
 * compensate for the acidosis).
 *
 * Source: Wasserman et al., J Appl Physiol 1973;35:236–43. Units:
 * dimensionless (VE L/min × 1000 / VCO2 mL/min), s. Method: continuous two-segment fit of
 * VE/VCO2 against time from VT1 to the end of the incremental phase; the knot is VT2.
 * Assumption: the rise after the knot must be positive.
 */
import { hingeMethod } from './hinge-method';
import { timeSample } from './time-sample';
import { ratio } from './window';

export const veVco2Ratio = hingeMethod({
  method: 've-vco2-ratio',
  label: 'Ventilatory equivalent for CO2 (VE/VCO2)',
  source: 'Wasserman et al., J Appl Physiol 1973;35:236–43',
  xName: 'timeS',
  yName: 've/vco2',
  bend: 'rise',
  sample: (input) => timeSample(input, (i) => ratio(input.series.veLMin[i] * 1000, input.series.vco2MlMin[i])),
  accept: (fit) => (fit.slopeAfter <= 0 ? 'VE/VCO2 does not rise after the break.' : null),
});

export const detect = veVco2Ratio.detect;
