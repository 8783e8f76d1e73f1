// Reference: R package `segmented` (Muggeo, Stat Med 2003;22:3055–71; Debian r-cran-segmented).
// Twofold's continuous two-segment fit (core/thresholds/segments.ts, `hingeFit`) and R's
// segmented(lm(vco2 ~ vo2), seg.Z = ~vo2) fit the same model, so their breakpoints must agree
// within 1 % of VO2 on the same data (requirement of the thresholds work) and their slopes closely.
import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { normalRandom, seededRandom } from '../../core/math/random';
import { hingeFit, preparePoints } from '../../core/thresholds/segments';
import { syntheticSeries, timeAtVo2, TRUE_VT2_VO2 } from '../core/thresholds/synthetic-series';

const dir = mkdtempSync(join(tmpdir(), 'twofold-segmented-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

interface RFit {
  readonly psi: number;
  readonly slopes: readonly [number, number];
}

function rSegmented(name: string, vo2: readonly number[], vco2: readonly number[], psiStart: number): RFit {
  const file = join(dir, `${name}.csv`);
  writeFileSync(file, `vo2,vco2\n${vo2.map((v, i) => `${v},${vco2[i]}`).join('\n')}\n`);
  const script = [
    'suppressMessages(library(segmented))',
    `d <- read.csv("${file}")`,
    `m <- segmented(lm(vco2 ~ vo2, data = d), seg.Z = ~vo2, psi = ${psiStart})`,
    's <- slope(m)$vo2[, 1]',
    'cat(sprintf("%.10f %.10f %.10f", m$psi[1, 2], s[1], s[2]))',
  ].join('; ');
  const out = execFileSync('Rscript', ['-e', script], { encoding: 'utf8' }).trim().split(/\s+/).map(Number);
  return { psi: out[0], slopes: [out[1], out[2]] };
}

function twofold(vo2: readonly number[], vco2: readonly number[]) {
  return hingeFit(preparePoints(vo2, vco2), 8)!;
}

/** Noisy broken line: slope 0.9 below, 1.35 above the knot, Gaussian noise in both axes. */
function noisyLine(n: number, knot: number, sdMlMin: number, seed: number) {
  const g = normalRandom(seededRandom(seed));
  const vo2: number[] = [];
  const vco2: number[] = [];
  for (let i = 0; i < n; i++) {
    const x = 600 + (1800 * i) / (n - 1);
    vo2.push(x + sdMlMin * g());
    vco2.push(-30 + 0.9 * x + 0.45 * Math.max(0, x - knot) + sdMlMin * g());
  }
  return { vo2, vco2 };
}

const datasets: { name: string; vo2: readonly number[]; vco2: readonly number[] }[] = [];
for (const [k, seed] of [[1300, 1], [1500, 2], [1750, 3]] as const) datasets.push({ name: `line-${seed}`, ...noisyLine(200, k, 35, seed) });
for (const seed of [4, 5]) {
  const s = syntheticSeries({ noise: 0.03, seed });
  const end = timeAtVo2(TRUE_VT2_VO2);
  const keep = s.timeS.map((t, i) => (t >= 120 && t <= end ? i : -1)).filter((i) => i >= 0);
  datasets.push({ name: `model-${seed}`, vo2: keep.map((i) => s.vo2MlMin[i]), vco2: keep.map((i) => s.vco2MlMin[i]) });
}

describe('hinge V-slope against R segmented', () => {
  it.each(datasets)('$name: breakpoint within 1 % of VO2, slopes within 0.01', (d) => {
    const ours = twofold(d.vo2, d.vco2);
    const sorted = [...d.vo2].sort((a, b) => a - b);
    const r = rSegmented(d.name, d.vo2, d.vco2, sorted[Math.floor(sorted.length / 2)]);
    expect(Math.abs(ours.knot - r.psi) / r.psi).toBeLessThan(0.01);
    // Both reach the same least-squares optimum: measured differences were ≤ 0.0002 mL/min.
    expect(Math.abs(ours.knot - r.psi)).toBeLessThan(0.1);
    expect(ours.slopeBefore).toBeCloseTo(r.slopes[0], 2);
    expect(ours.slopeAfter).toBeCloseTo(r.slopes[1], 2);
  });
});
