/**
 * VT2 (respiratory compensation point) by end-tidal CO2: the time at which PetCO2, level or
 * rising after VT1, starts to fall (hyperventilation relative to CO2 output).
 *
 * Source: Wasserman et al., J Appl Physiol 1973;35:236–43 (end-tidal
 * criteria as widely described since). Units: mmHg, s. Method: continuous two-segment fit of
 * PetCO2 against time from VT1 to the end of the incremental phase; the knot is VT2.
 * Assumption: PetCO2 must fall after the knot. Without end-tidal data the method says so.
 */
import { NO_END_TIDAL, endTidalCount } from './end-tidal';
import { hingeMethod } from './hinge-method';
import { timeSample } from './time-sample';

export const petco2 = hingeMethod({
  method: 'petco2',
  label: 'End-tidal CO2 (PetCO2 fall)',
  source: 'Wasserman et al., J Appl Physiol 1973;35:236–43',
  xName: 'timeS',
  yName: 'petco2Mmhg',
  bend: 'fall',
  sample: (input) => {
    const m = input.settings.thresholds.minPointsPerSegment;
    if (endTidalCount(input) < 2 * m) return NO_END_TIDAL;
    return timeSample(input, (i) => input.series.petco2Mmhg[i]);
  },
  accept: (fit) => (fit.slopeAfter >= 0 ? 'PetCO2 does not fall after the break.' : null),
});

export const detect = petco2.detect;
