/**
 * The noise-free course of one test on a fine time grid: the deterministic half of the
 * model described in generate-test.ts. Pure: parameters in, arrays out.
 *
 * VO2 follows the O2 demand of the load through a first-order response,
 *   dVO2/dt = (target − VO2) / τ,   integrated exactly over each grid step
 *   (x ← target + (x − target)·e^(−dt/τ)), where target = demand, or min(demand, VO2peak)
 *   when the subject holds a plateau. VCO2, VE, end-tidal pressures and HR are functions of
 *   VO2 (physiology.ts), except that in recovery VCO2 falls with its own, slower first-order
 *   response toward the recovery steady state (CO2 stores; memory).
 */
import { incrementalStartS, loadAt, type Load } from './protocol';
import type { TestParams } from './params';
import {
  alveolarPco2Mmhg,
  alveolarPo2Mmhg,
  alveolarVentilationLMin,
  cyclingVo2MlMin,
  deadSpaceFraction,
  hrFromVo2Bpm,
  inspiredPo2Mmhg,
  tanakaHrMaxBpm,
  vco2FromVo2MlMin,
  veFromVco2LMin,
  walkingVo2MlKgMin,
  type Vco2Line,
  type VeLine,
} from './physiology';

/** Grid steps per second; the step (0.05 s) is small against every time constant (≥ 20 s). */
const GRID_STEPS_PER_S = 20;
export const GRID_STEP_S = 1 / GRID_STEPS_PER_S;
/** The incremental phase is abandoned as impossible beyond this, s. */
const MAX_INCREMENTAL_S = 3600;

export interface Trajectory {
  readonly timeS: Float64Array;
  readonly vo2MlMin: Float64Array;
  readonly vco2MlMin: Float64Array;
  readonly veLMin: Float64Array;
  readonly hrBpm: Float64Array;
  readonly paco2Mmhg: Float64Array;
  readonly pao2Mmhg: Float64Array;
  readonly incrementalStartS: number;
  readonly exerciseEndS: number;
  readonly recoveryEndS: number;
  readonly vo2RestMlMin: number;
  readonly hrPeakBpm: number;
  readonly vco2Line: Vco2Line;
  readonly veLine: VeLine;
}

export function restingVo2MlMin(params: TestParams): number {
  return params.vo2RestMlKgMin * params.subject.weightKg;
}

/** Steady-state O2 demand of a load, mL/min. */
export function vo2DemandMlMin(params: TestParams, load: Load): number {
  const rest = restingVo2MlMin(params);
  if (load.phase === 'rest') return rest;
  if (load.workW !== null) {
    return cyclingVo2MlMin(load.workW, rest, params.unloadedCostMlKgMin * params.subject.weightKg, params.cycleGainMlMinW);
  }
  // The ACSM walking equation includes 3.5 mL/kg/min of rest; the subject's own resting VO2 replaces it.
  const walking = walkingVo2MlKgMin(load.speedKmh ?? 0, load.gradePct ?? 0) - 3.5 + params.vo2RestMlKgMin;
  return walking * params.subject.weightKg;
}

export function vco2LineOf(params: TestParams): Vco2Line {
  return {
    vo2RestMlMin: restingVo2MlMin(params),
    rerRest: params.rerRest,
    vt1Vo2MlMin: params.vt1Vo2MlMin,
    slopeBelowVt1: params.vco2SlopeBelowVt1,
    slopeAboveVt1: params.vco2SlopeAboveVt1,
  };
}

export function veLineOf(params: TestParams): VeLine {
  return {
    interceptLMin: params.veInterceptLMin,
    slopeBelowVt2: params.veSlopeBelowVt2,
    slopeAboveVt2: params.veSlopeAboveVt2,
    vt2Vco2MlMin: vco2FromVo2MlMin(params.vt2Vo2MlMin, vco2LineOf(params)),
  };
}

