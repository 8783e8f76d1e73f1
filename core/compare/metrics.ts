/**
 * Day 2 against day 1, metric by metric: both values, absolute and percent change, the band,
 * the change interval and the call (change-interval.ts) with its reason in words.
 *
 * `not_comparable` when a value is missing on either day, a threshold was not found on one
 * day, or a peak metric comes from a test that was not a maximal effort (effort.verdict !==
 * 'maximal'): a lower peak then may reflect effort, not capacity (common practice).
 * Δ% = 100 · (day 2 − day 1) / day 1. Whether a change counts against the subject is carried
 * separately (`adverse`, `adverseBeyondBand`), so a rise of the VE/VCO2 slope is worded as
 * the adverse change it is.
 */
import type { TestAnalysis } from '../model/analysis';
import { bandFor, DEFAULT_BAND_TABLE } from './bands';
import { changeCall, verdictWords, zeroWidth } from './change-interval';
import { findingZ } from './findings';
import { measurementSd } from './measurement';
import { METRICS, type MetricDefinition } from './metric-catalog';
import type { BandTable, MetricRow } from './types';

function missingReason(def: MetricDefinition, test: TestAnalysis, day: string): string {
  if (def.threshold) {
    const result = test[def.threshold];
    if (result.at === null) return `${def.threshold.toUpperCase()} not found on ${day}${result.reason ? `: ${result.reason}` : ''}`;
  }
  if (def.unit === 'W' && test.metadata.modality === 'treadmill') return `no workload in watts on ${day} (treadmill)`;
  return `${def.label} not available on ${day} (not recorded or not computable)`;
}

export function compareMetric(def: MetricDefinition, day1: TestAnalysis, day2: TestAnalysis, table: BandTable): MetricRow {
  const v1 = def.read(day1);
  const v2 = def.read(day2);
  const ok1 = v1 !== null && Number.isFinite(v1);
  const ok2 = v2 !== null && Number.isFinite(v2);
  const band = bandFor(def.id, table);
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
  const notComparable = (reason: string): MetricRow => ({ ...base, interval: null, verdict: 'not_comparable', adverseBeyondBand: false, reason: def.effortCheck ? `${reason}; peak RER is an effort check, not an outcome` : reason });

  const missing = [!ok1 ? missingReason(def, day1, 'day 1') : null, !ok2 ? missingReason(def, day2, 'day 2') : null].filter((r): r is string => r !== null);
  if (missing.length > 0) return notComparable(missing.join('; '));
  if (def.gate === 'maximal') {
    const notMax = [day1.effort.verdict !== 'maximal' ? `day 1 effort ${day1.effort.verdict}` : null, day2.effort.verdict !== 'maximal' ? `day 2 effort ${day2.effort.verdict}` : null].filter(Boolean);
    if (notMax.length > 0) return notComparable(`peak metric compared only between two maximal efforts (${notMax.join(', ')})`);
  }
  if (deltaPct === null) return notComparable('day 1 value is zero, so no percent change exists');
  const m1 = measurementSd(day1, def.id);
  const m2 = measurementSd(day2, def.id);
  const call = changeCall(v1 as number, v2 as number, m1.sd, m2.sd, band, m1.how, findingZ(def));
  if (call === null) return notComparable('a value is not positive, so no change ratio exists');

  const { verdict, interval: iv } = call;
  const adverseBeyondBand = !def.effortCheck && ((verdict === 'fell' && def.adverse === 'lower') || (verdict === 'rose' && def.adverse === 'higher'));
  const missingSd = [m1.sd === null ? 'day 1' : null, m2.sd === null ? 'day 2' : null].filter(Boolean);
  const none = zeroWidth(iv);
  const measured = none === 'exact' ? ` (exact: ${m1.how})` : none === 'not known' ? '' : ` (measurement interval ${signedPct(iv.lowPct)} to ${signedPct(iv.highPct)}, from ${m1.how})`;
  let reason = `change ${signedPct(iv.changePct)}${measured}; a reproduced test lies within ${signedPct(band.lowPct)} to ${signedPct(band.highPct)}`;
  if (band.centrePct !== 0) reason += ` (centred on the band's mean day-2 change ${signedPct(band.centrePct)})`;
  if (missingSd.length > 0) reason += `; no measurement interval on ${missingSd.join(' and ')}, so the band alone applies there`;
  reason += `; ${verdictWords(verdict)}`;
  if (verdict === 'fell' || verdict === 'rose') reason += ` (beyond the limit ${signedPct(verdict === 'fell' ? iv.limitLowPct : iv.limitHighPct)} that biology and both days' measurement allow together)`;
  else if (verdict === 'open') reason += ' (the interval reaches past a band edge, but the change is not beyond the combined limit)';
  if (def.effortCheck) reason += '; peak RER is an effort check, not an outcome';
  return { ...base, interval: iv, verdict, adverseBeyondBand, reason };
}

function signedPct(value: number): string {
  return `${value > 0 ? '+' : value < 0 ? '−' : ''}${Math.abs(value).toFixed(1)} %`;
}

export function compareMetrics(day1: TestAnalysis, day2: TestAnalysis, table: BandTable = DEFAULT_BAND_TABLE): MetricRow[] {
  return METRICS.map((def) => compareMetric(def, day1, day2, table));
}
