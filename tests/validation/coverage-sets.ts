/**
 * The large held-out sets for the interval's coverage (issue 10, item 4), and the coverage
 * figures with their binomial 95 % confidence interval (Wilson, J Am Stat Assoc 1927).
 *
 * Why a second held-out range: the 72 tests per set of heldout.ts move a coverage by 1.4 points
 * each, and a perfectly calibrated 95 % interval lands in 93–97 % on 72 tests only about half
 * the time; on 504 tests it does so with probability of about 0.97 (binomial).
 *
 * Seeds: COVERAGE_FIRST_SEED and up, a range no other script, test or tuning run uses (the
 * others: held-out grids 1–72 and 1001–1072, development grids from 5000, day-2 pairs
 * 9000–9559, 20001–20200, 30001–30200, 40001–45250 and 49000 on, whose generator seeds are
 * 2·seed and 2·seed + 1, below 100,000; demo scenario 41701–63802). Family 1: main grid seeds
 * 200001–200504 (42 per cell of its 12 cells), hard 201001–201504 (21 per cell of its 24; the
 * grid's own HARD_SEED_OFFSET); family B: 200001–200504 in each of its two conditions (its
 * own grid draws a different subject per condition from the same seed). The same grid builders
 * as the 72-test sets, so the conditions are the same. Never tune on these.
 */
import { kineticCases } from '../../sample-tests/kinetic-family';
import { DEVELOPMENT_FIRST_SEED, hardCases, HARD_SEED_OFFSET, mainCases } from './cases';
import { familyBCase } from './family-b';
import { family1, measureCase, type CaseResult, type TruthCase } from './measure';

/** First seed of the large held-out coverage sets (both families). */
export const COVERAGE_FIRST_SEED = 200001;
/** Tests per family and condition: 42 × 12 main cells, 21 × 24 hard cells, 504 family-B draws. */
export const COVERAGE_TESTS_PER_SET = 504;
/** Highest seed any coverage set uses. */
export const COVERAGE_LAST_SEED = COVERAGE_FIRST_SEED + HARD_SEED_OFFSET + COVERAGE_TESTS_PER_SET - 1;

/**
 * Why a development run over seeds first … first + span − 1 (span: the seeds it may draw,
 * hard condition included) would touch held-out seeds, or null when it would not: the
 * held-out grids start at VALIDATION_FIRST_SEED and sit below DEVELOPMENT_FIRST_SEED, and
 * the large coverage sets are COVERAGE_FIRST_SEED … COVERAGE_LAST_SEED.
 */
export function developmentSeedProblem(first: number, span: number): string | null {
  const last = first + span - 1;
  if (!Number.isInteger(first) || !Number.isInteger(span) || span < 1) return `seeds must be whole numbers, got first ${first}, span ${span}`;
  if (first < DEVELOPMENT_FIRST_SEED) return `development seeds start at ${DEVELOPMENT_FIRST_SEED}; ${first} is a held-out seed`;
  if (first <= COVERAGE_LAST_SEED && last >= COVERAGE_FIRST_SEED) return `seeds ${first}–${last} reach the held-out coverage sets (${COVERAGE_FIRST_SEED}–${COVERAGE_LAST_SEED})`;
  return null;
}

export interface CoverageSet {
  readonly name: string;
  readonly family: 'family 1' | 'family B';
  readonly condition: 'main' | 'hard';
  readonly cases: readonly TruthCase[];
}

export function coverageSets(): CoverageSet[] {
  const n = COVERAGE_TESTS_PER_SET;
  return [
    { name: 'family 1, main', family: 'family 1', condition: 'main', cases: family1(mainCases(n / 12, COVERAGE_FIRST_SEED)) },
    { name: 'family 1, hard', family: 'family 1', condition: 'hard', cases: family1(hardCases(n / 24, COVERAGE_FIRST_SEED)) },
    { name: 'family B, main', family: 'family B', condition: 'main', cases: kineticCases('main', n, COVERAGE_FIRST_SEED).map((c) => familyBCase(c, 'main')) },
    {
      name: 'family B, hard',
      family: 'family B',
      condition: 'hard',
      cases: kineticCases('short-or-noisy', n, COVERAGE_FIRST_SEED).map((c) => familyBCase(c, 'short-or-noisy')),
    },
  ];
}

/**
 * Wilson score interval for k successes in n trials (Wilson, J Am Stat Assoc 1927), in %.
 * Example: 475 of 500 → [92.7, 96.6].
 */
