/**
 * Ordinary least squares for y = intercept + slope · x.
 *
 * Example: linearFit([0, 1, 2], [1, 3, 5]) → { slope: 2, intercept: 1, r2: 1, n: 3, rss: 0 }.
 */

export interface LinearFit {
  readonly slope: number;
  readonly intercept: number;
  /** Coefficient of determination; NaN when y has no variance. */
  readonly r2: number;
  /** Residual sum of squares. */
  readonly rss: number;
  readonly n: number;
}

/** Fit over all pairs; null with fewer than two points or no spread in x. */
export function linearFit(x: ArrayLike<number>, y: ArrayLike<number>): LinearFit | null {
  const n = Math.min(x.length, y.length);
  if (n < 2) return null;
  let sx = 0;
  let sy = 0;
  for (let i = 0; i < n; i++) {
    sx += x[i];
    sy += y[i];
  }
  const mx = sx / n;
  const my = sy / n;
  let sxx = 0;
  let sxy = 0;
  let syy = 0;
  for (let i = 0; i < n; i++) {
    const dx = x[i] - mx;
    const dy = y[i] - my;
    sxx += dx * dx;
    sxy += dx * dy;
    syy += dy * dy;
  }
  if (sxx === 0) return null;
  const slope = sxy / sxx;
  const intercept = my - slope * mx;
  const rss = Math.max(0, syy - slope * sxy);
  return { slope, intercept, r2: syy === 0 ? Number.NaN : 1 - rss / syy, rss, n };
}
