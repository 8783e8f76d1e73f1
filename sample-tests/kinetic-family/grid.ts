/**
 * Family B validation grid: subjects and protocols drawn per seed within stated ranges.
 *
 * Conditions:
 * - 'main': incremental phase 8–12 min (ATS/ACCP 2003 recommends about 8–12 min; memory),
 *   cycle ramps of 10–30 W/min in steps of 5 chosen so the ramp fits the subject, or a treadmill
 *   walking ramp (speed and grade rising together); peak VO2 18–55 mL/kg/min (sedentary to
 *   trained); VT1 at 45–65 % and VT2 at 75–90 % of peak VO2 (textbook ranges, memory); noise ×0.8–1.2.
 * - 'short-or-noisy': half the seeds have an incremental phase of 5–8 min at noise ×0.8–1.2, the
 *   other half 8–12 min at noise ×1.5–2.
 *
 * Seeds: 1–4999 are HELD-OUT validation seeds (measure once, never tune on them);
 * 5000 and up are DEVELOPMENT seeds (tune and explore there), except 200001–201504, the
 * large held-out coverage sets (tests/validation/coverage-sets.ts), never tuned on either.
 */
import { seededRandom } from '../../core/math/random';
import { simulateCourse } from './course';
import { kineticTruthOf } from './generate';
import {
  DEFAULT_KINETIC_NOISE,
  restVo2MlMin,
  softplus,
  unloadedVo2MlMin,
  walkingVo2MlMin,
  type KineticParams,
  type KineticProtocol,
} from './model';

export type KineticCondition = 'main' | 'short-or-noisy';

/** First held-out validation seed of family B (seeds below the development range). */
export const FAMILY_B_VALIDATION_FIRST_SEED = 1;
/** First development seed of family B: tuning uses these, never the held-out ones. */
export const FAMILY_B_DEVELOPMENT_FIRST_SEED = 5000;

export interface KineticCase {
  readonly label: string;
  readonly condition: KineticCondition;
  readonly modality: 'cycle' | 'treadmill';
  /** The seed: it both draws the subject and drives the noise of generateKineticTest. */
  readonly seed: number;
  readonly params: KineticParams;
  /** Planned incremental duration, min, and the noise scale (for reporting by condition). */
  readonly incrementalMin: number;
  readonly noiseScale: number;
}

const MAX_ATTEMPTS = 400;

/**
 * The subject and protocol of one seed in one condition. Draws are redrawn (deterministically,
 * from the same seeded stream) until the simulated test satisfies the condition: incremental
 * phase in range, VT1 at least 1 min into the ramp, VT2 at least 45 s before exhaustion and a
 * peak RER ≥ 1.10 (maximal effort; Balady et al., Circulation 2010).
 */
