/**
 * `npm run bench`: runs every bench/*.ts module except this one and prints its figures.
 * Each module exports `run(): Promise<string[]>`, lines of results for docs/performance.md.
 */
import { readdirSync } from 'node:fs';
import { loadavg } from 'node:os';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { dirname, join } from 'node:path';

const here = dirname(fileURLToPath(import.meta.url));
const only = process.argv[2];
for (const file of readdirSync(here).filter((f) => f.endsWith('.ts') && f !== 'run.ts').sort()) {
  if (only && !file.startsWith(only)) continue;
  const mod = (await import(pathToFileURL(join(here, file)).href)) as { run: () => Promise<string[]> };
  console.log(`## ${file.replace(/\.ts$/, '')} (load average at start: ${loadavg().map((x) => x.toFixed(1)).join(' ')})`);
  for (const line of await mod.run()) console.log(line);
  console.log('');
}
