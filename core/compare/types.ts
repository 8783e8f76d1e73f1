/**
 * Types shared by the day-2-against-day-1 comparison modules. Units live in the names;
 * percentages are percent of day 1 (or of the grand mean for a band).
 */

/** Which way a change counts against the subject: a lower VO2, a higher VE/VCO2 slope. */
export type AdverseDirection = 'lower' | 'higher';

export type MetricId =
  | 'vt1_vo2'
  | 'vt1_vo2_kg'
  | 'vt1_work'
  | 'vt1_hr'
  | 'vt1_time'
  | 'vt1_ve_vco2'
  | 'vt1_ve_vo2'
  | 'vt2_vo2'
  | 'vt2_work'
  | 'peak_vo2'
  | 'peak_vo2_kg'
  | 'peak_work'
  | 'peak_hr'
  | 'peak_o2_pulse'
  | 'peak_ve'
  | 'peak_rer'
  | 've_vco2_slope'
  | 'oues'
  | 'duration';

/**
 * The call on one metric's day-2 change, read from its change interval against the band
 * (core/compare/change-interval.ts). Report wording: held → "reproduced", fell → "lower on
 * day 2", rose → "higher on day 2", open → "undetermined", not_comparable → "not comparable".
 */
export type Verdict = 'held' | 'fell' | 'rose' | 'open' | 'not_comparable';

/** Where a band came from; the report always states it. */
export type BandOrigin = 'default' | 'published' | 'lab-stated' | 'lab-derived';

/** One metric's band: the within-subject coefficient of variation and where it comes from. */
export interface BandEntry {
  /** Within-subject CV, % (the typical variation from day to day). */
  readonly cvPct: number;
  /** The citation, "common practice", or a note of how the lab derived it. */
  readonly source: string;
  /** Mean day-2 change of the band's population, % (a practice effect); the band centres on it. 0 when not stated. */
  readonly meanChangePct?: number;
}

export interface BandTable {
  readonly origin: BandOrigin;
  /** One line naming the table: the default table, or the lab's file and what it holds. */
  readonly description: string;
  /** Who was retested (e.g. "sedentary or healthy control groups of two-day studies"). */
  readonly population: string;
  /** How far apart the two tests were (e.g. "24 h"). */
  readonly retestInterval: string;
  /** What the entries are (e.g. "within-subject CV on the log scale; limits 1.96 × √2 × ln(1 + CV)"). */
  readonly statistic: string;
  /** The citation(s) behind the table as a whole. */
  readonly source: string;
  readonly entries: Readonly<Partial<Record<MetricId, BandEntry>>>;
}

/** The band applied to one metric: a reproduced test's range of day-2 change from biology alone. */
export interface AppliedBand {
  readonly cvPct: number;
  /** The band's centre (the population's mean day-2 change), %. */
  readonly centrePct: number;
  /** Lower and upper edge, % change: exp(ln(1 + centre) ∓ 1.96·√2·ln(1 + CV)) − 1 (asymmetric). */
  readonly lowPct: number;
  readonly highPct: number;
  readonly origin: BandOrigin;
  readonly source: string;
}

export type WarningSeverity = 'hard' | 'soft';

export interface PairingWarning {
  readonly code: string;
  readonly severity: WarningSeverity;
  readonly message: string;
}

export interface Pairing {
  /** Hours from day 1's start to day 2's start; null when either start time is unknown. */
  readonly intervalH: number | null;
  readonly warnings: readonly PairingWarning[];
  /** True when the two tests cannot belong to one person (different subject ids). */
  readonly hardMismatch: boolean;
}

export interface MetricRow {
  readonly id: MetricId;
  readonly label: string;
  readonly unit: string;
  readonly adverse: AdverseDirection;
  /** An effort check, not an outcome (peak RER): never counted as a decline or rise of function. */
  readonly effortCheck: boolean;
  readonly day1: number | null;
  readonly day2: number | null;
  /** day 2 − day 1, in the metric's unit. */
  readonly delta: number | null;
  /** 100 · (day 2 − day 1) / day 1. */
  readonly deltaPct: number | null;
  readonly band: AppliedBand | null;
  /** The change interval and the limits the call was read from; null when not comparable. */
  readonly interval: ChangeInterval | null;
  readonly verdict: Verdict;
  /** True when the change lies beyond the band in the metric's adverse direction. */
  readonly adverseBeyondBand: boolean;
  readonly reason: string;
}

/**
 * One metric's change on the log-ratio scale, with both sources of uncertainty.
 * r = ln(day 2 / day 1); m = √(s1² + s2²), s = each day's measurement SD of ln(value);
 * σ = √2 · ln(1 + CV), the biological SD of a stable person's log change.
 */
export interface ChangeInterval {
  readonly changePct: number;
  /** 95 % measurement interval of the change, % (r ± 1.96·m). */
  readonly lowPct: number;
  readonly highPct: number;
  /** Each day's measurement SD of ln(value); null when the analysis gives no interval. */
  readonly day1Sd: number | null;
  readonly day2Sd: number | null;
  /** Limits beyond which the change is called lower/higher: centre ∓ 1.96·√(σ² + m²), %. */
  readonly limitLowPct: number;
  readonly limitHighPct: number;
  /** Where the measurement SD came from, in words. */
  readonly measurement: string;
}
