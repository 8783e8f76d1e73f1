/**
 * Family B generator (sample-tests/kinetic-family) against stated physiology. Sources beside
 * each check; "(memory)" marks values recalled, not looked up.
 */
import { describe, expect, it } from 'vitest';
import {
  alveolarPo2Mmhg,
  deadSpaceFraction,
  DEFAULT_KINETIC_NOISE,
  generateKineticTest,
  kineticCase,
  kineticCases,
  simulateCourse,
  restVo2MlMin,
  unloadedVo2MlMin,
  ventilationLMin,
  FAMILY_B_DEVELOPMENT_FIRST_SEED,
  type Course,
  type CoursePoint,
} from '../../../sample-tests/kinetic-family';

const DEV = FAMILY_B_DEVELOPMENT_FIRST_SEED;
const main = kineticCases('main', 24, DEV);
const cycles = main.filter((c) => c.modality === 'cycle');
const treadmills = main.filter((c) => c.modality === 'treadmill');

function fitLine(xs: number[], ys: number[]): { slope: number; intercept: number } {
  const n = xs.length;
  const mx = xs.reduce((a, b) => a + b, 0) / n;
  const my = ys.reduce((a, b) => a + b, 0) / n;
  let sxy = 0;
  let sxx = 0;
  for (let i = 0; i < n; i++) {
    sxy += (xs[i] - mx) * (ys[i] - my);
    sxx += (xs[i] - mx) ** 2;
  }
  const slope = sxy / sxx;
  return { slope, intercept: my - slope * mx };
}

function during(course: Course, from: number, to: number): CoursePoint[] {
  return course.points.filter((p) => p.timeS >= from && p.timeS <= to && p.timeS <= course.exerciseEndS);
}

/**
 * Intersection (x) of lines fitted to y(VO2) on two windows of the CO2-side metabolic rate,
 * 2.5–5 widths either side of the centre, using only ramp points where the on-ramp kinetic
 * transient has settled (t ≥ start + delay + 2.5·τVCO2). `n` = points in the lower window.
 */
function breakOf(course: Course, y: (p: CoursePoint) => number, centre: number, width: number, settledS: number): { x: number; below: number; above: number; n: number } {
  const pts = course.points.filter((p) => p.timeS >= course.incrementalStartS && p.timeS <= course.exerciseEndS);
  const lo = pts.filter((p) => p.timeS >= settledS && p.co2SideMlMin >= centre - 5 * width && p.co2SideMlMin <= centre - 2.5 * width);
  const hi = pts.filter((p) => p.co2SideMlMin >= centre + 2.5 * width && p.co2SideMlMin <= centre + 5 * width);
  const a = fitLine(lo.map((p) => p.vo2MlMin), lo.map(y));
  const b = fitLine(hi.map((p) => p.vo2MlMin), hi.map(y));
  return { x: (b.intercept - a.intercept) / (a.slope - b.slope), below: a.slope, above: b.slope, n: lo.length };
}

describe('family B grid', () => {
  it('main: incremental phase 8–12 min (ATS/ACCP 2003, memory), cycle ramps 10–30 W/min, thresholds in textbook ranges', () => {
    expect(cycles.length).toBeGreaterThan(8);
    expect(treadmills.length).toBeGreaterThan(3);
    for (const c of main) {
      const { truth } = generateKineticTest(c.params, c.seed);
      const incMin = (truth.phases.exerciseEndS - truth.phases.incrementalStartS) / 60;
      expect(incMin).toBeGreaterThanOrEqual(8);
      expect(incMin).toBeLessThanOrEqual(12);
      if (c.params.protocol.kind === 'cycle') {
        expect(c.params.protocol.rampWPerMin).toBeGreaterThanOrEqual(10);
        expect(c.params.protocol.rampWPerMin).toBeLessThanOrEqual(30);
      }
      // VT1 45–65 %, VT2 75–90 % of peak VO2 as metabolic rates (textbook ranges, memory).
      expect(c.params.vt1Vo2MlMin / c.params.vo2PeakMlMin).toBeGreaterThanOrEqual(0.449);
      expect(c.params.vt1Vo2MlMin / c.params.vo2PeakMlMin).toBeLessThanOrEqual(0.651);
      expect(c.params.vt2Vo2MlMin / c.params.vo2PeakMlMin).toBeGreaterThanOrEqual(0.749);
      expect(c.params.vt2Vo2MlMin / c.params.vo2PeakMlMin).toBeLessThanOrEqual(0.901);
      const mlKg = c.params.vo2PeakMlMin / c.params.weightKg;
      expect(mlKg).toBeGreaterThanOrEqual(18);
      expect(mlKg).toBeLessThanOrEqual(55);
    }
  });

  it('short-or-noisy: each test has a 5–8 min incremental phase or noise ×1.5–2', () => {
    const cs = kineticCases('short-or-noisy', 24, DEV);
    let short = 0;
    let noisy = 0;
    for (const c of cs) {
      const { truth } = generateKineticTest(c.params, c.seed);
      const incMin = (truth.phases.exerciseEndS - truth.phases.incrementalStartS) / 60;
      const isShort = incMin >= 5 && incMin < 8 + 1e-9;
      const isNoisy = c.noiseScale >= 1.5 && c.noiseScale <= 2 && incMin >= 8 && incMin <= 12;
      expect(isShort || isNoisy).toBe(true);
      if (isShort) short++;
      if (isNoisy) noisy++;
    }
    expect(short).toBeGreaterThan(4);
    expect(noisy).toBeGreaterThan(4);
  });

  it('the same seed gives the same test; another seed another subject', () => {
    const a = kineticCase('main', DEV + 3);
    const b = kineticCase('main', DEV + 3);
    expect(b).toEqual(a);
    expect(generateKineticTest(b.params, b.seed)).toEqual(generateKineticTest(a.params, a.seed));
    expect(kineticCase('main', DEV + 4).params.vo2PeakMlMin).not.toBe(a.params.vo2PeakMlMin);
  });
});

