/**
 * Whether the certificate that signed a report is one the lab trusts: the signer's
 * certificate must chain, through the certificates the signature carries, to a certificate
 * on the lab's trust list (RFC 5280 §6 path validation as node-forge implements it:
 * each link's signature, validity dates, and basicConstraints cA for every issuer). The
 * validity dates must hold at the signing time the signature states (a report outlives its
 * certificate) or at the time of checking; the stated signing time is the signer's own
 * claim (no trusted time stamp), so either is accepted.
 *
 * A certificate named after the lab but issued by anyone else does not chain to the lab's
 * own certificate (its issuer's key differs), so it is refused. Nothing is trusted by
 * default: the demonstration certificate only when its PEM is on the list.
 */
import forge from 'node-forge';
import { fail, locatedError, ok, type Result } from '../model/errors';

export interface TrustAnchor {
  /** One certificate, PEM. */
  readonly pem: string;
  /** Where it came from (a file name), for statements. */
  readonly source: string;
}

export interface TrustedChain {
  /** Subject common names from the signer up to the trusted certificate. */
  readonly path: readonly string[];
  /** The trust-list entry the chain ends at. */
  readonly anchor: string;
}

const PEM_BLOCK = /-----BEGIN CERTIFICATE-----[^-]+-----END CERTIFICATE-----/g;

/** Every certificate in a trust file's text (one or more PEM blocks); a file without one is refused. */
export function parseTrustFile(text: string, file: string): Result<TrustAnchor[]> {
  const blocks = text.match(PEM_BLOCK) ?? [];
  if (blocks.length === 0) {
    return fail(locatedError('trust-not-pem', file, 1, 1, 'A trust file must hold one or more certificates in PEM form (-----BEGIN CERTIFICATE-----).'));
  }
  const out: TrustAnchor[] = [];
  for (const pem of blocks) {
    try {
      forge.pki.certificateFromPem(pem);
    } catch (error) {
      const line = text.slice(0, text.indexOf(pem)).split('\n').length;
      return fail(locatedError('trust-unreadable', file, line, 1, `This certificate cannot be read (${error instanceof Error ? error.message : String(error)}); only RSA certificates in PEM form are read.`));
    }
    out.push({ pem, source: file });
  }
  return ok(out);
}

function commonName(cert: forge.pki.Certificate): string {
  return String(cert.subject.getField('CN')?.value ?? cert.subject.attributes.map((a) => `${a.shortName ?? a.name}=${String(a.value)}`).join(', '));
}

/** The signer's chain to a trusted certificate, or a sentence saying why there is none. */
export function checkTrust(signerPem: string, otherPems: readonly string[], anchors: readonly TrustAnchor[], at: readonly Date[], file: string): Result<TrustedChain> {
  const refuse = (code: string, message: string) => fail<TrustedChain>(locatedError(code, file, null, null, message));
  if (anchors.length === 0) {
    return refuse('trust-none', 'No trust list was given, so who signed the report is not established; name the certificates your lab trusts with --trust FILE.');
  }
  const signer = forge.pki.certificateFromPem(signerPem);
  const others = otherPems.map((p) => forge.pki.certificateFromPem(p));
  const chain = [signer];
  for (let current = signer; chain.length < 8 && !current.isIssuer(current); ) {
    const next = others.find((c) => current.isIssuer(c) && !chain.includes(c));
    if (!next) break;
    chain.push(next);
    current = next;
  }
  const store = forge.pki.createCaStore(anchors.map((a) => a.pem));
  let refusal: unknown = null;
  for (const date of at) {
    try {
      forge.pki.verifyCertificateChain(store, [...chain], { validityCheckDate: date });
      refusal = null;
      break;
    } catch (error) {
      refusal ??= error;
    }
  }
  if (refusal !== null) {
    const reason = (refusal as { message?: string }).message ?? String(refusal);
    return refuse('trust-refused', `The signer's certificate "${commonName(signer)}" does not chain to a certificate on the trust list (${reason.replace(/\.$/, '')}); anyone can make a certificate with any name, so this signature does not show who signed.`);
  }
  const top = chain[chain.length - 1];
  const anchorCert = store.getIssuer(top) ?? top;
  const anchorPem = forge.pki.certificateToPem(Array.isArray(anchorCert) ? anchorCert[0] : anchorCert).replace(/\r/g, '');
  const anchor = anchors.find((a) => a.pem.replace(/\r/g, '').trim() === anchorPem.trim())?.source ?? anchors[0].source;
  return ok({ path: chain.map(commonName), anchor });
}
