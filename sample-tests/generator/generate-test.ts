/**
 * generateTest(params, seed): one breath-by-breath CPET from a stated physiological model,
 * with its ground truth. Same parameters and seed → the same table, value for value.
 *
 * THE MODEL (defaults in params.ts, each with its source)
 * Protocol. Rest (restS, 0 W or standing still), warm-up (warmupS at warmupW, or a slow
 *   walk), incremental phase (cycle ramp W(t) = warmupW + rate·(t − start)/60, cycle steps,
 *   or treadmill speed-and-grade steps), then recovery (recoveryS at recoveryW or a slow walk).
 *   The incremental phase ends when the subject can go no further: when the noise-free VO2
 *   reaches vo2PeakMlMin, or, with a plateau, plateauS s after the demand first reaches it
 *   (VO2 then levels at vo2PeakMlMin while the load still rises).
 * O2 demand. Cycle: VO2rest + unloaded cost + gain·W, VO2rest = vo2RestMlKgMin·kg
 *   (3.5 mL/kg/min, 1 MET, common practice), unloaded cost 3.5 mL/kg/min (ACSM leg-cycling
 *   equation, memory), gain ≈ 10 mL/min/W (ATS/ACCP 2003, memory). Treadmill: ACSM walking
 *   equation 0.1·v + 1.8·v·grade + VO2rest, v in m/min (memory).
 * VO2. First-order response to the demand, time constant vo2TauS (30–60 s, memory);
 *   the cardiodynamic phase is not modelled.
 * VCO2. Continuous broken line of VO2 (Beaver et al. 1986): RERrest·VO2rest at
 *   rest, slope s1 (≈ 0.95) up to VT1, slope s2 (≈ 1.4) above. During exercise VCO2 is an
 *   instantaneous function of VO2 (an idealisation: real VCO2 lags VO2 a little, which bends
 *   the first minute of a ramp; detectors should not rely on its absence). In recovery VCO2 falls with
 *   its own first-order response, time constant vco2RecoveryTauFactor·vo2TauS, so RER rises
 *   after exercise (CO2 stores, memory).
 * VE. Continuous broken line of VCO2: VE = a + k1·VCO2 (L/min) up to VCO2 at VT2, slope k2 > k1
 *   above (respiratory compensation). VE/VCO2 ≈ k1 and nearly flat between VT1 and VT2.
 * End-tidal pressures. Alveolar equations (textbook physiology): VD/VT falls linearly from
 *   rest to peak with f, the fraction of the VO2 range reached; VA = VE·(1 − VD/VT);
 *   PetCO2 = 863·VCO2/VA + offset; PetO2 = PIO2 − PACO2·(FIO2 + (1 − FIO2)/R),
 *   PIO2 = (PB − 47)·FIO2, R = VCO2/VO2.
 * HR. Linear in VO2 from hrRestBpm at rest to hrPeakFraction·(208 − 0.7·age) at peak VO2
 *   (Tanaka et al. 2001); it follows the VO2 kinetics, also in recovery.
 * Breathing. Tidal volume saturates with VE (physiology.ts); the model breathing rate is
 *   VE/VT. Each breath lasts 60/RR(t)·(1 + breathDurationSd·z) s; the breath's rate is
 *   60/duration and its tidal volume VE/rate, so rows are per breath.
 * Noise (Lamarra et al., J Appl Physiol 1987). AR(1) per variable, coefficient `ar1`:
 *   a breath-size factor shared by VE, VT, VO2 and VCO2 (SD breathSizeSd), independent
 *   VO2 and VCO2 noise with SD √(gasAbsSd² + (gasRelSd·value)²) (≈ 10 % at rest, ≈ 5 % at
 *   peak), independent VE noise, HR and end-tidal noise with their own SD and coefficient.
 * Outliers. When asked, isolated breaths are made far off, one kind each (multipliers in
 *   OUTLIER_EFFECTS): a cough (large VE, VO2, VCO2), a swallow (an interrupted, tiny breath),
 *   a sigh (very deep breath); the truth lists them.
 * RPE. Borg 6–20 readings every rpe.intervalS s of the incremental phase and at its end,
 *   6 + (peakBorg − 6)·f rounded, f the fraction of the VO2 range reached (the scale grows
 *   about linearly with intensity, Borg 1982), each at the time of a breath.
 * Recorded precision: time 0.01 s, VO2 and VCO2 1 mL/min, VE 0.01 L/min, HR 1 bpm, work 1 W,
 *   speed and grade 0.1, end-tidal pressures 0.1 mmHg, RR 0.1 /min, VT 0.001 L.
 * The truth: VT1 and VT2 as VO2, the first time the noise-free VO2 reaches it during the
 *   incremental phase, and the load then; phase boundaries; noise-free peak values;
 *   outliers; the parameters and the seed. The model states physiology; it is not fitted to
 *   any detector.
 */
