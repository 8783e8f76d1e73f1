// The browser-mode server stays responsive while it verifies (issue: a crafted report froze
// it). Reference: wall-clock time of real HTTP requests over 127.0.0.1; the crafted report
// is the one from the issue (bootstrap replicates 2e9 inside the embedded case).
import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { request } from 'node:http';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { caseToText } from '../../../core/case/case-text';
import { buildReport } from '../../../core/report/build-report';
import { signReport } from '../../../host/sign-report';
import { reportFonts } from '../../../host/fonts';
import { startBridge, type RunningBridge } from '../../../host/workbench/http-bridge';
import { createWiredService } from '../../../host/workbench/wiring';
import { demoReport, opensslCertificate } from '../../core/report/fixture';

const TOKEN = 'b'.repeat(64);
const bridges: RunningBridge[] = [];
let honest: string;
let crafted: string;

async function bridge(verifyLimitMs?: number): Promise<RunningBridge> {
  const dataDir = mkdtempSync(join(tmpdir(), 'twofold-offthread-'));
  const dist = join(dataDir, 'dist');
  mkdirSync(dist);
  writeFileSync(join(dist, 'index.html'), '<!doctype html><title>t</title>');
  const b = await startBridge({ service: createWiredService({ dataDir, verifyLimitMs }), distDir: dist, token: TOKEN });
  bridges.push(b);
  return b;
}

function api(b: RunningBridge, method: string, body: unknown): Promise<{ ok: boolean; value?: { valid: boolean; summary: string; cases?: unknown[] } }> {
  return new Promise((resolve, reject) => {
    const req = request({ host: '127.0.0.1', port: b.port, path: `/api/${method}`, method: 'POST', headers: { 'content-type': 'application/json', 'x-twofold-token': TOKEN } }, (res) => {
      let text = '';
      res.setEncoding('utf8');
      res.on('data', (c: string) => (text += c));
      res.on('end', () => resolve(JSON.parse(text)));
    });
    req.on('error', reject);
    req.end(JSON.stringify(body));
  });
}

beforeAll(async () => {
  const cert = opensslCertificate();
  const built = await demoReport();
  const sign = async (pdf: Uint8Array) => {
    const s = await signReport(pdf, { p12: cert.p12, passphrase: cert.password, p12Name: 'lab.p12', signerName: 'T', reason: 't', location: 't', signingTime: new Date() });
    if (!s.ok) throw new Error(s.error.message);
    return Buffer.from(s.value).toString('base64');
  };
  honest = await sign(built.pdf);
  const hostile = { ...built.caseFile, settings: { ...built.caseFile.settings, thresholds: { ...built.caseFile.settings.thresholds, bootstrap: { replicates: 2e9, seed: 1 } } } };
  crafted = await sign(await buildReport({ caseFile: built.caseFile, caseText: caseToText(hostile), outcome: built.outcome, raw: built.raw, fonts: reportFonts(), generatedAt: '2026-03-11T10:00:00Z', reviewer: null, signature: 'lab' }));
}, 180_000);

afterAll(async () => {
  for (const b of bridges) await b.close();
});

describe('verification off the request thread', () => {
  it('the crafted report (2e9 replicates) is refused, and listing cases meanwhile answers within 1 s', async () => {
    const b = await bridge();
    const verifying = api(b, 'verifyReport', { fileName: 'crafted.pdf', base64: crafted });
    const started = Date.now();
    const listed = await api(b, 'listCases', {});
    expect(Date.now() - started).toBeLessThan(1000);
    expect(listed.ok).toBe(true);
    const verdict = await verifying;
    expect(verdict.value?.valid).toBe(false);
    expect(JSON.stringify(verdict.value)).toContain("The case file's field settings.thresholds.bootstrap.replicates is not valid");
  });

  it('while a sound report is verified (seconds of work), listing cases answers within 1 s and before the verdict', async () => {
    const b = await bridge();
    let verified = false;
    const verifying = api(b, 'verifyReport', { fileName: 'honest.pdf', base64: honest }).then((r) => {
      verified = true;
      return r;
    });
    await new Promise((r) => setTimeout(r, 200));
    const started = Date.now();
    expect((await api(b, 'listCases', {})).ok).toBe(true);
    expect(Date.now() - started).toBeLessThan(1000);
    expect(verified).toBe(false);
    const verdict = await verifying;
    // Not on this workbench's trust list, but every other check holds.
    expect(verdict.value?.summary).toContain('its signer is NOT trusted');
  });

  it('the report preview is built off the request thread too: cases list within 1 s meanwhile, and the preview is a PDF', async () => {
    const b = await bridge();
    const pair = (await api(b, 'demoPair', {})).value as unknown as { day1: unknown; day2: unknown };
    const none = { peakRpe: null, lactateMmolL: null, fev1L: null, mvvLMin: null, restingHrBpm: null };
    const made = (await api(b, 'createCase', { title: 'off-thread', day1: pair.day1, day2: pair.day2, clinical: { day1: none, day2: none } })) as unknown as { ok: boolean; value: { caseId: string } };
    expect(made.ok).toBe(true);
    const previewing = api(b, 'previewReport', { caseId: made.value.caseId, reviewer: '' });
    await new Promise((r) => setTimeout(r, 200));
    const started = Date.now();
    expect((await api(b, 'listCases', {})).ok).toBe(true);
    expect(Date.now() - started).toBeLessThan(1000);
    const preview = (await previewing) as unknown as { ok: boolean; value: { base64: string } };
    expect(Buffer.from(preview.value.base64, 'base64').subarray(0, 5).toString('latin1')).toBe('%PDF-');
  });

  it('a verification that runs past the time limit is stopped and reported as not verified', async () => {
    const b = await bridge(300);
    const verdict = await api(b, 'verifyReport', { fileName: 'honest.pdf', base64: honest });
    expect(verdict.value?.valid).toBe(false);
    expect(verdict.value?.summary).toContain('Verification stopped after 0 s without finishing');
  });
});
