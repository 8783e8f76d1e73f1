// Reference: a generated file whose line numbers are known by construction (line = header
// line + row number); it is longer than one parsing chunk (4,096 lines), so rows on both
// sides of the chunk boundaries must keep their lines.
import { expect, test } from 'vitest';
import { readBreathText } from '../../../core/import/read-table';

test('line numbers and rejections stay exact across parsing chunks', () => {
  const lines = ['# subject_id: L-1', 'time_s,vo2_ml_min,vco2_ml_min,ve_l_min'];
  for (let i = 0; i < 10_000; i++) lines.push(i === 6000 ? `${i * 2},bad,250,9` : i === 4095 ? '' : `${i * 2},${300 + i},250,9`);
  const r = readBreathText(`${lines.join('\n')}\n`, { sourceName: 'long.csv' });
  if (!r.ok) throw new Error(r.error.message);
  const breaths = r.value.table.breaths;
  // row i sits on line i + 3; row 4095 is blank (not a row), row 6000 is rejected
  expect(breaths).toHaveLength(9998);
  expect(r.value.dataRows).toBe(9999);
  expect(breaths.every((b) => b.sourceLine === b.timeS / 2 + 3)).toBe(true);
  expect(breaths.every((b) => b.vo2MlMin === 300 + b.timeS / 2)).toBe(true);
  expect(r.value.rejected.map((e) => [e.code, e.line, e.column])).toEqual([['not-a-number', 6003, 2]]);
});

test('a header on the last line searched still has its rows after it', () => {
  // 999 free-text lines, the header on line 1000 (the last line searched), data from line 1001
  const lines = [...Array.from({ length: 999 }, (_, i) => `note ${i}`), 't,VO2 (mL/min),VCO2 (mL/min),VE (L/min)', '3,300,250,9', '6,310,260,9.5'];
  const r = readBreathText(`${lines.join('\n')}\n`, { sourceName: 'deep.csv' });
  if (!r.ok) throw new Error(r.error.message);
  expect([r.value.layout.headerLine, r.value.table.breaths.map((b) => b.sourceLine)]).toEqual([1000, [1001, 1002]]);
});
