// Reference: sample-tests/ (the demo tests in our own layout, and the same test written in
// several invented export layouts by sample-tests/layout-writers/). Each layout file must
// import to the values of its our-layout file, within the rounding that layout's writer uses
// (stated per layout below, half of its last written digit).
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { basename, extname, join } from 'node:path';
import { describe, expect, test } from 'vitest';
import type { Breath } from '../../../core/model/breath-table';
import { readBreathFile } from '../../../core/import/read-table';
import { writeBreathCsv } from '../../../core/export/breath-csv';

const root = join(__dirname, '../../../sample-tests');
const demoDir = join(root, 'demo');
const layoutsDir = join(root, 'layouts');

type Tolerance = Partial<Record<keyof Breath, number>>;

/** Half a unit of the last digit each layout writer keeps (see its doc comment). */
const TOLERANCE: Readonly<Record<string, Tolerance>> = {
  // mm:ss whole seconds; L/min with 3 decimals; VE 2; HR, W 0; PetO2/PetCO2, RR 1; VT 3
  'narrative-semicolon': { timeS: 0.5, vo2MlMin: 0.5, vco2MlMin: 0.5, veLMin: 0.005, hrBpm: 0.5, workW: 0.5, peto2Mmhg: 0.05, petco2Mmhg: 0.05, rrPerMin: 0.05, vtL: 0.0005 },
  // s with 1 decimal; mL/min 0; VE 2; HR, W 0; PetO2/PetCO2, RR 1; VT 3
  'quoted-utf16': { timeS: 0.05, vo2MlMin: 0.5, vco2MlMin: 0.5, veLMin: 0.005, hrBpm: 0.5, workW: 0.5, peto2Mmhg: 0.05, petco2Mmhg: 0.05, rrPerMin: 0.05, vtL: 0.0005 },
  // clock whole seconds; mL/min 0; VE 2; kPa with 2 decimals = ±0.005 kPa = ±0.0375 mmHg; VT mL 0
  'tabbed-units-clock': { timeS: 0.5, vo2MlMin: 0.5, vco2MlMin: 0.5, veLMin: 0.005, hrBpm: 0.5, workW: 0.5, peto2Mmhg: 0.04, petco2Mmhg: 0.04, rrPerMin: 0.05, vtL: 0.0005 },
  // minutes with 3 decimals = ±0.03 s; everything else stored as the number itself
  workbook: { timeS: 0.03, vo2MlMin: 1e-9, vco2MlMin: 1e-9, veLMin: 1e-9, hrBpm: 1e-9, workW: 1e-9, peto2Mmhg: 1e-9, petco2Mmhg: 1e-9, rrPerMin: 1e-9, vtL: 1e-9 },
};

const VARIABLES: (keyof Breath)[] = ['timeS', 'vo2MlMin', 'vco2MlMin', 'veLMin', 'hrBpm', 'workW', 'peto2Mmhg', 'petco2Mmhg', 'rrPerMin', 'vtL'];

const layoutFiles = existsSync(layoutsDir)
  ? readdirSync(layoutsDir).flatMap((layout) => readdirSync(join(layoutsDir, layout)).map((f) => ({ layout, file: join(layoutsDir, layout, f) })))
  : [];

async function importFile(path: string) {
  const r = await readBreathFile(new Uint8Array(readFileSync(path)), { sourceName: path });
  if (!r.ok) throw new Error(`${r.error.code}: ${r.error.message}`);
  return r.value;
}

describe.runIf(existsSync(demoDir))('demo files in our own layout', () => {
  const demos = existsSync(demoDir) ? readdirSync(demoDir).filter((f) => f.endsWith('.csv')) : [];
  test.each(demos)('%s imports with no rejected row and writes back to the same bytes', async (name) => {
    const path = join(demoDir, name);
    const r = await importFile(path);
    expect(r.rejected).toEqual([]);
    expect(r.warnings).toEqual([]);
    // our writer (core/export/breath-csv.ts) and our reader are inverse: the file is reproduced
    expect(writeBreathCsv(r.table)).toBe(readFileSync(path, 'utf8'));
  });
});

describe.runIf(layoutFiles.length > 0)('invented export layouts import to the canonical values', () => {
  test.each(layoutFiles)('$layout', async ({ layout, file }) => {
    const tolerance = TOLERANCE[layout];
    expect(tolerance, `no stated rounding for layout ${layout}`).toBeDefined();
    const canonical = await importFile(join(demoDir, `${basename(file, extname(file))}.csv`));
    const other = await importFile(file);
    expect(other.rejected).toEqual([]);
    expect(other.table.breaths).toHaveLength(canonical.table.breaths.length);
    expect(other.table.metadata.subjectId).toBe(canonical.table.metadata.subjectId);
    for (let i = 0; i < canonical.table.breaths.length; i++) {
      const a = canonical.table.breaths[i];
      const b = other.table.breaths[i];
      for (const v of VARIABLES) {
        const x = a[v] as number | null;
        const y = b[v] as number | null;
        if (x === null) {
          expect(y, `${layout} row ${i} ${v}`).toBeNull();
          continue;
        }
        expect(y, `${layout} row ${i} ${v}`).not.toBeNull();
        expect(Math.abs((y as number) - x), `${layout} row ${i} ${v}: ${y} vs ${x}`).toBeLessThanOrEqual(tolerance[v]! + 1e-9);
      }
    }
    if (layout !== 'quoted-utf16') {
      // quoted-utf16 carries only the peak rating, as a metadata line
      expect(other.table.rpe.map((r) => r.borg)).toEqual(canonical.table.rpe.map((r) => r.borg));
    }
  });
});
