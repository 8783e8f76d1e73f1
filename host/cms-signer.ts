/**
 * The report's signer: a detached CMS SignedData (RFC 5652; the PKCS#7 layout that
 * adbe.pkcs7.detached readers expect, ISO 32000-1 §12.8.3.3) with one RSA signer, SHA-256.
 *
 * The arithmetic runs in Node's native crypto (OpenSSL): the digest of the signed bytes and
 * the RSA PKCS#1 v1.5 signature (RFC 8017 §8.2) over the signed attributes, and opening the
 * PKCS#12 (pkcs12.ts). node-forge only writes and reads the ASN.1. Before, all
 * of it ran in node-forge's JavaScript big-number code, one of the largest costs of a first
 * signed report in a new process.
 *
 * The layout is node-forge's pkcs7 signer's as @signpdf/signer-p12 drove it (version 1;
 * every certificate of the file; signed attributes content type, signing time, message
 * digest, in that order). PKCS#1 v1.5 signatures are deterministic, so for the same input the
 * bytes are the same as before (tests/host/cms-signer.test.ts holds that).
 */
import { Buffer } from 'node:buffer';
import { createHash, sign } from 'node:crypto';
import { Signer } from '@signpdf/utils';
import forge from 'node-forge';
import { openP12, type P12Contents } from './pkcs12';

const { asn1, pki } = forge;
const { Class, Type } = asn1;

const node = (tag: number, constructed: boolean, value: string | forge.asn1.Asn1[]) => asn1.create(Class.UNIVERSAL, tag, constructed, value);
const oid = (id: string) => node(Type.OID, false, asn1.oidToDer(id).getBytes());
const algorithm = (id: string) => node(Type.SEQUENCE, true, [oid(id), node(Type.NULL, false, '')]);
const attribute = (type: string, value: forge.asn1.Asn1) => node(Type.SEQUENCE, true, [oid(type), node(Type.SET, true, [value])]);

/** RFC 5652 §11.3 (with RFC 5280 §4.1.2.5): UTCTime from 1950 to 2049, GeneralizedTime outside. */
function signingTimeValue(at: Date): forge.asn1.Asn1 {
  const year = at.getUTCFullYear();
  return year >= 1950 && year < 2050 ? node(Type.UTCTIME, false, asn1.dateToUtcTime(at)) : node(Type.GENERALIZEDTIME, false, asn1.dateToGeneralizedTime(at));
}

/** RFC 5652 §10.2.4: the signer's certificate named by its issuer and serial number, as they stand in it (RFC 5280 §4.1). */
function issuerAndSerialNumber(certificateDer: Buffer): forge.asn1.Asn1 {
  const tbs = (asn1.fromDer(certificateDer.toString('binary')).value as forge.asn1.Asn1[])[0]!.value as forge.asn1.Asn1[];
  const fields = tbs[0]!.tagClass === Class.CONTEXT_SPECIFIC ? tbs.slice(1) : tbs; // [0] version is optional
  return node(Type.SEQUENCE, true, [fields[2]!, fields[0]!]);
}

/** The DER of a detached SignedData over `content` (the PDF without its /Contents gap). */
export function detachedSignedData(content: Uint8Array, p12: P12Contents, signingTime: Date): Buffer {
  const digest = createHash('sha256').update(content).digest();
  const attributes = [
    attribute(pki.oids.contentType, oid(pki.oids.data)),
    attribute(pki.oids.signingTime, signingTimeValue(signingTime)),
    attribute(pki.oids.messageDigest, node(Type.OCTETSTRING, false, digest.toString('binary'))),
  ];
  // RFC 5652 §5.4: the signature covers the attributes' DER with the SET tag, not the [0] tag they travel under.
  const signedDer = Buffer.from(asn1.toDer(node(Type.SET, true, attributes)).getBytes(), 'binary');
  const signature = sign('sha256', signedDer, p12.key);
  const signerInfo = node(Type.SEQUENCE, true, [
    node(Type.INTEGER, false, asn1.integerToDer(1).getBytes()),
    issuerAndSerialNumber(p12.signerDer),
    algorithm(pki.oids.sha256),
    asn1.create(Class.CONTEXT_SPECIFIC, 0, true, attributes),
    algorithm(pki.oids.rsaEncryption),
    node(Type.OCTETSTRING, false, signature.toString('binary')),
  ]);
  const signedData = node(Type.SEQUENCE, true, [
    node(Type.INTEGER, false, asn1.integerToDer(1).getBytes()),
    node(Type.SET, true, [algorithm(pki.oids.sha256)]),
    node(Type.SEQUENCE, true, [oid(pki.oids.data)]),
    asn1.create(Class.CONTEXT_SPECIFIC, 0, true, p12.certificatesDer.map((der) => asn1.fromDer(der.toString('binary')))),
    node(Type.SET, true, [signerInfo]),
  ]);
  const contentInfo = node(Type.SEQUENCE, true, [oid(pki.oids.signedData), asn1.create(Class.CONTEXT_SPECIFIC, 0, true, [signedData])]);
  return Buffer.from(asn1.toDer(contentInfo).getBytes(), 'binary');
}

/** The signer @signpdf/signpdf calls with the bytes to sign (everything but the /Contents gap). */
export class NativeP12Signer extends Signer {
  private readonly contents: P12Contents;

  constructor(p12: Uint8Array, passphrase: string) {
    super();
    this.contents = openP12(p12, passphrase);
  }

  override async sign(pdfBuffer: Buffer, signingTime?: Date): Promise<Buffer> {
    return detachedSignedData(pdfBuffer, this.contents, signingTime ?? new Date());
  }
}
