/**
 * Shared helpers for the end-tidal methods: how many points carry PetO2 and PetCO2, and the
 * sentence used when a file has none.
 */
import type { DetectorInput } from './detector';
import { windowPoints } from './window';

export const NO_END_TIDAL = 'No end-tidal data: this file has no usable PetO2 and PetCO2 in the search window.';

/** Points in the window with both end-tidal pressures present. */
export function endTidalCount(input: DetectorInput): number {
  const s = input.series;
  return windowPoints(s, input.fromS, input.toS, (i) => {
    const o = s.peto2Mmhg[i];
    const c = s.petco2Mmhg[i];
    return o === null || c === null ? null : o + c;
  }).timeS.length;
}
