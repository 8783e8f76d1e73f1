/**
 * VT1 by the V-slope method with ventilation as a second witness: VCO2 and VE against VO2,
 * fitted together as two continuous two-segment lines with one shared knot
 * (core/thresholds/shared-knot.ts). The knot is VT1.
 *
 * Physiology: below VT1 ventilation tracks CO2 output; at VT1 the bicarbonate-buffered CO2
 * makes VCO2 rise faster than VO2 (the V-slope bend, Beaver, Wasserman & Whipp, J Appl Physiol
 * 1986;60:2020–7), and ventilation, still following VCO2 (isocapnic buffering), bends against
 * VO2 at the same point (the rise of VE/VO2 without a rise of VE/VCO2, Wasserman, Whipp, Koyal
 * & Beaver, J Appl Physiol 1973;35:236–43). Fitting both with one knot uses both signals
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
import { locallySmoothedVo2 } from './smooth-vo2';
import { vslopeSlopeReason } from './vslope-hinge';
import { windowPoints } from './window';

/** Half-width of the VO2 smoother, s (our choice, on development seeds). */
export const SMOOTH_HALF_WIDTH_S = 60;

const spec = {
  method: 'vslope-ve',
  label: 'V-slope with VE (shared breakpoint of VCO2 and VE against VO2)',
  source: 'Beaver, Wasserman & Whipp, J Appl Physiol 1986;60:2020–7; Wasserman et al., J Appl Physiol 1973;35:236–43; combined after Gaskill et al., Med Sci Sports Exerc 2001;33:1841–8',
};

export const detect: Detector = (input) => {
  const { series, fromS, toS, settings } = input;
  const smooth = locallySmoothedVo2(series, SMOOTH_HALF_WIDTH_S);
  const usable = (i: number) => Number.isFinite(smooth[i]) && Number.isFinite(series.vco2MlMin[i]) && Number.isFinite(series.veLMin[i]);
  const x = windowPoints(series, fromS, toS, (i) => (usable(i) ? smooth[i] : null)).value;
  const vco2 = windowPoints(series, fromS, toS, (i) => (usable(i) ? series.vco2MlMin[i] : null)).value;
  const ve = windowPoints(series, fromS, toS, (i) => (usable(i) ? series.veLMin[i] : null)).value;
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
    evidence: hingeEvidence('vo2MlMin', 'vco2MlMin', [Math.min(...x), Math.max(...x)], { knot: fit.knot, intercept: co2.intercept, slopeBefore: co2.slopeBefore, slopeAfter: co2.slopeAfter, rss: co2.rss, n: fit.n }),
  };
};
