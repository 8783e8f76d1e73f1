// Forged reports (issue: a re-signed report with a rewritten page-1 summary passed). The
// signer's chain is checked with node-forge's RFC 5280 path validation against openssl-made
// certificates; the pages are compared with the report rebuilt from its embedded case, and
// the rewritten text is read back with poppler's pdftotext, a tool outside Twofold.
import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { caseToText } from '../../core/case/case-text';
import { buildReport } from '../../core/report/build-report';
import { signReport } from '../../host/sign-report';
import { reportFonts } from '../../host/fonts';
import { verifyReport } from '../../host/verify-report';
import { main } from '../../cli/main';
import { io } from '../cli/capture-io';
import { demoReport, opensslCertificate, trustOf, type LabCertificate } from '../core/report/fixture';

// Page 1 leads with one finding sentence per primary finding (core/compare/findings.ts); the
// forger swaps the peak's for the wording a reproduced peak gets.
const FORGED_FINDING = 'The peak reproduced day 1: VO2 and workload within the band.';

/** A home-made CA and a leaf named exactly like the lab's signer, the leaf's p12 carrying the CA. */
function homeMadeChain(): LabCertificate & { caPem: string } {
  const dir = mkdtempSync(join(tmpdir(), 'twofold-forger-'));
  const run = (args: string[]) => execFileSync('openssl', args, { stdio: 'pipe', cwd: dir });
  run(['req', '-x509', '-newkey', 'rsa:2048', '-nodes', '-keyout', 'ca.key', '-out', 'ca.pem', '-days', '2', '-subj', '/CN=Home CA', '-addext', 'basicConstraints=critical,CA:TRUE', '-addext', 'keyUsage=keyCertSign']);
  run(['req', '-newkey', 'rsa:2048', '-nodes', '-keyout', 'leaf.key', '-out', 'leaf.csr', '-subj', '/CN=Test Lab Signer/O=Test Lab']);
  run(['x509', '-req', '-in', 'leaf.csr', '-CA', 'ca.pem', '-CAkey', 'ca.key', '-CAcreateserial', '-out', 'leaf.pem', '-days', '2']);
  run(['pkcs12', '-export', '-inkey', 'leaf.key', '-in', 'leaf.pem', '-certfile', 'ca.pem', '-out', 'leaf.p12', '-passout', 'pass:x']);
  return { dir, p12: readFileSync(join(dir, 'leaf.p12')), certPem: join(dir, 'leaf.pem'), password: 'x', caPem: join(dir, 'ca.pem') };
}

async function sign(pdf: Uint8Array, cert: LabCertificate): Promise<Uint8Array> {
  const signed = await signReport(pdf, { p12: cert.p12, passphrase: cert.password, p12Name: 'p12', signerName: 'T. Tester', reason: 'test', location: 'test lab', signingTime: new Date() });
  if (!signed.ok) throw new Error(signed.error.message);
  return signed.value;
}

let lab: LabCertificate;
let forger: ReturnType<typeof homeMadeChain>;
let honest: Uint8Array;
let rewritten: Uint8Array;
let dir: string;

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'twofold-forgery-'));
  lab = opensslCertificate();
  forger = homeMadeChain();
  const built = await demoReport();
  honest = built.pdf;
  // The same case, raw files and numbers embedded; only the peak finding drawn on page 1 rewritten.
  const c = built.outcome.comparison;
  if (!c.findings.some((f) => f.id === 'peak' && f.verdict !== 'held')) throw new Error('the demo pair no longer has a peak finding other than reproduced to forge');
  const findings = c.findings.map((f) => (f.id === 'peak' ? { ...f, verdict: 'held' as const, sentence: FORGED_FINDING } : f));
  const outcome = { ...built.outcome, comparison: { ...c, findings } };
  rewritten = await buildReport({ caseFile: built.caseFile, caseText: caseToText(built.caseFile), outcome, raw: built.raw, fonts: reportFonts(), generatedAt: '2026-03-11T10:00:00Z', reviewer: 'T. Tester, test credential', signature: 'lab' });
}, 180_000);

function text(pdf: Uint8Array, page: number): string {
  const path = join(dir, `p${page}-${Math.random().toString(36).slice(2)}.pdf`);
  writeFileSync(path, pdf);
  return spawnSync('pdftotext', ['-f', String(page), '-l', String(page), path, '-'], { encoding: 'utf8' }).stdout.replace(/\s+/g, ' ');
}

describe('verify refuses forged reports', () => {
  it('a report re-signed by a home-made certificate named after the lab, page 1 rewritten: signer not trusted and page 1 named', async () => {
    const forged = await sign(rewritten, forger);
    expect(text(honest, 1)).not.toContain(FORGED_FINDING);
    expect(text(forged, 1)).toContain(FORGED_FINDING);
    const r = await verifyReport(forged, 'forged.pdf', { trust: trustOf(lab) });
    expect(r.passed).toBe(false);
    expect(r.untrustedOnly).toBe(false);
    const failed = r.steps.filter((s) => !s.ok).map((s) => s.what);
    expect(failed[0]).toContain('Signer: The signer\'s certificate "Test Lab Signer" does not chain to a certificate on the trust list');
    expect(failed[1]).toContain('Pages: Page 1 differs from the page rebuilt');
    expect(failed[1]).toContain(`the report shows "${FORGED_FINDING}"`);
    // The numbers embedded are the honest ones, so that check alone would have passed.
    expect(r.steps.find((s) => s.what.startsWith('Numbers:'))?.ok).toBe(true);
  });

  it('the same rewritten page signed with the trusted lab certificate still fails, naming page 1', async () => {
    const r = await verifyReport(await sign(rewritten, lab), 'insider.pdf', { trust: trustOf(lab) });
    expect(r.passed).toBe(false);
    expect(r.steps.filter((s) => !s.ok).map((s) => s.what)).toEqual([expect.stringMatching(/^Pages: Page 1 differs/)]);
  });

  it('the honest report: trusted through the CA when the CA is on the list, refused when nothing is, exit codes 0 / 3 / 1', async () => {
    const viaCa = await sign(honest, forger);
    const trusted = await verifyReport(viaCa, 'ca.pdf', { trust: [{ pem: readFileSync(forger.caPem, 'latin1'), source: 'ca.pem' }] });
    expect(trusted.passed).toBe(true);
    expect(trusted.steps[1].what).toBe('Signer trusted: "Test Lab Signer" issued by "Home CA" chains to a certificate on the trust list (ca.pem).');
    const none = await verifyReport(viaCa, 'ca.pdf', { trust: [] });
    expect(none.passed).toBe(false);
    expect(none.untrustedOnly).toBe(true);
    const path = join(dir, 'ca.pdf');
    writeFileSync(path, viaCa);
    expect(await main(['verify', path, '--trust', forger.caPem], io().io)).toBe(0);
    const t = io();
    expect(await main(['verify', path], t.io)).toBe(3);
    expect(t.out()).toContain('its signer is NOT trusted');
    expect(await main(['verify', path, '--trust', lab.certPem], io().io)).toBe(3);
    const forgedPath = join(dir, 'forged.pdf');
    writeFileSync(forgedPath, await sign(rewritten, forger));
    expect(await main(['verify', forgedPath, '--trust', forger.caPem], io().io)).toBe(1);
    const bad = io();
    expect(await main(['verify', path, '--trust', dir], bad.io)).toBe(2);
    expect(bad.err()).toContain(`${dir}:0:0: The trust file is a folder, not a file.`);
  }, 300_000);
});
