/**
 * Signs a finished report with a PKCS#12 certificate: @signpdf/placeholder-plain adds a
 * signature field and a /Contents placeholder in an incremental update, then @signpdf/signpdf
 * with the native signer of cms-signer.ts writes a detached CMS SignedData (adbe.pkcs7.detached,
 * SHA-256, ISO 32000-1 §12.8) over the whole file except the placeholder. The signing time
 * and the password are passed in; nothing here reads a clock or the environment. It lives in
 * host/ because the key arithmetic runs in Node's crypto.
 */
import { Buffer } from 'node:buffer';
import { plainAddPlaceholder } from '@signpdf/placeholder-plain';
import { SignPdf } from '@signpdf/signpdf';
import { fail, locatedError, ok, type Result } from '../core/model/errors';
import { SOFTWARE_NAME, SOFTWARE_VERSION } from '../core/version';
import { NativeP12Signer } from './cms-signer';

export interface SigningRequest {
  readonly p12: Uint8Array;
  readonly passphrase: string;
  /** Where the certificate came from, for error messages. */
  readonly p12Name: string;
  readonly signerName: string;
  readonly reason: string;
  readonly location: string;
  readonly signingTime: Date;
}

/** Room for the CMS blob (certificate chain included), bytes; the placeholder is twice this in hex. */
const SIGNATURE_BYTES = 16384;

export async function signReport(pdf: Uint8Array, request: SigningRequest): Promise<Result<Uint8Array>> {
  let prepared: Buffer;
  try {
    prepared = plainAddPlaceholder({
      pdfBuffer: Buffer.from(pdf),
      reason: request.reason,
      contactInfo: '',
      name: request.signerName,
      location: request.location,
      signingTime: request.signingTime,
      signatureLength: SIGNATURE_BYTES,
      appName: `${SOFTWARE_NAME}-${SOFTWARE_VERSION}`,
    });
  } catch (error) {
    return fail(locatedError('sign-placeholder', 'report', null, null, `The report could not be prepared for signing: ${message(error)}`));
  }
  prepared = startxrefAtXref(prepared);
  try {
    const signer = new NativeP12Signer(request.p12, request.passphrase);
    const signed = await new SignPdf().sign(prepared, signer, request.signingTime);
    return ok(new Uint8Array(signed));
  } catch (error) {
    return fail(locatedError('sign-failed', request.p12Name, null, null, `The report could not be signed with this certificate (wrong password, or not a PKCS#12 file with a private key): ${message(error)}`));
  }
}

/**
 * placeholder-plain 3.3.0 points the update's startxref at the blank line before `xref`, one
 * byte early; strict readers (qpdf) warn. Point it at the keyword, as ISO 32000-1 §7.5.5 asks.
 */
function startxrefAtXref(pdf: Buffer): Buffer {
  const tail = pdf.subarray(Math.max(0, pdf.length - 64)).toString('latin1');
  const match = /startxref\s+(\d+)\s+%%EOF\s*$/.exec(tail);
  if (!match) return pdf;
  let offset = Number(match[1]);
  while (offset < pdf.length && (pdf[offset] === 0x0a || pdf[offset] === 0x0d || pdf[offset] === 0x20)) offset++;
  if (offset === Number(match[1]) || pdf.subarray(offset, offset + 4).toString('latin1') !== 'xref') return pdf;
  const at = pdf.length - tail.length + match.index;
  return Buffer.concat([pdf.subarray(0, at), Buffer.from(`startxref\n${offset}\n%%EOF\n`, 'latin1')]);
}

function message(error: unknown): string {
  return error instanceof Error ? error.message : String(error);
}
