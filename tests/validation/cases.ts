/**
 * The generated tests of the accuracy validation: a fixed grid of conditions, each with its
 * own seeds. Subject values are drawn per seed within stated physiological ranges, so the
 * detectors meet many thresholds rather than one: peak VO2 1,600–3,200 mL/min, VT1 at 45–65 %
 * of peak and VT2 at 75–88 % (textbook ranges, memory; check-values.md). The generator itself
 * (sample-tests/generator) is used as its author wrote it; only its documented parameters are set.
 */
import { DEFAULT_NOISE, defaultCycleParams, defaultTreadmillParams, type TestParams } from '../../sample-tests/generator';
import { seededRandom } from '../../core/math/random';

export interface ValidationCase {
  readonly label: string;
  readonly modality: 'cycle' | 'treadmill';
  readonly rampWPerMin: number | null;
  readonly noiseScale: number;
  readonly outliers: number;
  readonly seed: number;
  readonly params: TestParams;
}

const NOISE_SCALES = [0.5, 1, 1.5];
const RAMPS = [10, 20, 30];

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

function subject(base: TestParams, seed: number): Pick<TestParams, 'vo2PeakMlMin' | 'vt1Vo2MlMin' | 'vt2Vo2MlMin'> {
  const r = seededRandom(seed * 7919 + 17);
  const peak = 1600 + 1600 * r();
  return {
    vo2PeakMlMin: Math.round(peak),
    vt1Vo2MlMin: Math.round(peak * (0.45 + 0.2 * r())),
    vt2Vo2MlMin: Math.round(peak * (0.75 + 0.13 * r())),
  };
}

/** First seed of the held-out validation set; tuning uses DEVELOPMENT_FIRST_SEED instead. */
export const VALIDATION_FIRST_SEED = 1;
/** First seed of the development set: the same conditions, other subjects and noise. */
export const DEVELOPMENT_FIRST_SEED = 5000;

/** Every condition × seedsPerCondition tests, seeds counting up from `firstSeed`. */
export function validationCases(seedsPerCondition: number, firstSeed = VALIDATION_FIRST_SEED): ValidationCase[] {
  const cases: ValidationCase[] = [];
  let seed = firstSeed;
  for (const noiseScale of NOISE_SCALES) {
    for (const outliers of [0, 15]) {
      const conditions: { modality: 'cycle' | 'treadmill'; ramp: number | null }[] = [
        ...RAMPS.map((ramp) => ({ modality: 'cycle' as const, ramp })),
        { modality: 'treadmill', ramp: null },
      ];
      for (const c of conditions) {
        for (let k = 0; k < seedsPerCondition; k++, seed++) {
          const base = c.modality === 'cycle' ? defaultCycleParams() : defaultTreadmillParams();
          const protocol = c.modality === 'cycle' && base.protocol.kind === 'cycle-ramp' ? { ...base.protocol, rampWPerMin: c.ramp ?? 15 } : base.protocol;
          const params: TestParams = {
            ...base,
            ...subject(base, seed),
            protocol,
            protocolLabel: c.modality === 'cycle' ? `cycle ramp ${c.ramp} W/min` : base.protocolLabel,
            noise: scaledNoise(noiseScale),
            outlierBreaths: outliers,
          };
          cases.push({
            label: `${c.modality}${c.ramp ? ` ${c.ramp} W/min` : ''}, noise ×${noiseScale}, ${outliers ? 'outliers' : 'clean'}`,
            modality: c.modality,
            rampWPerMin: c.ramp,
            noiseScale,
            outliers,
            seed,
            params,
          });
        }
      }
    }
  }
  return cases;
}
