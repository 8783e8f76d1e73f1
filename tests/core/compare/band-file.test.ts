// Our own band-file format (docs/comparison.md): round trip of derived statistics and located
// errors (line and column counted by hand in each input).
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseBandFile, writeDerivedBandFile } from '../../../core/compare/band-file';
import { repeatStats } from '../../../core/compare/band-stats';

describe('band file', () => {
  it('reads a lab-stated band', () => {
    const r = parseBandFile('{"format":"twofold-band","version":1,"description":"our audit","metrics":{"peak_vo2":{"cv_pct":6.1,"source":"audit of 30 repeat tests"}}}', 'lab.json');
    if (!r.ok) throw new Error(r.error.message);
    expect(r.value.origin).toBe('lab-stated');
    expect(r.value.entries.peak_vo2).toEqual({ cvPct: 6.1, source: 'audit of 30 repeat tests' });
    expect(r.value.description).toMatch(/band stated by the lab: our audit \(lab\.json\)/);
  });

  it('round-trips a derived band: CV from the hand-worked table of band-stats.test.ts (4.3732%)', () => {
    const s = repeatStats([{ day1: 20, day2: 22 }, { day1: 30, day2: 29 }, { day1: 40, day2: 43 }, { day1: 50, day2: 50 }])!;
    const text = writeDerivedBandFile({ vt1_vo2: s }, '4 repeat pairs');
    const r = parseBandFile(text, 'band.json');
    if (!r.ok) throw new Error(r.error.message);
    expect(r.value.origin).toBe('lab-derived');
    expect(r.value.entries.vt1_vo2!.cvPct).toBeCloseTo(4.3732, 3);
    const stats = JSON.parse(text).metrics.vt1_vo2.stats;
    expect(stats).toMatchObject({ n: 4, mean_change: 1, sem: 1.291, icc_3_1: 0.9899, cv_method: 'log-transformed' });
  });

  it('locates a JSON syntax error and an unknown metric', () => {
    const bad = parseBandFile('{\n  "format": "twofold-band",\n  "version": 1,,\n}', 'b.json');
    if (bad.ok) throw new Error('expected an error');
    expect(bad.error.code).toBe('band-json');
    expect(bad.error.line).toBe(3); // the doubled comma is on line 3
    const text = '{"format":"twofold-band","version":1,\n"metrics":{\n  "vo2_at_nothing":{"cv_pct":5,"source":"x"}}}';
    const unknown = parseBandFile(text, 'b.json');
    if (unknown.ok) throw new Error('expected an error');
    expect(unknown.error).toMatchObject({ code: 'band-metric-id', line: 3, column: 3 });
  });

  it('rejects a CV out of range, a missing source, and a wrong format', () => {
    const cv = parseBandFile('{"format":"twofold-band","version":1,"metrics":{"oues":{"cv_pct":0,"source":"x"}}}', 'b.json');
    expect(cv.ok ? null : cv.error.code).toBe('band-cv');
    const src = parseBandFile('{"format":"twofold-band","version":1,"metrics":{"oues":{"cv_pct":5}}}', 'b.json');
    expect(src.ok ? null : src.error.code).toBe('band-source');
    const fmt = parseBandFile('{"format":"other","version":1,"metrics":{}}', 'b.json');
    expect(fmt.ok ? null : fmt.error.code).toBe('band-format');
    const arr = parseBandFile('[1,2]', 'b.json');
    expect(arr.ok ? null : arr.error.code).toBe('band-shape');
  });
});

// Bad input never crashes (project standard): any text gives a band or a located error.
describe('parseBandFile on arbitrary text', () => {
  it('never throws', () => {
    fc.assert(
      fc.property(fc.oneof(fc.string(), fc.json()), (text) => {
        const r = parseBandFile(text, 'b.json');
        if (!r.ok) expect(r.error.file).toBe('b.json');
      }),
      { numRuns: 300 },
    );
  });
});
