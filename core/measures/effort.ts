/**
 * Maximal-effort assessment: each criterion with its value, threshold and source, and a
 * verdict.
 *
 * Criteria (thresholds from `settings.effort`):
 * - peak_rer: peak RER ≥ rerMin (1.10; Balady et al., Circulation 2010;122:191–225;
 *   ATS/ACCP 2003). Some labs use 1.15; Robergs et al., Sports Med 2010;40:95–111 surveyed
 *   labs using either.
 * - vo2_plateau (Taylor et al., J Appl Physiol 1955;8:73–80; Howley, Bassett &
 *   Welch, Med Sci Sports Exerc 1995;27:1292–301): the rise of VO2 over the last increase of
 *   load is below plateauMlKgMin (2.1 mL/kg/min, when body mass is known) or plateauMlMin
 *   (150 mL/min). On a step protocol (last stage held ≥ 60 s) the rise is the mean VO2 of the
 *   last 30 s of the final stage minus that of the stage before. On a ramp it is the
 *   least-squares VO2–time slope over the final 60 s × 1 min, and the slope must also be
 *   below half the slope over the rest of the ramp (its first minute excluded): on a slow ramp
 *   VO2 rises by less than 150 mL/min per minute anyway, so the rise alone proves nothing.
 * - peak_hr, by `hrCriterion`: 'percent', peak HR ≥ hrPctMin (85 %) of age-predicted HRmax;
 *   'within-bpm', peak HR ≥ predicted − hrWithinBpm (10 bpm); 'either', one of the two;
 *   'off', not assessed (beta-blockade blunts the HR response). Common practice; Howley et al.,
 *   Med Sci Sports Exerc 1995.
 * - peak_rpe: Borg 6–20 ≥ rpeMin (17; Borg, Med Sci Sports Exerc 1982;14:377–81; common
 *   practice), from the lab's entry, else the highest rating recorded in the file.
 * - lactate: ≥ lactateMinMmolL (8 mmol/L; common practice), when entered.
 *
 * Verdict rule `rule`:
 * 'rer-plus-one' (the default; common practice: RER is the criterion hardest to reach
 * without a true maximal effort, and no single secondary criterion suffices alone):
 * - maximal: the RER criterion is met and at least one other criterion is met;
 * - submaximal: the RER criterion is not met and at most one other criterion is met;
 * - indeterminate: everything else (RER met with no other criterion met or assessable, or RER
 *   not met while two or more others are).
 * 'rer-alone' (Balady et al. 2010 call peak RER the best non-invasive indicator of effort
 * (memory)): maximal when RER is met, submaximal when not, indeterminate without an RER; the
 * other criteria are reported and do not decide.
 * Each criterion carries the rule as applied in words and its value at the precision it is
 * judged at (RER 2 decimals, HR and RPE whole numbers), so no screen or page re-derives them.
 * Values print with bounded digits (core/locale/format-number.ts: '≥ 10⁹' beyond a billion).
 *
 * Data that cannot show an effort: when `impossibleData` gives a reason (more than 5 % of
 * the breaths carry values outside physiology, core/import/sanity.ts; common practice), the
 * verdict is indeterminate whatever the criteria say, and that reason comes first.
 */
import type { Breath } from '../model/breath-table';
import type { EffortAssessment, EffortCriterion, PeakValues, Phases } from '../model/analysis';
import { EFFORT_OPTION_DEFAULTS, type Settings } from '../model/settings';
import { linearFit } from '../math/linear-fit';
import { mean } from '../math/stats';
import { loadSignal } from '../clean/phases';
import { boundedFixed } from '../locale/format-number';

export interface EffortInputs {
  readonly breaths: readonly Breath[];
  readonly phases: Pick<Phases, 'incrementalStartS' | 'incrementalEndS'>;
  readonly peak: PeakValues;
  readonly weightKg: number | null;
  readonly predictedHrMaxBpm: number | null;
  readonly peakRpe: number | null;
  readonly lactateMmolL: number | null;
  readonly settings: Settings['effort'];
  /** Why the recording cannot vouch for its effort (too many impossible values), or null. */
  readonly impossibleData?: string | null;
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
    // Typed arrays: see core/thresholds/window.ts.
    const t = new Float64Array(inc.length);
    const v = new Float64Array(inc.length);
    let k = 0;
    for (const b of inc) {
      if (b.timeS >= from && b.timeS <= to) {
        t[k] = b.timeS;
        v[k++] = b.vo2MlMin;
      }
    }
    return linearFit(t.subarray(0, k), v.subarray(0, k));
  };
  const final = fit(endS - HOLD_S, endS);
  if (!final) return null;
  const before = fit(inc[0].timeS + HOLD_S, endS - HOLD_S);
  const slopeRatio = before && before.slope > 0 ? final.slope / before.slope : null;
  return { riseMlMin: final.slope * 60, protocol: 'ramp', slopeRatio };
}

