/**
 * VT2 (respiratory compensation point) as the breakpoint of VE against VCO2: above it, VE
 * rises more steeply per unit of CO2 output.
 *
 * Source: Beaver et al., J Appl Physiol 1986;60:2020–7 (the same two-line
 * analysis applied to VE against VCO2, as recalled: memory). Units: VE L/min BTPS, VCO2
 * mL/min. Method: continuous two-segment fit from VT1 to the end of the incremental phase; the
 * knot is a VCO2, whose time is read off the monotone VCO2 curve and whose VO2 is read at that
 * time off the monotone VO2 curve (core/thresholds/read-off.ts).
 * Assumption: the slope must increase at the knot.
 *
 * As for VT1 (vslope-shared.ts), the x-axis is VCO2 smoothed over ±40 s by a local straight
 * line (regression calibration for noise in x) and VE has the part of its scatter that moves
 * with VCO2's own scatter removed (the breath-size covariate); the knot's time is read off the
 * monotone curve of that smoothed VCO2. Chosen on development seeds (docs/validation.md).
 */
import { hingeMethod } from './hinge-method';
import { monotoneCurve, timeAtValue, valueAtTime, vo2Curve } from './read-off';
import { locallySmoothed } from './smooth-vo2';
import { withoutBreathScatter } from './vslope-shared';
import { windowPoints } from './window';

/** Half-width of the VCO2 smoother, s (our choice on development seeds: 40 s; 60 s reached into recovery near VT2). */
export const VCO2_SMOOTH_HALF_WIDTH_S = 40;

export const veVsVco2 = hingeMethod({
  method: 've-vs-vco2',
  label: 'VE against VCO2 breakpoint',
  source: 'Beaver et al., J Appl Physiol 1986;60:2020–7',
  xName: 'vco2MlMin',
  yName: 'veLMin',
  bend: 'rise',
  sample: (input) => {
    const { series, fromS, toS } = input;
    const smCo2 = locallySmoothed(series.timeS, series.vco2MlMin, VCO2_SMOOTH_HALF_WIDTH_S);
    const smVe = locallySmoothed(series.timeS, series.veLMin, VCO2_SMOOTH_HALF_WIDTH_S);
    const ok = (i: number) => Number.isFinite(series.vco2MlMin[i]) && Number.isFinite(series.veLMin[i]) && Number.isFinite(smCo2[i]) && Number.isFinite(smVe[i]);
    const pick = (f: (i: number) => number) => windowPoints(series, fromS, toS, (i) => (ok(i) ? f(i) : null)).value;
    const x = pick((i) => smCo2[i]);
    const y = withoutBreathScatter(pick((i) => series.veLMin[i]), pick((i) => smVe[i]), pick((i) => series.vco2MlMin[i] - smCo2[i]));
    const co2 = monotoneCurve(series.timeS, smCo2, fromS, toS);
    const o2 = vo2Curve(series, fromS, toS);
    return { x, y, xIsTime: false, toPoint: (knot: number) => { const timeS = timeAtValue(co2, knot); return { timeS, vo2MlMin: valueAtTime(o2, timeS) }; } };
  },
});

export const detect = veVsVco2.detect;
