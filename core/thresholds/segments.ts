/**
 * Shared segment fitting for the breakpoint detectors: two straight lines through (x, y).
 *
 * (a) `twoRegressionSplit`: the two-regression split of the V-slope method (Beaver, Wasserman &
 *     Whipp, J Appl Physiol 1986;60:2020–7). For every split of the x-sorted points into a left
 *     and a right run, fit a separate ordinary least-squares line to each; keep the split with
 *     the smallest total residual sum of squares RSS_left + RSS_right. Beaver et al. compared
 *     the two-line fit with the single-line fit through all points (a ratio of the single-line
 *     to the two-line error, as recalled: memory); the single-line error does not depend on
 *     the split and the two-line fit always has four parameters, so maximising that ratio and
 *     minimising the total two-line RSS choose the same split. We state the criterion as the
 *     RSS because it needs no assumption about how their ratio was scaled. The breakpoint is
 *     the x where the two lines cross, clamped to the x-range of the data.
 * (b) `hingeFit`: the continuous two-segment least-squares fit
 *     y = a + b·x + c·(x − k)+, the knot k searched over every interval between neighbouring
 *     x values. Within one interval the set of points right of the knot is fixed; following
 *     Hudson (J Am Stat Assoc 1966;61:1097–129) the best knot there is the crossing of the
 *     two separately fitted lines when that crossing lies inside the interval (then the
 *     continuous fit equals the two-line fit), otherwise an end of the interval, i.e. a data
 *     point. Both are evaluated, so the search is exact, not a grid.
 *
 * Both searches are linear in the number of points: the per-run sums of x, y, x², xy, y² come
 * from prefix sums, computed on x and y centred at their means so that large VO2 values do
 * not cost precision. Units are those of x and y (mL/min for VCO2 against VO2). Assumptions:
 * finite values only (callers remove the rest and say how many they used), at least
 * `minPerSide` points on each side of the break.
 */
import { newScratch, scratchArrays, type Scratch } from '../math/scratch';

export interface LineFit {
  readonly slope: number;
  readonly intercept: number;
  readonly rss: number;
  readonly n: number;
}

export interface TwoRegressionFit {
  /** Points in the left run (the right run starts at this index of the x-sorted data). */
  readonly splitIndex: number;
  readonly left: LineFit;
  readonly right: LineFit;
  readonly rss: number;
  /** Where the two lines cross, clamped to the data's x-range. */
  readonly breakX: number;
  /** x of the last left point and the first right point. */
  readonly splitBetween: readonly [number, number];
}

export interface HingeFit {
  readonly knot: number;
  /** Line left of the knot: y = intercept + slopeBefore · x. */
  readonly intercept: number;
  readonly slopeBefore: number;
  readonly slopeAfter: number;
  readonly rss: number;
  readonly n: number;
  /** Points with x ≤ knot. */
  readonly pointsBefore: number;
}

/**
 * What the two fits read: the x-sorted x, the means, and prefix sums of the centred values
 * (entry i covers points 0..i−1). The number of points is x's length; the sum arrays may be
 * longer than that plus one (the bootstrap's shared scratch arrays), entries past it are not read.
 */
export interface PrefixSums {
  readonly x: Float64Array;
  readonly mx: number;
  readonly my: number;
  readonly sx: Float64Array;
  readonly sy: Float64Array;
  readonly sxx: Float64Array;
  readonly sxy: Float64Array;
  readonly syy: Float64Array;
}

/** Points sorted by x (stable), with their means, centred values and prefix sums. */
export interface PreparedPoints extends PrefixSums {
  readonly y: Float64Array;
}

/** Element moves per point the insertion sort may make before it gives up (our choice). */
const INSERTION_MOVES_PER_POINT = 16;

/**
 * Stable insertion sort of (x, y) pairs by x into `x` and `y`; false (outputs unusable) when it
 * would need more than `INSERTION_MOVES_PER_POINT` moves per point. Most samples are VO2 in time
 * order, nearly sorted already (only breath noise swaps neighbours), where this costs about one
 * pass instead of a comparison sort; a pair moves only past strictly larger x, so ties keep
 * their order exactly as the comparison sort by (x, index) does.
 */
