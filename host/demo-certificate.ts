/**
 * A throw-away, self-signed certificate for `twofold demo`, as a PKCS#12 file. The RSA key
 * comes from Node's crypto (native, fast); node-forge builds the X.509 certificate and the
 * PKCS#12 container (3DES key bag, the widely readable choice). The subject says plainly that
 * it is a demonstration, and the report marks its signature as not a clinical one. Its
 * password is random for each certificate and lives only in memory beside the PKCS#12 bytes:
 * neither is ever written (the demo writes the public certificate alone).
 */
import { generateKeyPair, randomBytes } from 'node:crypto';
import { promisify } from 'node:util';
import forge from 'node-forge';

export interface DemoCertificate {
  readonly p12: Uint8Array;
  readonly passphrase: string;
  readonly certificatePem: string;
  readonly commonName: string;
}

export const DEMO_COMMON_NAME = 'Twofold DEMONSTRATION certificate - not for clinical use';

/** Asynchronous, so the key can be generated (off the main thread) while the case is analysed. */
export async function demoCertificate(now: Date, passphrase = randomBytes(18).toString('base64')): Promise<DemoCertificate> {
  const { privateKey, publicKey } = await promisify(generateKeyPair)('rsa', { modulusLength: 2048 });
  const key = forge.pki.privateKeyFromPem(privateKey.export({ type: 'pkcs1', format: 'pem' }).toString());
  const cert = forge.pki.createCertificate();
  cert.publicKey = forge.pki.publicKeyFromPem(publicKey.export({ type: 'spki', format: 'pem' }).toString());
  cert.serialNumber = `01${forge.util.bytesToHex(forge.random.getBytesSync(8))}`;
  cert.validity.notBefore = new Date(now.getTime() - 60_000);
  cert.validity.notAfter = new Date(now.getTime() + 30 * 24 * 3600_000);
  const name = [
    { name: 'commonName', value: DEMO_COMMON_NAME },
    { name: 'organizationName', value: 'Twofold demonstration' },
  ];
  cert.setSubject(name);
  cert.setIssuer(name);
  cert.setExtensions([
    { name: 'basicConstraints', cA: false },
    { name: 'keyUsage', digitalSignature: true, nonRepudiation: true },
  ]);
  cert.sign(key, forge.md.sha256.create());
  const p12 = forge.pkcs12.toPkcs12Asn1(key, [cert], passphrase, { algorithm: '3des' });
  return {
    p12: Buffer.from(forge.asn1.toDer(p12).getBytes(), 'binary'),
    passphrase,
    certificatePem: forge.pki.certificateToPem(cert),
    commonName: DEMO_COMMON_NAME,
  };
}
