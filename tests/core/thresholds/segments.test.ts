// Checks the prefix-sum searches of core/thresholds/segments.ts against brute force: every
// split refitted from scratch with core/math/linear-fit.ts, and for the hinge fit every knot
// interval minimised by a golden-section search on directly computed least squares
// (reference method: Hudson, J Am Stat Assoc 1966;61:1097–129, exact knot search).
import { describe, expect, it } from 'vitest';
import { linearFit } from '../../../core/math/linear-fit';
import { normalRandom, seededRandom } from '../../../core/math/random';
import { newScratch } from '../../../core/math/scratch';
import { hingeFit, hingeValue, preparePoints, twoRegressionSplit } from '../../../core/thresholds/segments';

function brokenLine(n: number, seed: number, noise: number, knot: number) {
  const gauss = normalRandom(seededRandom(seed));
  const x: number[] = [];
  const y: number[] = [];
  for (let i = 0; i < n; i++) {
    const xi = 800 + (2200 * i) / (n - 1) + gauss() * noise;
    x.push(xi);
    y.push(-50 + 0.92 * xi + 0.45 * Math.max(0, xi - knot) + gauss() * noise);
  }
  return { x, y };
}

function bruteTwoRegression(x: number[], y: number[], m: number) {
  const order = x.map((_, i) => i).sort((a, b) => x[a] - x[b] || a - b);
  const xs = order.map((i) => x[i]);
  const ys = order.map((i) => y[i]);
  let best = { s: -1, rss: Infinity };
  for (let s = m; s <= xs.length - m; s++) {
    const l = linearFit(xs.slice(0, s), ys.slice(0, s));
    const r = linearFit(xs.slice(s), ys.slice(s));
    if (l && r && l.rss + r.rss < best.rss) best = { s, rss: l.rss + r.rss };
  }
  return best;
}

/** Direct least squares of y on [1, x, (x − k)+] by 3 × 3 normal equations in centred form. */
function directHingeRss(x: number[], y: number[], k: number): number {
  const n = x.length;
  const z = x.map((v) => Math.max(0, v - k));
  const m = (a: number[]) => a.reduce((s, v) => s + v, 0) / n;
  const mx = m(x), mz = m(z), my = m(y);
  let xx = 0, xz = 0, zz = 0, xy = 0, zy = 0, yy = 0;
  for (let i = 0; i < n; i++) {
    const dx = x[i] - mx, dz = z[i] - mz, dy = y[i] - my;
    xx += dx * dx; xz += dx * dz; zz += dz * dz; xy += dx * dy; zy += dz * dy; yy += dy * dy;
  }
  const det = xx * zz - xz * xz;
  if (!(det > 0)) return Infinity;
  const b = (xy * zz - zy * xz) / det;
  const c = (zy * xx - xy * xz) / det;
  return yy - b * xy - c * zy;
}

function bruteHinge(x: number[], y: number[], m: number) {
  const xs = [...x].sort((a, b) => a - b);
  let best = { k: NaN, rss: Infinity };
  for (let j = m - 1; j <= xs.length - m - 1; j++) {
    if (!(xs[j] < xs[j + 1])) continue;
    let lo = xs[j], hi = xs[j + 1];
    const g = (Math.sqrt(5) - 1) / 2;
    for (let it = 0; it < 80; it++) {
      const a = hi - g * (hi - lo), b = lo + g * (hi - lo);
      if (directHingeRss(x, y, a) < directHingeRss(x, y, b)) hi = b;
      else lo = a;
    }
    for (const k of [xs[j], (lo + hi) / 2]) {
      const rss = directHingeRss(x, y, k);
      if (rss < best.rss) best = { k, rss };
    }
  }
  return best;
}

