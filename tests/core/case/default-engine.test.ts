// The default engine reads each file with the column map passed to it (the case's recorded
// map). Reference: the demo CSV's own hr_bpm column, read here by splitting its lines
// (sample-tests/demo, Twofold's plain CSV layout, docs/formats.md).
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { defaultEngine } from '../../../core/case/default-engine';
import type { ColumnMapping } from '../../../core/import/mapping';
import { DEFAULT_SETTINGS } from '../../../core/model/settings';
import { DEMO_FOLDER, DEMO_PAIR } from '../../../host/demo-job';

const text = readFileSync(join(DEMO_FOLDER, DEMO_PAIR.day1), 'utf8');
const renamed = new TextEncoder().encode(text.replace('hr_bpm', 'cardiac_beats'));
const map: ColumnMapping = { format: 'twofold-column-map', version: 1, columns: [{ header: 'cardiac_beats', variable: 'hrBpm', unit: 'bpm' }] };

/** The hr_bpm cell of every data line, as written. */
function hrColumn(): number[] {
  const lines = text.split('\n').filter((l) => l !== '' && !l.startsWith('#'));
  const at = lines[0].split(',').indexOf('hr_bpm');
  return lines.slice(1).map((l) => Number(l.split(',')[at]));
}

describe('default engine', () => {
  it('reads a column the importer cannot name when the map names it', () => {
    const r = defaultEngine.readTable('cart.csv', renamed, DEFAULT_SETTINGS, map);
    if (!r.ok) throw new Error(r.error.message);
    const expected = hrColumn();
    expect(r.value.breaths.length).toBe(expected.length);
    expect(r.value.breaths.map((b) => b.hrBpm)).toEqual(expected);
  });

  it('without the map the same file reads with no heart rate, and keeps every breath', () => {
    const r = defaultEngine.readTable('cart.csv', renamed, DEFAULT_SETTINGS, null);
    if (!r.ok) throw new Error(r.error.message);
    expect(r.value.breaths.length).toBe(hrColumn().length);
    expect(r.value.breaths.every((b) => b.hrBpm === null)).toBe(true);
  });
});
