// writeBreathCsv against the layout it documents (core/export/breath-csv.ts; the format of
// issue 2): exact text for small tables worked by hand, and a round trip of a generated
// test through a plain parse written here (split on LF and comma, Number()).
import { describe, expect, test } from 'vitest';
import { breath, emptyMetadata, type Breath, type BreathTable } from '../../../core/model/breath-table';
import { formatCsvNumber, writeBreathCsv, BREATH_COLUMNS } from '../../../core/export/breath-csv';
import { generateTest } from '../../../sample-tests/generator/generate-test';
import { defaultCycleParams, defaultTreadmillParams } from '../../../sample-tests/generator/params';

function table(breaths: Breath[], extra: Partial<BreathTable> = {}): BreathTable {
  return { metadata: emptyMetadata(), breaths, rpe: [], sourceName: 'test', ...extra };
}

/** A plain reader of the layout, independent of the writer's code. */
function parse(text: string) {
  const lines = text.split('\n');
  expect(lines.pop()).toBe('');
  const meta = new Map<string, string>();
  let i = 0;
  for (; lines[i].startsWith('# '); i++) {
    const at = lines[i].indexOf(': ');
    meta.set(lines[i].slice(2, at), lines[i].slice(at + 2));
  }
  const header = lines[i].split(',');
  const rows = lines.slice(i + 1).map((l) => l.split(',').map((c) => (c === '' ? null : Number(c))));
  return { meta, header, rows };
}

describe('exact text', () => {
  test('the documented example: one breath, no metadata', () => {
    const t = table([breath({ timeS: 1.5, vo2MlMin: 300, vco2MlMin: 250, veLMin: 9.1 })]);
    expect(writeBreathCsv(t)).toBe('time_s,vo2_ml_min,vco2_ml_min,ve_l_min\n1.5,300,250,9.1\n');
  });

  test('a column with any value is written, with empty cells for the missing ones', () => {
    const t = table([
      breath({ timeS: 1, vo2MlMin: 300, vco2MlMin: 250, veLMin: 9, hrBpm: 70 }),
      breath({ timeS: 4, vo2MlMin: 310, vco2MlMin: 260, veLMin: 9.5, petco2Mmhg: 36.2 }),
    ]);
    expect(writeBreathCsv(t)).toBe('time_s,vo2_ml_min,vco2_ml_min,ve_l_min,hr_bpm,petco2_mmhg\n1,300,250,9,70,\n4,310,260,9.5,,36.2\n');
  });

  test('metadata lines in the documented order, extras last, line breaks flattened', () => {
    const t = table([breath({ timeS: 1, vo2MlMin: 300, vco2MlMin: 250, veLMin: 9 })], {
      metadata: {
        ...emptyMetadata(),
        subjectId: 'QX-1',
        ageY: 45,
        sex: 'M',
        weightKg: 80.5,
        testStart: '2026-01-02T08:00:00Z',
        modality: 'cycle',
        protocol: 'ramp\n15 W/min',
        extra: { lab: 'Somewhere' },
      },
    });
    const head = writeBreathCsv(t).split('\n').slice(0, 8);
    expect(head).toEqual([
      '# subject_id: QX-1',
      '# age: 45',
      '# sex: M',
      '# weight_kg: 80.5',
      '# test_start: 2026-01-02T08:00:00Z',
      '# modality: cycle',
      '# protocol: ramp 15 W/min',
      '# lab: Somewhere',
    ]);
  });

  test('RPE sits on the breath nearest its time, blank elsewhere', () => {
    // 7.9 s is nearer 8 than 4; 2.1 s nearer 1 than 4 (worked by hand).
    const t = table(
      [1, 4, 8].map((s) => breath({ timeS: s, vo2MlMin: 300, vco2MlMin: 250, veLMin: 9 })),
      { rpe: [{ timeS: 7.9, borg: 13 }, { timeS: 2.1, borg: 9 }] },
    );
    expect(writeBreathCsv(t)).toBe('time_s,vo2_ml_min,vco2_ml_min,ve_l_min,rpe\n1,300,250,9,9\n4,300,250,9,\n8,300,250,9,13\n');
  });

  test('numbers never use exponent notation; non-finite numbers become empty cells', () => {
    // String(1e-7) is "1e-7"; the layout needs "0.0000001" (dot decimals only).
    expect(formatCsvNumber(1e-7)).toBe('0.0000001');
    expect(formatCsvNumber(0.1 + 0.2)).toBe('0.30000000000000004');
    expect(formatCsvNumber(Number.NaN)).toBe('');
    expect(formatCsvNumber(null)).toBe('');
    expect(formatCsvNumber(-12.5)).toBe('-12.5');
  });

  test('an empty table is just the header', () => {
    expect(writeBreathCsv(table([]))).toBe('time_s,vo2_ml_min,vco2_ml_min,ve_l_min\n');
  });
});

describe('round trip of a generated test', () => {
  test('cycle: every value and metadata field reads back unchanged', () => {
    const { table: t } = generateTest({ ...defaultCycleParams(), outlierBreaths: 2, extraMetadata: { lab: 'Test lab' } }, 99);
    const { meta, header, rows } = parse(writeBreathCsv(t));
    expect(header).toEqual(['time_s', 'vo2_ml_min', 'vco2_ml_min', 've_l_min', 'hr_bpm', 'work_w', 'peto2_mmhg', 'petco2_mmhg', 'rr_per_min', 'vt_l', 'rpe']);
    expect(rows).toHaveLength(t.breaths.length);
    const keys = header.slice(0, -1).map((h) => BREATH_COLUMNS.find((c) => c.name === h)!.key);
    rows.forEach((row, i) => keys.forEach((k, j) => expect(row[j]).toBe(t.breaths[i][k])));
    const rpe = rows.flatMap((row, i) => (row[10] === null ? [] : [{ timeS: t.breaths[i].timeS, borg: row[10] }]));
    expect(rpe).toEqual(t.rpe);
    expect(Object.fromEntries(meta)).toEqual({
      subject_id: 'GEN-0001',
      age: '40',
      sex: 'F',
      height_cm: '168',
      weight_kg: '68',
      test_start: '2026-03-02T09:00:00Z',
      modality: 'cycle',
      protocol: 'cycle ramp 15 W/min',
      barometric_mmhg: '760',
      lab: 'Test lab',
    });
  });

  test('treadmill: speed and grade columns, no work column', () => {
    const { table: t } = generateTest(defaultTreadmillParams(), 5);
    const { header, rows } = parse(writeBreathCsv(t));
    expect(header).not.toContain('work_w');
    const speed = header.indexOf('speed_kmh');
    const grade = header.indexOf('grade_pct');
    rows.forEach((row, i) => {
      expect(row[speed]).toBe(t.breaths[i].speedKmh);
      expect(row[grade]).toBe(t.breaths[i].gradePct);
    });
  });
});
