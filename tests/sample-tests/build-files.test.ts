// Sample generation is deterministic (same seeds → byte-identical files) and the files in
// the tree are the ones the generator makes now (so a changed model cannot hide behind old files).
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, test } from 'vitest';
import { buildSampleFiles } from '../../sample-tests/build-files';

const root = join(__dirname, '../../sample-tests');

describe('generated sample files', () => {
  test('two runs give byte-identical files', async () => {
    const a = await buildSampleFiles();
    const b = await buildSampleFiles();
    expect(b.map((f) => f.path)).toEqual(a.map((f) => f.path));
    a.forEach((f, i) => expect(Buffer.from(b[i].bytes).equals(Buffer.from(f.bytes))).toBe(true));
  });

  test('the files in sample-tests/ match a fresh run (run `npm run generate-samples` after a model change)', async () => {
    for (const f of await buildSampleFiles()) {
      expect(Buffer.from(readFileSync(join(root, f.path))).equals(Buffer.from(f.bytes)), f.path).toBe(true);
    }
  });

  test('every demo test has its truth beside it, and each outlier line in the CSV is the outlier breath', async () => {
    const files = await buildSampleFiles();
    const csvs = files.filter((f) => f.path.startsWith('demo/') && f.path.endsWith('.csv'));
    expect(csvs).toHaveLength(6);
    for (const csv of csvs) {
      const truthFile = files.find((f) => f.path === csv.path.replace(/\.csv$/, '.truth.json'));
      expect(truthFile, csv.path).toBeDefined();
      const truth = JSON.parse(new TextDecoder().decode(truthFile!.bytes));
      const lines = new TextDecoder().decode(csv.bytes).split('\n');
      for (const o of truth.outliers) expect(Number(lines[o.csvLine - 1].split(',')[0])).toBe(o.timeS);
    }
  });
});