export function assessEffort(input: EffortInputs): EffortAssessment {
  const s = input.settings;
  const rule = s.rule ?? EFFORT_OPTION_DEFAULTS.rule;
  const criteria: EffortCriterion[] = [];
  const rer = Number.isFinite(input.peak.rer) ? input.peak.rer : null;
  criteria.push({
    id: 'peak_rer',
    label: 'Peak RER',
    met: rer === null ? null : rer >= s.rerMin,
    value: rer,
    threshold: s.rerMin,
    unit: '',
    source: 'Balady et al., Circulation 2010;122:191–225; ATS/ACCP 2003; 1.10 or 1.15 by lab (Robergs et al., Sports Med 2010)',
    rule: `peak RER ≥ ${s.rerMin.toFixed(2)}`,
    valueText: rer === null ? 'not measured' : boundedFixed(rer, 2),
    detail: null,
  });
  criteria.push(plateauCriterion(input));
  criteria.push(hrCriterion(input));
  const rpeDigits = input.peakRpe !== null && !Number.isInteger(input.peakRpe) ? 1 : 0;
  criteria.push({
    id: 'peak_rpe',
    label: 'Peak RPE (Borg 6–20)',
    met: input.peakRpe === null ? null : input.peakRpe >= s.rpeMin,
    value: input.peakRpe,
    threshold: s.rpeMin,
    unit: 'Borg 6–20',
    source: 'Borg, Med Sci Sports Exerc 1982;14:377–81; threshold common practice',
    rule: `rating ≥ ${trim(s.rpeMin)} on the Borg 6–20 scale`,
    valueText: input.peakRpe === null ? 'not recorded' : boundedFixed(input.peakRpe, rpeDigits),
    detail: null,
  });
  criteria.push({
    id: 'lactate',
    label: 'Peak blood lactate',
    met: input.lactateMmolL === null ? null : input.lactateMmolL >= s.lactateMinMmolL,
    value: input.lactateMmolL,
    threshold: s.lactateMinMmolL,
    unit: 'mmol/L',
    source: 'common practice',
    rule: `≥ ${trim(s.lactateMinMmolL)} mmol/L`,
    valueText: input.lactateMmolL === null ? 'not measured' : `${boundedFixed(input.lactateMmolL, 1)} mmol/L`,
    detail: null,
  });
  if (input.impossibleData) return { criteria, combination: COMBINATION[rule], verdict: 'indeterminate', reasons: [input.impossibleData, ...reasonsOf(criteria)] };
  const verdict = rule === 'rer-alone' ? rerAloneVerdict(criteria) : verdictOf(criteria);
  return { criteria, combination: COMBINATION[rule], ...verdict };
}

const COMBINATION = {
  'rer-plus-one':
    'Maximal when the peak RER criterion and at least one other criterion are met; submaximal when RER is not met and at most one other is; otherwise indeterminate (common practice).',
  'rer-alone':
    'Maximal when the peak RER criterion is met and submaximal when it is not; the other criteria are reported and do not decide (Balady et al., Circulation 2010, who call peak RER the best non-invasive indicator of effort; memory).',
} as const;

/** A threshold as a person writes it: 2.1, 150, 1.1 → "2.1", "150", "1.1". */
function trim(value: number): string {
  return String(Number(value.toFixed(2)));
}

function hrMaxWords(formula: Settings['effort']['hrMaxFormula']): string {
  return formula === 'tanaka' ? 'Tanaka 2001 (208 − 0.7 × age)' : 'Fox 1971 (220 − age)';
}

function hrCriterion(input: EffortInputs): EffortCriterion {
  const s = input.settings;
  const mode = s.hrCriterion ?? EFFORT_OPTION_DEFAULTS.hrCriterion;
  const withinBpm = s.hrWithinBpm ?? EFFORT_OPTION_DEFAULTS.hrWithinBpm;
  const predicted = input.predictedHrMaxBpm;
  const hr = input.peak.hrBpm;
  const hrPct = hr !== null && predicted !== null ? (100 * hr) / predicted : null;
  const source = `common practice; Howley et al. 1995; HRmax by ${hrMaxWords(s.hrMaxFormula)}`;
  const predictedText = predicted === null ? 'age-predicted HRmax' : `age-predicted ${predicted.toFixed(0)} bpm`;
  const base = { id: 'peak_hr' as const, source };
  if (mode === 'off') {
    return {
      ...base,
      label: 'Peak HR (criterion switched off)',
      met: null,
      value: hrPct,
      threshold: s.hrPctMin,
      unit: '%',
      rule: 'not applied: the HR criterion is switched off in the settings (e.g. beta-blockade)',
      valueText: hr === null ? 'not recorded' : `${boundedFixed(hr, 0)} bpm`,
      detail: null,
    };
  }
  const pctMet = hrPct === null ? null : hrPct >= s.hrPctMin;
  const withinMet = hr === null || predicted === null ? null : hr >= predicted - withinBpm;
  const pctRule = `≥ ${trim(s.hrPctMin)} % of ${predictedText}${predicted === null ? '' : ` (≥ ${((s.hrPctMin / 100) * predicted).toFixed(0)} bpm)`}`;
  const withinRule = `within ${trim(withinBpm)} bpm of ${predictedText}${predicted === null ? '' : ` (≥ ${(predicted - withinBpm).toFixed(0)} bpm)`}`;
  const pctText = hrPct === null ? 'not available' : `${boundedFixed(hrPct, 0)} % (${boundedFixed(hr as number, 0)} bpm)`;
  if (mode === 'within-bpm') {
    return {
      ...base,
      label: 'Peak HR, within range of age-predicted',
      met: withinMet,
      value: hr,
      threshold: predicted === null ? withinBpm : predicted - withinBpm,
      unit: 'bpm',
      rule: `peak HR ${withinRule}`,
      valueText: hr === null ? 'not recorded' : `${boundedFixed(hr, 0)} bpm`,
      detail: null,
    };
  }
  return {
    ...base,
    label: 'Peak HR, % of age-predicted',
    met: mode === 'either' ? (pctMet === null ? null : pctMet || withinMet === true) : pctMet,
    value: hrPct,
    threshold: s.hrPctMin,
    unit: '%',
    rule: mode === 'either' ? `peak HR ${pctRule}, or ${withinRule}` : `peak HR ${pctRule}`,
    valueText: pctText,
    detail: null,
  };
}

