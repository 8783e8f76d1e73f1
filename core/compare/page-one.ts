/**
 * What page 1 of the report leads with, as plain data (pure; the report, the CLI and the
 * workbench lay it out): the neutral finding sentences, the band's population and retest
 * interval, the primary table and the secondary table. No caution text here: the cautions
 * keep their own box.
 */
import { bandStatement } from './bands';
import type { Comparison } from './compare-tests';
import { verdictWords, zeroWidth } from './change-interval';
import { isPrimary } from './findings';
import type { MetricRow } from './types';
import { formatFixed, formatSigned } from '../locale/format-number';
import { localeByTag, type ReportLocale } from '../locale/locales';
import { minSec } from '../locale/min-sec';

export interface PageOneTable {
  readonly header: readonly string[];
  readonly rows: readonly (readonly string[])[];
}

export interface PageOne {
  /** One neutral sentence per primary finding (or the refusals, when the pair was refused). */
  readonly sentences: readonly string[];
  /** "Band: population; retest interval …" and the full statement with statistic and source. */
  readonly bandLine: string;
  /** "Statistic: …. Source: …." of the band. */
  readonly bandBasis: string;
  readonly bandStatement: string;
  readonly primary: PageOneTable;
  readonly secondary: PageOneTable;
}

/** A duration as a person reads it, m:ss (e.g. 452 → '7:32'), by the one formatter; '–' when missing. */
const clock = (seconds: number | null): string => minSec(seconds);

function digits(unit: string): number {
  return unit === 'mL/min' || unit === 'W' || unit === 'bpm' || unit === 's' ? 0 : unit === '' ? 2 : 1;
}

/** The table cells' numbers in one locale (`twofold verify` reads the report's back in it). */
function cells(locale: ReportLocale) {
  const value = (v: number | null, d: number): string => formatFixed(v, d, locale);
  const signedPct = (v: number | null | undefined): string => formatSigned(v, 1, locale);
  const range = (lo: number | undefined, hi: number | undefined): string => (lo === undefined || hi === undefined ? '–' : `${signedPct(lo)} to ${signedPct(hi)}`);
  const primaryRow = (m: MetricRow): string[] => {
    const d = digits(m.unit);
    return [
      `${m.label}${m.unit ? ` (${m.unit})` : ''}`,
      value(m.day1, d),
      value(m.day2, d),
      signedPct(m.interval?.changePct ?? m.deltaPct),
      m.interval && zeroWidth(m.interval) ? `none (${zeroWidth(m.interval)})` : range(m.interval?.lowPct, m.interval?.highPct),
      m.band ? range(m.band.lowPct, m.band.highPct) : '–',
      verdictWords(m.verdict),
    ];
  };
  const secondaryRow = (m: MetricRow): string[] => {
    const d = digits(m.unit);
    const band = m.band ? range(m.band.lowPct, m.band.highPct) : '–';
    if (m.unit === 's') return [m.label, 'm:ss', clock(m.day1), clock(m.day2), signedPct(m.deltaPct), band, verdictWords(m.verdict)];
    return [m.label, m.unit || '–', value(m.day1, d), value(m.day2, d), signedPct(m.deltaPct), band, verdictWords(m.verdict)];
  };
  return { primaryRow, secondaryRow };
}

const NEUTRAL = localeByTag(undefined);

/** `locale` writes the tables' numbers (decimal mark, thousands); the neutral `en` when absent. */
export function pageOne(c: Comparison, locale: ReportLocale = NEUTRAL): PageOne {
  const { primaryRow, secondaryRow } = cells(locale);
  const sentences = c.refusals.length > 0 ? c.refusals.map((r) => `Not compared: ${r.message}`) : c.findings.map((f) => f.sentence);
  return {
    sentences,
    bandLine: `Band: ${c.band.population}; retest interval ${c.band.retestInterval} (${c.band.description}).`,
    bandBasis: `Statistic: ${c.band.statistic}. Source: ${c.band.source}.`,
    bandStatement: bandStatement(c.band),
    primary: {
      header: ['Primary outcome', 'Day 1', 'Day 2', 'Change %', 'Change interval %', 'Reproduced range %', 'Call'],
      rows: c.refusals.length > 0 ? [] : c.metrics.filter((m) => isPrimary(m.id)).map(primaryRow),
    },
    secondary: {
      header: ['Secondary metric', 'Unit', 'Day 1', 'Day 2', 'Δ %', 'Reproduced range %', 'Call'],
      rows: c.refusals.length > 0 ? [] : c.metrics.filter((m) => !isPrimary(m.id)).map(secondaryRow),
    },
  };
}
