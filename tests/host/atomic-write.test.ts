// Atomic save under SIGKILL: a child process saves the case over and over; after a few saves
// the parent watches the folder and kills the child the moment a temporary file appears, that
// is, in the middle of a save (several times). The case file on disk must then always load,
// with its schema and hash chain intact, and hold at least the last save reported complete.
// The property relied on is POSIX rename(2) atomicity within one file system.
import { spawn } from 'node:child_process';
import { mkdtempSync, readdirSync, readFileSync, watch, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { writeFileAtomic } from '../../host/atomic-write';
import { loadCase } from '../../host/case-folder';

const loop = fileURLToPath(new URL('./save-loop.ts', import.meta.url));

function killMidSave(folder: string, afterSaves: number): Promise<number> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, ['--import', 'tsx', loop, folder], { stdio: ['ignore', 'pipe', 'pipe'] });
    let last = 0;
    let buffer = '';
    let killing = false;
    child.stdout.on('data', (chunk: Buffer) => {
      buffer += chunk.toString();
      for (const m of buffer.matchAll(/saved (\d+)\n/g)) last = Number(m[1]);
      buffer = buffer.slice(buffer.lastIndexOf('\n') + 1);
      if (!killing && last > 0 && last - 203 >= afterSaves) {
        killing = true;
        const watcher = watch(folder, (_event, name) => {
          if (name && name.endsWith('.tmp')) {
            child.kill('SIGKILL');
            watcher.close();
          }
        });
      }
    });
    let err = '';
    child.stderr.on('data', (c: Buffer) => (err += c.toString()));
    child.on('exit', (_code, signal) => (signal === 'SIGKILL' ? resolve(last) : reject(new Error(`child ended without being killed: ${err}`))));
  });
}

describe('writeFileAtomic', () => {
  it('replaces a file in one step and leaves no temporary file', () => {
    const dir = mkdtempSync(join(tmpdir(), 'twofold-atomic-'));
    const path = join(dir, 'f.txt');
    writeFileSync(path, 'old');
    writeFileAtomic(path, 'new');
    expect(readFileSync(path, 'utf8')).toBe('new');
    expect(readdirSync(dir)).toEqual(['f.txt']);
  });

  it('a case saved by a process killed with SIGKILL mid-save is the previous or the new one, always valid', async () => {
    const folder = mkdtempSync(join(tmpdir(), 'twofold-kill-'));
    let leftBehind = 0;
    for (const saves of [2, 3, 4, 5]) {
      const acknowledged = await killMidSave(folder, saves);
      leftBehind += readdirSync(folder).filter((f) => f.endsWith('.tmp')).length;
      const loaded = loadCase(folder);
      expect(loaded.ok, loaded.ok ? '' : loaded.error.message).toBe(true);
      if (loaded.ok) expect(loaded.value.caseFile.log.length).toBeGreaterThanOrEqual(acknowledged);
    }
    // Temporary files left behind show that kills did land inside a save (between open and rename).
    expect(leftBehind).toBeGreaterThan(0);
    // Opening the case removed them: their processes are gone (host/case-folder.ts).
    expect(readdirSync(folder).filter((f) => f.endsWith('.tmp')).length).toBe(0);
  }, 120_000);
});
