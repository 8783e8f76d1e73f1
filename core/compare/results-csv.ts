/**
 * The batch results table (CSV, our own layout): one row per manifest pair, compared or
 * skipped with its located error, so no pair is ever dropped silently. Columns: pair_id,
 * status (compared | skipped | refused), error, interval_h, hard_mismatch, warnings, band,
 * band_origin, then for each metric `<id>_day1`, `<id>_day2`, `<id>_delta_pct`, `<id>_verdict`
 * (held = reproduced, fell = lower on day 2, rose = higher on day 2, open = undetermined).
 * A refused pair (refusals.ts: same file, same series, day order, day metadata) carries the
 * refusal as its error and no values.
 * Comma delimiter, dot decimals, RFC 4180 quoting, LF line ends.
 */
import { formatLocated, type LocatedError } from '../model/errors';
import type { Comparison } from './compare-tests';
import { METRIC_IDS } from './metric-catalog';

export type BatchOutcome =
  | { readonly pairId: string; readonly status: 'compared'; readonly comparison: Comparison }
  | { readonly pairId: string; readonly status: 'skipped'; readonly error: LocatedError };

function cell(value: string | number | boolean | null): string {
  if (value === null) return '';
  const text = typeof value === 'number' ? (Number.isFinite(value) ? String(Math.round(value * 1000) / 1000) : '') : String(value);
  return /[",\n\r]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

export function resultsHeader(): string {
  const metricCols = METRIC_IDS.flatMap((id) => [`${id}_day1`, `${id}_day2`, `${id}_delta_pct`, `${id}_verdict`]);
  return ['pair_id', 'status', 'error', 'interval_h', 'hard_mismatch', 'warnings', 'band', 'band_origin', ...metricCols].join(',');
}

export function resultsRow(outcome: BatchOutcome): string {
  if (outcome.status === 'skipped') {
    const blanks = new Array(5 + METRIC_IDS.length * 4).fill('');
    return [cell(outcome.pairId), 'skipped', cell(formatLocated(outcome.error)), ...blanks].join(',');
  }
  const c = outcome.comparison;
  if (c.refusals.length > 0) {
    const blanks = new Array(5 + METRIC_IDS.length * 4).fill('');
    return [cell(outcome.pairId), 'refused', cell(c.refusals.map((r) => `${r.code}: ${r.message}`).join(' | ')), ...blanks].join(',');
  }
  const byId = new Map(c.metrics.map((m) => [m.id, m]));
  const metricCells = METRIC_IDS.flatMap((id) => {
    const m = byId.get(id);
    return m ? [cell(m.day1), cell(m.day2), cell(m.deltaPct), m.verdict] : ['', '', '', ''];
  });
  return [
    cell(outcome.pairId),
    'compared',
    '',
    cell(c.pairing.intervalH),
    cell(c.pairing.hardMismatch),
    cell(c.pairing.warnings.map((w) => w.message).join(' | ')),
    cell(c.band.description),
    c.band.origin,
    ...metricCells,
  ].join(',');
}
