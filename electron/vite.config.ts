/**
 * Build of the Electron side into electron/dist, in two parts (`--mode main`, `--mode preload`):
 * - the main process as an ES module (`main.mjs`), packages left external (they sit in
 *   node_modules beside it; some use top-level await, which CommonJS cannot hold);
 * - the preload as one self-contained CommonJS file (`preload.cjs`), which is what a
 *   sandboxed preload must be: only `electron` stays external.
 */
import { defineConfig } from 'vite';
import { builtinModules } from 'node:module';
import { fileURLToPath } from 'node:url';

const here = fileURLToPath(new URL('.', import.meta.url));
const builtins = ['electron', ...builtinModules, ...builtinModules.map((m) => `node:${m}`)];

export default defineConfig(({ mode }) => {
  const preload = mode === 'preload';
  return {
    root: here,
    build: {
      outDir: 'dist',
      emptyOutDir: false,
      target: 'node20',
      ssr: true,
      minify: false,
      rollupOptions: {
        input: { [preload ? 'preload' : 'main']: `${here}${preload ? 'preload' : 'main'}.ts` },
        external: builtins,
        output: { format: preload ? 'cjs' : 'es', entryFileNames: preload ? '[name].cjs' : '[name].mjs' },
      },
    },
    ssr: preload ? { noExternal: true } : {},
  };
});
