/**
 * Invented layout "workbook": an .xlsx file (written with exceljs). The first sheet,
 * "Session", starts with a metadata block (label in column A, value in column B), a blank
 * row, then the table's header; time is elapsed minutes as a decimal number (3 decimals),
 * VO2 and VCO2 mL/min, sex as a word, the test start as text. A second sheet, "About",
 * holds a short note. Numbers are stored as numbers, not text.
 */
import ExcelJS from 'exceljs';
import type { BreathTable } from '../../core/model/breath-table';
import { withFixedZipDates } from './fixed-zip-dates';
import { rpeByBreath, sexWord } from './text-cells';

/** Fixed workbook dates, so the file's bytes do not depend on the clock. */
const WORKBOOK_DATE = new Date('2026-01-01T00:00:00Z');

export async function writeWorkbook(table: BreathTable, labName: string): Promise<Uint8Array> {
  const m = table.metadata;
  const workbook = new ExcelJS.Workbook();
  workbook.creator = labName;
  workbook.created = WORKBOOK_DATE;
  workbook.modified = WORKBOOK_DATE;
  const sheet = workbook.addWorksheet('Session');
  const block: [string, string | number | null][] = [
    ['Laboratory', labName],
    ['Patient', m.subjectId],
    ['Age', m.ageY],
    ['Sex', sexWord(m.sex)],
    ['Height [cm]', m.heightCm],
    ['Weight [kg]', m.weightKg],
    ['Start', m.testStart],
    ['Mode', m.modality],
    ['Protocol', m.protocol],
    ['Barometer [mmHg]', m.barometricMmhg],
  ];
  for (const [label, value] of block) sheet.addRow([label, value ?? '']);
  sheet.addRow([]);
  sheet.addRow(['Elapsed [min]', 'VO2 [mL/min]', 'VCO2 [mL/min]', 'VE [L/min]', 'HR [bpm]', 'Load [W]', 'PetO2 [mmHg]', 'PetCO2 [mmHg]', 'RR [/min]', 'VT [L]', 'Borg RPE']);
  const rpe = rpeByBreath(table);
  for (const b of table.breaths) {
    sheet.addRow([
      Math.round((b.timeS / 60) * 1000) / 1000,
      b.vo2MlMin,
      b.vco2MlMin,
      b.veLMin,
      b.hrBpm,
      b.workW,
      b.peto2Mmhg,
      b.petco2Mmhg,
      b.rrPerMin,
      b.vtL,
      rpe.get(b) ?? null,
    ]);
  }
  const about = workbook.addWorksheet('About');
  about.addRow(['Invented demo data from the Twofold test-data generator; not a real patient.']);
  const buffer = await workbook.xlsx.writeBuffer();
  return withFixedZipDates(new Uint8Array(buffer as ArrayBuffer));
}
