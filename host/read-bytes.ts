/**
 * A file's bytes as a plain Uint8Array view on the buffer Node read them into, not a copy:
 * `new Uint8Array(readFileSync(path))` copies, so a 55 MB breath file briefly cost twice its
 * size (docs/performance.md, "Memory at a million breaths").
 */
import { readFileSync } from 'node:fs';

export function readFileBytes(path: string): Uint8Array {
  const buffer = readFileSync(path);
  return new Uint8Array(buffer.buffer, buffer.byteOffset, buffer.byteLength);
}
