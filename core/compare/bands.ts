/**
 * Test-retest bands: the published presets and the band applied to one metric.
 *
 * A band says how much a stable person's value moves from one test to the next from biology
 * alone. Every table states its population, its retest interval, its statistic and its
 * source (the CLI, the workbench and the report print them). Entries are within-subject CVs on
 * the log scale (Hopkins, Sports Med 2000;30:1–15), optionally with the population's mean
 * day-2 change. The band for one metric is the 95 % range of a stable person's change:
 *
 *   centre c = ln(1 + mean change), σ = √2 · ln(1 + CV)   (SD of a log difference of two tests)
 *   edges    = exp(c ∓ 1.96 · σ) − 1                      (MDC95 on the log scale; Weir 2005)
 *
 * Example: CV 10.4 %, no mean change → −24.0 % / +31.6 % (not ±28.8 %).
 *
 * Presets:
 * - `controls-24h` (the default): 24-h retests of sedentary or healthy control groups in
 *   two-day studies. Verified against the published abstracts: controls reproduced day 1 —
 *   no significant change of VO2 or power output at the gas-exchange threshold (Lien et al.,
 *   Physiol Rep 2019; 15 healthy women, 24 h), sedentary controls reproduced CPET-1 measures
 *   (Keller et al., J Transl Med 2024; 71 sedentary controls, 24 h), controls' workload at VT
 *   rose (Hodges et al., Clin Physiol Funct Imaging 2018; 17 healthy controls, 24 h), and a fall
 *   of workload at VT of 6.3–9.8 % separated patients from controls (Nelson et al., J Transl
 *   Med 2019; 10 controls). The abstracts give no within-subject CV: the CVs below are
 *   Twofold's working values (memory), chosen below Decato's 30-day figures because a 24-h
 *   retest and a separately stated threshold interval leave less for biology. No mean
 *   day-2 change is stated (0 %), since the abstracts report none as significant.
 * - `healthy-30d`: Decato et al., Med Sci Sports Exerc 2018;50:589–95, 45 healthy adults
 *   retested within 30 days (CVs verified against the abstract).
 * - the lab's own band (`twofold band`, origin lab-derived) and a band the lab states
 *   (origin lab-stated) are read from a band file (band-file.ts).
 * A metric a table does not list falls back to Decato's value where published, else about 8 %
 * (day-to-day reproducibility of a maximal CPET in most patient groups, common practice).
 */
import { fail, locatedError, ok, type Result } from '../model/errors';
import type { AppliedBand, BandEntry, BandTable, MetricId } from './types';

/** 1.96 · √2: the factor from a typical error (SEM) to the MDC95 (Weir, J Strength Cond Res 2005;19:231–40). */
export const MDC95_FACTOR = 1.96 * Math.SQRT2;
export const Z95 = 1.96;

const DECATO = 'Decato et al., Med Sci Sports Exerc 2018';
const COMMON = 'about 8 %, day-to-day reproducibility of a maximal CPET in most patient groups (common practice)';
const WORKING = "Twofold's 24-h working value (memory; no within-subject CV in the verified abstracts)";

const DECATO_ENTRIES: Readonly<Partial<Record<MetricId, BandEntry>>> = {
  vt1_vo2: { cvPct: 10.4, source: `${DECATO}: VO2 at the lactate (gas-exchange) threshold` },
  vt1_vo2_kg: { cvPct: 10.4, source: `${DECATO}: VO2 at the threshold (body mass assumed unchanged)` },
  vt1_ve_vco2: { cvPct: 4.0, source: `${DECATO}: VE/VCO2 at the threshold` },
  vt1_ve_vo2: { cvPct: 4.8, source: `${DECATO}: VE/VO2 at the threshold` },
  peak_vo2: { cvPct: 4.9, source: `${DECATO}: peak VO2` },
  peak_vo2_kg: { cvPct: 4.9, source: `${DECATO}: peak VO2 (body mass assumed unchanged)` },
  peak_o2_pulse: { cvPct: 4.6, source: `${DECATO}: peak O2 pulse` },
  peak_ve: { cvPct: 7.4, source: `${DECATO}: peak VE` },
};

export const HEALTHY_30D_BAND: BandTable = {
  origin: 'published',
  description: 'Decato et al. 2018: healthy adults retested within 30 days',
  population: '45 healthy adults (not sedentary controls, not patients)',
  retestInterval: 'within 30 days (not 24 h)',
  statistic: 'within-subject coefficient of variation; limits 1.96 × √2 × ln(1 + CV) on the log scale',
  source: 'Decato et al., Med Sci Sports Exerc 2018;50:589–95 (CVs verified against the abstract)',
  entries: DECATO_ENTRIES,
};

