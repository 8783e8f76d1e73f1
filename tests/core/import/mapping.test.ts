// Reference: our own column-map format (docs/formats.md); JSON positions per ECMA-404.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, test } from 'vitest';
import { mappingFromImport, parseMapping, serializeMapping } from '../../../core/import/mapping';
import { readBreathText } from '../../../core/import/read-table';

const odd = ['Sekunde;Sauerstoff;Kohlendioxid;Atmung;Puls', '3;0,35;0,30;10,5;70', '6;0,40;0,34;11,0;72', ''].join('\n');

describe('column map', () => {
  test('a map names columns detection cannot know, and sets their units', () => {
    const map = parseMapping(
      JSON.stringify({
        format: 'twofold-column-map',
        version: 1,
        delimiter: ';',
        decimal: ',',
        columns: [
          { header: 'Sekunde', variable: 'timeS', unit: 's' },
          { header: 'Sauerstoff', variable: 'vo2MlMin', unit: 'L/min' },
          { header: 'Kohlendioxid', variable: 'vco2MlMin', unit: 'L/min' },
          { header: 'Atmung', variable: 'veLMin', unit: 'L/min' },
          { header: 'Puls', variable: null },
        ],
      }),
      'map.json',
    );
    expect(map.ok).toBe(true);
    if (!map.ok) return;
    const r = readBreathText(odd, { sourceName: 'odd.csv', mapping: map.value });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    // 0,35 L/min = 350 mL/min; 0,30 L/min = 300 mL/min
    expect(r.value.table.breaths.map((b) => [b.timeS, b.vo2MlMin, b.vco2MlMin, b.veLMin, b.hrBpm])).toEqual([
      [3, 350, 300, 10.5, null],
      [6, 400, 340, 11, null],
    ]);
    expect(r.value.columns[4]).toMatchObject({ header: 'Puls', variable: null, note: 'ignored by the column map' });
  });

  test('the saved map of an import reproduces it exactly', () => {
    const text = ['Time;VO2;VCO2;VE;HR', '00:03;0,35;0,30;10,5;70', '00:06;0,40;0,34;11,0;72', ''].join('\n');
    const first = readBreathText(text, { sourceName: 'a.csv' });
    if (!first.ok) throw new Error(first.error.message);
    const saved = parseMapping(serializeMapping(mappingFromImport(first.value)), 'saved.json');
    if (!saved.ok) throw new Error(saved.error.message);
    const second = readBreathText(text, { sourceName: 'a.csv', mapping: saved.value });
    if (!second.ok) throw new Error(second.error.message);
    expect(second.value.table).toEqual(first.value.table);
    // the first import inferred L/min (warned); with the map no unit is inferred any more
    expect(first.value.warnings.some((w) => w.code === 'unit-inferred')).toBe(true);
    expect(second.value.warnings.filter((w) => w.code === 'unit-inferred')).toEqual([]);
  });

  test('invalid JSON is located at its line and column', () => {
    const r = parseMapping('{\n  "format": "twofold-column-map",\n  "version": 1,,\n}', 'bad.json');
    expect(r.ok ? null : [r.error.code, r.error.file, r.error.line]).toEqual(['mapping-not-json', 'bad.json', 3]);
  });

  test('a wrong format, version or variable is refused with the place in the map', () => {
    const wrongVersion = parseMapping(JSON.stringify({ format: 'twofold-column-map', version: 2, columns: [] }), 'm.json');
    expect(wrongVersion.ok ? null : wrongVersion.error.code).toBe('mapping-invalid');
    const wrongVariable = parseMapping(JSON.stringify({ format: 'twofold-column-map', version: 1, columns: [{ header: 'x', variable: 'oxygen' }] }), 'm.json');
    expect(wrongVariable.ok ? null : wrongVariable.error.message).toContain('columns.0.variable');
  });

  test('the example map in docs/formats.md parses and reads a file laid out that way', () => {
    const doc = readFileSync(join(__dirname, '../../../docs/formats.md'), 'utf8');
    const json = /## Column map[\s\S]*?```json\n([\s\S]*?)```/.exec(doc)![1];
    const map = parseMapping(json, 'formats.md');
    if (!map.ok) throw new Error(map.error.message);
    // mm:ss time, flows in L/min (→ mL/min ×1000), decimal comma, a column to ignore.
    const text = ['Stopwatch;Oxygen in;Carbon dioxide out;Ventilation;Lab note', '00:03;0,35;0,30;10,5;x', '01:02;1,20;1,10;30,0;y', ''].join('\n');
    const r = readBreathText(text, { sourceName: 'lab.csv', mapping: map.value });
    if (!r.ok) throw new Error(r.error.message);
    expect(r.value.table.breaths.map((b) => [b.timeS, b.vo2MlMin, b.vco2MlMin, b.veLMin])).toEqual([
      [3, 350, 300, 10.5],
      [62, 1200, 1100, 30],
    ]);
  });
});
