/**
 * One test, end to end: breaths outside physiology left out → outlier removal → averaging → phases → thresholds → values at each
 * threshold → peaks → derived measures → predicted values → effort → warnings → provenance.
 * Pure and deterministic: the same table, settings and clinical inputs always give the same
 * analysis (the bootstrap is seeded from the settings).
 *
 * The % of predicted at each threshold uses FRIEND (mL/kg/min × body mass) when it can be
 * computed, else Hansen/Wasserman: FRIEND's coefficients were confirmed against its
 * publication, Hansen's equations are written from memory (see core/measures/predicted.ts).
 */
import type { BreathTable, Modality } from '../model/breath-table';
import type { ClinicalInputs, DerivedMeasures, PredictedValues, TestAnalysis, ThresholdId, ThresholdResult } from '../model/analysis';
import type { Settings } from '../model/settings';
import type { ThresholdEstimate } from '../thresholds/detector';
import { SOFTWARE_NAME, SOFTWARE_VERSION } from '../version';
import { removeOutliers } from '../clean/outliers';
import { leaveOutImpossible } from '../clean/impossible';
import { averageBreaths } from '../clean/averaging';
import { findPhases } from '../clean/phases';
import { intervalLabel } from '../thresholds/interval-label';
import { isShortRamp } from '../thresholds/ramp-length';
import { findThresholds } from '../thresholds/find-thresholds';
import { peakValues } from '../measures/peaks';
import { breathingReserve, dVo2dWr, hrReserve, mvvLMin, oues, veVco2Slope, weberClass } from '../measures/derived';
import { friendVo2MlKgMin, hansenVo2MlMin, percentOf, predictedHrMax, type Person } from '../measures/predicted';
import { assessEffort } from '../measures/effort';
import { impossibleShareNote } from '../import/sanity';
import { valuesAt, valuesAtContext, type ValuesAtContext } from './values-at';
import { analysisWarnings } from './warnings';

/** ΔVO2/ΔWR leaves out the first minute of the ramp (VO2 kinetics lag; see derived.ts). */
const KINETIC_LAG_S = 60;

export function noClinicalInputs(): ClinicalInputs {
  return { peakRpe: null, lactateMmolL: null, fev1L: null, mvvLMin: null, restingHrBpm: null };
}

export function analyzeTest(table: BreathTable, settings: Settings, clinical: ClinicalInputs): TestAnalysis {
  const meta = table.metadata;
  // Values outside physiology first (named, core/clean/impossible.ts), then outlier breaths.
  const possible = leaveOutImpossible(table.breaths, settings.import, table.sourceName);
  const outliers = removeOutliers(possible.kept, settings.clean.outliers);
  const kept = outliers.kept;
  const removed = [...possible.removed, ...outliers.removed].sort((p, q) => p.timeS - q.timeS);
  const series = averageBreaths(kept, settings.clean.averaging);
  const phases = findPhases(kept, settings.clean.phases);
  const incrementalWindow = { fromS: phases.incrementalStartS, toS: phases.incrementalEndS };

  const estimates = findThresholds(series, phases, settings);
  const peak = peakValues(kept, phases, meta.weightKg, settings.peaks.windowS);

  const modality = meta.modality ?? inferModality(table);
  const person = personOf(table, modality);
  const hrMaxBpm = meta.ageY === null ? null : predictedHrMax(meta.ageY, settings.effort.hrMaxFormula);
  const friend = person ? friendVo2MlKgMin(person) : null;
  const hansen = person ? hansenVo2MlMin(person) : null;
  const predicted: PredictedValues = {
    hrMaxBpm,
    friendVo2MlKgMin: friend,
    hansenVo2MlMin: hansen,
    pctPredictedFriend: percentOf(peak.vo2MlKgMin, friend),
    pctPredictedHansen: percentOf(peak.vo2MlMin, hansen),
  };

  const context = valuesAtContext(peak, predicted, meta.weightKg);
  const short = isShortRamp(phases.incrementalStartS, phases.incrementalEndS);
  const vt1 = thresholdResult('vt1', estimates.vt1, series, context, short);
  const vt2 = thresholdResult('vt2', estimates.vt2, series, context, short);

  const slopeEnd = vt2.at ? vt2.at.timeS : phases.incrementalEndS;
  const mvv = mvvLMin(clinical.mvvLMin, clinical.fev1L);
  const reserve = breathingReserve(mvv, peak.veLMin);
  const derived: DerivedMeasures = {
    veVco2Slope: veVco2Slope(series, { fromS: phases.incrementalStartS, toS: slopeEnd }),
    oues: oues(series, incrementalWindow),
    dVo2dWrMlMinW: dVo2dWr(series, { fromS: phases.incrementalStartS + KINETIC_LAG_S, toS: phases.incrementalEndS }),
    breathingReserveLMin: reserve.lMin,
    breathingReservePct: reserve.pct,
    hrReserveBpm: hrReserve(hrMaxBpm, peak.hrBpm),
    weberClass: weberClass(peak.vo2MlKgMin),
  };

  const rpeFromFile = table.rpe.length > 0 ? Math.max(...table.rpe.map((r) => r.borg)) : null;
  const effort = assessEffort({
    breaths: kept,
    phases,
    peak,
    weightKg: meta.weightKg,
    predictedHrMaxBpm: hrMaxBpm,
    peakRpe: clinical.peakRpe ?? rpeFromFile,
    lactateMmolL: clinical.lactateMmolL,
    settings: settings.effort,
    impossibleData: impossibleShareNote(table.breaths, settings, table.sourceName),
  });

  const warnings = analysisWarnings({
    table,
    removedCount: removed.length,
    phases,
    vt1,
    vt2,
    peak,
    effort,
    personComplete: person !== null,
    assumedModality: meta.modality === null ? modality : null,
  });

  return {
    sourceName: table.sourceName,
    metadata: meta,
    clinical,
    series,
    phases,
    removedBreaths: removed,
    vt1,
    vt2,
    peak,
    derived,
    predicted,
    effort,
    warnings,
    provenance: { software: SOFTWARE_NAME, softwareVersion: SOFTWARE_VERSION, settings },
  };
}

function thresholdResult(id: ThresholdId, e: ThresholdEstimate, series: TestAnalysis['series'], context: ValuesAtContext, shortRamp: boolean): ThresholdResult {
  return {
    id,
    methods: e.methods,
    at: e.consensus ? valuesAt(series, e.consensus.timeS, context, e.consensus.vo2MlMin) : null,
    ci95Vo2MlMin: e.ci95Vo2MlMin,
    ci95TimeS: e.ci95TimeS,
    ...(e.ci95Vo2MlMin ? { ciLabel: intervalLabel(id, shortRamp) } : {}),
    spreadVo2MlMin: e.spreadVo2MlMin,
    methodsDisagree: e.methodsDisagree,
    reason: e.consensus ? null : (e.reason ?? 'no method found a breakpoint'),
  };
}

function inferModality(table: BreathTable): Modality | null {
  if (table.breaths.some((b) => b.workW !== null)) return 'cycle';
  if (table.breaths.some((b) => b.speedKmh !== null)) return 'treadmill';
  return null;
}

function personOf(table: BreathTable, modality: Modality | null): Person | null {
  const m = table.metadata;
  if (m.ageY === null || m.sex === null || m.heightCm === null || m.weightKg === null || modality === null) return null;
  return { ageY: m.ageY, sex: m.sex, heightCm: m.heightCm, weightKg: m.weightKg, modality };
}
