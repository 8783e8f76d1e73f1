/**
 * A 95 % confidence interval for a threshold: a residual bootstrap of the breakpoint fits,
 * carried through the consensus.
 *
 * For each method that found the threshold, its fit gives fitted values and residuals. One
 * bootstrap replicate adds resampled residuals to the fitted values of every such method,
 * refits each (the same fit the method uses: the continuous two-segment fit, or the two
 * regressions for `vslope`), and combines the refitted VO2 estimates as the consensus does
 * (the median, consensus.ts). The interval is the 2.5th to 97.5th percentile of the replicates
 * (percentile bootstrap, Efron et al., An Introduction to the Bootstrap, 1993).
 *
 * Averaging makes neighbouring residuals correlated, and resampling them one by one would
 * understate the scatter; residuals are therefore drawn in moving blocks (Künsch, Ann Stat
 * 1989;17:1217–41). Block length (our choice): the first lag at which the residuals'
 * autocorrelation falls below 0.1, between 1 and a quarter of the points.
 *
 * Replicates and seed come from `settings.thresholds.bootstrap`, through the seeded generator
 * of core/math/random.ts, so the same file always gives the same interval. Units: mL/min for
 * VO2; the time interval is read off the monotone VO2 curve at the VO2 limits, s.
 * Assumptions: the fitted two-segment shape is right and the residuals are stationary. The
 * interval shows how far noise moves the consensus; a bias the methods share is not in it.
 */
import type { MethodOutcome } from '../model/analysis';
import type { Settings } from '../model/settings';
import { seededRandomAfter, type Random } from '../math/random';
import { median, quantile, sampleSd } from '../math/stats';
import type { DetectorInput } from './detector';
import { minPerSide } from './edge-floor';
import { fitSample, type MethodSample } from './hinge-method';
import { HINGE_METHODS } from './methods';
import { timeAtValue, type MonotoneCurve } from './read-off';
import { hingeFit, hingeValue, twoRegressionSplit, type HingeFit, type PreparedPoints, type PrefixSums } from './segments';
import { vslopeSample } from './vslope-hinge';

export interface ThresholdCi {
  readonly ci95Vo2MlMin: readonly [number, number];
  readonly ci95TimeS: readonly [number, number];
  /** Replicates in which at least one method could be refitted. */
  readonly replicates: number;
  /** The SDs the reported interval was built from, mL/min (methodAwareInterval only). */
  readonly parts?: { readonly bootSdMlMin: number; readonly methodSdMlMin: number; readonly floorSdMlMin: number };
}

/**
 * What one method keeps for the whole bootstrap: its x-sorted x, the fit and the residuals
 * (two arrays of the window's points). The fitted values are recomputed from the fit in each
 * replicate, and the replicate's y and prefix sums go into one set of scratch arrays shared by
 * all methods, so memory is 2 arrays per method plus 6 for the largest window (at a million
 * breaths, the 14 arrays per method held before came to about 80 MB a method).
 */
interface Refit {
  readonly x: Float64Array;
  readonly mx: number;
  readonly my: number;
  readonly fit: HingeFit;
  readonly residuals: Float64Array;
  readonly block: number;
  readonly estimate: (p: PrefixSums) => number | null;
}

/** One replicate's y and prefix sums, sized to the largest window, reused by every method and replicate. */
interface Scratch {
  readonly y: Float64Array;
  readonly sx: Float64Array;
  readonly sy: Float64Array;
  readonly sxx: Float64Array;
  readonly sxy: Float64Array;
  readonly syy: Float64Array;
}

function scratchFor(n: number): Scratch {
  return {
    y: new Float64Array(n),
    sx: new Float64Array(n + 1),
    sy: new Float64Array(n + 1),
    sxx: new Float64Array(n + 1),
    sxy: new Float64Array(n + 1),
    syy: new Float64Array(n + 1),
  };
}

