/**
 * Parameters of the test-data model (see generate-test.ts for the model itself) and their
 * defaults. Every default names where it comes from: a published source, "common practice",
 * or "(memory)" where the value was recalled and not looked up.
 */
import type { Sex } from '../../core/model/breath-table';

export interface SubjectParams {
  readonly subjectId: string;
  readonly ageY: number;
  readonly sex: Sex;
  readonly heightCm: number;
  readonly weightKg: number;
}

/** Cycle ergometer: rest, warm-up at a constant load, a linear ramp, recovery at a constant load. */
export interface CycleRampProtocol {
  readonly kind: 'cycle-ramp';
  readonly restS: number;
  readonly warmupS: number;
  readonly warmupW: number;
  readonly rampWPerMin: number;
  readonly recoveryS: number;
  readonly recoveryW: number;
}

/** Cycle ergometer with load steps: the first step is warmupW + stepW, one step every stepS. */
export interface CycleStepProtocol {
  readonly kind: 'cycle-steps';
  readonly restS: number;
  readonly warmupS: number;
  readonly warmupW: number;
  readonly stepW: number;
  readonly stepS: number;
  readonly recoveryS: number;
  readonly recoveryW: number;
}

/** Treadmill walking: speed and grade rise together in steps every stepS; no work signal. */
export interface TreadmillStepProtocol {
  readonly kind: 'treadmill-steps';
  readonly restS: number;
  readonly warmupS: number;
  readonly warmupSpeedKmh: number;
  readonly warmupGradePct: number;
  readonly startSpeedKmh: number;
  readonly startGradePct: number;
  readonly speedStepKmh: number;
  readonly gradeStepPct: number;
  readonly maxSpeedKmh: number;
  readonly stepS: number;
  readonly recoveryS: number;
  readonly recoverySpeedKmh: number;
  readonly recoveryGradePct: number;
}

export type ProtocolParams = CycleRampProtocol | CycleStepProtocol | TreadmillStepProtocol;

/** Breath-to-breath noise: AR(1) per variable (Lamarra et al., J Appl Physiol 1987). */
export interface NoiseParams {
  /** AR(1) coefficient shared by the gas-exchange variables (breath-to-breath correlation). */
  readonly ar1: number;
  /** SD of the breath-size factor shared by VE, VT, VO2 and VCO2 (relative). */
  readonly breathSizeSd: number;
  /** Independent noise of VO2 and VCO2: SD = √(abs² + (rel × value)²). */
  readonly gasAbsSdMlMin: number;
  readonly gasRelSd: number;
  /** Independent relative noise of VE. */
  readonly veRelSd: number;
  /** Relative SD of the breath duration (sets breath timing and breathing rate). */
  readonly breathDurationSd: number;
  readonly hrSdBpm: number;
  readonly hrAr1: number;
  readonly peto2SdMmhg: number;
  readonly petco2SdMmhg: number;
  readonly endTidalAr1: number;
}

export interface RpeParams {
  /** The Borg 6–20 rating at the end of exercise. */
  readonly peakBorg: number;
  /** A rating every intervalS s of the incremental phase, and one at its end. */
  readonly intervalS: number;
}

export interface TestParams {
  /** Name of the generated test (becomes the table's sourceName). */
  readonly name: string;
  readonly subject: SubjectParams;
  readonly protocol: ProtocolParams;
  /** Protocol label written to the metadata, e.g. "cycle ramp 15 W/min". */
  readonly protocolLabel: string;
  /** ISO 8601 start of the recording (given, never read from a clock). */
  readonly testStart: string;
  readonly barometricMmhg: number;
  readonly fio2: number;

  readonly vo2RestMlKgMin: number;
  /** O2 cost of unloaded pedalling above rest, mL/kg/min (cycle only). */
  readonly unloadedCostMlKgMin: number;
  /** Steady-state ΔVO2/ΔWR on the cycle, mL/min/W. */
  readonly cycleGainMlMinW: number;
  /** Time constant of the first-order VO2 response, s. */
  readonly vo2TauS: number;
  /** VCO2 falls more slowly than VO2 in recovery (CO2 stores): its time constant is this multiple of vo2TauS. */
  readonly vco2RecoveryTauFactor: number;
  /** The highest VO2 the subject can reach, mL/min. */
  readonly vo2PeakMlMin: number;
  /** Seconds the subject keeps going on a VO2 plateau after the demand reaches vo2PeakMlMin; 0 = no plateau. */
  readonly plateauS: number;

  readonly vt1Vo2MlMin: number;
  readonly vt2Vo2MlMin: number;
  readonly rerRest: number;
  readonly vco2SlopeBelowVt1: number;
  readonly vco2SlopeAboveVt1: number;

  readonly veInterceptLMin: number;
  readonly veSlopeBelowVt2: number;
  readonly veSlopeAboveVt2: number;
  readonly deadSpaceFractionRest: number;
  readonly deadSpaceFractionPeak: number;
  readonly petco2OffsetMmhg: number;

