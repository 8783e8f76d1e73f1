// Property tests (fast-check). Reference: the canonical table each case starts from — every
// variant file is written from it in the test, so the expected values are known exactly;
// conversions are definitions (1 L = 1000 mL, 1 min = 60 s, mm:ss sexagesimal).
import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { readBreathBytes } from '../../../core/import/read-table';

interface Row {
  timeS: number;
  vo2MlMin: number;
  vco2MlMin: number;
  veLMin: number;
  hrBpm: number | null;
}

interface Variant {
  delimiter: ',' | ';' | '\t';
  decimal: '.' | ',';
  gasUnit: 'mL/min' | 'L/min';
  time: 's' | 'min' | 'mm:ss' | 'h:mm:ss';
  units: 'brackets' | 'row' | 'none';
  metadata: boolean;
  crlf: boolean;
  encoding: 'utf-8' | 'utf-8-bom' | 'utf-16le';
}

const rowsArb = fc
  .array(
    fc.record({
      stepDs: fc.integer({ min: 10, max: 60 }), // 1.0–6.0 s between breaths
      vo2MlMin: fc.integer({ min: 150, max: 5000 }),
      rer100: fc.integer({ min: 70, max: 130 }),
      ve100: fc.integer({ min: 500, max: 15000 }),
      hrBpm: fc.option(fc.integer({ min: 40, max: 210 }), { nil: null }),
    }),
    { minLength: 3, maxLength: 40 },
  )
  .map((raw) => {
    let ds = 20;
    return raw.map((r): Row => {
      ds += r.stepDs;
      return { timeS: ds / 10, vo2MlMin: r.vo2MlMin, vco2MlMin: Math.round((r.vo2MlMin * r.rer100) / 100), veLMin: r.ve100 / 100, hrBpm: r.hrBpm };
    });
  });

const variantArb: fc.Arbitrary<Variant> = fc
  .record({
    delimiter: fc.constantFrom<Variant['delimiter']>(',', ';', '\t'),
    decimal: fc.constantFrom<Variant['decimal']>('.', ','),
    gasUnit: fc.constantFrom<Variant['gasUnit']>('mL/min', 'L/min'),
    time: fc.constantFrom<Variant['time']>('s', 'min', 'mm:ss', 'h:mm:ss'),
    units: fc.constantFrom<Variant['units']>('brackets', 'row', 'none'),
    metadata: fc.boolean(),
    crlf: fc.boolean(),
    encoding: fc.constantFrom<Variant['encoding']>('utf-8', 'utf-8-bom', 'utf-16le'),
  })
  // A decimal comma in a comma-delimited file would need quoting; carts use ; or tab then.
  .map((v) => (v.delimiter === ',' ? { ...v, decimal: '.' as const } : v))
  // Minutes without a unit are guessed from breath spacing, not known: keep the unit named.
  .map((v) => (v.time === 'min' && v.units === 'none' ? { ...v, units: 'brackets' as const } : v));

function num(x: number, decimals: number, mark: '.' | ','): string {
  const t = x.toFixed(decimals);
  return mark === ',' ? t.replace('.', ',') : t;
}

function timeCell(t: number, v: Variant): string {
  if (v.time === 's') return num(t, 1, v.decimal);
  if (v.time === 'min') return num(t / 60, 6, v.decimal);
  const m = Math.floor(t / 60);
  const s = (t - m * 60).toFixed(1).padStart(4, '0');
  if (v.time === 'mm:ss') return `${String(m).padStart(2, '0')}:${s}`;
  return `${Math.floor(m / 60)}:${String(m % 60).padStart(2, '0')}:${s}`;
}

function writeVariant(rows: Row[], v: Variant): Uint8Array {
  const timeUnit = v.time === 's' ? 's' : v.time === 'min' ? 'min' : v.time;
  const names = ['Time', "V'O2", "V'CO2", 'VE', 'HR'];
  const units = [timeUnit, v.gasUnit, v.gasUnit, 'L/min', 'bpm'];
  const header = v.units === 'brackets' ? names.map((n, i) => `${n} [${units[i]}]`) : names;
  const lines: string[] = [];
  if (v.metadata) lines.push('Exercise laboratory export', `Subject${v.delimiter}T-1`, '# weight: 70 kg', '');
  lines.push(header.join(v.delimiter));
  if (v.units === 'row') lines.push(units.join(v.delimiter));
  const gas = (x: number) => (v.gasUnit === 'L/min' ? num(x / 1000, 3, v.decimal) : num(x, 0, v.decimal));
  for (const r of rows) {
    lines.push([timeCell(r.timeS, v), gas(r.vo2MlMin), gas(r.vco2MlMin), num(r.veLMin, 2, v.decimal), r.hrBpm === null ? '' : String(r.hrBpm)].join(v.delimiter));
  }
  const text = lines.join(v.crlf ? '\r\n' : '\n') + (v.crlf ? '\r\n' : '\n');
  if (v.encoding === 'utf-16le') {
    const out = new Uint8Array(2 + text.length * 2);
    out[0] = 0xff;
    out[1] = 0xfe;
    for (let i = 0; i < text.length; i++) {
      out[2 + 2 * i] = text.charCodeAt(i) & 0xff;
      out[3 + 2 * i] = text.charCodeAt(i) >> 8;
    }
    return out;
  }
  const utf8 = new TextEncoder().encode(text);
  return v.encoding === 'utf-8-bom' ? new Uint8Array([0xef, 0xbb, 0xbf, ...utf8]) : utf8;
}

