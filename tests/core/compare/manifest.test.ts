// The manifest layout is our own (docs/comparison.md); locations worked by hand by counting
// lines and characters of each input (1-based, as compilers report them).
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseManifest } from '../../../core/compare/manifest';

describe('parseManifest', () => {
  it('reads pairs, skipping blank and # lines, with BOM and CRLF', () => {
    const text = '\uFEFFpair_id,day1_file,day2_file\r\n# archive 2025\r\nP1,a/d1.csv,a/d2.csv\r\n\r\n"P 2","b,1.csv", b2.csv\r\n';
    const r = parseManifest(text, 'm.csv');
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value).toEqual([
      { pairId: 'P1', day1File: 'a/d1.csv', day2File: 'a/d2.csv', line: 3 },
      { pairId: 'P 2', day1File: 'b,1.csv', day2File: 'b2.csv', line: 5 },
    ]);
  });

  it('a wrong header: line 1, at the column of the wrong name ("pair_id,day_1,..." → column 9)', () => {
    const r = parseManifest('pair_id,day_1,day2_file\n', 'm.csv');
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.error).toMatchObject({ code: 'manifest-header', file: 'm.csv', line: 1, column: 9 });
  });

  it('a missing field: line 3, column just past the end ("P2,x.csv" is 8 characters → 9)', () => {
    const r = parseManifest('pair_id,day1_file,day2_file\nP1,a,b\nP2,x.csv\n', 'm.csv');
    if (r.ok) throw new Error('expected an error');
    expect(r.error).toMatchObject({ code: 'manifest-fields', line: 3, column: 9 });
  });

  it('an empty field, a duplicate id, an open quote and an empty file are located errors', () => {
    const empty = parseManifest('pair_id,day1_file,day2_file\nP1,,b\n', 'm.csv');
    if (empty.ok) throw new Error('expected an error');
    expect(empty.error).toMatchObject({ code: 'manifest-empty', line: 2, column: 4 });
    const dup = parseManifest('pair_id,day1_file,day2_file\nP1,a,b\nP1,c,d\n', 'm.csv');
    if (dup.ok) throw new Error('expected an error');
    expect(dup.error).toMatchObject({ code: 'manifest-duplicate', line: 3, column: 1 });
    expect(dup.error.message).toMatch(/line 2/);
    const quote = parseManifest('pair_id,day1_file,day2_file\nP1,"a,b\n', 'm.csv');
    if (quote.ok) throw new Error('expected an error');
    expect(quote.error).toMatchObject({ code: 'manifest-quote', line: 2, column: 4 });
    const none = parseManifest('', 'm.csv');
    expect(none.ok).toBe(false);
  });
});

// Bad input never crashes (project standard): any text gives pairs or a located error.
describe('parseManifest on arbitrary text', () => {
  it('never throws; an error always names the file and a line', () => {
    fc.assert(
      fc.property(fc.string({ unit: fc.constantFrom('a', ',', '"', '\n', '\r', ' ', '#', 'p', '1') }), (body) => {
        const r = parseManifest(`pair_id,day1_file,day2_file\n${body}`, 'm.csv');
        if (!r.ok) {
          expect(r.error.file).toBe('m.csv');
          expect(r.error.line).toBeGreaterThanOrEqual(1);
        } else {
          for (const e of r.value) expect(e.pairId.length).toBeGreaterThan(0);
        }
      }),
      { numRuns: 300 },
    );
  });
});
