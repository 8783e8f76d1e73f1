/**
 * Memory at a million breaths (issue 12): peak resident set size of the whole process for
 * `twofold analyze FILE --json` and for `twofold report DAY1 DAY2 --out REPORT.pdf` (unsigned;
 * both days a million rows). `twofold verify` is not measured: the report here is unsigned,
 * and verify stops at the signature check before it rebuilds anything. The files (about 55 MB
 * each, bench/memory/large-file.ts) are generated into a temporary folder and removed after.
 * Target: under 1 GB (10^9 bytes) each, for analyze and report. Files this large run in a
 * child process with a heap limit (scripts/start-flags.cjs); the figure is then the child's peak
 * plus the parent's (bench/memory/max-rss.cjs), never less than the two held together.
 *
 * `npx tsx bench/memory.ts --check` runs the same and exits 1 when a target is missed (the
 * nightly memory check; too long for `npm test`, which has a smaller guard,
 * tests/cli/memory-guard.test.ts).
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { LARGE_ROWS, writeLargeBreathFile } from './memory/large-file';
import { peakRss, type PeakRun } from './memory/peak-rss';

export const PEAK_RSS_TARGET_BYTES = 1e9;

const gb = (bytes: number) => `${(bytes / 1e9).toFixed(2)} GB`;

function line(what: string, r: PeakRun, target: number): string {
  const verdict = r.peakRssBytes < target ? ` (target < ${gb(target)}: met)` : ` (target < ${gb(target)}: NOT met)`;
  return `- ${what}: peak RSS ${gb(r.peakRssBytes)}, ${(r.wallMs / 1000).toFixed(1)} s wall, exit ${r.exitCode}${verdict}`;
}

export async function measureMemory(rows = LARGE_ROWS): Promise<{ lines: string[]; missed: string[] }> {
  const dir = mkdtempSync(join(tmpdir(), 'twofold-bench-memory-'));
  const lines: string[] = [];
  const missed: string[] = [];
  try {
    const size1 = writeLargeBreathFile(join(dir, 'large-day1.csv'), rows, 1, 0);
    const size2 = writeLargeBreathFile(join(dir, 'large-day2.csv'), rows, 2, 1);
    lines.push(`${rows.toLocaleString('en-US')} rows per file (${(size1 / 1e6).toFixed(1)} and ${(size2 / 1e6).toFixed(1)} MB), load average at the start ${loadavg()[0].toFixed(1)}`);
    const runs: [string, string[], number][] = [
      ['twofold analyze FILE --json', ['analyze', 'large-day1.csv', '--json'], PEAK_RSS_TARGET_BYTES],
      ['twofold report DAY1 DAY2 --out (unsigned)', ['report', 'large-day1.csv', 'large-day2.csv', '--out', 'large.pdf'], PEAK_RSS_TARGET_BYTES],
    ];
    for (const [what, args, target] of runs) {
      const r = await peakRss(args, dir);
      lines.push(line(what, r, target));
      if (r.exitCode !== 0) missed.push(`${what} exited ${r.exitCode}: ${r.stderr.trim().split('\n')[0]}`);
      if (r.peakRssBytes >= target) missed.push(`${what}: ${gb(r.peakRssBytes)}`);
    }
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
  return { lines, missed };
}

export async function run(): Promise<string[]> {
  const { lines, missed } = await measureMemory();
  return [...lines, missed.length === 0 ? 'every target met' : `missed: ${missed.join('; ')}`];
}

if (process.argv.includes('--check')) {
  const { lines, missed } = await measureMemory();
  for (const l of lines) console.log(l);
  if (missed.length > 0) {
    console.error(`memory check failed: ${missed.join('; ')}`);
    process.exitCode = 1;
  }
}
