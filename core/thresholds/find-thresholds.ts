/**
 * Finds VT1 and VT2 in one test's processed series: the entry point core/analyze calls.
 *
 * Order of search (each later window depends on an earlier answer):
 *  1. a preliminary VT2 by the VT2 methods over the whole incremental phase, so that VT1 is
 *     searched below it, as the V-slope method requires (Beaver, Wasserman & Whipp, J Appl
 *     Physiol 1986;60:2020–7: the VCO2–VO2 fit runs up to the respiratory compensation point);
 *  2. VT1 by the VT1 methods from one minute into the incremental phase to the preliminary VT2
 *     (to the end of the phase when there is none, or when no method finds VT1 below it: a
 *     preliminary VT2 that came too early must not hide VT1);
 *  3. VT2 by the VT2 methods from VT1 to the end of the incremental phase (from its start
 *     when VT1 was not found).
 * Each threshold is the consensus of its methods (consensus.ts) with a 95 % interval that joins
 * the bootstrap spread of the consensus and the methods' spread (uncertainty.ts). The preliminary VT2 only bounds a window and
 * gets no interval. Units: s and mL/min. Pure: same input, same output.
 */
import type { Phases, ProcessedSeries, ThresholdId } from '../model/analysis';
import type { Settings } from '../model/settings';
import { median } from '../math/stats';
import { consensusOf } from './consensus';
import type { DetectorEntry, DetectorInput, ThresholdEstimate } from './detector';
import { VT1_METHODS, VT2_METHODS } from './methods';
import { vo2Curve } from './read-off';
import { combinationInterval, methodAwareInterval, methodReplicates } from './uncertainty';

const NAMES: Record<ThresholdId, string> = { vt1: 'VT1', vt2: 'VT2' };

/**
 * The VT1 search skips the first minute of the ramp: VO2 lags the load (time constant about
 * 30–60 s, memory) and the gas exchange ratios swing while the body's CO2 stores adjust, so
 * those points bend the curves without any threshold (common practice; the same minute is left
 * out of ΔVO2/ΔWR in core/analyze).
 */
export const KINETIC_LAG_S = 60;

export function estimateThreshold(
  id: ThresholdId,
  methods: readonly DetectorEntry[],
  input: DetectorInput,
  incremental: readonly [number, number],
  withInterval: boolean,
): ThresholdEstimate {
  const outcomes = methods.map((m) => m.detect(input));
  const curve = vo2Curve(input.series, incremental[0], incremental[1]);
  const reps = withInterval ? methodReplicates(outcomes, input, id === 'vt1' ? 1 : 2) : null;
  const c = consensusOf(outcomes, curve, input.settings.thresholds.disagreementPct, NAMES[id]);
  const boot = reps && c.consensus ? combinationInterval(reps, median, curve) : null;
  const found = outcomes.flatMap((o) => (o.found ? [o.vo2MlMin] : []));
  const ci = boot && c.consensus ? methodAwareInterval(boot, c.consensus.vo2MlMin, found, curve) : null;
  return {
    methods: outcomes,
    consensus: c.consensus,
    ci95Vo2MlMin: ci?.ci95Vo2MlMin ?? null,
    ci95TimeS: ci?.ci95TimeS ?? null,
    spreadVo2MlMin: c.spreadVo2MlMin,
    methodsDisagree: c.methodsDisagree,
    reason: c.reason,
  };
}

export function findThresholds(
  series: ProcessedSeries,
  phases: Phases,
  settings: Settings,
): { vt1: ThresholdEstimate; vt2: ThresholdEstimate } {
  const inc: [number, number] = [phases.incrementalStartS, phases.incrementalEndS];
  const input = (fromS: number, toS: number): DetectorInput => ({ series, fromS, toS, settings });
  const preliminary = estimateThreshold('vt2', VT2_METHODS, input(inc[0], inc[1]), inc, false);
  const vt1From = Math.min(inc[0] + KINETIC_LAG_S, inc[1]);
  const below = estimateThreshold('vt1', VT1_METHODS, input(vt1From, preliminary.consensus?.timeS ?? inc[1]), inc, true);
  const vt1 = below.consensus || !preliminary.consensus ? below : estimateThreshold('vt1', VT1_METHODS, input(vt1From, inc[1]), inc, true);
  const vt2 = estimateThreshold('vt2', VT2_METHODS, input(vt1.consensus?.timeS ?? inc[0], inc[1]), inc, true);
  return { vt1, vt2 };
}
