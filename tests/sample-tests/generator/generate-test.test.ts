// generateTest against the model it states (sample-tests/generator/generate-test.ts): breath
// timing, noise size after Lamarra et al. (J Appl Physiol 1987; a few % to ~10 %, memory),
// outliers far off their neighbours, Borg 6–20 ratings (Borg 1982), and determinism.
import { describe, expect, test } from 'vitest';
import { linearFit } from '../../../core/math/linear-fit';
import { median } from '../../../core/math/stats';
import { generateTest } from '../../../sample-tests/generator/generate-test';
import { DEFAULT_NOISE, defaultCycleParams, type NoiseParams, type TestParams } from '../../../sample-tests/generator/params';
import { modelTrajectory, valueAt } from '../../../sample-tests/generator/trajectory';

const SILENT: NoiseParams = { ...DEFAULT_NOISE, breathSizeSd: 0, gasAbsSdMlMin: 0, gasRelSd: 0, veRelSd: 0, breathDurationSd: 0, hrSdBpm: 0, peto2SdMmhg: 0, petco2SdMmhg: 0 };

describe('determinism', () => {
  test('the same parameters and seed give the same table, value for value', () => {
    const a = generateTest({ ...defaultCycleParams(), outlierBreaths: 3 }, 7);
    const b = generateTest({ ...defaultCycleParams(), outlierBreaths: 3 }, 7);
    expect(JSON.stringify(b)).toBe(JSON.stringify(a));
  });

  test('another seed gives other noise but the same truth thresholds', () => {
    const a = generateTest(defaultCycleParams(), 7);
    const b = generateTest(defaultCycleParams(), 8);
    expect(b.table.breaths[10].vo2MlMin).not.toBe(a.table.breaths[10].vo2MlMin);
    expect(b.truth.vt1).toEqual(a.truth.vt1);
    expect(b.truth.seed).toBe(8);
  });
});

describe('breaths', () => {
  const { table, truth } = generateTest(defaultCycleParams(), 11);
  const b = table.breaths;

  test('rows are per breath: times rise, each breath lasting 60 / RR s', () => {
    // RR is defined as 60 / breath duration; rounding to 0.1 /min and 0.01 s bounds the mismatch.
    for (let k = 1; k < b.length; k++) {
      expect(b[k].timeS).toBeGreaterThan(b[k - 1].timeS);
      expect(60 / (b[k].rrPerMin ?? 0)).toBeCloseTo(b[k].timeS - b[k - 1].timeS, 0);
    }
  });

  test('tidal volume × breathing rate equals VE (VT = VE / RR)', () => {
    for (const x of b) expect((x.vtL ?? 0) * (x.rrPerMin ?? 0)).toBeCloseTo(x.veLMin, 0);
  });

  test('breath-to-breath VO2 noise is near 10 % at rest and near 5 % close to peak', () => {
    // Lamarra et al. 1987 (memory: a few % to ~10 %, larger at rest). The model's SD is
    // √(25² + (0.045·v)²) independent plus 4 % shared: rest 238 → √(0.105² + 0.04²) ≈ 11 %;
    // 1900 → √(0.0563² + 0.04²) ≈ 7 % (worked by hand). Checked within 7–16 % and 4.5–10 %.
    const tr = modelTrajectory(defaultCycleParams());
    const rel = (from: number, to: number) => {
      const r = b.filter((x) => x.timeS >= from && x.timeS < to).map((x) => x.vo2MlMin / valueAt(tr.vo2MlMin, x.timeS) - 1);
      return Math.sqrt(r.reduce((s, v) => s + v * v, 0) / r.length);
    };
    const atRest = rel(0, 180);
    expect(atRest).toBeGreaterThan(0.07);
    expect(atRest).toBeLessThan(0.16);
    const nearPeak = rel(truth.phases.exerciseEndS - 120, truth.phases.exerciseEndS);
    expect(nearPeak).toBeGreaterThan(0.045);
    expect(nearPeak).toBeLessThan(0.1);
  });

  test('work follows the ramp and the metadata describes the subject', () => {
    // Ramp 15 W/min from 360 s: at 660 s, 15 × 300 / 60 = 75 W (worked by hand).
    const near = b.reduce((best, x) => (Math.abs(x.timeS - 660) < Math.abs(best.timeS - 660) ? x : best));
    expect(near.workW).toBeCloseTo((15 * (near.timeS - 360)) / 60, -0.5);
    expect(table.metadata).toMatchObject({ subjectId: 'GEN-0001', ageY: 40, sex: 'F', modality: 'cycle', barometricMmhg: 760 });
    expect(b.every((x) => x.speedKmh === null && x.gradePct === null)).toBe(true);
  });

  test('RPE readings are Borg 6–20, rising, the last at the end of exercise with the stated peak', () => {
    // Borg 1982 scale bounds; peak rating 18 from the defaults.
    const r = table.rpe;
    expect(r.length).toBeGreaterThanOrEqual(3);
    for (let i = 1; i < r.length; i++) expect(r[i].borg).toBeGreaterThanOrEqual(r[i - 1].borg);
    expect(r.every((x) => x.borg >= 6 && x.borg <= 20)).toBe(true);
    expect(r[r.length - 1].borg).toBe(18);
    expect(truth.phases.exerciseEndS - r[r.length - 1].timeS).toBeLessThan(5);
    expect(r.every((x) => b.some((y) => y.timeS === x.timeS))).toBe(true);
  });
});