/** First lag whose autocorrelation is below 0.1, within [1, n/4]. */
export function blockLength(residuals: ArrayLike<number>): number {
  const n = residuals.length;
  const maxLag = Math.max(1, Math.floor(n / 4));
  let c0 = 0;
  for (let i = 0; i < n; i++) c0 += residuals[i] * residuals[i];
  if (!(c0 > 0)) return 1;
  for (let lag = 1; lag <= maxLag; lag++) {
    let c = 0;
    for (let i = lag; i < n; i++) c += residuals[i] * residuals[i - lag];
    if (c / c0 < 0.1) return lag;
  }
  return maxLag;
}

function refitFor(method: string, input: DetectorInput): Refit | null {
  const hinge = HINGE_METHODS[method];
  if (method !== 'vslope' && !hinge) return null;
  const sample: MethodSample | string = method === 'vslope' ? vslopeSample(input) : hinge.spec.sample(input);
  if (typeof sample === 'string') return null;
  const m = minPerSide(input.settings, sample.x.length);
  // Residuals always come from the continuous fit; `vslope` is then refitted its own way.
  const base = fitSample(sample, m);
  if (!base) return null;
  const { p, fit } = base;
  // A replicate's break is searched first near the original one (the same fit, found sooner).
  const estimateKnot = method === 'vslope' ? vslopeEstimate(p, m) : (q: PrefixSums) => hingeFit(q, m, fit.pointsBefore - 1)?.knot ?? null;
  const n = p.x.length;
  const residuals = new Float64Array(n);
  for (let i = 0; i < n; i++) residuals[i] = p.y[i] - hingeValue(fit, p.x[i]);
  // Only the point-to-VO2 map is kept, not the sample's own arrays.
  const toPoint = sample.toPoint;
  return {
    x: p.x,
    mx: p.mx,
    my: p.my,
    fit,
    residuals,
    block: blockLength(residuals),
    estimate: (q) => {
      const knot = estimateKnot(q);
      if (knot === null) return null;
      const v = toPoint(knot).vo2MlMin;
      return Number.isFinite(v) ? v : null;
    },
  };
}

/**
 * A method's x prefix sums into the shared scratch arrays, as preparePoints made them (the
 * same additions in the same order, so the same numbers). x does not change between
 * replicates, so they are written once per method and run of replicates.
 */
function xSumsInto(r: Refit, scratch: Scratch): void {
  const { x, mx } = r;
  const { sx, sxx } = scratch;
  let ax = 0;
  let axx = 0;
  sx[0] = 0;
  sxx[0] = 0;
  for (let i = 0; i < x.length; i++) {
    const cx = x[i] - mx;
    sx[i + 1] = ax += cx;
    sxx[i + 1] = axx += cx * cx;
  }
}

/** Random numbers one replicate of a method draws: one per block of residuals. */
function drawsPerReplicate(r: Refit): number {
  return Math.ceil(r.residuals.length / r.block);
}

/** The `vslope` refit of a replicate: the two-regression break, searched first near the original points' split. */
function vslopeEstimate(p: PrefixSums, m: number): (q: PrefixSums) => number | null {
  const near = twoRegressionSplit(p, m)?.splitIndex;
  return (q) => twoRegressionSplit(q, m, near)?.breakX ?? null;
}

/**
 * One replicate of a method's points: fitted values plus residuals drawn in moving blocks,
 * written straight into the shared scratch arrays, with the y prefix sums accumulated in the
 * same pass (the x sums are already there: `xSumsInto`). The sums are centred on the original
 * points' mean (the fits only take differences of the sums, so any fixed centre gives the same
 * fit; this one needs no second pass over the replicate).
 */
