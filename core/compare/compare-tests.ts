/**
 * Day 2 against day 1, end to end: pairing checks, metric deltas against the band, matched
 * workloads and the neutral summary. Pure and deterministic: the same two analyses, settings
 * and band always give the same comparison.
 *
 * Example: compareTests(day1, day2, DEFAULT_SETTINGS) compares against Twofold's default band
 * table (docs/comparison.md) with the band kind of settings.compare.bandKind.
 */
import type { TestAnalysis } from '../model/analysis';
import type { BandKind, Settings } from '../model/settings';
import { bandKindLabel, DEFAULT_BAND_TABLE } from './bands';
import { matchedWorkloads, type MatchedWorkloads } from './matched';
import { compareMetrics } from './metrics';
import { pairTests } from './pairing';
import type { BandTable, MetricRow, Pairing } from './types';
import { summarize } from './wording';

export interface Comparison {
  readonly day1Source: string;
  readonly day2Source: string;
  readonly pairing: Pairing;
  readonly metrics: readonly MetricRow[];
  readonly matched: MatchedWorkloads;
  readonly bandKind: BandKind;
  readonly band: BandTable;
  readonly summary: string;
  readonly settings: Settings;
}

export function compareTests(day1: TestAnalysis, day2: TestAnalysis, settings: Settings, band: BandTable = DEFAULT_BAND_TABLE): Comparison {
  const kind = settings.compare.bandKind;
  const pairing = pairTests(day1, day2, settings);
  const metrics = compareMetrics(day1, day2, kind, band);
  const matched = matchedWorkloads(day1, day2, settings);
  const summary = summarize(day1, day2, pairing, metrics, kind, band);
  return { day1Source: day1.sourceName, day2Source: day2.sourceName, pairing, metrics, matched, bandKind: kind, band, summary, settings };
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
    band: { kind: c.bandKind, kind_label: bandKindLabel(c.bandKind), origin: c.band.origin, description: c.band.description },
    metrics: c.metrics.map((m) => ({
      id: m.id,
      label: m.label,
      unit: m.unit,
      day1: num(m.day1),
      day2: num(m.day2),
      delta: num(m.delta),
      delta_pct: num(m.deltaPct, 2),
      band_pct: m.band ? num(m.band.halfWidthPct, 2) : null,
      band_cv_pct: m.band ? num(m.band.cvPct, 2) : null,
      band_source: m.band ? `${m.band.origin}: ${m.band.source}` : null,
      adverse_direction: m.adverse,
      effort_check: m.effortCheck,
      verdict: m.verdict,
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
