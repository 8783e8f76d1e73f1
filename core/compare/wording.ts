/**
 * A short, neutral summary of the comparison, generated from the numbers only: a different
 * subject first and in capitals, any refusal, one sentence per primary finding (findings.ts),
 * the effort of both tests, and the band's population, retest interval and source. It states
 * measured changes and never names a condition or a cause (Twofold does not diagnose). The
 * cautions are kept apart (CAUTIONS), in their own box, not repeated inside the summary.
 */
import type { TestAnalysis } from '../model/analysis';
import type { Finding } from './findings';
import type { PairRefusal } from './refusals';
import type { BandTable, Pairing } from './types';

export const CAUTIONS =
  'Twofold supports licensed clinicians and does not diagnose. Two-day maximal testing can provoke prolonged symptom flares; screening, consent and supervision are the lab\'s responsibility. Follow local regulations and licensed practice.';

function effortSentence(day1: TestAnalysis, day2: TestAnalysis): string {
  const e1 = day1.effort.verdict;
  const e2 = day2.effort.verdict;
  if (e1 === 'maximal' && e2 === 'maximal') return 'Both tests met the maximal-effort criteria.';
  return `Effort: day 1 ${e1}, day 2 ${e2}; peak values are compared only between two maximal efforts.`;
}

/** The band in one sentence: population, retest interval and source. */
export function bandSentence(table: BandTable): string {
  return `Band: ${table.population}, retested ${table.retestInterval} apart (${table.description}).`;
}

export function summarize(day1: TestAnalysis, day2: TestAnalysis, pairing: Pairing, found: readonly Finding[], table: BandTable, refusals: readonly PairRefusal[] = []): string {
  const parts: string[] = [];
  for (const w of pairing.warnings.filter((w) => w.severity === 'hard')) parts.push(w.message);
  for (const r of refusals) parts.push(`NOT COMPARED: ${r.message}`);
  if (refusals.length === 0) for (const f of found) parts.push(f.sentence);
  parts.push(effortSentence(day1, day2));
  if (pairing.intervalH !== null) parts.push(`The tests were ${pairing.intervalH.toFixed(1)} h apart.`);
  parts.push(bandSentence(table));
  return parts.join(' ');
}
