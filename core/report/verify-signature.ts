/**
 * Checks the signature of a signed report, independently of the code that signed it:
 * 1. the last /ByteRange [0 b c d] must start at byte 0 and end exactly at the end of the
 *    file (so no bytes, such as an appended incremental update, lie outside it), and the gap
 *    b..c must be exactly the /Contents hex string;
 * 2. the CMS SignedData (RFC 5652) in /Contents is parsed with node-forge; the digest of the
 *    two signed byte ranges must equal the signed messageDigest attribute (RFC 5652 §11.2);
 * 3. the signature over the DER of the signed attributes (re-tagged as a SET, §5.4) must
 *    verify with the signer certificate's RSA public key (PKCS#1 v1.5, RFC 8017).
 * Trust in the certificate itself (a chain to a certificate the lab trusts) is checked
 * separately, by trust.ts, from the certificates this returns.
 */
import forge from 'node-forge';
import { fail, locatedError, ok, type Result } from '../model/errors';
import { latin1Text } from './latin1';

export interface SignatureCheck {
  readonly byteRange: readonly [number, number, number, number];
  readonly signer: string;
  readonly selfSigned: boolean;
  readonly signingTime: string | null;
  readonly digestAlgorithm: string;
  /** The signer's certificate (PEM) and any other certificates the signature carries (a chain). */
  readonly certificatePem: string;
  readonly otherCertificatesPem: readonly string[];
}

const OID_MESSAGE_DIGEST = forge.pki.oids.messageDigest;
const OID_SIGNING_TIME = forge.pki.oids.signingTime;
const DIGESTS: Record<string, () => forge.md.MessageDigest> = {
  [forge.pki.oids.sha256]: () => forge.md.sha256.create(),
  [forge.pki.oids.sha384]: () => forge.md.sha384.create(),
  [forge.pki.oids.sha512]: () => forge.md.sha512.create(),
  [forge.pki.oids.sha1]: () => forge.md.sha1.create(),
};

export function verifySignature(pdf: Uint8Array, file: string): Result<SignatureCheck> {
  const problem = (code: string, message: string) => fail<SignatureCheck>(locatedError(code, file, null, null, message));
  const text = latin1Text(pdf);
  const ranges = [...text.matchAll(/\/ByteRange\s*\[\s*(\d+)\s+(\d+)\s+(\d+)\s+(\d+)\s*\]/g)];
  if (ranges.length === 0) return problem('unsigned', 'The report carries no digital signature.');
  const last = ranges[ranges.length - 1];
  const [a, b, c, d] = last.slice(1, 5).map(Number) as [number, number, number, number];
  if (a !== 0 || c + d !== pdf.length) {
    const outside = pdf.length - (c + d);
    return problem('signature-partial', `The signature does not cover the whole file: ${outside > 0 ? `${outside} bytes were added after the signed part (an incremental update)` : 'its byte range does not match the file'}.`);
  }
  if (!(b < c && text[b] === '<' && text[c - 1] === '>' && /^[0-9a-fA-F]*$/.test(text.slice(b + 1, c - 1)))) {
    return problem('signature-gap', 'The unsigned gap of the file is not just the signature value, so the signature cannot be trusted.');
  }
  let signed: SignerParts;
  try {
    signed = signerParts(cmsFromGap(text.slice(b + 1, c - 1)));
  } catch (error) {
    return problem('signature-unreadable', `The signature value is not a readable CMS SignedData: ${error instanceof Error ? error.message : String(error)}.`);
  }
  const makeDigest = DIGESTS[signed.digestOid];
  if (!makeDigest) return problem('signature-digest', `The signature uses a digest this check does not know (${signed.digestOid}).`);
  const md = makeDigest();
  md.update(text.slice(a, a + b));
  md.update(text.slice(c, c + d));
  if (md.digest().getBytes() !== signed.messageDigest) {
    return problem('signature-digest-mismatch', 'The file was changed after it was signed: the digest of the signed bytes does not match the signature.');
  }
  const attrsMd = makeDigest();
  attrsMd.update(signed.signedAttrsDer);
  let valid = false;
  try {
    valid = (signed.certificate.publicKey as forge.pki.rsa.PublicKey).verify(attrsMd.digest().getBytes(), signed.signature);
  } catch {
    valid = false;
  }
  if (!valid) return problem('signature-invalid', "The signature value does not verify with the signer's certificate.");
  const cert = signed.certificate;
  return ok({
    byteRange: [a, b, c, d],
    signer: cert.subject.getField('CN')?.value ?? cert.subject.attributes.map((x) => `${x.shortName ?? x.name}=${x.value}`).join(', '),
    selfSigned: cert.isIssuer(cert),
    signingTime: signed.signingTime,
    digestAlgorithm: forge.pki.oids[signed.digestOid] ?? signed.digestOid,
    certificatePem: forge.pki.certificateToPem(cert),
    otherCertificatesPem: signed.others.map((c) => forge.pki.certificateToPem(c)),
  });
}

