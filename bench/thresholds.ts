/**
 * Threshold figures for docs/performance.md "## Thresholds": the breakpoint searches'
 * growth from 1,000 to 100,000 points, and findThresholds (bootstrap included) on the
 * processed series of a generated test of about 1,500 breaths, after warm-up.
 */
import { analyzeTest, noClinicalInputs } from '../core/analyze/analyze-test';
import { averageBreaths } from '../core/clean/averaging';
import { findPhases } from '../core/clean/phases';
import { removeOutliers } from '../core/clean/outliers';
import { median } from '../core/math/stats';
import { normalRandom, seededRandom } from '../core/math/random';
import { DEFAULT_SETTINGS } from '../core/model/settings';
import { findThresholds } from '../core/thresholds/find-thresholds';
import { hingeFit, preparePoints, twoRegressionSplit } from '../core/thresholds/segments';
import { defaultCycleParams, generateTest } from '../sample-tests/generator';

function timeMs(f: () => unknown, runs: number, warmUp = 5): number {
  for (let i = 0; i < warmUp; i++) f();
  const t: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    f();
    t.push(performance.now() - t0);
  }
  return median(t);
}

function vslopeData(n: number) {
  const g = normalRandom(seededRandom(n));
  const x = Array.from({ length: n }, (_, i) => 500 + (2500 * i) / n + 30 * g());
  const y = x.map((v) => 0.95 * v - 40 + 0.45 * Math.max(0, v - 1600) + 30 * g());
  return { x, y };
}

export async function run(): Promise<string[]> {
  const lines: string[] = [];
  lines.push('| points | prepare + sort ms | two-regression ms | hinge ms | hinge µs per point |', '| --- | --- | --- | --- | --- |');
  // Warm the searches up on a mid-sized input first, so the smallest size is not timed cold.
  const warm = vslopeData(20_000);
  const pw = preparePoints(warm.x, warm.y);
  for (let i = 0; i < 50; i++) {
    hingeFit(pw, 8);
    twoRegressionSplit(pw, 8);
  }
  for (const n of [1_000, 10_000, 100_000]) {
    const { x, y } = vslopeData(n);
    const runs = n >= 100_000 ? 9 : n >= 10_000 ? 51 : 201;
    const prep = timeMs(() => preparePoints(x, y), runs);
    const p = preparePoints(x, y);
    const two = timeMs(() => twoRegressionSplit(p, 8), runs);
    const hinge = timeMs(() => hingeFit(p, 8), runs);
    lines.push(`| ${n.toLocaleString('en')} | ${prep.toFixed(2)} | ${two.toFixed(2)} | ${hinge.toFixed(2)} | ${((1000 * hinge) / n).toFixed(3)} |`);
  }

  // About 1,500 breaths: a slow ramp to a high peak.
  const params = { ...defaultCycleParams(), protocol: { ...defaultCycleParams().protocol, rampWPerMin: 10 } as ReturnType<typeof defaultCycleParams>['protocol'], vo2PeakMlMin: 4200, vt1Vo2MlMin: 2200, vt2Vo2MlMin: 3400 };
  const { table } = generateTest(params, 11);
  const { kept } = removeOutliers(table.breaths, DEFAULT_SETTINGS.clean.outliers);
  const series = averageBreaths(kept, DEFAULT_SETTINGS.clean.averaging);
  const phases = findPhases(kept, DEFAULT_SETTINGS.clean.phases);
  const inc = series.timeS.filter((t) => t >= phases.incrementalStartS && t <= phases.incrementalEndS).length;
  const find = timeMs(() => findThresholds(series, phases, DEFAULT_SETTINGS), 21, 20);
  const noBoot = { ...DEFAULT_SETTINGS, thresholds: { ...DEFAULT_SETTINGS.thresholds, bootstrap: { ...DEFAULT_SETTINGS.thresholds.bootstrap, replicates: 0 } } };
  const findNoBoot = timeMs(() => findThresholds(series, phases, noBoot), 21, 20);
  const whole = timeMs(() => analyzeTest(table, DEFAULT_SETTINGS, noClinicalInputs()), 21, 20);
  lines.push(
    '',
    `Generated test: ${table.breaths.length} breaths, ${series.timeS.length} processed points, ${inc} in the incremental phase (15-s rolling mean, defaults).`,
    '',
    '| step | median ms after warm-up |',
    '| --- | --- |',
    `| findThresholds, ${DEFAULT_SETTINGS.thresholds.bootstrap.replicates} bootstrap replicates | ${find.toFixed(1)} |`,
    `| findThresholds, no bootstrap | ${findNoBoot.toFixed(1)} |`,
    `| analyzeTest, whole analysis | ${whole.toFixed(1)} |`,
  );
  return lines;
}
