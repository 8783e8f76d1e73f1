/**
 * VT1 by the V-slope method, continuous (hinge) variant: VCO2 against VO2 over the incremental
 * phase up to a preliminary VT2, fitted by y = a + b·x + c·(x − k)+ with the knot k searched
 * exactly (core/thresholds/segments.ts). The knot is VT1.
 *
 * Source: Beaver et al., J Appl Physiol 1986;60:2020–7 (V-slope); the continuous
 * two-segment fit is the common variant (Hudson, J Am Stat Assoc 1966;61:1097–129, for the
 * exact knot search). Units: VO2 and VCO2 mL/min; the time at VT1 is read off the monotone
 * VO2 curve (core/thresholds/read-off.ts). Constraints on the two slopes, after Beaver et al.
 * 1986: the lower segment has a slope a little under 1 and the segment above VT1 a slope
 * above 1 (VCO2 rising faster than VO2: the CO2 from bicarbonate buffering); checked against
 * secondary descriptions of the method found with the search tool (ERS and methods texts),
 * not the paper itself. The paper's further criterion that the slope rises by more than 0.1
 * is memory. We accept a lower slope up to 1.1 (noise; our choice), an upper slope above
 * 1.0 and a rise of at least 0.1.
 */
import { hingeMethod, type MethodSample } from './hinge-method';
import type { DetectorInput } from './detector';
import { timeAtValue, vo2Curve } from './read-off';
import { windowPoints } from './window';
import type { HingeFit } from './segments';

export const SLOPE_BELOW_MAX = 1.1;
export const SLOPE_RISE_MIN = 0.1;
/** The segment above VT1 rises faster than VO2 (Beaver et al. 1986). */
export const SLOPE_ABOVE_MIN = 1.0;

/** VCO2 against VO2 over the window, knot read as VO2. */
export function vslopeSample(input: DetectorInput): MethodSample {
  const { series, fromS, toS } = input;
  const w = windowPoints(series, fromS, toS, (i) => (Number.isFinite(series.vo2MlMin[i]) ? series.vco2MlMin[i] : null));
  const x = windowPoints(series, fromS, toS, (i) => (Number.isFinite(series.vco2MlMin[i]) ? series.vo2MlMin[i] : null)).value;
  const curve = vo2Curve(series, fromS, toS);
  return { x, y: w.value, xIsTime: false, toPoint: (knot) => ({ timeS: timeAtValue(curve, knot), vo2MlMin: knot }) };
}

/** The V-slope expectation on the two slopes; a sentence when they do not meet it. */
export function vslopeSlopeReason(slopeBelow: number, slopeAbove: number): string | null {
  if (slopeBelow > SLOPE_BELOW_MAX) {
    return `The VCO2–VO2 slope below the break is ${slopeBelow.toFixed(2)}, above the ${SLOPE_BELOW_MAX} expected below VT1.`;
  }
  if (!(slopeAbove > SLOPE_ABOVE_MIN)) {
    return `The VCO2–VO2 slope above the break is ${slopeAbove.toFixed(2)}; above VT1 VCO2 rises faster than VO2 (slope above ${SLOPE_ABOVE_MIN.toFixed(1)}).`;
  }
  if (slopeAbove - slopeBelow < SLOPE_RISE_MIN) {
    return `The VCO2–VO2 slope rises by only ${(slopeAbove - slopeBelow).toFixed(2)} at the break; at least ${SLOPE_RISE_MIN} is expected at VT1.`;
  }
  return null;
}

export const vslopeHinge = hingeMethod({
  method: 'vslope-hinge',
  label: 'V-slope (continuous two-segment fit)',
  source: 'Beaver et al., J Appl Physiol 1986;60:2020–7; knot search after Hudson, J Am Stat Assoc 1966;61:1097–129',
  xName: 'vo2MlMin',
  yName: 'vco2MlMin',
  bend: 'rise',
  sample: vslopeSample,
  accept: (fit: HingeFit) => vslopeSlopeReason(fit.slopeBefore, fit.slopeAfter),
});

export const detect = vslopeHinge.detect;
