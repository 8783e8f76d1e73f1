/**
 * The engine the shells use: Twofold's importer, one-test analysis, values at a threshold
 * and the day-2-against-day-1 comparison (default band table).
 */
import { analyzeTest } from '../analyze/analyze-test';
import { valuesAt } from '../analyze/values-at';
import { compareTests, type Comparison } from '../compare/compare-tests';
import { readBreathBytes } from '../import/read-table';
import type { TestAnalysis } from '../model/analysis';
import { ok } from '../model/errors';
import type { Engine } from './engine';

export const defaultEngine: Engine<Comparison> = {
  readTable: (name, bytes, settings) => {
    const read = readBreathBytes(bytes, { sourceName: name, settings });
    return read.ok ? ok(read.value.table) : read;
  },
  analyzeTest: (table, settings, clinical) => ok(analyzeTest(table, settings, clinical)),
  valuesAt: (analysis, timeS) => valuesAt(analysis.series, timeS, valuesContext(analysis)),
  compareTests: (day1, day2, settings) => compareTests(day1, day2, settings),
};

/** The same context analyzeTest reads its thresholds with: peak VO2, predicted peak (FRIEND × mass, else Hansen), mass. */
function valuesContext(a: TestAnalysis) {
  const weightKg = a.metadata.weightKg;
  const friend = a.predicted.friendVo2MlKgMin;
  return {
    peakVo2MlMin: Number.isFinite(a.peak.vo2MlMin) ? a.peak.vo2MlMin : null,
    predictedPeakVo2MlMin: friend !== null && weightKg !== null ? friend * weightKg : a.predicted.hansenVo2MlMin,
    weightKg,
  };
}
