/**
 * Browser mode, for machines without the Electron runtime: the workbench page and the host
 * interface on 127.0.0.1 (a free port), protected by a per-run random token, opened in
 * Chromium's app mode when Chromium and a display are present. Chromium gets its own
 * throw-away profile and the flags that stop it calling out (background networking,
 * component updates, sync), and answers an action without waiting a frame (response-flags.ts).
 *
 * The address with the token never appears in a process's arguments (which every local user
 * can read with `ps`): Chromium is started on a launch page, a file in a folder only this
 * user can open (0700, the file 0600), which forwards to the address; the file is deleted a
 * minute later or when the window closes, whichever comes first.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { chmodSync, existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { pathToFileURL } from 'node:url';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { startBridge, type RunningBridge } from './http-bridge';
import { createWiredService, newToken } from './wiring';
import { RESPONSE_FLAGS } from './response-flags';

export interface BrowserModeOptions {
  readonly dataDir: string;
  readonly distDir: string;
  readonly port?: number;
}

export async function startBrowserMode(options: BrowserModeOptions): Promise<RunningBridge> {
  return startBridge({ service: createWiredService({ dataDir: options.dataDir }), distDir: options.distDir, token: newToken(), port: options.port ?? 0 });
}

export const CHROMIUM_QUIET_FLAGS = ['--no-first-run', '--no-default-browser-check', '--disable-background-networking', '--disable-component-update', '--disable-sync'] as const;

export function findChromium(candidates: readonly string[] = ['/usr/bin/chromium', '/usr/bin/chromium-browser']): string | null {
  return candidates.find((path) => existsSync(path)) ?? null;
}

/**
 * Opens the address as an app window; returns null when there is no Chromium or no display.
 * `chromium`: the browser to start (found on this machine unless given).
 */
export function openAppWindow(url: string, env: Readonly<Record<string, string | undefined>>, chromium: string | null = findChromium()): ChildProcess | null {
  if (!chromium || !(env.DISPLAY || env.WAYLAND_DISPLAY)) return null;
  const profile = mkdtempSync(join(tmpdir(), 'twofold-chromium-'));
  const launch = writeLaunchPage(url);
  const child = spawn(chromium, appWindowArgs(launch.page, profile), { stdio: 'ignore', detached: false });
  const timer = setTimeout(launch.remove, 60_000);
  timer.unref();
  child.once('exit', launch.remove);
  return child;
}

/** Chromium's arguments: the launch page's file address, never the tokened address itself. */
export function appWindowArgs(launchPage: string, profile: string): string[] {
  return [`--app=${pathToFileURL(launchPage).href}`, `--user-data-dir=${profile}`, ...CHROMIUM_QUIET_FLAGS, ...RESPONSE_FLAGS];
}

/** A page that forwards to `url`, in a fresh 0700 folder, itself 0600. */
export function writeLaunchPage(url: string): { page: string; remove: () => void } {
  const dir = mkdtempSync(join(tmpdir(), 'twofold-launch-'));
  chmodSync(dir, 0o700);
  const page = join(dir, 'open.html');
  const quoted = JSON.stringify(url).replace(/</g, '\\u003c');
  writeFileSync(page, `<!doctype html><meta charset="utf-8"><title>Twofold</title><script>location.replace(${quoted});</script>\n`, { mode: 0o600 });
  return { page, remove: () => rmSync(dir, { recursive: true, force: true }) };
}
