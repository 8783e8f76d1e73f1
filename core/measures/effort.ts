/**
 * Maximal-effort assessment: each criterion with its value, threshold and source, and a
 * verdict.
 *
 * Criteria (thresholds from `settings.effort`):
 * - peak_rer: peak RER ≥ rerMin (1.10; Balady et al., Circulation 2010;122:191–225;
 *   ATS/ACCP 2003).
 * - vo2_plateau (Taylor, Buskirk & Henschel, J Appl Physiol 1955;8:73–80; Howley, Bassett &
 *   Welch, Med Sci Sports Exerc 1995;27:1292–301): the rise of VO2 over the last increase of
 *   load is below plateauMlKgMin (2.1 mL/kg/min, when body mass is known) or plateauMlMin
 *   (150 mL/min). On a step protocol (last stage held ≥ 60 s) the rise is the mean VO2 of the
 *   last 30 s of the final stage minus that of the stage before. On a ramp it is the
 *   least-squares VO2–time slope over the final 60 s × 1 min, and the slope must also be
 *   below half the slope over the rest of the ramp (its first minute excluded): on a slow ramp
 *   VO2 rises by less than 150 mL/min per minute anyway, so the rise alone proves nothing.
 * - peak_hr: peak HR ≥ hrPctMin (85%) of age-predicted HRmax (common practice; Howley 1995).
 * - peak_rpe: Borg 6–20 ≥ rpeMin (17; Borg, Med Sci Sports Exerc 1982;14:377–81; common
 *   practice), from the lab's entry, else the highest rating recorded in the file.
 * - lactate: ≥ lactateMinMmolL (8 mmol/L; common practice), when entered.
 *
 * Verdict rule (common practice: RER is the criterion hardest to reach without a true
 * maximal effort, and no single secondary criterion suffices alone):
 * - maximal: the RER criterion is met and at least one other criterion is met;
 * - submaximal: the RER criterion is not met and at most one other criterion is met;
 * - indeterminate: everything else (RER met with no other criterion met or assessable, or RER
 *   not met while two or more others are).
 */
import type { Breath } from '../model/breath-table';
import type { EffortAssessment, EffortCriterion, PeakValues, Phases } from '../model/analysis';
import type { Settings } from '../model/settings';
import { linearFit } from '../math/linear-fit';
import { mean } from '../math/stats';
import { loadSignal } from '../clean/phases';

export interface EffortInputs {
  readonly breaths: readonly Breath[];
  readonly phases: Pick<Phases, 'incrementalStartS' | 'incrementalEndS'>;
  readonly peak: PeakValues;
  readonly weightKg: number | null;
  readonly predictedHrMaxBpm: number | null;
  readonly peakRpe: number | null;
  readonly lactateMmolL: number | null;
  readonly settings: Settings['effort'];
}

export interface PlateauMeasure {
  readonly riseMlMin: number;
  readonly protocol: 'step' | 'ramp';
  /** Ramp only: final-minute slope ÷ slope over the rest of the ramp. */
  readonly slopeRatio: number | null;
}

const HOLD_S = 60;
const STAGE_TAIL_S = 30;

/** Rise of VO2 over the last increase of load (see the module comment), or null. */
export function vo2PlateauMeasure(breaths: readonly Breath[], phases: EffortInputs['phases']): PlateauMeasure | null {
  const inc = breaths.filter((b) => b.timeS >= phases.incrementalStartS && b.timeS <= phases.incrementalEndS);
  if (inc.length < 4) return null;
  const endS = inc[inc.length - 1].timeS;
  const signal = loadSignal(inc);
  let lastChangeS: number | null = null;
  if (signal) {
    const last = signal.load[signal.load.length - 1];
    for (let i = inc.length - 1; i >= 0; i--) {
      const value = signal.load[i];
      if (value === null || last === null || Math.abs(value - last) > signal.tolerance) break;
      lastChangeS = inc[i].timeS;
    }
  }
  if (lastChangeS !== null && endS - lastChangeS >= HOLD_S && lastChangeS - inc[0].timeS >= STAGE_TAIL_S) {
    const change = lastChangeS;
    const finalStage = mean(inc.filter((b) => b.timeS > endS - STAGE_TAIL_S).map((b) => b.vo2MlMin));
    const stageBefore = mean(inc.filter((b) => b.timeS >= change - STAGE_TAIL_S && b.timeS < change).map((b) => b.vo2MlMin));
    const rise = finalStage - stageBefore;
    return Number.isFinite(rise) ? { riseMlMin: rise, protocol: 'step', slopeRatio: null } : null;
  }
  const fit = (from: number, to: number) => {
    const part = inc.filter((b) => b.timeS >= from && b.timeS <= to);
    return linearFit(part.map((b) => b.timeS), part.map((b) => b.vo2MlMin));
  };
  const final = fit(endS - HOLD_S, endS);
  if (!final) return null;
  const before = fit(inc[0].timeS + HOLD_S, endS - HOLD_S);
  const slopeRatio = before && before.slope > 0 ? final.slope / before.slope : null;
  return { riseMlMin: final.slope * 60, protocol: 'ramp', slopeRatio };
}

