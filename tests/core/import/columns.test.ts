// Reference: hand-built headers; the rules are the documented ones in core/import/columns.ts
// (map first, then names, then units; magnitudes when no unit; 1 min = 60 s).
import { describe, expect, test } from 'vitest';
import { planColumns, type PlanInput } from '../../../core/import/columns';

function plan(headerCells: string[], sample: string[][], extra: Partial<PlanInput> = {}) {
  return planColumns({ file: 'c.csv', headerCells, unitCells: null, headerLine: 3, unitsLine: null, mapping: null, sample, decimal: '.', ...extra });
}

describe('planColumns', () => {
  test('a second column for the same variable is ignored, with a warning at its cell', () => {
    const r = plan(['t', 'VO2', 'VCO2', 'VE', 'HR', 'HR'], [['1', '300', '250', '9', '70', '71']]);
    if (!r.ok) throw new Error(r.error.message);
    expect(r.value.columns[5]).toMatchObject({ variable: null, note: 'a second HR column; column 5 is used' });
    expect(r.value.warnings.map((w) => [w.code, w.line, w.column])).toContainEqual(['duplicate-column', 3, 6]);
  });

  test('absolute VO2 wins over VO2 per kg', () => {
    const r = plan(['t (s)', 'VO2 (mL/min)', 'VO2/kg (mL/kg/min)', 'VCO2 (mL/min)', 'VE (L/min)'], [['1', '300', '4.3', '250', '9']]);
    if (!r.ok) throw new Error(r.error.message);
    expect(r.value.columns.map((c) => c.variable)).toEqual(['timeS', 'vo2MlMin', null, 'vco2MlMin', 'veLMin']);
  });

  test('a plain VO2 header with a per-kg unit feeds VO2 per kg', () => {
    const r = plan(['t (s)', 'VO2 (ml/kg/min)', 'VCO2 (mL/min)', 'VE (L/min)'], [['1', '4.3', '250', '9']]);
    expect(r.ok && r.value.columns[1].variable).toBe('vo2MlKgMin');
  });

  test('a unitless time whose breaths sit hundredths apart is minutes', () => {
    // 0.05 min = 3 s between breaths (breaths come 1–6 s apart, common practice)
    const sample = [['0.05', '300', '250', '9'], ['0.10', '300', '250', '9'], ['0.15', '300', '250', '9'], ['0.20', '300', '250', '9']];
    const r = plan(['Time', 'VO2 (mL/min)', 'VCO2 (mL/min)', 'VE (L/min)'], sample);
    expect(r.ok && [r.value.timeFormat, r.value.columns[0].unitInferred]).toEqual(['minutes', true]);
    const seconds = plan(['Time', 'VO2 (mL/min)', 'VCO2 (mL/min)', 'VE (L/min)'], [['3', '1', '1', '1'], ['6', '1', '1', '1'], ['9', '1', '1', '1']]);
    expect(seconds.ok && seconds.value.timeFormat).toBe('seconds');
  });

  test('a missing required column is fatal at the header line', () => {
    const r = plan(['t', 'VO2', 'VE'], [['1', '300', '9']]);
    expect(r.ok ? null : [r.error.code, r.error.line, r.error.column]).toEqual(['missing-column', 3, null]);
  });

  test("the trade's abbreviations stay in the synonym table: primed flows, BF, VTex, upper-case end-tidal names", () => {
    // The sample layouts no longer write these headers (they use plain words); real exports do.
    const r = plan(['t (s)', "V'O2 (ml/min)", "V'CO2 (ml/min)", "V'E (l/min)", 'HR', 'Load', 'PETO2', 'PETCO2', 'BF', 'VTex (l)'], [['1', '300', '250', '9', '70', '0', '100', '40', '15', '0.6']]);
    if (!r.ok) throw new Error(r.error.message);
    expect(r.value.columns.map((c) => c.variable)).toEqual(['timeS', 'vo2MlMin', 'vco2MlMin', 'veLMin', 'hrBpm', 'workW', 'peto2Mmhg', 'petco2Mmhg', 'rrPerMin', 'vtL']);
  });
});
