// Reference: default limits in core/model/settings.ts (VO2 ≤ 8,000 mL/min, HR 25–250 bpm,
// RER 0.5–2.0, RER mismatch 0.05; common practice). RER = VCO2/VO2 worked by hand.
import { describe, expect, test } from 'vitest';
import { readBreathText } from '../../../core/import/read-table';

const rows = [
  't,VO2 (mL/min),VCO2 (mL/min),VE (L/min),HR (bpm),RER',
  '3,2000,2200,60,150,1.10', // RER 2200/2000 = 1.10, agrees with the file
  '6,9000,9000,200,150,1.00', // VO2 above 8000
  '9,1000,2500,40,260,2.50', // HR 260 > 250; RER 2.5 > 2.0; file agrees
  '12,2000,2000,50,20,1.20', // HR 20 < 25; file RER 1.20 vs 1.00 computed: mismatch 0.20 > 0.05
  '',
].join('\n');

describe('plausibility flags', () => {
  test('each implausible value is flagged on its line, and the breath is kept', () => {
    const r = readBreathText(rows, { sourceName: 'p.csv' });
    if (!r.ok) throw new Error(r.error.message);
    expect(r.value.table.breaths).toHaveLength(4);
    expect(r.value.flags.map((f) => [f.code, f.line, f.column])).toEqual([
      ['implausible-vo2', 3, 2],
      ['implausible-rer', 4, null],
      ['implausible-hr', 4, 5],
      ['rer-mismatch', 5, 6],
      ['implausible-hr', 5, 5],
    ]);
    expect(r.value.flags.find((f) => f.code === 'implausible-rer')?.value).toBe(2.5);
  });
});
