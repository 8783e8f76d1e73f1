// End-to-end analysis of tests generated from the stated physiological model in
// sample-tests/generator (known VT1, VT2, phases, outliers and peak). Tolerances are ours,
// stated per assertion; the generator and the analysis were written by different people.
import { describe, expect, it } from 'vitest';
import { defaultCycleParams, defaultTreadmillParams, generateTest } from '../../../sample-tests/generator';
import { analyzeTest, noClinicalInputs } from '../../../core/analyze/analyze-test';
import { summaryJson } from '../../../core/analyze/summary-json';
import { DEFAULT_SETTINGS } from '../../../core/model/settings';
import { SOFTWARE_VERSION } from '../../../core/version';

const cycle = generateTest({ ...defaultCycleParams(), outlierBreaths: 8 }, 11);
const analysis = analyzeTest(cycle.table, DEFAULT_SETTINGS, noClinicalInputs());
const truth = cycle.truth;

describe('analyzeTest on a generated 15 W/min cycle ramp', () => {
  it('finds VT1 and VT2 within 10 % of the model VO2', () => {
    // Model: VT1 at 1100 mL/min, VT2 at 1650 mL/min (defaultCycleParams).
    expect(Math.abs(analysis.vt1.at!.vo2MlMin - truth.vt1.vo2MlMin) / truth.vt1.vo2MlMin).toBeLessThan(0.1);
    expect(Math.abs(analysis.vt2.at!.vo2MlMin - truth.vt2.vo2MlMin) / truth.vt2.vo2MlMin).toBeLessThan(0.1);
    // Values at VT1 are read off the same series: work follows the 15 W/min ramp from 360 s
    // (work = 0.25 W/s × (t − 360 s)), within 5 W of that line at the estimated time.
    const at = analysis.vt1.at!;
    expect(Math.abs(at.workW! - 0.25 * (at.timeS - 360))).toBeLessThan(5);
    expect(analysis.vt1.ci95Vo2MlMin![0]).toBeLessThan(analysis.vt1.ci95Vo2MlMin![1]);
  });

  it('judges the effort maximal', () => {
    // Model peak RER ≈ 1.14 (≥ 1.10), HR 95 % of predicted, Borg 18.
    expect(analysis.effort.verdict).toBe('maximal');
  });

  it('finds the phases of the protocol', () => {
    // Ramp from 360 s to the end of exercise; breaths are ~2–4 s apart, so within 6 s.
    expect(Math.abs(analysis.phases.incrementalStartS - truth.phases.incrementalStartS)).toBeLessThan(6);
    expect(Math.abs(analysis.phases.incrementalEndS - truth.phases.exerciseEndS)).toBeLessThan(6);
    expect(analysis.phases.rampWPerMin).toBeCloseTo(15, 0);
  });

  it('removes every outlier breath the model inserted, and lists each', () => {
    const removedTimes = new Set(analysis.removedBreaths.map((r) => Math.round(r.timeS * 100) / 100));
    for (const o of truth.outliers) expect(removedTimes.has(o.timeS)).toBe(true);
    expect(analysis.removedBreaths.length).toBeLessThan(0.06 * cycle.table.breaths.length);
  });

  it('measures peaks and derived values near the model', () => {
    // Noise-free VO2 at the end of exercise is 2000 mL/min; a 30 s mean sits a little below.
    expect(analysis.peak.vo2MlMin).toBeGreaterThan(0.93 * truth.peak.vo2MlMin);
    expect(analysis.peak.vo2MlMin).toBeLessThan(1.03 * truth.peak.vo2MlMin);
    // Model gain 10 mL/min/W (cycleGainMlMinW); VE/VCO2 slope below VT2 26 (veSlopeBelowVt2).
    expect(Math.abs(analysis.derived.dVo2dWrMlMinW! - 10)).toBeLessThan(1);
    expect(Math.abs(analysis.derived.veVco2Slope! - 26)).toBeLessThan(1.5);
    // Tanaka: 208 − 0.7 × 40 = 180 bpm.
    expect(analysis.predicted.hrMaxBpm).toBeCloseTo(180, 9);
  });

  it('is deterministic and records its provenance', () => {
    const again = analyzeTest(cycle.table, DEFAULT_SETTINGS, noClinicalInputs());
    expect(again).toEqual(analysis);
    expect(analysis.provenance.softwareVersion).toBe(SOFTWARE_VERSION);
    expect(analysis.provenance.settings).toEqual(DEFAULT_SETTINGS);
  });

  it('produces the JSON summary shape', () => {
    const j = summaryJson(analysis) as Record<string, any>;
    expect(Object.keys(j.vt1)).toEqual(expect.arrayContaining(['time_s', 'vo2_ml_min', 'work_w', 'hr_bpm', 'ci95_vo2_ml_min', 'methods']));
    expect(Object.keys(j.peak)).toEqual(expect.arrayContaining(['vo2_ml_min', 'vo2_ml_kg_min', 'rer', 'hr_bpm', 'work_w', 've_l_min']));
    expect(j.effort.verdict).toBe('maximal');
    expect(j.effort.criteria[0]).toMatchObject({ id: 'peak_rer', threshold: 1.1 });
    expect(Array.isArray(j.warnings)).toBe(true);
    expect(JSON.parse(JSON.stringify(j))).toEqual(j);
  });
});

