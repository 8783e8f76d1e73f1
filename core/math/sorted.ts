/**
 * Searching a non-decreasing array by bisection (the order is the caller's promise: the
 * processed series' times, a running maximum of the load).
 */

/** The first index in [from, to) whose value makes `atOrPast` true, or `to` when none does; `atOrPast` must be false then true along the array. */
export function firstIndexWhere(values: ArrayLike<number>, atOrPast: (value: number) => boolean, from = 0, to = values.length): number {
  let lo = from;
  let hi = to;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (atOrPast(values[mid])) hi = mid;
    else lo = mid + 1;
  }
  return lo;
}

/** The indices [first, last) of the values within [from, to] (both ends included) of a non-decreasing array. */
export function indexRangeWithin(values: ArrayLike<number>, from: number, to: number): [number, number] {
  const first = firstIndexWhere(values, (v) => v >= from);
  return [first, Math.max(first, firstIndexWhere(values, (v) => v > to, first))];
}
