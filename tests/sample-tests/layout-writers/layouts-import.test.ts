// The invented export layouts read back through the project's importer (core/import) to the
// breaths they were written from, within each layout's written precision (stated per check:
// mm:ss and h:mm:ss keep whole seconds, so ±0.5 s; minutes to 3 decimals, ±0.03 s; kPa to
// 0.01, i.e. ±0.0375 mmHg; t to 0.1 s, ±0.05 s).
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, test } from 'vitest';
import { readBreathFile } from '../../../core/import/read-table';
import type { Breath } from '../../../core/model/breath-table';
import { generateTest } from '../../../sample-tests/generator/generate-test';
import { DEMO_PAIRS } from '../../../sample-tests/scenario/demo-scenario';

const day1 = DEMO_PAIRS[0].day1;
const { table } = generateTest(day1.params, day1.seed);
const root = join(__dirname, '../../../sample-tests/layouts');

const cases: [string, number, number][] = [
  // file, time tolerance s, end-tidal tolerance mmHg
  ['narrative-semicolon/qh0417-day1.txt', 0.5, 1e-9],
  ['tabbed-units-clock/qh0417-day1.tsv', 0.5, 0.0375 + 1e-9],
  ['quoted-utf16/qh0417-day1.csv', 0.05 + 1e-9, 1e-9],
  ['workbook/qh0417-day1.xlsx', 0.03 + 1e-9, 1e-9],
];

describe('invented layouts through core/import', () => {
  for (const [file, timeTol, pressureTol] of cases) {
    test(file, async () => {
      const read = await readBreathFile(new Uint8Array(readFileSync(join(root, file))), { sourceName: file });
      expect(read.ok).toBe(true);
      if (!read.ok) return;
      const got = read.value.table.breaths;
      expect(got).toHaveLength(table.breaths.length);
      got.forEach((g: Breath, i) => {
        const want = table.breaths[i];
        expect(Math.abs(g.timeS - want.timeS)).toBeLessThanOrEqual(timeTol);
        expect(g.vo2MlMin).toBeCloseTo(want.vo2MlMin, 6);
        expect(g.vco2MlMin).toBeCloseTo(want.vco2MlMin, 6);
        expect(g.veLMin).toBeCloseTo(want.veLMin, 9);
        expect(g.workW).toBe(want.workW);
        expect(Math.abs((g.petco2Mmhg ?? NaN) - want.petco2Mmhg!)).toBeLessThanOrEqual(pressureTol);
      });
      expect(read.value.table.metadata.subjectId).toBe('QH-0417');
    });
  }
});