describe('family B physiology (noise-free course)', () => {
  it('ΔVO2/ΔWR on the cycle ramp is 8.5–11 mL/min/W (about 10; ATS/ACCP 2003, memory)', () => {
    for (const c of cycles) {
      const course = simulateCourse(c.params);
      const pts = during(course, course.incrementalStartS + 150, course.exerciseEndS);
      const fit = fitLine(pts.map((p) => p.workW ?? 0), pts.map((p) => p.vo2MlMin));
      expect(fit.slope).toBeGreaterThanOrEqual(8.5);
      expect(fit.slope).toBeLessThanOrEqual(11);
    }
  });

  it('a maximal test: peak RER ≥ 1.10 (Balady et al., Circulation 2010; ATS/ACCP 2003), HR peak near 208 − 0.7·age (Tanaka et al., JACC 2001)', () => {
    for (const c of main) {
      const { truth } = generateKineticTest(c.params, c.seed);
      expect(truth.peak.rer).toBeGreaterThanOrEqual(1.1);
      expect(Math.abs(truth.peak.hrBpm - (208 - 0.7 * c.params.ageY))).toBeLessThanOrEqual(10);
    }
  });

  it('alveolar equations: worked values of check-values.md', () => {
    // PACO2 = 863 × VCO2 / VA: VCO2 1.0 L/min, PACO2 28.8 mmHg → VA = 863 × 1.0 / 28.8 = 29.97 L/min.
    expect(ventilationLMin(1000, 28.8, 0)).toBeCloseTo(29.97, 1);
    // With VD/VT 0.25, VE = VA / 0.75 = 39.96 L/min.
    expect(ventilationLMin(1000, 28.8, 0.25)).toBeCloseTo(39.96, 1);
    // PB 760, PACO2 40, R 0.8: PIO2 = 713 × 0.2093 = 149.2; PAO2 = 149.2 − 40 × (0.2093 + 0.7907/0.8) = 101.3.
    expect(alveolarPo2Mmhg(760, 40, 0.8)).toBeCloseTo(101.3, 1);
  });

  it('every course point obeys PetCO2 = 863·VCO2/VA and PetO2 from the alveolar gas equation', () => {
    const c = cycles[0];
    const course = simulateCourse(c.params);
    for (const p of course.points.filter((_, i) => i % 97 === 0)) {
      const va = p.veLMin * (1 - deadSpaceFraction(p.co2SideMlMin, c.params));
      expect(p.petco2Mmhg).toBeCloseTo((863 * (p.vco2MlMin / 1000)) / va, 6);
      expect(p.peto2Mmhg).toBeCloseTo(alveolarPo2Mmhg(c.params.barometricMmhg, p.petco2Mmhg, p.vco2MlMin / p.vo2MlMin), 6);
    }
  });

  it('VCO2 lags VO2: after the rest-to-pedalling step VCO2 reaches 63 % of its change 10–20 s later (τVCO2 − τVO2; Whipp et al. 1982, memory)', () => {
    for (const c of cycles) {
      const course = simulateCourse(c.params);
      const rest = restVo2MlMin(c.params);
      const unl = unloadedVo2MlMin(c.params.weightKg);
      const after = course.points.filter((p) => p.timeS >= course.restEndS && p.timeS < course.incrementalStartS);
      const v0 = course.points[0].vco2MlMin;
      const vEnd = after[after.length - 1].vco2MlMin;
      const t63o2 = after.find((p) => p.vo2MlMin >= rest + 0.632 * (unl - rest))!.timeS - course.restEndS;
      // VCO2 has not fully settled at the end of the warm-up when τ is long; use its model target.
      const co2Target = v0 + (vEnd - v0) / (1 - Math.exp(-(course.incrementalStartS - course.restEndS - c.params.delayS) / c.params.tauVco2S));
      const t63co2 = after.find((p) => p.vco2MlMin >= v0 + 0.632 * (co2Target - v0))!.timeS - course.restEndS;
      // VO2 phase 2: delay + τ, with τ 20–65 s (30–45 s in healthy adults, longer when unfit; Rossiter, Compr Physiol 2011, memory).
      expect(t63o2 - c.params.delayS).toBeGreaterThanOrEqual(20);
      expect(t63o2 - c.params.delayS).toBeLessThanOrEqual(65);
      expect(t63co2 - t63o2).toBeGreaterThanOrEqual(9);
      expect(t63co2 - t63o2).toBeLessThanOrEqual(21);
    }
  });

  it('V-slope: VCO2 on VO2 has slope about 1 below VT1, steeper by > 0.1 above, and the asymptotes cross at the true VT1 (Beaver et al., J Appl Physiol 1986, memory)', () => {
    // When VT1 lies within a few widths of the ramp start, no settled lower window exists (the
    // kinetic transient hides the lower V-slope segment); those tests are counted, not checked.
    let checked = 0;
    for (const c of main) {
      const course = simulateCourse(c.params);
      const { truth } = generateKineticTest(c.params, c.seed);
      const settled = course.incrementalStartS + c.params.delayS + 2.5 * c.params.tauVco2S;
      const b = breakOf(course, (p) => p.vco2MlMin, c.params.vt1Vo2MlMin, c.params.vt1WidthMlMin, settled);
      if (b.n < 10) continue;
      checked++;
      // The lower window still holds a little of the smooth buffering term, hence "about 1".
      expect(b.below).toBeGreaterThan(0.9);
      expect(b.below).toBeLessThan(1.1);
      expect(b.above).toBeGreaterThan(1);
      expect(b.above - b.below).toBeGreaterThan(0.1);
      expect(Math.abs(b.x - truth.vt1.vo2MlMin) / truth.vt1.vo2MlMin).toBeLessThan(0.02);
    }
    expect(checked).toBeGreaterThanOrEqual((2 / 3) * main.length);
  });

  it('VT2: PetCO2 starts to fall at the true VT2 (asymptotes of PetCO2 on VO2 cross there; Whipp et al. 1989, memory)', () => {
    for (const c of main) {
      const course = simulateCourse(c.params);
      const { truth } = generateKineticTest(c.params, c.seed);
      const w = c.params.vt2WidthMlMin;
      const b = breakOf(course, (p) => p.petco2Mmhg, c.params.vt2Vo2MlMin, Math.min(w, (c.params.vo2PeakMlMin - c.params.vt2Vo2MlMin) / 5.5), 0);
      expect(b.above).toBeLessThan(b.below);
      expect(Math.abs(b.x - truth.vt2.vo2MlMin) / truth.vt2.vo2MlMin).toBeLessThan(0.03);
    }
  });

  it('VE/VCO2 has a broad nadir between VT1 and VT2, in the normal range 22–32 (ATS/ACCP 2003, memory)', () => {
    for (const c of main) {
      const course = simulateCourse(c.params);
      const { truth } = generateKineticTest(c.params, c.seed);
      const pts = during(course, course.incrementalStartS, course.exerciseEndS);
      const ratio = pts.map((p) => p.veLMin / (p.vco2MlMin / 1000));
      const min = Math.min(...ratio);
      const at = pts[ratio.indexOf(min)];
      expect(at.vo2MlMin).toBeGreaterThan(truth.vt1.vo2MlMin);
      expect(at.vo2MlMin).toBeLessThanOrEqual(truth.vt2.vo2MlMin * 1.02);
      expect(min).toBeGreaterThan(22);
      expect(min).toBeLessThan(32);
      // Broad: within 0.5 of the nadir over at least a quarter of the incremental VO2 range.
      const near = pts.filter((_, i) => ratio[i] <= min + 0.5).map((p) => p.vo2MlMin);
      expect(Math.max(...near) - Math.min(...near)).toBeGreaterThan(0.25 * (truth.peak.vo2MlMin - pts[0].vo2MlMin));
    }
  });
});

