/**
 * The call on one day-2 change, on the log-ratio scale, with both sources of uncertainty:
 * biology (the band: a stable person's change, centre c, SD σ = √2 · ln(1 + CV); Hopkins,
 * Sports Med 2000;30:1–15) and measurement (each day's SD s of ln(value), measurement.ts).
 *
 *   r = ln(day 2 / day 1), m = √(s1² + s2²)
 *   change interval   r ± 1.96 · m                       (how well this person's change is known)
 *   band              c ± 1.96 · σ                       (a reproduced test, from biology alone)
 *   limits            c ± z · √(σ² + m²)                 (biology and measurement together)
 *
 * Calls: `fell` when r lies below the lower limit, `rose` above the upper limit; `held` when the
 * whole change interval lies inside the band; otherwise `open` (the interval straddles a band
 * edge, or measurement is too uncertain to place the change). Report words: reproduced / lower
 * on day 2 / higher on day 2 / undetermined.
 *
 * z, one rule for all facets of one finding (findings.ts): every value read at VT1 (VO2, VO2/kg,
 * workload, HR, time, ventilatory equivalents) uses the VT1 finding's z, every peak value the
 * peak finding's z, so a secondary facet is never "lower" where the primary one beside it,
 * with the same change and the same interval, is "undetermined". The z of a finding
 * (`Z_FINDING`) keeps a stable person's chance of a false "lower on day 2" on any of the four
 * primary outcomes at or under 5 %: 2.5 % per finding (Bonferroni over the two findings, which
 * holds whatever their correlation), and within a finding the two primary facets (VO2 and
 * workload, read at the same breakpoint or the same end of test) are taken as bivariate normal
 * with correlation ρ = 0.8, for which P(either below −z) = 2.5 % at z = 2.152 (Bonferroni
 * within the finding would need 2.241 and ignores that the facets move together). On the
 * development null pairs of both generator families the two facets' standardized changes
 * correlated by 0.94–0.97 (between the two findings 0.10–0.14; docs/validation.md); ρ = 0.8 is
 * rounded down, so the rule stays at or under 2.5 % per finding
 * for any correlation from 0.8 up (a lower ρ than assumed would raise it, at ρ = 0 to 3.1 %).
 * Values that belong to no finding (VT2, VE/VCO2 slope, OUES) use z = 1.96: shown, never counted.
 *
 * Example: VO2 at VT1 1200 → 950 mL/min (r = −0.234, −20.8 %), s1 = s2 = 0.03, CV 6 %:
 * σ = 0.0824, m = 0.0424, lower limit exp(−2.152 · 0.0927) − 1 = −18.1 % (a VT1 facet) → fell.
 */
import { Z95 } from './bands';
import type { AppliedBand, ChangeInterval, Verdict } from './types';

/**
 * Percent from a log ratio, rounded to 1e-9 %: exp and log may differ in the last bit between
 * JavaScript engines (the workbench's and the CLI's), and the case file records these numbers.
 */
export function tidyPct(logValue: number): number {
  return Math.round(1e9 * 100 * (Math.exp(logValue) - 1)) / 1e9;
}

function tidy(value: number): number {
  return Math.round(1e12 * value) / 1e12;
}

const pct = tidyPct;

export interface ChangeCall {
  readonly verdict: Exclude<Verdict, 'not_comparable'>;
  readonly interval: ChangeInterval;
}

/**
 * A finding's z: 1 − Φ₂(z, z; ρ = 0.8) = 2.5 % for a standard bivariate normal (the chance that
 * either of two facets correlated by 0.8 lands below −z), z = 2.152 (computed numerically;
 * tests/core/compare/change-interval.test.ts recomputes it). For comparison: one outcome at
 * 2.5 %, 1.960; Bonferroni over four outcomes, 2.241.
 */
export const Z_FINDING = 2.152;

/**
 * What a change interval of no width means, so that it is not printed as "−18.8 to −18.8":
 * 'exact' when neither day's value carries a measurement uncertainty (a load set by the
 * ergometer, a time on the clock), 'not known' when neither day's analysis gives one (the band
 * alone applies); null when the interval has a width.
 */
export function zeroWidth(iv: ChangeInterval): 'exact' | 'not known' | null {
  if (iv.lowPct !== iv.highPct) return null;
  return iv.day1Sd === 0 && iv.day2Sd === 0 ? 'exact' : 'not known';
}

export function changeCall(day1: number, day2: number, day1Sd: number | null, day2Sd: number | null, band: AppliedBand, measurement: string, zCall: number = Z95): ChangeCall | null {
  if (!(day1 > 0) || !(day2 > 0)) return null;
  const r = Math.log(day2 / day1);
  const m = Math.sqrt((day1Sd ?? 0) ** 2 + (day2Sd ?? 0) ** 2);
  const c = Math.log(1 + band.centrePct / 100);
  const sigma = Math.SQRT2 * Math.log(1 + band.cvPct / 100);
  const reach = zCall * Math.sqrt(sigma * sigma + m * m);
  const bandLow = Math.log(1 + band.lowPct / 100);
  const bandHigh = Math.log(1 + band.highPct / 100);
  const verdict: ChangeCall['verdict'] =
    r < c - reach ? 'fell' : r > c + reach ? 'rose' : r - Z95 * m >= bandLow && r + Z95 * m <= bandHigh ? 'held' : 'open';
  return {
    verdict,
    interval: {
      changePct: pct(r),
      lowPct: pct(r - Z95 * m),
      highPct: pct(r + Z95 * m),
      day1Sd: day1Sd === null ? null : tidy(day1Sd),
      day2Sd: day2Sd === null ? null : tidy(day2Sd),
      limitLowPct: pct(c - reach),
      limitHighPct: pct(c + reach),
      measurement,
    },
  };
}

/** Neutral words for a call, as the report, CLI and workbench print it. */
export function verdictWords(verdict: Verdict): string {
  switch (verdict) {
    case 'held':
      return 'reproduced';
    case 'fell':
      return 'lower on day 2';
    case 'rose':
      return 'higher on day 2';
    case 'open':
      return 'undetermined';
    default:
      return 'not comparable';
  }
}
