/**
 * VT1 by end-tidal O2: PetO2 reaches its low point and starts to rise while PetCO2 stays level
 * (isocapnic buffering: ventilation rises with the extra CO2, so alveolar O2 climbs while
 * alveolar CO2 does not fall).
 *
 * Source: Wasserman et al., J Appl Physiol 1973;35:236–43 (end-tidal
 * criteria as widely described since). Units: mmHg, s. Method: continuous two-segment fit of
 * PetO2 against time over the incremental phase up to a preliminary VT2; the knot is VT1.
 * Assumption (our test of "level"): after the knot PetCO2 falls at less than half the rate at
 * which PetO2 rises. Without end-tidal data the method reports that it could not run.
 */
import { NO_END_TIDAL, endTidalCount } from './end-tidal';
import { hingeMethod } from './hinge-method';
import { slopeOverTime, timeSample } from './time-sample';

export const peto2 = hingeMethod({
  method: 'peto2',
  label: 'End-tidal O2 (PetO2 nadir)',
  source: 'Wasserman et al., J Appl Physiol 1973;35:236–43',
  xName: 'timeS',
  yName: 'peto2Mmhg',
  bend: 'rise',
  sample: (input) => {
    const m = input.settings.thresholds.minPointsPerSegment;
    if (endTidalCount(input) < 2 * m) return NO_END_TIDAL;
    const s = input.series;
    return timeSample(input, (i) => (s.petco2Mmhg[i] === null ? null : s.peto2Mmhg[i]));
  },
  accept: (fit, input) => {
    if (fit.slopeAfter <= 0) return 'PetO2 does not rise after its low point.';
    const s = input.series;
    const co2 = slopeOverTime(input, fit.knot, input.toS, (i) => (s.peto2Mmhg[i] === null ? null : s.petco2Mmhg[i]));
    if (-co2 >= 0.5 * fit.slopeAfter) return 'PetCO2 falls as PetO2 rises, so the rise is not that of VT1.';
    return null;
  },
});

export const detect = peto2.detect;
