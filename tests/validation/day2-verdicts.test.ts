// Day-2 verdicts on generated pairs of known truth (issue 11; tests/validation/day2-pairs.ts
// states the model): 200 null pairs (biological day-to-day variation of the 24-h band plus
// breath noise) and 200 decline pairs of the published mean two-day declines (Keller et al.,
// J Transl Med 2014: VO2 at VT −15.8 %, peak VO2 −13.8 %; verified against the abstract),
// held-out seeds, generator family A (sample-tests/generator). Bootstrap: 50 replicates here
// (the machine is shared); docs/validation.md gives the same figures with the default 200.
//
// Requirements: a false "lower on day 2" on any primary outcome in at most 5 % of null pairs
// (met); "lower on day 2" on VO2 or workload at VT1 in at least 80 % of decline pairs (NOT
// met: measured about 20 %, see docs/validation.md "Day-2 verdicts"; the VT1 interval the
// analysis gives today is ±20–30 % of VO2, wider than the declines); false calls become
// "undetermined", never the opposite call (met in decline pairs).
import { describe, expect, it } from 'vitest';
import { figures, runPairs, settingsWithReplicates } from './day2-pairs';

const settings = settingsWithReplicates(50);
const nulls = figures(runPairs('null', 200, 20001, undefined, settings));
const declines = figures(runPairs('decline', 200, 30001, undefined, settings));

describe('day-2 verdicts, generator family A, 200 + 200 held-out pairs', () => {
  it(`false "lower on day 2" on any primary outcome ≤ 5 % of null pairs (measured ${nulls.anyPrimaryFellPct.toFixed(1)} %)`, () => {
    expect(nulls.n).toBe(200);
    expect(nulls.anyPrimaryFellPct).toBeLessThanOrEqual(5);
  });

  it('decline pairs are never called higher on day 2 on a primary outcome (the opposite call)', () => {
    expect(declines.n).toBe(200);
    expect(declines.anyPrimaryRosePct).toBe(0);
  });

  it('not the requirement (≥ 80 %, unmet): VT1 is called lower in more decline pairs than null pairs, and peak in over a third', () => {
    expect(declines.vt1FellPct).toBeGreaterThan(3 * nulls.vt1FellPct);
    expect(declines.peakFellPct).toBeGreaterThan(33);
  });
});
