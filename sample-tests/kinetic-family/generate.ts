/**
 * Family B generator: one breath-by-breath test with its ground truth, from a noise-free
 * course (course.ts) sampled at realistic breath times, with correlated breath-size noise,
 * independent measurement noise, slow drift and outlier breaths (sighs, swallows, coughs).
 *
 * Truth (see README.md): VT1 and VT2 are the moments at which the CO2-side metabolic rate
 * crosses the centre of the buffering term and of the respiratory-compensation term. There the
 * asymptotes of the noise-free VCO2-vs-VO2 curve (VT1) and of the PetCO2 and VE-vs-VCO2 curves
 * (VT2) cross, which is where a reader places the break on the V-slope and ventilatory plots.
 * Each threshold is reported in recorded terms: noise-free VO2, VCO2, HR and load at that moment.
 */
import { breath, emptyMetadata, type Breath, type BreathTable, type RpeReading } from '../../core/model/breath-table';
import { normalRandom, seededRandom } from '../../core/math/random';
import { courseAt, firstCrossingS, simulateCourse, type Course } from './course';
import type { KineticParams } from './model';

export const KINETIC_MODEL_VERSION = 'family-b-kinetic/1';

export type OutlierKind = 'sigh' | 'swallow' | 'cough';

export interface ThresholdTruth {
  readonly vo2MlMin: number;
  readonly vco2MlMin: number;
  readonly timeS: number;
  readonly workW: number | null;
  readonly speedKmh: number | null;
  readonly gradePct: number | null;
  readonly hrBpm: number;
  /** The model's metabolic-rate parameter (centre of the softplus), mL/min. */
  readonly metabolicVo2MlMin: number;
}

export interface KineticTruth {
  readonly modelVersion: string;
  readonly seed: number;
  readonly vt1: ThresholdTruth;
  readonly vt2: ThresholdTruth;
  /** Noise-free values at the end of the incremental phase. */
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
  readonly phases: {
    readonly restEndS: number;
    readonly incrementalStartS: number;
    readonly exerciseEndS: number;
    readonly recoveryEndS: number;
  };
  readonly outliers: readonly { readonly index: number; readonly timeS: number; readonly kind: OutlierKind }[];
  readonly params: KineticParams;
}

export interface KineticTest {
  readonly table: BreathTable;
  readonly truth: KineticTruth;
}

function thresholdTruth(course: Course, metabolicMlMin: number, name: string): ThresholdTruth {
  const t = firstCrossingS(course, metabolicMlMin);
  if (t === null) {
    throw new Error(`Family B generator: ${name} (${metabolicMlMin.toFixed(0)} mL/min) is not crossed during the incremental phase; choose it between the warm-up and the peak.`);
  }
  const at = courseAt(course, t);
  return {
    vo2MlMin: at.vo2MlMin,
    vco2MlMin: at.vco2MlMin,
    timeS: t,
    workW: at.workW,
    speedKmh: at.speedKmh,
    gradePct: at.gradePct,
    hrBpm: at.hrBpm,
    metabolicVo2MlMin: metabolicMlMin,
  };
}

/** The truth of a parameter set without generating breaths (used by the grid to vet subjects). */
export function kineticTruthOf(p: KineticParams, seed: number, course: Course = simulateCourse(p)): Omit<KineticTruth, 'outliers'> {
  const end = courseAt(course, course.exerciseEndS);
  return {
    modelVersion: KINETIC_MODEL_VERSION,
    seed,
    vt1: thresholdTruth(course, p.vt1Vo2MlMin, 'VT1'),
    vt2: thresholdTruth(course, p.vt2Vo2MlMin, 'VT2'),
    peak: {
      vo2MlMin: end.vo2MlMin,
      vco2MlMin: end.vco2MlMin,
      rer: end.vco2MlMin / end.vo2MlMin,
      veLMin: end.veLMin,
      hrBpm: end.hrBpm,
      workW: end.workW,
      speedKmh: end.speedKmh,
      gradePct: end.gradePct,
    },
    phases: {
      restEndS: course.restEndS,
      incrementalStartS: course.incrementalStartS,
      exerciseEndS: course.exerciseEndS,
      recoveryEndS: course.recoveryEndS,
    },
    params: p,
  };
}

