/**
 * Accuracy of the whole analysis (core/analyze/analyze-test.ts, default settings) on generated
 * tests with known thresholds. Signed error = (found − true) / true × 100 for the VO2 and, on a
 * cycle, the work rate at VT1 and VT2; |error| for medians and p95. A threshold that was not
 * found counts as a 100 % error, so misses cannot hide. Works on any generator family through
 * `TruthCase` (family 1: cases.ts; family 2: family-b.ts).
 */
import { analyzeTest, noClinicalInputs } from '../../core/analyze/analyze-test';
import { median, quantile } from '../../core/math/stats';
import type { BreathTable } from '../../core/model/breath-table';
import { DEFAULT_SETTINGS } from '../../core/model/settings';
import { generateTest } from '../../sample-tests/generator';
import { findThresholds } from '../../core/thresholds/find-thresholds';
import type { ValidationCase } from './cases';

export const MISS_ERROR_PCT = 100;

interface TrueThreshold {
  readonly vo2MlMin: number;
  readonly workW: number | null;
}

/** One generated test of any family, with its true thresholds. */
export interface TruthCase {
  readonly family: string;
  readonly condition: 'main' | 'hard';
  /** The hard condition's kind ('short ramp', 'very noisy'), null in main. */
  readonly hardKind: string | null;
  readonly protocol: string;
  readonly modality: 'cycle' | 'treadmill';
  readonly noiseScale: number;
  readonly outliers: number;
  readonly seed: number;
  readonly label: string;
  readonly generate: () => { table: BreathTable; vt1: TrueThreshold; vt2: TrueThreshold };
}

export interface CaseResult {
  readonly c: TruthCase;
  /** Signed VO2 errors, %; MISS_ERROR_PCT when not found. */
  readonly vt1SignedPct: number;
  readonly vt2SignedPct: number;
  readonly vt1ErrPct: number;
  readonly vt2ErrPct: number;
  /** Signed work-rate errors at the threshold, %; null on a treadmill (no work signal). */
  readonly work1SignedPct: number | null;
  readonly work2SignedPct: number | null;
  readonly vt1Covered: boolean | null;
  readonly vt2Covered: boolean | null;
  /** Interval width as % of the true VO2, null without an interval. */
  readonly vt1CiWidthPct: number | null;
  readonly vt2CiWidthPct: number | null;
  /** Interval half-width and the consensus error, mL/min (null without an interval), for calibration. */
  readonly vt1Calib: Calib | null;
  readonly vt2Calib: Calib | null;
  /** Each method's signed VO2 error, % (null when that method found nothing). */
  readonly methods: Readonly<Record<string, number | null>>;
}

export interface Calib {
  readonly halfMlMin: number;
  readonly errMlMin: number;
  readonly vo2MlMin: number;
  /** The interval's SD parts (only when measured with parts). */
  readonly parts: { readonly bootSdMlMin: number; readonly methodSdMlMin: number; readonly floorSdMlMin: number } | null;
}

export interface Summary {
  readonly n: number;
  readonly vt1Median: number;
  readonly vt1P95: number;
  readonly vt1Bias: number;
  readonly vt2Median: number;
  readonly vt2P95: number;
  readonly vt2Bias: number;
  readonly vt1Misses: number;
  readonly vt2Misses: number;
  /** Work rate at VT1 / VT2 (cycle tests only): median and p95 |error| %, NaN without cycle tests. */
  readonly work1Median: number;
  readonly work1P95: number;
  readonly work2Median: number;
  readonly work2P95: number;
  readonly cycleN: number;
  /** Share of found thresholds whose 95 % interval holds the true VO2, %. */
  readonly vt1CoveragePct: number;
  readonly vt2CoveragePct: number;
  /** Median interval width, % of the true VO2. */
  readonly vt1CiWidthPct: number;
  readonly vt2CiWidthPct: number;
}

function signedPct(found: number | null | undefined, truth: number): number {
  return found === undefined || found === null ? MISS_ERROR_PCT : (100 * (found - truth)) / truth;
}

function widthPct(ci: readonly [number, number] | null, truth: number): number | null {
  return ci ? (100 * (ci[1] - ci[0])) / truth : null;
}

function covered(ci: readonly [number, number] | null, truth: number): boolean | null {
  return ci ? ci[0] <= truth && truth <= ci[1] : null;
}