function insertionSorted(xIn: ArrayLike<number>, yIn: ArrayLike<number>, x: Float64Array, y: Float64Array, n: number): boolean {
  let budget = INSERTION_MOVES_PER_POINT * n;
  for (let i = 0; i < n; i++) {
    const xi = xIn[i];
    const yi = yIn[i];
    let j = i - 1;
    while (j >= 0 && x[j] > xi) {
      x[j + 1] = x[j];
      y[j + 1] = y[j];
      j--;
      if (--budget < 0) return false;
    }
    x[j + 1] = xi;
    y[j + 1] = yi;
  }
  return true;
}

/** Run length the merge sort starts from, sorted by insertion (our choice). */
const MERGE_RUN = 32;
const MERGE_SCRATCH = newScratch();

/**
 * Stable sort of the pairs (x[i], y[i]), i < n, by x, in place: insertion-sorted runs of
 * `MERGE_RUN`, then bottom-up merges that take from the left run on ties, so the order is that
 * of a comparison sort by (x, index). For samples too far from sorted for the insertion sort
 * (a dense recording's averaged VO2 moves about 23 places per point): the comparison sort of an
 * index array it replaces spent about 11 ms on 22,000 points.
 */
function mergeSorted(x: Float64Array, y: Float64Array, n: number): void {
  for (let start = 0; start < n; start += MERGE_RUN) {
    const end = Math.min(n, start + MERGE_RUN);
    for (let i = start + 1; i < end; i++) {
      const xi = x[i];
      const yi = y[i];
      let j = i - 1;
      while (j >= start && x[j] > xi) {
        x[j + 1] = x[j];
        y[j + 1] = y[j];
        j--;
      }
      x[j + 1] = xi;
      y[j + 1] = yi;
    }
  }
  if (n <= MERGE_RUN) return;
  const [tx, ty] = scratchArrays(MERGE_SCRATCH, [n, n]);
  mergeRuns(x, y, n, tx, ty);
}

function mergeRuns(x: Float64Array, y: Float64Array, n: number, tx: Float64Array, ty: Float64Array): void {
  let srcX = x;
  let srcY = y;
  let dstX = tx;
  let dstY = ty;
  for (let width = MERGE_RUN; width < n; width *= 2) {
    for (let lo = 0; lo < n; lo += 2 * width) {
      const mid = Math.min(n, lo + width);
      const hi = Math.min(n, lo + 2 * width);
      let i = lo;
      let j = mid;
      let k = lo;
      while (i < mid && j < hi) {
        if (srcX[j] < srcX[i]) {
          dstX[k] = srcX[j];
          dstY[k++] = srcY[j++];
        } else {
          dstX[k] = srcX[i];
          dstY[k++] = srcY[i++];
        }
      }
      while (i < mid) {
        dstX[k] = srcX[i];
        dstY[k++] = srcY[i++];
      }
      while (j < hi) {
        dstX[k] = srcX[j];
        dstY[k++] = srcY[j++];
      }
    }
    [srcX, dstX] = [dstX, srcX];
    [srcY, dstY] = [dstY, srcY];
  }
  if (srcX !== x) {
    x.set(srcX.subarray(0, n));
    y.set(srcY.subarray(0, n));
  }
}

/** One scratch for the detectors' own fits, whose points do not outlive the detector call (see core/math/scratch.ts; not the bootstrap's, which keeps x). */
export const DETECTOR_SCRATCH: Scratch = newScratch();

/**
 * Sort by x and build the prefix sums; x and y must be finite and of equal length. With
 * `scratch`, the arrays are views into it and are overwritten by the next fit that uses it.
 */
export function preparePoints(xIn: ArrayLike<number>, yIn: ArrayLike<number>, alreadySorted = false, scratch?: Scratch): PreparedPoints {
  const n = Math.min(xIn.length, yIn.length);
  const [x, y, sx, sy, sxx, sxy, syy] = scratchArrays(scratch, [n, n, n + 1, n + 1, n + 1, n + 1, n + 1]);
  if (alreadySorted) {
    for (let i = 0; i < n; i++) {
      x[i] = xIn[i];
      y[i] = yIn[i];
    }
  } else if (!insertionSorted(xIn, yIn, x, y, n)) {
    for (let i = 0; i < n; i++) {
      x[i] = xIn[i];
      y[i] = yIn[i];
    }
    mergeSorted(x, y, n);
  }
  let mx = 0;
  let my = 0;
  for (let i = 0; i < n; i++) {
    mx += x[i];
    my += y[i];
  }
  mx = n > 0 ? mx / n : 0;
  my = n > 0 ? my / n : 0;
  sx[0] = 0;
  sy[0] = 0;
  sxx[0] = 0;
  sxy[0] = 0;
  syy[0] = 0;
  for (let i = 0; i < n; i++) {
    const cx = x[i] - mx;
    const cy = y[i] - my;
    sx[i + 1] = sx[i] + cx;
    sy[i + 1] = sy[i] + cy;
    sxx[i + 1] = sxx[i] + cx * cx;
    sxy[i + 1] = sxy[i] + cx * cy;
    syy[i + 1] = syy[i] + cy * cy;
  }
  return { x, y, mx, my, sx, sy, sxx, sxy, syy };
}