/**
 * Breathing frequency, breaths/min, rising with ventilation from ~13/min at rest to ~42/min at
 * peak (textbook ranges, memory); tidal volume follows as VE / f.
 */
function breathingRate(veLMin: number, veRest: number, vePeak: number): number {
  const x = Math.min(1, Math.max(0, (veLMin - veRest) / Math.max(1, vePeak - veRest)));
  return 13 + 29 * Math.pow(x, 1.4);
}

/**
 * Generates one test. Same params and seed → identical table and truth.
 *
 * @example
 *   const { table, truth } = generateKineticTest(kineticCases('main', 1, 5000)[0].params, 5000);
 */
export function generateKineticTest(p: KineticParams, seed: number): KineticTest {
  const course = simulateCourse(p);
  const base = kineticTruthOf(p, seed, course);
  const random = seededRandom(seed);
  const normal = normalRandom(random);
  const n = p.noise;
  const sc = n.scale;
  const veRest = course.points[0].veLMin;
  const vePeak = base.peak.veLMin;

  // Slow drift: two sinusoids with periods of 4–12 min and random phases.
  const drift = (amp: number) => {
    const p1 = 240 + 480 * random();
    const p2 = 240 + 480 * random();
    const f1 = 2 * Math.PI * random();
    const f2 = 2 * Math.PI * random();
    return (t: number) => amp * sc * (0.7 * Math.sin((2 * Math.PI * t) / p1 + f1) + 0.3 * Math.sin((2 * Math.PI * t) / p2 + f2));
  };
  const flowDrift = drift(n.flowDriftAmp);
  const o2Drift = drift(n.o2DriftAmp);
  const rateFactor = 0.9 + 0.2 * random();

  const breaths: Breath[] = [];
  let t = 1 + 2 * random();
  let size = 0;
  const rho = n.breathSizeRho;
  while (t <= course.recoveryEndS) {
    const c = courseAt(course, t);
    size = rho * size + Math.sqrt(1 - rho * rho) * normal();
    const depth = 1 + n.breathSizeSd * sc * size;
    const flow = 1 + flowDrift(t);
    const rr = breathingRate(c.veLMin, veRest, vePeak) * rateFactor;
    const ve = c.veLMin * depth * flow * (1 + n.veRelSd * sc * normal());
    breaths.push(
      breath({
        timeS: round(t, 2),
        vo2MlMin: round(c.vo2MlMin * depth * flow * (1 + o2Drift(t)) + n.vo2SdMlMin * sc * normal(), 1),
        vco2MlMin: round(c.vco2MlMin * depth * flow + n.vco2SdMlMin * sc * normal(), 1),
        veLMin: round(ve, 2),
        hrBpm: Math.round(c.hrBpm + n.hrSdBpm * sc * normal()),
        workW: c.workW === null ? null : round(c.workW, 1),
        speedKmh: c.speedKmh === null ? null : round(c.speedKmh, 2),
        gradePct: c.gradePct === null ? null : round(c.gradePct, 2),
        peto2Mmhg: round(c.peto2Mmhg + n.peto2SdMmhg * sc * normal(), 1),
        petco2Mmhg: round(c.petco2Mmhg + n.petco2SdMmhg * sc * normal(), 1),
        rrPerMin: round(rr, 1),
        vtL: round(ve / rr, 3),
      }),
    );
    t += (60 / rr) * Math.exp(n.breathDurationSd * normal() - (n.breathDurationSd * n.breathDurationSd) / 2);
  }

  const outliers = placeOutliers(breaths, p.outlierCount, random);
  const table: BreathTable = {
    metadata: {
      ...emptyMetadata(),
      subjectId: `B-${seed}`,
      ageY: p.ageY,
      sex: p.sex,
      heightCm: p.heightCm,
      weightKg: p.weightKg,
      modality: p.protocol.kind,
      protocol:
        p.protocol.kind === 'cycle'
          ? `cycle ramp ${p.protocol.rampWPerMin} W/min`
          : `treadmill ramp +${p.protocol.speedKmhPerMin.toFixed(2)} km/h and +${p.protocol.gradePctPerMin.toFixed(2)} % per min`,
      barometricMmhg: p.barometricMmhg,
      extra: { generator: KINETIC_MODEL_VERSION, seed: String(seed) },
    },
    breaths,
    rpe: rpeReadings(base.phases.incrementalStartS, base.phases.exerciseEndS),
    sourceName: `family-b-seed-${seed}`,
  };
  return { table, truth: { ...base, outliers } };
}

