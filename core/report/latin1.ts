/**
 * Bytes as a string of the same length, one character per byte (ISO-8859-1: character code =
 * byte value), without Node's Buffer, so core/ runs in the workbench too. Not TextDecoder's
 * 'latin1', which the WHATWG Encoding standard maps to windows-1252 (0x80–0x9F become other
 * characters). A PDF is read this way so that string offsets are byte offsets.
 */
export function latin1Text(bytes: Uint8Array): string {
  const CHUNK = 8192;
  const parts: string[] = [];
  for (let at = 0; at < bytes.length; at += CHUNK) parts.push(String.fromCharCode.apply(null, bytes.subarray(at, at + CHUNK) as unknown as number[]));
  return parts.join('');
}
