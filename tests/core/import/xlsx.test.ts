// Reference: a workbook built here with exceljs (the reference writer of the format); Excel
// stores a time of day as a fraction of a day (00:01:30 = 90/86400), the conversion checked.
import ExcelJS from 'exceljs';
import { describe, expect, test } from 'vitest';
import { readBreathFile, readBreathBytes } from '../../../core/import/read-table';

async function workbook(build: (wb: ExcelJS.Workbook) => void): Promise<Uint8Array> {
  const wb = new ExcelJS.Workbook();
  build(wb);
  return new Uint8Array((await wb.xlsx.writeBuffer()) as ArrayBuffer);
}

describe('xlsx import', () => {
  test('metadata rows, a header with units, numbers stored as numbers, the first sheet', async () => {
    const bytes = await workbook((wb) => {
      const s = wb.addWorksheet('Breaths');
      s.addRow(['Subject', 'W-3']);
      s.addRow(['Weight [kg]', 81.5]);
      s.addRow([]);
      s.addRow(['Time [s]', 'VO2 [L/min]', 'VCO2 [L/min]', 'VE [L/min]', 'HR [bpm]', 'Borg']);
      s.addRow([4.5, 0.32, 0.27, 9.1, 72]);
      s.addRow([9, 0.35, 0.29, 9.8, 73, 7]);
      wb.addWorksheet('Other').addRow(['nothing here']);
    });
    const r = await readBreathFile(bytes, { sourceName: 'book.xlsx' });
    if (!r.ok) throw new Error(r.error.message);
    expect(r.value.layout).toMatchObject({ kind: 'workbook', sheet: 'Breaths', headerLine: 4 });
    expect(r.value.table.metadata.subjectId).toBe('W-3');
    expect(r.value.table.metadata.weightKg).toBe(81.5);
    // 0.32 L/min = 320 mL/min; the trailing Borg cell of row 5 is absent, not missing
    expect(r.value.table.breaths.map((b) => [b.timeS, Math.round(b.vo2MlMin * 1e6) / 1e6, b.hrBpm, b.sourceLine])).toEqual([
      [4.5, 320, 72, 5],
      [9, 350, 73, 6],
    ]);
    expect(r.value.table.rpe).toEqual([{ timeS: 9, borg: 7 }]);
    expect(r.value.rejected).toEqual([]);
  });

  test('a named sheet, and time cells formatted as mm:ss', async () => {
    const bytes = await workbook((wb) => {
      wb.addWorksheet('Summary').addRow(['peak only']);
      const s = wb.addWorksheet('Raw');
      s.addRow(['Time', 'VO2 (mL/min)', 'VCO2 (mL/min)', 'VE (L/min)']);
      const row = s.addRow([90 / 86400, 300, 250, 9]);
      row.getCell(1).numFmt = 'mm:ss';
      const row2 = s.addRow([95.5 / 86400, 310, 260, 9.5]);
      row2.getCell(1).numFmt = 'mm:ss.0';
    });
    const r = await readBreathFile(bytes, { sourceName: 'book.xlsx', sheet: 'Raw' });
    if (!r.ok) throw new Error(r.error.message);
    expect(r.value.table.breaths.map((b) => b.timeS)).toEqual([90, 95.5]);
    const missing = await readBreathFile(bytes, { sourceName: 'book.xlsx', sheet: 'Nope' });
    expect(missing.ok ? null : [missing.error.code, missing.error.message]).toEqual(['no-sheet', "The workbook has no worksheet named 'Nope' (it has 'Summary', 'Raw')."]);
  });

  test('a damaged workbook is a located error, and the text reader refuses a workbook', async () => {
    const bytes = await workbook((wb) => wb.addWorksheet('x').addRow(['t', 'VO2', 'VCO2', 'VE']));
    const damaged = bytes.slice(0, 200);
    const r = await readBreathFile(damaged, { sourceName: 'broken.xlsx' });
    expect(r.ok ? null : [r.error.code, r.error.file]).toEqual(['bad-workbook', 'broken.xlsx']);
    const sync = readBreathBytes(bytes, { sourceName: 'b.xlsx' });
    expect(sync.ok ? null : sync.error.code).toBe('workbook-needs-async');
  });
});
