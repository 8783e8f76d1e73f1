/**
 * Start-up of the `twofold` command as a whole process, side by side with its baseline
 * `node -e 0` (runs interleaved: baseline, command, baseline, command, ...; medians of wall
 * time). Targets (issue 14): `twofold analyze FILE --json` on a 1,500-breath CSV within 3 × of
 * `node -e 0`; the first signed report in a new process (`twofold demo`: analyse both days,
 * record the override and sign-off, build, generate the demonstration certificate, sign)
 * under 2 s.
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { availableParallelism, loadavg, tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { writeBreathCsv } from '../core/export/breath-csv';
import { median } from '../core/math/stats';
import { generateTest } from '../sample-tests/generator';
import { longTestParams } from './analysis';

const ROOT = join(dirname(fileURLToPath(import.meta.url)), '..');
const BIN = join(ROOT, 'bin', 'twofold.cjs');

function wallMs(args: readonly string[]): number {
  const t = performance.now();
  execFileSync(process.execPath, args, { stdio: 'ignore', cwd: ROOT });
  return performance.now() - t;
}

function sideBySide(command: readonly string[], runs: number): { baseline: number; command: number } {
  const base: number[] = [];
  const cmd: number[] = [];
  for (let i = 0; i < runs; i++) {
    base.push(wallMs(['-e', '0']));
    cmd.push(wallMs(command));
  }
  return { baseline: median(base), command: median(cmd) };
}

export async function run(): Promise<string[]> {
  const dir = mkdtempSync(join(tmpdir(), 'twofold-bench-startup-'));
  try {
    const { table } = generateTest(longTestParams(), 1);
    const file = join(dir, 'test-1500.csv');
    writeFileSync(file, writeBreathCsv(table));
    // Builds the bundle if a source changed, so no run below pays for it.
    wallMs([BIN, '--version']);
    const version = sideBySide([BIN, '--version'], 9);
    const analyze = sideBySide([BIN, 'analyze', file, '--json'], 9);
    const demo = sideBySide([BIN, 'demo', '--out', join(dir, 'demo')], 5);
    const row = (label: string, r: { baseline: number; command: number }, target: string) =>
      `| ${label} | ${r.command.toFixed(0)} ms | ${r.baseline.toFixed(0)} ms | ${(r.command / r.baseline).toFixed(1)} × | ${target} |`;
    return [
      'Whole processes, interleaved with `node -e 0`, medians (9 runs; 5 for the demo):',
      '| command | wall | `node -e 0` (baseline) | ratio | target |',
      '| --- | --- | --- | --- | --- |',
      row('`twofold --version`', version, '—'),
      row(`\`twofold analyze FILE --json\`, ${table.breaths.length} breaths`, analyze, '≤ 3 ×'),
      row('`twofold demo` (first signed report in a new process)', demo, '< 2 s'),
      `load average at the end: ${loadavg().map((x) => x.toFixed(1)).join(' ')} on ${availableParallelism()} cores`,
    ];
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
