/**
 * The metrics compared day 2 against day 1: label, unit, adverse direction, what must hold
 * for the comparison to mean anything, and how the value is read from a `TestAnalysis`.
 *
 * Adverse direction: a lower value counts against the subject for uptake, workload, time and
 * OUES (Baba et al., JACC 1996); a higher value for the VE/VCO2 slope and the ventilatory
 * equivalents at VT1 (ATS/ACCP 2003; AHA, Balady et al. 2010). HR at VT1 is listed as
 * 'lower' because an earlier VT1 is reached at a lower heart rate (common practice in
 * two-day testing); peak RER is an effort check, so its direction only orders the wording.
 */
import type { TestAnalysis, ThresholdResult, ValuesAt } from '../model/analysis';
import type { AdverseDirection, MetricId } from './types';

/** What must hold on both days: a found threshold, a maximal effort, or nothing. */
export type MetricGate = 'threshold' | 'maximal' | 'none';

export interface MetricDefinition {
  readonly id: MetricId;
  readonly label: string;
  readonly unit: string;
  readonly adverse: AdverseDirection;
  readonly gate: MetricGate;
  readonly threshold: 'vt1' | 'vt2' | null;
  readonly effortCheck: boolean;
  readonly read: (test: TestAnalysis) => number | null;
}

function atThreshold(test: TestAnalysis, id: 'vt1' | 'vt2'): ValuesAt | null {
  const result: ThresholdResult = test[id];
  return result.at;
}

function ratio(numerator: number | null | undefined, denominator: number | null | undefined, scale = 1): number | null {
  if (numerator == null || denominator == null || denominator === 0) return null;
  return (scale * numerator) / denominator;
}

export const METRICS: readonly MetricDefinition[] = [
  { id: 'vt1_vo2', label: 'VO2 at VT1', unit: 'mL/min', adverse: 'lower', gate: 'threshold', threshold: 'vt1', effortCheck: false, read: (t) => atThreshold(t, 'vt1')?.vo2MlMin ?? null },
  { id: 'vt1_vo2_kg', label: 'VO2/kg at VT1', unit: 'mL/kg/min', adverse: 'lower', gate: 'threshold', threshold: 'vt1', effortCheck: false, read: (t) => atThreshold(t, 'vt1')?.vo2MlKgMin ?? null },
  { id: 'vt1_work', label: 'Workload at VT1', unit: 'W', adverse: 'lower', gate: 'threshold', threshold: 'vt1', effortCheck: false, read: (t) => atThreshold(t, 'vt1')?.workW ?? null },
  { id: 'vt1_hr', label: 'HR at VT1', unit: 'bpm', adverse: 'lower', gate: 'threshold', threshold: 'vt1', effortCheck: false, read: (t) => atThreshold(t, 'vt1')?.hrBpm ?? null },
  {
    id: 'vt1_time',
    label: 'Time from ramp start to VT1',
    unit: 's',
    adverse: 'lower',
    gate: 'threshold',
    threshold: 'vt1',
    effortCheck: false,
    read: (t) => {
      const at = atThreshold(t, 'vt1');
      return at ? at.timeS - t.phases.incrementalStartS : null;
    },
  },
  { id: 'vt1_ve_vco2', label: 'VE/VCO2 at VT1', unit: '', adverse: 'higher', gate: 'threshold', threshold: 'vt1', effortCheck: false, read: (t) => { const at = atThreshold(t, 'vt1'); return ratio(at?.veLMin, at?.vco2MlMin, 1000); } },
  { id: 'vt1_ve_vo2', label: 'VE/VO2 at VT1', unit: '', adverse: 'higher', gate: 'threshold', threshold: 'vt1', effortCheck: false, read: (t) => { const at = atThreshold(t, 'vt1'); return ratio(at?.veLMin, at?.vo2MlMin, 1000); } },
  { id: 'vt2_vo2', label: 'VO2 at VT2', unit: 'mL/min', adverse: 'lower', gate: 'threshold', threshold: 'vt2', effortCheck: false, read: (t) => atThreshold(t, 'vt2')?.vo2MlMin ?? null },
  { id: 'vt2_work', label: 'Workload at VT2', unit: 'W', adverse: 'lower', gate: 'threshold', threshold: 'vt2', effortCheck: false, read: (t) => atThreshold(t, 'vt2')?.workW ?? null },
  { id: 'peak_vo2', label: 'Peak VO2', unit: 'mL/min', adverse: 'lower', gate: 'maximal', threshold: null, effortCheck: false, read: (t) => t.peak.vo2MlMin },
  { id: 'peak_vo2_kg', label: 'Peak VO2/kg', unit: 'mL/kg/min', adverse: 'lower', gate: 'maximal', threshold: null, effortCheck: false, read: (t) => t.peak.vo2MlKgMin },
  { id: 'peak_work', label: 'Peak workload', unit: 'W', adverse: 'lower', gate: 'maximal', threshold: null, effortCheck: false, read: (t) => t.peak.workW },
  { id: 'peak_hr', label: 'Peak HR', unit: 'bpm', adverse: 'lower', gate: 'maximal', threshold: null, effortCheck: false, read: (t) => t.peak.hrBpm },
  { id: 'peak_o2_pulse', label: 'Peak O2 pulse', unit: 'mL/beat', adverse: 'lower', gate: 'maximal', threshold: null, effortCheck: false, read: (t) => t.peak.o2PulseMlBeat },
  { id: 'peak_ve', label: 'Peak VE', unit: 'L/min', adverse: 'lower', gate: 'maximal', threshold: null, effortCheck: false, read: (t) => t.peak.veLMin },
  { id: 'peak_rer', label: 'Peak RER (effort check, not an outcome)', unit: '', adverse: 'lower', gate: 'none', threshold: null, effortCheck: true, read: (t) => t.peak.rer },
  { id: 've_vco2_slope', label: 'VE/VCO2 slope', unit: '', adverse: 'higher', gate: 'none', threshold: null, effortCheck: false, read: (t) => t.derived.veVco2Slope },
  { id: 'oues', label: 'OUES', unit: 'mL/min per log10(L/min)', adverse: 'lower', gate: 'none', threshold: null, effortCheck: false, read: (t) => t.derived.oues },
  { id: 'duration', label: 'Incremental phase duration', unit: 's', adverse: 'lower', gate: 'maximal', threshold: null, effortCheck: false, read: (t) => t.peak.exerciseDurationS },
];

export const METRIC_IDS: readonly MetricId[] = METRICS.map((m) => m.id);

export function metricDefinition(id: MetricId): MetricDefinition {
  const found = METRICS.find((m) => m.id === id);
  if (!found) throw new Error(`unknown metric ${id}`);
  return found;
}

export function isMetricId(value: string): value is MetricId {
  return (METRIC_IDS as readonly string[]).includes(value);
}