describe('analyzeTest on other generated tests', () => {
  it('finds the incremental phase of a treadmill step protocol', () => {
    const g = generateTest(defaultTreadmillParams(), 5);
    const a = analyzeTest(g.table, DEFAULT_SETTINGS, noClinicalInputs());
    expect(Math.abs(a.phases.incrementalStartS - g.truth.phases.incrementalStartS)).toBeLessThan(6);
    expect(Math.abs(a.phases.incrementalEndS - g.truth.phases.exerciseEndS)).toBeLessThan(6);
    expect(a.phases.rampWPerMin).toBeNull();
  });

  it('judges a test stopped early submaximal', () => {
    // Stops at 1300 mL/min, just past VT1 (1100) and VT2 (1250): model RER at the end
    // ≈ 1.0 (< 1.10), HR 75 % of predicted (< 85 %), Borg 13 (< 17).
    const params = { ...defaultCycleParams(), vo2PeakMlMin: 1300, vt2Vo2MlMin: 1250, hrPeakFractionOfPredicted: 0.75, rpe: { peakBorg: 13, intervalS: 120 } };
    const g = generateTest(params, 3);
    const a = analyzeTest(g.table, DEFAULT_SETTINGS, noClinicalInputs());
    expect(a.effort.verdict).toBe('submaximal');
    expect(a.warnings.some((w) => w.includes('submaximal'))).toBe(true);
  });

  it('uses the lab’s RPE and lactate over the file’s', () => {
    const a = analyzeTest(cycle.table, DEFAULT_SETTINGS, { ...noClinicalInputs(), peakRpe: 15, lactateMmolL: 9.5, fev1L: 3 });
    expect(a.effort.criteria.find((c) => c.id === 'peak_rpe')).toMatchObject({ value: 15, met: false });
    expect(a.effort.criteria.find((c) => c.id === 'lactate')).toMatchObject({ value: 9.5, met: true });
    // MVV = 3 L × 40 = 120 L/min; reserve = 120 − peak VE.
    expect(a.derived.breathingReserveLMin).toBeCloseTo(120 - a.peak.veLMin, 9);
  });
});

describe('analyzeTest with user phase limits', () => {
  it('uses them, and warns when they are inverted', () => {
    const user = { ...DEFAULT_SETTINGS, clean: { ...DEFAULT_SETTINGS.clean, phases: { incrementalStartS: 400, incrementalEndS: 1000 } } };
    const a = analyzeTest(cycle.table, user, noClinicalInputs());
    expect([a.phases.incrementalStartS, a.phases.incrementalEndS, a.phases.source]).toEqual([400, 1000, 'user']);
    // Exercise duration is the phase length: 1000 − 400 = 600 s.
    expect(a.peak.exerciseDurationS).toBe(600);
    const inverted = { ...DEFAULT_SETTINGS, clean: { ...DEFAULT_SETTINGS.clean, phases: { incrementalStartS: 900, incrementalEndS: 500 } } };
    expect(analyzeTest(cycle.table, inverted, noClinicalInputs()).warnings.some((w) => w.includes('ends (500 s) before it starts (900 s)'))).toBe(true);
  });
});