function resampleInto(r: Refit, scratch: Scratch, random: Random): PreparedPoints {
  const { x, mx, fit, residuals } = r;
  const { y, sx, sy, sxx, sxy, syy } = scratch;
  const n = residuals.length;
  const L = r.block;
  const centre = r.my;
  // The running sums are carried in locals (the same additions in the same order as reading
  // each sum back from its array, so the same numbers), and the fit read once: its intercept,
  // slopes and knot.
  const { intercept, slopeBefore, knot } = fit;
  const bend = fit.slopeAfter - fit.slopeBefore;
  let ay = 0;
  let axy = 0;
  let ayy = 0;
  sy[0] = 0;
  sxy[0] = 0;
  syy[0] = 0;
  let i = 0;
  // One random number per block of L points: `drawsPerReplicate` counts them, and
  // methodReplicates hands out the sequence by that count.
  while (i < n) {
    const shift = Math.floor(random() * (n - L + 1)) - i;
    const end = Math.min(n, i + L);
    for (; i < end; i++) {
      const xi = x[i];
      // hingeValue(fit, xi), written out.
      const v = intercept + slopeBefore * xi + (xi > knot ? bend * (xi - knot) : 0) + residuals[i + shift];
      const cy = v - centre;
      y[i] = v;
      sy[i + 1] = ay += cy;
      sxy[i + 1] = axy += (xi - mx) * cy;
      syy[i + 1] = ayy += cy * cy;
    }
  }
  // The scratch arrays are passed whole (no subarray views made per replicate): the fits read
  // points 0..n−1 and sums 0..n only (segments.ts PrefixSums). Same shape as preparePoints'
  // result, so the fits see one object layout.
  return { x, y, mx, my: centre, sx, sy, sxx, sxy, syy };
}

/** Early-stop rule of the settings; `checkEvery` 0 draws every replicate. */
interface StopRule {
  readonly checkEvery: number;
  readonly stableWithinPct: number;
}

/** The percentile interval of the combined replicates so far; null with fewer than 2. */
function percentileEnds(replicates: readonly (readonly number[])[], combine: (values: readonly number[]) => number): readonly [number, number] | null {
  const estimates: number[] = [];
  for (const r of replicates) {
    const values = r.filter(Number.isFinite);
    if (values.length > 0) estimates.push(combine(values));
  }
  return estimates.length < 2 ? null : [quantile(estimates, 0.025), quantile(estimates, 0.975)];
}

/** True when neither end moved by more than the tolerance, a share of the newer interval's width. */
export function intervalIsStable(before: readonly [number, number], after: readonly [number, number], stableWithinPct: number): boolean {
  const tolerance = (stableWithinPct / 100) * (after[1] - after[0]);
  return Math.abs(after[0] - before[0]) <= tolerance && Math.abs(after[1] - before[1]) <= tolerance;
}

/** Each found method's estimate, refitted in every bootstrap replicate (NaN where a refit failed). */
export interface MethodReplicates {
  readonly methods: readonly string[];
  /** replicates[b][k]: replicate b of method k, VO2 mL/min. */
  readonly replicates: readonly (readonly number[])[];
}

/**
 * Bootstrap replicates of every found method that can be refitted. All methods are resampled
 * within the same replicate, so a combination (the consensus) can be formed replicate by
 * replicate. Null when no method can be refitted or no replicates are asked for (then nothing
 * of the bootstrap is set up).
 *
 * Order of work: the replicates are drawn in runs of `checkEvery` (all of them when it is 0),
 * method by method within a run, so a method's x sums are written once per run. The random
 * numbers are those of one seeded sequence read replicate by replicate, method by method
 * within a replicate: each replicate of a method takes its own stretch of the sequence
 * (`seededRandomAfter`), so the order of work does not change a single number.
 *
 * Early stop (settings `checkEvery`, `stableWithinPct`; our choice, not a published rule):
 * after every `checkEvery` replicates the percentile interval of `combine` (the consensus'
 * median) is formed again; from the second check on, drawing stops when both of its ends
 * moved by no more than `stableWithinPct` % of its width since the previous check, and in any
 * case at `replicates`. The same seed and settings always stop at the same replicate.
 */
