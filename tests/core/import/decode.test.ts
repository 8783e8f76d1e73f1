// Reference: the Unicode standard's byte-order marks (UTF-8 EF BB BF, UTF-16 LE FF FE,
// UTF-16 BE FE FF) and the WHATWG Encoding standard's windows-1252 table (0xB5 = µ).
import { describe, expect, test } from 'vitest';
import { decodeBytes } from '../../../core/import/decode';

const ascii = (s: string) => new TextEncoder().encode(s);

function utf16(s: string, le: boolean, bom: boolean): Uint8Array {
  const out = new Uint8Array((bom ? 2 : 0) + s.length * 2);
  let o = 0;
  if (bom) {
    out[0] = le ? 0xff : 0xfe;
    out[1] = le ? 0xfe : 0xff;
    o = 2;
  }
  for (let i = 0; i < s.length; i++) {
    const c = s.charCodeAt(i);
    out[o + 2 * i] = le ? c & 0xff : c >> 8;
    out[o + 2 * i + 1] = le ? c >> 8 : c & 0xff;
  }
  return out;
}

describe('decodeBytes', () => {
  test('plain UTF-8 and UTF-8 with a byte-order mark give the same text', () => {
    const text = 'time_s,vo2_ml_min\n1,300\n';
    const plain = decodeBytes(ascii(text), 'a.csv');
    const bom = decodeBytes(new Uint8Array([0xef, 0xbb, 0xbf, ...ascii(text)]), 'a.csv');
    expect(plain).toEqual({ ok: true, value: { text, encoding: 'utf-8' } });
    expect(bom).toEqual({ ok: true, value: { text, encoding: 'utf-8-bom' } });
  });

  test('UTF-16 LE and BE with a mark, and LE without one, decode to the same text', () => {
    const text = "V'O2;VE\r\n0,35;10,5\r\n";
    expect(decodeBytes(utf16(text, true, true), 'a')).toEqual({ ok: true, value: { text, encoding: 'utf-16le' } });
    expect(decodeBytes(utf16(text, false, true), 'a')).toEqual({ ok: true, value: { text, encoding: 'utf-16be' } });
    expect(decodeBytes(utf16(text, true, false), 'a')).toEqual({ ok: true, value: { text, encoding: 'utf-16le' } });
  });

  test('bytes that are not UTF-8 are read as windows-1252 (0xB5 is µ)', () => {
    const r = decodeBytes(new Uint8Array([...ascii('VT ('), 0xb5, ...ascii('L)\n')]), 'old.txt');
    expect(r).toEqual({ ok: true, value: { text: 'VT (µL)\n', encoding: 'windows-1252' } });
  });

  test('an empty file and a blank file are located errors', () => {
    const empty = decodeBytes(new Uint8Array(), 'e.csv');
    const blank = decodeBytes(ascii('  \n\n'), 'b.csv');
    expect(empty.ok ? null : [empty.error.code, empty.error.file, empty.error.line]).toEqual(['empty-file', 'e.csv', null]);
    expect(blank.ok ? null : blank.error.code).toBe('empty-file');
  });

  test('binary content is an error at the line and column of the first binary byte', () => {
    // line 2, column 3: "ab\ncd<NUL>" → the NUL is the third character of line 2
    const r = decodeBytes(new Uint8Array([0x61, 0x62, 0x0a, 0x63, 0x64, 0x00, 0x01, 0x02]), 'x.bin');
    expect(r.ok ? null : [r.error.code, r.error.file, r.error.line, r.error.column]).toEqual(['binary-content', 'x.bin', 2, 3]);
  });
});