  readonly hrRestBpm: number;
  /** Peak HR as a fraction of 208 − 0.7 × age (Tanaka 2001). */
  readonly hrPeakFractionOfPredicted: number;

  readonly rrRestPerMin: number;
  readonly vtMaxL: number;
  readonly vtScaleLMin: number;

  readonly noise: NoiseParams;
  /** Number of isolated outlier breaths (coughs, swallows, sighs) to insert; 0 = none. */
  readonly outlierBreaths: number;
  readonly rpe: RpeParams | null;
  /** Further metadata lines written with the test (e.g. the lab's name). */
  readonly extraMetadata: Readonly<Record<string, string>>;
}

/** Defaults of the noise, with their sources. */
export const DEFAULT_NOISE: NoiseParams = {
  ar1: 0.3, // breath-to-breath correlation, modest (memory; Lamarra et al. 1987 treat noise as nearly white)
  breathSizeSd: 0.04, // common practice (assumed)
  gasAbsSdMlMin: 25, // gives ≈ 10 % at rest, ≈ 5 % near peak (memory; Lamarra et al. 1987)
  gasRelSd: 0.045,
  veRelSd: 0.03,
  breathDurationSd: 0.15, // breath-to-breath variability of breath duration (memory)
  hrSdBpm: 1.5,
  hrAr1: 0.8,
  peto2SdMmhg: 1.5,
  petco2SdMmhg: 1.0,
  endTidalAr1: 0.5,
};

/**
 * A complete parameter set for an untrained adult on a 15 W/min cycle ramp. Override fields
 * with `{ ...defaultCycleParams(), ... }`.
 */
export function defaultCycleParams(): TestParams {
  return {
    name: 'generated',
    subject: { subjectId: 'GEN-0001', ageY: 40, sex: 'F', heightCm: 168, weightKg: 68 },
    protocol: {
      kind: 'cycle-ramp',
      restS: 180, // common practice: 2–3 min
      warmupS: 180, // common practice: 3 min unloaded or light
      warmupW: 0,
      rampWPerMin: 15, // common practice: 10–30 W/min
      recoveryS: 180,
      recoveryW: 0,
    },
    protocolLabel: 'cycle ramp 15 W/min',
    testStart: '2026-03-02T09:00:00Z',
    barometricMmhg: 760,
    fio2: 0.2093, // room air, textbook
    vo2RestMlKgMin: 3.5, // 1 MET, common practice
    unloadedCostMlKgMin: 3.5, // ACSM leg-cycling equation adds 3.5 mL/kg/min for unloaded pedalling (memory)
    cycleGainMlMinW: 10, // ATS/ACCP 2003 (memory)
    vo2TauS: 45, // 30–60 s in untrained adults (memory)
    vco2RecoveryTauFactor: 1.5, // VCO2 kinetics slower than VO2 (memory)
    vo2PeakMlMin: 2000,
    plateauS: 0,
    vt1Vo2MlMin: 1100, // 55 % of peak; typical 45–65 % (memory)
    vt2Vo2MlMin: 1650,
    rerRest: 0.82, // common practice: ≈ 0.8 at rest
    vco2SlopeBelowVt1: 0.95, // Beaver et al. 1986: a little under 1 (memory)
    vco2SlopeAboveVt1: 1.4, // above 1 by ≥ 0.1 (memory)
    veInterceptLMin: 3.5, // VE at zero VCO2 a few L/min, so VE/VO2 falls toward VT1 (memory)
    veSlopeBelowVt2: 26, // VE/VCO2 slope normal below ≈ 30 (memory; ATS/ACCP 2003)
    veSlopeAboveVt2: 45, // steeper above the respiratory compensation point (assumed)
    deadSpaceFractionRest: 0.32, // textbook: ≈ 0.3 at rest (memory)
    deadSpaceFractionPeak: 0.15, // textbook: falls toward ≈ 0.15 (memory)
    petco2OffsetMmhg: 0,
    hrRestBpm: 72,
    hrPeakFractionOfPredicted: 0.95,
    rrRestPerMin: 12, // textbook: 12–16 at rest
    vtMaxL: 2.2, // about half of a vital capacity (memory)
    vtScaleLMin: 25, // assumed
    noise: DEFAULT_NOISE,
    outlierBreaths: 0,
    rpe: { peakBorg: 18, intervalS: 120 },
    extraMetadata: {},
  };
}

/** A walking-treadmill variant of the defaults. */
export function defaultTreadmillParams(): TestParams {
  return {
    ...defaultCycleParams(),
    protocol: {
      kind: 'treadmill-steps',
      restS: 180,
      warmupS: 180,
      warmupSpeedKmh: 2.5,
      warmupGradePct: 0,
      startSpeedKmh: 3.0,
      startGradePct: 2,
      speedStepKmh: 0.3,
      gradeStepPct: 1.5,
      maxSpeedKmh: 6.5,
      stepS: 60,
      recoveryS: 180,
      recoverySpeedKmh: 2.0,
      recoveryGradePct: 0,
    },
    protocolLabel: 'treadmill walk, speed and grade steps each minute',
  };
}