/** Centred OLS over points [from, to): slope, centred intercept and RSS; null without x spread. */
function runFit(p: PrefixSums, from: number, to: number): { b: number; a: number; rss: number } | null {
  const n = to - from;
  if (n < 2) return null;
  const sx = p.sx[to] - p.sx[from];
  const sy = p.sy[to] - p.sy[from];
  const dxx = p.sxx[to] - p.sxx[from] - (sx * sx) / n;
  const dxy = p.sxy[to] - p.sxy[from] - (sx * sy) / n;
  const dyy = p.syy[to] - p.syy[from] - (sy * sy) / n;
  if (!(dxx > 0)) return null;
  const b = dxy / dxx;
  return { b, a: sy / n - (b * sx) / n, rss: Math.max(0, dyy - b * dxy) };
}

function toLine(p: PrefixSums, f: { b: number; a: number; rss: number }, n: number): LineFit {
  return { slope: f.b, intercept: p.my + f.a - f.b * p.mx, rss: f.rss, n };
}

/**
 * The two-regression split with the smallest total RSS; null when no split leaves `minPerSide`
 * a side. The same lower bounds as `hingeFit` make it faster without changing its answer: a
 * block of `SKIP_BLOCK` splits is skipped when its left RSS at the start plus its right RSS at
 * the end cannot beat the best split so far, and `nearSplit` (the bootstrap passes the original
 * split) has the splits within `HINT_REACH` of it evaluated first, whose best RSS then bounds
 * the search.
 */
export function twoRegressionSplit(p: PrefixSums, minPerSide: number, nearSplit?: number): TwoRegressionFit | null {
  const n = p.x.length;
  const m = Math.max(2, minPerSide);
  const cap = rssNear(nearSplit, m, n - m, (from, to) => splitSearch(p, from, to, Infinity).rss);
  const { s: bestS, rss: bestRss } = splitSearch(p, m, n - m, cap);
  if (bestS < 0) return null;
  const best = { s: bestS, rss: bestRss, l: runFit(p, 0, bestS)!, r: runFit(p, bestS, n)! };
  const left = toLine(p, best.l, best.s);
  const right = toLine(p, best.r, n - best.s);
  const lo = p.x[0];
  const hi = p.x[n - 1];
  const between: [number, number] = [p.x[best.s - 1], p.x[best.s]];
  let breakX = (between[0] + between[1]) / 2;
  if (left.slope !== right.slope) {
    const cross = (right.intercept - left.intercept) / (left.slope - right.slope);
    if (Number.isFinite(cross)) breakX = Math.min(hi, Math.max(lo, cross));
  }
  return { splitIndex: best.s, left, right, rss: best.rss, breakX, splitBetween: between };
}

/** The best split s in from..to (left run 0..s−1) and its RSS; s −1 when none; blocks bounded above `cap` are skipped. */
function splitSearch(p: PrefixSums, from: number, to: number, cap: number): { s: number; rss: number } {
  const n = p.x.length;
  const { sx, sy, sxx, sxy, syy } = p;
  let bestS = -1;
  let bestRss = Infinity;
  let blockEnd = from - 1;
  for (let s = from; s <= to; s++) {
    if (s > blockEnd) {
      // RSS_left only grows and RSS_right only falls as s moves right (see hingeSearch).
      blockEnd = Math.min(to, s + SKIP_BLOCK - 1);
      const bound = lineRss(p, 0, s) + lineRss(p, blockEnd, n);
      if (bound >= bestRss || bound > cap) {
        s = blockEnd;
        continue;
      }
    }
    const nr = n - s;
    const sxl = sx[s];
    const syl = sy[s];
    const sxr = sx[n] - sxl;
    const syr = sy[n] - syl;
    const lxx = sxx[s] - (sxl * sxl) / s;
    const rxx = sxx[n] - sxx[s] - (sxr * sxr) / nr;
    if (!(lxx > 0 && rxx > 0)) continue;
    const lxy = sxy[s] - (sxl * syl) / s;
    const rxy = sxy[n] - sxy[s] - (sxr * syr) / nr;
    const lyy = syy[s] - (syl * syl) / s;
    const ryy = syy[n] - syy[s] - (syr * syr) / nr;
    const rss = Math.max(0, lyy - (lxy * lxy) / lxx) + Math.max(0, ryy - (rxy * rxy) / rxx);
    if (rss < bestRss) {
      bestRss = rss;
      bestS = s;
    }
  }
  return { s: bestS, rss: bestRss };
}