/** Problems with a parameter set, as sentences; empty when the set is usable. */
export function parameterProblems(params: TestParams): string[] {
  const problems: string[] = [];
  const s = params.subject;
  if (!(s.weightKg > 0) || !(s.ageY > 0) || !(s.heightCm > 0)) problems.push('age, height and weight must be positive');
  const rest = restingVo2MlMin(params);
  if (!(rest < params.vt1Vo2MlMin && params.vt1Vo2MlMin < params.vt2Vo2MlMin && params.vt2Vo2MlMin < params.vo2PeakMlMin)) {
    problems.push(`VO2 must rise rest (${rest.toFixed(0)}) < VT1 (${params.vt1Vo2MlMin}) < VT2 (${params.vt2Vo2MlMin}) < peak (${params.vo2PeakMlMin}) mL/min`);
  }
  if (!(params.vco2SlopeBelowVt1 > 0 && params.vco2SlopeAboveVt1 > params.vco2SlopeBelowVt1)) {
    problems.push('the VCO2-on-VO2 slope must be positive and steeper above VT1 than below');
  }
  if (!(params.veSlopeBelowVt2 > 0 && params.veSlopeAboveVt2 > params.veSlopeBelowVt2)) {
    problems.push('the VE-on-VCO2 slope must be positive and steeper above VT2 than below');
  }
  const dead = [params.deadSpaceFractionRest, params.deadSpaceFractionPeak];
  if (!dead.every((d) => d >= 0 && d < 1)) problems.push('VD/VT must lie in [0, 1)');
  if (!(params.vo2TauS > 0 && params.vco2RecoveryTauFactor > 0)) problems.push('time constants must be positive');
  if (!(params.plateauS >= 0)) problems.push('the plateau duration cannot be negative');
  if (!(params.rerRest > 0 && params.hrRestBpm > 0 && params.rrRestPerMin > 0)) problems.push('resting RER, HR and breathing rate must be positive');
  const n = params.noise;
  if (![n.ar1, n.hrAr1, n.endTidalAr1].every((phi) => phi >= 0 && phi < 1)) problems.push('AR(1) coefficients must lie in [0, 1)');
  return problems;
}

/**
 * Integrates the model. Throws when the parameters contradict themselves (a programming
 * mistake in a scenario, not a user's file): the message lists the problems.
 */
