/**
 * One typed, versioned settings object. Every result carries the settings that made it.
 * Each leaf's source is in `SETTING_SOURCES` below: a published source, "common practice"
 * (a rule of thumb with no single source), or "(memory)" where the value was recalled and
 * not looked up.
 */

export const SETTINGS_VERSION = 1 as const;

export type AveragingSpec =
  | { readonly kind: 'rolling-time'; readonly windowS: number }
  | { readonly kind: 'time-bins'; readonly binS: number }
  | { readonly kind: 'rolling-breaths'; readonly breaths: number };

export type OutlierSpec =
  | { readonly kind: 'none' }
  /** Remove a breath whose value lies beyond `limitSd` local standard deviations of the
   *  surrounding `windowBreaths` breaths (the breath itself excluded). */
  | { readonly kind: 'local-sd'; readonly windowBreaths: number; readonly limitSd: number };

/** User-set phase boundaries, s from the start of the recording; null = detect from the load. */
export interface PhaseOverrides {
  readonly incrementalStartS: number | null;
  readonly incrementalEndS: number | null;
}

export type HrMaxFormula = 'tanaka' | 'fox';
/**
 * How peak HR counts as an effort criterion: at least `hrPctMin` % of age-predicted HRmax,
 * within `hrWithinBpm` of it, either of the two, or not at all ('off', e.g. under
 * beta-blockade, when the heart rate cannot reach its predicted maximum).
 */
export type HrCriterion = 'percent' | 'within-bpm' | 'either' | 'off';
/**
 * How the criteria combine: 'rer-plus-one' (peak RER and at least one other; common
 * practice) or 'rer-alone' (peak RER by itself, the single criterion Balady et al. 2010 rely on).
 */
export type EffortRule = 'rer-plus-one' | 'rer-alone';
export type BandKind = 'typical' | 'mdc95';

export interface Settings {
  readonly version: typeof SETTINGS_VERSION;
  readonly import: {
    readonly implausible: {
      readonly vo2MaxMlMin: number;
      readonly hrMinBpm: number;
      readonly hrMaxBpm: number;
      readonly rerMin: number;
      readonly rerMax: number;
    };
    /** Absolute RER difference between a file's RER column and VCO2/VO2 that raises a warning. */
    readonly rerMismatch: number;
  };
  readonly clean: {
    readonly outliers: OutlierSpec;
    readonly averaging: AveragingSpec;
    readonly phases: PhaseOverrides;
  };
  readonly thresholds: {
    /** Fewest averaged points either side of a breakpoint. */
    readonly minPointsPerSegment: number;
    /** Methods disagree when their VO2 estimates span more than this share of the consensus. */
    readonly disagreementPct: number;
    readonly bootstrap: {
      /** The most replicates drawn. */
      readonly replicates: number;
      readonly seed: number;
      /**
       * Early stop (core/thresholds/uncertainty.ts): every `checkEvery` replicates the interval
       * is formed again, and drawing stops once both of its ends moved by less than
       * `stableWithinPct` % of its width since the previous check. Absent or 0: all replicates
       * (case files written before the rule existed recompute exactly as they were made).
       */
      readonly checkEvery?: number;
      readonly stableWithinPct?: number;
    };
  };
  readonly peaks: {
    /** Peak values are the highest rolling mean over this window. */
    readonly windowS: number;
  };
  readonly effort: {
    readonly rerMin: number;
    readonly plateauMlMin: number;
    readonly plateauMlKgMin: number;
    readonly hrMaxFormula: HrMaxFormula;
    readonly hrPctMin: number;
    readonly rpeMin: number;
    readonly lactateMinMmolL: number;
    // The three below are optional so that case files written before them load with their
    // anchor unchanged; absent means the default (EFFORT_OPTION_DEFAULTS), the old behaviour.
    readonly hrCriterion?: HrCriterion;
    readonly hrWithinBpm?: number;
    readonly rule?: EffortRule;
  };
  readonly compare: {
    readonly intervalHMin: number;
    readonly intervalHMax: number;
    /** Workload step for the matched-workload table, W. */
    readonly workloadStepW: number;
    readonly bandKind: BandKind;
  };
  readonly report: {
    readonly paper: 'a4' | 'letter';
  };
}

export const EFFORT_OPTION_DEFAULTS = { hrCriterion: 'percent', hrWithinBpm: 10, rule: 'rer-plus-one' } as const satisfies {
  hrCriterion: HrCriterion;
  hrWithinBpm: number;
  rule: EffortRule;
};

