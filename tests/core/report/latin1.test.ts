// latin1Text against Node's own 'latin1' decoding (Buffer#toString, ISO-8859-1): every byte
// value, and a text longer than one chunk.
import { describe, expect, it } from 'vitest';
import { latin1Text } from '../../../core/report/latin1';

describe('latin1Text', () => {
  it('gives one character per byte, with the byte as its code, as Node does', () => {
    const all = Uint8Array.from({ length: 256 }, (_, i) => i);
    const text = latin1Text(all);
    expect(text.length).toBe(256);
    for (let i = 0; i < 256; i++) expect(text.charCodeAt(i)).toBe(i);
    const long = Uint8Array.from({ length: 20_000 }, (_, i) => (i * 131) % 256);
    expect(latin1Text(long)).toBe(Buffer.from(long).toString('latin1'));
    expect(latin1Text(new Uint8Array(0))).toBe('');
  });
});