function plateauCriterion(input: EffortInputs): EffortCriterion {
  const s = input.settings;
  const perKg = input.weightKg !== null && input.weightKg > 0;
  const threshold = perKg ? s.plateauMlKgMin : s.plateauMlMin;
  const unit = perKg ? 'mL/kg/min' : 'mL/min';
  const digits = perKg ? 1 : 0;
  const base = {
    id: 'vo2_plateau' as const,
    label: 'VO2 plateau',
    threshold,
    unit,
    source: 'Taylor et al. 1955; Howley et al. 1995; ramp slope ratio: Twofold’s own addition',
  };
  const m = vo2PlateauMeasure(input.breaths, input.phases);
  if (!m) return { ...base, met: null, value: null, rule: `rise of VO2 below ${trim(threshold)} ${unit} for a further rise in load`, valueText: 'not assessable', detail: null };
  const value = perKg ? m.riseMlMin / (input.weightKg as number) : m.riseMlMin;
  const slopeOk = m.protocol === 'step' || (m.slopeRatio !== null && m.slopeRatio < RAMP_SLOPE_RATIO_MAX);
  const ramp = m.protocol === 'ramp';
  return {
    ...base,
    label: ramp ? 'VO2 plateau (ramp)' : 'VO2 plateau (step)',
    met: value < threshold && slopeOk,
    value,
    rule: ramp
      ? `rise below ${trim(threshold)} ${unit} over the final minute, and the final minute's slope below ${RAMP_SLOPE_RATIO_MAX.toFixed(2)} × the slope over the earlier ramp`
      : `rise below ${trim(threshold)} ${unit} from the stage before to the last stage`,
    valueText: `${boundedFixed(value, digits)} ${unit}`,
    detail: ramp ? `slope ratio ${m.slopeRatio === null ? 'not available' : boundedFixed(m.slopeRatio, 2)}` : null,
  };
}

/** The ramp part of the plateau rule (module comment): the final minute's slope below half the earlier one. */
const RAMP_SLOPE_RATIO_MAX = 0.5;

function reasonsOf(criteria: readonly EffortCriterion[]): string[] {
  return criteria.map((c) => {
    const state = c.met === null ? (c.id === 'peak_hr' && c.label.includes('switched off') ? 'not assessed (switched off)' : 'not assessed (no data)') : c.met ? 'met' : 'not met';
    const value = c.value === null && c.met === null ? '' : ` (${c.valueText}${c.detail ? `, ${c.detail}` : ''}; rule: ${c.rule})`;
    return `${c.label}: ${state}${value}.`;
  });
}

function rerAloneVerdict(criteria: readonly EffortCriterion[]): Pick<EffortAssessment, 'verdict' | 'reasons'> {
  const rer = criteria.find((c) => c.id === 'peak_rer') as EffortCriterion;
  const reasons = reasonsOf(criteria);
  if (rer.met === true) return { verdict: 'maximal', reasons: ['RER criterion met (the rule in use decides by RER alone).', ...reasons] };
  if (rer.met === false) return { verdict: 'submaximal', reasons: ['RER criterion not met (the rule in use decides by RER alone).', ...reasons] };
  return { verdict: 'indeterminate', reasons: ['Peak RER could not be computed.', ...reasons] };
}

function verdictOf(criteria: readonly EffortCriterion[]): Pick<EffortAssessment, 'verdict' | 'reasons'> {
  const rer = criteria.find((c) => c.id === 'peak_rer') as EffortCriterion;
  const others = criteria.filter((c) => c.id !== 'peak_rer');
  const metOthers = others.filter((c) => c.met === true);
  const reasons = reasonsOf(criteria);
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
