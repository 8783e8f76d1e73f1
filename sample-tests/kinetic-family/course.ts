/**
 * Family B noise-free time course: load → metabolic demand → first-order kinetics → gas
 * exchange, ventilation, end-tidal pressures and heart rate, on a fine time grid.
 *
 * Kinetics (Whipp et al., J Appl Physiol 1982; Rossiter, Compr Physiol 2011; memory): after a
 * transit delay, VO2 follows the demand with a first-order time constant τVO2. The CO2 side
 * (the metabolic rate "seen" by the CO2 stores, from which VCO2, ventilation and end-tidal
 * pressures are computed) follows the same demand with a longer τVCO2 (the tissue CO2 stores
 * buffer the change). On a ramp VCO2 therefore lags VO2 by about τVCO2 − τVO2 seconds.
 */
import {
  alveolarPco2Mmhg,
  alveolarPo2Mmhg,
  deadSpaceFraction,
  restVo2MlMin,
  unloadedVo2MlMin,
  vco2FromMetabolic,
  ventilationLMin,
  walkingVo2MlMin,
  type KineticParams,
} from './model';

export const COURSE_STEP_S = 0.5;

export interface CoursePoint {
  readonly timeS: number;
  readonly vo2MlMin: number;
  readonly vco2MlMin: number;
  readonly veLMin: number;
  readonly hrBpm: number;
  readonly peto2Mmhg: number;
  readonly petco2Mmhg: number;
  readonly workW: number | null;
  readonly speedKmh: number | null;
  readonly gradePct: number | null;
  /** Metabolic rate as seen by the CO2 side (drives VCO2 and VE), mL/min. */
  readonly co2SideMlMin: number;
}

export interface Course {
  readonly points: readonly CoursePoint[];
  readonly restEndS: number;
  readonly incrementalStartS: number;
  readonly exerciseEndS: number;
  readonly recoveryEndS: number;
  /** True when noise-free VO2 reached vo2PeakMlMin before maxIncrementalS. */
  readonly reachedPeak: boolean;
}

interface Load {
  readonly workW: number | null;
  readonly speedKmh: number | null;
  readonly gradePct: number | null;
  readonly demandMlMin: number;
}

function loadAt(t: number, p: KineticParams, incStart: number, exEnd: number | null): Load {
  const restEnd = p.restS;
  const pr = p.protocol;
  const inRecovery = exEnd !== null && t >= exEnd;
  if (pr.kind === 'cycle') {
    if (t < restEnd) return { workW: 0, speedKmh: null, gradePct: null, demandMlMin: restVo2MlMin(p) };
    const unloaded = unloadedVo2MlMin(p.weightKg);
    if (t < incStart || inRecovery) return { workW: 0, speedKmh: null, gradePct: null, demandMlMin: unloaded };
    const w = (pr.rampWPerMin * (t - incStart)) / 60;
    return { workW: w, speedKmh: null, gradePct: null, demandMlMin: unloaded + p.gainMlMinW * w };
  }
  if (t < restEnd) return { workW: null, speedKmh: 0, gradePct: 0, demandMlMin: restVo2MlMin(p) };
  if (inRecovery) {
    const s = 0.8 * pr.startSpeedKmh;
    return { workW: null, speedKmh: s, gradePct: 0, demandMlMin: walkingVo2MlMin(p.weightKg, s, 0) };
  }
  const minutes = t < incStart ? 0 : (t - incStart) / 60;
  const s = pr.startSpeedKmh + pr.speedKmhPerMin * minutes;
  const g = pr.startGradePct + pr.gradePctPerMin * minutes;
  return { workW: null, speedKmh: s, gradePct: g, demandMlMin: walkingVo2MlMin(p.weightKg, s, g) };
}

