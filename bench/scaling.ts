/**
 * How the cost of one analysis grows with the number of breaths, 500 → 32,000 (issue 14:
 * linear, the cost per breath within ±20 % of its mean over the sizes).
 *
 * The tests: one generated cycle ramp of about 500 breaths (sample-tests/generator, 10 W/min),
 * and that same protocol breathed k times as densely: the breaths of k independently seeded
 * runs of the generator merged in time order (k = 1 … 66), so the physiology and the length
 * of the test stay fixed and only the number of breaths grows. Time per breath of
 * `analyzeTest`, median of several runs after a warm-up, CPU time of this process.
 */
import { availableParallelism, loadavg } from 'node:os';
import { analyzeTest, noClinicalInputs } from '../core/analyze/analyze-test';
import { median } from '../core/math/stats';
import type { Breath, BreathTable } from '../core/model/breath-table';
import { DEFAULT_SETTINGS, type Settings } from '../core/model/settings';
import { defaultCycleParams, generateTest, type TestParams } from '../sample-tests/generator';

export const DENSITIES = [1, 2, 4, 8, 16, 32, 66] as const;

function params(): TestParams {
  const base = defaultCycleParams();
  if (base.protocol.kind !== 'cycle-ramp') throw new Error('the default protocol is expected to be a cycle ramp');
  return { ...base, name: 'bench-scaling', protocol: { ...base.protocol, rampWPerMin: 10 } };
}

/** The breaths of `k` seeded runs of the same test, in time order (a stable sort keeps ties by seed). */
export function denseTable(k: number): BreathTable {
  const p = params();
  const runs = Array.from({ length: k }, (_, i) => generateTest(p, 101 + i).table);
  const breaths: Breath[] = runs.flatMap((t) => t.breaths).sort((a, b) => a.timeS - b.timeS);
  return { ...runs[0], breaths };
}

function cpuMsPerRun(table: BreathTable, settings: Settings, runs: number): number {
  const clinical = noClinicalInputs();
  analyzeTest(table, settings, clinical);
  const cpu: number[] = [];
  for (let i = 0; i < runs; i++) {
    const c0 = process.cpuUsage();
    analyzeTest(table, settings, clinical);
    const c = process.cpuUsage(c0);
    cpu.push((c.user + c.system) / 1000);
  }
  return median(cpu);
}

export interface ScalingRow {
  readonly breaths: number;
  readonly withoutUsPerBreath: number;
  readonly withUsPerBreath: number;
}

export function measureScaling(densities: readonly number[] = DENSITIES): ScalingRow[] {
  const off: Settings = { ...DEFAULT_SETTINGS, thresholds: { ...DEFAULT_SETTINGS.thresholds, bootstrap: { ...DEFAULT_SETTINGS.thresholds.bootstrap, replicates: 0 } } };
  // Warm the code up on a mid-sized table first, so the smallest size is not timed cold.
  const warm = denseTable(4);
  for (let i = 0; i < 5; i++) analyzeTest(warm, DEFAULT_SETTINGS, noClinicalInputs());
  return densities.map((k) => {
    const table = denseTable(k);
    const n = table.breaths.length;
    const runs = k <= 8 ? 15 : k <= 32 ? 7 : 5;
    return { breaths: n, withoutUsPerBreath: (1000 * cpuMsPerRun(table, off, runs)) / n, withUsPerBreath: (1000 * cpuMsPerRun(table, DEFAULT_SETTINGS, runs)) / n };
  });
}

/** Largest deviation of the per-breath costs from their mean, % of the mean. */
export function spreadPct(values: readonly number[]): number {
  const mean = values.reduce((a, b) => a + b, 0) / values.length;
  return (100 * Math.max(...values.map((v) => Math.abs(v - mean)))) / mean;
}

export async function run(): Promise<string[]> {
  const rows = measureScaling();
  const lines = [
    'analyzeTest CPU time per breath, one test breathed 1–66 times as densely (target: within ±20 % of the mean from 500 to 32,000 breaths):',
    '| breaths | without the bootstrap, µs per breath | with the bootstrap (default settings), µs per breath |',
    '| --- | --- | --- |',
    ...rows.map((r) => `| ${r.breaths.toLocaleString('en-US')} | ${r.withoutUsPerBreath.toFixed(2)} | ${r.withUsPerBreath.toFixed(2)} |`),
    `largest deviation from the mean: without the bootstrap ${spreadPct(rows.map((r) => r.withoutUsPerBreath)).toFixed(1)} %, with it ${spreadPct(rows.map((r) => r.withUsPerBreath)).toFixed(1)} % (target ±20 %)`,
    `load average at the end: ${loadavg().map((x) => x.toFixed(1)).join(' ')} on ${availableParallelism()} cores`,
  ];
  return lines;
}