export function modelTrajectory(params: TestParams): Trajectory {
  const problems = parameterProblems(params);
  if (problems.length > 0) throw new Error(`test-data model: ${problems.join('; ')}`);
  const protocol = params.protocol;
  const start = incrementalStartS(protocol);
  const decayVo2 = Math.exp(-GRID_STEP_S / params.vo2TauS);
  const decayVco2 = Math.exp(-GRID_STEP_S / (params.vo2TauS * params.vco2RecoveryTauFactor));
  const vco2Line = vco2LineOf(params);
  const veLine = veLineOf(params);
  const vo2Rest = restingVo2MlMin(params);

  const times: number[] = [];
  const vo2: number[] = [];
  const vco2: number[] = [];
  let exerciseEndS = Number.POSITIVE_INFINITY;
  let demandReachedPeakS: number | null = null;
  let x = vo2Rest;
  let co2 = vco2FromVo2MlMin(x, vco2Line);
  for (let i = 0; ; i++) {
    // Division keeps grid times exact decimals (841.9, not 841.9000000000001).
    const t = i / GRID_STEPS_PER_S;
    if (t > exerciseEndS + protocol.recoveryS) break;
    const load = loadAt(protocol, t, exerciseEndS);
    const demand = vo2DemandMlMin(params, load);
    if (i > 0) {
      const target = params.plateauS > 0 && load.phase === 'incremental' ? Math.min(demand, params.vo2PeakMlMin) : demand;
      x = target + (x - target) * decayVo2;
      co2 = load.phase === 'recovery' ? vco2FromVo2MlMin(demand, vco2Line) + (co2 - vco2FromVo2MlMin(demand, vco2Line)) * decayVco2 : vco2FromVo2MlMin(x, vco2Line);
    }
    times.push(t);
    vo2.push(x);
    vco2.push(co2);
    if (load.phase === 'incremental' && !Number.isFinite(exerciseEndS)) {
      if (params.plateauS === 0 && x >= params.vo2PeakMlMin) exerciseEndS = t;
      if (params.plateauS > 0 && demandReachedPeakS === null && demand >= params.vo2PeakMlMin) {
        demandReachedPeakS = t;
        exerciseEndS = t + params.plateauS;
      }
      if (t - start > MAX_INCREMENTAL_S) throw new Error('test-data model: the protocol never brings VO2 to the stated peak within an hour');
    }
  }
  if (vo2[Math.round(start / GRID_STEP_S)] >= params.vt1Vo2MlMin) {
    throw new Error('test-data model: VO2 already exceeds VT1 before the incremental phase starts; lower the warm-up load or raise VT1');
  }

  const n = times.length;
  const out = {
    timeS: Float64Array.from(times),
    vo2MlMin: Float64Array.from(vo2),
    vco2MlMin: Float64Array.from(vco2),
    veLMin: new Float64Array(n),
    hrBpm: new Float64Array(n),
    paco2Mmhg: new Float64Array(n),
    pao2Mmhg: new Float64Array(n),
  };
  const hrPeakBpm = params.hrPeakFractionOfPredicted * tanakaHrMaxBpm(params.subject.ageY);
  const pio2 = inspiredPo2Mmhg(params.barometricMmhg, params.fio2);
  for (let i = 0; i < n; i++) {
    const ve = veFromVco2LMin(out.vco2MlMin[i], veLine);
    const deadSpace = deadSpaceFraction(out.vo2MlMin[i], vo2Rest, params.vo2PeakMlMin, params.deadSpaceFractionRest, params.deadSpaceFractionPeak);
    const paco2 = alveolarPco2Mmhg(out.vco2MlMin[i] / 1000, alveolarVentilationLMin(ve, deadSpace));
    out.veLMin[i] = ve;
    out.hrBpm[i] = hrFromVo2Bpm(out.vo2MlMin[i], vo2Rest, params.vo2PeakMlMin, params.hrRestBpm, hrPeakBpm);
    out.paco2Mmhg[i] = paco2 + params.petco2OffsetMmhg;
    out.pao2Mmhg[i] = alveolarPo2Mmhg(pio2, paco2, out.vco2MlMin[i] / out.vo2MlMin[i], params.fio2);
  }
  return {
    ...out,
    incrementalStartS: start,
    exerciseEndS,
    recoveryEndS: exerciseEndS + protocol.recoveryS,
    vo2RestMlMin: vo2Rest,
    hrPeakBpm,
    vco2Line,
    veLine,
  };
}

/** Linear interpolation of a grid series at `timeS` (clamped to the grid). */
export function valueAt(series: Float64Array, timeS: number): number {
  const position = Math.min(Math.max(timeS / GRID_STEP_S, 0), series.length - 1);
  const i = Math.floor(position);
  const j = Math.min(i + 1, series.length - 1);
  return series[i] + (series[j] - series[i]) * (position - i);
}

/** First time in the incremental phase at which the noise-free VO2 reaches `vo2MlMin`, s. */
export function firstTimeAtVo2(trajectory: Trajectory, vo2MlMin: number): number | null {
  const first = Math.round(trajectory.incrementalStartS / GRID_STEP_S);
  const v = trajectory.vo2MlMin;
  for (let i = Math.max(first, 1); i < v.length && trajectory.timeS[i] <= trajectory.exerciseEndS; i++) {
    if (v[i] >= vo2MlMin && v[i - 1] < vo2MlMin) {
      return trajectory.timeS[i - 1] + (GRID_STEP_S * (vo2MlMin - v[i - 1])) / (v[i] - v[i - 1]);
    }
  }
  return null;
}
