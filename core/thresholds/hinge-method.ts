/**
 * The common frame of the breakpoint detectors that fit a continuous two-segment line
 * (core/thresholds/segments.ts, `hingeFit`) to one variable over a search window: collect the
 * points, fit, test that the bend is the one the method looks for, and read the threshold off
 * the series. Each method module supplies its points and its physiological test.
 *
 * Shared acceptance rule (our choice, stated so it can be checked): the bend must be in the
 * method's direction and large enough to see, i.e. where the two segments have drifted apart
 * by the end of the window, |slopeAfter − slopeBefore| · (xEnd − knot), must be at least
 * twice the residual standard deviation √(RSS / (n − 4)). A smaller bend is no breakpoint.
 */
import type { MethodEvidence, MethodOutcome } from '../model/analysis';
import type { Detector, DetectorInput } from './detector';
import { minPerSide } from './edge-floor';
import type { Scratch } from '../math/scratch';
import { DETECTOR_SCRATCH, hingeFit, preparePoints, type HingeFit, type PreparedPoints } from './segments';

export interface ThresholdPoint {
  readonly timeS: number;
  readonly vo2MlMin: number;
}

/** The points one method fits, and how its knot maps to a time and a VO2. */
export interface MethodSample {
  readonly x: ArrayLike<number>;
  readonly y: ArrayLike<number>;
  /** x is time (already in order) for the time-domain methods. */
  readonly xIsTime: boolean;
  readonly toPoint: (knot: number) => ThresholdPoint;
}

export interface HingeMethodSpec {
  readonly method: string;
  readonly label: string;
  readonly source: string;
  readonly xName: string;
  readonly yName: string;
  /** 'rise': the slope must increase at the knot; 'fall': it must decrease. */
  readonly bend: 'rise' | 'fall';
  /** The points over the window, or a sentence saying why there are none. */
  readonly sample: (input: DetectorInput) => MethodSample | string;
  /** A method-specific test of the fit; a sentence when the bend is not this threshold. */
  readonly accept?: (fit: HingeFit, input: DetectorInput, sample: MethodSample) => string | null;
}

export interface HingeMethod {
  readonly spec: HingeMethodSpec;
  readonly detect: Detector;
}

/** The shared acceptance rule; a reason when the fit shows no usable bend. */
export function bendReason(fit: HingeFit, p: PreparedPoints, bend: 'rise' | 'fall', yName: string): string | null {
  const change = fit.slopeAfter - fit.slopeBefore;
  if (bend === 'rise' ? change <= 0 : change >= 0) {
    return `No ${bend === 'rise' ? 'upward' : 'downward'} bend in ${yName}: the best two-line fit bends the other way.`;
  }
  const xEnd = p.x[p.x.length - 1];
  const sd = Math.sqrt(fit.rss / Math.max(1, fit.n - 4));
  if (Math.abs(change) * (xEnd - fit.knot) < 2 * sd) {
    return `No clear slope change in ${yName}: the bend is smaller than twice the scatter of the points.`;
  }
  return null;
}

/**
 * The evidence of a continuous two-segment fit over the x-range `window`: the line left of the
 * knot and the line right of it, which meet at the knot (so the right intercept follows from
 * the left line's value there).
 */
export function hingeEvidence(
  xName: string,
  yName: string,
  window: readonly [number, number],
  fit: { readonly knot: number; readonly intercept: number; readonly slopeBefore: number; readonly slopeAfter: number; readonly rss: number; readonly n: number },
): MethodEvidence {
  const [x0, x1] = window;
  const knotY = fit.intercept + fit.slopeBefore * fit.knot;
  return {
    xName,
    yName,
    window: [x0, x1],
    segments: [
      { x0, x1: fit.knot, slope: fit.slopeBefore, intercept: fit.intercept },
      { x0: fit.knot, x1, slope: fit.slopeAfter, intercept: knotY - fit.slopeAfter * fit.knot },
    ],
    residualSumSquares: fit.rss,
    points: fit.n,
  };
}

export function failed(spec: { method: string; label: string; source: string }, reason: string): MethodOutcome {
  return { method: spec.method, label: spec.label, source: spec.source, found: false, reason };
}

/** Fit a sample; null when there are too few points either side. */
export function fitSample(sample: MethodSample, minPerSide: number, scratch?: Scratch): { p: PreparedPoints; fit: HingeFit } | null {
  const p = preparePoints(sample.x, sample.y, sample.xIsTime, scratch);
  const fit = hingeFit(p, minPerSide);
  return fit ? { p, fit } : null;
}

export function hingeMethod(spec: HingeMethodSpec): HingeMethod {
  const detect: Detector = (input) => {
    const sample = spec.sample(input);
    if (typeof sample === 'string') return failed(spec, sample);
    const m = input.settings.thresholds.minPointsPerSegment;
    if (sample.x.length < 2 * m) {
      return failed(
        spec,
        `Too few points in the search window: ${sample.x.length} averaged points, at least ${2 * m} needed (${m} each side of a breakpoint).`,
      );
    }
    // The points are read only within this call (the bootstrap makes its own), so they go in the shared scratch.
    const fitted = fitSample(sample, minPerSide(input.settings, sample.x.length), DETECTOR_SCRATCH);
    if (!fitted) return failed(spec, `No two-line fit was possible: ${spec.xName} does not spread enough in the window.`);
    const { p, fit } = fitted;
    const reason = bendReason(fit, p, spec.bend, spec.yName) ?? spec.accept?.(fit, input, sample) ?? null;
    if (reason) return failed(spec, reason);
    const at = sample.toPoint(fit.knot);
    if (!Number.isFinite(at.timeS) || !Number.isFinite(at.vo2MlMin)) {
      return failed(spec, 'The breakpoint could not be read off the VO2 series.');
    }
    return {
      method: spec.method,
      label: spec.label,
      source: spec.source,
      found: true,
      timeS: at.timeS,
      vo2MlMin: at.vo2MlMin,
      evidence: hingeEvidence(spec.xName, spec.yName, [p.x[0], p.x[p.x.length - 1]], fit),
    };
  };
  return { spec, detect };
}