/**
 * The least-squares continuous two-segment fit; null when no knot leaves `minPerSide` a side.
 * For partition j (points 0..j left, j+1..n−1 right) it evaluates the crossing of the two
 * separate lines when it lies strictly inside (x_j, x_j+1), else the knot at x_j by the 3 × 3
 * normal equations for (a, b, c) of y = a + b·x + c·(x − k)+. All in centred coordinates and
 * without allocation, since the bootstrap calls this hundreds of times per test.
 *
 * Two lower bounds make the search faster without changing its answer (branch and bound):
 * - the two separate lines' RSS of a partition bounds every continuous fit in it from below,
 *   and the sum of the left run's RSS at the start of a block of `SKIP_BLOCK` partitions and
 *   the right run's RSS at its end bounds the whole block (see `hingeSearch`); a block or
 *   partition that cannot beat the best fit so far is skipped;
 * - `nearPartition` (the bootstrap passes the original fit's, `pointsBefore − 1`): the
 *   partitions within `HINT_REACH` of it are evaluated first, and the smallest RSS there is
 *   one some knot reaches, so anything whose bound exceeds it is skipped from the start.
 * The full search then makes the same comparisons in the same order as without the bounds
 * and returns the same fit; it could differ only where two candidates' RSS differ by rounding
 * alone. tests/core/thresholds/segments.test.ts checks it against a golden-section search of
 * every knot interval and against itself without the hint, and the bootstrap's digests
 * (tests/core/thresholds/bootstrap-identity.test.ts) are unchanged.
 */
export function hingeFit(p: PrefixSums, minPerSide: number, nearPartition?: number): HingeFit | null {
  const n = p.x.length;
  const m = Math.max(2, minPerSide);
  const first = m - 1;
  const last = n - m - 1;
  const cap = rssNear(nearPartition, first, last, (from, to) => hingeSearch(p, from, to, Infinity)?.rss ?? Infinity);
  return hingeSearch(p, first, last, cap);
}

/** Candidates either side of the hint that are evaluated first (our choice: the knot of a replicate seldom moves far). */
const HINT_REACH = 2;

/**
 * The best RSS among the candidates within `HINT_REACH` of `near` (clipped to first..last),
 * found by `search`; Infinity without a hint or when none lies in the range. An RSS some
 * candidate reaches, so it bounds the full search from above.
 */
function rssNear(near: number | undefined, first: number, last: number, search: (from: number, to: number) => number): number {
  if (near === undefined) return Infinity;
  const from = Math.max(first, near - HINT_REACH);
  const to = Math.min(last, near + HINT_REACH);
  return from <= to ? search(from, to) : Infinity;
}

/** Partitions per block of the block bound in `hingeSearch` (our choice; any size gives the same fit). */
const SKIP_BLOCK = 16;

/** RSS of the least-squares line through points [from, to), from the prefix sums; 0 with fewer than 3 points or no x spread (still a lower bound). */
function lineRss(p: PrefixSums, from: number, to: number): number {
  const n = to - from;
  if (n < 3) return 0;
  const sx = p.sx[to] - p.sx[from];
  const sy = p.sy[to] - p.sy[from];
  const dxx = p.sxx[to] - p.sxx[from] - (sx * sx) / n;
  if (!(dxx > 0)) return 0;
  const dxy = p.sxy[to] - p.sxy[from] - (sx * sy) / n;
  const dyy = p.syy[to] - p.syy[from] - (sy * sy) / n;
  return Math.max(0, dyy - (dxy * dxy) / dxx);
}

/**
 * The search of `hingeFit` over partitions `from..to`; a partition whose two-line RSS exceeds
 * `cap` is skipped (Infinity: none is).
 */
