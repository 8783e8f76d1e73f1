/**
 * The result of analysing one test: the contract between `core/analyze` and everything
 * downstream (compare, case, report, the shells). Units live in the names.
 */
import type { Settings } from './settings';
import type { TestMetadata } from './breath-table';

/** The averaged, cleaned series every detector and chart works from (columnar, equal length). */
export interface ProcessedSeries {
  readonly timeS: readonly number[];
  readonly vo2MlMin: readonly number[];
  readonly vco2MlMin: readonly number[];
  readonly veLMin: readonly number[];
  readonly hrBpm: readonly (number | null)[];
  readonly workW: readonly (number | null)[];
  readonly peto2Mmhg: readonly (number | null)[];
  readonly petco2Mmhg: readonly (number | null)[];
}

export type PhaseName = 'rest' | 'warmup' | 'incremental' | 'recovery';

export interface Phase {
  readonly name: PhaseName;
  readonly startS: number;
  readonly endS: number;
}

export interface Phases {
  readonly phases: readonly Phase[];
  /** Start and end of the incremental phase, s. */
  readonly incrementalStartS: number;
  readonly incrementalEndS: number;
  /** Ramp rate over the incremental phase (W/min), null without a load signal. */
  readonly rampWPerMin: number | null;
  readonly source: 'detected' | 'user';
}

export interface RemovedBreath {
  readonly sourceLine: number;
  readonly timeS: number;
  readonly variable: string;
  readonly value: number;
  readonly reason: string;
}

/** One straight line of a piecewise fit, drawn from x0 to x1. */
export interface LineSegment {
  readonly x0: number;
  readonly x1: number;
  readonly slope: number;
  readonly intercept: number;
}

/** What a detector computed, so a chart and the report can show exactly that. */
export interface MethodEvidence {
  /** Axis names, as series keys or derived quantities such as `ve/vo2`, `excess-co2`. */
  readonly xName: string;
  readonly yName: string;
  /** The x-range searched. */
  readonly window: readonly [number, number];
  readonly segments: readonly LineSegment[];
  readonly residualSumSquares: number;
  readonly points: number;
}

export type ThresholdId = 'vt1' | 'vt2';

export type MethodOutcome =
  | {
      readonly method: string;
      readonly label: string;
      readonly source: string;
      readonly found: true;
      readonly timeS: number;
      readonly vo2MlMin: number;
      readonly evidence: MethodEvidence;
    }
  | {
      readonly method: string;
      readonly label: string;
      readonly source: string;
      readonly found: false;
      readonly reason: string;
    };

/** Every value read off the processed series at one instant (a threshold). */
export interface ValuesAt {
  readonly timeS: number;
  readonly vo2MlMin: number;
  readonly vo2MlKgMin: number | null;
  readonly vco2MlMin: number;
  readonly workW: number | null;
  readonly hrBpm: number | null;
  readonly veLMin: number;
  readonly rer: number;
  readonly pctPeakVo2: number | null;
  readonly pctPredictedPeakVo2: number | null;
}

export interface ThresholdResult {
  readonly id: ThresholdId;
  readonly methods: readonly MethodOutcome[];
  /** Values at the consensus point, null when no method found the threshold. */
  readonly at: ValuesAt | null;
  readonly ci95Vo2MlMin: readonly [number, number] | null;
  readonly ci95TimeS: readonly [number, number] | null;
  /**
   * How to name the interval: "95% interval", or the coverage measured on held-out generated
   * tests where that was outside 93–97 % (core/thresholds/interval-label.ts). Absent without an interval.
   */
  readonly ciLabel?: string;
  /** Range of the methods' VO2 estimates (max − min), mL/min. */
  readonly spreadVo2MlMin: number | null;
  readonly methodsDisagree: boolean;
  /** Why there is no threshold, when `at` is null. */
  readonly reason: string | null;
}

export interface PeakValues {
  readonly vo2MlMin: number;
  readonly vo2MlKgMin: number | null;
  readonly vco2MlMin: number;
  readonly veLMin: number;
  readonly rer: number;
  readonly hrBpm: number | null;
  readonly o2PulseMlBeat: number | null;
  readonly workW: number | null;
  readonly mets: number | null;
  /** Duration of the incremental phase, s. */
  readonly exerciseDurationS: number;
}

export type WeberClass = 'A' | 'B' | 'C' | 'D';

export interface DerivedMeasures {
  readonly veVco2Slope: number | null;
  readonly oues: number | null;
  readonly dVo2dWrMlMinW: number | null;
  readonly breathingReserveLMin: number | null;
  readonly breathingReservePct: number | null;
  readonly hrReserveBpm: number | null;
  readonly weberClass: WeberClass | null;
}

export interface PredictedValues {
  readonly hrMaxBpm: number | null;
  readonly friendVo2MlKgMin: number | null;
  readonly hansenVo2MlMin: number | null;
  readonly pctPredictedFriend: number | null;
  readonly pctPredictedHansen: number | null;
}

export type EffortVerdict = 'maximal' | 'submaximal' | 'indeterminate';

export interface EffortCriterion {
  readonly id: 'peak_rer' | 'vo2_plateau' | 'peak_hr' | 'peak_rpe' | 'lactate';
  readonly label: string;
  /** null when the criterion could not be assessed (no data). */
  readonly met: boolean | null;
  readonly value: number | null;
  readonly threshold: number;
  readonly unit: string;
  readonly source: string;
}

export interface EffortAssessment {
  readonly verdict: EffortVerdict;
  readonly criteria: readonly EffortCriterion[];
  readonly reasons: readonly string[];
}

/** Inputs that are not in the breath file, given by the lab. */
export interface ClinicalInputs {
  readonly peakRpe: number | null;
  readonly lactateMmolL: number | null;
  readonly fev1L: number | null;
  readonly mvvLMin: number | null;
  readonly restingHrBpm: number | null;
}

export interface Provenance {
  readonly software: string;
  readonly softwareVersion: string;
  readonly settings: Settings;
}

export interface TestAnalysis {
  readonly sourceName: string;
  readonly metadata: TestMetadata;
  readonly clinical: ClinicalInputs;
  readonly series: ProcessedSeries;
  readonly phases: Phases;
  readonly removedBreaths: readonly RemovedBreath[];
  readonly vt1: ThresholdResult;
  readonly vt2: ThresholdResult;
  readonly peak: PeakValues;
  readonly derived: DerivedMeasures;
  readonly predicted: PredictedValues;
  readonly effort: EffortAssessment;
  readonly warnings: readonly string[];
  readonly provenance: Provenance;
}