export function wilsonPct(k: number, n: number, z = 1.959964): readonly [number, number] {
  if (n === 0) return [Number.NaN, Number.NaN];
  const p = k / n;
  const z2n = (z * z) / n;
  const centre = (p + z2n / 2) / (1 + z2n);
  const half = (z / (1 + z2n)) * Math.sqrt((p * (1 - p)) / n + (z * z) / (4 * n * n));
  return [100 * (centre - half), 100 * (centre + half)];
}

export interface ThresholdCoverage {
  /** Tests whose interval holds the true VO2, of the tests with an interval. */
  readonly covered: number;
  readonly withInterval: number;
  /** Tests where the threshold (and so its interval) was not found: not in the coverage. */
  readonly noInterval: number;
  readonly pct: number;
  readonly wilson: readonly [number, number];
  /** Median interval width, % of the true VO2. */
  readonly medianWidthPct: number;
}

function median(values: readonly number[]): number {
  if (!values.length) return Number.NaN;
  const s = [...values].sort((a, b) => a - b);
  const m = Math.floor(s.length / 2);
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

export function thresholdCoverage(covered: readonly (boolean | null)[], widths: readonly (number | null)[]): ThresholdCoverage {
  const known = covered.filter((v): v is boolean => v !== null);
  const k = known.filter(Boolean).length;
  return {
    covered: k,
    withInterval: known.length,
    noInterval: covered.length - known.length,
    pct: known.length ? (100 * k) / known.length : Number.NaN,
    wilson: wilsonPct(k, known.length),
    medianWidthPct: median(widths.filter((w): w is number => w !== null)),
  };
}

export function cellCoverage(results: readonly CaseResult[]): { n: number; vt1: ThresholdCoverage; vt2: ThresholdCoverage } {
  return {
    n: results.length,
    vt1: thresholdCoverage(
      results.map((r) => r.vt1Covered),
      results.map((r) => r.vt1CiWidthPct),
    ),
    vt2: thresholdCoverage(
      results.map((r) => r.vt2Covered),
      results.map((r) => r.vt2CiWidthPct),
    ),
  };
}

const f1 = (x: number) => (Number.isFinite(x) ? x.toFixed(1) : '—');
const cov = (t: ThresholdCoverage) => `${f1(t.pct)} (${t.covered}/${t.withInterval}; ${f1(t.wilson[0])}–${f1(t.wilson[1])})`;

export const COVERAGE_HEADER =
  '| set | tests | VT1 coverage % (covered/with interval; Wilson 95 %) | VT2 coverage % (covered/with interval; Wilson 95 %) | no interval VT1 / VT2 | median width % VT1 / VT2 |\n| --- | --- | --- | --- | --- | --- |';

export function coverageRow(name: string, results: readonly CaseResult[]): string {
  const c = cellCoverage(results);
  return `| ${name} | ${c.n} | ${cov(c.vt1)} | ${cov(c.vt2)} | ${c.vt1.noInterval} / ${c.vt2.noInterval} | ${f1(c.vt1.medianWidthPct)} / ${f1(c.vt2.medianWidthPct)} |`;
}

export interface MeasuredSet {
  readonly set: CoverageSet;
  readonly results: readonly CaseResult[];
  /** Wall time to analyse the set, s (the sets are built before, in coverageSets()). */
  readonly seconds: number;
}

/** Builds every coverage set, then analyses each (default settings, as measure.ts). */
export function measureCoverageSets(): MeasuredSet[] {
  return coverageSets().map((set) => {
    const t0 = Date.now();
    const results = set.cases.map((c) => measureCase(c));
    return { set, results, seconds: (Date.now() - t0) / 1000 };
  });
}

/**
 * The printed report: one row per family × condition, the hard condition's two kinds, and the
 * groups the interval's label states (interval-label.ts: 'usual' = main and very noisy tests,
 * 'short' = short-ramp tests).
 */
export function coverageReport(measured: readonly MeasuredSet[]): string {
  const lines = [COVERAGE_HEADER];
  for (const m of measured) lines.push(coverageRow(`${m.set.name} (analysis ${m.seconds.toFixed(0)} s)`, m.results));
  for (const m of measured.filter((x) => x.set.condition === 'hard')) {
    for (const kind of ['short ramp', 'very noisy']) lines.push(coverageRow(`${m.set.family}, hard: ${kind}`, m.results.filter((r) => r.c.hardKind === kind)));
  }
  for (const family of ['family 1', 'family B']) {
    const all = measured.filter((m) => m.set.family === family).flatMap((m) => m.results);
    lines.push(coverageRow(`${family}, label 'usual' (main + very noisy)`, all.filter((r) => r.c.hardKind !== 'short ramp')));
    lines.push(coverageRow(`${family}, label 'short' (short ramps)`, all.filter((r) => r.c.hardKind === 'short ramp')));
  }
  return lines.join('\n');
}
