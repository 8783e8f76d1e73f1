/**
 * Day 2 against day 1, metric by metric: both values, absolute and percent change, the band
 * that applies, and a verdict with its reason.
 *
 * Verdicts: `within` when |Δ%| ≤ the band's half-width; otherwise `decline` (day 2 lower) or
 * `rise` (day 2 higher). `not_comparable` when a value is missing on either day, a threshold
 * was not found on one day, or a peak metric comes from a test that was not a maximal effort
 * (effort.verdict !== 'maximal'): a lower peak then may reflect effort, not capacity (common
 * practice). The percent change is of day 1: Δ% = 100 · (day 2 − day 1) / day 1.
 * Whether a change counts against the subject is carried separately (`adverse`,
 * `adverseBeyondBand`), so a rise of the VE/VCO2 slope is worded as the adverse change it is.
 */
import type { TestAnalysis } from '../model/analysis';
import type { BandKind } from '../model/settings';
import { bandFor, DEFAULT_BAND_TABLE } from './bands';
import { METRICS, type MetricDefinition } from './metric-catalog';
import type { BandTable, MetricRow, Verdict } from './types';

function fmt(value: number): string {
  return Math.abs(value) >= 100 ? value.toFixed(0) : Math.abs(value) >= 10 ? value.toFixed(1) : value.toFixed(2);
}

function missingReason(def: MetricDefinition, test: TestAnalysis, day: string): string {
  if (def.threshold) {
    const result = test[def.threshold];
    if (result.at === null) return `${def.threshold.toUpperCase()} not found on ${day}${result.reason ? `: ${result.reason}` : ''}`;
  }
  if (def.unit === 'W' && test.metadata.modality === 'treadmill') return `no workload in watts on ${day} (treadmill)`;
  return `${def.label} not available on ${day} (not recorded or not computable)`;
}

export function compareMetric(def: MetricDefinition, day1: TestAnalysis, day2: TestAnalysis, kind: BandKind, table: BandTable): MetricRow {
  const v1 = def.read(day1);
  const v2 = def.read(day2);
  const ok1 = v1 !== null && Number.isFinite(v1);
  const ok2 = v2 !== null && Number.isFinite(v2);
  const band = bandFor(def.id, kind, table);
  const delta = ok1 && ok2 ? v2 - v1 : null;
  const deltaPct = ok1 && ok2 && v1 !== 0 ? (100 * (v2 - v1)) / Math.abs(v1) : null;
  const base = {
    id: def.id,
    label: def.label,
    unit: def.unit,
    adverse: def.adverse,
    effortCheck: def.effortCheck,
    day1: ok1 ? v1 : null,
    day2: ok2 ? v2 : null,
    delta,
    deltaPct,
    band,
  };
  const notComparable = (reason: string): MetricRow => ({ ...base, verdict: 'not_comparable', adverseBeyondBand: false, reason: def.effortCheck ? `${reason}; peak RER is an effort check, not an outcome` : reason });

  const missing = [!ok1 ? missingReason(def, day1, 'day 1') : null, !ok2 ? missingReason(def, day2, 'day 2') : null].filter((r): r is string => r !== null);
  if (missing.length > 0) return notComparable(missing.join('; '));
  if (def.gate === 'maximal') {
    const notMax = [day1.effort.verdict !== 'maximal' ? `day 1 effort ${day1.effort.verdict}` : null, day2.effort.verdict !== 'maximal' ? `day 2 effort ${day2.effort.verdict}` : null].filter(Boolean);
    if (notMax.length > 0) return notComparable(`peak metric compared only between two maximal efforts (${notMax.join(', ')})`);
  }
  if (deltaPct === null) return notComparable('day 1 value is zero, so no percent change exists');
  if (band === null) return notComparable('no band for this metric');

  const within = Math.abs(deltaPct) <= band.halfWidthPct;
  const verdict: Verdict = within ? 'within' : deltaPct < 0 ? 'decline' : 'rise';
  const adverseBeyondBand = !def.effortCheck && ((verdict === 'decline' && def.adverse === 'lower') || (verdict === 'rise' && def.adverse === 'higher'));
  const sign = deltaPct > 0 ? '+' : '';
  const where = within ? 'within' : 'beyond';
  let reason = `change ${sign}${fmt(deltaPct)}% lies ${where} the band ±${fmt(band.halfWidthPct)}% (${band.kind})`;
  if (!within) reason += adverseBeyondBand ? '; this is the adverse direction for this metric' : '; this is not the adverse direction for this metric';
  if (def.effortCheck) reason += '; peak RER is an effort check, not an outcome';
  return { ...base, verdict, adverseBeyondBand, reason };
}

export function compareMetrics(day1: TestAnalysis, day2: TestAnalysis, kind: BandKind, table: BandTable = DEFAULT_BAND_TABLE): MetricRow[] {
  return METRICS.map((def) => compareMetric(def, day1, day2, kind, table));
}