/** Simulates the whole test without noise. Pure and deterministic. */
export function simulateCourse(p: KineticParams): Course {
  const dt = COURSE_STEP_S;
  const restEnd = p.restS;
  const incStart = p.restS + p.warmupS;
  const aO2 = 1 - Math.exp(-dt / p.tauVo2S);
  const aCo2 = 1 - Math.exp(-dt / p.tauVco2S);
  const delaySteps = Math.round(p.delayS / dt);
  const rest = restVo2MlMin(p);
  const demandHistory: number[] = [];
  const points: CoursePoint[] = [];
  let vo2 = rest;
  let co2Side = rest;
  let exEnd: number | null = null;
  let reachedPeak = false;
  for (let k = 0; ; k++) {
    const t = k * dt;
    if (exEnd === null && t >= incStart + p.maxIncrementalS) exEnd = t;
    if (exEnd !== null && t > exEnd + p.recoveryS + 1e-9) break;
    const load = loadAt(t, p, incStart, exEnd);
    demandHistory.push(load.demandMlMin);
    const delayed = demandHistory[Math.max(0, k - delaySteps)];
    if (k > 0) {
      vo2 += (delayed - vo2) * aO2;
      co2Side += (delayed - co2Side) * aCo2;
    }
    const vco2 = vco2FromMetabolic(co2Side, p);
    const paco2 = alveolarPco2Mmhg(co2Side, p);
    const ve = ventilationLMin(vco2, paco2, deadSpaceFraction(co2Side, p));
    const effort = Math.max(0, (vo2 - rest) / (p.vo2PeakMlMin - rest));
    points.push({
      timeS: t,
      vo2MlMin: vo2,
      vco2MlMin: vco2,
      veLMin: ve,
      hrBpm: p.hrRestBpm + (p.hrPeakBpm - p.hrRestBpm) * effort,
      peto2Mmhg: alveolarPo2Mmhg(p.barometricMmhg, paco2, vco2 / vo2),
      petco2Mmhg: paco2,
      workW: load.workW,
      speedKmh: load.speedKmh,
      gradePct: load.gradePct,
      co2SideMlMin: co2Side,
    });
    if (exEnd === null && t > incStart && vo2 >= p.vo2PeakMlMin) {
      exEnd = t;
      reachedPeak = true;
    }
  }
  const end = exEnd ?? incStart + p.maxIncrementalS;
  return {
    points,
    restEndS: restEnd,
    incrementalStartS: incStart,
    exerciseEndS: end,
    recoveryEndS: end + p.recoveryS,
    reachedPeak,
  };
}

function lerp(a: number, b: number, f: number): number {
  return a + (b - a) * f;
}

function lerpNullable(a: number | null, b: number | null, f: number): number | null {
  return a === null || b === null ? null : lerp(a, b, f);
}

/** Noise-free values at any time, by linear interpolation on the course grid. */
export function courseAt(course: Course, t: number): CoursePoint {
  const pts = course.points;
  const x = Math.min(Math.max(t / COURSE_STEP_S, 0), pts.length - 1);
  const i = Math.min(Math.floor(x), pts.length - 2);
  const f = x - i;
  const a = pts[i];
  const b = pts[i + 1];
  return {
    timeS: t,
    vo2MlMin: lerp(a.vo2MlMin, b.vo2MlMin, f),
    vco2MlMin: lerp(a.vco2MlMin, b.vco2MlMin, f),
    veLMin: lerp(a.veLMin, b.veLMin, f),
    hrBpm: lerp(a.hrBpm, b.hrBpm, f),
    peto2Mmhg: lerp(a.peto2Mmhg, b.peto2Mmhg, f),
    petco2Mmhg: lerp(a.petco2Mmhg, b.petco2Mmhg, f),
    workW: lerpNullable(a.workW, b.workW, f),
    speedKmh: lerpNullable(a.speedKmh, b.speedKmh, f),
    gradePct: lerpNullable(a.gradePct, b.gradePct, f),
    co2SideMlMin: lerp(a.co2SideMlMin, b.co2SideMlMin, f),
  };
}

/**
 * First time in the incremental phase at which the CO2-side metabolic rate reaches `levelMlMin`
 * (linear interpolation between grid points), or null if it never does before exhaustion.
 */
export function firstCrossingS(course: Course, levelMlMin: number): number | null {
  const pts = course.points;
  for (let i = 1; i < pts.length; i++) {
    const a = pts[i - 1];
    const b = pts[i];
    if (b.timeS < course.incrementalStartS) continue;
    if (a.timeS > course.exerciseEndS) return null;
    if (a.co2SideMlMin < levelMlMin && b.co2SideMlMin >= levelMlMin) {
      return a.timeS + ((levelMlMin - a.co2SideMlMin) / (b.co2SideMlMin - a.co2SideMlMin)) * (b.timeS - a.timeS);
    }
  }
  return null;
}
