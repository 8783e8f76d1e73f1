/**
 * `npm run generate-samples`: writes every generated sample file under sample-tests/
 * (demo tests with their truth, and the layout variants). Deterministic: running it twice
 * gives byte-identical files.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { buildSampleFiles } from './build-files';

const here = dirname(fileURLToPath(import.meta.url));
for (const file of await buildSampleFiles()) {
  const target = join(here, file.path);
  mkdirSync(dirname(target), { recursive: true });
  writeFileSync(target, file.bytes);
  console.log(`wrote sample-tests/${file.path} (${file.bytes.length} bytes)`);
}
