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
 * Calls: `fell` when r lies below the lower limit, `rose` above the upper limit. For a
 * secondary metric the limit uses z = 1.96 (a stable person lands beyond it in about 2.5 % of
 * pairs on each side when the intervals are calibrated); for the four primary outcomes it uses
 * z = 2.241, the one-sided 1.25 % point (Bonferroni over four outcomes), so that a stable
 * person is called lower on any primary outcome in at most about 5 % of pairs;
 * `held` when the whole change interval lies inside the band; otherwise `open` (the interval
 * straddles a band edge, or measurement is too uncertain to place the change). Report words:
 * reproduced / lower on day 2 / higher on day 2 / undetermined.
 *
 * Example: VO2 at VT1 1200 → 950 mL/min (r = −0.234, −20.8 %), s1 = s2 = 0.03, CV 6 %:
 * σ = 0.0824, m = 0.0424, lower limit exp(−2.2414 · 0.0927) − 1 = −18.8 % (primary) → fell.
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

/** One-sided 1.25 % normal quantile (5 % / 4 primary outcomes, Bonferroni): Φ⁻¹(0.9875). */
export const Z_PRIMARY = 2.2414;

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
