/**
 * The generated tests of the accuracy validation (family 1: sample-tests/generator), in two
 * conditions reported separately:
 *
 * - **main**: the tests a lab aims for. The work-rate increment is chosen so that the
 *   incremental phase lasts about 10 (8–12) min (ERS task force, Palange et al., Eur Respir J
 *   2007, on-line supplement; ATS/ACCP statement, Am J Respir Crit Care Med 2003, memory).
 *   Cycle ramps of 10–15 and 20–30 W/min (15–20 W/min for an average young adult, less for
 *   patients: Palange et al. 2007), a walking treadmill whose grade rises 1–2.5 % a minute;
 *   noise ×0.5 and ×1 of the generator's default; with no outlier breaths or with 15.
 * - **hard**: short incremental phases (5–8 min, at noise ×0.5 and ×1) and very noisy tests
 *   (noise ×1.5 and ×2, 8–12 min), the same protocols.
 *
 * Each seed draws the subject: body mass 55–95 kg, the incremental duration (uniform over the
 * condition's range), the ramp rate (cycle) or grade step (treadmill) of its protocol cell;
 * peak VO2 is then whatever makes the generator's incremental phase last that long, so
 * fitness follows: about 17–60 mL/kg/min, sedentary to trained. VT1 at 45–65 % and VT2 at
 * 75–88 % of peak (textbook ranges, memory; check-values.md), VT1 at least a fifth of the way
 * from the warm-up VO2 to peak and VT2 at least 10 % of peak above VT1 (our choice: no reader
 * can place a threshold in the ramp's first minute). The generator itself is used as its author
 * wrote it; only its documented parameters are set. This file is the grid, not the model.
 */
import { DEFAULT_NOISE, defaultCycleParams, defaultTreadmillParams, modelTrajectory, type TestParams } from '../../sample-tests/generator';
import { seededRandom, type Random } from '../../core/math/random';

export type GridCondition = 'main' | 'hard';

export interface ValidationCase {
  readonly label: string;
  readonly condition: GridCondition;
  /** Protocol cell: 'cycle 10–15 W/min', 'cycle 20–30 W/min' or 'treadmill'. */
  readonly protocol: string;
  readonly modality: 'cycle' | 'treadmill';
  readonly rampWPerMin: number | null;
  readonly noiseScale: number;
  readonly outliers: number;
  /** Length of the incremental phase the subject was drawn for, min. */
  readonly incrementalMin: number;
  /** 'short ramp' or 'very noisy' in the hard condition, else null. */
  readonly hardKind: 'short ramp' | 'very noisy' | null;
  readonly seed: number;
  readonly params: TestParams;
}

function scaledNoise(scale: number): TestParams['noise'] {
  const n = DEFAULT_NOISE;
  return {
    ...n,
    gasAbsSdMlMin: n.gasAbsSdMlMin * scale,
    gasRelSd: n.gasRelSd * scale,
    veRelSd: n.veRelSd * scale,
    breathSizeSd: n.breathSizeSd * scale,
    peto2SdMmhg: n.peto2SdMmhg * scale,
    petco2SdMmhg: n.petco2SdMmhg * scale,
  };
}

interface ProtocolCell {
  readonly name: string;
  readonly modality: 'cycle' | 'treadmill';
  /** Cycle ramp rates (W/min) or treadmill grade steps (% per min) to draw from. */
  readonly steps: readonly number[];
}

const PROTOCOLS: readonly ProtocolCell[] = [
  { name: 'cycle 10–15 W/min', modality: 'cycle', steps: [10, 15] },
  { name: 'cycle 20–30 W/min', modality: 'cycle', steps: [20, 25, 30] },
  { name: 'treadmill', modality: 'treadmill', steps: [1, 1.5, 2, 2.5] },
];

interface HardCell {
  readonly kind: 'short ramp' | 'very noisy';
  readonly minutes: readonly [number, number];
  readonly noise: readonly number[];
}

const MAIN = { minutes: [8, 12] as const, noise: [0.5, 1] };
const HARD: readonly HardCell[] = [
  { kind: 'short ramp', minutes: [5, 8], noise: [0.5, 1] },
  { kind: 'very noisy', minutes: [8, 12], noise: [1.5, 2] },
];

function pick<T>(r: Random, values: readonly T[]): T {
  return values[Math.min(values.length - 1, Math.floor(r() * values.length))];
}

/** The parameters with peak, VT1 and VT2 set from the drawn fractions for a given peak. */
function withPeak(p: TestParams, peak: number, f1: number, f2: number, warmVo2: number): TestParams {
  const vt1 = Math.max(peak * f1, warmVo2 + 0.2 * (peak - warmVo2));
  const vt2 = Math.max(peak * f2, vt1 + 0.1 * peak);
  return { ...p, vo2PeakMlMin: Math.round(peak), vt1Vo2MlMin: Math.round(vt1), vt2Vo2MlMin: Math.round(Math.min(vt2, 0.95 * peak)) };
}

function incrementalS(p: TestParams): number {
  const t = modelTrajectory(p);
  return t.exerciseEndS - t.incrementalStartS;
}

