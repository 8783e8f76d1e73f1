/**
 * Day 2 against day 1, end to end: pairing checks, metric deltas against the band, matched
 * workloads and the neutral summary. Pure and deterministic: the same two analyses, settings
 * and band always give the same comparison.
 *
 * Example: compareTests(day1, day2, DEFAULT_SETTINGS) compares against Twofold's default band
 * (24-h retests of control groups, docs/comparison.md). `refusals` lists the mistakes that make
 * the comparison meaningless (refusals.ts); a shell must not present a verdict when it is not
 * empty. settings.compare.bandKind is no longer a decision rule (the call reads the change
 * interval, change-interval.ts); it is kept only so older case files still validate.
 */
import type { TestAnalysis } from '../model/analysis';
import type { Settings } from '../model/settings';
import { bandStatement, DEFAULT_BAND_TABLE } from './bands';
import { verdictWords } from './change-interval';
import { findings, isPrimary, type Finding } from './findings';
import { matchedWorkloads, type MatchedWorkloads } from './matched';
import { compareMetrics } from './metrics';
import { pairTests } from './pairing';
import { pairRefusals, type PairRefusal, type RefusalInputs } from './refusals';
import type { BandTable, MetricRow, Pairing } from './types';
import { summarize } from './wording';

export interface Comparison {
  readonly day1Source: string;
  readonly day2Source: string;
  readonly pairing: Pairing;
  readonly metrics: readonly MetricRow[];
  /** One finding per threshold shift and one for the peak, from the primary outcomes. */
  readonly findings: readonly Finding[];
  readonly refusals: readonly PairRefusal[];
  readonly matched: MatchedWorkloads;
  readonly band: BandTable;
  readonly summary: string;
  readonly settings: Settings;
}

export function compareTests(day1: TestAnalysis, day2: TestAnalysis, settings: Settings, band: BandTable = DEFAULT_BAND_TABLE, inputs: RefusalInputs = {}): Comparison {
  const pairing = pairTests(day1, day2, settings);
  const refusals = pairRefusals(day1, day2, inputs);
  const metrics = compareMetrics(day1, day2, band);
  const found = findings(metrics);
  const matched = matchedWorkloads(day1, day2, settings);
  const summary = summarize(day1, day2, pairing, found, band, refusals);
  return { day1Source: day1.sourceName, day2Source: day2.sourceName, pairing, metrics, findings: found, refusals, matched, band, summary, settings };
}

function num(value: number | null, digits = 3): number | null {
  if (value === null || !Number.isFinite(value)) return null;
  const f = 10 ** digits;
  return Math.round(value * f) / f;
}

/** The comparison as the CLI prints it with --json (snake_case keys). */
export function comparisonJson(c: Comparison): Record<string, unknown> {
  return {
    day1: c.day1Source,
    day2: c.day2Source,
    pairing: {
      interval_h: num(c.pairing.intervalH, 2),
      hard_mismatch: c.pairing.hardMismatch,
      warnings: c.pairing.warnings.map((w) => ({ code: w.code, severity: w.severity, message: w.message })),
    },
    refusals: c.refusals.map((r) => ({ code: r.code, message: r.message })),
    band: { origin: c.band.origin, description: c.band.description, population: c.band.population, retest_interval: c.band.retestInterval, statistic: c.band.statistic, source: c.band.source, statement: bandStatement(c.band) },
    findings: c.findings.map((f) => ({ id: f.id, verdict: f.verdict, words: verdictWords(f.verdict), sentence: f.sentence })),
    metrics: c.metrics.map((m) => ({
      id: m.id,
      label: m.label,
      unit: m.unit,
      day1: num(m.day1),
      day2: num(m.day2),
      delta: num(m.delta),
      delta_pct: num(m.deltaPct, 2),
      primary: isPrimary(m.id),
      band_low_pct: m.band ? num(m.band.lowPct, 2) : null,
      band_high_pct: m.band ? num(m.band.highPct, 2) : null,
      band_centre_pct: m.band ? num(m.band.centrePct, 2) : null,
      band_cv_pct: m.band ? num(m.band.cvPct, 2) : null,
      change_interval_pct: m.interval ? [num(m.interval.lowPct, 2), num(m.interval.highPct, 2)] : null,
      limits_pct: m.interval ? [num(m.interval.limitLowPct, 2), num(m.interval.limitHighPct, 2)] : null,
      measurement_sd_log: m.interval ? { day1: num(m.interval.day1Sd, 4), day2: num(m.interval.day2Sd, 4), from: m.interval.measurement } : null,
      band_source: m.band ? `${m.band.origin}: ${m.band.source}` : null,
      adverse_direction: m.adverse,
      effort_check: m.effortCheck,
      verdict: m.verdict,
      verdict_words: verdictWords(m.verdict),
      adverse_beyond_band: m.adverseBeyondBand,
      reason: m.reason,
    })),
    matched_workloads: c.matched.available
      ? c.matched.rows.map((r) => ({
          work_w: num(r.workW, 1),
          kind: r.kind,
          vo2_ml_min: { day1: num(r.values.vo2MlMin.day1, 1), day2: num(r.values.vo2MlMin.day2, 1), delta_pct: num(r.values.vo2MlMin.deltaPct, 2) },
          hr_bpm: { day1: num(r.values.hrBpm.day1, 1), day2: num(r.values.hrBpm.day2, 1), delta_pct: num(r.values.hrBpm.deltaPct, 2) },
          ve_l_min: { day1: num(r.values.veLMin.day1, 2), day2: num(r.values.veLMin.day2, 2), delta_pct: num(r.values.veLMin.deltaPct, 2) },
          rer: { day1: num(r.values.rer.day1), day2: num(r.values.rer.day2), delta_pct: num(r.values.rer.deltaPct, 2) },
          ve_vco2: { day1: num(r.values.veVco2.day1, 2), day2: num(r.values.veVco2.day2, 2), delta_pct: num(r.values.veVco2.deltaPct, 2) },
        }))
      : [],
    matched_workloads_status: c.matched.available
      ? { available: true, range_w: c.matched.rangeW, step_w: c.matched.stepW }
      : { available: false, reason: c.matched.reason },
    summary: c.summary,
    settings: c.settings,
  };
}
