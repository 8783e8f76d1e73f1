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
import { fail, locatedError, ok, type Result } from '../model/errors';

export function canonicalJson(value: unknown, file = 'case file', nonFinite: 'error' | 'as-string' = 'error'): Result<string> {
  const parts: string[] = [];
  const problem = write(value, parts, '$', nonFinite === 'as-string');
  if (problem) {
    return fail(locatedError('not-serialisable', file, null, null, `The value at ${problem} cannot be written to the case file (a number that is not finite, or a value that is not plain data).`));
  }
  return ok(parts.join(''));
}

/** Writes `value` into `out`; returns the path of the first value that cannot be written. */
function write(value: unknown, out: string[], path: string, lenient: boolean): string | null {
  if (value === null) {
    out.push('null');
    return null;
  }
  switch (typeof value) {
    case 'boolean':
      out.push(value ? 'true' : 'false');
      return null;
    case 'number':
      if (!Number.isFinite(value)) {
        if (!lenient) return path;
        out.push(JSON.stringify(String(value)));
        return null;
      }
      out.push(Object.is(value, -0) ? '0' : String(value));
      return null;
    case 'string':
      out.push(JSON.stringify(value));
      return null;
    case 'object': {
      if (Array.isArray(value)) {
        out.push('[');
        for (let i = 0; i < value.length; i++) {
          if (i > 0) out.push(',');
          const p = write(value[i] === undefined ? null : value[i], out, `${path}[${i}]`, lenient);
          if (p) return p;
        }
        out.push(']');
        return null;
      }
      const record = value as Record<string, unknown>;
      const keys = Object.keys(record)
        .filter((k) => record[k] !== undefined)
        .sort();
      out.push('{');
      for (let i = 0; i < keys.length; i++) {
        if (i > 0) out.push(',');
        out.push(JSON.stringify(keys[i]), ':');
        const p = write(record[keys[i]], out, `${path}.${keys[i]}`, lenient);
        if (p) return p;
      }
      out.push('}');
      return null;
    }
    default:
      return path;
  }
}
