// `twofold report` with a lab certificate made by openssl: the password comes from the
// environment, the PDF verifies in pdfsig, paper size follows --paper (US Letter is
// 612 × 792 pt, 8.5 × 11 in at 72 pt/in; A4 595.28 × 841.89 pt per ISO 216), the case folder
// is reopened with its log, and mistakes are plain messages with exit 2.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { main } from '../../cli/main';
import type { CliIo } from '../../cli/io';
import { DEMO_FOLDER, DEMO_PAIR } from '../../host/demo-job';
import { opensslCertificate, type LabCertificate } from '../core/report/fixture';

function io(env: Record<string, string> = {}) {
  const out: string[] = [];
  const err: string[] = [];
  const value: CliIo = { out: (t) => out.push(t), err: (t) => err.push(t), env, cwd: process.cwd(), interactive: false };
  return { io: value, out: () => out.join(''), err: () => err.join('') };
}

const day1 = join(DEMO_FOLDER, DEMO_PAIR.day1);
const day2 = join(DEMO_FOLDER, DEMO_PAIR.day2);
let cert: LabCertificate;
let dir: string;

beforeAll(() => {
  cert = opensslCertificate();
  dir = mkdtempSync(join(tmpdir(), 'twofold-cli-report-'));
});

describe('twofold report', () => {
  it('signs with the password from --pass-env; pdfsig accepts it; letter paper', async () => {
    const out = join(dir, 'letter.pdf');
    const t = io({ LAB_PASS: cert.password });
    const code = await main(['report', day1, day2, '--out', out, '--sign', join(cert.dir, 'lab.p12'), '--pass-env', 'LAB_PASS', '--reviewer', 'T. Tester, MSc', '--paper', 'letter'], t.io);
    expect(code, t.err()).toBe(0);
    const sig = spawnSync('pdfsig', [out], { encoding: 'utf8' }).stdout;
    expect(sig).toContain('Signature is Valid');
    expect(sig).toContain('Test Lab Signer');
    expect(spawnSync('pdfinfo', [out], { encoding: 'utf8' }).stdout).toMatch(/Page size:\s+612 x 792 pts/);
    expect(existsSync(join(dir, 'letter-case', 'twofold-case.json'))).toBe(true);
    expect(spawnSync('pdftotext', [out, '-'], { encoding: 'utf8' }).stdout).toContain('T. Tester, MSc');
  });

  it('reopens the case folder, and refuses other files for it', async () => {
    const out = join(dir, 'a4.pdf');
    expect(await main(['report', day1, day2, '--out', out], io().io)).toBe(0);
    expect(spawnSync('pdfinfo', [out], { encoding: 'utf8' }).stdout).toMatch(/Page size:\s+595\.2\d x 841\.8\d pts \(A4\)/);
    expect(await main(['report', day1, day2, '--out', out], io().io)).toBe(0);
    // The same folder named by its case file:
    expect(await main(['report', day1, day2, '--out', out, '--case', join(dir, 'a4-case', 'twofold-case.json')], io().io)).toBe(0);
    const t = io();
    expect(await main(['report', day2, day1, '--out', out], t.io)).toBe(2);
    expect(t.err()).toContain('different day 1 file');
  });

  it('a wrong password or a missing variable is a plain message, exit 2', async () => {
    const wrong = io({ LAB_PASS: 'not-it' });
    expect(await main(['report', day1, day2, '--out', join(dir, 'w.pdf'), '--sign', join(cert.dir, 'lab.p12'), '--pass-env', 'LAB_PASS'], wrong.io)).toBe(2);
    expect(wrong.err()).toContain('could not be signed');
    const missing = io();
    expect(await main(['report', day1, day2, '--out', join(dir, 'm.pdf'), '--sign', join(cert.dir, 'lab.p12'), '--pass-env', 'LAB_PASS'], missing.io)).toBe(2);
    expect(missing.err()).toContain('LAB_PASS is not set');
  });
});
