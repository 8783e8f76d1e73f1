/**
 * Build of the workbench page. Relative base so the same build loads from the Electron
 * app protocol, from file:// and from the browser mode's 127.0.0.1 server. Everything is
 * bundled (charts, fonts none remote), so the page runs fully offline.
 */
import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import { fileURLToPath } from 'node:url';

export default defineConfig({
  root: fileURLToPath(new URL('.', import.meta.url)),
  base: './',
  plugins: [react()],
  worker: { format: 'es' },
  build: {
    outDir: 'dist',
    emptyOutDir: true,
    target: 'es2022',
    chunkSizeWarningLimit: 6000,
    sourcemap: false,
  },
});
