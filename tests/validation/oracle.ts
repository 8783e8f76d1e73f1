/**
 * An oracle for VT1 on the generated tests: what a breakpoint fit can reach when it is told
 * more than any detector can know. It fits VCO2 and VE of each breath (the recorded, noisy
 * values; the true outlier breaths left out) against the model's NOISE-FREE VO2 at that breath,
 * with one shared knot (core/thresholds/shared-knot.ts), over the true window: the last minute
 * of the warm-up to the true VT2. No x-axis noise, no window to guess, no outlier to find; only
 * the y-axis breath noise remains. Its error is therefore a floor under what the detectors can
 * do on these data, not a method to ship.
 */
import { median, quantile } from '../../core/math/stats';
import { sharedKnotFit } from '../../core/thresholds/shared-knot';
import { generateTest, modelTrajectory, valueAt } from '../../sample-tests/generator';
import type { ValidationCase } from './cases';

/** Fewest breaths either side of the knot (the detectors' own floor, minPointsPerSegment). */
const MIN_PER_SIDE = 5;

export function oracleVt1ErrorPct(c: ValidationCase): number {
  const { table, truth } = generateTest(c.params, c.seed);
  const trajectory = modelTrajectory(c.params);
  const outliers = new Set(truth.outliers.map((o) => o.index));
  const x: number[] = [];
  const vco2: number[] = [];
  const ve: number[] = [];
  table.breaths.forEach((b, i) => {
    if (outliers.has(i) || b.timeS < trajectory.incrementalStartS - 60 || b.timeS > truth.vt2.timeS) return;
    x.push(valueAt(trajectory.vo2MlMin, b.timeS));
    vco2.push(b.vco2MlMin);
    ve.push(b.veLMin);
  });
  const fit = sharedKnotFit(x, [vco2, ve], MIN_PER_SIDE);
  return fit ? (100 * Math.abs(fit.knot - truth.vt1.vo2MlMin)) / truth.vt1.vo2MlMin : 100;
}

export function oracleSummary(cases: readonly ValidationCase[]): { median: number; p95: number } {
  const errors = cases.map(oracleVt1ErrorPct);
  return { median: median(errors), p95: quantile(errors, 0.95) };
}
