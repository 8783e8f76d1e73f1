/**
 * Durations as a person reads them in the report: m:ss, and a signed change in m:ss, both
 * from the one formatter (core/locale/min-sec.ts).
 *
 * Example: signedMinSec(-287) → '−4:47'; signedMinSec(36) → '+0:36'; signedMinSec(0) → '0:00'.
 */
import { minSec, signedMinSec } from '../locale/min-sec';

export { signedMinSec };

/** A metric's cells for a seconds unit: unit m:ss, values and change in m:ss; null when the unit is not seconds. */
export function timeCells(unit: string, day1: number | null, day2: number | null, delta: number | null): { unit: string; day1: string; day2: string; delta: string } | null {
  if (unit !== 's') return null;
  return { unit: 'm:ss', day1: minSec(day1), day2: minSec(day2), delta: signedMinSec(delta) };
}
