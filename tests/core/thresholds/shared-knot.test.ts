// Shared-knot fit and the VO2 smoother on exact inputs worked by hand.
import { describe, expect, it } from 'vitest';
import { sharedKnotFit } from '../../../core/thresholds/shared-knot';
import { locallySmoothedVo2 } from '../../../core/thresholds/smooth-vo2';
import type { ProcessedSeries } from '../../../core/model/analysis';

describe('sharedKnotFit', () => {
  it('recovers a knot at 1,500 shared by two broken lines with small alternating noise (by hand: both lines bend at x = 1,500)', () => {
    const x = Array.from({ length: 101 }, (_, i) => 1000 + 10 * i);
    const wobble = (i: number) => (i % 2 ? 1 : -1);
    const vco2 = x.map((v, i) => 0.9 * v + 0.4 * Math.max(0, v - 1500) + 2 * wobble(i));
    const ve = x.map((v, i) => 0.025 * v + 0.012 * Math.max(0, v - 1500) + 0.05 * wobble(i));
    const fit = sharedKnotFit(x, [vco2, ve], 8)!;
    expect(Math.abs(fit.knot - 1500)).toBeLessThanOrEqual(10); // one x step
    expect(fit.lines[0].slopeBefore).toBeCloseTo(0.9, 1);
    expect(fit.lines[0].slopeAfter).toBeCloseTo(1.3, 1);
  });
});

describe('locallySmoothedVo2', () => {
  it('returns a straight line unchanged (a local linear fit is exact on a line: VO2 = 800 + 5 t)', () => {
    const timeS = Array.from({ length: 50 }, (_, i) => 3 * i);
    const vo2MlMin = timeS.map((t) => 800 + 5 * t);
    const series = { timeS, vo2MlMin, vco2MlMin: vo2MlMin, veLMin: vo2MlMin, hrBpm: [], workW: [], peto2Mmhg: [], petco2Mmhg: [] } as ProcessedSeries;
    const s = locallySmoothedVo2(series, 60);
    for (let i = 0; i < timeS.length; i++) expect(s[i]).toBeCloseTo(vo2MlMin[i], 6);
  });
});
