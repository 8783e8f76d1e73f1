// The browser-mode token is not on any command line (issue: `ps` showed
// --app=http://127.0.0.1:PORT/#token=…). POSIX permission bits as stat(2) reports them.
import { readFileSync, statSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { appWindowArgs, writeLaunchPage } from '../../../host/workbench/browser-mode';

describe('browser-mode launch page', () => {
  const url = `http://127.0.0.1:4321/#token=${'f'.repeat(64)}`;

  it('Chromium gets a file address only; the token is in a 0600 file inside a 0700 folder', () => {
    const launch = writeLaunchPage(url);
    const args = appWindowArgs(launch.page, '/tmp/profile');
    expect(args.join(' ')).not.toContain('f'.repeat(64));
    expect(args[0]).toMatch(/^--app=file:\/\/\/.*open\.html$/);
    // The app window answers an action without waiting a frame (host/workbench/response-flags.ts).
    expect(args).toContain('--disable-features=DeferRendererTasksAfterInput');
    expect(statSync(launch.page).mode & 0o777).toBe(0o600);
    expect(statSync(launch.page.replace(/\/open\.html$/, '')).mode & 0o777).toBe(0o700);
    expect(readFileSync(launch.page, 'utf8')).toContain(`location.replace("${url}")`);
    launch.remove();
    expect(() => statSync(launch.page)).toThrow();
  });
});