export function kineticCase(condition: KineticCondition, seed: number): KineticCase {
  const r = seededRandom(seed * 2654435761 + 97);
  const u = (lo: number, hi: number) => lo + (hi - lo) * r();
  const treadmill = r() < 1 / 3;
  const shortRamp = condition === 'short-or-noisy' && r() < 0.5;
  const noiseScale = condition === 'short-or-noisy' && !shortRamp ? u(1.5, 2) : u(0.8, 1.2);
  const [tMin, tMax] = shortRamp ? [5, 8] : [8, 12];
  for (let attempt = 0; attempt < MAX_ATTEMPTS; attempt++) {
    const sex: 'F' | 'M' = r() < 0.5 ? 'F' : 'M';
    const ageY = Math.round(u(20, 70));
    const heightCm = Math.round(sex === 'F' ? u(155, 175) : u(167, 192));
    const weightKg = Math.round(u(20, 30) * (heightCm / 100) ** 2 * 10) / 10;
    const fitness = u(18, 55);
    const fitNorm = (fitness - 18) / 37;
    const peak = fitness * weightKg;
    const tauVo2S = 28 + 27 * (1 - fitNorm) + u(-4, 4);
    const tauVco2S = tauVo2S + u(10, 20);
    const delayS = u(10, 20);
    const gain = u(9, 11);
    const plannedS = u(tMin, tMax) * 60;
    const demandS = plannedS - delayS - tauVo2S;
    let protocol: KineticProtocol;
    let warmDemand: number;
    if (!treadmill) {
      const unloaded = unloadedVo2MlMin(weightKg);
      warmDemand = unloaded;
      const needed = (peak - unloaded) / gain / (demandS / 60);
      protocol = { kind: 'cycle', rampWPerMin: Math.min(30, Math.max(10, 5 * Math.round(needed / 5))) };
    } else {
      const startSpeedKmh = 3;
      const endSpeed = 5 + 2 * fitNorm;
      const v = (endSpeed * 1000) / 60;
      const grade = (peak / weightKg - 3.5 - 0.1 * v) / (1.8 * v);
      if (grade < 0.02 || grade > 0.25) continue;
      warmDemand = walkingVo2MlMin(weightKg, startSpeedKmh, 0);
      protocol = {
        kind: 'treadmill',
        startSpeedKmh,
        startGradePct: 0,
        speedKmhPerMin: Math.round(((endSpeed - startSpeedKmh) / (demandS / 60)) * 100) / 100,
        gradePctPerMin: Math.round(((grade * 100) / (demandS / 60)) * 100) / 100,
      };
    }
    const vt1Lo = Math.max(0.45, (warmDemand + 0.2 * (peak - warmDemand)) / peak);
    if (vt1Lo > 0.63) continue;
    const vt1Frac = u(vt1Lo, 0.65);
    const vt2Lo = Math.max(0.75, vt1Frac + 0.15);
    if (vt2Lo > 0.88) continue;
    const vt2Frac = u(vt2Lo, 0.9);
    const vt1 = peak * vt1Frac;
    const vt1Width = peak * u(0.04, 0.07);
    const s1 = u(0.95, 1.0);
    const rerRest = u(0.78, 0.85);
    // s2 from a target RER at exhaustion (1.12–1.25), allowing for the VCO2 lag on the ramp.
    const rest = 3.5 * weightKg;
    const lagMl = ((peak - warmDemand) / plannedS) * (tauVco2S - tauVo2S);
    const mEnd = peak - lagMl;
    const vco2Target = u(1.12, 1.25) * peak;
    const s2 = s1 + (vco2Target - rerRest * rest - s1 * (mEnd - rest)) / softplus(mEnd - vt1, vt1Width);
    if (!(s2 > s1 + 0.1 && s2 < 2.2)) continue;
    const params: KineticParams = {
      ageY,
      sex,
      heightCm,
      weightKg,
      barometricMmhg: Math.round(u(735, 768)),
      protocol,
      vo2PeakMlMin: Math.round(peak),
      vt1Vo2MlMin: Math.round(vt1),
      vt2Vo2MlMin: Math.round(peak * vt2Frac),
      vt1WidthMlMin: Math.round(vt1Width),
      vt2WidthMlMin: Math.round(peak * u(0.03, 0.05)),
      tauVo2S,
      tauVco2S,
      delayS,
      gainMlMinW: gain,
      s1,
      s2,
      rerRest,
      hrRestBpm: Math.round(u(60, 85)),
      hrPeakBpm: Math.round(208 - 0.7 * ageY + u(-8, 8)),
      restS: Math.round(u(120, 180)),
      warmupS: 180,
      recoveryS: Math.round(u(120, 180)),
      maxIncrementalS: tMax * 60 + 60,
      noise: { ...DEFAULT_KINETIC_NOISE, scale: noiseScale },
      outlierCount: Math.round(u(2, 6)),
    };
    if (restVo2MlMin(params) >= vt1) continue;
    const course = simulateCourse(params);
    if (!course.reachedPeak) continue;
    const incS = course.exerciseEndS - course.incrementalStartS;
    if (incS < tMin * 60 || incS > tMax * 60) continue;
    let truth;
    try {
      truth = kineticTruthOf(params, seed, course);
    } catch {
      continue;
    }
    if (truth.vt1.timeS - course.incrementalStartS < 60) continue;
    if (course.exerciseEndS - truth.vt2.timeS < 45) continue;
    if (truth.peak.rer < 1.1) continue;
    const modality = protocol.kind;
    const rampText = protocol.kind === 'cycle' ? ` ${protocol.rampWPerMin} W/min` : '';
    return {
      label: `B ${condition}: ${modality}${rampText}, ${(incS / 60).toFixed(1)} min, noise ×${noiseScale.toFixed(2)}`,
      condition,
      modality,
      seed,
      params,
      incrementalMin: incS / 60,
      noiseScale,
    };
  }
  throw new Error(`Family B grid: no subject satisfied condition '${condition}' for seed ${seed} in ${MAX_ATTEMPTS} draws.`);
}

/** `count` cases of one condition, seeds counting up from `firstSeed`. */
export function kineticCases(condition: KineticCondition, count: number, firstSeed: number = FAMILY_B_VALIDATION_FIRST_SEED): KineticCase[] {
  return Array.from({ length: count }, (_, k) => kineticCase(condition, firstSeed + k));
}

/** The short alias the validation uses: `cases('main', 40, 1)`. */
export const cases = kineticCases;
