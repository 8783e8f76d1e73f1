// Checks canonical JSON against the rule written out by hand (sorted keys, no whitespace,
// shortest number form as RFC 8785 prints numbers) and SHA-256 against the FIPS 180-2
// test vector for "abc" and against Node's own crypto.
import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { canonicalJson, canonicalJsonSha256 } from '../../../core/case/canonical-json';
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

describe('canonicalJsonSha256', () => {
  it('is Node crypto’s SHA-256 of the canonical text, across many chunks and multi-byte characters', () => {
    // Reference: Node's own crypto over the whole text at once.
    const value = { reason: 'VO₂ réglé 😀', series: Array.from({ length: 40_000 }, (_, i) => ({ t: i / 3, note: i % 997 === 0 ? 'Δ😀' : null })) };
    const text = canonicalJson(value);
    expect(text.ok).toBe(true);
    if (!text.ok) return;
    expect(text.value.length).toBeGreaterThan(4 * 65_536);
    const digest = canonicalJsonSha256(value);
    expect(digest.ok && digest.value).toBe(createHash('sha256').update(text.value, 'utf8').digest('hex'));
  });

  it('refuses what canonicalJson refuses, with the same path', () => {
    const r = canonicalJsonSha256({ a: [{ b: 1 }, { b: Number.POSITIVE_INFINITY }] });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.error.message).toContain('$.a[1].b');
    const lenient = canonicalJsonSha256({ a: [1, Number.NaN] }, 'x', 'as-string');
    expect(lenient.ok && lenient.value).toBe(createHash('sha256').update('{"a":[1,"NaN"]}').digest('hex'));
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
