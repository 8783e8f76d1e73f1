/**
 * The engine the shells use: Twofold's importer (each file read with the column map the
 * case records for it, core/import/mapping.ts), one-test analysis, values at a threshold
 * and the day-2-against-day-1 comparison (default band table).
 */
import { analyzeTest } from '../analyze/analyze-test';
import { valuesAt, valuesAtContext } from '../analyze/values-at';
import { compareTests, type Comparison } from '../compare/compare-tests';
import { readBreathBytes } from '../import/read-table';
import { implausibleTable, refuseImpossible } from '../import/sanity';
import { fail, ok } from '../model/errors';
import type { Engine } from './engine';

export const defaultEngine: Engine<Comparison> = {
  readTable: (name, bytes, settings, columnMap) => {
    const read = readBreathBytes(bytes, { sourceName: name, settings, mapping: columnMap });
    if (!read.ok) return read;
    // Impossible data is refused here first, where the import's flags, columns and set-aside
    // rows are known, so the message names the column too (core/import/sanity.ts).
    const impossible = refuseImpossible(read.value, name);
    return impossible ? fail(impossible) : ok(read.value.table);
  },
  analyzeTest: (table, settings, clinical) => {
    // Impossible data is refused rather than analysed with confidence (core/import/sanity.ts).
    const impossible = implausibleTable(table, settings);
    return impossible ? fail(impossible) : ok(analyzeTest(table, settings, clinical));
  },
  valuesAt: (a, timeS) => valuesAt(a.series, timeS, valuesAtContext(a.peak, a.predicted, a.metadata.weightKg)),
  compareTests: (day1, day2, settings) => compareTests(day1, day2, settings),
};
