// The signature gap of a signed PDF holds the CMS DER followed by zero padding. Its end comes
// from the DER's outer length (ITU-T X.690 §8.1.3), never from stripping zeros: a DER whose
// last byte is 0x00 (an RSA signature value ends in a zero byte about once in 256) must come
// back whole.
import forge from 'node-forge';
import { describe, expect, it } from 'vitest';
import { cmsFromGap } from '../../../core/report/verify-signature';

const asn1 = forge.asn1;
function derEndingInZero(contentBytes: number): string {
  const octets = `${'\x5a'.repeat(contentBytes - 1)}\x00`;
  const seq = asn1.create(asn1.Class.UNIVERSAL, asn1.Type.SEQUENCE, true, [asn1.create(asn1.Class.UNIVERSAL, asn1.Type.OCTETSTRING, false, octets)]);
  return asn1.toDer(seq).getBytes();
}

describe('cmsFromGap', () => {
  it('keeps a trailing zero byte of the DER and drops only the padding (short and long length forms)', () => {
    for (const n of [10, 200, 3000]) {
      const der = derEndingInZero(n);
      expect(der.charCodeAt(der.length - 1)).toBe(0);
      const gap = forge.util.bytesToHex(der) + '00'.repeat(64);
      const back = cmsFromGap(gap);
      expect(back.length).toBe(der.length);
      expect(back).toBe(der);
    }
  });
  it('refuses a gap shorter than the DER says', () => {
    const der = derEndingInZero(200);
    expect(() => cmsFromGap(forge.util.bytesToHex(der.slice(0, 100)))).toThrow(/longer than the signature gap/);
  });
});