export const CONTROLS_24H_BAND: BandTable = {
  origin: 'default',
  description: 'Twofold default: 24-h retests of sedentary or healthy control groups in two-day studies',
  population: 'sedentary or healthy control groups of two-day CPET studies',
  retestInterval: '24 h',
  statistic: 'within-subject coefficient of variation; limits 1.96 × √2 × ln(1 + CV) on the log scale; no mean day-2 change stated',
  source:
    'Lien et al., Physiol Rep 2019; Keller et al., J Transl Med 2024; Hodges et al., Clin Physiol Funct Imaging 2018; Nelson et al., J Transl Med 2019 (controls reproduced; verified against the abstracts). CVs: working values (memory); peak VO2 and secondary metrics from Decato et al. 2018',
  entries: {
    vt1_vo2: { cvPct: 6, source: `${WORKING}; controls' VO2 at GET unchanged at 24 h (Lien et al. 2019)` },
    vt1_work: { cvPct: 8, source: `${WORKING}; controls' power at GET unchanged at 24 h (Lien et al. 2019)` },
    vt1_vo2_kg: { cvPct: 6, source: `${WORKING} (body mass assumed unchanged)` },
    peak_vo2: { cvPct: 4.9, source: `${DECATO}: peak VO2 (30-day value, used for 24 h)` },
    peak_vo2_kg: { cvPct: 4.9, source: `${DECATO}: peak VO2 (30-day value, used for 24 h)` },
    peak_work: { cvPct: 6, source: WORKING },
  },
};

/** The default band table (24-h controls). */
export const DEFAULT_BAND_TABLE = CONTROLS_24H_BAND;

export type BandPresetId = 'controls-24h' | 'healthy-30d';
export const BAND_PRESETS: Readonly<Record<BandPresetId, BandTable>> = { 'controls-24h': CONTROLS_24H_BAND, 'healthy-30d': HEALTHY_30D_BAND };

export function bandPreset(name: string): Result<BandTable> {
  if (name === 'controls-24h' || name === 'healthy-30d') return ok(BAND_PRESETS[name]);
  return fail(locatedError('band-preset', '--band', null, null, `Unknown band preset '${name}'. Presets: ${Object.keys(BAND_PRESETS).join(', ')}; or give a band file (twofold-band JSON).`));
}

/** One line a reader can check: population, retest interval, statistic and source. */
export function bandStatement(table: BandTable): string {
  return `${table.description}. Population: ${table.population}. Retest interval: ${table.retestInterval}. Statistic: ${table.statistic}. Source: ${table.source}.`;
}

/** Percent from a log value, rounded to 1e-9 % so every JavaScript engine records the same number. */
function pct(logValue: number): number {
  return Math.round(1e9 * 100 * (Math.exp(logValue) - 1)) / 1e9;
}

/** The band of one CV and mean change. Example: CV 10.4 %, mean 0 → −24.0 % / +31.6 %. */
export function bandEdges(cvPct: number, meanChangePct = 0): { centrePct: number; lowPct: number; highPct: number; sigmaLog: number } {
  const c = Math.log(1 + meanChangePct / 100);
  const sigmaLog = Math.SQRT2 * Math.log(1 + cvPct / 100);
  return { centrePct: meanChangePct, lowPct: pct(c - Z95 * sigmaLog), highPct: pct(c + Z95 * sigmaLog), sigmaLog };
}

function applied(entry: BandEntry, origin: AppliedBand['origin'], source: string): AppliedBand {
  const e = bandEdges(entry.cvPct, entry.meanChangePct ?? 0);
  return { cvPct: entry.cvPct, centrePct: e.centrePct, lowPct: e.lowPct, highPct: e.highPct, origin, source };
}

/**
 * The band for one metric: the table's entry first; else Decato's published value; else
 * about 8 % (common practice). A fallback says so in its source.
 */
export function bandFor(id: MetricId, table: BandTable = DEFAULT_BAND_TABLE): AppliedBand {
  const own = table.entries[id];
  if (own) return applied(own, table.origin, own.source);
  const decato = DECATO_ENTRIES[id];
  if (decato) return applied(decato, 'published', `${decato.source} (not in the chosen band; published value used)`);
  return applied({ cvPct: 8, source: COMMON }, 'default', `${COMMON} (not in the chosen band)`);
}
