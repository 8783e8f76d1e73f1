/**
 * The fewest points a breakpoint fit may leave on either side: the setting
 * `minPointsPerSegment`, and at least a fixed share of the window's points. A bend carried by
 * the last few points of a window cannot be told from noise at its edge (breakpoint
 * estimators are least stable near the ends of the data); the share is our choice, stated so
 * that it can be checked, and was held fixed in the accuracy validation (docs/validation.md).
 */
import type { Settings } from '../model/settings';

export const EDGE_SHARE = 0.15;

export function minPerSide(settings: Settings, points: number): number {
  return Math.max(settings.thresholds.minPointsPerSegment, Math.ceil(EDGE_SHARE * points));
}
