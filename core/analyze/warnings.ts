/**
 * The warnings of one analysis: plain sentences for the physiologist about what is missing,
 * uncertain or assumed. Thresholds for raising them are stated beside each constant.
 */
import type { BreathTable, Modality } from '../model/breath-table';
import type { EffortAssessment, PeakValues, Phases, ThresholdResult } from '../model/analysis';

import { SHORT_RAMP_S } from '../thresholds/ramp-length';

/*
 * An incremental phase shorter than SHORT_RAMP_S (8 min) is flagged: labs aim for about 10
 * (8–12) min (ERS task force, Palange et al., Eur Respir J 2007), and on generated tests
 * thresholds are clearly less accurate below 8 min (docs/validation.md, "hard" condition).
 */
/** Share of removed breaths above which the data quality is flagged, % (common practice). */
const REMOVED_WARN_PCT = 5;

export interface WarningInputs {
  readonly table: BreathTable;
  readonly removedCount: number;
  readonly phases: Phases;
  readonly vt1: ThresholdResult;
  readonly vt2: ThresholdResult;
  readonly peak: PeakValues;
  readonly effort: EffortAssessment;
  /** Age, sex, height, body mass and modality all known (predicted VO2 computed). */
  readonly personComplete: boolean;
  /** The modality taken from the load columns because the file did not state it, else null. */
  readonly assumedModality: Modality | null;
}

/** The short-ramp warning for an incremental phase of `durationS`. */
export function shortRampWarning(durationS: number): string {
  return `Short ramp (${(durationS / 60).toFixed(1)} min, under ${SHORT_RAMP_S / 60} min): thresholds less certain, and peaks may be too; 8–12 min of incremental exercise is the usual aim.`;
}

export function analysisWarnings(input: WarningInputs): string[] {
  const warnings: string[] = [];
  const { phases, peak, effort, vt1, vt2 } = input;
  const { breaths, metadata: meta } = input.table;
  if (breaths.length === 0) warnings.push('The file holds no breaths; nothing could be analysed.');
  const removedPct = breaths.length > 0 ? (100 * input.removedCount) / breaths.length : 0;
  if (removedPct > REMOVED_WARN_PCT) {
    warnings.push(`${input.removedCount} of ${breaths.length} breaths (${removedPct.toFixed(1)}%) were removed as outliers; check the recording.`);
  }
  if (!breaths.some((b) => b.workW !== null || b.speedKmh !== null) && phases.source === 'detected') {
    warnings.push('No load (work or treadmill speed) was recorded: the whole recording was treated as the incremental phase; set the phase limits in the settings.');
  }
  if (phases.incrementalEndS <= phases.incrementalStartS) {
    warnings.push(`The incremental phase ends (${phases.incrementalEndS.toFixed(0)} s) before it starts (${phases.incrementalStartS.toFixed(0)} s); check the phase limits in the settings.`);
  } else if (phases.incrementalEndS - phases.incrementalStartS < SHORT_RAMP_S) {
    warnings.push(shortRampWarning(phases.incrementalEndS - phases.incrementalStartS));
  }
  for (const t of [vt1, vt2]) {
    const name = t.id.toUpperCase();
    if (!t.at) warnings.push(`${name} was not found${t.reason ? `: ${t.reason}` : '.'}`);
    else if (t.methodsDisagree) warnings.push(`The ${name} methods disagree (spread ${t.spreadVo2MlMin?.toFixed(0) ?? '?'} mL/min); review the breakpoint.`);
  }
  if (!vt2.at) warnings.push('The VE/VCO2 slope was fitted over the whole incremental phase because VT2 was not found.');
  if (meta.weightKg === null) warnings.push('Body mass is missing: no VO2/kg, METs, Weber class or FRIEND prediction.');
  if (meta.ageY === null) warnings.push('Age is missing: no predicted HRmax or predicted VO2, and the HR effort criterion was not assessed.');
  else if (!input.personComplete) warnings.push('Sex, height or body mass is missing: no predicted peak VO2.');
  if (input.assumedModality !== null) warnings.push(`The file does not state the modality; ${input.assumedModality} was assumed from the recorded load.`);
  if (peak.hrBpm === null) warnings.push('No heart rate was recorded: no peak HR, O2 pulse or HR reserve.');
  if (effort.verdict !== 'maximal') {
    warnings.push(`Effort was judged ${effort.verdict}: a lower value on this day may reflect effort rather than physiology.`);
  }
  return warnings;
}
