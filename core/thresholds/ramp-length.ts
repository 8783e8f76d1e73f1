/**
 * The incremental phase labs aim for: about 10 (8–12) min (ERS task force, Palange et al., Eur
 * Respir J 2007). Shorter phases give thresholds with fewer points either side of the bend; the
 * analysis warns (core/analyze/warnings.ts) and the threshold interval is widened for them
 * (uncertainty.ts, calibrated on development seeds, docs/validation.md). Units: s.
 */
export const SHORT_RAMP_S = 8 * 60;

export function isShortRamp(incrementalStartS: number, incrementalEndS: number): boolean {
  return incrementalEndS - incrementalStartS < SHORT_RAMP_S;
}
