/**
 * A short, neutral summary of the comparison, generated from the numbers only: the pairing
 * problems (a different subject first and in capitals), whether both tests were maximal, the
 * changes beyond the band in each metric's adverse direction and in the other direction, what
 * could not be compared, the band kind and source, and the cautions. It states measured
 * changes and never names a condition or a cause (Twofold does not diagnose).
 */
import type { TestAnalysis } from '../model/analysis';
import type { BandKind } from '../model/settings';
import { bandKindLabel } from './bands';
import type { BandTable, MetricRow, Pairing } from './types';

export const CAUTIONS =
  'Twofold supports licensed clinicians and does not diagnose. Two-day maximal testing can provoke prolonged symptom flares; screening, consent and supervision are the lab\'s responsibility. Follow local regulations and licensed practice.';

function pct(value: number): string {
  return `${Math.abs(value).toFixed(1)}%`;
}

function change(row: MetricRow): string {
  const dir = (row.deltaPct ?? 0) < 0 ? 'lower' : 'higher';
  return `${row.label} ${pct(row.deltaPct ?? 0)} ${dir} on day 2 (band ±${row.band ? row.band.halfWidthPct.toFixed(1) : '?'}%)`;
}

function effortSentence(day1: TestAnalysis, day2: TestAnalysis): string {
  const e1 = day1.effort.verdict;
  const e2 = day2.effort.verdict;
  if (e1 === 'maximal' && e2 === 'maximal') return 'Both tests met the maximal-effort criteria.';
  return `Effort: day 1 ${e1}, day 2 ${e2}; peak values are compared only between two maximal efforts.`;
}

export function summarize(day1: TestAnalysis, day2: TestAnalysis, pairing: Pairing, rows: readonly MetricRow[], kind: BandKind, table: BandTable): string {
  const parts: string[] = [];
  for (const w of pairing.warnings.filter((w) => w.severity === 'hard')) parts.push(w.message);
  const soft = pairing.warnings.filter((w) => w.severity === 'soft');
  if (soft.length > 0) parts.push(`Pairing warnings: ${soft.map((w) => w.message).join(' ')}`);
  if (pairing.intervalH !== null) parts.push(`The tests were ${pairing.intervalH.toFixed(1)} h apart.`);
  parts.push(effortSentence(day1, day2));

  const outcome = rows.filter((r) => !r.effortCheck);
  const adverse = outcome.filter((r) => r.adverseBeyondBand);
  const other = outcome.filter((r) => (r.verdict === 'decline' || r.verdict === 'rise') && !r.adverseBeyondBand);
  const within = outcome.filter((r) => r.verdict === 'within');
  const notComparable = rows.filter((r) => r.verdict === 'not_comparable');

  parts.push(adverse.length > 0 ? `Beyond the band in the adverse direction: ${adverse.map(change).join('; ')}.` : 'No metric changed beyond its band in the adverse direction.');
  if (other.length > 0) parts.push(`Beyond the band in the other direction: ${other.map(change).join('; ')}.`);
  parts.push(`${within.length} of ${outcome.length} metrics lie within their band.`);
  const rer = rows.find((r) => r.effortCheck);
  if (rer && rer.day1 !== null && rer.day2 !== null) parts.push(`Peak RER (an effort check, not an outcome): day 1 ${rer.day1.toFixed(2)}, day 2 ${rer.day2.toFixed(2)}.`);
  if (notComparable.length > 0) parts.push(`Not compared: ${notComparable.map((r) => `${r.label} (${r.reason})`).join('; ')}.`);
  parts.push(`Band: ${bandKindLabel(kind)}; source: ${table.description}.`);
  parts.push(CAUTIONS);
  return parts.join(' ');
}
