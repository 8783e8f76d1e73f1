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
 * The median of all methods that found the threshold, the combined V-slope with VE
 * (vslope-shared.ts) among them. Letting that one method lead (its estimate as the consensus
 * whenever it found VT1) gave a lower median error on generated tests but failed badly
 * where it alone went wrong (a demo pair that reproduces showed a false VT1 decline), so the
 * median stands: robust to one wayward method (our choice; docs/validation.md).
 */
import type { MethodOutcome } from '../model/analysis';
import { median } from '../math/stats';
import { timeAtValue, type MonotoneCurve } from './read-off';

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
  const vo2MlMin = median(found);
  const spread = Math.max(...found) - Math.min(...found);
  return {
    consensus: { timeS: timeAtValue(vo2, vo2MlMin), vo2MlMin },
    spreadVo2MlMin: spread,
    methodsDisagree: spread > (disagreementPct / 100) * vo2MlMin,
    reason: null,
  };
}
