/**
 * Types shared by the day-2-against-day-1 comparison modules. Units live in the names;
 * percentages are percent of day 1 (or of the grand mean for a band).
 */
import type { BandKind } from '../model/settings';

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

export type Verdict = 'within' | 'decline' | 'rise' | 'not_comparable';

/** Where a band came from; the report always states it. */
export type BandOrigin = 'default' | 'lab-stated' | 'lab-derived';

/** One metric's band: the within-subject coefficient of variation and where it comes from. */
export interface BandEntry {
  /** Within-subject CV, % (the typical variation from day to day). */
  readonly cvPct: number;
  /** The citation, "common practice", or a note of how the lab derived it. */
  readonly source: string;
}

export interface BandTable {
  readonly origin: BandOrigin;
  /** One line naming the table: the default table, or the lab's file and what it holds. */
  readonly description: string;
  readonly entries: Readonly<Partial<Record<MetricId, BandEntry>>>;
}

/** The band applied to one metric, after the band kind has been chosen. */
export interface AppliedBand {
  readonly kind: BandKind;
  /** Half-width of the band, % of day 1: the CV (typical) or 1.96·√2·CV (mdc95). */
  readonly halfWidthPct: number;
  readonly cvPct: number;
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
  readonly verdict: Verdict;
  /** True when the change lies beyond the band in the metric's adverse direction. */
  readonly adverseBeyondBand: boolean;
  readonly reason: string;
}
