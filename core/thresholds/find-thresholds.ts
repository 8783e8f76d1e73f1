/**
 * Finds VT1 and VT2 in one test's processed series: the entry point core/analyze calls.
 *
 * Order of search (each later window depends on an earlier answer):
 *  1. a preliminary VT2 by the VT2 methods over the whole incremental phase, so that VT1 is
 *     searched below it, as the V-slope method requires (Beaver et al., J Appl
 *     Physiol 1986;60:2020–7: the VCO2–VO2 fit runs up to the respiratory compensation point).
 *     Over the whole phase the VE/VCO2 and PetCO2 methods answer early (below VT1 both still
 *     drift, which bends their two-line fits), while VE against VCO2 stays straight up to VT2;
 *     so the bound is the latest of the methods' answers, plus 30 s (`VT2_BOUND_MARGIN_S`) so
 *     that a bound a little early does not cut VT1 off;
 *  2. VT1 by the VT1 methods over the VT1 window (`vt1Window`): the last minute of the warm-up
 *     (steady state, it anchors the line below VT1 when VT1 comes early in a short ramp), then
 *     the incremental phase from one minute in (the on-transient left out) up to that bound; to
 *     the end of the phase when there is no bound, or when no method finds VT1 below it;
 *  3. VT2 by the VT2 methods from VT1 to the end of the incremental phase (from its start
 *     when VT1 was not found).
 * Each threshold is the consensus of its methods (consensus.ts) with a 95 % interval that joins
 * the bootstrap spread of the consensus and the methods' spread (uncertainty.ts). The preliminary VT2 only bounds a window and
 * gets no interval. Units: s and mL/min. Pure: same input, same output.
 */
import type { Phases, ProcessedSeries, ThresholdId } from '../model/analysis';
import type { Settings } from '../model/settings';
import { median } from '../math/stats';
import { CONSENSUS_RULES, consensusOf } from './consensus';
import type { DetectorEntry, DetectorInput, ThresholdEstimate } from './detector';
import { VT1_METHODS, VT2_METHODS } from './methods';
import { vo2Curve } from './read-off';
import { isShortRamp } from './ramp-length';
import { combinationInterval, INTERVAL_CALIBRATION, methodAwareInterval, methodReplicates } from './uncertainty';

const NAMES: Record<ThresholdId, string> = { vt1: 'VT1', vt2: 'VT2' };

/**
 * The VT1 search skips the first minute of the ramp: VO2 lags the load (time constant about
 * 30–60 s, memory) and the gas exchange ratios swing while the body's CO2 stores adjust, so
 * those points bend the curves without any threshold (common practice; the same minute is left
 * out of ΔVO2/ΔWR in core/analyze).
 */
export const KINETIC_LAG_S = 60;
/** The steady end of the warm-up joins the VT1 search, s (our choice). */
export const WARMUP_ANCHOR_S = 60;
/** The VT1 window ends this long after the latest preliminary VT2, s (our choice, development seeds). */
export const VT2_BOUND_MARGIN_S = 30;

/**
 * The VT1 search window: from the last `WARMUP_ANCHOR_S` of a warm-up phase (when the test has
 * one right before the incremental phase) to `toS`, with the first `KINETIC_LAG_S` of the
 * incremental phase left out. Returned as the window and the series with the left-out span's
 * gas-exchange values blanked (NaN, end-tidal null), so every detector and the bootstrap see
 * the same points.
 */
export function vt1Window(series: ProcessedSeries, phases: Phases, toS: number): { series: ProcessedSeries; fromS: number; toS: number } {
  const inc0 = phases.incrementalStartS;
  const skipTo = Math.min(inc0 + KINETIC_LAG_S, phases.incrementalEndS);
  const warmup = phases.phases.find((p) => p.name === 'warmup' && Math.abs(p.endS - inc0) < 1);
  if (!warmup) return { series, fromS: skipTo, toS };
  const fromS = Math.max(warmup.startS, inc0 - WARMUP_ANCHOR_S);
  const out = (i: number) => series.timeS[i] > inc0 && series.timeS[i] < skipTo;
  const blank = (a: readonly number[]) => a.map((v, i) => (out(i) ? Number.NaN : v));
  const blankNull = (a: readonly (number | null)[]) => a.map((v, i) => (out(i) ? null : v));
  return {
    series: {
      ...series,
      vo2MlMin: blank(series.vo2MlMin),
      vco2MlMin: blank(series.vco2MlMin),
      veLMin: blank(series.veLMin),
      peto2Mmhg: blankNull(series.peto2Mmhg),
      petco2Mmhg: blankNull(series.petco2Mmhg),
    },
    fromS,
    toS,
  };
}

/** The bound of the VT1 search from the preliminary VT2: its latest method, plus the margin. */
export function vt2Bound(preliminary: ThresholdEstimate, incrementalEndS: number): number | null {
  const times = preliminary.methods.flatMap((o) => (o.found ? [o.timeS] : []));
  return times.length ? Math.min(incrementalEndS, Math.max(...times) + VT2_BOUND_MARGIN_S) : null;
}

export function estimateThreshold(
  id: ThresholdId,
  methods: readonly DetectorEntry[],
  input: DetectorInput,
  incremental: readonly [number, number],
  withInterval: boolean,
  shortRamp = false,
): ThresholdEstimate {
  const outcomes = methods.map((m) => m.detect(input));
  const curve = vo2Curve(input.series, incremental[0], incremental[1]);
  const reps = withInterval ? methodReplicates(outcomes, input, id === 'vt1' ? 1 : 2) : null;
  const c = consensusOf(outcomes, curve, input.settings.thresholds.disagreementPct, NAMES[id], withInterval ? CONSENSUS_RULES[id] : undefined);
  const boot = reps && c.consensus ? combinationInterval(reps, median, curve) : null;
  const found = outcomes.flatMap((o) => (o.found ? [o.vo2MlMin] : []));
  const ci = boot && c.consensus ? methodAwareInterval(boot, c.consensus.vo2MlMin, found, curve, INTERVAL_CALIBRATION[id], shortRamp) : null;
  return {
    methods: outcomes,
    consensus: c.consensus,
    ci95Vo2MlMin: ci?.ci95Vo2MlMin ?? null,
    ci95TimeS: ci?.ci95TimeS ?? null,
    ciParts: ci?.parts ?? null,
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
  const short = isShortRamp(inc[0], inc[1]);
  const preliminary = estimateThreshold('vt2', VT2_METHODS, input(inc[0], inc[1]), inc, false);
  const bound = vt2Bound(preliminary, inc[1]);
  // The blanked copy of the series is made once; the two VT1 searches differ only in their end.
  const below1 = vt1Window(series, phases, inc[1]);
  const vt1Input = (toS: number): DetectorInput => ({ ...below1, toS, settings });
  const below = estimateThreshold('vt1', VT1_METHODS, vt1Input(bound ?? inc[1]), inc, true, short);
  const vt1 = below.consensus || bound === null ? below : estimateThreshold('vt1', VT1_METHODS, vt1Input(inc[1]), inc, true, short);
  const vt2 = estimateThreshold('vt2', VT2_METHODS, input(vt1.consensus?.timeS ?? inc[0], inc[1]), inc, true, short);
  return { vt1, vt2 };
}
