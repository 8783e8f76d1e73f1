/**
 * The analysis as one plain JSON object with snake_case keys and units in the names, for
 * the command line's `--json` and for scripts. Non-finite numbers become null.
 */
import type { TestAnalysis, ThresholdResult } from '../model/analysis';

type Json = null | boolean | number | string | Json[] | { [key: string]: Json };

function num(x: number | null | undefined): number | null {
  return x === null || x === undefined || !Number.isFinite(x) ? null : x;
}

function threshold(t: ThresholdResult): Json {
  if (!t.at) return null;
  const methods: { [key: string]: Json } = {};
  for (const m of t.methods) {
    methods[m.method] = m.found
      ? { found: true, time_s: num(m.timeS), vo2_ml_min: num(m.vo2MlMin), source: m.source }
      : { found: false, time_s: null, vo2_ml_min: null, reason: m.reason, source: m.source };
  }
  return {
    time_s: num(t.at.timeS),
    vo2_ml_min: num(t.at.vo2MlMin),
    vo2_ml_kg_min: num(t.at.vo2MlKgMin),
    work_w: num(t.at.workW),
    hr_bpm: num(t.at.hrBpm),
    ve_l_min: num(t.at.veLMin),
    rer: num(t.at.rer),
    pct_peak_vo2: num(t.at.pctPeakVo2),
    pct_predicted_peak_vo2: num(t.at.pctPredictedPeakVo2),
    ci95_vo2_ml_min: t.ci95Vo2MlMin ? [num(t.ci95Vo2MlMin[0]), num(t.ci95Vo2MlMin[1])] : null,
    ci95_time_s: t.ci95TimeS ? [num(t.ci95TimeS[0]), num(t.ci95TimeS[1])] : null,
    ci_label: t.ci95Vo2MlMin ? (t.ciLabel ?? null) : null,
    spread_vo2_ml_min: num(t.spreadVo2MlMin),
    methods_disagree: t.methodsDisagree,
    methods,
  };
}

export function summaryJson(a: TestAnalysis): { [key: string]: Json } {
  return {
    source: a.sourceName,
    software: `${a.provenance.software} ${a.provenance.softwareVersion}`,
    vt1: threshold(a.vt1),
    vt2: threshold(a.vt2),
    peak: {
      vo2_ml_min: num(a.peak.vo2MlMin),
      vo2_ml_kg_min: num(a.peak.vo2MlKgMin),
      vco2_ml_min: num(a.peak.vco2MlMin),
      rer: num(a.peak.rer),
      hr_bpm: num(a.peak.hrBpm),
      o2_pulse_ml_beat: num(a.peak.o2PulseMlBeat),
      work_w: num(a.peak.workW),
      ve_l_min: num(a.peak.veLMin),
      mets: num(a.peak.mets),
      exercise_duration_s: num(a.peak.exerciseDurationS),
    },
    derived: {
      ve_vco2_slope: num(a.derived.veVco2Slope),
      oues: num(a.derived.oues),
      dvo2_dwr_ml_min_w: num(a.derived.dVo2dWrMlMinW),
      breathing_reserve_l_min: num(a.derived.breathingReserveLMin),
      breathing_reserve_pct: num(a.derived.breathingReservePct),
      hr_reserve_bpm: num(a.derived.hrReserveBpm),
      weber_class: a.derived.weberClass,
    },
    predicted: {
      hr_max_bpm: num(a.predicted.hrMaxBpm),
      friend_vo2_ml_kg_min: num(a.predicted.friendVo2MlKgMin),
      hansen_vo2_ml_min: num(a.predicted.hansenVo2MlMin),
      pct_predicted_friend: num(a.predicted.pctPredictedFriend),
      pct_predicted_hansen: num(a.predicted.pctPredictedHansen),
    },
    phases: {
      incremental_start_s: num(a.phases.incrementalStartS),
      incremental_end_s: num(a.phases.incrementalEndS),
      ramp_w_per_min: num(a.phases.rampWPerMin),
      source: a.phases.source,
      list: a.phases.phases.map((p) => ({ name: p.name, start_s: p.startS, end_s: p.endS })),
    },
    removed_breaths: a.removedBreaths.map((r) => ({ line: r.sourceLine, time_s: r.timeS, variable: r.variable, value: r.value, reason: r.reason })),
    effort: {
      verdict: a.effort.verdict,
      criteria: a.effort.criteria.map((c) => ({ id: c.id, met: c.met, value: num(c.value), threshold: c.threshold, unit: c.unit, source: c.source })),
      reasons: [...a.effort.reasons],
    },
    warnings: [...a.warnings],
  };
}
