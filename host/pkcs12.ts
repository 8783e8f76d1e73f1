/**
 * PKCS#12 files (RFC 7292) opened and written with Node's native crypto (OpenSSL): the
 * integrity MAC, the key bag's decryption and the certificate bags' decryption run natively;
 * node-forge only reads and writes the ASN.1 structure.
 *
 * Opening handles what current tools write: OpenSSL 3 (PBES2 with PBKDF2 and AES-CBC for the
 * key and the certificates, an HMAC-SHA-256 MAC), and the older 3DES key bags with an
 * HMAC-SHA-1 MAC (node-forge, many other tools). Any other layout (RC2-encrypted certificate
 * bags from older OpenSSL, public-key integrity mode) is opened by node-forge instead, slower
 * but complete. Either way a wrong password is refused.
 */
import { Buffer } from 'node:buffer';
import { createCipheriv, createDecipheriv, createHash, createHmac, createPrivateKey, pbkdf2Sync, randomBytes, timingSafeEqual, X509Certificate, type KeyObject } from 'node:crypto';
import forge from 'node-forge';

const { asn1, pki } = forge;
const { Class, Type } = asn1;
type Node = forge.asn1.Asn1;

export interface P12Contents {
  readonly key: KeyObject;
  /** DER of the certificate whose public key matches the private key. */
  readonly signerDer: Buffer;
  /** DER of every certificate in the file, in its order (the chain travels with a signature). */
  readonly certificatesDer: readonly Buffer[];
}

const OID = {
  data: pki.oids.data,
  encryptedData: pki.oids.encryptedData,
  keyBag: pki.oids.keyBag,
  shroudedKeyBag: pki.oids.pkcs8ShroudedKeyBag,
  certBag: pki.oids.certBag,
  x509Certificate: pki.oids.x509Certificate,
  localKeyId: pki.oids.localKeyId,
  pbes2: '1.2.840.113549.1.5.13',
  pbkdf2: '1.2.840.113549.1.5.12',
} as const;

const HASHES: Record<string, { name: string; blockBytes: number }> = {
  '1.3.14.3.2.26': { name: 'sha1', blockBytes: 64 },
  '2.16.840.1.101.3.4.2.1': { name: 'sha256', blockBytes: 64 },
  '2.16.840.1.101.3.4.2.2': { name: 'sha384', blockBytes: 128 },
  '2.16.840.1.101.3.4.2.3': { name: 'sha512', blockBytes: 128 },
};
/** PBKDF2 pseudo-random functions (RFC 8018 §B.1.2); HMAC-SHA-1 when absent. */
const PRFS: Record<string, string> = {
  '1.2.840.113549.2.7': 'sha1',
  '1.2.840.113549.2.9': 'sha256',
  '1.2.840.113549.2.10': 'sha384',
  '1.2.840.113549.2.11': 'sha512',
};
const AES_CBC: Record<string, string> = {
  '2.16.840.1.101.3.4.1.2': 'aes-128-cbc',
  '2.16.840.1.101.3.4.1.22': 'aes-192-cbc',
  '2.16.840.1.101.3.4.1.42': 'aes-256-cbc',
};

/** Thrown when the file is sound but laid out in a way only the node-forge path reads. */
class Unsupported extends Error {}

/**
 * The PKCS#12 key derivation (RFC 7292 Appendix B.2): `id` 1 for a key, 2 for an IV, 3 for
 * the MAC key; the password as a BMPString with its two-byte terminator.
 */