/**
 * The CMS bytes of the /Contents gap: the DER's own outer length (X.690 §8.1.3) says where it
 * ends; the zero padding after it is not part of it. (Stripping trailing "00" pairs instead
 * cut the DER short whenever the signature value itself ended in a zero byte, about one
 * signature in 256, and such a report then failed to verify.)
 */
export function cmsFromGap(hex: string): string {
  const bytes = forge.util.hexToBytes(hex.length % 2 ? `${hex}0` : hex);
  if (bytes.length < 2) throw new Error('too short for a DER value');
  const first = bytes.charCodeAt(1);
  let length = first;
  let header = 2;
  if (first & 0x80) {
    const n = first & 0x7f;
    if (n === 0 || n > 4 || bytes.length < 2 + n) throw new Error('unreadable DER length');
    length = 0;
    for (let k = 0; k < n; k++) length = length * 256 + bytes.charCodeAt(2 + k);
    header = 2 + n;
  }
  if (header + length > bytes.length) throw new Error('the DER value is longer than the signature gap');
  return bytes.slice(0, header + length);
}

interface SignerParts {
  readonly digestOid: string;
  readonly messageDigest: string;
  readonly signedAttrsDer: string;
  readonly signature: string;
  readonly signingTime: string | null;
  readonly certificate: forge.pki.Certificate;
  readonly others: readonly forge.pki.Certificate[];
}

type Asn1 = forge.asn1.Asn1;

function children(node: Asn1): Asn1[] {
  if (!Array.isArray(node.value)) throw new Error('unexpected primitive ASN.1 value');
  return node.value;
}

/** Walks ContentInfo → SignedData → the first SignerInfo (RFC 5652 §5). */
function signerParts(der: string): SignerParts {
  const asn1 = forge.asn1;
  const root = asn1.fromDer(der, false);
  const [contentType, explicit] = children(root);
  if (asn1.derToOid(contentType.value as string) !== forge.pki.oids.signedData) throw new Error('not SignedData');
  const signedData = children(children(explicit)[0]);
  const certificates = signedData.find((n) => n.tagClass === asn1.Class.CONTEXT_SPECIFIC && n.type === 0);
  const signerInfos = signedData[signedData.length - 1];
  const info = children(children(signerInfos)[0]);
  const sid = children(info[1]);
  const serialHex = forge.util.bytesToHex(sid[1].value as string);
  const digestOid = asn1.derToOid(children(info[2])[0].value as string);
  const attrs = info[3];
  if (attrs.tagClass !== asn1.Class.CONTEXT_SPECIFIC || attrs.type !== 0) throw new Error('no signed attributes');
  let messageDigest: string | null = null;
  let signingTime: string | null = null;
  for (const attr of children(attrs)) {
    const [oid, values] = children(attr);
    const type = asn1.derToOid(oid.value as string);
    const value = children(values)[0];
    if (type === OID_MESSAGE_DIGEST) messageDigest = value.value as string;
    if (type === OID_SIGNING_TIME) {
      const raw = value.value as string;
      signingTime = (value.type === asn1.Type.UTCTIME ? asn1.utcTimeToDate(raw) : asn1.generalizedTimeToDate(raw)).toISOString();
    }
  }
  if (messageDigest === null) throw new Error('no messageDigest attribute');
  const asSet = asn1.create(asn1.Class.UNIVERSAL, asn1.Type.SET, true, children(attrs));
  const signature = info[5].value as string;
  if (!certificates) throw new Error('no certificate in the signature');
  const certs = children(certificates).map((c) => forge.pki.certificateFromAsn1(c));
  const certificate = certs.find((c) => c.serialNumber.replace(/^0+/, '') === serialHex.replace(/^0+/, '')) ?? certs[0];
  return { digestOid, messageDigest, signedAttrsDer: asn1.toDer(asSet).getBytes(), signature, signingTime, certificate, others: certs.filter((c) => c !== certificate) };
}