export function methodReplicates(
  outcomes: readonly MethodOutcome[],
  input: DetectorInput,
  seedOffset: number,
  combine: (values: readonly number[]) => number = median,
): MethodReplicates | null {
  const { replicates, seed } = input.settings.thresholds.bootstrap;
  if (replicates < 2) return null;
  const methods: string[] = [];
  const refits: Refit[] = [];
  for (const o of outcomes) {
    if (!o.found) continue;
    const r = refitFor(o.method, input);
    if (!r) continue;
    methods.push(o.method);
    refits.push(r);
  }
  if (refits.length === 0) return null;
  let largest = 0;
  for (const r of refits) largest = Math.max(largest, r.x.length);
  const scratch = scratchFor(largest);
  const rule = stopRule(input.settings.thresholds.bootstrap);
  const sequenceSeed = (seed + seedOffset) >>> 0;
  // Where each method's draws start within a replicate, and the draws of a whole replicate.
  const offsets: number[] = [];
  let perReplicate = 0;
  for (const r of refits) {
    offsets.push(perReplicate);
    perReplicate += drawsPerReplicate(r);
  }
  const run = rule.checkEvery > 0 ? rule.checkEvery : replicates;
  const out: number[][] = [];
  let previous: readonly [number, number] | null = null;
  for (let start = 0; start < replicates; start += run) {
    const end = Math.min(replicates, start + run);
    for (let b = start; b < end; b++) out.push(new Array<number>(refits.length));
    refits.forEach((r, k) => {
      xSumsInto(r, scratch);
      for (let b = start; b < end; b++) {
        const random = seededRandomAfter(sequenceSeed, b * perReplicate + offsets[k]);
        out[b][k] = r.estimate(resampleInto(r, scratch, random)) ?? Number.NaN;
      }
    });
    if (rule.checkEvery > 0 && end < replicates) {
      const ends = percentileEnds(out, combine);
      if (previous && ends && intervalIsStable(previous, ends, rule.stableWithinPct)) break;
      previous = ends;
    }
  }
  return { methods, replicates: out };
}

function stopRule(bootstrap: Settings['thresholds']['bootstrap']): StopRule {
  return { checkEvery: bootstrap.checkEvery ?? 0, stableWithinPct: bootstrap.stableWithinPct ?? 0 };
}

/**
 * The 95 % percentile interval of a combination of the methods, formed in each replicate from
 * the methods that refitted there; null with fewer than 2 usable replicates.
 */
export function combinationInterval(
  reps: MethodReplicates,
  combine: (values: readonly number[]) => number,
  vo2: MonotoneCurve,
): ThresholdCi | null {
  const estimates = reps.replicates.filter((r) => r.some(Number.isFinite)).length;
  const ends = percentileEnds(reps.replicates, combine);
  if (!ends) return null;
  const [lo, hi] = ends;
  return { ci95Vo2MlMin: [lo, hi], ci95TimeS: [timeAtValue(vo2, lo), timeAtValue(vo2, hi)], replicates: estimates };
}

/** Fewest found methods for which the between-method spread is taken robustly (scaled MAD). */
export const ROBUST_SPREAD_MIN_METHODS = 5;

/**
 * The between-method spread, mL/min: with at least `ROBUST_SPREAD_MIN_METHODS` estimates the
 * scaled median absolute deviation, 1.4826 · median |x − median x| (consistent for the SD of
 * a normal sample; Rousseeuw et al., J Am Stat Assoc 1993;88:1273–83), so that one method
 * biased far from the rest does not widen the interval on its own; with fewer, the sample SD
 * (with three estimates one deviation from the median is zero by construction and the MAD is
 * not a usable scale). 0 with one estimate.
 * Example: 1,000, 1,020, 1,040, 1,060 and 1,400 → median 1,040, deviations 40, 20, 0, 20, 360,
 * MAD 20, spread 29.65 (the sample SD would be 167).
 */
export function methodSpread(estimatesVo2MlMin: readonly number[]): number {
  const n = estimatesVo2MlMin.length;
  if (n < 2) return 0;
  if (n < ROBUST_SPREAD_MIN_METHODS) return sampleSd(estimatesVo2MlMin);
  const m = median(estimatesVo2MlMin);
  return 1.4826 * median(estimatesVo2MlMin.map((v) => Math.abs(v - m)));
}