export function pkcs12Kdf(hash: string, blockBytes: number, password: string, salt: Buffer, iterations: number, id: number, bytes: number): Buffer {
  const v = blockBytes;
  const pass = password.length === 0 ? Buffer.alloc(0) : Buffer.concat([Buffer.from(password, 'utf16le').swap16(), Buffer.alloc(2)]);
  const fill = (src: Buffer) => {
    const out = Buffer.alloc(v * Math.ceil(src.length / v));
    for (let i = 0; i < out.length; i++) out[i] = src[i % src.length]!;
    return out;
  };
  const I = Buffer.concat([salt.length ? fill(salt) : Buffer.alloc(0), pass.length ? fill(pass) : Buffer.alloc(0)]);
  const D = Buffer.alloc(v, id);
  const out: Buffer[] = [];
  let have = 0;
  while (have < bytes) {
    let A = createHash(hash).update(D).update(I).digest();
    for (let r = 1; r < iterations; r++) A = createHash(hash).update(A).digest();
    out.push(A);
    have += A.length;
    if (have >= bytes) break;
    // I_j = (I_j + B + 1) mod 2^(8v), B = A repeated to v bytes.
    const B = fill(A);
    for (let j = 0; j < I.length; j += v) {
      let carry = 1;
      for (let k = v - 1; k >= 0; k--) {
        const sum = I[j + k]! + B[k]! + carry;
        I[j + k] = sum & 0xff;
        carry = sum >> 8;
      }
    }
  }
  return Buffer.concat(out).subarray(0, bytes);
}

const bytesOf = (n: Node): Buffer => Buffer.from(n.value as string, 'binary');
const children = (n: Node): Node[] => (Array.isArray(n.value) ? n.value : []);
const oidOf = (n: Node | undefined): string => (n && n.type === Type.OID ? asn1.derToOid(n.value as string) : '');
const integerOf = (n: Node | undefined): number => (n ? asn1.derToInteger(n.value as string) : 0);
const derOf = (n: Node): Buffer => Buffer.from(asn1.toDer(n).getBytes(), 'binary');
/** The contents of a primitive OCTET STRING (a constructed, BER-style one goes to the other path). */
function octets(n: Node | undefined): Buffer {
  if (!n || n.type !== Type.OCTETSTRING || n.constructed) throw new Unsupported('constructed octet string');
  return bytesOf(n);
}

/** PBES2 (RFC 8018 §6.2) with PBKDF2 and AES-CBC, natively. */
function pbes2Decrypt(params: Node, password: string, data: Buffer): Buffer {
  const [kdf, scheme] = children(params);
  if (oidOf(children(kdf!)[0]) !== OID.pbkdf2) throw new Unsupported('key derivation');
  const kdfParams = children(children(kdf!)[1]!);
  const salt = octets(kdfParams[0]);
  const iterations = integerOf(kdfParams[1]);
  const prfNode = kdfParams.find((n) => n.type === Type.SEQUENCE);
  const prf = prfNode ? PRFS[oidOf(children(prfNode)[0])] : 'sha1';
  const cipher = AES_CBC[oidOf(children(scheme!)[0])];
  if (!prf || !cipher) throw new Unsupported('cipher');
  const iv = octets(children(scheme!)[1]);
  const key = pbkdf2Sync(Buffer.from(password, 'utf8'), salt, iterations, Number(cipher.slice(4, 7)) / 8, prf);
  const decipher = createDecipheriv(cipher, key, iv);
  return Buffer.concat([decipher.update(data), decipher.final()]);
}

function verifyMac(pfx: Node[], authSafe: Buffer, password: string): void {
  const macData = pfx[2];
  if (!macData) throw new Unsupported('no MAC');
  const [digestInfo, saltNode, iterNode] = children(macData);
  const hash = HASHES[oidOf(children(children(digestInfo!)[0]!)[0])];
  if (!hash) throw new Unsupported('MAC hash');
  const expected = octets(children(digestInfo!)[1]);
  const iterations = iterNode ? integerOf(iterNode) : 1;
  const key = pkcs12Kdf(hash.name, hash.blockBytes, password, octets(saltNode), iterations, 3, expected.length);
  const actual = createHmac(hash.name, key).update(authSafe).digest();
  if (actual.length !== expected.length || !timingSafeEqual(actual, expected)) throw new Error('the password is wrong or the file is damaged (its integrity check failed)');
}