/** Family 1 (sample-tests/generator) cases as truth cases. */
export function family1(cases: readonly ValidationCase[]): TruthCase[] {
  return cases.map((c) => ({
    family: 'family 1',
    condition: c.condition,
    hardKind: c.hardKind,
    protocol: c.protocol,
    modality: c.modality,
    noiseScale: c.noiseScale,
    outliers: c.outliers,
    seed: c.seed,
    label: c.label,
    generate: () => {
      const { table, truth } = generateTest(c.params, c.seed);
      return { table, vt1: truth.vt1, vt2: truth.vt2 };
    },
  }));
}

export function measureCase(c: TruthCase, withParts = false): CaseResult {
  const { table, vt1, vt2 } = c.generate();
  const a = analyzeTest(table, DEFAULT_SETTINGS, noClinicalInputs());
  const parts = withParts ? findThresholds(a.series, a.phases, DEFAULT_SETTINGS) : null;
  const work = (found: number | null | undefined, truth: number | null) => (truth === null || !(truth > 0) ? null : signedPct(found, truth));
  const methods: Record<string, number | null> = {};
  for (const m of a.vt1.methods) methods[`vt1 ${m.method}`] = m.found ? signedPct(m.vo2MlMin, vt1.vo2MlMin) : null;
  for (const m of a.vt2.methods) methods[`vt2 ${m.method}`] = m.found ? signedPct(m.vo2MlMin, vt2.vo2MlMin) : null;
  const s1 = signedPct(a.vt1.at?.vo2MlMin, vt1.vo2MlMin);
  const s2 = signedPct(a.vt2.at?.vo2MlMin, vt2.vo2MlMin);
  return {
    c,
    vt1SignedPct: s1,
    vt2SignedPct: s2,
    vt1ErrPct: Math.abs(s1),
    vt2ErrPct: Math.abs(s2),
    work1SignedPct: work(a.vt1.at?.workW, vt1.workW),
    work2SignedPct: work(a.vt2.at?.workW, vt2.workW),
    vt1Covered: covered(a.vt1.ci95Vo2MlMin, vt1.vo2MlMin),
    vt2Covered: covered(a.vt2.ci95Vo2MlMin, vt2.vo2MlMin),
    vt1CiWidthPct: widthPct(a.vt1.ci95Vo2MlMin, vt1.vo2MlMin),
    vt2CiWidthPct: widthPct(a.vt2.ci95Vo2MlMin, vt2.vo2MlMin),
    vt1Calib: calib(a.vt1.ci95Vo2MlMin, a.vt1.at?.vo2MlMin, vt1.vo2MlMin, parts?.vt1.ciParts ?? null),
    vt2Calib: calib(a.vt2.ci95Vo2MlMin, a.vt2.at?.vo2MlMin, vt2.vo2MlMin, parts?.vt2.ciParts ?? null),
    methods,
  };
}

function calib(ci: readonly [number, number] | null, found: number | undefined, truth: number, parts: Calib['parts']): Calib | null {
  return ci && found !== undefined ? { halfMlMin: (ci[1] - ci[0]) / 2, errMlMin: found - truth, vo2MlMin: found, parts } : null;
}

export function measureAll(cases: readonly TruthCase[], withParts = false): CaseResult[] {
  return cases.map((c) => measureCase(c, withParts));
}

function coverage(values: readonly (boolean | null)[]): number {
  const known = values.filter((v): v is boolean => v !== null);
  return known.length ? (100 * known.filter(Boolean).length) / known.length : Number.NaN;
}

function medianKnown(values: readonly (number | null)[]): number {
  const known = values.filter((v): v is number => v !== null);
  return known.length ? median(known) : Number.NaN;
}

function p95Known(values: readonly (number | null)[]): number {
  const known = values.filter((v): v is number => v !== null);
  return known.length ? quantile(known, 0.95) : Number.NaN;
}