describe('analyzeTest on arbitrary small tables', () => {
  it('never throws and never drops a breath silently (project standard: bad input never crashes)', async () => {
    const fc = await import('fast-check');
    const { breath, emptyMetadata } = await import('../../../core/model/breath-table');
    const row = fc.record({
      dt: fc.double({ min: 0, max: 10, noNaN: true }),
      vo2: fc.double({ min: 0, max: 5000, noNaN: true }),
      vco2: fc.double({ min: 0, max: 6000, noNaN: true }),
      ve: fc.double({ min: 0, max: 200, noNaN: true }),
      work: fc.option(fc.integer({ min: 0, max: 400 })),
      hr: fc.option(fc.integer({ min: 30, max: 220 })),
    });
    fc.assert(
      fc.property(fc.array(row, { maxLength: 60 }), (rows) => {
        let t = 0;
        const breaths = rows.map((r, i) => {
          t += r.dt;
          return breath({ timeS: t, vo2MlMin: r.vo2, vco2MlMin: r.vco2, veLMin: r.ve, workW: r.work, hrBpm: r.hr, sourceLine: i + 2 });
        });
        const a = analyzeTest({ metadata: emptyMetadata(), breaths, rpe: [], sourceName: 'random' }, DEFAULT_SETTINGS, noClinicalInputs());
        // Each removed breath is listed once, by its own line, with a reason.
        const lines = a.removedBreaths.map((r) => r.sourceLine);
        expect(new Set(lines).size).toBe(lines.length);
        expect(a.removedBreaths.every((r) => r.sourceLine >= 2 && r.sourceLine <= breaths.length + 1 && r.reason.length > 0)).toBe(true);
        expect(['maximal', 'submaximal', 'indeterminate']).toContain(a.effort.verdict);
        JSON.stringify(summaryJson(a));
      }),
      { numRuns: 150, seed: 42 },
    );
  });
});

describe('analysis warnings', () => {
  it('says what is missing when the metadata is empty', () => {
    const bare = { ...cycle.table, metadata: { ...cycle.table.metadata, weightKg: null, ageY: null, modality: null } };
    const w = analyzeTest(bare, DEFAULT_SETTINGS, noClinicalInputs()).warnings;
    expect(w).toEqual(expect.arrayContaining([expect.stringContaining('Body mass is missing'), expect.stringContaining('Age is missing'), expect.stringContaining('cycle was assumed')]));
  });
});

describe('short-ramp warning', () => {
  it('flags an incremental phase under 8 min and not one of about 10 min', () => {
    // 30 W/min to a peak of 2,000 mL/min: (2,000 − 476) / 300 ≈ 5.1 min plus the VO2 lag, under 8 min.
    const short = generateTest({ ...defaultCycleParams(), protocol: { ...(defaultCycleParams().protocol as any), rampWPerMin: 30 } }, 12);
    const w = analyzeTest(short.table, DEFAULT_SETTINGS, noClinicalInputs()).warnings;
    const minutes = (short.truth.phases.exerciseEndS - short.truth.phases.incrementalStartS) / 60;
    expect(minutes).toBeLessThan(8);
    expect(w.some((x) => x.startsWith('Short ramp (') && x.includes('thresholds less certain'))).toBe(true);
    // The 15 W/min default lasts about 10.6 min: no such warning.
    expect(analysis.warnings.some((x) => x.startsWith('Short ramp'))).toBe(false);
  });
});

describe('summaryJson on an empty table', () => {
  it('writes null for values that could not be computed, never NaN', async () => {
    const { emptyMetadata } = await import('../../../core/model/breath-table');
    const a = analyzeTest({ metadata: emptyMetadata(), breaths: [], rpe: [], sourceName: 'empty.csv' }, DEFAULT_SETTINGS, noClinicalInputs());
    const j = summaryJson(a) as Record<string, any>;
    expect(j.vt1).toBeNull();
    expect(j.vt2).toBeNull();
    expect(j.peak.vo2_ml_min).toBeNull();
    expect(j.warnings).toContain('The file holds no breaths; nothing could be analysed.');
  });
});