function openNatively(p12: Uint8Array, password: string): P12Contents {
  const pfx = children(asn1.fromDer(Buffer.from(p12).toString('binary'), true));
  const authSafeInfo = children(pfx[1]!);
  if (oidOf(authSafeInfo[0]) !== OID.data) throw new Unsupported('public-key integrity');
  const authSafe = octets(children(authSafeInfo[1]!)[0]);
  verifyMac(pfx, authSafe, password);
  const certificatesDer: Buffer[] = [];
  let key: KeyObject | null = null;
  for (const info of children(asn1.fromDer(authSafe.toString('binary')))) {
    const [type, content] = children(info);
    let safeContents: Buffer;
    if (oidOf(type) === OID.data) safeContents = octets(children(content!)[0]);
    else if (oidOf(type) === OID.encryptedData) {
      const encryptedContentInfo = children(children(children(content!)[0]!)[1]!);
      const algorithm = children(encryptedContentInfo[1]!);
      if (oidOf(algorithm[0]) !== OID.pbes2) throw new Unsupported('certificate bag cipher');
      const encrypted = encryptedContentInfo[2];
      if (!encrypted || encrypted.constructed) throw new Unsupported('constructed encrypted content');
      safeContents = pbes2Decrypt(algorithm[1]!, password, bytesOf(encrypted));
    } else throw new Unsupported('safe contents type');
    for (const bag of children(asn1.fromDer(safeContents.toString('binary')))) {
      const [bagId, wrapped] = children(bag);
      const value = children(wrapped!)[0]!;
      const id = oidOf(bagId);
      if (id === OID.certBag) {
        const [certType, certValue] = children(value);
        if (oidOf(certType) === OID.x509Certificate) certificatesDer.push(octets(children(certValue!)[0]));
      } else if ((id === OID.shroudedKeyBag || id === OID.keyBag) && !key) {
        key = createPrivateKey({ key: derOf(value), format: 'der', type: 'pkcs8', ...(id === OID.shroudedKeyBag ? { passphrase: password } : {}) });
      }
    }
  }
  if (!key) throw new Error('the file holds no private key');
  return withSigner(key, certificatesDer);
}

function withSigner(key: KeyObject, certificatesDer: Buffer[]): P12Contents {
  if (key.asymmetricKeyType !== 'rsa') throw new Error(`the private key is ${key.asymmetricKeyType ?? 'of an unknown type'}; Twofold signs with RSA`);
  const signerDer = certificatesDer.find((der) => new X509Certificate(der).checkPrivateKey(key));
  if (!signerDer) throw new Error('no certificate in the file matches the private key');
  return { key, signerDer, certificatesDer };
}

/** node-forge reads every layout RFC 7292 allows; its arithmetic is JavaScript, so it is the slow path. */
function openWithForge(p12: Uint8Array, password: string): P12Contents {
  const parsed = forge.pkcs12.pkcs12FromAsn1(asn1.fromDer(Buffer.from(p12).toString('binary')), false, password);
  const certificatesDer = (parsed.getBags({ bagType: OID.certBag })[OID.certBag] ?? []).flatMap((b) => (b.cert ? [derOf(pki.certificateToAsn1(b.cert))] : []));
  const bags = [...(parsed.getBags({ bagType: OID.shroudedKeyBag })[OID.shroudedKeyBag] ?? []), ...(parsed.getBags({ bagType: OID.keyBag })[OID.keyBag] ?? [])];
  const rsaKey = bags.find((b) => b.key)?.key as forge.pki.rsa.PrivateKey | undefined;
  if (!rsaKey) throw new Error('the file holds no RSA private key');
  return withSigner(createPrivateKey({ key: derOf(pki.privateKeyToAsn1(rsaKey)), format: 'der', type: 'pkcs1' }), certificatesDer);
}

/** Opens a PKCS#12 with its password; throws with a reason when the password or the contents are wrong. */
export function openP12(p12: Uint8Array, password: string): P12Contents {
  try {
    return openNatively(p12, password);
  } catch (error) {
    if (error instanceof Unsupported) return openWithForge(p12, password);
    throw error;
  }
}

const node = (tag: number, constructed: boolean, value: string | Node[]) => asn1.create(Class.UNIVERSAL, tag, constructed, value);
const oid = (id: string) => node(Type.OID, false, asn1.oidToDer(id).getBytes());
const octetString = (b: Buffer) => node(Type.OCTETSTRING, false, b.toString('binary'));
const explicit0 = (inner: Node) => asn1.create(Class.CONTEXT_SPECIFIC, 0, true, [inner]);
const dataInfo = (der: Buffer) => node(Type.SEQUENCE, true, [oid(OID.data), explicit0(octetString(der))]);
const safeBag = (bagId: string, value: Node, localKeyId: Buffer) =>
  node(Type.SEQUENCE, true, [oid(bagId), explicit0(value), node(Type.SET, true, [node(Type.SEQUENCE, true, [oid(OID.localKeyId), node(Type.SET, true, [octetString(localKeyId)])])])]);

