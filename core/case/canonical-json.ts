/**
 * Canonical JSON: object keys sorted by code unit, no whitespace, numbers as JavaScript
 * prints them (shortest round-trip form, as in RFC 8785's number rule). The audit log
 * hashes this form, so the same content always gives the same bytes whatever the key order
 * it was built with. `undefined` members are left out, as JSON.stringify does. A
 * non-finite number is an error value, unless `nonFinite` is 'as-string' (used for digests
 * of computed results, where NaN is a legitimate answer): then it is written as "NaN",
 * "Infinity" or "-Infinity".
 *
 * Example: canonicalJson({ b: 1, a: [true, null] }) → '{"a":[true,null],"b":1}'.
 */
import { sha256 } from '@noble/hashes/sha2';
import { bytesToHex, utf8ToBytes } from '@noble/hashes/utils';
import { fail, locatedError, ok, type Result } from '../model/errors';

type NonFinite = 'error' | 'as-string';

export function canonicalJson(value: unknown, file = 'case file', nonFinite: NonFinite = 'error'): Result<string> {
  const parts: string[] = [];
  const problem = write(value, (s) => parts.push(s), nonFinite === 'as-string');
  return problem ? notSerialisable(problem, file) : ok(parts.join(''));
}

/** Text gathered before it is hashed, in UTF-16 code units. */
const DIGEST_CHUNK = 1 << 16;

/**
 * SHA-256 (hex) of the UTF-8 bytes of `canonicalJson(value, file, nonFinite)`, the same
 * digest, computed as the text is written: the whole text is never held at once (for a test
 * of a million breaths it runs to hundreds of megabytes).
 */
export function canonicalJsonSha256(value: unknown, file = 'case file', nonFinite: NonFinite = 'error'): Result<string> {
  const hash = sha256.create();
  let pending = '';
  const problem = write(
    value,
    (s) => {
      pending += s;
      if (pending.length >= DIGEST_CHUNK) {
        hash.update(utf8ToBytes(pending));
        pending = '';
      }
    },
    nonFinite === 'as-string',
  );
  if (problem) return notSerialisable(problem, file);
  hash.update(utf8ToBytes(pending));
  return ok(bytesToHex(hash.digest()));
}

function notSerialisable(path: string[], file: string): Result<never> {
  return fail(locatedError('not-serialisable', file, null, null, `The value at ${path.join('')} cannot be written to the case file (a number that is not finite, or a value that is not plain data).`));
}

/**
 * Writes `value` to `out`; returns null, or the path of the first value that cannot be
 * written (its segments, `$` first), built only then.
 */
function write(value: unknown, out: (s: string) => void, lenient: boolean): string[] | null {
  const problem = writeValue(value, out, lenient);
  if (problem) problem.push('$');
  return problem ? problem.reverse() : null;
}

/** As `write`, with the path's segments innermost first. */
function writeValue(value: unknown, out: (s: string) => void, lenient: boolean): string[] | null {
  if (value === null) {
    out('null');
    return null;
  }
  switch (typeof value) {
    case 'boolean':
      out(value ? 'true' : 'false');
      return null;
    case 'number':
      if (!Number.isFinite(value)) {
        if (!lenient) return [];
        out(JSON.stringify(String(value)));
        return null;
      }
      out(Object.is(value, -0) ? '0' : String(value));
      return null;
    case 'string':
      out(JSON.stringify(value));
      return null;
    case 'object': {
      if (Array.isArray(value)) {
        out('[');
        for (let i = 0; i < value.length; i++) {
          if (i > 0) out(',');
          const p = writeValue(value[i] === undefined ? null : value[i], out, lenient);
          if (p) {
            p.push(`[${i}]`);
            return p;
          }
        }
        out(']');
        return null;
      }
      const record = value as Record<string, unknown>;
      const keys = Object.keys(record)
        .filter((k) => record[k] !== undefined)
        .sort();
      out('{');
      for (let i = 0; i < keys.length; i++) {
        if (i > 0) out(',');
        out(JSON.stringify(keys[i]));
        out(':');
        const p = writeValue(record[keys[i]], out, lenient);
        if (p) {
          p.push(`.${keys[i]}`);
          return p;
        }
      }
      out('}');
      return null;
    }
    default:
      return [];
  }
}
