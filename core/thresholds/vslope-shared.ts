/**
 * VT1 by the V-slope method with ventilation as a second witness: VCO2 and VE against VO2,
 * fitted together as two continuous two-segment lines with one shared knot
 * (core/thresholds/shared-knot.ts). The knot is VT1.
 *
 * Physiology: below VT1 ventilation tracks CO2 output; at VT1 the bicarbonate-buffered CO2
 * makes VCO2 rise faster than VO2 (the V-slope bend, Beaver et al., J Appl Physiol
 * 1986;60:2020–7), and ventilation, still following VCO2 (isocapnic buffering), bends against
 * VO2 at the same point (the rise of VE/VO2 without a rise of VE/VCO2, Wasserman et
 * al., J Appl Physiol 1973;35:236–43). Fitting both with one knot uses both signals
 * (combining methods improves reliability: Gaskill et al., Med Sci Sports Exerc
 * 2001;33:1841–8). The x-axis is VO2 smoothed over ±60 s by a local straight line
 * (core/thresholds/smooth-vo2.ts, regression calibration for noise in x); VCO2 and VE are the
 * processed (averaged) values. Window: as the other VT1 methods (find-thresholds.ts
 * `vt1Window`). The ±60 s width was chosen on development seeds only (docs/validation.md).
 * Units: VO2, VCO2 mL/min, VE L/min; time read off the monotone VO2 curve. Acceptance: the
 * V-slope expectation on the VCO2 line (vslope-hinge.ts) and a steeper VE line after the knot.
 */
import type { Detector } from './detector';
import { minPerSide } from './edge-floor';
import { failed, hingeEvidence } from './hinge-method';
import { timeAtValue, vo2Curve } from './read-off';
import { sharedKnotFit } from './shared-knot';
import { locallySmoothed, locallySmoothedVo2 } from './smooth-vo2';
import { vslopeSlopeReason } from './vslope-hinge';
import { windowPoints } from './window';
import { maxOf, minOf } from '../math/stats';

/** Half-width of the VO2 smoother, s (our choice, on development seeds). */
export const SMOOTH_HALF_WIDTH_S = 60;

/** Whether the breath-size covariate is removed from VCO2 and VE (docs/validation.md). */
export const BREATH_SIZE_ADJUST = true;

/**
 * VCO2 or VE with the part that moves with VO2's own short-term scatter removed:
 * y − β·r, with r = VO2 − smoothed VO2 (the x-axis residual) and β the least-squares slope of
 * y's own short-term scatter (y − smoothed y) on r, over the window. Why: breath-to-breath
 * scatter of a larger or smaller breath moves VO2, VCO2 and VE together (the same tidal volume
 * carries all three; Lamarra et al., J Appl Physiol 1987, model breath noise per variable, the
 * shared part is memory). With VO2 smoothed on the x-axis that shared scatter stays in y as
 * noise about the two lines; entering r as a covariate takes it out (an added covariate in
 * least squares; r is nearly orthogonal to the slow two-segment shape, so it is removed
 * first, after Frisch–Waugh–Lovell, approximately). Our choice, tuned on development seeds.
 */
export function withoutBreathScatter(y: ArrayLike<number>, ySmooth: ArrayLike<number>, r: ArrayLike<number>): Float64Array {
  let srr = 0;
  let sry = 0;
  for (let i = 0; i < y.length; i++) {
    srr += r[i] * r[i];
    sry += r[i] * (y[i] - ySmooth[i]);
  }
  const beta = srr > 0 ? sry / srr : 0;
  const out = new Float64Array(y.length);
  for (let i = 0; i < y.length; i++) out[i] = y[i] - beta * r[i];
  return out;
}

const spec = {
  method: 'vslope-ve',
  label: 'V-slope with VE (shared breakpoint of VCO2 and VE against VO2)',
  source: 'Beaver et al., J Appl Physiol 1986;60:2020–7; Wasserman et al., J Appl Physiol 1973;35:236–43; combined after Gaskill et al., Med Sci Sports Exerc 2001;33:1841–8',
};

export const detect: Detector = (input) => {
  const { series, fromS, toS, settings } = input;
  const smooth = locallySmoothedVo2(series, SMOOTH_HALF_WIDTH_S);
  const smCo2 = locallySmoothed(series.timeS, series.vco2MlMin, SMOOTH_HALF_WIDTH_S);
  const smVe = locallySmoothed(series.timeS, series.veLMin, SMOOTH_HALF_WIDTH_S);
  const usable = (i: number) =>
    Number.isFinite(smooth[i]) && Number.isFinite(series.vo2MlMin[i]) && Number.isFinite(series.vco2MlMin[i]) && Number.isFinite(series.veLMin[i]) && Number.isFinite(smCo2[i]) && Number.isFinite(smVe[i]);
  const pick = (f: (i: number) => number) => windowPoints(series, fromS, toS, (i) => (usable(i) ? f(i) : null)).value;
  const x = pick((i) => smooth[i]);
  const r = pick((i) => series.vo2MlMin[i] - smooth[i]);
  const rawCo2 = pick((i) => series.vco2MlMin[i]);
  const rawVe = pick((i) => series.veLMin[i]);
  const vco2 = BREATH_SIZE_ADJUST ? withoutBreathScatter(rawCo2, pick((i) => smCo2[i]), r) : rawCo2;
  const ve = BREATH_SIZE_ADJUST ? withoutBreathScatter(rawVe, pick((i) => smVe[i]), r) : rawVe;
  const m = settings.thresholds.minPointsPerSegment;
  if (x.length < 2 * m) {
    return failed(spec, `Too few points in the search window: ${x.length} averaged points, at least ${2 * m} needed (${m} each side of a breakpoint).`);
  }
  const fit = sharedKnotFit(x, [vco2, ve], minPerSide(settings, x.length));
  if (!fit) return failed(spec, 'No two-line fit was possible: VO2 does not spread enough in the window.');
  const [co2, vent] = fit.lines;
  const reason = vslopeSlopeReason(co2.slopeBefore, co2.slopeAfter);
  if (reason) return failed(spec, reason);
  if (!(vent.slopeAfter > vent.slopeBefore)) return failed(spec, 'VE does not rise more steeply against VO2 after the break, as it should at VT1.');
  const timeS = timeAtValue(vo2Curve(series, fromS, toS), fit.knot);
  if (!Number.isFinite(timeS)) return failed(spec, 'The breakpoint could not be read off the VO2 series.');
  return {
    ...spec,
    found: true,
    timeS,
    vo2MlMin: fit.knot,
    evidence: hingeEvidence('vo2MlMin', 'vco2MlMin', [minOf(x), maxOf(x)], { knot: fit.knot, intercept: co2.intercept, slopeBefore: co2.slopeBefore, slopeAfter: co2.slopeAfter, rss: co2.rss, n: fit.n }),
  };
};