export const DEFAULT_SETTINGS: Settings = {
  version: SETTINGS_VERSION,
  import: {
    implausible: { vo2MaxMlMin: 8000, hrMinBpm: 25, hrMaxBpm: 250, rerMin: 0.5, rerMax: 2.0 },
    rerMismatch: 0.05,
  },
  clean: {
    outliers: { kind: 'local-sd', windowBreaths: 9, limitSd: 4 },
    averaging: { kind: 'rolling-time', windowS: 15 },
    phases: { incrementalStartS: null, incrementalEndS: null },
  },
  thresholds: {
    minPointsPerSegment: 8,
    disagreementPct: 10,
    bootstrap: { replicates: 200, seed: 20260101, checkEvery: 50, stableWithinPct: 5 },
  },
  peaks: { windowS: 30 },
  effort: {
    rerMin: 1.1,
    plateauMlMin: 150,
    plateauMlKgMin: 2.1,
    hrMaxFormula: 'tanaka',
    hrPctMin: 85,
    rpeMin: 17,
    lactateMinMmolL: 8,
    hrCriterion: 'percent',
    hrWithinBpm: 10,
    rule: 'rer-plus-one',
  },
  compare: { intervalHMin: 18, intervalHMax: 72, workloadStepW: 10, bandKind: 'mdc95' },
  report: { paper: 'a4' },
};

/** Where each default comes from, by dotted path. Shown in the report's methods section. */
export const SETTING_SOURCES: Readonly<Record<string, string>> = {
  'import.implausible.vo2MaxMlMin': 'common practice (plausibility limit, no single source)',
  'import.implausible.hrMinBpm': 'common practice (plausibility limit, no single source)',
  'import.implausible.hrMaxBpm': 'common practice (plausibility limit, no single source)',
  'import.implausible.rerMin': 'common practice (plausibility limit, no single source)',
  'import.implausible.rerMax': 'common practice (plausibility limit, no single source)',
  'import.rerMismatch': 'common practice (no single source)',
  'clean.outliers': 'local-SD breath rejection after Lamarra et al., J Appl Physiol 1987;62:2003–12; window and limit common practice',
  'clean.averaging': 'time-based rolling mean; 15 s window is common practice (Robergs et al., Sports Med 2010;40:95–111 discuss 10–30 s windows)',
  'clean.phases': 'detected from the load; user override',
  'thresholds.minPointsPerSegment': 'common practice (no single source)',
  'thresholds.disagreementPct': 'common practice (no single source)',
  'thresholds.bootstrap': 'residual bootstrap of the breakpoint fit, seeded for reproducibility; early stop when the interval is stable is our choice',
  'peaks.windowS': 'common practice (30 s rolling mean)',
  'effort.rerMin': 'Balady et al., Circulation 2010;122:191–225 (1.10); ATS/ACCP, Am J Respir Crit Care Med 2003;167:211–77; some labs use 1.15 (Robergs et al., Sports Med 2010;40:95–111 surveyed both)',
  'effort.plateauMlMin': 'Taylor et al., J Appl Physiol 1955;8:73–80; Howley et al., Med Sci Sports Exerc 1995;27:1292–301',
  'effort.plateauMlKgMin': 'Taylor et al. 1955; Howley et al. 1995',
  'effort.hrMaxFormula': 'Tanaka et al., J Am Coll Cardiol 2001;37:153–6 (208 − 0.7 × age); alternative Fox 1971 (220 − age)',
  'effort.hrPctMin': 'common practice; Howley et al. 1995',
  'effort.rpeMin': 'Borg, Med Sci Sports Exerc 1982;14:377–81; threshold 17 common practice',
  'effort.lactateMinMmolL': 'common practice (no single source)',
  'effort.hrCriterion': 'common practice (85 % of predicted, or within 10 bpm; Howley et al. 1995); off under beta-blockade, which blunts the HR response (common practice)',
  'effort.hrWithinBpm': 'common practice; Howley et al. 1995',
  'effort.rule': "RER plus one other criterion: common practice; RER alone: Balady et al., Circulation 2010 call peak RER the best non-invasive indicator of effort (memory)",
  'compare.intervalHMin': 'common practice for two-day testing (about 24 h apart); 18–72 h stated on page 1 when outside',
  'compare.intervalHMax': 'common practice for two-day testing (about 24 h apart); 18–72 h stated on page 1 when outside',
  'compare.workloadStepW': 'common practice',
  'compare.bandKind': 'kept so older case files validate; no decision rule (calls read the change interval: core/compare/change-interval.ts; Hopkins, Sports Med 2000;30:1–15; Weir, J Strength Cond Res 2005)',
  'report.paper': 'user choice',
};
