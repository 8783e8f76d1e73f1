/**
 * How the cost of one analysis grows with the number of breaths, 500 → 32,000 (issue 14:
 * linear, the cost per breath within ±20 % of its mean over the sizes).
 *
 * The tests: one generated cycle ramp of about 500 breaths (sample-tests/generator, 10 W/min),
 * and that same protocol breathed k times as densely: the breaths of k independently seeded
 * runs of the generator merged in time order (k = 1 … 66), so the physiology and the length
 * of the test stay fixed and only the number of breaths grows. The merged breaths are copied
 * into new objects in time order, as the importer makes them from a file: objects left where
 * 66 separate runs allocated them are read out of order in memory, which alone made the
 * largest test about 20 % dearer per breath than the same breaths read in file order.
 *
 * Time per breath of `analyzeTest`, CPU time of this process (all its threads, garbage
 * collection included). The sizes take turns: each round times one batch of about 30,000
 * breaths' worth of runs at every size, so a slow spell of the machine falls on all sizes
 * alike; the figure is the median over the rounds (9, or 5 with the bootstrap), after a warm-up.
 * Each size also shows how many methods found each threshold: until the phase rule let a
 * one-watt dip in the load through, the merged tables of 16 runs and more lost the ramp's start
 * and most methods failed early, so their low cost per breath measured less work, not less cost.
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
  const breaths: Breath[] = runs
    .flatMap((t) => t.breaths)
    .sort((a, b) => a.timeS - b.timeS)
    .map((b) => ({ ...b }));
  return { ...runs[0], breaths };
}

/** CPU ms of one `analyzeTest` of the table, averaged over `runs` runs. */
function cpuMsOfBatch(table: BreathTable, settings: Settings, runs: number): number {
  const clinical = noClinicalInputs();
  const c0 = process.cpuUsage();
  for (let r = 0; r < runs; r++) analyzeTest(table, settings, clinical);
  const c = process.cpuUsage(c0);
  return (c.user + c.system) / 1000 / runs;
}

/** Settings with the bootstrap off (`replicates` 0, which a settings file may ask for; issue 14 measures this cost). */
export const NO_BOOTSTRAP: Settings = { ...DEFAULT_SETTINGS, thresholds: { ...DEFAULT_SETTINGS.thresholds, bootstrap: { ...DEFAULT_SETTINGS.thresholds.bootstrap, replicates: 0 } } };

/**
 * µs of CPU per breath of `analyzeTest` at each density: `rounds` rounds, each timing one
 * batch of about `batchBreaths` breaths' worth of runs at every density in turn (so a small
 * table is not timed below the clock's resolution), the median per density; after warming
 * the code up on a mid-sized table and once on each table.
 */
export function usPerBreath(densities: readonly number[], settings: Settings, rounds = 9, batchBreaths = 30_000): { breaths: number; usPerBreath: number }[] {
  const warm = denseTable(4);
  for (let i = 0; i < 10; i++) analyzeTest(warm, settings, noClinicalInputs());
  const tables = densities.map((k) => denseTable(k));
  const runs = tables.map((t) => Math.max(1, Math.ceil(batchBreaths / t.breaths.length)));
  tables.forEach((t) => analyzeTest(t, settings, noClinicalInputs()));
  const ms: number[][] = tables.map(() => []);
  for (let round = 0; round < rounds; round++) tables.forEach((t, i) => ms[i].push(cpuMsOfBatch(t, settings, runs[i])));
  return tables.map((t, i) => ({ breaths: t.breaths.length, usPerBreath: (1000 * median(ms[i])) / t.breaths.length }));
}

export interface ScalingRow {
  readonly breaths: number;
  readonly withoutUsPerBreath: number;
  readonly withUsPerBreath: number;
  /** Methods that found VT1 and VT2, e.g. '6/6, 3/3': a cost is only comparable across sizes when the analyses did the same work. */
  readonly found: string;
}

/** How many methods found VT1 and VT2 on the table ('6/6, 3/3'). */
export function methodsFound(table: BreathTable): string {
  const a = analyzeTest(table, NO_BOOTSTRAP, noClinicalInputs());
  const count = (t: typeof a.vt1) => `${t.methods.filter((m) => m.found).length}/${t.methods.length}`;
  return `${count(a.vt1)}, ${count(a.vt2)}`;
}

export function measureScaling(densities: readonly number[] = DENSITIES): ScalingRow[] {
  const without = usPerBreath(densities, NO_BOOTSTRAP);
  const withIt = usPerBreath(densities, DEFAULT_SETTINGS, 5);
  return without.map((r, i) => ({ breaths: r.breaths, withoutUsPerBreath: r.usPerBreath, withUsPerBreath: withIt[i].usPerBreath, found: methodsFound(denseTable(densities[i])) }));
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
    '| breaths | without the bootstrap, µs per breath | with the bootstrap (default settings), µs per breath | methods that found VT1, VT2 |',
    '| --- | --- | --- | --- |',
    ...rows.map((r) => `| ${r.breaths.toLocaleString('en-US')} | ${r.withoutUsPerBreath.toFixed(2)} | ${r.withUsPerBreath.toFixed(2)} | ${r.found} |`),
    `largest deviation from the mean: without the bootstrap ${spreadPct(rows.map((r) => r.withoutUsPerBreath)).toFixed(1)} %, with it ${spreadPct(rows.map((r) => r.withUsPerBreath)).toFixed(1)} % (target ±20 %)`,
    `load average at the end: ${loadavg().map((x) => x.toFixed(1)).join(' ')} on ${availableParallelism()} cores`,
  ];
  return lines;
}
