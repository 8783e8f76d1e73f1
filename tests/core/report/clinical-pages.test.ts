// The report's clinical pages on the demo pair (sample-tests/demo/), read back with poppler's
// pdftotext: settings in words with no raw keys, the per-day table's derived values recomputed
// here from the analysis by their published formulas (METs = VO2/kg ÷ 3.5, common practice;
// Weber et al., Circulation 1982: A > 20 mL/kg/min), the effort rule as applied ("below" for
// the plateau, the ramp's slope ratio shown), the reviewer-set threshold marked, and DRAFT on
// every page when no sign-off is in force.
import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { DEFAULT_SETTINGS, SETTING_SOURCES } from '../../../core/model/settings';
import { dayMeasureRows } from '../../../core/report/day-measures';
import { PHRASED_KEYS, settingsInWords } from '../../../core/report/settings-text';
import { demoReport } from './fixture';

let pages: string[];
let text: string;
let report: Awaited<ReturnType<typeof demoReport>>;

beforeAll(async () => {
  report = await demoReport();
  const dir = mkdtempSync(join(tmpdir(), 'twofold-clinical-'));
  writeFileSync(join(dir, 'r.pdf'), report.pdf);
  const raw = spawnSync('pdftotext', [join(dir, 'r.pdf'), '-'], { encoding: 'utf8' }).stdout;
  pages = raw.split('\f').filter((p) => p.trim() !== '');
  text = raw.replace(/\s+/g, ' ');
}, 120_000);

describe('settings in words', () => {
  it('every setting with a source has its own sentence', () => {
    expect(Object.keys(SETTING_SOURCES).filter((k) => !PHRASED_KEYS.includes(k))).toEqual([]);
  });

  it('states the implausibility limit as a clinician reads it', () => {
    const line = settingsInWords(DEFAULT_SETTINGS).find((l) => l.key === 'import.implausible.vo2MaxMlMin');
    expect(line?.text).toBe('VO₂ above 8,000 mL/min is treated as implausible.');
    expect(text).toContain('VO₂ above 8,000 mL/min is treated as implausible.');
  });

  it('prints no raw setting key in the PDF text (they stay in the embedded case file)', () => {
    for (const key of Object.keys(SETTING_SOURCES)) expect(text).not.toContain(key);
    expect(text).not.toContain('incrementalStartS');
  });
});

describe('per-day clinical table', () => {
  it('METs and Weber class follow from peak VO2/kg by their formulas', () => {
    const a = report.outcome.day1.analysis;
    const perKg = a.peak.vo2MlKgMin as number;
    const rows = dayMeasureRows(report.outcome.day1);
    const mets = rows.find((r) => r[0] === 'METs at peak')!;
    expect(mets[1]).toBe((perKg / 3.5).toFixed(1));
    const weber = rows.find((r) => r[0] === 'Weber class')!;
    expect(weber[1]).toBe(perKg > 20 ? 'A' : perKg >= 16 ? 'B' : perKg >= 10 ? 'C' : 'D');
    expect(text).toContain('Peak VO₂, % predicted (FRIEND)');
    expect(text).toContain('% predicted (Hansen');
    expect(text).toContain('ΔVO₂/ΔWR');
  });

  it('breathing reserve says what it needs when neither MVV nor FEV1 is given', () => {
    const row = dayMeasureRows(report.outcome.day1).find((r) => r[0] === 'Breathing reserve')!;
    expect(row[1]).toBe('not assessed');
    expect(row[2]).toContain('needs MVV or FEV1');
  });

  it('HR at VT1 stands beside its rules of thumb, labelled as such', () => {
    const a = report.outcome.day1.analysis;
    const hrMax = a.predicted.hrMaxBpm as number;
    const rows = dayMeasureRows(report.outcome.day1);
    expect(rows.find((r) => r[0].startsWith('HR at VT1'))![1]).toBe(`${Math.round(a.vt1.at!.hrBpm!)} bpm`);
    // 55–60 % of age-predicted HRmax (common practice).
    expect(rows.find((r) => r[0].startsWith('Rule of thumb: 55–60'))![1]).toBe(`${(0.55 * hrMax).toFixed(0)}–${(0.6 * hrMax).toFixed(0)} bpm`);
  });

  it('marks the VT1 values that the reviewer set (the fixture moves day 2 VT1)', () => {
    expect(dayMeasureRows(report.outcome.day2).find((r) => r[0].startsWith('At VT1'))![0]).toBe('At VT1 ‡');
    expect(dayMeasureRows(report.outcome.day1).find((r) => r[0].startsWith('At VT1'))![0]).toBe('At VT1');
    expect(text).toContain('‡ Value read at a threshold set by a reviewer');
  });
});

describe('effort table', () => {
  it('prints the plateau rule as "below", with the ramp slope-ratio part, and no over-precision', () => {
    expect(text).toContain('rise below 2.1 mL/kg/min over the final minute');
    expect(text).toMatch(/slope ratio \d\.\d\d/);
    expect(text).not.toContain('Required ≥ 2.1');
    expect(text).not.toMatch(/\d+\.\d\d %/);
    expect(text).toContain('Verdict rule: Maximal when the peak RER criterion and at least one other criterion are met');
  });
});

describe('draft mark', () => {
  it('a report whose case has no sign-off is marked DRAFT on every page', () => {
    expect(report.caseFile.log.some((e) => e.action.kind === 'sign-off')).toBe(false);
    expect(pages.length).toBeGreaterThan(5);
    for (const p of pages) expect(p).toContain('DRAFT: no reviewer sign-off is in force for this case');
  });
});
