// A new case records the column map each day is read with (docs/case-file.md), and the maps
// can change only while the reviewer log is empty. References: SHA-256 from Node's crypto
// (OpenSSL); the map is the importer's own format (docs/formats.md, "Column map").
import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { withColumnMaps, rawInput } from '../../../core/case/new-case';
import { columnMapOf } from '../../../core/case/case-file';
import type { ColumnMapping } from '../../../core/import/mapping';
import { caseWithLog, smallCase } from './fixtures';

const map: ColumnMapping = { format: 'twofold-column-map', version: 1, columns: [{ header: 'cardiac_beats', variable: 'hrBpm', unit: 'bpm' }] };
const bytes = new TextEncoder().encode('time_s,vo2\n1,300\n');

describe('new case and its column maps', () => {
  it('records no map unless one is given, and the map given otherwise', () => {
    const plain = rawInput({ name: 'Day1.CSV', bytes });
    const sha = createHash('sha256').update(bytes).digest('hex');
    expect(plain).toEqual({ name: 'Day1.CSV', sha256: sha, sizeBytes: 17, storedAs: `raw/${sha}.csv`, columnMap: null });
    expect(rawInput({ name: 'day1.csv', bytes, columnMap: map }).columnMap).toEqual(map);
  });

  it('an input without the field (a case file older than it) reads as no map', () => {
    const { columnMap: _dropped, ...old } = rawInput({ name: 'day1.csv', bytes, columnMap: map });
    expect(columnMapOf(old)).toBeNull();
  });

  it('sets the maps while the log is empty, and clears results computed with the old ones', () => {
    const c = { ...smallCase(), recorded: { softwareVersion: 'x', digest: '0'.repeat(64), numbers: {} } };
    const r = withColumnMaps(c, { day1: map, day2: null });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect([r.value.inputs.day1.columnMap, r.value.inputs.day2.columnMap, r.value.recorded]).toEqual([map, null, null]);
    expect(r.value.inputs.day1.sha256).toBe(c.inputs.day1.sha256);
  });

  it('refuses to change the maps once the log has an entry, naming why', () => {
    const r = withColumnMaps(caseWithLog(), { day1: map, day2: null });
    expect(r.ok ? null : r.error.code).toBe('column-map-after-review');
    expect(r.ok ? '' : r.error.message).toContain('reviewer log has an entry');
  });
});