function hingeSearch(p: PrefixSums, from: number, to: number, cap: number): HingeFit | null {
  const n = p.x.length;
  const { x, mx, sx, sy, sxx, sxy, syy } = p;
  // Whole-data sums (centred, so sX and sY are zero up to rounding).
  const sX = sx[n];
  const sY = sy[n];
  const sXX = sxx[n];
  const sXY = sxy[n];
  const sYY = syy[n];
  const XX = sXX - (sX * sX) / n;
  const XY = sXY - (sX * sY) / n;
  const YY = sYY - (sY * sY) / n;
  let bestRss = Infinity;
  let bestK = 0;
  let bestA = 0;
  let bestB = 0;
  let bestC = 0;
  let bestJ = -1;
  let blockEnd = from - 1;
  for (let j = from; j <= to; j++) {
    if (j > blockEnd) {
      // A new block of partitions j..blockEnd. Over it the left run only gains points and the
      // right run only loses them, and a least-squares line's RSS never falls when points are
      // added, so RSS_left(j) + RSS_right(blockEnd) bounds every partition's two-line RSS from
      // below: when it cannot beat the best so far (or exceeds `cap`), the block is skipped.
      blockEnd = Math.min(to, j + SKIP_BLOCK - 1);
      const bound = lineRss(p, 0, j + 1) + lineRss(p, blockEnd + 1, n);
      if (bound >= bestRss || bound > cap) {
        j = blockEnd;
        continue;
      }
    }
    const xj = x[j] - mx;
    const xj1 = x[j + 1] - mx;
    if (!(xj < xj1)) continue; // tied x: the knot at this value is taken at the last tied point
    const nl = j + 1;
    const nr = n - nl;
    const inl = 1 / nl;
    const inr = 1 / nr;
    const sxl = sx[nl];
    const syl = sy[nl];
    const sxr = sX - sxl;
    const syr = sY - syl;
    const sxxr = sXX - sxx[nl];
    const sxyr = sXY - sxy[nl];
    // The two separate lines of this partition. Their total RSS bounds from below every
    // continuous fit with the knot in [x_j, x_j+1), so a partition that cannot beat the best
    // so far is skipped whole.
    const lxx = sxx[nl] - sxl * sxl * inl;
    const rxx = sxxr - sxr * sxr * inr;
    if (lxx > 0 && rxx > 0) {
      const lxy = sxy[nl] - sxl * syl * inl;
      const rxy = sxyr - sxr * syr * inr;
      const bl = lxy / lxx;
      const br = rxy / rxx;
      const twoLine = syy[nl] - syl * syl * inl - bl * lxy + (sYY - syy[nl] - syr * syr * inr - br * rxy);
      if (twoLine >= bestRss || twoLine > cap) continue;
      // Knot inside (x_j, x_j+1): the two lines' crossing, if it lies there (Hudson 1966).
      if (bl !== br) {
        const al = (syl - bl * sxl) * inl;
        const ar = (syr - br * sxr) * inr;
        const kc = (ar - al) / (bl - br);
        if (kc > xj && kc < xj1) {
          bestRss = twoLine;
          bestK = kc;
          bestA = al;
          bestB = bl;
          bestC = br - bl;
          bestJ = j;
          continue; // the two-line RSS is the bound, so the knot at x_j cannot do better
        }
      }
    }
    // Knot at the data point x_j: hinge column z = (x − x_j)+, intercept eliminated.
    const kc = xj;
    const sZ = sxr - kc * nr;
    const xz = sxxr - kc * sxr - (sX * sZ) / n;
    const zz = sxxr - 2 * kc * sxr + kc * kc * nr - (sZ * sZ) / n;
    const zy = sxyr - kc * syr - (sZ * sY) / n;
    const det = XX * zz - xz * xz;
    if (det > 1e-12 * XX * zz) {
      const b = (XY * zz - zy * xz) / det;
      const c = (zy * XX - XY * xz) / det;
      const rss = YY - b * XY - c * zy;
      if (rss < bestRss) {
        bestRss = rss;
        bestK = kc;
        bestB = b;
        bestC = c;
        bestA = (sY - b * sX - c * sZ) / n;
        bestJ = j;
      }
    }
  }
  if (bestJ < 0) return null;
  return {
    knot: bestK + p.mx,
    intercept: p.my + bestA - bestB * p.mx,
    slopeBefore: bestB,
    slopeAfter: bestB + bestC,
    rss: Math.max(0, bestRss),
    n,
    pointsBefore: bestJ + 1,
  };
}

/** Fitted value of a hinge fit at x. */
export function hingeValue(fit: HingeFit, x: number): number {
  return fit.intercept + fit.slopeBefore * x + (x > fit.knot ? (fit.slopeAfter - fit.slopeBefore) * (x - fit.knot) : 0);
}
