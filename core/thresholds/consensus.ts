/**
 * The consensus of the methods that found a threshold: the median of their VO2 estimates
 * (robust to one stray method; combining methods improves reliability, Gaskill et al., Med
 * Sci Sports Exerc 2001;33:1841–8), its time read off the monotone VO2 curve of the
 * incremental phase (read-off.ts), and the spread (max − min VO2, mL/min). The methods
 * disagree when the spread exceeds `disagreementPct` % of the consensus VO2 (a setting,
 * common practice).
 *
 * Example: estimates 1,500, 1,550 and 1,700 mL/min → consensus 1,550, spread 200; with a
 * 10 % limit (155 mL/min) the methods disagree.
 *
 * With a rule (CONSENSUS_RULES, what findThresholds uses): the median of the leading methods
 * found, unless it lies more than the guard from the median of all (then that median). The
 * leading methods were chosen for their small bias on two generator families; the other
 * methods stay as checks (spread, disagreement flag, guard). Without a rule: the median of all
 * (the preliminary VT2, which only bounds the VT1 window).
 */
import type { MethodOutcome, ThresholdId } from '../model/analysis';
import { median } from '../math/stats';
import { timeAtValue, type MonotoneCurve } from './read-off';

/**
 * Which methods lead a threshold's consensus, decided from the validation on two independently
 * built generator families (docs/validation.md, "Consensus"): the methods whose own bias was
 * smallest on both. The lead is the median of the leading methods found; every other method is
 * a check. When the lead lies more than `guardPct` % from the median of all found methods, the
 * lead is not trusted and that median of all is the consensus (one wayward fit cannot carry the
 * threshold alone, the failure that withdrew a single leading method before).
 */
export interface ConsensusRule {
  readonly lead: readonly string[];
  readonly guardPct: number;
}

export const CONSENSUS_RULES: Readonly<Record<ThresholdId, ConsensusRule>> = {
  // PetO2 (early by 5–8 % on both families), excess CO2 (late by about 4 %), VE/VO2 and the
  // two-regression V-slope (early, wider) are checks.
  vt1: { lead: ['vslope-ve', 'vslope-hinge'], guardPct: 10 },
  // VE/VCO2 and PetCO2 come early on both families (their curved course before the bend pulls a
  // two-line knot early); VE against smoothed VCO2 is nearly unbiased.
  vt2: { lead: ['ve-vs-vco2'], guardPct: 10 },
};

export interface Consensus {
  readonly consensus: { readonly timeS: number; readonly vo2MlMin: number } | null;
  readonly spreadVo2MlMin: number | null;
  readonly methodsDisagree: boolean;
  readonly reason: string | null;
}

export function consensusOf(
  outcomes: readonly MethodOutcome[],
  vo2: MonotoneCurve,
  disagreementPct: number,
  thresholdName: string,
  rule?: ConsensusRule,
): Consensus {
  const found = outcomes.flatMap((o) => (o.found ? [o.vo2MlMin] : []));
  if (found.length === 0) {
    const why = outcomes.map((o) => (o.found ? '' : `${o.label}: ${o.reason}`)).filter(Boolean);
    return {
      consensus: null,
      spreadVo2MlMin: null,
      methodsDisagree: false,
      reason: `No method found ${thresholdName}. ${why.join(' ')}`.trim(),
    };
  }
  const all = median(found);
  const leading = rule ? outcomes.flatMap((o) => (o.found && rule.lead.includes(o.method) ? [o.vo2MlMin] : [])) : [];
  const lead = leading.length ? median(leading) : null;
  const vo2MlMin = lead !== null && rule && Math.abs(lead - all) <= (rule.guardPct / 100) * all ? lead : all;
  const spread = Math.max(...found) - Math.min(...found);
  return {
    consensus: { timeS: timeAtValue(vo2, vo2MlMin), vo2MlMin },
    spreadVo2MlMin: spread,
    methodsDisagree: spread > (disagreementPct / 100) * vo2MlMin,
    reason: null,
  };
}
