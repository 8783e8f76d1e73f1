/**
 * The contract every threshold detector meets. A detector is a pure function of the
 * processed series and a search window; it returns its estimate with its evidence, or
 * says why it found none.
 */
import type { MethodOutcome, ProcessedSeries, ThresholdId } from '../model/analysis';
import type { Settings } from '../model/settings';

export interface DetectorInput {
  readonly series: ProcessedSeries;
  /** Search window, s from the start of the recording. */
  readonly fromS: number;
  readonly toS: number;
  readonly settings: Settings;
}

export type Detector = (input: DetectorInput) => MethodOutcome;

export interface DetectorEntry {
  readonly threshold: ThresholdId;
  readonly method: string;
  readonly detect: Detector;
}

/** One threshold as the detectors and their consensus found it, before values are read off. */
export interface ThresholdEstimate {
  readonly methods: readonly MethodOutcome[];
  /** Consensus point; null when no method succeeded. */
  readonly consensus: { readonly timeS: number; readonly vo2MlMin: number } | null;
  readonly ci95Vo2MlMin: readonly [number, number] | null;
  readonly ci95TimeS: readonly [number, number] | null;
  /** The SDs the interval was built from (uncertainty.ts); absent for the preliminary VT2. */
  readonly ciParts?: { readonly bootSdMlMin: number; readonly methodSdMlMin: number; readonly floorSdMlMin: number } | null;
  readonly spreadVo2MlMin: number | null;
  readonly methodsDisagree: boolean;
  readonly reason: string | null;
}
