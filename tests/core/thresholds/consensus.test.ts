// Consensus = median of the found methods (Gaskill et al., Med Sci Sports Exerc 2001 combine
// methods); the worked example from core/thresholds/consensus.ts, recomputed by hand here.
import { describe, expect, it } from 'vitest';
import type { MethodOutcome } from '../../../core/model/analysis';
import { consensusOf } from '../../../core/thresholds/consensus';
import { monotoneCurve } from '../../../core/thresholds/read-off';

function found(method: string, vo2MlMin: number): MethodOutcome {
  return {
    method,
    label: method,
    source: 'test',
    found: true,
    timeS: 0,
    vo2MlMin,
    evidence: { xName: 'x', yName: 'y', window: [0, 1], segments: [], residualSumSquares: 0, points: 0 },
  };
}
const missing: MethodOutcome = { method: 'm', label: 'Missing method', source: 'test', found: false, reason: 'No end-tidal data.' };
// VO2 1,000 → 2,000 mL/min over 0 → 100 s: 1,550 mL/min is reached at 55 s (by hand).
const curve = monotoneCurve([0, 100], [1000, 2000], 0, 100);

describe('consensusOf', () => {
  it('takes the median, reads its time off the VO2 curve, and flags a 200 mL/min spread above 10 %', () => {
    const c = consensusOf([found('a', 1500), found('b', 1550), found('c', 1700), missing], curve, 10, 'VT1');
    expect(c.consensus?.vo2MlMin).toBe(1550);
    expect(c.consensus?.timeS).toBeCloseTo(55, 10);
    expect(c.spreadVo2MlMin).toBe(200);
    expect(c.methodsDisagree).toBe(true); // 200 > 0.10 × 1,550 = 155
  });

  it('does not flag a spread within the limit: 1,500 and 1,600 → 1,550, spread 100 < 155', () => {
    const c = consensusOf([found('a', 1500), found('b', 1600)], curve, 10, 'VT1');
    expect(c.consensus?.vo2MlMin).toBe(1550);
    expect(c.methodsDisagree).toBe(false);
  });

  it('says why when no method found the threshold', () => {
    const c = consensusOf([missing], curve, 10, 'VT2');
    expect(c.consensus).toBeNull();
    expect(c.reason).toBe('No method found VT2. Missing method: No end-tidal data.');
  });
});
