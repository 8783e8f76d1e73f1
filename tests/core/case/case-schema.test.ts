// The case file's column maps through text and schema (docs/case-file.md). The old-format
// file beside this test was written by Twofold before the field existed (caseToText of
// fixtures.ts `caseWithLog`, three reviewer entries); it must keep loading and verifying.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { anchorHash } from '../../../core/case/audit-log';
import { columnMapOf } from '../../../core/case/case-file';
import { caseFromText, caseToText } from '../../../core/case/case-text';
import { withColumnMaps } from '../../../core/case/new-case';
import type { ColumnMapping } from '../../../core/import/mapping';
import { smallCase } from './fixtures';

const oldText = readFileSync(join(__dirname, 'case-before-column-maps.json'), 'utf8');
const map: ColumnMapping = { format: 'twofold-column-map', version: 1, delimiter: ',', decimal: '.', headerLine: null, columns: [{ header: 'cardiac_beats', variable: 'hrBpm', unit: 'bpm' }, { header: 'marker', variable: null }] };

describe('case schema: column maps', () => {
  it('an old case file without the field loads, its chain holds, and each day reads with no map', () => {
    expect(oldText).not.toContain('columnMap');
    const r = caseFromText(oldText, 'old.json');
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value.log.length).toBe(3);
    // The first entry's prevHash was written by the earlier version: the anchor is unchanged.
    expect(anchorHash(r.value)).toBe(r.value.log[0].prevHash);
    expect([columnMapOf(r.value.inputs.day1), columnMapOf(r.value.inputs.day2)]).toEqual([null, null]);
  });

  it('a case with a map round-trips through its text exactly', () => {
    const c = withColumnMaps(smallCase(), { day1: map, day2: null });
    if (!c.ok) throw new Error(c.error.message);
    const back = caseFromText(caseToText(c.value), 'case.json');
    expect(back.ok && back.value).toEqual(c.value);
  });

  it('a map that breaks the column-map format is refused, naming the case field and the map field', () => {
    const c = withColumnMaps(smallCase(), { day1: map, day2: null });
    if (!c.ok) throw new Error(c.error.message);
    const text = caseToText(c.value).replace('"variable": "hrBpm"', '"variable": "pulse"');
    const r = caseFromText(text, 'case.json');
    expect(r.ok ? null : r.error.code).toBe('case-invalid');
    expect(r.ok ? '' : r.error.message).toContain('inputs.day1.columnMap');
    expect(r.ok ? '' : r.error.message).toContain('columns.0.variable');
    // The error points at the line of the map in the file.
    expect(r.ok ? null : text.split('\n')[(r.error.line ?? 0) - 1]).toContain('"columnMap"');
  });

  it('a map of the wrong kind of value is refused', () => {
    const text = caseToText(smallCase()).replace('"columnMap": null', '"columnMap": "cardiac_beats=hrBpm"');
    const r = caseFromText(text, 'case.json');
    expect(r.ok ? '' : r.error.message).toContain('inputs.day1.columnMap');
  });
});
