/**
 * Test-retest statistics of one metric from a lab's own repeat tests (pairs of day 1, day 2
 * values of the same person under the same protocol).
 *
 * Sources: Hopkins, Sports Med 2000;30:1–15 (typical error, CV, log transformation);
 * Weir, J Strength Cond Res 2005;19:231–40 (ICC forms, SEM = √MSE, MDC95 = 1.96·√2·SEM);
 * Shrout et al., Psychol Bull 1979;86:420–8 (ICC(2,1), ICC(3,1)).
 *
 * - mean change = mean(day 2 − day 1); typical error TE = SD(day 2 − day 1) / √2.
 * - SEM = √MSE of the two-way ANOVA (subjects × days); with two days MSE = SD(diff)²/2, so
 *   SEM equals TE.
 * - CV, two ways, both reported: `cvPctRaw` = 100·TE / grand mean; `cvPctLog` = 100·(e^s − 1),
 *   s = SD(ln day 2 − ln day 1)/√2 (Hopkins' log method; needs every value > 0). The band uses
 *   the log CV when it exists (`cvMethod` says which was used).
 * - ICC(3,1) two-way mixed, consistency, single measure: (MSR − MSE)/(MSR + MSE);
 *   ICC(2,1) two-way random, absolute agreement: (MSR − MSE)/(MSR + MSE + 2(MSC − MSE)/n).
 *   Reported from 3 pairs up (with 2 the subject mean square has one degree of freedom).
 * - MDC95 = 1.96·√2·SEM in the metric's unit; its percent form 1.96·√2·CV.
 * Units: whatever unit the metric has; percentages of the grand mean.
 */
import { mean, sampleSd } from '../math/stats';
import { MDC95_FACTOR } from './bands';

export interface RepeatPair {
  readonly day1: number;
  readonly day2: number;
}

export interface RepeatStats {
  readonly n: number;
  readonly meanDay1: number;
  readonly meanDay2: number;
  readonly grandMean: number;
  readonly meanChange: number;
  readonly sdChange: number;
  readonly typicalError: number;
  readonly sem: number;
  readonly cvPctRaw: number;
  readonly cvPctLog: number | null;
  /** The CV the band uses. */
  readonly cvPct: number;
  readonly cvMethod: 'log-transformed' | 'typical error / grand mean';
  readonly icc31: number | null;
  readonly icc21: number | null;
  readonly mdc95: number;
  readonly mdc95Pct: number;
}

/** Statistics of at least two finite pairs; null with fewer (no SD of differences exists). */
export function repeatStats(pairs: readonly RepeatPair[]): RepeatStats | null {
  const usable = pairs.filter((p) => Number.isFinite(p.day1) && Number.isFinite(p.day2));
  const n = usable.length;
  if (n < 2) return null;
  const a = usable.map((p) => p.day1);
  const b = usable.map((p) => p.day2);
  const diffs = usable.map((p) => p.day2 - p.day1);
  const meanChange = mean(diffs);
  const sdChange = sampleSd(diffs);
  const typicalError = sdChange / Math.SQRT2;
  const grandMean = mean([...a, ...b]);
  const meanDay1 = mean(a);
  const meanDay2 = mean(b);

  const allPositive = usable.every((p) => p.day1 > 0 && p.day2 > 0);
  const cvPctLog = allPositive
    ? 100 * (Math.exp(sampleSd(usable.map((p) => Math.log(p.day2) - Math.log(p.day1))) / Math.SQRT2) - 1)
    : null;
  const cvPctRaw = grandMean !== 0 ? (100 * typicalError) / Math.abs(grandMean) : Number.NaN;

  let icc31: number | null = null;
  let icc21: number | null = null;
  if (n >= 3) {
    let ssRows = 0;
    for (let i = 0; i < n; i++) ssRows += 2 * ((a[i] + b[i]) / 2 - grandMean) ** 2;
    const ssCols = n * ((meanDay1 - grandMean) ** 2 + (meanDay2 - grandMean) ** 2);
    let ssTotal = 0;
    for (const x of [...a, ...b]) ssTotal += (x - grandMean) ** 2;
    const msr = ssRows / (n - 1);
    const msc = ssCols;
    const mse = (ssTotal - ssRows - ssCols) / (n - 1);
    const d31 = msr + mse;
    const d21 = msr + mse + (2 * (msc - mse)) / n;
    icc31 = d31 > 0 ? (msr - mse) / d31 : null;
    icc21 = d21 > 0 ? (msr - mse) / d21 : null;
  }

  const cvPct = cvPctLog ?? cvPctRaw;
  return {
    n,
    meanDay1,
    meanDay2,
    grandMean,
    meanChange,
    sdChange,
    typicalError,
    sem: typicalError,
    cvPctRaw,
    cvPctLog,
    cvPct,
    cvMethod: cvPctLog !== null ? 'log-transformed' : 'typical error / grand mean',
    icc31,
    icc21,
    mdc95: MDC95_FACTOR * typicalError,
    mdc95Pct: MDC95_FACTOR * cvPct,
  };
}