describe('outliers', () => {
  const params: TestParams = { ...defaultCycleParams(), outlierBreaths: 5 };
  const { table, truth } = generateTest(params, 21);

  test('the truth lists the requested number of isolated outlier breaths', () => {
    expect(truth.outliers).toHaveLength(5);
    for (let i = 1; i < truth.outliers.length; i++) expect(truth.outliers[i].index - truth.outliers[i - 1].index).toBeGreaterThanOrEqual(6);
    for (const o of truth.outliers) expect(table.breaths[o.index].timeS).toBe(o.timeS);
  });

  test('each outlier breath is far off its neighbours in VE and VO2', () => {
    // A cough or sigh at least doubles VE (×2.2–2.5), a swallow cuts it to about a third (×0.35);
    // neighbours vary by ~10 %, so the ratio to the neighbours' median lies beyond 1.6 or below 0.55.
    for (const o of truth.outliers) {
      const around = table.breaths.slice(o.index - 4, o.index + 5).filter((_, j) => j !== 4);
      const ratioVe = table.breaths[o.index].veLMin / median(around.map((x) => x.veLMin));
      const ratioVo2 = table.breaths[o.index].vo2MlMin / median(around.map((x) => x.vo2MlMin));
      if (o.kind === 'swallow') {
        expect(ratioVe).toBeLessThan(0.55);
        expect(ratioVo2).toBeLessThan(0.55);
      } else {
        expect(ratioVe).toBeGreaterThan(1.6);
        expect(ratioVo2).toBeGreaterThan(1.4);
      }
    }
  });

  test('no outliers unless asked', () => {
    expect(generateTest(defaultCycleParams(), 21).truth.outliers).toHaveLength(0);
  });
});

describe('without noise the breaths lie on the model', () => {
  const params: TestParams = { ...defaultCycleParams(), noise: SILENT, vco2SlopeBelowVt1: 0.88, vco2SlopeAboveVt1: 1.33 };
  const { table, truth } = generateTest(params, 1);

  test('VCO2-on-VO2 slopes of the breaths equal the parameters (within rounding to 1 mL/min)', () => {
    const inc = table.breaths.filter((x) => x.timeS > truth.phases.incrementalStartS && x.timeS < truth.phases.exerciseEndS);
    const below = inc.filter((x) => x.vo2MlMin < params.vt1Vo2MlMin - 10);
    const above = inc.filter((x) => x.vo2MlMin > params.vt1Vo2MlMin + 10);
    expect(linearFit(below.map((x) => x.vo2MlMin), below.map((x) => x.vco2MlMin))?.slope).toBeCloseTo(0.88, 2);
    expect(linearFit(above.map((x) => x.vo2MlMin), above.map((x) => x.vco2MlMin))?.slope).toBeCloseTo(1.33, 2);
  });

  test('breaths are evenly spaced at rest: 60 / 12 = 5 s at the resting breathing rate', () => {
    // rrRestPerMin 12 (defaults) and no duration jitter.
    expect(table.breaths[1].timeS - table.breaths[0].timeS).toBeCloseTo(5, 1);
  });
});
