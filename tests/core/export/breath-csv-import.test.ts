// Round trip through the project's importer (core/import): what writeBreathCsv writes,
// readBreathText reads back unchanged: every breath value, the RPE readings and the metadata.
// The importer is written independently from the layout description, so this holds the two
// to the same format.
import { describe, expect, test } from 'vitest';
import { writeBreathCsv } from '../../../core/export/breath-csv';
import { readBreathText } from '../../../core/import/read-table';
import { generateTest } from '../../../sample-tests/generator/generate-test';
import { defaultCycleParams, defaultTreadmillParams } from '../../../sample-tests/generator/params';

const strip = <T extends { sourceLine: number }>(rows: readonly T[]) => rows.map(({ sourceLine: _line, ...rest }) => rest);

describe('writeBreathCsv → core/import', () => {
  for (const [label, params] of [
    ['cycle with outliers', { ...defaultCycleParams(), outlierBreaths: 4, extraMetadata: { lab: 'Invented lab' } }],
    ['treadmill', defaultTreadmillParams()],
  ] as const) {
    test(`${label}: breaths, RPE and metadata read back unchanged`, () => {
      const { table } = generateTest(params, 314);
      const read = readBreathText(writeBreathCsv(table), { sourceName: 'roundtrip.csv' });
      expect(read.ok).toBe(true);
      if (!read.ok) return;
      expect(read.value.rejected).toEqual([]);
      expect(strip(read.value.table.breaths)).toEqual(strip(table.breaths));
      expect(read.value.table.rpe).toEqual(table.rpe);
      expect(read.value.table.metadata).toEqual(table.metadata);
    });
  }
});
