// Checks canonical JSON against the rule written out by hand (sorted keys, no whitespace,
// shortest number form as RFC 8785 prints numbers) and SHA-256 against the FIPS 180-2
// test vector for "abc" and against Node's own crypto.
import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { canonicalJson } from '../../../core/case/canonical-json';
import { sha256Hex } from '../../../core/case/sha256';

describe('canonicalJson', () => {
  it('sorts keys at every depth and drops whitespace (worked by hand)', () => {
    const r = canonicalJson({ b: 1, a: [true, null, { d: 'x', c: 0.1 }], e: undefined });
    expect(r.ok && r.value).toBe('{"a":[true,null,{"c":0.1,"d":"x"}],"b":1}');
  });

  it('gives the same text whatever the key order it was built with', () => {
    const a = canonicalJson({ x: 1, y: { p: 2, q: 3 } });
    const b = canonicalJson({ y: { q: 3, p: 2 }, x: 1 });
    expect(a).toEqual(b);
  });

  it('prints numbers in shortest round-trip form, -0 as 0 (RFC 8785 §3.2.2.3)', () => {
    const r = canonicalJson([1e21, 0.000001, -0, 1.5]);
    expect(r.ok && r.value).toBe('[1e+21,0.000001,0,1.5]');
  });

  it('refuses a non-finite number with its path, unless asked to write it as a string', () => {
    const r = canonicalJson({ a: [1, Number.NaN] });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.error.message).toContain('$.a[1]');
    const lenient = canonicalJson({ a: [1, Number.NaN] }, 'x', 'as-string');
    expect(lenient.ok && lenient.value).toBe('{"a":[1,"NaN"]}');
  });
});

describe('sha256Hex', () => {
  it('matches the FIPS 180-2 test vector for "abc"', () => {
    expect(sha256Hex('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
  });

  it('matches Node crypto on bytes (reference implementation)', () => {
    const bytes = new Uint8Array(1000).map((_, i) => (i * 37) & 0xff);
    expect(sha256Hex(bytes)).toBe(createHash('sha256').update(bytes).digest('hex'));
  });
});
