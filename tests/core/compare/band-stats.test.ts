// Checks test-retest statistics against hand working (below) and mathjs (mean, std), and the
// check value SEM 1.0 → MDC95 2.77 (Weir, J Strength Cond Res 2005; Hopkins, Sports Med 2000).
import { describe, expect, it } from 'vitest';
import { mean as mjMean, std as mjStd } from 'mathjs';
import { execFileSync } from 'node:child_process';
import fc from 'fast-check';
import { repeatStats } from '../../../core/compare/band-stats';
import { normalRandom, seededRandom } from '../../../core/math/random';

/*
 * Hand working, pairs (day 1, day 2): (20,22) (30,29) (40,43) (50,50)
 * differences 2, −1, 3, 0 → mean change 1; deviations 1, −2, 2, −1 → SS 10; SD = √(10/3) = 1.82574
 * typical error = 1.82574 / √2 = 1.29099 (= SEM = √MSE)
 * grand mean = 284 / 8 = 35.5 → raw CV = 100 · 1.29099 / 35.5 = 3.63660%
 * MDC95 = 1.96 · √2 · 1.29099 = 2.77186 · 1.29099 = 3.57847
 * ANOVA: subject means 21, 29.5, 41.5, 50 → SSR = 2·(14.5² + 6² + 6² + 14.5²) = 985, MSR = 328.333
 * day means 35, 36 → SSC = 4·(0.5² + 0.5²) = 2 = MSC; SST = 992 → SSE = 5, MSE = 5/3 = 1.66667
 * ICC(3,1) = (328.333 − 1.66667)/(328.333 + 1.66667) = 326.667/330 = 0.989899
 * ICC(2,1) = 326.667/(330 + 2·(2 − 1.66667)/4) = 326.667/330.16667 = 0.989399
 * log CV: ln ratios 0.0953102, −0.0339016, 0.0723207, 0 → SD 0.0605330 → /√2 = 0.0428031
 *   → 100·(e^0.0428031 − 1) = 4.3732%
 */
const pairs = [
  { day1: 20, day2: 22 },
  { day1: 30, day2: 29 },
  { day1: 40, day2: 43 },
  { day1: 50, day2: 50 },
];

describe('repeatStats', () => {
  const s = repeatStats(pairs)!;

  it('mean change, SD of differences and typical error match the hand working and mathjs', () => {
    const diffs = pairs.map((p) => p.day2 - p.day1);
    expect(s.meanChange).toBeCloseTo(1, 12);
    expect(s.meanChange).toBeCloseTo(mjMean(diffs) as number, 12);
    expect(s.sdChange).toBeCloseTo(1.82574, 5);
    expect(s.sdChange).toBeCloseTo(mjStd(diffs) as unknown as number, 12); // mathjs std: n − 1
    expect(s.typicalError).toBeCloseTo(1.29099, 5);
    expect(s.sem).toBeCloseTo(s.typicalError, 12);
    expect(s.grandMean).toBe(35.5);
  });

  it('CV both ways, the log form used for the band', () => {
    expect(s.cvPctRaw).toBeCloseTo(3.6366, 4);
    expect(s.cvPctLog!).toBeCloseTo(4.3732, 3);
    expect(s.cvMethod).toBe('log-transformed');
    expect(s.cvPct).toBe(s.cvPctLog);
  });

  it('ICC(3,1) and ICC(2,1) from the two-way ANOVA (Shrout et al. 1979; Weir 2005)', () => {
    expect(s.icc31!).toBeCloseTo(0.989899, 5);
    expect(s.icc21!).toBeCloseTo(0.989399, 5);
  });

  it('MDC95 = 1.96·√2·SEM = 3.578 (hand working above)', () => {
    expect(s.mdc95).toBeCloseTo(3.57847, 4);
    expect(s.mdc95Pct).toBeCloseTo(2.771859 * 4.3732, 2);
  });

  it('check value: SEM 1.0 → MDC95 2.77 (pairs (10,10), (10,12): SD of diffs √2, TE 1)', () => {
    const t = repeatStats([{ day1: 10, day2: 10 }, { day1: 10, day2: 12 }])!;
    expect(t.sem).toBeCloseTo(1, 12);
    expect(t.mdc95).toBeCloseTo(2.77, 2);
    expect(t.icc31).toBeNull(); // fewer than 3 pairs
  });

  it('falls back to the raw CV when a value is not positive, and needs two pairs', () => {
    const t = repeatStats([{ day1: 0, day2: 1 }, { day1: 2, day2: 2 }, { day1: 4, day2: 5 }])!;
    expect(t.cvPctLog).toBeNull();
    expect(t.cvMethod).toBe('typical error / grand mean');
    expect(repeatStats([{ day1: 1, day2: 2 }])).toBeNull();
    expect(repeatStats([{ day1: 1, day2: Number.NaN }, { day1: 2, day2: 3 }])).toBeNull();
  });
});

