#!/usr/bin/env node
// `npm start`: the Twofold workbench. With the Electron runtime present, builds the main
// process and preload and opens the desktop window. Without it (this machine cannot download
// it), builds the page, serves it and the host interface on 127.0.0.1 with a per-run token,
// and opens it in Chromium's app mode when Chromium and a display exist; otherwise prints
// the address to open.
//
// Options (environment): TWOFOLD_DATA_DIR (cases, mappings, certificates; default
// $XDG_DATA_HOME/twofold or ~/.local/share/twofold), TWOFOLD_PORT (browser mode; default a
// free port), TWOFOLD_NO_WINDOW=1 (browser mode: only print the address).
import { spawn } from 'node:child_process';
import { existsSync, mkdirSync } from 'node:fs';
import { createRequire } from 'node:module';
import { homedir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { register } from 'tsx/esm/api';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const require = createRequire(import.meta.url);

function electronBinary() {
  try {
    const path = require('electron');
    return typeof path === 'string' && existsSync(path) ? path : null;
  } catch {
    return null; // the package is installed for its types; its runtime download failed or never ran
  }
}

async function viteBuild(configFile, mode) {
  const { build } = await import('vite');
  await build({ configFile, mode, logLevel: 'warn' });
}

const dataDir = process.env.TWOFOLD_DATA_DIR ?? join(process.env.XDG_DATA_HOME ?? join(homedir(), '.local', 'share'), 'twofold');
// Cases, certificates and mappings: this user's only (0700).
mkdirSync(dataDir, { recursive: true, mode: 0o700 });

register();
const { ensureRenderer } = await import('../host/workbench/renderer-build.ts');
const distDir = await ensureRenderer(root);

const electron = electronBinary();
if (electron) {
  await viteBuild(join(root, 'electron', 'vite.config.ts'), 'main');
  await viteBuild(join(root, 'electron', 'vite.config.ts'), 'preload');
  const child = spawn(electron, [join(root, 'electron', 'dist', 'main.mjs')], { stdio: 'inherit' });
  child.on('exit', (code) => process.exit(code ?? 0));
} else {
  const { startBrowserMode, openAppWindow } = await import('../host/workbench/browser-mode.ts');
  const bridge = await startBrowserMode({ dataDir, distDir, port: Number(process.env.TWOFOLD_PORT ?? 0) });
  console.log('Twofold workbench (browser mode: the Electron runtime is not installed here).');
  console.log(`Cases are kept in ${dataDir}`);
  console.log(`Open: ${bridge.url}`);
  console.log('The address carries this run\'s access key; it stops working when this process ends. Ctrl+C to stop.');
  const window = process.env.TWOFOLD_NO_WINDOW === '1' ? null : openAppWindow(bridge.url, process.env);
  if (window) console.log('Opened in a Chromium app window.');
  const stop = async () => {
    window?.kill();
    await bridge.close();
    process.exit(0);
  };
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
}