function round(x: number, digits: number): number {
  const f = 10 ** digits;
  return Math.round(x * f) / f;
}

/**
 * Outlier breaths at distinct random indices (never in the first or last 10 breaths):
 * a sigh (deep breath: VE ×2–2.6, VCO2 ×1.7–2.3, VO2 ×1.5–2, PetCO2 lower, PetO2 higher),
 * a swallow (interrupted breath: VE, VO2, VCO2 ×0.25–0.5) or a cough (VE ×1.6–2.2,
 * VCO2 ×1.4–1.9, VO2 ×1.1–1.4). Magnitudes are plausible choices (memory), not measured.
 */
function placeOutliers(breaths: Breath[], count: number, random: () => number): KineticTruth['outliers'] {
  const out: { index: number; timeS: number; kind: OutlierKind }[] = [];
  const used = new Set<number>();
  const kinds: OutlierKind[] = ['sigh', 'swallow', 'cough'];
  const span = breaths.length - 20;
  if (span <= 0) return out;
  while (out.length < Math.min(count, span)) {
    const index = 10 + Math.floor(random() * span);
    if (used.has(index)) continue;
    used.add(index);
    const kind = kinds[Math.floor(random() * 3)];
    const b = breaths[index];
    const u = (lo: number, hi: number) => lo + (hi - lo) * random();
    let f: { ve: number; vo2: number; vco2: number; dCo2: number; dO2: number };
    if (kind === 'sigh') f = { ve: u(2, 2.6), vo2: u(1.5, 2), vco2: u(1.7, 2.3), dCo2: -u(2, 4), dO2: u(3, 6) };
    else if (kind === 'swallow') {
      const s = u(0.25, 0.5);
      f = { ve: s, vo2: s * u(0.9, 1.1), vco2: s * u(0.9, 1.1), dCo2: 0, dO2: 0 };
    } else f = { ve: u(1.6, 2.2), vo2: u(1.1, 1.4), vco2: u(1.4, 1.9), dCo2: -u(1, 2), dO2: u(1, 3) };
    breaths[index] = {
      ...b,
      veLMin: round(b.veLMin * f.ve, 2),
      vo2MlMin: round(b.vo2MlMin * f.vo2, 1),
      vco2MlMin: round(b.vco2MlMin * f.vco2, 1),
      vtL: b.vtL === null ? null : round(b.vtL * f.ve, 3),
      petco2Mmhg: b.petco2Mmhg === null ? null : round(b.petco2Mmhg + f.dCo2, 1),
      peto2Mmhg: b.peto2Mmhg === null ? null : round(b.peto2Mmhg + f.dO2, 1),
    };
    out.push({ index, timeS: b.timeS, kind });
  }
  return out.sort((a, b) => a.index - b.index);
}

/** Borg 6–20 each minute of the incremental phase, rising to 18 at exhaustion (common practice). */
function rpeReadings(incStart: number, exEnd: number): RpeReading[] {
  const out: RpeReading[] = [];
  const dur = exEnd - incStart;
  for (let t = incStart + 60; t < exEnd; t += 60) {
    out.push({ timeS: Math.round(t), borg: Math.round(7 + 11 * Math.pow((t - incStart) / dur, 1.3)) });
  }
  out.push({ timeS: Math.round(exEnd), borg: 18 });
  return out;
}
