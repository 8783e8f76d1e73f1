// The `twofold` command runs the compiled bundle (scripts/cli-build.mjs), never a stale one:
// every source file the bundle was built from is recorded with its size and modification
// time, and the bin rebuilds when one differs. References: the file system's own stat of
// each source, and the TypeScript sources run in-process through cli/main.ts.
import { execFileSync, spawnSync } from 'node:child_process';
import { copyFileSync, existsSync, mkdtempSync, readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { main } from '../../cli/main';
import { io as captureIo } from './capture-io';

const ROOT = join(__dirname, '..', '..');

describe('the built command line', () => {
  it('runs from dist/cli/, built from the current sources (every recorded stamp matches the file now)', () => {
    const out = execFileSync(process.execPath, [join(ROOT, 'bin', 'twofold.cjs'), '--version'], { encoding: 'utf8', cwd: ROOT });
    expect(out.trim()).toBe(JSON.parse(readFileSync(join(ROOT, 'package.json'), 'utf8')).version);
    const record = JSON.parse(readFileSync(join(ROOT, 'dist', 'cli', 'build.json'), 'utf8')) as { entry: string; inputs: Record<string, [number, number]> };
    expect(Object.keys(record.inputs)).toEqual(expect.arrayContaining(['cli/main.ts', 'cli/commands/analyze.ts', 'core/thresholds/uncertainty.ts', 'host/demo-job.ts']));
    for (const [path, [mtimeMs, size]] of Object.entries(record.inputs)) {
      const s = statSync(join(ROOT, path));
      expect([path, s.mtimeMs, s.size]).toEqual([path, mtimeMs, size]);
    }
    // No TypeScript is compiled at start-up: neither the bin nor its start-up code loads tsx.
    for (const file of ['bin/twofold.cjs', 'scripts/cli-start.cjs']) expect(readFileSync(join(ROOT, file), 'utf8')).not.toContain('tsx');
    // The earlier path runs the same command.
    expect(execFileSync(process.execPath, [join(ROOT, 'bin', 'twofold.mjs'), '--version'], { encoding: 'utf8', cwd: ROOT })).toBe(out);
    // The package's command is that bin.
    expect(JSON.parse(readFileSync(join(ROOT, 'package.json'), 'utf8')).bin.twofold).toBe('bin/twofold.cjs');
  });

  it('gives the same analysis as the TypeScript sources run in-process', async () => {
    const file = join(ROOT, 'sample-tests', 'demo', 'qh0417-day1.csv');
    const built = execFileSync(process.execPath, [join(ROOT, 'bin', 'twofold.cjs'), 'analyze', file, '--json'], { encoding: 'utf8', cwd: ROOT });
    const io = captureIo();
    expect(await main(['analyze', file, '--json'], io.io)).toBe(0);
    const strip = (text: string) => JSON.parse(text.replace(/"generatedAt":\s*"[^"]*"/g, '"generatedAt":""'));
    expect(strip(built)).toEqual(strip(io.out()));
  });

  it('a later start compiles from the V8 code cache the first one wrote, with the same output', () => {
    const file = join(ROOT, 'sample-tests', 'demo', 'qh0417-day2.csv');
    const run = () => execFileSync(process.execPath, [join(ROOT, 'bin', 'twofold.cjs'), 'analyze', file, '--json'], { encoding: 'utf8', cwd: ROOT }).replace(/"generatedAt":\s*"[^"]*"/g, '');
    const first = run();
    const record = JSON.parse(readFileSync(join(ROOT, 'dist', 'cli', 'build.json'), 'utf8')) as { entry: string };
    const cache = join(ROOT, 'dist', 'cli', dirname(record.entry), 'code-cache');
    expect(existsSync(cache) && readdirSync(cache).filter((f) => f.endsWith('.v8')).length).toBeGreaterThan(1);
    expect(run()).toBe(first);
  });

  it('a batch on two worker threads of the built command gives the rows one worker gives', () => {
    const dir = mkdtempSync(join(tmpdir(), 'twofold-built-batch-'));
    for (const day of ['day1', 'day2']) copyFileSync(join(ROOT, 'sample-tests', 'demo', `qh0417-${day}.csv`), join(dir, `${day}.csv`));
    writeFileSync(join(dir, 'manifest.csv'), ['pair_id,day1_file,day2_file', ...Array.from({ length: 8 }, (_, i) => `P${i},day1.csv,day2.csv`)].join('\n') + '\n');
    const batch = (workers: number) => {
      execFileSync(process.execPath, [join(ROOT, 'bin', 'twofold.cjs'), 'compare', '--manifest', 'manifest.csv', '--out', `r${workers}.csv`, '--workers', String(workers)], { cwd: dir, stdio: 'pipe' });
      return readFileSync(join(dir, `r${workers}.csv`), 'utf8');
    };
    const two = batch(2);
    expect(two.trim().split('\n')).toHaveLength(9);
    expect(two).toBe(batch(1));
  });

  it('twofold analyze on a CSV loads only what it uses: no workbook, PDF, chart, certificate or settings-validation library, no node:crypto', () => {
    const file = join(ROOT, 'sample-tests', 'demo', 'qh0417-day1.csv');
    // The command as the bin runs it; at exit, every CommonJS file it loaded and Node's own modules.
    const probe = `process.on('exit', () => process.stderr.write(JSON.stringify({ files: Object.keys(require.cache), builtins: process.moduleLoadList })));
      require('./scripts/cli-start.cjs').run(['analyze', ${JSON.stringify(file)}, '--json']);`;
    const r = spawnSync(process.execPath, ['-e', probe], { cwd: ROOT, encoding: 'utf8' });
    expect(r.status).toBe(0);
    const { files, builtins } = JSON.parse(r.stderr) as { files: string[]; builtins: string[] };
    expect(files.some((f) => f.includes('papaparse'))).toBe(true);
    for (const heavy of ['exceljs', 'pdfkit', 'fontkit', 'vega', 'node-forge', 'zod', 'esbuild', 'tsx']) expect([heavy, files.filter((f) => f.includes(`node_modules/${heavy}`))]).toEqual([heavy, []]);
    expect(builtins.filter((m) => /^NativeModule (crypto|internal\/crypto)/.test(m))).toEqual([]);
    // Of the build, only the entry and the command's own file, with no bundled package in it.
    const built = files.filter((f) => f.includes(join('dist', 'cli')));
    expect(built.map((f) => f.split(/[\\/]/).at(-1)).sort()).toEqual(['analyze.cjs', 'main.cjs']);
    expect(readFileSync(built.find((f) => f.endsWith('analyze.cjs'))!, 'utf8')).not.toMatch(/\/\/ node_modules\//);
  });
});

