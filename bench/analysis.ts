/**
 * Speed of one end-to-end analysis (outliers → averaging → phases → thresholds with their
 * bootstrap intervals → peaks → derived → predicted → effort) on a generated test of about
 * 1,500 breaths, after warm-up. Target: under 100 ms in Node.
 */
import { availableParallelism, loadavg } from 'node:os';
import { performance } from 'node:perf_hooks';
import { analyzeTest, noClinicalInputs } from '../core/analyze/analyze-test';
import type { BreathTable } from '../core/model/breath-table';
import { DEFAULT_SETTINGS, type Settings } from '../core/model/settings';
import { median, quantile } from '../core/math/stats';
import { defaultCycleParams, generateTest, type TestParams } from '../sample-tests/generator';

/** A long, fast-breathing 12 W/min ramp: a fit man breathing ~16/min at rest gives ~1,500 breaths. */
export function longTestParams(): TestParams {
  const base = defaultCycleParams();
  if (base.protocol.kind !== 'cycle-ramp') throw new Error('the default protocol is expected to be a cycle ramp');
  return {
    ...base,
    name: 'bench-1500',
    subject: { ...base.subject, sex: 'M', weightKg: 80, heightCm: 180 },
    protocol: { ...base.protocol, rampWPerMin: 12 },
    vo2PeakMlMin: 3600,
    vt1Vo2MlMin: 1800,
    vt2Vo2MlMin: 2800,
    rrRestPerMin: 18,
    vtMaxL: 1.5,
    outlierBreaths: 15,
  };
}

/**
 * Wall-clock and CPU milliseconds of each of `runs` analyses after 5 warm-up runs. CPU time
 * (user + system of this process) is the steadier figure on a shared machine.
 */
function timed(table: BreathTable, settings: Settings, runs: number): { wall: number[]; cpu: number[] } {
  const clinical = noClinicalInputs();
  for (let i = 0; i < 5; i++) analyzeTest(table, settings, clinical);
  const wall: number[] = [];
  const cpu: number[] = [];
  for (let i = 0; i < runs; i++) {
    const c0 = process.cpuUsage();
    const t0 = performance.now();
    analyzeTest(table, settings, clinical);
    wall.push(performance.now() - t0);
    const c = process.cpuUsage(c0);
    cpu.push((c.user + c.system) / 1000);
  }
  return { wall, cpu };
}

function line(label: string, { wall, cpu }: { wall: readonly number[]; cpu: readonly number[] }): string {
  return (
    `${label}: wall median ${median(wall).toFixed(1)} ms, 90th percentile ${quantile(wall, 0.9).toFixed(1)} ms, max ${Math.max(...wall).toFixed(1)} ms; ` +
    `CPU median ${median(cpu).toFixed(1)} ms`
  );
}

export async function run(): Promise<string[]> {
  const { table } = generateTest(longTestParams(), 1);
  const replicates = DEFAULT_SETTINGS.thresholds.bootstrap.replicates;
  const noBootstrap: Settings = { ...DEFAULT_SETTINGS, thresholds: { ...DEFAULT_SETTINGS.thresholds, bootstrap: { ...DEFAULT_SETTINGS.thresholds.bootstrap, replicates: 0 } } };
  return [
    `analyzeTest on ${table.breaths.length} breaths, 30 runs after 5 warm-up runs (target < 100 ms with the bootstrap):`,
    line(`  bootstrap ${replicates} replicates`, timed(table, DEFAULT_SETTINGS, 30)),
    line('  without the bootstrap', timed(table, noBootstrap, 30)),
    `  load average at the end: ${loadavg().map((x) => x.toFixed(1)).join(' ')} on ${availableParallelism()} cores`,
  ];
}
