// Reference: hand-built exports with values converted by hand in the comments
// (1 L = 1000 mL; 1 kPa = 7.50062 mmHg; mm:ss to seconds). Bad-input cases check the file,
// line and column of the located error (core/model/errors.ts).
import { describe, expect, test } from 'vitest';
import { readBreathBytes, readBreathText } from '../../../core/import/read-table';
import type { ImportResult } from '../../../core/import/types';

function read(text: string, file = 'f.csv'): ImportResult {
  const r = readBreathText(text, { sourceName: file });
  if (!r.ok) throw new Error(`${r.error.code}: ${r.error.message}`);
  return r.value;
}

function fatal(text: string, file = 'f.csv') {
  const r = readBreathText(text, { sourceName: file });
  if (r.ok) throw new Error('expected an import error');
  return [r.error.code, r.error.file, r.error.line, r.error.column];
}

describe('readBreathText', () => {
  test('metadata block, units row, semicolons and decimal commas, mm:ss, kPa', () => {
    const r = read(
      ['Patient: Q-12', 'Weight: 70 kg', 'A free line of text', '', "Time;V'O2;V'CO2;V'E;HR;PetCO2;Load", 'mm:ss;L/min;L/min;L/min;bpm;kPa;W', '00:03;0,350;0,300;10,5;70;5,00;0', '01:02,5;1,200;1,100;30,0;110;5,20;50', ''].join('\r\n'),
    );
    expect(r.layout).toMatchObject({ delimiter: ';', decimal: ',', headerLine: 5, unitsLine: 6, timeFormat: 'mm:ss' });
    expect(r.table.metadata.subjectId).toBe('Q-12');
    // 01:02,5 → 62.5 s; 1,200 L/min → 1200 mL/min; 5,00 kPa → 37.50 mmHg
    const b = r.table.breaths;
    expect([b[1].timeS, b[1].vo2MlMin, b[1].vco2MlMin, b[1].veLMin, b[1].hrBpm, b[1].workW]).toEqual([62.5, 1200, 1100, 30, 110, 50]);
    expect(b[0].petco2Mmhg).toBeCloseTo(37.503, 3);
    expect(b.map((x) => x.sourceLine)).toEqual([7, 8]);
  });

  test('VO2 per kg needs a weight, and uses it', () => {
    // 20 mL/kg/min · 70 kg = 1400 mL/min
    const r = read(['Weight: 70 kg', 'Time (s),VO2/kg (mL/kg/min),VCO2 (mL/min),VE (L/min)', '10,20,1300,40', ''].join('\n'));
    expect(r.table.breaths[0].vo2MlMin).toBe(1400);
    expect(fatal(['Time (s),VO2/kg,VCO2 (mL/min),VE (L/min)', '10,20,1300,40', ''].join('\n'))).toEqual(['weight-needed', 'f.csv', 1, 2]);
  });

  test('clock time counts from the first row and sets the test start when a date is known', () => {
    const r = read(['Date: 2026-03-09', 'Clock\tVO2\tVCO2\tVE', 'h:mm:ss\tml/min\tml/min\tl/min', '23:59:58\t300\t250\t9', '0:00:03\t310\t260\t9.5', ''].join('\n'));
    // 23:59:58 → 0 s; 0:00:03 the next day → 5 s
    expect(r.table.breaths.map((b) => b.timeS)).toEqual([0, 5]);
    expect(r.table.metadata.testStart).toBe('2026-03-09T23:59:58');
    expect(r.layout.timeFormat).toBe('clock');
  });

  test('a sparse RPE column gives readings; a row with only time and RPE is a reading, not a breath', () => {
    const r = read(['t,VO2,VCO2,VE,RPE', '3,300,250,9,', '6,310,260,9,11', '7,,,,13', '9,320,270,10,', ''].join('\n'));
    expect(r.table.rpe).toEqual([
      { timeS: 6, borg: 11 },
      { timeS: 7, borg: 13 },
    ]);
    expect(r.table.breaths).toHaveLength(3);
    expect(r.rejected).toEqual([]);
    expect(r.dataRows).toBe(4);
  });

  test('missing units are inferred and warned about', () => {
    const r = read(['Time,VO2,VCO2,VE,PetCO2', '3,0.3,0.25,9,5.1', '6,0.31,0.26,9.5,5.0', ''].join('\n'));
    expect(r.columns.filter((c) => c.unitInferred).map((c) => [c.header, c.unit])).toEqual([
      ['Time', 's'],
      ['VO2', 'L/min'],
      ['VCO2', 'L/min'],
      ['VE', 'L/min'],
      ['PetCO2', 'kPa'],
    ]);
    expect(r.warnings.map((w) => [w.code, w.line, w.column])).toEqual([
      ['unit-inferred', 1, 1],
      ['unit-inferred', 1, 2],
      ['unit-inferred', 1, 3],
      ['unit-inferred', 1, 4],
      ['unit-inferred', 1, 5],
    ]);
  });

  test('a quoted cell with a line break keeps later rows on their true lines', () => {
    const r = read(['t,VO2 (mL/min),VCO2 (mL/min),VE (L/min),Note', '3,300,250,9,"cough', 'then swallow"', '6,310,260,9.5,', ''].join('\n'));
    expect(r.table.breaths.map((b) => b.sourceLine)).toEqual([2, 4]);
  });
});

