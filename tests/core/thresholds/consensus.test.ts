// Consensus = median of the found methods (Gaskill et al., Med Sci Sports Exerc 2001 combine
// methods); the worked example from core/thresholds/consensus.ts, recomputed by hand here.
import { describe, expect, it } from 'vitest';
import type { MethodOutcome } from '../../../core/model/analysis';
import { CONSENSUS_RULES, consensusOf } from '../../../core/thresholds/consensus';
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

  it('with a rule, the leading methods decide unless they stray past the guard', () => {
    const rule = { lead: ['a', 'b'], guardPct: 10 };
    // Lead median (1,500 + 1,560) / 2 = 1,530; median of all four (1,500, 1,560, 1,650, 1,700) = 1,605; 75 ≤ 160.5 → lead.
    expect(consensusOf([found('a', 1500), found('b', 1560), found('c', 1650), found('d', 1700)], curve, 10, 'VT1', rule).consensus?.vo2MlMin).toBe(1530);
    // Lead 1,200 against a median of all of 1,600 (1,200, 1,600, 1,650): 400 > 160 → median of all.
    expect(consensusOf([found('a', 1200), found('c', 1600), found('d', 1650)], curve, 10, 'VT1', rule).consensus?.vo2MlMin).toBe(1600);
    // No leading method found → median of the rest.
    expect(consensusOf([found('c', 1600), found('d', 1700)], curve, 10, 'VT1', rule).consensus?.vo2MlMin).toBe(1650);
  });

  it('lets the V-slope pair lead VT1 and VE against VCO2 lead VT2', () => {
    expect(CONSENSUS_RULES.vt1.lead).toEqual(['vslope-ve', 'vslope-hinge']);
    expect(CONSENSUS_RULES.vt2.lead).toEqual(['ve-vs-vco2']);
  });
});
