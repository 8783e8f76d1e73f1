/**
 * The engine the shells use: Twofold's importer (each file read with the column map the
 * case records for it, core/import/mapping.ts), one-test analysis, values at a threshold
 * and the day-2-against-day-1 comparison (default band table).
 */
import { analyzeTest } from '../analyze/analyze-test';
import { valuesAt, valuesAtContext } from '../analyze/values-at';
import { compareTests, type Comparison } from '../compare/compare-tests';
import { readBreathBytes } from '../import/read-table';
import { backwardTime, implausibleTable } from '../import/sanity';
import { fail, ok } from '../model/errors';
import type { Engine } from './engine';

export const defaultEngine: Engine<Comparison> = {
  readTable: (name, bytes, settings, columnMap) => {
    const read = readBreathBytes(bytes, { sourceName: name, settings, mapping: columnMap });
    if (!read.ok) return read;
    // Time running backwards on many rows is refused here, where the import's set-aside rows are known.
    const backwards = backwardTime(read.value.rejected, read.value.table.breaths.length, name);
    return backwards ? fail(backwards) : ok(read.value.table);
  },
  analyzeTest: (table, settings, clinical) => {
    // Impossible data is refused rather than analysed with confidence (core/import/sanity.ts).
    const impossible = implausibleTable(table, settings);
    return impossible ? fail(impossible) : ok(analyzeTest(table, settings, clinical));
  },
  valuesAt: (a, timeS) => valuesAt(a.series, timeS, valuesAtContext(a.peak, a.predicted, a.metadata.weightKg)),
  compareTests: (day1, day2, settings) => compareTests(day1, day2, settings),
};
