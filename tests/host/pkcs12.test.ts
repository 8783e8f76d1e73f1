// PKCS#12 files opened and written natively (host/pkcs12.ts), held against openssl: files
// openssl writes in three layouts (OpenSSL 3's default PBES2/AES with an SHA-256 MAC; 3DES
// bags with an SHA-1 MAC; -legacy, RC2-encrypted certificates, read by the node-forge path)
// must give openssl's own key and certificate; a file Twofold writes must open in openssl with
// its password, key and certificate belonging together; a wrong password is refused.
import { execFileSync } from 'node:child_process';
import { createPrivateKey, X509Certificate } from 'node:crypto';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { openP12, pkcs12Kdf, writeP12 } from '../../host/pkcs12';

const dir = mkdtempSync(join(tmpdir(), 'twofold-p12-'));
const openssl = (args: string[]) => execFileSync('openssl', args, { cwd: dir, encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'] });
openssl(['req', '-x509', '-newkey', 'rsa:2048', '-nodes', '-keyout', 'key.pem', '-out', 'cert.pem', '-days', '2', '-subj', '/CN=P12 Test/O=Test Lab']);
const keyPem = readFileSync(join(dir, 'key.pem'), 'utf8');
const certDer = new X509Certificate(readFileSync(join(dir, 'cert.pem'))).raw;

const LAYOUTS: Record<string, string[]> = {
  'OpenSSL 3 default (PBES2, AES-256, SHA-256 MAC)': [],
  '3DES bags, SHA-1 MAC': ['-certpbe', 'PBE-SHA1-3DES', '-keypbe', 'PBE-SHA1-3DES', '-macalg', 'sha1'],
  'legacy (RC2-40 certificates, node-forge path)': ['-legacy'],
};

describe('openP12', () => {
  for (const [label, extra] of Object.entries(LAYOUTS)) {
    it(`opens ${label} with openssl's key and certificate`, () => {
      const file = `${label.length}.p12`;
      openssl(['pkcs12', '-export', '-inkey', 'key.pem', '-in', 'cert.pem', '-out', file, '-passout', 'pass:läb pass', ...extra]);
      const bytes = readFileSync(join(dir, file));
      const opened = openP12(bytes, 'läb pass');
      expect(opened.key.equals(createPrivateKey(keyPem))).toBe(true);
      expect(opened.signerDer.equals(certDer)).toBe(true);
      expect(opened.certificatesDer).toHaveLength(1);
      expect(() => openP12(bytes, 'lab pass')).toThrow();
    });
  }
});

describe('writeP12', () => {
  it('openssl opens the file with its password, and its key belongs to its certificate', () => {
    const file = join(dir, 'ours.p12');
    writeFileSync(file, writeP12(createPrivateKey(keyPem), certDer, 'pässword'));
    // openssl checks the MAC first: a wrong password fails there.
    expect(() => openssl(['pkcs12', '-in', 'ours.p12', '-passin', 'pass:password', '-nodes', '-out', 'wrong.pem'])).toThrow();
    openssl(['pkcs12', '-in', 'ours.p12', '-passin', 'pass:pässword', '-nodes', '-out', 'both.pem']);
    const both = readFileSync(join(dir, 'both.pem'), 'utf8');
    const key = createPrivateKey(both);
    expect(key.equals(createPrivateKey(keyPem))).toBe(true);
    expect(new X509Certificate(both).raw.equals(certDer)).toBe(true);
    const opened = openP12(readFileSync(file), 'pässword');
    expect(opened.key.equals(key)).toBe(true);
  });
});

describe('pkcs12Kdf', () => {
  // RFC 7292 Appendix B.2 by hand for one block: D = 64 bytes of the id, I = salt and password
  // (BMPString "ab\0" = 00 61 00 62 00 00) each repeated to 64 bytes; A = SHA-1(D || I).
  it('one iteration of one block is SHA-1 of D and I', () => {
    const salt = Buffer.from('0102030405060708', 'hex');
    const fill = (b: Buffer) => Buffer.concat(Array.from({ length: Math.ceil(64 / b.length) }, () => b)).subarray(0, 64);
    const I = Buffer.concat([fill(salt), fill(Buffer.from('006100620000', 'hex'))]);
    const expected = execFileSync('openssl', ['dgst', '-sha1', '-binary'], { input: Buffer.concat([Buffer.alloc(64, 3), I]) });
    expect(pkcs12Kdf('sha1', 64, 'ab', salt, 1, 3, 20).equals(expected)).toBe(true);
  });
});
