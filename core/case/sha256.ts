/**
 * SHA-256 (FIPS 180-4) as lowercase hex, over bytes or over a string's UTF-8 encoding.
 * Uses @noble/hashes, an audited pure-JavaScript implementation, so core/ needs no Node crypto.
 *
 * Example: sha256Hex('abc') → 'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad'.
 */
import { sha256 } from '@noble/hashes/sha2';
import { bytesToHex, utf8ToBytes } from '@noble/hashes/utils';

export function sha256Hex(data: Uint8Array | string): string {
  return bytesToHex(sha256(typeof data === 'string' ? utf8ToBytes(data) : data));
}
