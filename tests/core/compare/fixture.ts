/**
 * Hand-built TestAnalysis objects for the comparison tests. The series is a noise-free ramp
 * whose values are exact linear functions, so values at any workload can be worked by hand:
 *   work W   = rampWPerMin · (t − 180) / 60 on the ramp (t from 180 s to endS), 0 before,
 *   VO2      = vo2RestMlMin + slopeMlMinW · W        (ΔVO2/ΔWR ≈ 10 mL/min/W, memory)
 *   VCO2     = 0.9 · VO2,  VE (L/min) = 0.03 · VCO2 (mL/min)  → VE/VCO2 = 30, RER = 0.9
 *   HR       = 70 + 0.5 · W
 * one point every 5 s; recovery (load back to 0) for 120 s after the ramp.
 */
import type { TestAnalysis, ThresholdResult, ValuesAt, EffortVerdict } from '../../../core/model/analysis';
import { DEFAULT_SETTINGS } from '../../../core/model/settings';
import type { TestMetadata } from '../../../core/model/breath-table';

export interface FixtureOptions {
  readonly sourceName?: string;
  readonly metadata?: Partial<TestMetadata>;
  /** No per-fixture VCO2 offset (for tests that read the series to 12 digits). */
  readonly exactSeries?: boolean;
  readonly rampWPerMin?: number;
  readonly endS?: number;
  readonly vo2RestMlMin?: number;
  readonly slopeMlMinW?: number;
  readonly vt1?: Partial<ValuesAt> | null;
  readonly vt2?: Partial<ValuesAt> | null;
  readonly peak?: Partial<TestAnalysis['peak']>;
  readonly derived?: Partial<TestAnalysis['derived']>;
  readonly effort?: EffortVerdict;
  readonly noWork?: boolean;
}

function threshold(id: 'vt1' | 'vt2', at: Partial<ValuesAt> | null | undefined): ThresholdResult {
  if (at === null) {
    return { id, methods: [], at: null, ci95Vo2MlMin: null, ci95TimeS: null, spreadVo2MlMin: null, methodsDisagree: false, reason: 'no method found a breakpoint' };
  }
  const full: ValuesAt = {
    timeS: 600,
    vo2MlMin: 1500,
    vo2MlKgMin: 20,
    vco2MlMin: 1400,
    workW: 100,
    hrBpm: 120,
    veLMin: 40,
    rer: 1400 / 1500,
    pctPeakVo2: 60,
    pctPredictedPeakVo2: null,
    ...at,
  };
  return { id, methods: [], at: full, ci95Vo2MlMin: null, ci95TimeS: null, spreadVo2MlMin: 0, methodsDisagree: false, reason: null };
}

let fixtureCount = 0;

export function buildAnalysis(options: FixtureOptions = {}): TestAnalysis {
  fixtureCount++;
  const ramp = options.rampWPerMin ?? 15;
  const startS = 180;
  const endS = options.endS ?? 900;
  const vo2Rest = options.vo2RestMlMin ?? 500;
  const slope = options.slopeMlMinW ?? 10;
  const series = { timeS: [] as number[], vo2MlMin: [] as number[], vco2MlMin: [] as number[], veLMin: [] as number[], hrBpm: [] as (number | null)[], workW: [] as (number | null)[], peto2Mmhg: [] as (number | null)[], petco2Mmhg: [] as (number | null)[] };
  for (let t = 0; t <= endS + 120; t += 5) {
    const onRamp = t >= startS && t <= endS;
    const w = onRamp ? (ramp * (t - startS)) / 60 : 0;
    // A per-fixture offset of VCO2 (µL/min) keeps two fixtures from being the same breath series
    // (which the comparison refuses, core/compare/refusals.ts) without changing any worked value.
    const vo2 = vo2Rest + slope * w;
    series.timeS.push(t);
    series.vo2MlMin.push(vo2);
    series.vco2MlMin.push(0.9 * vo2 + (options.exactSeries ? 0 : fixtureCount * 1e-6));
    series.veLMin.push(0.03 * 0.9 * vo2);
    series.hrBpm.push(70 + 0.5 * w);
    series.workW.push(options.noWork ? null : w);
    series.peto2Mmhg.push(null);
    series.petco2Mmhg.push(null);
  }
  const metadata: TestMetadata = {
    subjectId: 'S-01',
    ageY: 40,
    sex: 'F',
    heightCm: 165,
    weightKg: 70,
    testStart: '2026-03-02T09:00:00Z',
    modality: 'cycle',
    protocol: 'ramp 15 W/min',
    barometricMmhg: 760,
    extra: {},
    ...options.metadata,
  };
  return {
    sourceName: options.sourceName ?? 'fixture.csv',
    metadata,
    clinical: { peakRpe: 19, lactateMmolL: null, fev1L: null, mvvLMin: null, restingHrBpm: null },
    series,
    phases: {
      phases: [
        { name: 'rest', startS: 0, endS: startS },
        { name: 'incremental', startS, endS },
        { name: 'recovery', startS: endS, endS: endS + 120 },
      ],
      incrementalStartS: startS,
      incrementalEndS: endS,
      rampWPerMin: options.noWork ? null : ramp,
      source: 'detected',
    },
    removedBreaths: [],
    vt1: threshold('vt1', options.vt1),
    vt2: threshold('vt2', options.vt2 === undefined ? { timeS: 780, vo2MlMin: 2200, workW: 150, hrBpm: 150, veLMin: 66, vco2MlMin: 2200 } : options.vt2),
    peak: {
      vo2MlMin: 2500,
      vo2MlKgMin: 2500 / 70,
      vco2MlMin: 2900,
      veLMin: 90,
      rer: 1.16,
      hrBpm: 175,
      o2PulseMlBeat: 2500 / 175,
      workW: 180,
      mets: 2500 / 70 / 3.5,
      exerciseDurationS: 720,
      ...options.peak,
    },
    derived: { veVco2Slope: 28, oues: 2000, dVo2dWrMlMinW: 10, breathingReserveLMin: null, breathingReservePct: null, hrReserveBpm: null, weberClass: 'A', ...options.derived },
    predicted: { hrMaxBpm: 180, friendVo2MlKgMin: null, hansenVo2MlMin: null, pctPredictedFriend: null, pctPredictedHansen: null },
    effort: { verdict: options.effort ?? 'maximal', combination: '', criteria: [], reasons: [] },
    warnings: [],
    provenance: { software: 'Twofold', softwareVersion: '0.1.0', settings: DEFAULT_SETTINGS },
  };
}
