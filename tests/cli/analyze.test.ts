// `twofold analyze` end to end on a generated test written as a plain CSV: output shape,
// flag overrides (Tanaka 208 − 0.7 × age) and exit codes (0 ok, 2 bad input, as cli/io.ts states).
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { run } from '../../cli/commands/analyze';
import { main } from '../../cli/main';
import type { CliIo } from '../../cli/io';
import { defaultCycleParams, generateTest } from '../../sample-tests/generator';

let dir = '';

function capture(): { io: CliIo; out: () => string; err: () => string } {
  let out = '';
  let err = '';
  const io: CliIo = { out: (t) => (out += t), err: (t) => (err += t), env: {}, cwd: dir, interactive: false };
  return { io, out: () => out, err: () => err };
}

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'twofold-analyze-'));
  const { table } = generateTest({ ...defaultCycleParams(), outlierBreaths: 4 }, 21);
  const rows = table.breaths.map((b) =>
    [b.timeS.toFixed(2), b.vo2MlMin.toFixed(0), b.vco2MlMin.toFixed(0), b.veLMin.toFixed(2), b.hrBpm?.toFixed(0) ?? '', b.workW?.toFixed(0) ?? '', b.peto2Mmhg?.toFixed(1) ?? '', b.petco2Mmhg?.toFixed(1) ?? ''].join(','),
  );
  const text = ['Age: 40', 'Sex: F', 'Height: 168', 'Weight: 68', 'Modality: cycle', '', 'Time (s),VO2 (mL/min),VCO2 (mL/min),VE (L/min),HR (bpm),Work (W),PetO2 (mmHg),PetCO2 (mmHg)', ...rows].join('\n');
  writeFileSync(join(dir, 'day1.csv'), text);
  writeFileSync(join(dir, 'broken.csv'), 'Time (s),HR (bpm)\n0,70\n3,71\n');
  writeFileSync(join(dir, 'bad-settings.json'), '{\n  "peaks": {"windowS": 30},\n}');
  writeFileSync(join(dir, 'settings.json'), '{"effort": {"hrMaxFormula": "fox"}}');
});

describe('twofold analyze', () => {
  it('prints the JSON shape with --json', async () => {
    const c = capture();
    expect(await run(['day1.csv', '--json'], c.io)).toBe(0);
    const j = JSON.parse(c.out());
    for (const t of [j.vt1, j.vt2]) {
      expect(t).not.toBeNull();
      expect(Object.keys(t)).toEqual(expect.arrayContaining(['time_s', 'vo2_ml_min', 'work_w', 'hr_bpm', 'ci95_vo2_ml_min', 'methods']));
      expect(t.ci95_vo2_ml_min).toHaveLength(2);
      expect(Object.values(t.methods).some((m: any) => typeof m.vo2_ml_min === 'number')).toBe(true);
    }
    expect(Object.keys(j.peak)).toEqual(expect.arrayContaining(['vo2_ml_min', 'vo2_ml_kg_min', 'rer', 'hr_bpm', 'work_w', 've_l_min']));
    expect(j.effort.verdict).toBe('maximal');
    expect(j.effort.criteria.map((c: any) => c.id)).toEqual(['peak_rer', 'vo2_plateau', 'peak_hr', 'peak_rpe', 'lactate']);
    // File metadata: age 40 → Tanaka 208 − 28 = 180 bpm.
    expect(j.predicted.hr_max_bpm).toBeCloseTo(180, 9);
    expect(Array.isArray(j.warnings)).toBe(true);
  });

  it('lets flags override the metadata and a settings file the defaults', async () => {
    const c = capture();
    expect(await run(['day1.csv', '--json', '--age', '60', '--lactate', '9'], c.io)).toBe(0);
    const j = JSON.parse(c.out());
    // Tanaka: 208 − 0.7 × 60 = 166 bpm.
    expect(j.predicted.hr_max_bpm).toBeCloseTo(166, 9);
    expect(j.effort.criteria.find((x: any) => x.id === 'lactate')).toMatchObject({ value: 9, met: true });
    const s = capture();
    expect(await run(['day1.csv', '--json', '--settings', 'settings.json'], s.io)).toBe(0);
    expect(JSON.parse(s.out()).effort.criteria.find((x: any) => x.id === 'peak_hr').source).toContain('Fox 1971');
    // Fox at age 60, through the main entry: 220 − 60 = 160 bpm.
    const m = capture();
    expect(await main(['analyze', 'day1.csv', '--json', '--settings', 'settings.json', '--age', '60'], m.io)).toBe(0);
    expect(JSON.parse(m.out()).predicted.hr_max_bpm).toBe(160);
  });

  it('prints a readable summary with units', async () => {
    const c = capture();
    expect(await run(['day1.csv'], c.io)).toBe(0);
    expect(c.out()).toMatch(/VT1: VO2 \d+ mL\/min/);
    expect(c.out()).toMatch(/Peak: VO2 \d+ mL\/min \(\d+\.\d mL\/kg\/min/);
    expect(c.out()).toContain('Effort: maximal');
    expect(c.out()).toContain('does not diagnose');
  });

  it('exits 2 with FILE:LINE:COLUMN for a file without the required columns', async () => {
    const c = capture();
    expect(await run(['broken.csv'], c.io)).toBe(2);
    expect(c.err()).toMatch(/^broken\.csv:\d+:\d+: /);
  });

  it('exits 2 for a missing file, a bad settings file and bad flags', async () => {
    const missing = capture();
    expect(await run(['nothing.csv'], missing.io)).toBe(2);
    expect(missing.err()).toMatch(/^nothing\.csv:0:0: The file cannot be read/);
    const settings = capture();
    expect(await run(['day1.csv', '--settings', 'bad-settings.json'], settings.io)).toBe(2);
    expect(settings.err()).toMatch(/^bad-settings\.json:3:1: /);
    for (const flags of [['--sex', 'X'], ['--age', 'old'], ['--fev1-l', '3', '--mvv-l-min', '120'], ['--rpe', '25'], ['--nonsense']]) {
      const c = capture();
      expect(await main(['analyze', 'day1.csv', ...flags], c.io)).toBe(2);
    }
  });
});
