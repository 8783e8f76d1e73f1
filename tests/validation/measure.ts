/**
 * Accuracy of the whole analysis (core/analyze/analyze-test.ts, default settings) on generated
 * tests with known thresholds (sample-tests/generator). Error = |found VO2 − true VO2| / true
 * VO2 × 100. A threshold that was not found counts as a 100 % error, so misses cannot hide.
 */
import { analyzeTest, noClinicalInputs } from '../../core/analyze/analyze-test';
import { median, quantile } from '../../core/math/stats';
import { DEFAULT_SETTINGS } from '../../core/model/settings';
import { generateTest } from '../../sample-tests/generator';
import { validationCases, type ValidationCase } from './cases';

export const MISS_ERROR_PCT = 100;

export interface CaseResult {
  readonly c: ValidationCase;
  readonly vt1ErrPct: number;
  readonly vt2ErrPct: number;
  readonly vt1Covered: boolean | null;
  readonly vt2Covered: boolean | null;
  /** Interval width as % of the true VO2, null without an interval. */
  readonly vt1CiWidthPct: number | null;
  readonly vt2CiWidthPct: number | null;
}

export interface Summary {
  readonly n: number;
  readonly vt1Median: number;
  readonly vt1P95: number;
  readonly vt2Median: number;
  readonly vt2P95: number;
  readonly vt1Misses: number;
  readonly vt2Misses: number;
  /** Share of found thresholds whose 95 % interval holds the true VO2, %. */
  readonly vt1CoveragePct: number;
  readonly vt2CoveragePct: number;
  /** Median interval width, % of the true VO2. */
  readonly vt1CiWidthPct: number;
  readonly vt2CiWidthPct: number;
}

function errPct(found: number | undefined, truth: number): number {
  return found === undefined ? MISS_ERROR_PCT : (100 * Math.abs(found - truth)) / truth;
}

function widthPct(ci: readonly [number, number] | null, truth: number): number | null {
  return ci ? (100 * (ci[1] - ci[0])) / truth : null;
}

function covered(ci: readonly [number, number] | null, truth: number): boolean | null {
  return ci ? ci[0] <= truth && truth <= ci[1] : null;
}

export function runCases(seedsPerCondition: number, firstSeed?: number): CaseResult[] {
  return validationCases(seedsPerCondition, firstSeed).map((c) => {
    const { table, truth } = generateTest(c.params, c.seed);
    const a = analyzeTest(table, DEFAULT_SETTINGS, noClinicalInputs());
    return {
      c,
      vt1ErrPct: errPct(a.vt1.at?.vo2MlMin, truth.vt1.vo2MlMin),
      vt2ErrPct: errPct(a.vt2.at?.vo2MlMin, truth.vt2.vo2MlMin),
      vt1Covered: covered(a.vt1.ci95Vo2MlMin, truth.vt1.vo2MlMin),
      vt2Covered: covered(a.vt2.ci95Vo2MlMin, truth.vt2.vo2MlMin),
      vt1CiWidthPct: widthPct(a.vt1.ci95Vo2MlMin, truth.vt1.vo2MlMin),
      vt2CiWidthPct: widthPct(a.vt2.ci95Vo2MlMin, truth.vt2.vo2MlMin),
    };
  });
}

function coverage(values: readonly (boolean | null)[]): number {
  const known = values.filter((v): v is boolean => v !== null);
  return known.length ? (100 * known.filter(Boolean).length) / known.length : Number.NaN;
}

function medianKnown(values: readonly (number | null)[]): number {
  const known = values.filter((v): v is number => v !== null);
  return known.length ? median(known) : Number.NaN;
}

export function summarise(results: readonly CaseResult[]): Summary {
  const e1 = results.map((r) => r.vt1ErrPct);
  const e2 = results.map((r) => r.vt2ErrPct);
  return {
    n: results.length,
    vt1Median: median(e1),
    vt1P95: quantile(e1, 0.95),
    vt2Median: median(e2),
    vt2P95: quantile(e2, 0.95),
    vt1Misses: e1.filter((e) => e === MISS_ERROR_PCT).length,
    vt2Misses: e2.filter((e) => e === MISS_ERROR_PCT).length,
    vt1CoveragePct: coverage(results.map((r) => r.vt1Covered)),
    vt2CoveragePct: coverage(results.map((r) => r.vt2Covered)),
    vt1CiWidthPct: medianKnown(results.map((r) => r.vt1CiWidthPct)),
    vt2CiWidthPct: medianKnown(results.map((r) => r.vt2CiWidthPct)),
  };
}

/** Results grouped by a key (protocol, noise, outliers), each summarised. */
export function byCondition(results: readonly CaseResult[], key: (c: ValidationCase) => string): [string, Summary][] {
  const groups = new Map<string, CaseResult[]>();
  for (const r of results) {
    const k = key(r.c);
    groups.set(k, [...(groups.get(k) ?? []), r]);
  }
  return [...groups.entries()].map(([k, rs]) => [k, summarise(rs)]);
}
