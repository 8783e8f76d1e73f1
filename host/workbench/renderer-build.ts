/**
 * Building the workbench page when it is missing or older than its sources. The page bundles
 * core/ (the analysis worker runs it), so core's files count as sources too.
 */
import { existsSync, mkdirSync, readdirSync, rmdirSync, statSync } from 'node:fs';
import { join } from 'node:path';

const SOURCES = ['renderer/src', 'renderer/index.html', 'renderer/vite.config.ts', 'core', 'host/workbench/api.ts'];

function newestMtimeMs(path: string): number {
  if (!existsSync(path)) return 0;
  const stat = statSync(path);
  if (!stat.isDirectory()) return stat.mtimeMs;
  let newest = stat.mtimeMs;
  for (const entry of readdirSync(path)) newest = Math.max(newest, newestMtimeMs(join(path, entry)));
  return newest;
}

export function rendererDist(root: string): string {
  return join(root, 'renderer', 'dist');
}

/** True when renderer/dist/index.html is missing or older than any source file. */
export function rendererIsStale(root: string): boolean {
  const built = join(rendererDist(root), 'index.html');
  if (!existsSync(built)) return true;
  const builtAt = statSync(built).mtimeMs;
  return SOURCES.some((s) => newestMtimeMs(join(root, s)) > builtAt);
}

/**
 * Runs the Vite build of renderer/ (quietly) and returns the output folder. Always a
 * production build: Vite takes NODE_ENV from the environment when it is set (vitest sets
 * "test"), and would then bundle React's development build and its development JSX, several
 * times slower to render, into a page that `npm start` later serves as it is.
 */
export async function buildRenderer(root: string): Promise<string> {
  const { build } = await import('vite');
  const nodeEnv = process.env.NODE_ENV;
  process.env.NODE_ENV = 'production';
  try {
    await build({ configFile: join(root, 'renderer', 'vite.config.ts'), logLevel: 'warn', mode: 'production' });
  } finally {
    if (nodeEnv === undefined) delete process.env.NODE_ENV;
    else process.env.NODE_ENV = nodeEnv;
  }
  return rendererDist(root);
}

/**
 * Builds when stale. Two processes (two test files, or a test and `npm start`) may ask at
 * once: a lock folder (mkdir is atomic) lets one build while the other waits and then finds
 * the build fresh. A lock older than five minutes is taken to be left by a killed build.
 */
export async function ensureRenderer(root: string): Promise<string> {
  const lock = join(root, 'renderer', '.build-lock');
  for (;;) {
    try {
      mkdirSync(lock);
      break;
    } catch {
      if (existsSync(lock) && Date.now() - statSync(lock).mtimeMs > 5 * 60_000) rmdirSync(lock);
      await new Promise((resolve) => setTimeout(resolve, 250));
    }
  }
  try {
    return rendererIsStale(root) ? await buildRenderer(root) : rendererDist(root);
  } finally {
    rmdirSync(lock);
  }
}
