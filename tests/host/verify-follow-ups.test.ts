// `verify` checks follow-up reports like every other recorded number: the demo pair with the
// demo's invented follow-ups verifies; an edited rating in the attached case file is caught by
// the hash chain; a recorded recovery time that does not follow from the log is caught by the
// recompute, named by its path. A forger is assumed to re-sign with a key of their own, so the
// signature alone cannot catch it.
import { describe, expect, it } from 'vitest';
import type { CaseFile } from '../../core/case/case-file';
import { caseToText } from '../../core/case/case-text';
import { defaultEngine } from '../../core/case/default-engine';
import { newCase } from '../../core/case/new-case';
import { recomputeCase } from '../../core/case/recompute';
import { noClinicalInputs } from '../../core/analyze/analyze-test';
import { DEFAULT_SETTINGS } from '../../core/model/settings';
import { buildReport } from '../../core/report/build-report';
import { signReport } from '../../host/sign-report';
import { DEMO_FOLDER, DEMO_PAIR } from '../../host/demo-job';
import { recordDemoFollowUps } from '../../host/demo-follow-ups';
import { reportFonts } from '../../host/fonts';
import { readRaw } from '../../host/report-job';
import { verifyReport } from '../../host/verify-report';
import { join } from 'node:path';
import { opensslCertificate, trustOf } from '../core/report/fixture';

const cert = opensslCertificate();
const day1 = readRaw(join(DEMO_FOLDER, DEMO_PAIR.day1));
const day2 = readRaw(join(DEMO_FOLDER, DEMO_PAIR.day2));
const raw = { day1: day1.bytes, day2: day2.bytes };

function demoCase(): CaseFile {
  const c = newCase('2026-03-10T08:00:00Z', day1, day2, DEFAULT_SETTINGS, { day1: noClinicalInputs(), day2: noClinicalInputs() });
  const f = recordDemoFollowUps(c, { who: 'C. Coordinator', role: 'lab coordinator', at: '2026-03-12T10:00:00Z' });
  if (!f.ok) throw new Error(f.error.message);
  return f.value;
}

/** The signed report of `caseFile` with `caseText` attached as its case file (by default the honest text). */
async function signed(caseFile: CaseFile, edit: (text: string) => string = (t) => t) {
  const outcome = recomputeCase(caseFile, raw, defaultEngine);
  if (!outcome.ok) throw new Error(outcome.error.message);
  const recorded = { ...caseFile, recorded: outcome.value.recorded };
  const caseText = edit(caseToText(recorded));
  const pdf = await buildReport({ caseFile: recorded, caseText, outcome: outcome.value, raw, fonts: reportFonts(), generatedAt: '2026-03-14T10:00:00Z', reviewer: 'T. Tester', signature: 'lab' });
  const s = await signReport(pdf, { p12: cert.p12, passphrase: cert.password, p12Name: 'lab.p12', signerName: 'T. Tester', reason: 'test', location: 'test lab', signingTime: new Date('2026-03-14T10:05:00Z') });
  if (!s.ok) throw new Error(s.error.message);
  return { pdf: s.value, numbers: outcome.value.recorded.numbers };
}

describe('verify: follow-up reports', () => {
  const c = demoCase();

  it('records the follow-up figures with the numbers, and an honest report verifies', async () => {
    const { pdf, numbers } = await signed(c);
    // The demo's day 2 reports (sample-tests/scenario/demo-follow-ups.ts): not back at 20, 72 (corrected from 27) and 168 h, back at 288 h.
    expect(numbers['followUp.day2.recoveredByH']).toBe(288);
    expect(numbers['followUp.day2.notYetAtH']).toBe(168);
    expect(numbers['followUp.day1.recovery']).toBe('not-recovered');
    expect(numbers['followUp.day2.reportsInForce[1].afterTestH']).toBe(72);
    const verdict = await verifyReport(pdf, 'report.pdf', { trust: trustOf(cert) });
    expect(verdict.steps.filter((s) => !s.ok).map((s) => s.what)).toEqual([]);
    expect(verdict.passed).toBe(true);
  }, 120_000);

  it('fails on a rating edited in the attached case file (the chain breaks)', async () => {
    const { pdf } = await signed(c, (t) => t.replace('"score": 8', '"score": 2'));
    const verdict = await verifyReport(pdf, 'report.pdf', { trust: trustOf(cert) });
    expect(verdict.passed).toBe(false);
    expect(verdict.steps[verdict.steps.length - 1].what).toMatch(/^Case file: .*Reviewer log entry \d+ .* was edited after it was recorded/);
  }, 120_000);

  it('fails, naming the figure, on a recorded recovery time that does not follow from the log', async () => {
    const { pdf } = await signed(c, (t) => t.replace('"followUp.day2.recoveredByH": 288', '"followUp.day2.recoveredByH": 48'));
    const verdict = await verifyReport(pdf, 'report.pdf', { trust: trustOf(cert) });
    expect(verdict.passed).toBe(false);
    expect(verdict.steps[verdict.steps.length - 1].what).toContain('followUp.day2.recoveredByH recorded 48, recomputed 288');
  }, 120_000);
});
