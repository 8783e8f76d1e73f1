// Checks local-SD breath rejection (Lamarra et al., J Appl Physiol 1987) on values worked by hand.
import { describe, expect, it } from 'vitest';
import { breath } from '../../../core/model/breath-table';
import { removeOutliers } from '../../../core/clean/outliers';

const VO2 = [1000, 1010, 990, 1005, 3000, 995, 1000, 1010, 990];
const table = VO2.map((v, i) => breath({ timeS: i * 3, vo2MlMin: v, vco2MlMin: 800, veLMin: 25, sourceLine: 11 + i }));

describe('removeOutliers', () => {
  it('removes the cough breath and names its line and reason', () => {
    // By hand: the 3000 breath's 8 neighbours sum to 8000 (mean 1000); squared deviations
    // 0+100+100+25+25+0+100+100 = 450, SD = √(450/7) = 8.018 mL/min, so it lies
    // (3000 − 1000) / 8.018 = 249.4 SD away, far beyond 4 SD.
    const { kept, removed } = removeOutliers(table, { kind: 'local-sd', windowBreaths: 9, limitSd: 4 });
    expect(removed).toHaveLength(1);
    expect(removed[0].sourceLine).toBe(15);
    expect(removed[0].timeS).toBe(12);
    expect(removed[0].variable).toBe('vo2MlMin');
    expect(removed[0].value).toBe(3000);
    expect(removed[0].reason).toContain('249.4 SD');
    expect(removed[0].reason).toContain('1000 mL/min');
    // Never drop rows silently: every breath is either kept or listed.
    expect(kept.length + removed.length).toBe(table.length);
    expect(kept.map((b) => b.vo2MlMin)).not.toContain(3000);
  });

  it('keeps a breath that is within the limit', () => {
    // By hand: with a 4 SD limit, 1010 among neighbours of mean ≈ 1000 and SD ≈ 8 is about 1.3 SD away.
    const smooth = table.filter((_, i) => i !== 4);
    expect(removeOutliers(smooth, { kind: 'local-sd', windowBreaths: 9, limitSd: 4 }).removed).toHaveLength(0);
  });

  it('checks VE as well as the gases', () => {
    // A sigh: VE 80 L/min among breaths of 25 L/min (spread 0 elsewhere except the sigh) is removed for VE.
    const sigh = table.map((b, i) => ({ ...b, vo2MlMin: 1000, veLMin: i === 6 ? 80 : 25 + (i % 2) }));
    const { removed } = removeOutliers(sigh, { kind: 'local-sd', windowBreaths: 9, limitSd: 4 });
    expect(removed.map((r) => [r.sourceLine, r.variable])).toEqual([[17, 'veLMin']]);
  });

  it("keeps everything with kind 'none'", () => {
    const { kept, removed } = removeOutliers(table, { kind: 'none' });
    expect(kept).toHaveLength(9);
    expect(removed).toHaveLength(0);
  });
});
