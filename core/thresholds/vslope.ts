/**
 * VT1 by the V-slope method as first published: VCO2 against VO2 over the incremental phase
 * up to a preliminary VT2; two separate least-squares lines, left and right of every split,
 * the split with the smallest total residual sum of squares (core/thresholds/segments.ts,
 * `twoRegressionSplit`, which explains why that criterion). VT1 is the VO2 where the two
 * lines cross.
 *
 * Source: Beaver et al., J Appl Physiol 1986;60:2020–7. Units: VO2 and VCO2
 * mL/min; time read off the monotone VO2 curve. Assumptions as in vslope-hinge.ts: lower slope
 * at most 1.1 (near 1) and a rise of at least 0.1 (memory).
 */
import type { Detector } from './detector';
import { minPerSide } from './edge-floor';
import { failed } from './hinge-method';
import { DETECTOR_SCRATCH, preparePoints, twoRegressionSplit } from './segments';
import { vslopeSample, vslopeSlopeReason } from './vslope-hinge';

const spec = {
  method: 'vslope',
  label: 'V-slope (two regressions)',
  source: 'Beaver et al., J Appl Physiol 1986;60:2020–7',
};

export const detect: Detector = (input) => {
  const sample = vslopeSample(input);
  const m = input.settings.thresholds.minPointsPerSegment;
  if (sample.x.length < 2 * m) {
    return failed(spec, `Too few points in the search window: ${sample.x.length} averaged points, at least ${2 * m} needed (${m} each side of a breakpoint).`);
  }
  // The points are read only within this call, so they go in the shared scratch.
  const p = preparePoints(sample.x, sample.y, false, DETECTOR_SCRATCH);
  const fit = twoRegressionSplit(p, minPerSide(input.settings, p.x.length));
  if (!fit) return failed(spec, 'No two-line fit was possible: VO2 does not spread enough in the window.');
  const reason = vslopeSlopeReason(fit.left.slope, fit.right.slope);
  if (reason) return failed(spec, reason);
  const at = sample.toPoint(fit.breakX);
  if (!Number.isFinite(at.timeS)) return failed(spec, 'The breakpoint could not be read off the VO2 series.');
  const x0 = p.x[0];
  const x1 = p.x[p.x.length - 1];
  return {
    ...spec,
    found: true,
    timeS: at.timeS,
    vo2MlMin: at.vo2MlMin,
    evidence: {
      xName: 'vo2MlMin',
      yName: 'vco2MlMin',
      window: [x0, x1],
      segments: [
        { x0, x1: fit.splitBetween[0], slope: fit.left.slope, intercept: fit.left.intercept },
        { x0: fit.splitBetween[1], x1, slope: fit.right.slope, intercept: fit.right.intercept },
      ],
      residualSumSquares: fit.rss,
      points: p.x.length,
    },
  };
};