/**
 * How the interval's parts are scaled, per threshold (calibration, docs/validation.md "The
 * interval"). `boot` and `methods` multiply the two SDs, `floorPct` is an SD floor in % of the
 * consensus VO2 for the error neither the bootstrap nor the methods' spread can see (a bias the
 * methods share, the shape error of a two-line fit to a curve).
 *
 * Chosen on development seeds only (both generator families' detection grids from seed 5000,
 * main and hard, and the development day-2 pairs from 9000 and 49000: 3,900 test-thresholds),
 * in two steps: (1) the weights are the maximum-likelihood fit of a normal model of the log
 * error, ln(found / true) ~ N(0, f² + (a·s_boot)² + (b·s_methods)²) with s_boot and s_methods
 * relative to the consensus, each data set weighted equally; so the interval is as narrow as
 * the evidence allows where a test is clean, and wide where its bootstrap or its methods say it
 * is not, instead of one inflation for every test; (2) one common scale on all three so that
 * the interval held the truth in about 95 % of the development tests (VT1 × 1.05, VT2 × 1),
 * and for VT1 a further × 1.1 on short ramps (ramp-length.ts), where the development coverage
 * was otherwise 94 % in family B. Fit: VT1 f 5.85 %, a 1.65, b 0.45; VT2 f 2.83 %, a 1.59,
 * b 0.88. The earlier calibration (VT1 a 3, b 0.5, f 3 %) tripled the bootstrap SD, which on a
 * test whose VT1 comes early made the interval ±20–75 % where the VT1 had been found within
 * 7 % of the truth.
 */
export interface IntervalCalibration {
  readonly boot: number;
  readonly methods: number;
  readonly floorPct: number;
  /** The whole half-width is multiplied by this when the incremental phase is short (ramp-length.ts). */
  readonly shortRamp: number;
}

export const INTERVAL_CALIBRATION: Readonly<Record<'vt1' | 'vt2', IntervalCalibration>> = {
  vt1: { boot: 1.73, methods: 0.48, floorPct: 6.1, shortRamp: 1.1 },
  vt2: { boot: 1.59, methods: 0.88, floorPct: 2.8, shortRamp: 1 },
};

/**
 * The reported 95 % interval: the bootstrap spread (noise), the between-method spread (the
 * methods' own biases, which the bootstrap cannot see) and a floor for the bias they share,
 * added in quadrature, centred on the consensus:
 * consensus ± k · 1.96 · √((a·s_boot)² + (b·s_methods)² + (f·consensus)²), with k the
 * short-ramp factor when the incremental phase is short (else 1),
 * s_boot = (hi − lo) / 3.92 of the bootstrap percentile interval, s_methods from
 * `methodSpread`, and a, b, f from the calibration. Independent error sources add in variance
 * (common practice, as in a combined standard uncertainty: JCGM 100:2008, Guide to the
 * Expression of Uncertainty in Measurement, §5.1). Checked by its coverage on development and
 * held-out seeds (docs/validation.md). Example with a = b = 1, f = 0: bootstrap 1,450–1,550
 * (s_boot 25.5), estimates 1,400, 1,500 and 1,600 (s_methods 100, the SD of three), consensus
 * 1,500 → 1,500 ± 1.96 · 103.2 = 1,297.7–1,702.3.
 */
export function methodAwareInterval(
  bootstrap: ThresholdCi,
  consensusVo2MlMin: number,
  estimatesVo2MlMin: readonly number[],
  vo2: MonotoneCurve,
  calibration: IntervalCalibration = { boot: 1, methods: 1, floorPct: 0, shortRamp: 1 },
  shortRamp = false,
): ThresholdCi {
  const bootSdMlMin = (bootstrap.ci95Vo2MlMin[1] - bootstrap.ci95Vo2MlMin[0]) / 3.92;
  const methodSdMlMin = methodSpread(estimatesVo2MlMin);
  const floorSdMlMin = (calibration.floorPct / 100) * consensusVo2MlMin;
  const a = calibration.boot * bootSdMlMin;
  const b = calibration.methods * methodSdMlMin;
  const half = (shortRamp ? calibration.shortRamp : 1) * 1.96 * Math.sqrt(a * a + b * b + floorSdMlMin * floorSdMlMin);
  const lo = consensusVo2MlMin - half;
  const hi = consensusVo2MlMin + half;
  return {
    ci95Vo2MlMin: [lo, hi],
    ci95TimeS: [timeAtValue(vo2, lo), timeAtValue(vo2, hi)],
    replicates: bootstrap.replicates,
    parts: { bootSdMlMin, methodSdMlMin, floorSdMlMin },
  };
}
