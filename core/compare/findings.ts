/**
 * Primary outcomes and findings: what a day-2 verdict rests on.
 *
 * Primary outcomes: VO2 and workload at VT1, peak VO2 and peak workload. Two-day studies
 * report VO2 and workload at the ventilatory threshold and at peak as the measures that fall
 * on day 2 (Keller et al., J Transl Med 2014: VO2 at VT −15.8 %, workload at VT −21.3 %,
 * peak VO2 −13.8 %, workload at peak −12.5 %; verified against the abstract), and workload at
 * VT as the most discriminating (Nelson et al., J Transl Med 2019: a fall of 6.3–9.8 %
 * separated patients from controls; verified against the abstract). Everything else is
 * secondary: shown, never counted as a finding, never in the headline.
 *
 * One threshold's shift is one finding: the VO2, workload, HR and time read at VT1 are facets
 * of the same breakpoint, so they are stated together in one sentence, and every facet is
 * called with the same rule, the finding's z (change-interval.ts `Z_FINDING`), so VO2/kg at VT1
 * is never "lower" while VO2 at VT1 is "undetermined". Peak values likewise (the peak finding,
 * with the exercise duration). The finding's call:
 * lower on day 2 when a primary facet is lower and none is higher; higher when the reverse;
 * reproduced when every primary facet reproduced; undetermined otherwise (one facet
 * undetermined, or the facets disagree in direction).
 */
import { verdictWords, zeroWidth, Z_FINDING } from './change-interval';
import { Z95 } from './bands';
import type { MetricDefinition } from './metric-catalog';
import type { MetricId, MetricRow, Verdict } from './types';
import { minSec } from '../locale/min-sec';

export const PRIMARY_IDS: readonly MetricId[] = ['vt1_vo2', 'vt1_work', 'peak_vo2', 'peak_work'];

export function isPrimary(id: MetricId): boolean {
  return PRIMARY_IDS.includes(id);
}

export type FindingId = 'vt1' | 'peak';

/** The finding a metric is a facet of: read at VT1, or at the peak of a maximal test; null for the rest (VT2, slopes). */
export function findingOf(def: Pick<MetricDefinition, 'threshold' | 'gate'>): FindingId | null {
  if (def.threshold === 'vt1') return 'vt1';
  if (def.threshold === null && def.gate === 'maximal') return 'peak';
  return null;
}

/** The z a metric is called with: its finding's, or 1.96 for a value outside the findings. */
export function findingZ(def: Pick<MetricDefinition, 'threshold' | 'gate'>): number {
  return findingOf(def) === null ? Z95 : Z_FINDING;
}

export interface Finding {
  readonly id: FindingId;
  readonly verdict: Verdict;
  /** One neutral sentence stating the facets together and the call in words. */
  readonly sentence: string;
  readonly primary: readonly MetricRow[];
}

/** The call of one finding from its primary facets. */
export function findingVerdict(rows: readonly MetricRow[]): Verdict {
  const calls = rows.map((r) => r.verdict).filter((v) => v !== 'not_comparable');
  if (calls.length === 0) return 'not_comparable';
  const fell = calls.includes('fell');
  const rose = calls.includes('rose');
  if (fell && !rose) return 'fell';
  if (rose && !fell) return 'rose';
  if (!fell && !rose && calls.every((v) => v === 'held') && calls.length === rows.length) return 'held';
  return 'open';
}

function signed(value: number, digits: number, unit: string): string {
  const sign = value > 0 ? '+' : value < 0 ? '−' : '';
  return `${sign}${Math.abs(value).toFixed(digits)}${unit}`;
}

function facet(label: string, row: MetricRow | undefined): string | null {
  if (!row || row.verdict === 'not_comparable' || !row.interval) return null;
  const iv = row.interval;
  const none = zeroWidth(iv);
  const interval = none === 'exact' ? 'exact, no measurement interval' : none === 'not known' ? 'no measurement interval' : `interval ${signed(iv.lowPct, 1, '')} to ${signed(iv.highPct, 1, ' %')}`;
  return `${label} ${signed(iv.changePct, 1, ' %')} (${interval}; ${verdictWords(row.verdict)})`;
}

function notComparableText(rows: readonly MetricRow[]): string {
  return rows.map((r) => `${r.label}: ${r.reason}`).join('; ');
}

function vt1Finding(rows: readonly MetricRow[]): Finding {
  const by = (id: MetricId) => rows.find((r) => r.id === id);
  const primary = [by('vt1_vo2'), by('vt1_work')].filter((r): r is MetricRow => r !== undefined);
  const verdict = findingVerdict(primary);
  if (verdict === 'not_comparable') return { id: 'vt1', verdict, primary, sentence: `VT1 could not be compared (${notComparableText(primary)}).` };
  const parts = [facet('VO2', by('vt1_vo2')), facet('workload', by('vt1_work'))].filter((p): p is string => p !== null);
  const hr = by('vt1_hr');
  if (hr && hr.delta !== null) parts.push(`HR ${signed(hr.delta, 0, ' bpm')}`);
  const time = by('vt1_time');
  if (time && time.delta !== null) parts.push(`${minSec(Math.abs(time.delta))} (m:ss) ${time.delta < 0 ? 'sooner' : 'later'} into the ramp`);
  const lead =
    verdict === 'fell'
      ? 'VT1 came earlier on day 2'
      : verdict === 'rose'
        ? 'VT1 came later on day 2'
        : verdict === 'held'
          ? 'VT1 reproduced day 1'
          : 'VT1 on day 2 is undetermined against day 1';
  return { id: 'vt1', verdict, primary, sentence: `${lead}: ${parts.join(', ')}.` };
}

function peakFinding(rows: readonly MetricRow[]): Finding {
  const by = (id: MetricId) => rows.find((r) => r.id === id);
  const primary = [by('peak_vo2'), by('peak_work')].filter((r): r is MetricRow => r !== undefined);
  const verdict = findingVerdict(primary);
  if (verdict === 'not_comparable') return { id: 'peak', verdict, primary, sentence: `Peak values could not be compared (${notComparableText(primary)}).` };
  const parts = [facet('VO2', by('peak_vo2')), facet('workload', by('peak_work'))].filter((p): p is string => p !== null);
  const lead =
    verdict === 'fell' ? 'The peak was lower on day 2' : verdict === 'rose' ? 'The peak was higher on day 2' : verdict === 'held' ? 'The peak reproduced day 1' : 'The day-2 peak is undetermined against day 1';
  return { id: 'peak', verdict, primary, sentence: `${lead}: ${parts.join(', ')}.` };
}

/** The findings of a comparison, VT1 first. */
export function findings(rows: readonly MetricRow[]): Finding[] {
  return [vt1Finding(rows), peakFinding(rows)];
}
