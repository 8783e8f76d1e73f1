/**
 * What the threshold interval's label says. The interval is built for 95 % coverage
 * (uncertainty.ts); where the held-out validation measured a coverage outside 93–97 %, the label
 * states the measured range instead of a bare "95 %", so a reader knows what it held
 * (docs/validation.md, "The interval"). Figures: held-out seeds of both generator families,
 * measured 2026-12-02; "short" is an incremental phase under 8 min (ramp-length.ts).
 */
import type { ThresholdId } from '../model/analysis';

/** Measured coverage range (%) over the two families, [lowest, highest], per threshold and ramp length. */
export const MEASURED_COVERAGE_PCT: Readonly<Record<ThresholdId, { readonly usual: readonly [number, number]; readonly short: readonly [number, number] }>> = {
  vt1: { usual: [95.8, 100], short: [95.0, 100] },
  vt2: { usual: [98.6, 98.6], short: [92.5, 100] },
};

export function intervalLabel(id: ThresholdId, shortRamp: boolean): string {
  const [lo, hi] = MEASURED_COVERAGE_PCT[id][shortRamp ? 'short' : 'usual'];
  if (lo >= 93 && hi <= 97) return '95% interval';
  const range = lo === hi ? `${lo.toFixed(0)}%` : `${lo.toFixed(0)}–${hi.toFixed(0)}%`;
  return `interval (held ${range} of generated tests${shortRamp ? ' with short ramps' : ''})`;
}
