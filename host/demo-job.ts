/**
 * `twofold demo`: the whole job on the demo declining pair (sample-tests/demo/qh0417, an
 * invented subject at an invented lab). One reviewer override is recorded: day 2 VT1 set, by
 * its VO2, to the estimate of the method nearest the automatic consensus (a reviewer's usual
 * call when the methods disagree and one breakpoint reads clearly), with a reason; the
 * invented follow-up reports (sample-tests/scenario/demo-follow-ups.ts); then a sign-off. The report is signed with a
 * freshly generated demonstration certificate.
 */
import { fileURLToPath } from 'node:url';
import { dirname, join } from 'node:path';
import { existsSync, writeFileSync, mkdirSync } from 'node:fs';
import { newCase } from '../core/case/new-case';
import { recordOverride, recordSignOff, type Reviewer } from '../core/case/review';
import { recordDemoFollowUps } from './demo-follow-ups';
import { noClinicalInputs } from '../core/analyze/analyze-test';
import { DEFAULT_SETTINGS, type Settings } from '../core/model/settings';
import type { Result } from '../core/model/errors';
import { demoCertificate } from './demo-certificate';
import { readRaw, recordCase, runReportJob, type ReportJobResult } from './report-job';

/** sample-tests/demo in the nearest folder above this module that has one (the sources, or the built command line in dist/). */
function demoFolder(): string {
  const start = dirname(fileURLToPath(import.meta.url));
  for (let dir = start; ; dir = dirname(dir)) {
    const candidate = join(dir, 'sample-tests', 'demo');
    if (existsSync(candidate)) return candidate;
    if (dirname(dir) === dir) return join(start, '..', 'sample-tests', 'demo');
  }
}

export const DEMO_FOLDER = demoFolder();
export const DEMO_PAIR = { day1: 'qh0417-day1.csv', day2: 'qh0417-day2.csv' } as const;
export const DEMO_REVIEWER = 'A. Demo, exercise physiologist (demonstration)';

export interface DemoResult extends ReportJobResult {
  readonly certificatePath: string;
}

export async function runDemo(outDir: string, now: Date, paper: Settings['report']['paper'] = 'a4'): Promise<Result<DemoResult>> {
  mkdirSync(outDir, { recursive: true });
  const certificate = demoCertificate(now);
  const day1 = readRaw(join(DEMO_FOLDER, DEMO_PAIR.day1));
  const day2 = readRaw(join(DEMO_FOLDER, DEMO_PAIR.day2));
  const raw = { day1: day1.bytes, day2: day2.bytes };
  const at = now.toISOString().replace(/\.\d{3}Z$/, 'Z');
  const settings: Settings = { ...DEFAULT_SETTINGS, report: { paper } };
  let caseFile = newCase(at, day1, day2, settings, { day1: noClinicalInputs(), day2: noClinicalInputs() });
  const first = recordCase(caseFile, raw);
  if (!first.ok) return first;
  const reviewer: Reviewer = { who: 'A. Demo', role: 'exercise physiologist (demonstration)', at };
  const vt1 = first.value.outcome.day2.vt1;
  const consensus = vt1.automatic.at?.vo2MlMin ?? null;
  const candidates = vt1.automatic.methods.flatMap((m) => (m.found && consensus !== null && Math.abs(m.vo2MlMin - consensus) >= 1 ? [m] : []));
  const chosen = candidates.sort((a, b) => Math.abs(a.vo2MlMin - (consensus ?? 0)) - Math.abs(b.vo2MlMin - (consensus ?? 0)))[0];
  if (!chosen) return { ok: false, error: { code: 'demo-no-method', file: DEMO_PAIR.day2, line: null, column: null, message: 'No VT1 method found a breakpoint on the demo day 2, so the demonstration override cannot be made.' } };
  const reason = `Demonstration: on day 2 the reviewer reads the breakpoint where the ${chosen.label} method puts it (VO₂ ${Math.round(chosen.vo2MlMin)} mL/min) and sets VT1 there rather than at the consensus of all methods.`;
  const overridden = recordOverride(caseFile, first.value.outcome, reviewer, 2, 'vt1', { vo2MlMin: chosen.vo2MlMin }, reason);
  if (!overridden.ok) return overridden;
  caseFile = overridden.value;
  const followedUp = recordDemoFollowUps(caseFile, { who: 'B. Demo', role: 'lab coordinator (demonstration)', at });
  if (!followedUp.ok) return followedUp;
  caseFile = followedUp.value;
  const signedOff = recordSignOff(caseFile, reviewer, 'Reviewed; thresholds accepted as shown (demonstration).', 'Demonstration sign-off.');
  if (!signedOff.ok) return signedOff;
  caseFile = signedOff.value;
  const result = await runReportJob({
    caseFile,
    raw,
    caseFolder: join(outDir, 'case'),
    outPath: join(outDir, 'twofold-demo-report.pdf'),
    reviewer: DEMO_REVIEWER,
    certificate: { name: 'demonstration certificate', kind: 'demonstration', material: certificate },
    now,
  });
  const certificatePath = join(outDir, 'demo-certificate.pem');
  writeFileSync(certificatePath, (await certificate).certificatePem);
  return result.ok ? { ok: true, value: { ...result.value, certificatePath } } : result;
}
