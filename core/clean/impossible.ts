/**
 * Breaths with values outside physiology are left out of the analysis, each named with its
 * line and reason, before outlier removal: a VO2, VCO2 or VE at or below zero, a VO2 above
 * the plausibility limit, a VE, work or end-tidal pressure outside the hard limits of
 * core/import/plausibility.ts, or a heart rate above the plausible maximum. Such a value is
 * not noise about the response (outlier removal assumes that, Lamarra et al. 1987) but a
 * broken cell, and a single 1e300 would otherwise become a peak or drag an average.
 * A heart rate below the plausible minimum is kept: a drop-out of the HR sensor (0 bpm) is
 * common and leaves the breath's gas exchange intact. How many breaths a test may lose this
 * way before it is refused or its effort left undecided: core/import/sanity.ts.
 *
 * Example: VE 1e300 L/min on the breath of line 320 → that breath is left out, with the
 * reason "VE of ≥ 10⁹ L/min is outside physiology (above 0, at most 400 L/min)."
 */
import type { Breath } from '../model/breath-table';
import type { RemovedBreath } from '../model/analysis';
import type { Settings } from '../model/settings';
import { plausibilityFlags } from '../import/plausibility';

const LEFT_OUT = new Set(['implausible-gas', 'implausible-vo2', 'implausible-ve', 'implausible-work', 'implausible-pet']);

export function leaveOutImpossible(breaths: readonly Breath[], settings: Settings['import'], file: string): { kept: readonly Breath[]; removed: readonly RemovedBreath[] } {
  // The breath flags come in breath order (each with its breath's line and time), so one walk
  // pairs them with their breaths, also where a table has no source lines.
  const flags = plausibilityFlags(breaths, [], [], [], settings, file).filter((f) => LEFT_OUT.has(f.code) || (f.code === 'implausible-hr' && (f.value ?? 0) > settings.implausible.hrMaxBpm));
  if (flags.length === 0) return { kept: breaths, removed: [] };
  const kept: Breath[] = [];
  const removed: RemovedBreath[] = [];
  let j = 0;
  for (const b of breaths) {
    const f = flags[j];
    if (f && f.timeS === b.timeS && (f.line ?? 0) === b.sourceLine) {
      removed.push({ sourceLine: b.sourceLine, timeS: b.timeS, variable: f.variable, value: f.value ?? Number.NaN, reason: f.message });
      while (j < flags.length && flags[j].timeS === b.timeS && (flags[j].line ?? 0) === b.sourceLine) j++;
    } else kept.push(b);
  }
  return { kept, removed };
}
