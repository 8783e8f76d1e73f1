// Reference: ml-regression's SimpleLinearRegression (ordinary least squares, npm ml-regression
// 6.3.0). Each segment of Twofold's two-regression split (core/thresholds/segments.ts) is an OLS
// line through its own points, so its slope and intercept must equal ml-regression's fit of
// those same points to near machine precision.
import { describe, expect, it } from 'vitest';
import { SimpleLinearRegression } from 'ml-regression';
import { normalRandom, seededRandom } from '../../core/math/random';
import { preparePoints, twoRegressionSplit } from '../../core/thresholds/segments';

describe('two-regression segments against ml-regression', () => {
  it.each([1, 2, 3, 4])('seed %i: both lines match SimpleLinearRegression on their points', (seed) => {
    const g = normalRandom(seededRandom(seed));
    const x = Array.from({ length: 150 }, (_, i) => 700 + 12 * i + 20 * g());
    const y = x.map((v) => 0.93 * v - 20 + 0.4 * Math.max(0, v - 1500) + 25 * g());
    const p = preparePoints(x, y);
    const fit = twoRegressionSplit(p, 8)!;
    const xs = Array.from(p.x);
    const ys = Array.from(p.y);
    const left = new SimpleLinearRegression(xs.slice(0, fit.splitIndex), ys.slice(0, fit.splitIndex));
    const right = new SimpleLinearRegression(xs.slice(fit.splitIndex), ys.slice(fit.splitIndex));
    expect(fit.left.slope).toBeCloseTo(left.slope, 9);
    expect(fit.left.intercept).toBeCloseTo(left.intercept, 6);
    expect(fit.right.slope).toBeCloseTo(right.slope, 9);
    expect(fit.right.intercept).toBeCloseTo(right.intercept, 6);
  });
});
