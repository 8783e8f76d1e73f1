// Reference: sample-tests/languages/ — the first demo test (generated from the stated model
// with a fixed seed, sample-tests/generator/) written by sample-tests/layout-writers/
// lab-languages.ts with its labels and headers in nine languages. Each file must import to
// exactly the breath table of its English twin (same digits, only words, decimal mark,
// delimiter and date order differ), and to the canonical values within the writer's rounding.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, test } from 'vitest';
import { readBreathFile } from '../../../core/import/read-table';
import type { Breath } from '../../../core/model/breath-table';
import { LAB_LANGUAGES } from '../../../sample-tests/layout-writers/lab-languages';

const root = join(__dirname, '../../../sample-tests');

async function importFile(path: string) {
  const r = await readBreathFile(new Uint8Array(readFileSync(path)), { sourceName: 'qh0417-day1.csv' });
  if (!r.ok) throw new Error(`${r.error.code}: ${r.error.message}`);
  return r.value;
}

// s 1 decimal; L/min 3 decimals; VE 2; HR, W 0; kPa 2 decimals = ±0.005 kPa = ±0.0375 mmHg; RR 1; VT 3
const TOLERANCE: Partial<Record<keyof Breath, number>> = { timeS: 0.05, vo2MlMin: 0.5, vco2MlMin: 0.5, veLMin: 0.005, hrBpm: 0.5, workW: 0.5, peto2Mmhg: 0.04, petco2Mmhg: 0.04, rrPerMin: 0.05, vtL: 0.0005 };

describe('an invented export in each lab language imports like its English twin', () => {
  test.each(LAB_LANGUAGES.filter((l) => l !== 'en'))('%s', async (language) => {
    const twin = await importFile(join(root, 'languages/en/qh0417-day1.csv'));
    const other = await importFile(join(root, `languages/${language}/qh0417-day1.csv`));
    expect(other.layout.languages).toEqual([language]);
    expect(other.layout.decimal).toBe(',');
    expect(other.warnings).toEqual([]);
    expect(other.rejected).toEqual([]);
    expect(other.table.breaths).toEqual(twin.table.breaths);
    expect(other.table.rpe).toEqual(twin.table.rpe);
    const pick = (m: typeof twin.table.metadata) => [m.subjectId, m.testStart, m.ageY, m.sex, m.heightCm, m.weightKg];
    expect(pick(other.table.metadata)).toEqual(pick(twin.table.metadata));
    // the phase, marker and blood pressure columns are named and not used
    const ignored = other.columns.filter((c) => c.variable === null).map((c) => c.note?.split(';')[0]);
    expect(ignored).toEqual([
      "the cart's phase or stage labels",
      "the cart's event markers",
      ...(language === 'de' || language === 'it' ? ['a blood pressure'] : []),
    ]);
  });

  test('the English twin matches the canonical demo file within the writer’s rounding', async () => {
    const canonical = await importFile(join(root, 'demo/qh0417-day1.csv'));
    const twin = await importFile(join(root, 'languages/en/qh0417-day1.csv'));
    expect(twin.layout.languages).toEqual(['en']);
    expect(twin.table.metadata.testStart).toBe('2026-03-09T09:10:00');
    expect(twin.table.breaths).toHaveLength(canonical.table.breaths.length);
    canonical.table.breaths.forEach((a, i) => {
      const b = twin.table.breaths[i];
      for (const [v, tol] of Object.entries(TOLERANCE) as [keyof Breath, number][]) {
        expect(Math.abs((b[v] as number) - (a[v] as number)), `row ${i} ${v}`).toBeLessThanOrEqual(tol + 1e-9);
      }
    });
    expect(twin.table.rpe.map((r) => r.borg)).toEqual(canonical.table.rpe.map((r) => r.borg));
  });
});