// Reference: R's stats::anova on lm(value ~ subject + day) gives the two-way mean squares;
// ICC(3,1) = (MSR − MSE)/(MSR + MSE), ICC(2,1) = (MSR − MSE)/(MSR + MSE + 2(MSC − MSE)/n)
// (Shrout et al. 1979, k = 2), and √MSE = SEM (Weir 2005).
describe('repeatStats against R (stats::anova)', () => {
  it('matches the ICC forms and SEM from R mean squares on a 12-pair seeded table', () => {
    const random = seededRandom(20260301);
    const gauss = normalRandom(random);
    const pairs = Array.from({ length: 12 }, () => {
      const person = 1500 + 300 * gauss();
      return { day1: person + 60 * gauss(), day2: person - 40 + 60 * gauss() };
    });
    const values = [...pairs.map((p) => p.day1), ...pairs.map((p) => p.day2)].map((v) => v.toFixed(6)).join(',');
    const script = `d <- data.frame(v=c(${values}), s=factor(rep(1:12,2)), day=factor(rep(1:2,each=12))); a <- anova(lm(v ~ s + day, data=d)); cat(sprintf('%.10f', a[['Mean Sq']]), sep=',')`;
    const [msr, msc, mse] = execFileSync('Rscript', ['-e', script], { encoding: 'utf8' }).split(',').map(Number);
    const rounded = pairs.map((p) => ({ day1: Number(p.day1.toFixed(6)), day2: Number(p.day2.toFixed(6)) }));
    const s = repeatStats(rounded)!;
    expect(s.icc31!).toBeCloseTo((msr - mse) / (msr + mse), 8);
    expect(s.icc21!).toBeCloseTo((msr - mse) / (msr + mse + (2 * (msc - mse)) / 12), 8);
    expect(s.sem).toBeCloseTo(Math.sqrt(mse), 6);
  });
});

// Properties that follow from the definitions (Hopkins 2000): the typical error does not change
// when a constant is added to every value; the log CV does not change when every value is
// scaled; MDC95 is always 1.96·√2 times the SEM.
describe('repeatStats properties', () => {
  const pairArb = fc.array(fc.record({ day1: fc.double({ min: 100, max: 5000, noNaN: true }), day2: fc.double({ min: 100, max: 5000, noNaN: true }) }), { minLength: 3, maxLength: 30 });
  it('shift invariance of TE, scale invariance of the log CV, MDC95 = 2.77·SEM', () => {
    fc.assert(
      fc.property(pairArb, fc.double({ min: -50, max: 50, noNaN: true }), fc.double({ min: 0.5, max: 3, noNaN: true }), (pairs, shift, scale) => {
        const s = repeatStats(pairs)!;
        const shifted = repeatStats(pairs.map((p) => ({ day1: p.day1 + shift, day2: p.day2 + shift })))!;
        const scaled = repeatStats(pairs.map((p) => ({ day1: p.day1 * scale, day2: p.day2 * scale })))!;
        expect(shifted.typicalError).toBeCloseTo(s.typicalError, 6);
        expect(scaled.cvPctLog!).toBeCloseTo(s.cvPctLog!, 6);
        expect(s.mdc95).toBeCloseTo(1.96 * Math.SQRT2 * s.sem, 9);
        if (s.icc31 !== null) expect(s.icc31).toBeLessThanOrEqual(1 + 1e-12);
      }),
      { numRuns: 200 },
    );
  });
});
