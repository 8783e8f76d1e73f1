// Breaths kept in columns (core/import/breath-store.ts, for very large files) against plain
// objects: the same values, field by field, and the same analysis, number for number. The
// reference is the plain-object reading of the same bytes (the importer's own way for every
// ordinary test), and a hand-written breath with empty optional values.
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { analyzeTest, noClinicalInputs } from '../../../core/analyze/analyze-test';
import { summaryJson } from '../../../core/analyze/summary-json';
import { BreathStore, COMPACT_FROM_BREATHS } from '../../../core/import/breath-store';
import { readBreathFile } from '../../../core/import/read-table';
import type { Breath } from '../../../core/model/breath-table';
import { DEFAULT_SETTINGS } from '../../../core/model/settings';
import { writeLargeBreathFile } from '../../../bench/memory/large-file';

const FIELDS: readonly (keyof Breath)[] = ['timeS', 'vo2MlMin', 'vco2MlMin', 'veLMin', 'hrBpm', 'workW', 'speedKmh', 'gradePct', 'peto2Mmhg', 'petco2Mmhg', 'rrPerMin', 'vtL', 'sourceLine'];
const plainCopy = (b: Breath) => Object.fromEntries(FIELDS.map((k) => [k, b[k]]));

describe('the breath store', () => {
  it('keeps plain objects below its threshold and moves every breath to columns at it', () => {
    const store = new BreathStore(3);
    const breath = (i: number): Breath => ({ timeS: i, vo2MlMin: 1000 + i, vco2MlMin: 900.5, veLMin: 30.25, hrBpm: i === 1 ? null : 120, workW: 50, speedKmh: null, gradePct: null, peto2Mmhg: null, petco2Mmhg: 38, rrPerMin: 20, vtL: i === 2 ? null : 1.5, sourceLine: 10 + i });
    store.push(breath(0));
    store.push(breath(1));
    expect(Object.getPrototypeOf(store.breaths[0])).toBe(Object.prototype);
    store.push(breath(2));
    store.push(breath(3));
    expect(store.breaths).toHaveLength(4);
    for (const b of store.breaths) expect(Object.getPrototypeOf(b)).not.toBe(Object.prototype);
    for (let i = 0; i < 4; i++) expect(plainCopy(store.breaths[i])).toEqual(breath(i));
    expect(store.breaths[1].hrBpm).toBeNull();
    expect(store.breaths[2].vtL).toBeNull();
    expect(store.breaths[0].speedKmh).toBeNull();
  });

  it('gives a table and an analysis identical to plain objects (demo day 1)', async () => {
    const bytes = new Uint8Array(readFileSync(join(__dirname, '..', '..', '..', 'sample-tests', 'demo', 'qh0417-day1.csv')));
    const plain = await readBreathFile(bytes, { sourceName: 'day1.csv', settings: DEFAULT_SETTINGS });
    // 1 makes every breath a column breath.
    const columns = await readBreathFile(bytes, { sourceName: 'day1.csv', settings: DEFAULT_SETTINGS, compactFromBreaths: 1 });
    expect(plain.ok && columns.ok).toBe(true);
    if (!plain.ok || !columns.ok) return;
    expect(plain.value.table.breaths.length).toBeGreaterThan(400);
    expect(plain.value.table.breaths.length).toBeLessThan(COMPACT_FROM_BREATHS);
    expect(Object.getPrototypeOf(plain.value.table.breaths[0])).toBe(Object.prototype);
    expect(Object.getPrototypeOf(columns.value.table.breaths[0])).not.toBe(Object.prototype);
    expect(columns.value.table.breaths.map(plainCopy)).toEqual(plain.value.table.breaths.map(plainCopy));
    const a = summaryJson(analyzeTest(plain.value.table, DEFAULT_SETTINGS, noClinicalInputs()));
    const b = summaryJson(analyzeTest(columns.value.table, DEFAULT_SETTINGS, noClinicalInputs()));
    expect(JSON.stringify(b)).toBe(JSON.stringify(a));
  });

  it('gives the same analysis at 30,000 breaths, kept in columns by default (bench/memory/large-file.ts model)', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'twofold-store-'));
    try {
      writeLargeBreathFile(join(dir, 'large.csv'), 30_000, 5, 0);
      const bytes = new Uint8Array(readFileSync(join(dir, 'large.csv')));
      const columns = await readBreathFile(bytes, { sourceName: 'large.csv', settings: DEFAULT_SETTINGS });
      const plain = await readBreathFile(bytes, { sourceName: 'large.csv', settings: DEFAULT_SETTINGS, compactFromBreaths: Number.POSITIVE_INFINITY });
      if (!plain.ok || !columns.ok) throw new Error('not read');
      expect(columns.value.table.breaths).toHaveLength(30_000);
      expect(Object.getPrototypeOf(columns.value.table.breaths[29_999])).not.toBe(Object.prototype);
      expect(Object.getPrototypeOf(plain.value.table.breaths[29_999])).toBe(Object.prototype);
      const a = summaryJson(analyzeTest(plain.value.table, DEFAULT_SETTINGS, noClinicalInputs()));
      const b = summaryJson(analyzeTest(columns.value.table, DEFAULT_SETTINGS, noClinicalInputs()));
      expect(JSON.stringify(b)).toBe(JSON.stringify(a));
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });

  it('spans blocks without losing a breath (10,000 breaths in blocks of 4,096 and 8,192)', () => {
    const store = new BreathStore(1);
    for (let i = 0; i < 10_000; i++) store.push({ timeS: i * 2.5, vo2MlMin: i, vco2MlMin: i / 2, veLMin: 1, hrBpm: i % 7 === 0 ? null : i % 200, workW: null, speedKmh: i / 10, gradePct: null, peto2Mmhg: null, petco2Mmhg: null, rrPerMin: null, vtL: null, sourceLine: i + 5 });
    const b = store.breaths;
    expect(b).toHaveLength(10_000);
    for (const i of [0, 4095, 4096, 12_287 - 4096, 9999]) {
      expect([b[i].timeS, b[i].vo2MlMin, b[i].hrBpm, b[i].workW, b[i].speedKmh, b[i].sourceLine]).toEqual([i * 2.5, i, i % 7 === 0 ? null : i % 200, null, i / 10, i + 5]);
    }
  });
});
