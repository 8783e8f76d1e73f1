/**
 * Only what changed crosses from the worker to the page: the worker sends a patch of its new
 * view against the view it posted before, and the page applies it to its copy of that view.
 * Parts that did not change keep their identity on the page, so memoised components and
 * charts drawn from them are left alone.
 *
 * A patch mirrors the shape of the value: a changed leaf or a reshaped part is sent whole
 * (`set`); a plain object with some changed keys sends those keys (`keys`) and the names of
 * keys it lost (`drop`); an array of the same kind sends its changed items and its new length
 * (`items`). Unchanged parts are absent. Values are compared with Object.is (NaN equals NaN).
 *
 * Example: from { a: 1, b: { c: [1, 2] } } to { a: 1, b: { c: [1, 2, 3] } } the patch is
 * { keys: { b: { keys: { c: { items: { 2: { set: 3 } }, length: 3 } } } } }.
 */

export type Patch =
  | { readonly set: unknown }
  | { readonly keys: Readonly<Record<string, Patch>>; readonly drop?: readonly string[] }
  | { readonly items: Readonly<Record<number, Patch>>; readonly length: number };

function isPlainObject(value: unknown): value is Record<string, unknown> {
  if (value === null || typeof value !== 'object') return false;
  const proto = Object.getPrototypeOf(value);
  return proto === Object.prototype || proto === null;
}

/** The patch that turns `before` into `after`; null when they are the same. */
export function diffValue(before: unknown, after: unknown): Patch | null {
  if (Object.is(before, after)) return null;
  if (Array.isArray(before) && Array.isArray(after)) {
    const items: Record<number, Patch> = {};
    let changed = 0;
    for (let i = 0; i < after.length; i++) {
      const p = i < before.length ? diffValue(before[i], after[i]) : { set: after[i] };
      if (p) {
        items[i] = p;
        changed++;
      }
    }
    if (changed === 0 && before.length === after.length) return null;
    // Mostly new: sending it whole is smaller than an item-by-item patch.
    if (changed > after.length / 2) return { set: after };
    return { items, length: after.length };
  }
  if (isPlainObject(before) && isPlainObject(after)) {
    const keys: Record<string, Patch> = {};
    let changed = false;
    for (const k of Object.keys(after)) {
      const p = k in before ? diffValue(before[k], after[k]) : { set: after[k] };
      if (p) {
        keys[k] = p;
        changed = true;
      }
    }
    const drop = Object.keys(before).filter((k) => !(k in after));
    if (!changed && drop.length === 0) return null;
    return drop.length ? { keys, drop } : { keys };
  }
  return { set: after };
}

/** `before` with the patch applied; unchanged parts are `before`'s own objects. */
export function applyPatch<T>(before: T, patch: Patch | null): T {
  if (!patch) return before;
  if ('set' in patch) return patch.set as T;
  if ('items' in patch) {
    if (!Array.isArray(before)) throw new Error('an array patch for a value that is not an array');
    const out = before.slice(0, patch.length);
    for (const [i, p] of Object.entries(patch.items)) out[Number(i)] = applyPatch(before[Number(i)], p);
    return out as T;
  }
  if (!isPlainObject(before)) throw new Error('an object patch for a value that is not an object');
  const out: Record<string, unknown> = { ...before };
  for (const k of patch.drop ?? []) delete out[k];
  for (const [k, p] of Object.entries(patch.keys)) out[k] = applyPatch(before[k], p);
  return out as T;
}
