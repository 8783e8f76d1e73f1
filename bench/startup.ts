/**
 * Start-up of the `twofold` command as a whole process, side by side with its baseline
 * `node -e 0` (runs interleaved: baseline, command, baseline, command, ...; medians of wall
 * time, and of CPU time, user + system, which a loaded machine inflates less). Targets
 * (issue 14): `twofold analyze FILE --json` on a 1,500-breath CSV within 3 × of `node -e 0`;
 * the first signed report in a new process (`twofold demo`: analyse both days, record the
 * override and sign-off, build, generate the demonstration certificate, sign) under 2 s.
 * The demo runs once more first with the build's V8 code cache removed (the first start
 * after a build), then interleaved with the baseline as every later start runs.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { availableParallelism, loadavg, tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { writeBreathCsv } from '../core/export/breath-csv';
import { median } from '../core/math/stats';
import { generateTest } from '../sample-tests/generator';
import { longTestParams } from './analysis';

const ROOT = join(dirname(fileURLToPath(import.meta.url)), '..');
const BIN = join(ROOT, 'bin', 'twofold.cjs');

interface Run {
  readonly wallMs: number;
  readonly cpuMs: number;
}

/** One process: its wall time, and its CPU time from /usr/bin/time when present (else null). */
function once(args: readonly string[]): Run {
  const t = performance.now();
  const r = spawnSync('/usr/bin/time', ['-f', '%U %S', process.execPath, ...args], { cwd: ROOT, encoding: 'utf8', stdio: ['ignore', 'ignore', 'pipe'] });
  const wallMs = performance.now() - t;
  if (r.status !== 0) throw new Error(`${args.join(' ')} failed: ${r.stderr}`);
  const [user, sys] = r.stderr.trim().split('\n').at(-1)!.split(' ').map(Number);
  return { wallMs, cpuMs: 1000 * (user! + sys!) };
}

interface Pair {
  readonly baseline: Run;
  readonly command: Run;
}

function sideBySide(command: (i: number) => readonly string[], runs: number): Pair {
  const base: Run[] = [];
  const cmd: Run[] = [];
  for (let i = 0; i < runs; i++) {
    base.push(once(['-e', '0']));
    cmd.push(once(command(i)));
  }
  const med = (xs: Run[]): Run => ({ wallMs: median(xs.map((x) => x.wallMs)), cpuMs: median(xs.map((x) => x.cpuMs)) });
  return { baseline: med(base), command: med(cmd) };
}

const load = () => loadavg()[0]!.toFixed(1);

export async function run(): Promise<string[]> {
  const dir = mkdtempSync(join(tmpdir(), 'twofold-bench-startup-'));
  try {
    const { table } = generateTest(longTestParams(), 1);
    const file = join(dir, 'test-1500.csv');
    writeFileSync(file, writeBreathCsv(table));
    // Builds the command line if a source changed, so no run below pays for it.
    once([BIN, '--version']);
    const record = JSON.parse(readFileSync(join(ROOT, 'dist', 'cli', 'build.json'), 'utf8')) as { entry: string };
    rmSync(join(ROOT, 'dist', 'cli', dirname(record.entry), 'code-cache'), { recursive: true, force: true });
    const rows: string[] = [];
    const row = (label: string, r: Pair, target: string, at: string) =>
      rows.push(
        `| ${label} | ${r.command.wallMs.toFixed(0)} ms | ${r.baseline.wallMs.toFixed(0)} ms | ${(r.command.wallMs / r.baseline.wallMs).toFixed(2)} × | ${r.command.cpuMs.toFixed(0)} ms / ${r.baseline.cpuMs.toFixed(0)} ms (${(r.command.cpuMs / r.baseline.cpuMs).toFixed(2)} ×) | ${target} | ${at} |`,
      );
    const coldDemo = sideBySide(() => [BIN, 'demo', '--out', join(dir, 'demo-cold')], 1);
    row('`twofold demo`, first start after a build (no code cache yet)', coldDemo, '< 2 s', load());
    const version = sideBySide(() => [BIN, '--version'], 9);
    row('`twofold --version`', version, '—', load());
    const analyze = sideBySide(() => [BIN, 'analyze', file, '--json'], 11);
    row(`\`twofold analyze FILE --json\`, ${table.breaths.length} breaths`, analyze, '≤ 3 × (wall)', load());
    const demo = sideBySide((i) => [BIN, 'demo', '--out', join(dir, `demo-${i}`)], 5);
    row('`twofold demo` (first signed report in a new process)', demo, '< 2 s (wall)', load());
    return [
      'Whole processes, interleaved with `node -e 0`, medians (11 runs for analyze, 9 for --version, 5 for the demo):',
      '| command | wall | `node -e 0` (baseline) | wall ratio | CPU, command / baseline | target | load average (1 min) after |',
      '| --- | --- | --- | --- | --- | --- | --- |',
      ...rows,
      `${availableParallelism()} cores, Node ${process.version}`,
    ];
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
