// `twofold verify` exit codes and statements: 0 for an intact signed report, 1 with a plain
// statement for a changed byte (cross-checked: pdfsig also rejects it) or an unsigned report.
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { main } from '../../cli/main';
import { io } from './capture-io';
import { DEMO_FOLDER, DEMO_PAIR } from '../../host/demo-job';
import { opensslCertificate } from '../core/report/fixture';


let dir: string;
let signed: string;
let trust: string;

beforeAll(async () => {
  const cert = opensslCertificate();
  trust = cert.certPem;
  dir = mkdtempSync(join(tmpdir(), 'twofold-cli-verify-'));
  signed = join(dir, 'signed.pdf');
  const code = await main(['report', join(DEMO_FOLDER, DEMO_PAIR.day1), join(DEMO_FOLDER, DEMO_PAIR.day2), '--out', signed, '--sign', join(cert.dir, 'lab.p12'), '--pass-env', 'P'], io({ P: cert.password }).io);
  if (code !== 0) throw new Error('report failed');
});

describe('twofold verify', () => {
  it('exit 0 for the intact report', async () => {
    const t = io();
    expect(await main(['verify', signed, '--trust', trust], t.io)).toBe(0);
    expect(t.out()).not.toContain('FAILED');
  });

  it('exit 1 and a plain statement for one changed byte; pdfsig agrees', async () => {
    const bytes = readFileSync(signed);
    const at = bytes.indexOf('/Title');
    bytes[at + 10] ^= 0x02;
    const bad = join(dir, 'bad.pdf');
    writeFileSync(bad, bytes);
    const t = io();
    expect(await main(['verify', bad, '--trust', trust], t.io)).toBe(1);
    expect(t.out()).toContain('FAILED Signature: The file was changed after it was signed');
    expect(spawnSync('pdfsig', [bad], { encoding: 'utf8' }).stdout).not.toContain('Signature is Valid');
  });

  it('exit 1 for an unsigned report, exit 2 for a missing file', async () => {
    const unsigned = join(dir, 'unsigned.pdf');
    expect(await main(['report', join(DEMO_FOLDER, DEMO_PAIR.day1), join(DEMO_FOLDER, DEMO_PAIR.day2), '--out', unsigned], io().io)).toBe(0);
    const t = io();
    expect(await main(['verify', unsigned, '--trust', trust], t.io)).toBe(1);
    expect(t.out()).toContain('carries no digital signature');
    expect(await main(['verify', join(dir, 'nothing.pdf'), '--trust', trust], io().io)).toBe(2);
  });
});