import { breath, type Breath, type BreathTable, type RpeReading } from '../../core/model/breath-table';
import { normalRandom, seededRandom, type Random } from '../../core/math/random';
import { ar1Series } from './noise';
import type { TestParams } from './params';
import { tidalVolumeL } from './physiology';
import { loadAt } from './protocol';
import { firstTimeAtVo2, modelTrajectory, valueAt, type Trajectory } from './trajectory';

export const MODEL_VERSION = 1;

export type OutlierKind = 'cough' | 'swallow' | 'sigh';

/** How an outlier breath departs from its neighbours: multipliers, and shifts in mmHg (assumed magnitudes). */
export const OUTLIER_EFFECTS: Readonly<Record<OutlierKind, { ve: number; vo2: number; vco2: number; peto2: number; petco2: number }>> = {
  cough: { ve: 2.5, vo2: 2.0, vco2: 2.2, peto2: 5, petco2: -4 },
  swallow: { ve: 0.35, vo2: 0.3, vco2: 0.3, peto2: 0, petco2: 0 },
  sigh: { ve: 2.2, vo2: 1.7, vco2: 1.9, peto2: 4, petco2: -3 },
};
const OUTLIER_KINDS: readonly OutlierKind[] = ['cough', 'swallow', 'sigh'];
/** Outliers sit at least this many breaths apart and from the ends, so each stays isolated. */
const OUTLIER_SPACING = 6;

export interface ThresholdTruth {
  readonly vo2MlMin: number;
  readonly vco2MlMin: number;
  readonly timeS: number;
  /** Cycle work at that time, W; null on a treadmill. */
  readonly workW: number | null;
  readonly speedKmh: number | null;
  readonly gradePct: number | null;
  readonly hrBpm: number;
}

export interface OutlierTruth {
  /** 0-based index of the breath in the table. */
  readonly index: number;
  readonly timeS: number;
  readonly kind: OutlierKind;
}

export interface TestTruth {
  readonly modelVersion: number;
  readonly seed: number;
  readonly params: TestParams;
  readonly vt1: ThresholdTruth;
  readonly vt2: ThresholdTruth;
  readonly phases: {
    readonly restEndS: number;
    readonly incrementalStartS: number;
    readonly exerciseEndS: number;
    readonly recoveryEndS: number;
  };
  /** Noise-free values at the end of the incremental phase (VO2 is then at its highest). */
  readonly peak: {
    readonly vo2MlMin: number;
    readonly vco2MlMin: number;
    readonly rer: number;
    readonly veLMin: number;
    readonly hrBpm: number;
    readonly workW: number | null;
    readonly speedKmh: number | null;
    readonly gradePct: number | null;
  };
  readonly outliers: readonly OutlierTruth[];
  readonly rpe: readonly RpeReading[];
}

export interface GeneratedTest {
  readonly table: BreathTable;
  readonly truth: TestTruth;
}

function round(value: number, decimals: number): number {
  const f = 10 ** decimals;
  return Math.round(value * f) / f;
}

function thresholdTruth(params: TestParams, trajectory: Trajectory, vo2MlMin: number): ThresholdTruth {
  const timeS = firstTimeAtVo2(trajectory, vo2MlMin);
  if (timeS === null) throw new Error(`test-data model: the noise-free VO2 never reaches ${vo2MlMin} mL/min during the incremental phase`);
  const load = loadAt(params.protocol, timeS, trajectory.exerciseEndS);
  return {
    vo2MlMin,
    vco2MlMin: valueAt(trajectory.vco2MlMin, timeS),
    timeS,
    workW: load.workW,
    speedKmh: load.speedKmh,
    gradePct: load.gradePct,
    hrBpm: valueAt(trajectory.hrBpm, timeS),
  };
}