describe('family B recorded breaths', () => {
  const c = cycles[1];
  const quiet = { ...c.params, outlierCount: 0, noise: { ...DEFAULT_KINETIC_NOISE, scale: 1 } };

  it('VO2 noise per breath at moderate work is 50–150 mL/min (Lamarra et al., J Appl Physiol 1987, memory); VO2, VCO2 and VE share breath-size noise', () => {
    const { table, truth } = generateKineticTest(quiet, 77);
    const course = simulateCourse(quiet);
    const res = table.breaths
      .filter((b) => b.timeS > truth.phases.incrementalStartS + 120 && b.timeS < truth.vt1.timeS)
      .map((b) => {
        const p = course.points[Math.round(b.timeS / 0.5)];
        return { o2: b.vo2MlMin - p.vo2MlMin, co2: b.vco2MlMin / p.vco2MlMin - 1, ve: b.veLMin / p.veLMin - 1 };
      });
    expect(res.length).toBeGreaterThan(30);
    const sd = Math.sqrt(res.reduce((a, r) => a + r.o2 ** 2, 0) / res.length);
    expect(sd).toBeGreaterThan(50);
    expect(sd).toBeLessThan(150);
    const corr = (x: number[], y: number[]) => {
      const mx = x.reduce((a, b) => a + b, 0) / x.length;
      const my = y.reduce((a, b) => a + b, 0) / y.length;
      const sxy = x.reduce((a, v, i) => a + (v - mx) * (y[i] - my), 0);
      return sxy / Math.sqrt(x.reduce((a, v) => a + (v - mx) ** 2, 0) * y.reduce((a, v) => a + (v - my) ** 2, 0));
    };
    expect(corr(res.map((r) => r.co2), res.map((r) => r.ve))).toBeGreaterThan(0.5);
  });

  it('breath timing: 10–20 breaths/min at rest, 30–55 at peak; times strictly increase', () => {
    const { table, truth } = generateKineticTest(quiet, 77);
    const t = table.breaths.map((b) => b.timeS);
    for (let i = 1; i < t.length; i++) expect(t[i]).toBeGreaterThan(t[i - 1]);
    const restN = t.filter((x) => x < truth.phases.restEndS).length / (truth.phases.restEndS / 60);
    const endN = t.filter((x) => x > truth.phases.exerciseEndS - 60 && x <= truth.phases.exerciseEndS).length;
    expect(restN).toBeGreaterThanOrEqual(10);
    expect(restN).toBeLessThanOrEqual(20);
    expect(endN).toBeGreaterThanOrEqual(30);
    expect(endN).toBeLessThanOrEqual(55);
  });

  it('outlier breaths are listed in the truth and stand out from the noise-free course', () => {
    const params = { ...quiet, outlierCount: 6 };
    const { table, truth } = generateKineticTest(params, 91);
    const course = simulateCourse(params);
    expect(truth.outliers).toHaveLength(6);
    for (const o of truth.outliers) {
      const b = table.breaths[o.index];
      expect(b.timeS).toBe(o.timeS);
      const ratio = b.veLMin / course.points[Math.round(b.timeS / 0.5)].veLMin;
      if (o.kind === 'swallow') expect(ratio).toBeLessThan(0.65);
      else expect(ratio).toBeGreaterThan(1.35);
    }
  });

  it('truth carries the model version, the seed, phases in order and the load at each threshold', () => {
    const { table, truth } = generateKineticTest(c.params, c.seed);
    expect(truth.modelVersion).toMatch(/^family-b-kinetic\//);
    expect(truth.seed).toBe(c.seed);
    const ph = truth.phases;
    expect(ph.restEndS).toBeLessThan(ph.incrementalStartS);
    expect(ph.incrementalStartS).toBeLessThan(truth.vt1.timeS);
    expect(truth.vt1.timeS).toBeLessThan(truth.vt2.timeS);
    expect(truth.vt2.timeS).toBeLessThan(ph.exerciseEndS);
    expect(ph.exerciseEndS).toBeLessThan(ph.recoveryEndS);
    expect(truth.vt1.workW).toBeCloseTo(((truth.vt1.timeS - ph.incrementalStartS) / 60) * (c.params.protocol.kind === 'cycle' ? c.params.protocol.rampWPerMin : NaN), 6);
    expect(table.metadata.modality).toBe('cycle');
    const t = treadmills[0];
    const tt = generateKineticTest(t.params, t.seed).truth;
    expect(tt.vt1.workW).toBeNull();
    expect(tt.vt1.speedKmh).toBeGreaterThan(3);
    expect(tt.vt1.gradePct).toBeGreaterThan(0);
  });
});
