/**
 * A throw-away, self-signed certificate for `twofold demo`, as a PKCS#12 file. Node's crypto
 * does the arithmetic (the RSA key, the certificate's SHA-256 with RSA signature, the
 * PKCS#12's encryption and MAC: pkcs12.ts); node-forge only lays out the X.509 fields. The
 * subject says plainly that it is a demonstration, and the report marks its signature as not
 * a clinical one. Its password is random for each certificate and lives only in memory beside
 * the PKCS#12 bytes: neither is ever written (the demo writes the public certificate alone).
 */
import { Buffer } from 'node:buffer';
import { generateKeyPair, randomBytes, sign } from 'node:crypto';
import { promisify } from 'node:util';
import forge from 'node-forge';
import { writeP12 } from './pkcs12';

export interface DemoCertificate {
  readonly p12: Uint8Array;
  readonly passphrase: string;
  readonly certificatePem: string;
  readonly commonName: string;
}

export const DEMO_COMMON_NAME = 'Twofold DEMONSTRATION certificate - not for clinical use';

/** Asynchronous, so the key can be generated (off the main thread) while the case is analysed and the report built. */
export async function demoCertificate(now: Date, passphrase = randomBytes(18).toString('base64')): Promise<DemoCertificate> {
  const { privateKey, publicKey } = await promisify(generateKeyPair)('rsa', { modulusLength: 2048 });
  const cert = forge.pki.createCertificate();
  cert.publicKey = forge.pki.publicKeyFromPem(publicKey.export({ type: 'spki', format: 'pem' }).toString());
  cert.serialNumber = `01${randomBytes(8).toString('hex')}`;
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
  // RFC 5280 §4.1.1.2-3: sha256WithRSAEncryption over the DER of the TBSCertificate.
  cert.signatureOid = cert.siginfo.algorithmOid = forge.pki.oids.sha256WithRSAEncryption;
  cert.tbsCertificate = (forge.pki as unknown as { getTBSCertificate(c: forge.pki.Certificate): forge.asn1.Asn1 }).getTBSCertificate(cert);
  const tbs = Buffer.from(forge.asn1.toDer(cert.tbsCertificate).getBytes(), 'binary');
  cert.signature = sign('sha256', tbs, privateKey).toString('binary');
  const der = Buffer.from(forge.asn1.toDer(forge.pki.certificateToAsn1(cert)).getBytes(), 'binary');
  return {
    p12: writeP12(privateKey, der, passphrase),
    passphrase,
    certificatePem: forge.pki.certificateToPem(cert),
    commonName: DEMO_COMMON_NAME,
  };
}
