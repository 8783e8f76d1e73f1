// The heap limit for large inputs (scripts/start-flags.cjs): which command lines get it, that the
// capped child gives the output an uncapped run gives, byte for byte, and that a child that
// still runs out of memory is run again without the limit, with one line instead of V8's
// report; and that a batch on two workers run with a single-threaded collector gives the rows
// one worker gives. References: the file system's own sizes (a sparse file), the uncapped
// run, and the one-worker batch.
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, truncateSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { writeLargeBreathFile } from '../../bench/memory/large-file';

const ROOT = join(__dirname, '..', '..');
const BIN = join(ROOT, 'bin', 'twofold.cjs');
const heapCap = createRequire(__filename)(join(ROOT, 'scripts', 'start-flags.cjs')) as {
  CAP_FROM_BYTES: number;
  childFlags: (argv: string[], env?: Record<string, string | undefined>, execArgv?: string[]) => string[] | null;
  namedFileBytes: (argv: string[]) => number;
};

let dir = '';
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'twofold-start-flags-'));
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const wantsCap = (argv: string[], env: Record<string, string | undefined>, execArgv: string[]) => (heapCap.childFlags(argv, env, execArgv) ?? []).some((f) => f.startsWith('--max-old-space-size='));

describe('which command lines run in a child, and with which flags', () => {
  it('only those whose named files total more than the threshold, and never twice', () => {
    const big = join(dir, 'big.csv');
    writeFileSync(big, '');
    truncateSync(big, heapCap.CAP_FROM_BYTES + 1);
    const small = join(dir, 'small.csv');
    writeFileSync(small, 'time_s\n');
    expect(heapCap.CAP_FROM_BYTES).toBe(24e6);
    expect(heapCap.namedFileBytes(['analyze', big, '--json', small, join(dir, 'missing.csv')])).toBe(heapCap.CAP_FROM_BYTES + 1 + 7);
    expect(wantsCap(['analyze', big, '--json'], {}, [])).toBe(true);
    expect(wantsCap(['analyze', small, '--json'], {}, [])).toBe(false);
    // The child itself, and a process started with a limit of its own, run the command.
    expect(wantsCap(['analyze', big], { TWOFOLD_IN_CHILD: '1' }, [])).toBe(false);
    expect(wantsCap(['analyze', big], {}, ['--max-old-space-size=2000'])).toBe(false);
    // Commands that append to a case's log never run twice.
    expect(wantsCap(['override', big], {}, [])).toBe(false);
    expect(wantsCap(['sign-off', big], {}, [])).toBe(false);
    expect(wantsCap(['report', big, small, '--out', 'x.pdf'], {}, [])).toBe(true);
    expect(heapCap.childFlags(['analyze', big, '--json'], {}, [])).toEqual(['--max-old-space-size=450']);
    // A batch on two or more worker threads: one collector thread per heap; not on one worker.
    expect(heapCap.childFlags(['compare', '--manifest', small, '--out', 'r.csv', '--workers', '2'], {}, [])).toEqual(['--single-threaded-gc']);
    expect(heapCap.childFlags(['compare', '--manifest', small, '--out', 'r.csv', '--workers=3'], {}, [])).toEqual(['--single-threaded-gc']);
    expect(heapCap.childFlags(['compare', '--manifest', small, '--out', 'r.csv', '--workers', '1'], {}, [])).toBeNull();
    expect(heapCap.childFlags(['compare', small, small], {}, [])).toBeNull();
    expect(heapCap.childFlags(['compare', '--manifest', small, '--workers', '2'], {}, ['--single-threaded-gc'])).toBeNull();
    // Flags are not files, even when a file of that name exists.
    expect(heapCap.namedFileBytes(['--json'])).toBe(0);
  });
});

describe('a large input under the heap limit', () => {
  it('gives the uncapped output; a child that runs out is run again without the limit', { timeout: 240_000 }, () => {
    // 150,000 rows, about 8 MB: the threshold is lowered so the test stays short.
    writeLargeBreathFile(join(dir, 'large.csv'), 150_000, 4, 0);
    const run = (env: Record<string, string>) =>
      spawnSync(process.execPath, [BIN, 'analyze', 'large.csv', '--json'], { cwd: dir, encoding: 'utf8', env: { ...process.env, ...env }, maxBuffer: 64e6 });
    const uncapped = run({ TWOFOLD_IN_CHILD: '1' });
    expect(uncapped.status).toBe(0);
    const capped = run({ TWOFOLD_HEAP_CAP_FROM_BYTES: '1000', TWOFOLD_HEAP_CAP_MB: '400' });
    expect(capped.stderr).toBe('');
    expect(capped.status).toBe(0);
    // A 16 MB old generation cannot hold the file's text (8 MB) and its averaged series
    // (8 variables × 150,000 points × 8 bytes).
    const starved = run({ TWOFOLD_HEAP_CAP_FROM_BYTES: '1000', TWOFOLD_HEAP_CAP_MB: '16' });
    expect(starved.stderr).toBe('twofold: this input needed more memory than the limit set for large files; running it again without the limit.\n');
    expect(starved.status).toBe(0);
    const strip = (text: string) => text.replace(/"generatedAt":\s*"[^"]*"/g, '"generatedAt":""');
    expect(strip(capped.stdout)).toBe(strip(uncapped.stdout));
    expect(strip(starved.stdout)).toBe(strip(uncapped.stdout));
    expect(JSON.parse(uncapped.stdout).vt1).toBeTruthy();
  });

  it('runs a batch on two worker threads in a child with one collector thread, with the rows one worker gives', { timeout: 120_000 }, () => {
    const demo = join(ROOT, 'sample-tests', 'demo');
    const rows = ['pair_id,day1_file,day2_file', ...Array.from({ length: 8 }, (_, k) => `P${k},${join(demo, 'qh0417-day1.csv')},${join(demo, 'qh0417-day2.csv')}`)];
    writeFileSync(join(dir, 'manifest.csv'), `${rows.join('\n')}\n`);
    const batch = (workers: string, out: string) => spawnSync(process.execPath, [BIN, 'compare', '--manifest', 'manifest.csv', '--out', out, '--workers', workers], { cwd: dir, encoding: 'utf8' });
    const two = batch('2', 'two.csv');
    const one = batch('1', 'one.csv');
    expect([two.status, one.status]).toEqual([0, 0]);
    expect(two.stderr).not.toMatch(/Fatal|Check failed/);
    expect(readFileSync(join(dir, 'two.csv'), 'utf8')).toBe(readFileSync(join(dir, 'one.csv'), 'utf8'));
  });

  it('passes the exit code and located message of bad input through the child', () => {
    writeFileSync(join(dir, 'bad.csv'), 'time_s,vo2_ml_min\n1,abc\n');
    const r = spawnSync(process.execPath, [BIN, 'analyze', 'bad.csv', '--json'], { cwd: dir, encoding: 'utf8', env: { ...process.env, TWOFOLD_HEAP_CAP_FROM_BYTES: '1' } });
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/^bad\.csv:\d+:\d+: /);
    expect(r.stdout).toBe('');
  });
});