export function assessEffort(input: EffortInputs): EffortAssessment {
  const s = input.settings;
  const criteria: EffortCriterion[] = [];
  const rer = Number.isFinite(input.peak.rer) ? input.peak.rer : null;
  criteria.push({
    id: 'peak_rer',
    label: 'Peak RER',
    met: rer === null ? null : rer >= s.rerMin,
    value: rer,
    threshold: s.rerMin,
    unit: '',
    source: 'Balady et al., Circulation 2010;122:191–225; ATS/ACCP 2003',
  });
  criteria.push(plateauCriterion(input));
  const hrPct = input.peak.hrBpm !== null && input.predictedHrMaxBpm !== null ? (100 * input.peak.hrBpm) / input.predictedHrMaxBpm : null;
  criteria.push({
    id: 'peak_hr',
    label: 'Peak HR, % of age-predicted',
    met: hrPct === null ? null : hrPct >= s.hrPctMin,
    value: hrPct,
    threshold: s.hrPctMin,
    unit: '%',
    source: `common practice; Howley, Bassett & Welch 1995; HRmax by ${s.hrMaxFormula === 'tanaka' ? 'Tanaka 2001 (208 − 0.7 × age)' : 'Fox 1971 (220 − age)'}`,
  });
  criteria.push({
    id: 'peak_rpe',
    label: 'Peak RPE (Borg 6–20)',
    met: input.peakRpe === null ? null : input.peakRpe >= s.rpeMin,
    value: input.peakRpe,
    threshold: s.rpeMin,
    unit: 'Borg 6–20',
    source: 'Borg, Med Sci Sports Exerc 1982;14:377–81; threshold common practice',
  });
  criteria.push({
    id: 'lactate',
    label: 'Peak blood lactate',
    met: input.lactateMmolL === null ? null : input.lactateMmolL >= s.lactateMinMmolL,
    value: input.lactateMmolL,
    threshold: s.lactateMinMmolL,
    unit: 'mmol/L',
    source: 'common practice',
  });
  return { criteria, ...verdictOf(criteria) };
}

function plateauCriterion(input: EffortInputs): EffortCriterion {
  const s = input.settings;
  const perKg = input.weightKg !== null && input.weightKg > 0;
  const base = {
    id: 'vo2_plateau' as const,
    label: 'VO2 plateau',
    threshold: perKg ? s.plateauMlKgMin : s.plateauMlMin,
    unit: perKg ? 'mL/kg/min' : 'mL/min',
    source: 'Taylor, Buskirk & Henschel 1955; Howley, Bassett & Welch 1995',
  };
  const m = vo2PlateauMeasure(input.breaths, input.phases);
  if (!m) return { ...base, met: null, value: null };
  const value = perKg ? m.riseMlMin / (input.weightKg as number) : m.riseMlMin;
  const slopeOk = m.protocol === 'step' || (m.slopeRatio !== null && m.slopeRatio < 0.5);
  return {
    ...base,
    label: m.protocol === 'ramp' ? 'VO2 plateau (ramp: rise over the final minute, slope below half the earlier slope)' : 'VO2 plateau (step: rise over the last stage)',
    met: value < base.threshold && slopeOk,
    value,
  };
}

function verdictOf(criteria: readonly EffortCriterion[]): Pick<EffortAssessment, 'verdict' | 'reasons'> {
  const rer = criteria.find((c) => c.id === 'peak_rer') as EffortCriterion;
  const others = criteria.filter((c) => c.id !== 'peak_rer');
  const metOthers = others.filter((c) => c.met === true);
  const reasons = criteria.map((c) => {
    const state = c.met === null ? 'not assessed (no data)' : c.met ? 'met' : 'not met';
    const decimals = c.id === 'peak_rer' ? 2 : c.id === 'peak_rpe' ? 0 : 1;
    const unit = c.unit ? ` ${c.unit}` : '';
    const value = c.value === null ? '' : ` (${c.value.toFixed(decimals)}${unit}; threshold ${c.threshold}${unit})`;
    return `${c.label}: ${state}${value}.`;
  });
  const names = metOthers.map((c) => c.label).join(', ');
  if (rer.met === true && metOthers.length >= 1) {
    return { verdict: 'maximal', reasons: [`RER criterion met, with ${metOthers.length} more: ${names}.`, ...reasons] };
  }
  if (rer.met === false && metOthers.length <= 1) {
    return { verdict: 'submaximal', reasons: [`RER criterion not met and ${metOthers.length} other criterion met.`, ...reasons] };
  }
  const why =
    rer.met === true
      ? 'RER criterion met, but no other criterion was met or could be assessed.'
      : rer.met === false
        ? `RER criterion not met, yet ${metOthers.length} other criteria were: the evidence conflicts.`
        : 'Peak RER could not be computed.';
  return { verdict: 'indeterminate', reasons: [why, ...reasons] };
}