/** Breath end times: each breath lasts 60 / RR(t) s, jittered. Returns times and durations. */
function breathTimes(params: TestParams, trajectory: Trajectory, random: Random): { times: number[]; durations: number[] } {
  const normal = normalRandom(random);
  const veRest = trajectory.veLMin[0];
  const vtRest = veRest / params.rrRestPerMin;
  const times: number[] = [];
  const durations: number[] = [];
  let t = 0;
  for (;;) {
    const ve = valueAt(trajectory.veLMin, t);
    const rr = ve / tidalVolumeL(ve, veRest, vtRest, params.vtMaxL, params.vtScaleLMin);
    // A breath cannot last less than 40 % of its expected duration.
    const duration = (60 / rr) * Math.max(0.4, 1 + params.noise.breathDurationSd * normal());
    t += duration;
    if (t > trajectory.recoveryEndS) break;
    times.push(t);
    durations.push(duration);
  }
  return { times, durations };
}

function pickOutliers(count: number, times: readonly number[], exerciseEndS: number, random: Random): OutlierTruth[] {
  const last = times.findIndex((t) => t > exerciseEndS) - OUTLIER_SPACING;
  const chosen: OutlierTruth[] = [];
  // Bounded tries keep a crowded request from looping for ever; fewer outliers are then placed.
  for (let attempt = 0; chosen.length < count && attempt < count * 100; attempt++) {
    const index = OUTLIER_SPACING + Math.floor(random() * Math.max(0, last - OUTLIER_SPACING));
    if (index >= last || chosen.some((o) => Math.abs(o.index - index) < OUTLIER_SPACING)) continue;
    chosen.push({ index, timeS: round(times[index], 2), kind: OUTLIER_KINDS[Math.floor(random() * OUTLIER_KINDS.length)] });
  }
  return chosen.sort((a, b) => a.index - b.index);
}

function rpeReadings(params: TestParams, trajectory: Trajectory, times: readonly number[]): RpeReading[] {
  if (params.rpe === null) return [];
  const { peakBorg, intervalS } = params.rpe;
  const end = trajectory.exerciseEndS;
  const nominal: number[] = [];
  for (let t = trajectory.incrementalStartS + intervalS; t < end - intervalS / 2; t += intervalS) nominal.push(t);
  nominal.push(end);
  const vo2End = valueAt(trajectory.vo2MlMin, end);
  const readings: RpeReading[] = [];
  for (const t of nominal) {
    // The breath at or just before the nominal time, so the rating sits on a recorded breath.
    let k = 0;
    while (k + 1 < times.length && times[k + 1] <= t) k++;
    const f = (valueAt(trajectory.vo2MlMin, times[k]) - trajectory.vo2RestMlMin) / (vo2End - trajectory.vo2RestMlMin);
    const borg = Math.min(20, Math.max(6, Math.round(6 + (peakBorg - 6) * f)));
    const timeS = round(times[k], 2);
    if (readings.length === 0 || readings[readings.length - 1].timeS !== timeS) readings.push({ timeS, borg });
  }
  return readings;
}

