// The native signer held against two references outside it: the bytes @signpdf/signer-p12
// (node-forge's pkcs7 signer, what Twofold used before) writes for the same content, key and
// signing time (RSA PKCS#1 v1.5 is deterministic, RFC 8017 §8.2, so they must be equal), and
// `openssl cms -verify` on the detached signature. The certificate is made by openssl.
import { execFileSync } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { P12Signer } from '@signpdf/signer-p12';
import { describe, expect, it } from 'vitest';
import { demoCertificate } from '../../host/demo-certificate';
import { NativeP12Signer } from '../../host/cms-signer';
import { opensslCertificate } from '../core/report/fixture';

describe('NativeP12Signer', () => {
  const cert = opensslCertificate();
  const content = randomBytes(50_000);

  for (const at of [new Date('2026-03-11T10:00:00Z'), new Date('2051-01-02T03:04:05Z')]) {
    it(`writes the same SignedData bytes as @signpdf/signer-p12 (signing time ${at.getUTCFullYear()})`, async () => {
      const ours = await new NativeP12Signer(cert.p12, cert.password).sign(content, at);
      const before = await new P12Signer(cert.p12, { passphrase: cert.password }).sign(content, at);
      expect(ours.equals(before)).toBe(true);
    });
  }

  it('openssl cms -verify accepts the detached signature over the content', async () => {
    const der = await new NativeP12Signer(cert.p12, cert.password).sign(content, new Date());
    writeFileSync(join(cert.dir, 'native.der'), der);
    writeFileSync(join(cert.dir, 'native.bin'), content);
    const out = execFileSync(
      'openssl',
      ['cms', '-verify', '-binary', '-inform', 'DER', '-in', join(cert.dir, 'native.der'), '-content', join(cert.dir, 'native.bin'), '-CAfile', cert.certPem, '-purpose', 'any', '-out', join(cert.dir, 'native.out')],
      { encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'] },
    );
    expect(out).toBe('');
  });

  it('refuses a wrong password', () => {
    expect(() => new NativeP12Signer(cert.p12, 'not-the-password')).toThrow();
  });

  it('signs with the demonstration certificate, as the old signer did', async () => {
    const demo = await demoCertificate(new Date('2026-03-11T10:00:00Z'));
    const at = new Date('2026-03-11T10:00:05Z');
    const ours = await new NativeP12Signer(demo.p12, demo.passphrase).sign(content, at);
    const before = await new P12Signer(demo.p12, { passphrase: demo.passphrase }).sign(content, at);
    expect(ours.equals(before)).toBe(true);
  });
});
