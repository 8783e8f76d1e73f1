// Pairing rules of two-day testing (about 24 h apart, 20–52 h window: common practice);
// intervals worked by hand from the ISO start times.
import { describe, expect, it } from 'vitest';
import { pairTests } from '../../../core/compare/pairing';
import { DEFAULT_SETTINGS } from '../../../core/model/settings';
import { buildAnalysis } from './fixture';

describe('pairTests', () => {
  const day1 = buildAnalysis();

  it('a proper pair: 09:00 → 09:30 next day = 24.5 h, no warnings', () => {
    const p = pairTests(day1, buildAnalysis({ metadata: { testStart: '2026-03-03T09:30:00Z' } }), DEFAULT_SETTINGS);
    expect(p.intervalH).toBeCloseTo(24.5, 10);
    expect(p.warnings).toEqual([]);
    expect(p.hardMismatch).toBe(false);
  });

  it('a different subject is a hard mismatch', () => {
    const p = pairTests(day1, buildAnalysis({ metadata: { subjectId: 'S-02', testStart: '2026-03-03T09:00:00Z' } }), DEFAULT_SETTINGS);
    expect(p.hardMismatch).toBe(true);
    expect(p.warnings[0]).toMatchObject({ code: 'different-subject', severity: 'hard' });
    expect(p.warnings[0].message).toMatch(/^DIFFERENT SUBJECTS/);
  });

  it('subject ids compare without case or surrounding space', () => {
    const p = pairTests(day1, buildAnalysis({ metadata: { subjectId: ' s-01 ', testStart: '2026-03-03T09:00:00Z' } }), DEFAULT_SETTINGS);
    expect(p.hardMismatch).toBe(false);
  });

  it('84 h apart lies outside 18–72 h; day 2 before day 1 is noted (the refusal is refusals.ts)', () => {
    const late = pairTests(day1, buildAnalysis({ metadata: { testStart: '2026-03-05T21:00:00Z' } }), DEFAULT_SETTINGS);
    expect(late.intervalH).toBe(84);
    expect(late.warnings.map((w) => w.code)).toEqual(['interval-outside']);
    const early = pairTests(day1, buildAnalysis({ metadata: { testStart: '2026-03-01T09:00:00Z' } }), DEFAULT_SETTINGS);
    expect(early.intervalH).toBe(-24);
    expect(early.warnings.map((w) => w.code)).toEqual(['day2-not-after-day1']);
  });

  it('states a start time without a zone, read as UTC', () => {
    const p = pairTests(day1, buildAnalysis({ metadata: { testStart: '2026-03-03T09:00:00' } }), DEFAULT_SETTINGS);
    expect(p.warnings.map((w) => w.code)).toEqual(['start-without-zone']);
    expect(p.intervalH).toBe(24);
  });

  it('ramp 15 vs 20 W/min warns; 15 vs 15.5 W/min (within 1 W/min) does not', () => {
    const d2 = '2026-03-03T09:00:00Z';
    const steep = pairTests(day1, buildAnalysis({ rampWPerMin: 20, metadata: { testStart: d2 } }), DEFAULT_SETTINGS);
    expect(steep.warnings.map((w) => w.code)).toEqual(['different-ramp']);
    const close = pairTests(day1, buildAnalysis({ rampWPerMin: 15.5, metadata: { testStart: d2 } }), DEFAULT_SETTINGS);
    expect(close.warnings).toEqual([]);
  });

  it('different modality and protocol, missing subject and start time are all warnings', () => {
    const p = pairTests(day1, buildAnalysis({ metadata: { subjectId: null, testStart: null, modality: 'treadmill', protocol: 'steps' } }), DEFAULT_SETTINGS);
    expect(p.warnings.map((w) => w.code).sort()).toEqual(['different-modality', 'different-protocol', 'interval-unknown', 'subject-unknown']);
    expect(p.intervalH).toBeNull();
    expect(p.hardMismatch).toBe(false);
  });
});
