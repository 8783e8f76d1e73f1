// Recomputing a case on the demo pair with Twofold's own engine: the same case always gives
// the same numbers; an override given as a VO2 puts exactly that VO2 at the threshold
// (the inverse of linear interpolation, worked in overrides.ts, read back through valuesAt's
// own linear interpolation), and the comparison row follows it; withdrawing the override
// restores the automatic numbers exactly. Recording in a second step gives the same record,
// and its digest is the SHA-256 of the canonical JSON of the result, checked against Node's
// own crypto (OpenSSL), an implementation independent of the one core uses.
import { createHash } from 'node:crypto';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { noClinicalInputs } from '../../../core/analyze/analyze-test';
import { defaultEngine } from '../../../core/case/default-engine';
import { newCase } from '../../../core/case/new-case';
import { canonicalJson } from '../../../core/case/canonical-json';
import { recomputeCase, recomputeValues, recordResults } from '../../../core/case/recompute';
import { recordOverride, recordWithdrawal } from '../../../core/case/review';
import { DEFAULT_SETTINGS } from '../../../core/model/settings';
import { DEMO_FOLDER, DEMO_PAIR } from '../../../host/demo-job';
import { readRaw } from '../../../host/report-job';

const day1 = readRaw(join(DEMO_FOLDER, DEMO_PAIR.day1));
const day2 = readRaw(join(DEMO_FOLDER, DEMO_PAIR.day2));
const raw = { day1: day1.bytes, day2: day2.bytes };
const base = newCase('2026-03-11T10:00:00Z', day1, day2, DEFAULT_SETTINGS, { day1: noClinicalInputs(), day2: noClinicalInputs() });
const reviewer = { who: 'T. Tester', role: 'reviewer', at: '2026-03-11T10:10:00Z' };

function run(c = base) {
  const r = recomputeCase(c, raw, defaultEngine);
  if (!r.ok) throw new Error(r.error.message);
  return r.value;
}

describe('recomputeCase', () => {
  it('gives identical numbers and digest on every run', () => {
    const a = run();
    const b = run();
    expect(b.recorded).toEqual(a.recorded);
    expect(a.recorded.digest).toMatch(/^[0-9a-f]{64}$/);
  });

  it('an override by VO2 puts that VO2 at day 2 VT1 and the comparison follows; withdrawal restores it', () => {
    const auto = run();
    const target = Math.round((auto.day2.vt1.automatic.at?.vo2MlMin ?? 1000) * 0.9);
    const moved = recordOverride(base, auto, reviewer, 2, 'vt1', { vo2MlMin: target }, 'reads 10% lower');
    if (!moved.ok) throw new Error(moved.error.message);
    const after = run(moved.value);
    expect(after.day2.analysis.vt1.at?.vo2MlMin).toBeCloseTo(target, 6);
    const row = after.comparison.metrics.find((m) => m.id === 'vt1_vo2');
    expect(row?.day2).toBeCloseTo(target, 6);
    // Day 1 is untouched by a day 2 override.
    expect(after.day1.analysis.vt1).toEqual(auto.day1.analysis.vt1);
    expect(after.recorded.numbers['day2.vt1Source']).toBe('reviewer#1');
    const back = recordWithdrawal(moved.value, after, reviewer, 1, 'second look: automatic estimate is right');
    if (!back.ok) throw new Error(back.error.message);
    const action = back.value.log[2].action;
    expect(action.kind === 'withdraw' && action.after?.vo2MlMin).toBe(auto.day2.vt1.automatic.at?.vo2MlMin);
    const restored = run(back.value);
    expect(restored.recorded.digest).toBe(auto.recorded.digest);
  });

  it('values first and the record on request give exactly what recomputeCase gives', () => {
    const whole = run();
    const values = recomputeValues(base, raw, defaultEngine);
    if (!values.ok) throw new Error(values.error.message);
    expect(values.value).toEqual({ day1: whole.day1, day2: whole.day2, comparison: whole.comparison });
    const recorded = recordResults(values.value);
    if (!recorded.ok) throw new Error(recorded.error.message);
    expect(recorded.value).toEqual(whole.recorded);
    const text = canonicalJson({ day1: whole.day1.analysis, day2: whole.day2.analysis, comparison: whole.comparison }, 'test', 'as-string');
    if (!text.ok) throw new Error(text.error.message);
    expect(whole.recorded.digest).toBe(createHash('sha256').update(text.value, 'utf8').digest('hex'));
  });

  it('recomputeValues refuses changed raw bytes as recomputeCase does', () => {
    const r = recomputeValues(base, { day1: raw.day1, day2: raw.day1 }, defaultEngine);
    expect(!r.ok && r.error.code).toBe('raw-file-changed');
  });

  it('refuses raw bytes that are not the ones the case names', () => {
    const r = recomputeCase(base, { day1: raw.day1, day2: raw.day1 }, defaultEngine);
    expect(!r.ok && r.error.code).toBe('raw-file-changed');
  });
});
