/**
 * What the threshold interval's label says. The interval is built for 95 % coverage
 * (uncertainty.ts); where the held-out validation measured a coverage outside 93–97 %, the label
 * states the measured range instead of a bare "95 %", so a reader knows what it held
 * (docs/validation.md, "The interval"). Figures: held-out seeds of both generator families,
 * measured 2026-12-02 after the likelihood calibration (uncertainty.ts); "short" is an
 * incremental phase under 8 min (ramp-length.ts), the held-out short-ramp tests (36 of family
 * 1, 40 of family B); "usual" is every other test, the main grids (72 each) and the very noisy
 * tests (36 and 32), since the label cannot tell a noisy test from a clean one. With 32–72 tests
 * per set one test moves a coverage by 1.4–3 points; a perfectly calibrated 95 % interval lands
 * in 93–97 % on 72 tests only about half the time (binomial), so the ranges are wide.
 */
import type { ThresholdId } from '../model/analysis';

/** Measured coverage range (%) over the two families, [lowest, highest], per threshold and ramp length. */
export const MEASURED_COVERAGE_PCT: Readonly<Record<ThresholdId, { readonly usual: readonly [number, number]; readonly short: readonly [number, number] }>> = {
  vt1: { usual: [87.5, 100], short: [100, 100] },
  vt2: { usual: [90.6, 98.6], short: [87.5, 100] },
};

export function intervalLabel(id: ThresholdId, shortRamp: boolean): string {
  const [lo, hi] = MEASURED_COVERAGE_PCT[id][shortRamp ? 'short' : 'usual'];
  if (lo >= 93 && hi <= 97) return '95% interval';
  const range = lo === hi ? `${lo.toFixed(0)}%` : `${lo.toFixed(0)}–${hi.toFixed(0)}%`;
  return `interval (held ${range} of generated tests${shortRamp ? ' with short ramps' : ''})`;
}
