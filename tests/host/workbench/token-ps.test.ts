// The browser-mode token is in no process's arguments, as `ps` shows them to every local user
// (issue: `--app=http://127.0.0.1:PORT/#token=…` was readable in the process list). A real
// process is started the way openAppWindow starts Chromium, with a stand-in browser (a shell
// script that waits), and the whole process table is read with procps `ps -eww -o pid=,args=`.
import { execFileSync } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { chmodSync, existsSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { openAppWindow } from '../../../host/workbench/browser-mode';

describe('the token in the process list', () => {
  it("ps shows the window's launch page address, and the token nowhere", async () => {
    const token = randomBytes(32).toString('hex');
    const dir = mkdtempSync(join(tmpdir(), 'twofold-ps-'));
    const browser = join(dir, 'stand-in-browser');
    // The shell keeps its arguments in the process table while it waits; on TERM it ends its sleep too.
    writeFileSync(browser, '#!/bin/sh\nsleep 30 &\ntrap \'kill $!; exit 0\' TERM\nwait\n');
    chmodSync(browser, 0o700);
    const child = openAppWindow(`http://127.0.0.1:4321/#token=${token}`, { DISPLAY: ':99' }, browser);
    expect(child).not.toBeNull();
    try {
      // Give the shell a moment to start.
      await new Promise((r) => setTimeout(r, 300));
      const table = execFileSync('ps', ['-eww', '-o', 'pid=,args='], { encoding: 'utf8' });
      const line = table.split('\n').find((l) => l.trim().startsWith(`${child!.pid} `)) ?? '';
      // The check can fail: ps does show this process's arguments, the launch page among them.
      expect(line).toMatch(/--app=file:\/\/\/.*\/open\.html/);
      expect(table).not.toContain(token);
      const page = /--app=file:\/\/(\S+open\.html)/.exec(line)![1];
      expect(existsSync(page)).toBe(true);
      child!.kill();
      await new Promise((r) => child!.once('exit', r));
      // The launch page (holding the token) goes with the window.
      expect(existsSync(page)).toBe(false);
    } finally {
      child?.kill();
    }
  });
});
