/**
 * The e2e harness: builds the page when renderer/dist is missing or stale, starts browser
 * mode on a free 127.0.0.1 port with a throw-away data folder, and launches Debian's
 * Chromium headless with the flags that stop it calling out, and with the setting Twofold's
 * own windows start with (host/workbench/response-flags.ts), so the timing is the product's.
 *
 * Screenshots: every e2e run takes them (drawing a page is part of the test), but writes
 * them to the tracked docs/screenshots/ only when asked, so an ordinary run leaves git
 * clean:
 *
 *     TWOFOLD_SCREENSHOTS=docs npx vitest run tests/e2e     # refresh docs/screenshots/*.png
 *
 * Otherwise they go to twofold-e2e-screenshots-UID/ in the system temporary folder (one per
 * user), kept for a look after the run.
 */
import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium, type Browser, type Page } from 'playwright-core';
import { ensureRenderer } from '../../host/workbench/renderer-build';
import { startBrowserMode } from '../../host/workbench/browser-mode';
import { RESPONSE_FLAGS } from '../../host/workbench/response-flags';
import type { RunningBridge } from '../../host/workbench/http-bridge';

export const ROOT = fileURLToPath(new URL('../..', import.meta.url));
/** Set to `docs` to refresh the tracked screenshots in docs/screenshots/ (see above). */
export const SCREENSHOTS_ENV = 'TWOFOLD_SCREENSHOTS';

/** Where this run writes its screenshots: docs/screenshots/ when asked, a temporary folder otherwise. */
export function screenshotFolder(env: NodeJS.ProcessEnv = process.env): string {
  if (env[SCREENSHOTS_ENV] === 'docs') return join(ROOT, 'docs', 'screenshots');
  const dir = join(tmpdir(), `twofold-e2e-screenshots-${process.getuid?.() ?? 'user'}`);
  mkdirSync(dir, { recursive: true });
  return dir;
}

export const SCREENSHOTS = screenshotFolder();

/** Chromium's PDF viewer: its component extension and the browser's own shared resources. */
const BUILT_IN_PDF_VIEWER = ['chrome-extension://mhjfbmdgcfjbbpaeojofohoefgiehjai/', 'chrome://resources/'];

export interface Workbench {
  readonly bridge: RunningBridge;
  readonly browser: Browser;
  readonly dataDir: string;
  /**
   * Every URL the page asked for that is not this run's own origin, data:, blob: of it, or a
   * resource of Chromium's built-in PDF viewer (the report preview), which are files inside
   * the browser, not network requests.
   */
  readonly outside: string[];
  /** How many built-in PDF-viewer resources were loaded (shown by the preview). */
  readonly builtIn: string[];
  newPage(): Promise<Page>;
  close(): Promise<void>;
}

export async function startWorkbench(): Promise<Workbench> {
  const distDir = await ensureRenderer(ROOT);
  const dataDir = mkdtempSync(join(tmpdir(), 'twofold-e2e-'));
  const bridge = await startBrowserMode({ dataDir, distDir });
  const browser = await chromium.launch({
    executablePath: '/usr/bin/chromium',
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', ...RESPONSE_FLAGS],
  });
  const origin = `http://127.0.0.1:${bridge.port}/`;
  const outside: string[] = [];
  const builtIn: string[] = [];
  return {
    bridge,
    browser,
    dataDir,
    outside,
    builtIn,
    async newPage() {
      const page = await browser.newPage({ viewport: { width: 1440, height: 1000 } });
      page.on('request', (request) => {
        const url = request.url();
        if (url.startsWith(origin) || url.startsWith(`blob:${origin}`) || url.startsWith('data:')) return;
        if (BUILT_IN_PDF_VIEWER.some((prefix) => url.startsWith(prefix))) builtIn.push(url);
        else outside.push(url);
      });
      return page;
    },
    async close() {
      await browser.close();
      await bridge.close();
      rmSync(dataDir, { recursive: true, force: true });
    },
  };
}

/** Text of a cell, as a number: "1,299 mL/min" → 1299, "−346 mL/min" → −346. */
export function numberIn(text: string | null): number {
  const match = /([−-]?)([0-9][0-9,]*(?:\.[0-9]+)?)/.exec(text ?? '');
  if (!match) return Number.NaN;
  const value = Number(match[2].replace(/,/g, ''));
  return match[1] ? -value : value;
}
