/**
 * Comparison speed: compareTests alone, and a batch of 1,000 pairs through
 * `twofold compare --manifest` (read, import, analyse both days, compare, write the CSV).
 * The batch reuses 50 generated pairs (sample-tests/generator) written to a temp dir, each
 * listed 20 times in the manifest; every row is still read and analysed afresh.
 * The batch runs through the built command line (bin/twofold.cjs) in a new process, one
 * worker (the baseline) against one worker thread per core.
 * Run: npx tsx bench/run.ts compare
 */
import { mkdtempSync, mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { availableParallelism, loadavg, tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { analyzeTest, noClinicalInputs } from '../core/analyze/analyze-test';
import { compareTests } from '../core/compare/compare-tests';
import { writeBreathCsv } from '../core/export/breath-csv';
import { DEFAULT_SETTINGS } from '../core/model/settings';
import { defaultCycleParams, generateTest, type TestParams } from '../sample-tests/generator/index';
import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';

const BIN = join(dirname(fileURLToPath(import.meta.url)), '..', 'bin', 'twofold.cjs');

const DISTINCT = 50;
const PAIRS = 1000;

/** A long, fast-breathing 12 W/min ramp (~1,500 breaths), as bench/analysis.ts uses. */
function longParams(): TestParams {
  const base = defaultCycleParams();
  const protocol = base.protocol.kind === 'cycle-ramp' ? { ...base.protocol, rampWPerMin: 12 } : base.protocol;
  return { ...base, subject: { ...base.subject, sex: 'M', weightKg: 80, heightCm: 180 }, protocol, vo2PeakMlMin: 3600, vt1Vo2MlMin: 1800, vt2Vo2MlMin: 2800, rrRestPerMin: 18, vtMaxL: 1.5, outlierBreaths: 15 };
}

/** Write DISTINCT pairs and a manifest listing them PAIRS times over; returns the breath count. */
function writeBatch(dir: string, base: TestParams): number {
  mkdirSync(join(dir, 'files'), { recursive: true });
  let breaths = 0;
  for (let i = 0; i < DISTINCT; i++) {
    const subject = { ...base.subject, subjectId: `B${i}` };
    const g1 = generateTest({ ...base, subject, testStart: '2026-03-09T09:00:00Z' }, 10_000 + i);
    const g2 = generateTest({ ...base, subject, testStart: '2026-03-10T09:00:00Z', vt1Vo2MlMin: base.vt1Vo2MlMin * (i % 2 ? 0.7 : 1) }, 20_000 + i);
    writeFileSync(join(dir, 'files', `b${i}-1.csv`), writeBreathCsv(g1.table));
    writeFileSync(join(dir, 'files', `b${i}-2.csv`), writeBreathCsv(g2.table));
    breaths += g1.table.breaths.length + g2.table.breaths.length;
  }
  const manifest = ['pair_id,day1_file,day2_file'];
  for (let k = 0; k < PAIRS; k++) manifest.push(`K${k},files/b${k % DISTINCT}-1.csv,files/b${k % DISTINCT}-2.csv`);
  writeFileSync(join(dir, 'manifest.csv'), `${manifest.join('\n')}\n`);
  return Math.round(breaths / (2 * DISTINCT));
}

/** The batch through the built command line, as a user runs it (a new process, compiled code). */
async function timeBatch(dir: string, workers: number): Promise<{ seconds: number; code: number }> {
  const t = performance.now();
  const child = spawnSync(process.execPath, [BIN, 'compare', '--manifest', 'manifest.csv', '--out', `results-${workers}.csv`, '--workers', String(workers)], { cwd: dir, stdio: 'ignore' });
  return { seconds: (performance.now() - t) / 1000, code: child.status ?? -1 };
}

export async function run(): Promise<string[]> {
  const lines: string[] = [];
  const base = defaultCycleParams();
  const g1 = generateTest(base, 1);
  const g2 = generateTest({ ...base, vt1Vo2MlMin: base.vt1Vo2MlMin * 0.7 }, 2);
  const day1 = analyzeTest(g1.table, DEFAULT_SETTINGS, noClinicalInputs());
  const day2 = analyzeTest(g2.table, DEFAULT_SETTINGS, noClinicalInputs());
  for (let i = 0; i < 200; i++) compareTests(day1, day2, DEFAULT_SETTINGS);
  const n = 2000;
  const t0 = performance.now();
  for (let i = 0; i < n; i++) compareTests(day1, day2, DEFAULT_SETTINGS);
  lines.push(`compareTests on two analysed tests: ${((1000 * (performance.now() - t0)) / n).toFixed(0)} µs per pair (mean of ${n}, after warm-up)`);

  // Builds the command line if a source changed, so no batch below pays for it.
  spawnSync(process.execPath, [BIN, '--version'], { stdio: 'ignore' });
  const cores = availableParallelism();
  for (const [label, params, workerCounts] of [
    ['default generated ramp', base, [1, cores]],
    ['long ramp', longParams(), [1, cores]],
  ] as const) {
    const dir = mkdtempSync(join(tmpdir(), 'twofold-bench-compare-'));
    const breaths = writeBatch(dir, params);
    for (const workers of workerCounts) {
      const { seconds, code } = await timeBatch(dir, workers);
      const role = workers === 1 ? 'baseline' : 'target < 30 s';
      lines.push(`batch of ${PAIRS} pairs, ${label} (about ${breaths} breaths per file), \`twofold compare --manifest\`, ${workers} worker${workers > 1 ? ' threads' : ''} (${role}): ${seconds.toFixed(1)} s (exit ${code}), ${((1000 * seconds) / PAIRS).toFixed(1)} ms per pair (load average after: ${loadavg()[0]!.toFixed(1)})`);
    }
    rmSync(dir, { recursive: true, force: true });
  }
  lines.push(`machine: ${cores} cores (shared), Node ${process.version}`);
  return lines;
}
