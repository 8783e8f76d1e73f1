/**
 * A time-domain sample for the methods that look for a bend in a quantity over time
 * (ventilatory equivalents, excess CO2, end-tidal pressures): x is time in s, the knot is the
 * threshold's time, and its VO2 is read off the monotone VO2 curve (core/thresholds/read-off.ts).
 */
import { linearFit } from '../math/linear-fit';
import type { DetectorInput } from './detector';
import type { MethodSample } from './hinge-method';
import { valueAtTime, vo2Curve } from './read-off';
import { windowPoints } from './window';

export function timeSample(input: DetectorInput, quantity: (i: number) => number | null): MethodSample {
  const { series, fromS, toS } = input;
  const w = windowPoints(series, fromS, toS, quantity);
  const curve = vo2Curve(series, fromS, toS);
  return { x: w.timeS, y: w.value, xIsTime: true, toPoint: (knot) => ({ timeS: knot, vo2MlMin: valueAtTime(curve, knot) }) };
}

/** Least-squares slope of a quantity over time from `fromS` to `toS`; NaN with fewer than 3 points. */
export function slopeOverTime(input: DetectorInput, fromS: number, toS: number, quantity: (i: number) => number | null): number {
  const w = windowPoints(input.series, fromS, toS, quantity);
  if (w.timeS.length < 3) return Number.NaN;
  return linearFit(w.timeS, w.value)?.slope ?? Number.NaN;
}