describe('twoRegressionSplit', () => {
  it.each([1, 2, 3, 4, 5])('picks the same split as refitting every split from scratch (seed %i)', (seed) => {
    const { x, y } = brokenLine(120, seed, 40, 1700);
    const fit = twoRegressionSplit(preparePoints(x, y), 8)!;
    const ref = bruteTwoRegression(x, y, 8);
    expect(fit.splitIndex).toBe(ref.s);
    expect(fit.rss).toBeCloseTo(ref.rss, 6); // brute force, same criterion
  });

  it.each([6, 7])('picks the brute-force split on 400 points, where most blocks of splits are skipped (seed %i)', (seed) => {
    const { x, y } = brokenLine(400, seed, 40, 1600);
    const fit = twoRegressionSplit(preparePoints(x, y), 8)!;
    const ref = bruteTwoRegression(x, y, 8);
    expect(fit.splitIndex).toBe(ref.s);
    expect(fit.rss).toBeCloseTo(ref.rss, 6);
  });

  it('returns the very same split whatever split it is told to search first', () => {
    for (const seed of [1, 2, 3]) {
      const { x, y } = brokenLine(300, seed, seed === 2 ? 120 : 30, 1700);
      const p = preparePoints(x, y);
      const plain = twoRegressionSplit(p, 8)!;
      for (const near of [plain.splitIndex, plain.splitIndex - 4, 9, 150, 291, -3, 500]) {
        expect(twoRegressionSplit(p, 8, near)).toEqual(plain);
      }
    }
  });

  it('recovers an exact broken line: slopes 0.92 and 1.37, crossing at 1,700 (worked: -50 + 0.92·1700 = 1,514)', () => {
    const x = Array.from({ length: 61 }, (_, i) => 1000 + 25 * i);
    const y = x.map((v) => -50 + 0.92 * v + 0.45 * Math.max(0, v - 1700));
    const fit = twoRegressionSplit(preparePoints(x, y), 8)!;
    expect(fit.left.slope).toBeCloseTo(0.92, 10);
    expect(fit.right.slope).toBeCloseTo(1.37, 10);
    expect(fit.breakX).toBeCloseTo(1700, 6);
    expect(fit.rss).toBeLessThan(1e-6);
  });

  it('refuses a split with fewer than the minimum points a side', () => {
    const x = Array.from({ length: 15 }, (_, i) => i);
    expect(twoRegressionSplit(preparePoints(x, x), 8)).toBeNull(); // 15 < 2 × 8
  });
});

describe('hingeFit', () => {
  it.each([1, 2, 3, 4, 5, 6])('matches a golden-section search of every knot interval (seed %i)', (seed) => {
    const { x, y } = brokenLine(90, seed, seed % 2 ? 60 : 15, 1600 + 50 * seed);
    const fit = hingeFit(preparePoints(x, y), 8)!;
    const ref = bruteHinge(x, y, 8);
    expect(Math.abs(fit.rss - ref.rss) / ref.rss).toBeLessThan(1e-9);
    // RSS is flat at its minimum, so golden section pins the knot only to about √ε of the
    // interval; the exact (Hudson) knot lies within a hundredth of a mL/min of it.
    expect(Math.abs(fit.knot - ref.k)).toBeLessThan(0.01);
  });

  // 400 points cross many of the search's 16-partition blocks, most skipped by the block bound.
  it.each([7, 8, 9])('matches the golden-section search on 400 points, where most blocks of partitions are skipped (seed %i)', (seed) => {
    const { x, y } = brokenLine(400, seed, 40, 1500 + 100 * (seed - 7));
    const fit = hingeFit(preparePoints(x, y), 8)!;
    const ref = bruteHinge(x, y, 8);
    expect(Math.abs(fit.rss - ref.rss) / ref.rss).toBeLessThan(1e-9);
    expect(Math.abs(fit.knot - ref.k)).toBeLessThan(0.01);
  });

  it('returns the very same fit whatever partition it is told to search first (the hint only speeds the search)', () => {
    for (const seed of [1, 2, 3]) {
      const { x, y } = brokenLine(300, seed, seed === 2 ? 120 : 30, 1700);
      const p = preparePoints(x, y);
      const plain = hingeFit(p, 8)!;
      // Hints at the true partition, beside it, far from it, and past both ends of the search.
      for (const near of [plain.pointsBefore - 1, plain.pointsBefore + 3, 10, 150, 290, -5, 400]) {
        expect(hingeFit(p, 8, near)).toEqual(plain);
      }
    }
  });

  it('recovers an exact hinge with the knot between data points (knot 1,712.5, not on the 25-step grid)', () => {
    const x = Array.from({ length: 61 }, (_, i) => 1000 + 25 * i);
    const y = x.map((v) => 30 + 0.9 * v + 0.5 * Math.max(0, v - 1712.5));
    const fit = hingeFit(preparePoints(x, y), 8)!;
    expect(fit.knot).toBeCloseTo(1712.5, 6);
    expect(fit.slopeBefore).toBeCloseTo(0.9, 10);
    expect(fit.slopeAfter).toBeCloseTo(1.4, 10);
    expect(hingeValue(fit, 2000)).toBeCloseTo(30 + 1800 + 0.5 * 287.5, 6); // 1,973.75 by hand
  });

  it('stays exact with large offsets (VO2-sized x around 3,000 mL/min, 100,000 points)', () => {
    const n = 100_000;
    const x = Array.from({ length: n }, (_, i) => 3000 + i * 0.01);
    const y = x.map((v) => 0.95 * v + 0.3 * Math.max(0, v - 3600.005));
    const fit = hingeFit(preparePoints(x, y, true), 8)!;
    expect(fit.knot).toBeCloseTo(3600.005, 3);
  });
});

