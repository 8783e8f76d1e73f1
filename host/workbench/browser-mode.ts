/**
 * Browser mode, for machines without the Electron runtime: the workbench page and the host
 * interface on 127.0.0.1 (a free port), protected by a per-run random token, opened in
 * Chromium's app mode when Chromium and a display are present. Chromium gets its own
 * throw-away profile and the flags that stop it calling out (background networking,
 * component updates, sync).
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { startBridge, type RunningBridge } from './http-bridge';
import { createWiredService, newToken } from './wiring';

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

/** Opens the address as an app window; returns null when there is no Chromium or no display. */
export function openAppWindow(url: string, env: Readonly<Record<string, string | undefined>>): ChildProcess | null {
  const chromium = findChromium();
  if (!chromium || !(env.DISPLAY || env.WAYLAND_DISPLAY)) return null;
  const profile = mkdtempSync(join(tmpdir(), 'twofold-chromium-'));
  return spawn(chromium, [`--app=${url}`, `--user-data-dir=${profile}`, ...CHROMIUM_QUIET_FLAGS], { stdio: 'ignore', detached: false });
}
