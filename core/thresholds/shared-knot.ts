/**
 * A continuous two-segment fit of several variables against one x with a single shared knot:
 * y_v = a_v + b_v·x + c_v·(x − k)+ for every variable v, the same k for all.
 *
 * Why: when two variables bend at the same physiological event, each carries its own noise
 * about that one breakpoint, and fitting them together uses the information of both
 * (combining methods improves the reliability of threshold detection: Gaskill et al., Med Sci
 * Sports Exerc 2001;33:1841–8). Criterion (weighted least squares, common practice): the sum
 * over variables of RSS_v(k) / σ_v², with σ_v² the residual variance of variable v's own best
 * two-segment fit (core/thresholds/segments.ts `hingeFit`), so that each variable counts by its
 * own precision whatever its unit.
 *
 * Search: the knot is tried at every data x that leaves `minPerSide` points on each side; for a
 * fixed knot each variable's fit is ordinary least squares in (1, x, (x − k)+), whose sums over
 * the points right of the knot come from the prefix sums of `preparePoints`, so the whole
 * search is linear in the number of points. Knot resolution is the spacing of the data's x
 * (a few mL/min of VO2 on averaged data). Units: those of x and each y.
 */
import { newScratch, type Scratch } from '../math/scratch';
import { hingeFit, preparePoints, type PreparedPoints } from './segments';

export interface SharedKnotFit {
  /** The shared knot, in x units. */
  readonly knot: number;
  /** Per variable: slope before and after the knot, and RSS at the shared knot. */
  readonly lines: readonly { readonly slopeBefore: number; readonly slopeAfter: number; readonly intercept: number; readonly rss: number }[];
  /** Weighted criterion at the knot (dimensionless). */
  readonly criterion: number;
  readonly n: number;
}

interface KnotLine {
  readonly b: number;
  readonly c: number;
  readonly rss: number;
  /** Intercept in centred coordinates. */
  readonly a: number;
}

/** OLS of centred y on (x, (x − k)+) with the knot at sorted point j (right run j+1..n−1). */
function lineAtKnot(p: PreparedPoints, j: number): KnotLine | null {
  const n = p.x.length;
  const kc = p.x[j] - p.mx;
  const { sx, sy, sxx, sxy, syy } = p;
  const nR = n - j - 1;
  const sxR = sx[n] - sx[j + 1];
  const sxxR = sxx[n] - sxx[j + 1];
  const sxyR = sxy[n] - sxy[j + 1];
  const syR = sy[n] - sy[j + 1];
  const zs = sxR - kc * nR;
  const zz = sxxR - 2 * kc * sxR + kc * kc * nR;
  const xz = sxxR - kc * sxR;
  const yz = sxyR - kc * syR;
  const sX = sx[n];
  const sY = sy[n];
  const cxx = sxx[n] - (sX * sX) / n;
  const cxz = xz - (sX * zs) / n;
  const czz = zz - (zs * zs) / n;
  const cxy = sxy[n] - (sX * sY) / n;
  const czy = yz - (zs * sY) / n;
  const cyy = syy[n] - (sY * sY) / n;
  const det = cxx * czz - cxz * cxz;
  if (!(Math.abs(det) > 1e-12 * Math.max(1, cxx * czz))) return null;
  const b = (czz * cxy - cxz * czy) / det;
  const c = (cxx * czy - cxz * cxy) / det;
  return { b, c, rss: Math.max(0, cyy - b * cxy - c * czy), a: (sY - b * sX - c * zs) / n };
}

/** Scratch for each variable's prepared points (core/math/scratch.ts). */
const SHARED_KNOT_SCRATCH: Scratch[] = [];

/**
 * The shared-knot fit of `ys` against `x` (all of equal length, finite); null when there are
 * too few points or no variable has a usable own fit.
 */
export function sharedKnotFit(x: ArrayLike<number>, ys: readonly ArrayLike<number>[], minPerSide: number): SharedKnotFit | null {
  const n = x.length;
  const m = Math.max(2, minPerSide);
  if (ys.length === 0 || n < 2 * m + 1) return null;
  // The prepared points are read only within this call: one reused scratch per variable.
  const prepared = ys.map((y, v) => preparePoints(x, y, false, (SHARED_KNOT_SCRATCH[v] ??= newScratch())));
  const weights: number[] = [];
  for (const p of prepared) {
    const own = hingeFit(p, m);
    const variance = own ? own.rss / Math.max(1, n - 4) : Number.NaN;
    if (!(variance > 0)) return null;
    weights.push(1 / variance);
  }
  const px = prepared[0].x;
  let best = Infinity;
  let bestJ = -1;
  for (let j = m - 1; j <= n - m - 1; j++) {
    if (!(px[j] < px[j + 1])) continue;
    let total = 0;
    let ok = true;
    for (let v = 0; v < prepared.length && ok; v++) {
      const line = lineAtKnot(prepared[v], j);
      if (!line) ok = false;
      else total += weights[v] * line.rss;
    }
    if (ok && total < best) {
      best = total;
      bestJ = j;
    }
  }
  if (bestJ < 0) return null;
  const knot = px[bestJ];
  const lines = prepared.map((p) => {
    const line = lineAtKnot(p, bestJ) as KnotLine;
    // Back from centred coordinates: y − my = a + b·(x − mx) + c·(x − k)+.
    return { slopeBefore: line.b, slopeAfter: line.b + line.c, intercept: p.my + line.a - line.b * p.mx, rss: line.rss };
  });
  return { knot, lines, criterion: best, n };
}