describe('preparePoints', () => {
  // Reference: a stable sort of the indices by x, ties in input order (as Array.prototype.sort is stable, ES2019).
  function reference(x: number[], y: number[]) {
    const order = x.map((_, i) => i).sort((a, b) => x[a] - x[b] || a - b);
    return { x: order.map((i) => x[i]), y: order.map((i) => y[i]) };
  }
  const cases: [string, number[]][] = [
    ['nearly sorted, as VO2 in time order (insertion sort)', Array.from({ length: 500 }, (_, i) => 800 + 3 * i + ((i * 7919) % 13) * 4)],
    ['reversed (too many moves: the comparison sort takes over)', Array.from({ length: 2000 }, (_, i) => 5000 - i)],
    ['with ties, which keep their input order', Array.from({ length: 300 }, (_, i) => 1000 + 10 * Math.floor(i / 3) - (i % 3 === 1 ? 10 : 0))],
    // 3,001 points (not a multiple of the merge sort's 32-point runs) in a scrambled order with
    // every value taken about 30 times: the merge sort must keep ties in input order.
    ['scrambled, with many ties (merge sort)', Array.from({ length: 3001 }, (_, i) => (i * 7919) % 101)],
  ];
  it.each(cases)('sorts %s exactly as a stable sort by x', (_, x) => {
    const y = x.map((_, i) => i * 1.5);
    const p = preparePoints(x, y);
    const ref = reference(x, y);
    expect(Array.from(p.x)).toEqual(ref.x);
    expect(Array.from(p.y)).toEqual(ref.y);
  });

  it('gives the same points and sums through a reused scratch, large then small', () => {
    const scratch = newScratch();
    const big = Array.from({ length: 4000 }, (_, i) => (i * 7919) % 997);
    const small = Array.from({ length: 50 }, (_, i) => 50 - i);
    for (const x of [big, small]) {
      const y = x.map((v, i) => v * 0.5 + i);
      const fresh = preparePoints(x, y);
      const reused = preparePoints(x, y, false, scratch);
      for (const key of ['x', 'y', 'sx', 'sy', 'sxx', 'sxy', 'syy'] as const) expect(Array.from(reused[key]), key).toEqual(Array.from(fresh[key]));
      expect([reused.mx, reused.my]).toEqual([fresh.mx, fresh.my]);
    }
  });
});
