// `verify` on a report whose day-1 file needed a column map. References: the original demo
// file read by detection alone (renaming a header and naming it back changes no value, see
// mapped-case.ts); poppler's pdfsig as an independent check of the signature.
import { execFileSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import type { CaseFile } from '../../core/case/case-file';
import { caseToText } from '../../core/case/case-text';
import { defaultEngine } from '../../core/case/default-engine';
import type { Engine } from '../../core/case/engine';
import type { Comparison } from '../../core/compare/compare-tests';
import { recomputeCase } from '../../core/case/recompute';
import type { ColumnMapping } from '../../core/import/mapping';
import { DEFAULT_SETTINGS } from '../../core/model/settings';
import { buildReport } from '../../core/report/build-report';
import { signReport } from '../../host/sign-report';
import { DEMO_PAIR } from '../../host/demo-job';
import { reportFonts } from '../../host/fonts';
import { verifyReport } from '../../host/verify-report';
import { layoutKeyOf, workbenchEngine } from '../../renderer/src/engine/core-engine';
import { opensslCertificate, trustOf } from '../core/report/fixture';
import { day2, heartRateMap, mappedCase, original, originalCase, renamed } from './mapped-case';

const cert = opensslCertificate();

/** The engine the workbench's worker builds: the remembered map keyed by the layout of the file's plain import. */
async function workbenchWay(map: ColumnMapping) {
  const plain = await workbenchEngine(new Map()).preload(DEMO_PAIR.day1, renamed, DEFAULT_SETTINGS);
  if (!plain.ok) throw new Error(plain.error.message);
  const engine = workbenchEngine(new Map([[layoutKeyOf(plain.value), map]]));
  await engine.preload(DEMO_PAIR.day1, renamed, DEFAULT_SETTINGS);
  await engine.preload(DEMO_PAIR.day2, day2, DEFAULT_SETTINGS);
  return engine;
}

/**
 * Builds and signs the report of `caseFile`, as an export from the workbench does, with the
 * numbers recorded from `recordedFrom` (the same case unless a test makes them differ).
 */
async function signedReport(caseFile: CaseFile, engine: Engine<Comparison>, recordedFrom: CaseFile = caseFile) {
  const raw = { day1: renamed, day2 };
  const outcome = recomputeCase(recordedFrom, raw, engine);
  if (!outcome.ok) throw new Error(outcome.error.message);
  const recorded = { ...caseFile, recorded: outcome.value.recorded };
  const pdf = await buildReport({ caseFile: recorded, caseText: caseToText(recorded), outcome: outcome.value, raw, fonts: reportFonts(), generatedAt: '2026-03-11T10:00:00Z', reviewer: 'T. Tester', signature: 'lab' });
  const signed = await signReport(pdf, { p12: cert.p12, passphrase: cert.password, p12Name: 'lab.p12', signerName: 'T. Tester', reason: 'test', location: 'test lab', signingTime: new Date('2026-03-11T10:05:00Z') });
  if (!signed.ok) throw new Error(signed.error.message);
  return { pdf: signed.value, recorded: outcome.value.recorded };
}

describe('verify: a report whose day-1 file needed a column map', () => {
  it('verifies when the case records the map the workbench read with, and reproduces the original file\'s numbers', async () => {
    const { pdf, recorded } = await signedReport(mappedCase(heartRateMap), await workbenchWay(heartRateMap));
    const verdict = await verifyReport(pdf, 'report.pdf', { trust: trustOf(cert) });
    expect(verdict.steps.filter((s) => !s.ok).map((s) => s.what)).toEqual([]);
    expect(verdict.passed).toBe(true);
    expect(verdict.steps.map((s) => s.what).join('\n')).toContain('Day 1 read with the column map the case records.');
    const reference = recomputeCase(originalCase(), { day1: original, day2 }, defaultEngine);
    if (!reference.ok) throw new Error(reference.error.message);
    expect(recorded.numbers).toEqual(reference.value.recorded.numbers);
    expect(recorded.digest).toBe(reference.value.recorded.digest);
    const path = join(mkdtempSync(join(tmpdir(), 'twofold-verify-')), 'report.pdf');
    writeFileSync(path, pdf);
    expect(execFileSync('pdfsig', [path], { encoding: 'utf8' })).toContain('Signature is Valid');
  }, 120_000);

  it('fails, naming the heart-rate numbers, when the embedded case does not record the map its numbers were made with', async () => {
    // The state before cases recorded their maps: numbers from the mapped read, a case that names no map.
    const { pdf } = await signedReport(mappedCase(null), await workbenchWay(heartRateMap), mappedCase(heartRateMap));
    const verdict = await verifyReport(pdf, 'report.pdf', { trust: trustOf(cert) });
    expect(verdict.passed).toBe(false);
    const last = verdict.steps[verdict.steps.length - 1].what;
    expect(last).toContain('Numbers: recomputing does not give the recorded results');
    expect(last).toContain('hrBpm');
  }, 120_000);
});