export function summarise(results: readonly CaseResult[]): Summary {
  const e1 = results.map((r) => r.vt1ErrPct);
  const e2 = results.map((r) => r.vt2ErrPct);
  const w1 = results.map((r) => (r.work1SignedPct === null ? null : Math.abs(r.work1SignedPct)));
  const w2 = results.map((r) => (r.work2SignedPct === null ? null : Math.abs(r.work2SignedPct)));
  return {
    n: results.length,
    vt1Median: median(e1),
    vt1P95: quantile(e1, 0.95),
    vt1Bias: median(results.map((r) => r.vt1SignedPct)),
    vt2Median: median(e2),
    vt2P95: quantile(e2, 0.95),
    vt2Bias: median(results.map((r) => r.vt2SignedPct)),
    vt1Misses: e1.filter((e) => e === MISS_ERROR_PCT).length,
    vt2Misses: e2.filter((e) => e === MISS_ERROR_PCT).length,
    work1Median: medianKnown(w1),
    work1P95: p95Known(w1),
    work2Median: medianKnown(w2),
    work2P95: p95Known(w2),
    cycleN: w1.filter((v) => v !== null).length,
    vt1CoveragePct: coverage(results.map((r) => r.vt1Covered)),
    vt2CoveragePct: coverage(results.map((r) => r.vt2Covered)),
    vt1CiWidthPct: medianKnown(results.map((r) => r.vt1CiWidthPct)),
    vt2CiWidthPct: medianKnown(results.map((r) => r.vt2CiWidthPct)),
  };
}

/** Results grouped by a key (protocol, noise, outliers), each summarised. */
export function byCondition(results: readonly CaseResult[], key: (c: TruthCase) => string): [string, Summary][] {
  const groups = new Map<string, CaseResult[]>();
  for (const r of results) {
    const k = key(r.c);
    groups.set(k, [...(groups.get(k) ?? []), r]);
  }
  return [...groups.entries()].map(([k, rs]) => [k, summarise(rs)]);
}

/** Each method's own signed error: bias (median), spread (IQR/1.349), median |error|, p95, not found. */
export function methodStats(results: readonly CaseResult[]): { method: string; n: number; bias: number; spread: number; medianAbs: number; p95Abs: number; notFound: number }[] {
  const names = [...new Set(results.flatMap((r) => Object.keys(r.methods)))];
  return names.map((method) => {
    const all = results.map((r) => r.methods[method] ?? null);
    const v = all.filter((x): x is number => x !== null);
    const abs = v.map(Math.abs);
    return {
      method,
      n: v.length,
      bias: v.length ? median(v) : Number.NaN,
      spread: v.length > 1 ? (quantile(v, 0.75) - quantile(v, 0.25)) / 1.349 : Number.NaN,
      medianAbs: abs.length ? median(abs) : Number.NaN,
      p95Abs: abs.length ? quantile(abs, 0.95) : Number.NaN,
      notFound: all.length - v.length,
    };
  });
}

const f = (x: number) => (Number.isFinite(x) ? x.toFixed(1) : '—');

export const SUMMARY_HEADER =
  '| set | tests | VT1 median % | VT1 p95 % | VT1 bias % | VT2 median % | VT2 p95 % | VT2 bias % | work@VT1 median / p95 % | work@VT2 median / p95 % | VT1 CI coverage % | VT2 CI coverage % | VT1 CI width % | VT2 CI width % |\n| --- | --- | --- | --- | --- | --- | --- | --- | --- | --- | --- | --- | --- | --- |';

export function summaryRow(name: string, s: Summary): string {
  return `| ${name} | ${s.n} | ${f(s.vt1Median)} | ${f(s.vt1P95)} | ${f(s.vt1Bias)} | ${f(s.vt2Median)} | ${f(s.vt2P95)} | ${f(s.vt2Bias)} | ${f(s.work1Median)} / ${f(s.work1P95)} | ${f(s.work2Median)} / ${f(s.work2P95)} | ${f(s.vt1CoveragePct)} | ${f(s.vt2CoveragePct)} | ${f(s.vt1CiWidthPct)} | ${f(s.vt2CiWidthPct)} |`;
}

export function methodTable(results: readonly CaseResult[]): string {
  const rows = methodStats(results).map((m) => `| ${m.method} | ${m.n} | ${f(m.bias)} | ${f(m.spread)} | ${f(m.medianAbs)} | ${f(m.p95Abs)} | ${m.notFound} |`);
  return ['| method | found | bias (median signed) % | spread (IQR/1.349) % | median abs % | p95 abs % | not found |', '| --- | --- | --- | --- | --- | --- | --- |', ...rows].join('\n');
}
