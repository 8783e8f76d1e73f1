/**
 * Bytes to text. UTF-8 with or without a byte-order mark, UTF-16 LE/BE with a mark (or
 * without one when every other byte is zero, as such exports look), and Windows-1252 as the
 * fallback for older exports that are not valid UTF-8 (`µ`, `°` in headers).
 * Binary content (NUL bytes, control characters) is a located error, never an exception.
 * Line endings are left alone; the caller normalises them.
 */
import { fail, locatedError, ok, type Result } from '../model/errors';

export interface DecodedText {
  readonly text: string;
  readonly encoding: 'utf-8' | 'utf-8-bom' | 'utf-16le' | 'utf-16be' | 'windows-1252';
}

function utf16Guess(bytes: Uint8Array): 'utf-16le' | 'utf-16be' | null {
  const pairs = Math.min(256, Math.floor(bytes.length / 2));
  if (pairs < 4) return null;
  let zeroOdd = 0;
  let zeroEven = 0;
  for (let i = 0; i < pairs; i++) {
    if (bytes[2 * i] === 0) zeroEven++;
    if (bytes[2 * i + 1] === 0) zeroOdd++;
  }
  // ASCII text in UTF-16 has a zero in every pair, always on the same side.
  if (zeroOdd >= pairs * 0.9 && zeroEven === 0) return 'utf-16le';
  if (zeroEven >= pairs * 0.9 && zeroOdd === 0) return 'utf-16be';
  return null;
}

/** Where in the text the first character that text files never contain sits, if any. */
function firstBinaryChar(text: string): number {
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if ((c < 32 && c !== 9 && c !== 10 && c !== 13 && c !== 12) || c === 0xfffd || c === 0x7f) return i;
  }
  return -1;
}

function lineColumnAt(text: string, index: number): { line: number; column: number } {
  let line = 1;
  let start = 0;
  for (let i = 0; i < index; i++) {
    if (text.charCodeAt(i) === 10) {
      line++;
      start = i + 1;
    }
  }
  return { line, column: index - start + 1 };
}

export function decodeBytes(bytes: Uint8Array, file: string): Result<DecodedText> {
  if (bytes.length === 0) return fail(locatedError('empty-file', file, null, null, 'The file is empty: there is no breath table to read.'));
  let text: string;
  let encoding: DecodedText['encoding'];
  if (bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf) {
    encoding = 'utf-8-bom';
    text = new TextDecoder('utf-8').decode(bytes.subarray(3));
  } else if (bytes[0] === 0xff && bytes[1] === 0xfe) {
    encoding = 'utf-16le';
    text = new TextDecoder('utf-16le').decode(bytes.subarray(2));
  } else if (bytes[0] === 0xfe && bytes[1] === 0xff) {
    encoding = 'utf-16be';
    text = new TextDecoder('utf-16be').decode(bytes.subarray(2));
  } else {
    const guess = utf16Guess(bytes);
    if (guess) {
      encoding = guess;
      text = new TextDecoder(guess).decode(bytes);
    } else {
      try {
        text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
        encoding = 'utf-8';
      } catch {
        text = new TextDecoder('windows-1252').decode(bytes);
        encoding = 'windows-1252';
      }
    }
  }
  const bad = firstBinaryChar(text);
  if (bad >= 0) {
    const at = lineColumnAt(text, bad);
    return fail(
      locatedError(
        'binary-content',
        file,
        at.line,
        at.column,
        'The file contains binary data, not text: it is not a breath-by-breath export in CSV or text form (export the table as CSV, or give the .xlsx workbook).',
      ),
    );
  }
  if (text.trim() === '') return fail(locatedError('empty-file', file, null, null, 'The file holds only blank space: there is no breath table to read.'));
  return ok({ text, encoding });
}