/** One test from the model. Throws only when the parameters contradict themselves. */
export function generateTest(params: TestParams, seed: number): GeneratedTest {
  const trajectory = modelTrajectory(params);
  const random = seededRandom(seed);
  const { times, durations } = breathTimes(params, trajectory, random);
  const n = times.length;
  const noise = params.noise;
  const shared = ar1Series(n, noise.ar1, random);
  const vo2Noise = ar1Series(n, noise.ar1, random);
  const vco2Noise = ar1Series(n, noise.ar1, random);
  const veNoise = ar1Series(n, noise.ar1, random);
  const hrNoise = ar1Series(n, noise.hrAr1, random);
  const peto2Noise = ar1Series(n, noise.endTidalAr1, random);
  const petco2Noise = ar1Series(n, noise.endTidalAr1, random);
  const outliers = params.outlierBreaths > 0 ? pickOutliers(params.outlierBreaths, times, trajectory.exerciseEndS, random) : [];
  const outlierAt = new Map(outliers.map((o) => [o.index, OUTLIER_EFFECTS[o.kind]]));
  const gasSd = (value: number) => Math.sqrt(noise.gasAbsSdMlMin ** 2 + (noise.gasRelSd * value) ** 2);

  const breaths: Breath[] = [];
  for (let k = 0; k < n; k++) {
    const t = times[k];
    const size = 1 + noise.breathSizeSd * shared[k];
    const effect = outlierAt.get(k) ?? { ve: 1, vo2: 1, vco2: 1, peto2: 0, petco2: 0 };
    const vo2 = valueAt(trajectory.vo2MlMin, t);
    const vco2 = valueAt(trajectory.vco2MlMin, t);
    const ve = valueAt(trajectory.veLMin, t) * size * (1 + noise.veRelSd * veNoise[k]) * effect.ve;
    const rr = 60 / durations[k];
    const load = loadAt(params.protocol, t, trajectory.exerciseEndS);
    breaths.push(
      breath({
        timeS: round(t, 2),
        vo2MlMin: round((vo2 * size + gasSd(vo2) * vo2Noise[k]) * effect.vo2, 0),
        vco2MlMin: round((vco2 * size + gasSd(vco2) * vco2Noise[k]) * effect.vco2, 0),
        veLMin: round(ve, 2),
        hrBpm: round(valueAt(trajectory.hrBpm, t) + noise.hrSdBpm * hrNoise[k], 0),
        workW: load.workW === null ? null : round(load.workW, 0),
        speedKmh: load.speedKmh === null ? null : round(load.speedKmh, 1),
        gradePct: load.gradePct === null ? null : round(load.gradePct, 1),
        peto2Mmhg: round(valueAt(trajectory.pao2Mmhg, t) + noise.peto2SdMmhg * peto2Noise[k] + effect.peto2, 1),
        petco2Mmhg: round(valueAt(trajectory.paco2Mmhg, t) + noise.petco2SdMmhg * petco2Noise[k] + effect.petco2, 1),
        rrPerMin: round(rr, 1),
        vtL: round(ve / rr, 3),
      }),
    );
  }

  const s = params.subject;
  const end = trajectory.exerciseEndS;
  // The load just before the subject stopped is the peak load.
  const peakLoad = loadAt(params.protocol, end - 1e-6, end);
  const vo2End = valueAt(trajectory.vo2MlMin, end);
  const vco2End = valueAt(trajectory.vco2MlMin, end);
  const table: BreathTable = {
    metadata: {
      subjectId: s.subjectId,
      ageY: s.ageY,
      sex: s.sex,
      heightCm: s.heightCm,
      weightKg: s.weightKg,
      testStart: params.testStart,
      modality: params.protocol.kind === 'treadmill-steps' ? 'treadmill' : 'cycle',
      protocol: params.protocolLabel,
      barometricMmhg: params.barometricMmhg,
      extra: { ...params.extraMetadata },
    },
    breaths,
    rpe: rpeReadings(params, trajectory, times),
    sourceName: params.name,
  };
  const truth: TestTruth = {
    modelVersion: MODEL_VERSION,
    seed,
    params,
    vt1: thresholdTruth(params, trajectory, params.vt1Vo2MlMin),
    vt2: thresholdTruth(params, trajectory, params.vt2Vo2MlMin),
    phases: {
      restEndS: params.protocol.restS,
      incrementalStartS: trajectory.incrementalStartS,
      exerciseEndS: end,
      recoveryEndS: trajectory.recoveryEndS,
    },
    peak: {
      vo2MlMin: vo2End,
      vco2MlMin: vco2End,
      rer: vco2End / vo2End,
      veLMin: valueAt(trajectory.veLMin, end),
      hrBpm: valueAt(trajectory.hrBpm, end),
      workW: peakLoad.workW,
      speedKmh: peakLoad.speedKmh,
      gradePct: peakLoad.gradePct,
    },
    outliers,
    rpe: table.rpe,
  };
  return { table, truth };
}
