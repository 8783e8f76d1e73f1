/**
 * Test-retest bands: Twofold's default table and the band applied to one metric.
 *
 * Default table: within-subject coefficients of variation from Decato et al., Med Sci Sports
 * Exerc 2018;50:589–95 (45 healthy adults, cycle CPET twice: peak VO2 4.9%, VO2 at the
 * threshold 10.4%, peak O2 pulse 4.6%, peak VE 7.4%, VE/VCO2 at the threshold 4.0%, VE/VO2 at
 * the threshold 4.8%); every other metric gets "about 8%", the day-to-day reproducibility of
 * a maximal CPET in most patient groups (common practice).
 *
 * Band kinds (settings.compare.bandKind):
 * - `typical`: ± the CV, the typical day-to-day variation.
 * - `mdc95`: ± 1.96 · √2 · CV ≈ 2.77 · CV, the smallest change one person can show that lies
 *   beyond measurement error with 95% confidence (Weir, J Strength Cond Res 2005;19:231–40;
 *   Hopkins, Sports Med 2000;30:1–15). Stricter and more defensible for one person.
 * Assumption: the CV expresses error as a share of the value, so the band scales with day 1.
 */
import type { BandKind } from '../model/settings';
import type { AppliedBand, BandEntry, BandTable, MetricId } from './types';

/** 1.96 · √2: the factor from a typical error (SEM) to the MDC95 (Weir 2005). */
export const MDC95_FACTOR = 1.96 * Math.SQRT2;

const DECATO = 'Decato et al., Med Sci Sports Exerc 2018;50:589–95';
const COMMON = 'about 8%, day-to-day reproducibility of a maximal CPET in most patient groups (common practice)';

export const DEFAULT_BAND_TABLE: BandTable = {
  origin: 'default',
  description: "Twofold's default table (Decato et al. 2018 where published, otherwise about 8%, common practice)",
  entries: {
    vt1_vo2: { cvPct: 10.4, source: `${DECATO}: VO2 at the gas-exchange threshold` },
    vt1_vo2_kg: { cvPct: 10.4, source: `${DECATO}: VO2 at the gas-exchange threshold (body mass assumed unchanged between days)` },
    vt1_work: { cvPct: 8, source: COMMON },
    vt1_hr: { cvPct: 8, source: COMMON },
    vt1_time: { cvPct: 8, source: COMMON },
    vt1_ve_vco2: { cvPct: 4.0, source: `${DECATO}: VE/VCO2 at the threshold` },
    vt1_ve_vo2: { cvPct: 4.8, source: `${DECATO}: VE/VO2 at the threshold` },
    vt2_vo2: { cvPct: 8, source: COMMON },
    vt2_work: { cvPct: 8, source: COMMON },
    peak_vo2: { cvPct: 4.9, source: `${DECATO}: peak VO2` },
    peak_vo2_kg: { cvPct: 4.9, source: `${DECATO}: peak VO2 (body mass assumed unchanged between days)` },
    peak_work: { cvPct: 8, source: COMMON },
    peak_hr: { cvPct: 8, source: COMMON },
    peak_o2_pulse: { cvPct: 4.6, source: `${DECATO}: peak O2 pulse` },
    peak_ve: { cvPct: 7.4, source: `${DECATO}: peak VE` },
    peak_rer: { cvPct: 8, source: COMMON },
    ve_vco2_slope: { cvPct: 8, source: `${COMMON}; Decato's 4.0% is VE/VCO2 at the threshold, not the slope` },
    oues: { cvPct: 8, source: COMMON },
    duration: { cvPct: 8, source: COMMON },
  },
};

export function bandKindLabel(kind: BandKind): string {
  return kind === 'mdc95'
    ? 'minimal detectable change (MDC95 = 1.96 × √2 × CV ≈ 2.77 × CV; Weir 2005, Hopkins 2000)'
    : 'typical variation (± the within-subject CV)';
}

/** Half-width of the band in percent for a CV and a band kind. Example: CV 10.4%, mdc95 → 28.83%. */
export function bandHalfWidthPct(cvPct: number, kind: BandKind): number {
  return kind === 'mdc95' ? MDC95_FACTOR * cvPct : cvPct;
}

/**
 * The band for one metric: the lab's table first, falling back to the default table for a
 * metric the lab's table does not list (the fallback is stated in the source).
 */
export function bandFor(id: MetricId, kind: BandKind, table: BandTable = DEFAULT_BAND_TABLE): AppliedBand | null {
  const own: BandEntry | undefined = table.entries[id];
  if (own) return { kind, cvPct: own.cvPct, halfWidthPct: bandHalfWidthPct(own.cvPct, kind), origin: table.origin, source: own.source };
  const fallback = DEFAULT_BAND_TABLE.entries[id];
  if (!fallback) return null;
  const note = table.origin === 'default' ? fallback.source : `${fallback.source} (not in the lab's band; Twofold's default used)`;
  return { kind, cvPct: fallback.cvPct, halfWidthPct: bandHalfWidthPct(fallback.cvPct, kind), origin: 'default', source: note };
}
