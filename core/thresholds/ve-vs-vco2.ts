/**
 * VT2 (respiratory compensation point) as the breakpoint of VE against VCO2: above it, VE
 * rises more steeply per unit of CO2 output.
 *
 * Source: Beaver, Wasserman & Whipp, J Appl Physiol 1986;60:2020–7 (the same two-line
 * analysis applied to VE against VCO2, as recalled: memory). Units: VE L/min BTPS, VCO2
 * mL/min. Method: continuous two-segment fit from VT1 to the end of the incremental phase; the
 * knot is a VCO2, whose time is read off the monotone VCO2 curve and whose VO2 is read at that
 * time off the monotone VO2 curve (core/thresholds/read-off.ts).
 * Assumption: the slope must increase at the knot.
 */
import { hingeMethod } from './hinge-method';
import { timeAtValue, valueAtTime, vco2Curve, vo2Curve } from './read-off';
import { windowPoints } from './window';

export const veVsVco2 = hingeMethod({
  method: 've-vs-vco2',
  label: 'VE against VCO2 breakpoint',
  source: 'Beaver, Wasserman & Whipp, J Appl Physiol 1986;60:2020–7',
  xName: 'vco2MlMin',
  yName: 'veLMin',
  bend: 'rise',
  sample: (input) => {
    const { series, fromS, toS } = input;
    const y = windowPoints(series, fromS, toS, (i) => (Number.isFinite(series.vco2MlMin[i]) ? series.veLMin[i] : null)).value;
    const x = windowPoints(series, fromS, toS, (i) => (Number.isFinite(series.veLMin[i]) ? series.vco2MlMin[i] : null)).value;
    const co2 = vco2Curve(series, fromS, toS);
    const o2 = vo2Curve(series, fromS, toS);
    return {
      x,
      y,
      xIsTime: false,
      toPoint: (knot) => {
        const timeS = timeAtValue(co2, knot);
        return { timeS, vo2MlMin: valueAtTime(o2, timeS) };
      },
    };
  },
});

export const detect = veVsVco2.detect;
