/**
 * Peak resident set size of one whole `twofold` process (the built command line, as a user
 * runs it), read from getrusage by a preloaded hook (max-rss.cjs) when the process exits.
 */
import { spawn } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const here = dirname(fileURLToPath(import.meta.url));
const BIN = join(here, '..', '..', 'bin', 'twofold.mjs');

export interface PeakRun {
  readonly exitCode: number | null;
  readonly peakRssBytes: number;
  readonly wallMs: number;
  readonly stderr: string;
}

export async function peakRss(args: readonly string[], cwd: string): Promise<PeakRun> {
  const dir = mkdtempSync(join(tmpdir(), 'twofold-rss-'));
  const file = join(dir, 'max-rss');
  const t0 = performance.now();
  try {
    const child = spawn(process.execPath, ['--require', join(here, 'max-rss.cjs'), BIN, ...args], {
      cwd,
      env: { ...process.env, TWOFOLD_MAX_RSS_FILE: file },
      stdio: ['ignore', 'ignore', 'pipe'],
    });
    let stderr = '';
    child.stderr.on('data', (d: Buffer) => (stderr += d.toString()));
    const exitCode = await new Promise<number | null>((resolve) => child.on('close', (code) => resolve(code)));
    return { exitCode, peakRssBytes: Number(readFileSync(file, 'utf8')), wallMs: performance.now() - t0, stderr };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
