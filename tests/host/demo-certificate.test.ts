// The demonstration certificate, read back by openssl: a PKCS#12 that opens with its
// password, holding a self-signed certificate whose subject says it is a demonstration.
import { execFileSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { demoCertificate, DEMO_COMMON_NAME } from '../../host/demo-certificate';

describe('demoCertificate', () => {
  it('openssl opens the PKCS#12 and shows a self-signed demonstration certificate', async () => {
    const now = new Date('2026-03-11T10:00:00Z');
    const cert = await demoCertificate(now);
    const dir = mkdtempSync(join(tmpdir(), 'twofold-democert-'));
    writeFileSync(join(dir, 'demo.p12'), cert.p12);
    // The password reaches openssl in its environment, not its arguments.
    const pem = execFileSync('openssl', ['pkcs12', '-in', join(dir, 'demo.p12'), '-passin', 'env:DEMO_PASS', '-nokeys', '-clcerts'], { encoding: 'utf8', env: { ...process.env, DEMO_PASS: cert.passphrase } });
    writeFileSync(join(dir, 'c.pem'), pem);
    const text = execFileSync('openssl', ['x509', '-in', join(dir, 'c.pem'), '-noout', '-subject', '-issuer', '-startdate'], { encoding: 'utf8' });
    expect(text).toContain(DEMO_COMMON_NAME);
    const subject = /subject=(.*)/.exec(text)?.[1];
    const issuer = /issuer=(.*)/.exec(text)?.[1];
    expect(subject).toBe(issuer);
    // notBefore is one minute before `now` (Mar 11 09:59:00 2026 GMT, worked by hand).
    expect(text).toContain('notBefore=Mar 11 09:59:00 2026 GMT');
  });

  it('each certificate has its own random password (at least 18 random bytes), not a fixed word', async () => {
    const now = new Date('2026-03-11T10:00:00Z');
    const [a, b] = await Promise.all([demoCertificate(now), demoCertificate(now)]);
    expect(a.passphrase).not.toBe(b.passphrase);
    expect(Buffer.from(a.passphrase, 'base64').length).toBeGreaterThanOrEqual(18);
  });
});