function warmupVo2(p: TestParams): number {
  const t = modelTrajectory(p);
  return t.vo2MlMin[Math.max(0, Math.round(t.incrementalStartS * 20) - 1)];
}

/**
 * The parameters whose incremental phase lasts `targetS`: peak VO2 by bisection on the
 * generator's own trajectory (which ends the phase when VO2 reaches peak), VT1 and VT2 from the
 * drawn fractions of that peak.
 */
function paramsForDuration(p: TestParams, targetS: number, f1: number, f2: number): TestParams {
  const warmVo2 = warmupVo2(withPeak(p, 6000, f1, f2, 0));
  let lo = warmVo2 * 1.3;
  let hi = 7000;
  for (let k = 0; k < 12; k++) {
    const mid = (lo + hi) / 2;
    if (incrementalS(withPeak(p, mid, f1, f2, warmVo2)) < targetS) lo = mid;
    else hi = mid;
  }
  return withPeak(p, (lo + hi) / 2, f1, f2, warmVo2);
}

function makeCase(condition: GridCondition, cell: ProtocolCell, noiseScale: number, outliers: number, minutes: readonly [number, number], hardKind: ValidationCase['hardKind'], seed: number): ValidationCase {
  const r = seededRandom(seed * 7919 + 17);
  const weightKg = Math.round(55 + 40 * r());
  const incrementalMin = minutes[0] + (minutes[1] - minutes[0]) * r();
  const step = pick(r, cell.steps);
  const f1 = 0.45 + 0.2 * r();
  const f2 = 0.75 + 0.13 * r();
  const base = cell.modality === 'cycle' ? defaultCycleParams() : defaultTreadmillParams();
  const protocol =
    base.protocol.kind === 'cycle-ramp' ? { ...base.protocol, rampWPerMin: step }
    : base.protocol.kind === 'treadmill-steps' ? { ...base.protocol, gradeStepPct: step }
    : base.protocol;
  const start: TestParams = {
    ...base,
    subject: { ...base.subject, weightKg },
    protocol,
    protocolLabel: cell.modality === 'cycle' ? `cycle ramp ${step} W/min` : `treadmill walk, grade +${step} % and speed +0.3 km/h each minute`,
    noise: scaledNoise(noiseScale),
    outlierBreaths: outliers,
  };
  const params = paramsForDuration(start, incrementalMin * 60, f1, f2);
  return {
    label: `${cell.name}${cell.modality === 'cycle' ? ` (${step})` : ` (+${step} %/min)`}, ${incrementalMin.toFixed(1)} min, noise ×${noiseScale}, ${outliers ? 'outliers' : 'clean'}`,
    condition,
    protocol: cell.name,
    modality: cell.modality,
    rampWPerMin: cell.modality === 'cycle' ? step : null,
    noiseScale,
    outliers,
    incrementalMin,
    hardKind,
    seed,
    params,
  };
}

/** First seed of the held-out validation set; tuning uses DEVELOPMENT_FIRST_SEED instead. */
export const VALIDATION_FIRST_SEED = 1;
/**
 * First seed of the development set: the same conditions, other subjects and noise. Not
 * 200001–201504: the large held-out coverage sets (coverage-sets.ts).
 */
export const DEVELOPMENT_FIRST_SEED = 5000;
/** The hard condition's seeds start this far after the main condition's (no seed shared). */
export const HARD_SEED_OFFSET = 1000;

/**
 * The main grid: 3 protocols × noise ×0.5, ×1 × with/without outliers × seedsPerCell, seeds
 * counting up from `firstSeed`.
 */
export function mainCases(seedsPerCell: number, firstSeed = VALIDATION_FIRST_SEED): ValidationCase[] {
  const cases: ValidationCase[] = [];
  let seed = firstSeed;
  for (const noise of MAIN.noise) {
    for (const outliers of [0, 15]) {
      for (const cell of PROTOCOLS) {
        for (let k = 0; k < seedsPerCell; k++, seed++) cases.push(makeCase('main', cell, noise, outliers, MAIN.minutes, null, seed));
      }
    }
  }
  return cases;
}

/**
 * The hard condition: (short ramp at noise ×0.5, ×1; very noisy ×1.5, ×2 at 8–12 min) × 3
 * protocols × with/without outliers × seedsPerCell, seeds from `firstSeed + HARD_SEED_OFFSET`.
 */
export function hardCases(seedsPerCell: number, firstSeed = VALIDATION_FIRST_SEED): ValidationCase[] {
  const cases: ValidationCase[] = [];
  let seed = firstSeed + HARD_SEED_OFFSET;
  for (const hard of HARD) {
    for (const noise of hard.noise) {
      for (const outliers of [0, 15]) {
        for (const cell of PROTOCOLS) {
          for (let k = 0; k < seedsPerCell; k++, seed++) cases.push(makeCase('hard', cell, noise, outliers, hard.minutes, hard.kind, seed));
        }
      }
    }
  }
  return cases;
}

/** Both conditions. */
export function validationCases(seedsPerCell: number, firstSeed = VALIDATION_FIRST_SEED): ValidationCase[] {
  return [...mainCases(seedsPerCell, firstSeed), ...hardCases(seedsPerCell, firstSeed)];
}
