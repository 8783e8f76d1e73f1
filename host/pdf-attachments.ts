/**
 * Reads the embedded files out of a PDF that Twofold wrote: each /Filespec's name and its
 * /EF /F stream (an /EmbeddedFile, Flate-compressed or plain), as ISO 32000-1 §7.11.4 lays
 * them out. When an object number is defined more than once (incremental updates), the last
 * definition wins, as it does for a PDF reader. This is a reader for our own reports, not a
 * general PDF parser: it needs uncompressed object syntax (no object streams), which is what
 * pdfkit and the signing step write.
 */
import { inflateSync } from 'node:zlib';
import { fail, locatedError, ok, type Result } from '../core/model/errors';

export interface EmbeddedFile {
  readonly name: string;
  readonly bytes: Uint8Array;
}

export function embeddedFiles(pdf: Uint8Array, file: string): Result<EmbeddedFile[]> {
  const text = Buffer.from(pdf.buffer, pdf.byteOffset, pdf.byteLength).toString('latin1');
  const objects = new Map<number, number>();
  for (const m of text.matchAll(/(?:^|[\r\n\s])(\d+)\s+0\s+obj\b/g)) objects.set(Number(m[1]), m.index + m[0].length);
  const bodyOf = (n: number): string | null => {
    const start = objects.get(n);
    if (start === undefined) return null;
    const end = text.indexOf('endobj', start);
    return end < 0 ? null : text.slice(start, end);
  };
  const out: EmbeddedFile[] = [];
  for (const n of objects.keys()) {
    const body = bodyOf(n);
    if (!body || !/\/Type\s*\/Filespec\b/.test(body)) continue;
    const name = pdfString(/\/UF\s*(\([^]*?(?<!\\)\)|<[0-9A-Fa-f]*>)/.exec(body)?.[1] ?? /\/F\s*(\([^]*?(?<!\\)\)|<[0-9A-Fa-f]*>)/.exec(body)?.[1] ?? null);
    const ref = /\/EF\s*<<\s*\/F\s+(\d+)\s+0\s+R/.exec(body);
    if (name === null || !ref) return fail(locatedError('attachment-unreadable', file, null, null, `Embedded file entry ${n} has no readable name or content.`));
    const streamObj = objects.get(Number(ref[1]));
    const streamBody = bodyOf(Number(ref[1]));
    if (streamObj === undefined || !streamBody) return fail(locatedError('attachment-missing', file, null, null, `The content of the embedded file ${name} is missing.`));
    const length = /\/Length\s+(\d+)/.exec(streamBody);
    const streamAt = /stream\r?\n/.exec(streamBody);
    if (!length || !streamAt) return fail(locatedError('attachment-unreadable', file, null, null, `The content of the embedded file ${name} is not a readable stream.`));
    const from = streamObj + streamAt.index + streamAt[0].length;
    const raw = pdf.subarray(from, from + Number(length[1]));
    try {
      const bytes = /\/Filter\s*\/FlateDecode/.test(streamBody.slice(0, streamAt.index)) ? new Uint8Array(inflateSync(raw)) : new Uint8Array(raw);
      out.push({ name, bytes });
    } catch {
      return fail(locatedError('attachment-corrupt', file, null, null, `The embedded file ${name} is damaged (its compressed data does not inflate).`));
    }
  }
  return ok(out);
}

/** A PDF literal or hex string to text (UTF-16BE with a byte-order mark, or single bytes). */
function pdfString(token: string | null): string | null {
  if (token === null) return null;
  let bytes: Buffer;
  if (token.startsWith('<')) bytes = Buffer.from(token.slice(1, -1), 'hex');
  else {
    const escapes: Record<string, string> = { n: '\n', r: '\r', t: '\t', b: '\b', f: '\f', '(': '(', ')': ')', '\\': '\\' };
    const body = token.slice(1, -1).replace(/\\([nrtbf()\\]|[0-7]{1,3})/g, (_, e: string) => escapes[e] ?? String.fromCharCode(parseInt(e, 8)));
    bytes = Buffer.from(body, 'latin1');
  }
  if (bytes[0] === 0xfe && bytes[1] === 0xff) {
    const swapped = Buffer.from(bytes.subarray(2));
    swapped.swap16();
    return swapped.toString('utf16le');
  }
  return bytes.toString('latin1');
}