/** MAC and PBKDF2 iterations of the files Twofold writes (OpenSSL 3's default, PKCS5_DEFAULT_ITER). */
const ITERATIONS = 2048;

/**
 * A PKCS#12 of one RSA key and its certificate, as OpenSSL 3 writes one: the key bag in
 * PBES2 (PBKDF2-HMAC-SHA-256, AES-256-CBC; Node's own PKCS#8 encryption), the certificate in
 * a PBES2-encrypted bag, both tagged with the certificate's SHA-1 as local key id, and an
 * HMAC-SHA-256 integrity MAC.
 */
export function writeP12(key: KeyObject, certificateDer: Buffer, password: string): Buffer {
  const localKeyId = createHash('sha1').update(certificateDer).digest();
  const shrouded = asn1.fromDer(key.export({ type: 'pkcs8', format: 'der', cipher: 'aes-256-cbc', passphrase: password }).toString('binary'));
  const certBag = node(Type.SEQUENCE, true, [oid(OID.x509Certificate), explicit0(octetString(certificateDer))]);
  const certContents = derOf(node(Type.SEQUENCE, true, [safeBag(OID.certBag, certBag, localKeyId)]));
  const keyContents = derOf(node(Type.SEQUENCE, true, [safeBag(OID.shroudedKeyBag, shrouded, localKeyId)]));

  const salt = randomBytes(16);
  const iv = randomBytes(16);
  const cipherKey = pbkdf2Sync(Buffer.from(password, 'utf8'), salt, ITERATIONS, 32, 'sha256');
  const cipher = createCipheriv('aes-256-cbc', cipherKey, iv);
  const encryptedCerts = Buffer.concat([cipher.update(certContents), cipher.final()]);
  const pbes2 = node(Type.SEQUENCE, true, [
    oid(OID.pbes2),
    node(Type.SEQUENCE, true, [
      node(Type.SEQUENCE, true, [oid(OID.pbkdf2), node(Type.SEQUENCE, true, [octetString(salt), node(Type.INTEGER, false, asn1.integerToDer(ITERATIONS).getBytes()), node(Type.SEQUENCE, true, [oid('1.2.840.113549.2.9'), node(Type.NULL, false, '')])])]),
      node(Type.SEQUENCE, true, [oid('2.16.840.1.101.3.4.1.42'), octetString(iv)]),
    ]),
  ]);
  const encryptedInfo = node(Type.SEQUENCE, true, [
    oid(OID.encryptedData),
    explicit0(node(Type.SEQUENCE, true, [node(Type.INTEGER, false, asn1.integerToDer(0).getBytes()), node(Type.SEQUENCE, true, [oid(OID.data), pbes2, asn1.create(Class.CONTEXT_SPECIFIC, 0, false, encryptedCerts.toString('binary'))])])),
  ]);
  const authSafe = derOf(node(Type.SEQUENCE, true, [encryptedInfo, dataInfo(keyContents)]));

  const macSalt = randomBytes(8);
  const macKey = pkcs12Kdf('sha256', 64, password, macSalt, ITERATIONS, 3, 32);
  const mac = createHmac('sha256', macKey).update(authSafe).digest();
  const macData = node(Type.SEQUENCE, true, [
    node(Type.SEQUENCE, true, [node(Type.SEQUENCE, true, [oid('2.16.840.1.101.3.4.2.1'), node(Type.NULL, false, '')]), octetString(mac)]),
    octetString(macSalt),
    node(Type.INTEGER, false, asn1.integerToDer(ITERATIONS).getBytes()),
  ]);
  return derOf(node(Type.SEQUENCE, true, [node(Type.INTEGER, false, asn1.integerToDer(3).getBytes()), dataInfo(authSafe), macData]));
}
