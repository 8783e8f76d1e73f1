/**
 * What the threshold interval's label says. The interval is built for 95 % coverage
 * (uncertainty.ts); where the held-out validation measured a coverage outside 93–97 %, the label
 * states the measured range instead of a bare "95 %", so a reader knows what it held
 * (docs/validation.md, "The interval"). Figures: the held-out coverage on 504 tests per family
 * and condition (seeds 200001–201504, never used in tuning; docs/validation.md, "The interval's
 * coverage on 504 held-out tests per cell"), measured once on 2026-12-03 with the weights of
 * the likelihood calibration (uncertainty.ts); "short" is an incremental phase under 8 min
 * (ramp-length.ts), the short-ramp tests of both families; "usual" is every other test, the
 * main grids and the very noisy tests, since the label cannot tell a noisy test from a clean
 * one. The range is [lowest, highest] over those sets; each figure's Wilson 95 % interval is
 * about ±1.5–2 points at 504 tests.
 */
import type { ThresholdId } from '../model/analysis';

/** Measured coverage range (%) over the two families, [lowest, highest], per threshold and ramp length. */
export const MEASURED_COVERAGE_PCT: Readonly<Record<ThresholdId, { readonly usual: readonly [number, number]; readonly short: readonly [number, number] }>> = {
  vt1: { usual: [92.2, 97.8], short: [96.5, 98.0] },
  vt2: { usual: [92.7, 97.6], short: [90.4, 96.0] },
};

export function intervalLabel(id: ThresholdId, shortRamp: boolean): string {
  const [lo, hi] = MEASURED_COVERAGE_PCT[id][shortRamp ? 'short' : 'usual'];
  if (lo >= 93 && hi <= 97) return '95% interval';
  const range = lo === hi ? `${lo.toFixed(0)}%` : `${lo.toFixed(0)}–${hi.toFixed(0)}%`;
  return `interval (held ${range} of generated tests${shortRamp ? ' with short ramps' : ''})`;
}