describe('bad input: fatal errors name the file and, where there is one, the place', () => {
  test('empty file', () => {
    const r2 = readBreathBytes(new Uint8Array(), { sourceName: 'empty.csv' });
    expect(r2.ok ? null : [r2.error.code, r2.error.file, r2.error.line, r2.error.column]).toEqual(['empty-file', 'empty.csv', null, null]);
  });

  test('binary garbage', () => {
    const r = readBreathBytes(new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0x00]), { sourceName: 'img.png' });
    expect(r.ok ? null : [r.error.code, r.error.file, r.error.line]).toEqual(['binary-content', 'img.png', 2]);
  });

  test('no recognisable header', () => {
    expect(fatal('Name: A\nthis is a letter, not a table\n')).toEqual(['no-header', 'f.csv', null, null]);
  });

  test('a required column missing', () => {
    expect(fatal('Time;VO2;VE;HR\n1;300;9;70\n')).toEqual(['missing-column', 'f.csv', 1, null]);
  });

  test('an unknown unit, at the units row', () => {
    expect(fatal('Time;VO2;VCO2;VE\ns;ml/min;ml/min;gallons/h\n1;300;250;9\n')).toEqual(['unknown-unit', 'f.csv', 2, 4]);
  });

  test('an unclosed quote', () => {
    expect(fatal('t,VO2,VCO2,VE\n1,300,250,9\n2,"310,260,9\n3,320,270,10\n')[0]).toBe('unclosed-quote');
  });

  test('no usable row at all is located at the first problem', () => {
    expect(fatal('t,VO2,VCO2,VE\n1,x,250,9\n')).toEqual(['no-usable-rows', 'f.csv', 2, 2]);
  });
});

describe('bad input: row-level problems reject their row, listed with line, column and reason', () => {
  const text = [
    '# operator: staff 3',
    'time,vo2 (ml/min),vco2 (ml/min),ve (l/min),hr',
    '3,300,250,9,70', // line 3 fine
    '6,abc,260,9.5,71', // line 4: text in VO2 (column 2)
    '9,320,270', // line 5: too few cells (3 of 4 needed) → column 4
    '8,330,280,10,72', // line 6 fine: 8 s follows the last usable breath, 3 s
    '7,340,290,10.5,73', // line 7: 7 s after 8 s → backwards (column 1)
    '12,350,,11,74', // line 8: VCO2 empty (column 3)
    '15,360,300,11.5,seventy', // line 9: unreadable HR → breath kept, HR null, flagged
    '',
  ].join('\n');

  test('each rejected row is listed; nothing is dropped silently', () => {
    const r = read(text);
    expect(r.rejected.map((e) => [e.code, e.file, e.line, e.column])).toEqual([
      ['not-a-number', 'f.csv', 4, 2],
      ['too-few-cells', 'f.csv', 5, 4],
      ['time-backwards', 'f.csv', 7, 1],
      ['missing-value', 'f.csv', 8, 3],
    ]);
    expect(r.table.breaths.map((b) => b.sourceLine)).toEqual([3, 6, 9]);
    expect(r.table.breaths.length + r.rejected.length).toBe(r.dataRows);
    expect(r.flags.map((f) => [f.code, f.line, f.column])).toEqual([['unreadable-cell', 9, 5]]);
    expect(r.table.breaths[2].hrBpm).toBeNull();
  });
});
