// Fuzz suite (fast-check): hostile breath files through the importer and, when they import,
// the analysis. The property is that nothing throws: every input gives a result or a
// located error (file, line, column) — 0 crashes. Runs: TWOFOLD_FUZZ_RUNS (10,000 for the
// nightly-sized run; 1,000 each in `npm test`). The seed is printed by fast-check on a
// failure, so any crash found is reproducible.
import fc from 'fast-check';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { defaultEngine } from '../../core/case/default-engine';
import { noClinicalInputs } from '../../core/analyze/analyze-test';
import { readBreathBytes } from '../../core/import/read-table';
import { DEFAULT_SETTINGS, type Settings } from '../../core/model/settings';
import { DEMO_FOLDER, DEMO_PAIR } from '../../host/demo-job';

const RUNS = Number(process.env.TWOFOLD_FUZZ_RUNS ?? 1000);
const demo = readFileSync(join(DEMO_FOLDER, DEMO_PAIR.day1), 'utf8').split('\n');
const headerAt = demo.findIndex((l) => l.startsWith('time_s'));
const head = demo.slice(0, headerAt + 1);
const rows = demo.slice(headerAt + 1).filter((l) => l.trim() !== '');
// Fast analysis: no bootstrap (the thresholds themselves do not depend on it).
const FAST: Settings = { ...DEFAULT_SETTINGS, thresholds: { ...DEFAULT_SETTINGS.thresholds, bootstrap: { replicates: 0, seed: 1 } } };

const hostileCell = fc.oneof(
  fc.constantFrom('', '-', 'NaN', 'Infinity', '-Infinity', '1e300', '-1e300', '1e18', '0', '-0', '1,5', '１２', '0x10', '1e-320', ' ', '"', '""', '\t', '12:34', '99:99:99', '2026-13-45T25:61', 'null'),
  fc.double({ noNaN: false }).map(String),
  fc.string({ maxLength: 12 }),
);

/** The demo file with cells replaced, rows dropped, duplicated or swapped, and junk lines added. */
const hostileFile = fc
  .record({
    start: fc.integer({ min: 0, max: rows.length - 1 }),
    length: fc.oneof(fc.integer({ min: 0, max: 40 }), fc.integer({ min: 60, max: 400 }), fc.integer({ min: 60, max: 400 })),
    edits: fc.array(fc.tuple(fc.nat(), fc.nat(11), hostileCell), { maxLength: 30 }),
    swaps: fc.array(fc.tuple(fc.nat(), fc.nat()), { maxLength: 5 }),
    junk: fc.array(fc.tuple(fc.nat(), fc.string({ maxLength: 40 })), { maxLength: 3 }),
    header: fc.oneof({ weight: 9, arbitrary: fc.constant(null) }, { weight: 1, arbitrary: fc.string({ maxLength: 30 }) }),
  })
  .map(({ start, length, edits, swaps, junk, header }) => {
    const body = rows.slice(start, start + length).map((r) => r.split(','));
    for (const [r, c, v] of edits) if (body.length > 0) body[r % body.length][c] = v;
    for (const [a, b] of swaps) if (body.length > 0) [body[a % body.length], body[b % body.length]] = [body[b % body.length], body[a % body.length]];
    const lines = body.map((cells) => cells.join(','));
    for (const [at, text] of junk) lines.splice(at % (lines.length + 1), 0, text);
    const top = header === null ? head : [...head.slice(0, -1), header];
    return new TextEncoder().encode([...top, ...lines].join('\n'));
  });

describe(`fuzz: ${RUNS} hostile files`, () => {
  it('the importer returns a result or a located error, never throws', () => {
    fc.assert(
      fc.property(hostileFile, (bytes) => {
        const r = readBreathBytes(bytes, { sourceName: 'fuzz.csv', settings: FAST });
        if (!r.ok) expect(r.error.file).toBe('fuzz.csv');
      }),
      { numRuns: RUNS },
    );
  });

  it('the analysis of whatever imports returns a result or a located error, never throws', () => {
    let analysed = 0;
    fc.assert(
      fc.property(hostileFile, (bytes) => {
        const table = defaultEngine.readTable('fuzz.csv', bytes, FAST, null);
        if (!table.ok) { if (process.env.FUZZ_DEBUG) console.log(table.error.code); return; }
        const analysis = defaultEngine.analyzeTest(table.value, FAST, noClinicalInputs());
        if (analysis.ok) analysed++;
        else if (process.env.FUZZ_DEBUG) console.log(analysis.error.code);
        else expect(typeof analysis.error.message).toBe('string');
      }),
      { numRuns: RUNS },
    );
    // The generator is not all refusals: a good share of the files is analysed.
    expect(analysed).toBeGreaterThan(RUNS / 10);
  }, 600_000);
});
