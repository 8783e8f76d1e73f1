// Follow-up sheets (Twofold's own CSV layout, core/followup/sheet.ts): every problem is named by
// line and column, counted by hand from the sheet text in each test.
import { describe, expect, it } from 'vitest';
import { readFollowUpSheet } from '../../../core/followup/sheet';

const HEADER = 'test,hours,reported_by,channel,back_to_usual,note,fatigue,thinking and memory';

describe('follow-up sheets', () => {
  it('reads reports with quoted notes, days as hours, and empty ratings as not asked', () => {
    const r = readFollowUpSheet(`${HEADER}\n1,22,the person,phone,no,"slept badly, ""heavy"" legs",6,\n2,3d,partner,form,yes,,2,1\n`, 'sheet.csv');
    if (!r.ok) throw new Error(r.error.message);
    expect(r.value).toHaveLength(2);
    expect(r.value[0]).toEqual({ line: 2, report: { version: 1, day: 1, afterTestH: 22, reportedBy: 'the person', channel: 'phone', backToUsual: false, ratings: [{ domain: 'fatigue', score: 6 }, { domain: 'thinking and memory', score: null }], note: 'slept badly, "heavy" legs' } });
    expect(r.value[1].report.afterTestH).toBe(72);
  });

  it('names the line and column of a bad cell', () => {
    const r = readFollowUpSheet(`${HEADER}\n1,22,the person,phone,no,,6,4\n2,48,the person,phone,maybe,,6,4\n`, 'sheet.csv');
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect([r.error.file, r.error.line, r.error.column]).toEqual(['sheet.csv', 3, 5]);
    expect(r.error.message).toContain("column 'back_to_usual'");
    const score = readFollowUpSheet(`${HEADER}\n1,22,the person,phone,no,,11,4\n`, 'sheet.csv');
    expect(score.ok ? null : [score.error.line, score.error.column]).toEqual([2, 7]);
  });

  it('refuses a sheet without a required column, with a short line, or with an open quote', () => {
    const missing = readFollowUpSheet('test,hours,channel,back_to_usual\n1,2,phone,no\n', 's.csv');
    expect(missing.ok ? null : [missing.error.line, missing.error.message]).toEqual([1, expect.stringContaining("no 'reported_by' column")]);
    const short = readFollowUpSheet(`${HEADER}\n1,22,the person\n`, 's.csv');
    expect(short.ok ? null : [short.error.line, short.error.column]).toEqual([2, 4]);
    const quote = readFollowUpSheet(`${HEADER}\n1,22,the person,phone,no,"open,6,4\n`, 's.csv');
    expect(quote.ok ? null : [quote.error.code, quote.error.line, quote.error.column]).toEqual(['sheet-quote', 2, 6]);
  });
});
