/**
 * An oracle for VT1 on family 1's generated tests: one ACHIEVABLE reference, not a floor. It
 * fits VCO2 and VE of each breath (the recorded, noisy values; the true outlier breaths left
 * out) against the model's noise-free VO2 at that breath, with one shared knot
 * (core/thresholds/shared-knot.ts), over the true window: the last minute of the warm-up to the
 * true VT2. It is told what no detector knows (noise-free x, true window, true outliers), yet it
 * is not the best possible estimator: adding one step (the recorded VO2 residual as a
 * covariate, which removes the breath-size noise VO2, VCO2 and VE share) does better. So its
 * error says what one informed fit reaches, never what no method can beat; nothing asserts it.
 * Print it: npx tsx tests/validation/develop.ts with ORACLE=1.
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