describe('the same numbers come back whatever the layout', () => {
  test('delimiter, decimal mark, units, unit placement, time format, metadata, line ends, encoding', () => {
    fc.assert(
      fc.property(rowsArb, variantArb, (rows, v) => {
        const r = readBreathBytes(writeVariant(rows, v), { sourceName: 'variant.csv' });
        if (!r.ok) throw new Error(`${JSON.stringify(v)}: ${r.error.code} ${r.error.message}`);
        const got = r.value.table.breaths;
        expect(got).toHaveLength(rows.length);
        expect(r.value.rejected).toEqual([]);
        for (let i = 0; i < rows.length; i++) {
          // minutes are written with 6 decimals: at most 0.5e-6 min = 3e-5 s off
          expect(Math.abs(got[i].timeS - rows[i].timeS)).toBeLessThan(1e-4);
          expect(got[i].vo2MlMin).toBeCloseTo(rows[i].vo2MlMin, 6);
          expect(got[i].vco2MlMin).toBeCloseTo(rows[i].vco2MlMin, 6);
          expect(got[i].veLMin).toBeCloseTo(rows[i].veLMin, 9);
          expect(got[i].hrBpm).toBe(rows[i].hrBpm);
        }
        if (v.metadata) expect(r.value.table.metadata.weightKg).toBe(70);
      }),
      { numRuns: 300, seed: 20260301 },
    );
  });
});

describe('any bytes give a table or a located import error, never an exception', () => {
  test('random bytes', () => {
    fc.assert(
      fc.property(fc.uint8Array({ maxLength: 400 }), (bytes) => {
        const r = readBreathBytes(bytes, { sourceName: 'random.bin' });
        if (!r.ok) {
          expect(typeof r.error.code).toBe('string');
          expect(r.error.file).toBe('random.bin');
        }
      }),
      { numRuns: 1000, seed: 7 },
    );
  });

  test('random text built from the characters exports are made of', () => {
    const piece = fc.constantFrom('t', 'Time', 'VO2', 'VCO2', 'VE', 'HR', 'RER', 'Borg', '(L/min)', '[s]', 'mm:ss', ';', ',', '\t', '\n', '\r\n', '"', ':', '#', '0', '1,5', '2.25', '-', '12:30', '1:02:03', 'x', ' ', '', 'kPa', '2026-03-09');
    fc.assert(
      fc.property(fc.array(piece, { maxLength: 200 }), (pieces) => {
        const bytes = new TextEncoder().encode(pieces.join(''));
        const r = readBreathBytes(bytes, { sourceName: 'noise.csv' });
        if (r.ok) expect(r.value.table.breaths.length).toBeGreaterThan(0);
        else expect(r.error.file).toBe('noise.csv');
      }),
      { numRuns: 1000, seed: 11 },
    );
  });

  test('a valid header with random rows under it', () => {
    const cell = fc.constantFrom('', '1', '2.5', '3,5', 'abc', '-', '00:05', '9:59:59', '"q"', '"', '1e400', 'NaN', '-7');
    const row = fc.array(cell, { maxLength: 7 }).map((cells) => cells.join(';'));
    fc.assert(
      fc.property(fc.array(row, { maxLength: 30 }), (rows) => {
        const text = ['Time;VO2;VCO2;VE;HR;RER', ...rows].join('\n');
        const r = readBreathBytes(new TextEncoder().encode(text), { sourceName: 'rows.csv' });
        if (r.ok) expect(r.value.table.breaths.length + r.value.rejected.length + r.value.table.rpe.length).toBeGreaterThanOrEqual(r.value.dataRows);
        else expect(r.error.file).toBe('rows.csv');
      }),
      { numRuns: 1000, seed: 13 },
    );
  });
});
