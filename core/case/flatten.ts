/**
 * Flattens plain data to dotted paths, keeping only leaves (numbers, strings, booleans, null),
 * so two results can be compared number by number and the differences named. A
 * non-finite number becomes the string "NaN", "Infinity" or "-Infinity", so it survives JSON.
 *
 * Example: flattenLeaves({ a: { b: 1 }, c: [true] }) → { 'a.b': 1, 'c[0]': true }.
 */
export type Leaf = number | string | boolean | null;

export function flattenLeaves(value: unknown, prefix = '', out: Record<string, Leaf> = {}): Record<string, Leaf> {
  if (typeof value === 'number' && !Number.isFinite(value)) {
    out[prefix] = String(value);
  } else if (value === null || typeof value === 'number' || typeof value === 'string' || typeof value === 'boolean') {
    out[prefix] = value;
  } else if (Array.isArray(value)) {
    value.forEach((v, i) => flattenLeaves(v, `${prefix}[${i}]`, out));
  } else if (typeof value === 'object' && value !== undefined) {
    for (const [k, v] of Object.entries(value as Record<string, unknown>)) {
      if (v !== undefined) flattenLeaves(v, prefix ? `${prefix}.${k}` : k, out);
    }
  }
  return out;
}

/** Paths whose values differ between two flattened results (present in either). */
export function differingPaths(a: Readonly<Record<string, Leaf>>, b: Readonly<Record<string, Leaf>>): string[] {
  const keys = new Set([...Object.keys(a), ...Object.keys(b)]);
  return [...keys].filter((k) => !Object.is(a[k], b[k])).sort();
}
