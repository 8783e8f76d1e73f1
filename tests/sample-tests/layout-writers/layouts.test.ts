// Each invented export layout carries the same breaths as the table it was written from,
// read back here with a plain parser per layout; unit conversions checked by hand
// (1 mmHg = 0.133322 kPa by definition; 1 L = 1000 mL).
import ExcelJS from 'exceljs';
import { describe, expect, test } from 'vitest';
import { generateTest } from '../../../sample-tests/generator/generate-test';
import { DEMO_PAIRS, LAB_NAME } from '../../../sample-tests/scenario/demo-scenario';
import { writeNarrativeSemicolon } from '../../../sample-tests/layout-writers/narrative-semicolon';
import { writeTabbedUnitsClock } from '../../../sample-tests/layout-writers/tabbed-units-clock';
import { quotedUtf16Text, writeQuotedUtf16 } from '../../../sample-tests/layout-writers/quoted-utf16';
import { writeWorkbook } from '../../../sample-tests/layout-writers/workbook';
import { withFixedZipDates } from '../../../sample-tests/layout-writers/fixed-zip-dates';
import { clockTime, minutesSeconds } from '../../../sample-tests/layout-writers/text-cells';

const day1 = DEMO_PAIRS[0].day1;
const { table } = generateTest(day1.params, day1.seed);
const b = table.breaths;

describe('time cells', () => {
  test('m:ss and h:mm:ss, worked by hand', () => {
    expect(minutesSeconds(754.6)).toBe('12:35');
    expect(minutesSeconds(3725)).toBe('62:05');
    expect(clockTime(9 * 3600 + 10 * 60 + 4.4)).toBe('9:10:04');
  });
});

describe('narrative-semicolon', () => {
  const lines = writeNarrativeSemicolon(table, LAB_NAME).split('\n');
  const header = lines.findIndex((l) => l.startsWith('Time;'));
  const rows = lines.slice(header + 1, -1).map((l) => l.split(';'));

  test('a free-text preamble, a blank line, then one row per breath', () => {
    expect(lines[0]).toBe(LAB_NAME);
    expect(lines[header - 1]).toBe('');
    expect(lines).toContain('Patient code: QH-0417');
    expect(rows).toHaveLength(b.length);
  });

  test('VO2 in L/min with a decimal comma, time as mm:ss', () => {
    rows.forEach((r, i) => {
      expect(Number(r[1].replace(',', '.')) * 1000).toBeCloseTo(b[i].vo2MlMin, 6);
      expect(r[0]).toBe(minutesSeconds(b[i].timeS));
    });
    expect(rows.filter((r) => r[10] !== '').map((r) => Number(r[10]))).toEqual(table.rpe.map((x) => x.borg));
  });
});

describe('tabbed-units-clock', () => {
  const lines = writeTabbedUnitsClock(table).split('\n');
  const header = lines.findIndex((l) => l.startsWith('Clock\t'));

  test('a units row under the header; clock time from the 09:10:00 start', () => {
    expect(lines[header + 1].split('\t')[0]).toBe('h:mm:ss');
    const first = lines[header + 2].split('\t');
    expect(first[0]).toBe(clockTime(9 * 3600 + 600 + b[0].timeS));
    expect(lines.length - header - 3).toBe(b.length);
  });

  test('end-tidal pressures in kPa convert back to the mmHg values (within the 0.01 kPa rounding)', () => {
    lines.slice(header + 2, -1).forEach((l, i) => {
      const cells = l.split('\t');
      expect(Number(cells[6]) / 0.133322).toBeCloseTo(b[i].peto2Mmhg!, 0);
      expect(Math.abs(Number(cells[7]) / 0.133322 - b[i].petco2Mmhg!)).toBeLessThan(0.05);
      expect(Number(cells[9])).toBeCloseTo(b[i].vtL! * 1000, 6);
    });
  });
});

describe('quoted-utf16', () => {
  const bytes = writeQuotedUtf16(table);

  test('UTF-16 LE with a byte-order mark, CRLF line ends, every field quoted', () => {
    expect([bytes[0], bytes[1]]).toEqual([0xff, 0xfe]);
    const text = new TextDecoder('utf-16le').decode(bytes.subarray(2));
    expect(text).toBe(quotedUtf16Text(table));
    const lines = text.split('\r\n');
    expect(text.replace(/\r\n/g, '')).not.toContain('\n');
    expect(lines[0]).toBe('"Exercise session export"');
    const header = lines.findIndex((l) => l.startsWith('"Elapsed [s]"'));
    expect(lines[header]).toContain('"O2 uptake [mL/min]"');
    expect(lines[header]).toContain('"Respiratory rate [/min]"');
    const rows = lines.slice(header + 1, -1).map((l) => l.slice(1, -1).split('","'));
    expect(rows).toHaveLength(b.length);
    rows.forEach((r, i) => expect(Number(r[1])).toBe(b[i].vo2MlMin));
    expect(lines).toContain('"Protocol, ""as run""","cycle ramp 15 W/min after 3 min unloaded"');
  });
});

describe('workbook', () => {
  test('a metadata block above the table on the first sheet; numbers stored as numbers', async () => {
    const workbook = new ExcelJS.Workbook();
    await workbook.xlsx.load(Buffer.from(await writeWorkbook(table, LAB_NAME)) as unknown as ArrayBuffer);
    const sheet = workbook.worksheets[0];
    expect(sheet.name).toBe('Session');
    expect(sheet.getCell('A2').value).toBe('Patient');
    expect(sheet.getCell('B2').value).toBe('QH-0417');
    expect(sheet.getCell('A12').value).toBe('Elapsed [min]');
    expect(sheet.rowCount).toBe(12 + b.length);
    // Row 13 is the first breath: elapsed minutes = s / 60, to 3 decimals.
    expect(sheet.getCell('A13').value).toBeCloseTo(b[0].timeS / 60, 3);
    expect(sheet.getCell('B13').value).toBe(b[0].vo2MlMin);
  });

  test('every ZIP entry carries the fixed date 2026-01-01 (DOS date word 23585), so bytes do not depend on the clock', async () => {
    // DOS date = (2026 − 1980) << 9 | 1 << 5 | 1 = 23552 + 32 + 1 = 23585 (PKWARE APPNOTE).
    const zip = await writeWorkbook(table, LAB_NAME);
    const view = new DataView(zip.buffer, zip.byteOffset, zip.byteLength);
    let central = 0;
    for (let i = 0; i + 46 < zip.length; i++) {
      if (view.getUint32(i, true) === 0x02014b50) {
        central++;
        expect(view.getUint16(i + 14, true)).toBe(23585);
        expect(view.getUint16(i + 12, true)).toBe(0);
      }
    }
    expect(central).toBeGreaterThan(3);
    expect(Buffer.from(withFixedZipDates(zip)).equals(Buffer.from(zip))).toBe(true);
  });
});
