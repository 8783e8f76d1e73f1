/**
 * Thinning of a chart's points for drawing. A page cannot show more points than it has room
 * for, and a vega spec of a million rows per chart costs gigabytes to build and render, so a
 * chart whose largest series has more than `MAX_DRAWN_POINTS` averaged points draws one
 * point in k of every series (k the smallest step that brings the largest under the limit),
 * from the first, plus the last. The chart says so in its subtitle (`thinnedNote`). An
 * ordinary test (a few thousand breaths at most) stays under the limit and is drawn whole.
 * Tables and every computed number use all points; only the drawing is thinned. The limit
 * is our choice (common practice: decimate for display).
 *
 * Example: 12,000 points → step 3: points 0, 3, 6, …, 11,997 and 11,999 (4,001 drawn).
 */

/** Most points one chart series draws before the chart is thinned. */
export const MAX_DRAWN_POINTS = 5000;

/** The step that brings the largest of `counts` under the limit (1: draw every point). */
export function drawingStep(counts: readonly number[], max = MAX_DRAWN_POINTS): number {
  const largest = counts.reduce((a, b) => Math.max(a, b), 0);
  return largest <= max ? 1 : Math.ceil(largest / max);
}

/** One item in `step` from the first, plus the last; the items themselves when `step` is 1. */
export function everyNth<T>(items: readonly T[], step: number): readonly T[] {
  if (step <= 1) return items;
  const kept: T[] = [];
  for (let i = 0; i < items.length; i += step) kept.push(items[i]);
  if (items.length > 0 && (items.length - 1) % step !== 0) kept.push(items[items.length - 1]);
  return kept;
}

/** The subtitle line that states a thinning, or null when `step` is 1. */
export function thinnedNote(step: number, drawn: number, of: number): string | null {
  if (step <= 1) return null;
  const n = (x: number) => x.toLocaleString('en-US');
  return `drawn: 1 averaged point in ${n(step)} (${n(drawn)} of ${n(of)}); every number uses all of them`;
}
