/**
 * `twofold compare`: day 2 against day 1.
 *
 *   twofold compare DAY1 DAY2 [--json] [--band FILE] [--settings FILE]
 *   twofold compare --manifest FILE --out results.csv [--band FILE] [--settings FILE] [--workers N]
 *
 * The shell reads the files and hands bytes and text to core/ (import, analyzeTest,
 * compareTests); every number comes from core. A batch runs the pairs on worker threads (one
 * per core by default), keeps manifest order in the results, and never stops for one bad pair:
 * the pair is reported with its place and skipped. Exit 0 when the run completed and compared
 * at least one pair (skipped pairs are counted), 2 when every pair was skipped (the results
 * file still lists each with its reason) and for bad input (`FILE:LINE:COLUMN: message`) and for a refused pair (same
 * file or series for both days, day 2 before day 1 without --allow-order, `# day:` metadata
 * contradicting the slot; core/compare/refusals.ts), 1 otherwise.
 */
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { readFile } from 'node:fs/promises';
import { writeFileAtomic } from '../../host/atomic-write';
import { outputFileProblem } from '../../host/output-check';
import { availableParallelism } from 'node:os';
import { dirname, resolve } from 'node:path';
import { createRequire } from 'node:module';
import { pathToFileURL } from 'node:url';
import { isMainThread, parentPort, Worker, workerData } from 'node:worker_threads';
import { analyzeTest, noClinicalInputs } from '../../core/analyze/analyze-test';
import { settingsFromJson } from '../../core/analyze/settings-input';
import { parseBandFile } from '../../core/compare/band-file';
import { bandPreset, bandStatement, DEFAULT_BAND_TABLE } from '../../core/compare/bands';
import { verdictWords } from '../../core/compare/change-interval';
import { pageOne } from '../../core/compare/page-one';
import { CAUTIONS } from '../../core/compare/wording';
import { compareTests, comparisonJson, type Comparison } from '../../core/compare/compare-tests';
import { parseManifest, type ManifestEntry } from '../../core/compare/manifest';
import { resultsHeader, resultsRow } from '../../core/compare/results-csv';
import type { BandTable, MetricRow } from '../../core/compare/types';
import { readBreathFile } from '../../core/import/read-table';
import { refuseImpossible } from '../../core/import/sanity';
import type { TestAnalysis } from '../../core/model/analysis';
import { fail, formatLocated, locatedError, ok, type LocatedError, type Result } from '../../core/model/errors';
import { DEFAULT_SETTINGS, type Settings } from '../../core/model/settings';
import { parseFlags } from '../args';
import { EXIT_BAD_INPUT, EXIT_OK, EXIT_OTHER, UsageError, type CliIo } from '../io';

const USAGE = `usage:
  twofold compare DAY1 DAY2 [--json] [--band PRESET|FILE] [--settings FILE] [--allow-order]
  twofold compare --manifest FILE --out results.csv [--band PRESET|FILE] [--settings FILE] [--workers N]

  --json         print the comparison as one JSON object
  --band PRESET|FILE  controls-24h (default: 24-h retests of sedentary or healthy control groups),
                 healthy-30d (Decato et al. 2018: healthy adults within 30 days), or a band file
                 (twofold-band JSON: stated by the lab or written by 'twofold band')
  --allow-order  confirm that day 2 may start before day 1 (otherwise refused, exit 2)
  --settings FILE  a JSON partial of the settings (interval window, workload step, ...)
  --manifest FILE  a CSV of pairs: pair_id,day1_file,day2_file (paths relative to the manifest)
  --out FILE     where the batch writes its results CSV
  --workers N    worker threads for a batch (default: one per core)
`;

const WORKER_ROLE = 'twofold-compare-pair';

/** Read one breath file and analyse it; every failure is a located error, never a throw. */
export async function loadAnalysis(path: string, displayName: string, settings: Settings): Promise<Result<TestAnalysis>> {
  let bytes: Uint8Array;
  try {
    bytes = new Uint8Array(await readFile(path));
  } catch (error) {
    const why = (error as NodeJS.ErrnoException).code === 'ENOENT' ? 'the file does not exist' : `the file cannot be read (${(error as Error).message})`;
    return fail(locatedError('file-unreadable', displayName, null, null, `Cannot open this breath file: ${why}.`));
  }
  const imported = await readBreathFile(bytes, { sourceName: displayName, settings });
  if (!imported.ok) return imported;
  const impossible = refuseImpossible(imported.value, displayName);
  if (impossible) return fail(impossible);
  try {
    return ok(analyzeTest(imported.value.table, settings, noClinicalInputs()));
  } catch (error) {
    return fail(locatedError('analysis-failed', displayName, null, null, `The test was read but could not be analysed: ${(error as Error).message}`));
  }
}

/**
 * Settings for analysing the tests of a batch: the same as a single pair's. The day-2 calls read
 * each threshold's interval (core/compare/measurement.ts), so the breakpoint bootstrap stays on
 * even though it is most of an analysis's time (docs/performance.md).
 */
export function batchAnalysisSettings(settings: Settings): Settings {
  return settings;
}

/** Settings from --settings (merged over the defaults), or the defaults. */
export async function loadSettings(path: string | undefined, io: CliIo): Promise<Result<Settings>> {
  if (path === undefined) return ok(DEFAULT_SETTINGS);
  const text = await readText(resolve(io.cwd, path), path);
  return text.ok ? settingsFromJson(text.value, path) : text;
}

async function fileSha256(path: string): Promise<string> {
  return createHash('sha256').update(await readFile(path)).digest('hex');
}

async function readText(path: string, displayName: string): Promise<Result<string>> {
  try {
    return ok(await readFile(path, 'utf8'));
  } catch (error) {
    return fail(locatedError('file-unreadable', displayName, null, null, `Cannot open this file (${(error as NodeJS.ErrnoException).code ?? (error as Error).message}).`));
  }
}

async function loadBand(path: string | undefined, io: CliIo): Promise<Result<BandTable>> {
  if (path === undefined) return ok(DEFAULT_BAND_TABLE);
  if (!/[./\\]/.test(path)) return bandPreset(path);
  const text = await readText(resolve(io.cwd, path), path);
  return text.ok ? parseBandFile(text.value, path) : text;
}

/** A manifest entry with its paths resolved against the manifest's folder. */
export interface ResolvedPair {
  readonly pairId: string;
  readonly day1Path: string;
  readonly day2Path: string;
  readonly day1Name: string;
  readonly day2Name: string;
}

export function resolvePairs(entries: readonly ManifestEntry[], manifestPath: string): ResolvedPair[] {
  const dir = dirname(manifestPath);
  return entries.map((e) => ({ pairId: e.pairId, day1Path: resolve(dir, e.day1File), day2Path: resolve(dir, e.day2File), day1Name: e.day1File, day2Name: e.day2File }));
}

/** Read a manifest; a bad manifest is a located error. */
export async function loadManifest(path: string, io: CliIo): Promise<Result<ResolvedPair[]>> {
  const full = resolve(io.cwd, path);
  const text = await readText(full, path);
  if (!text.ok) return text;
  const parsed = parseManifest(text.value, path);
  return parsed.ok ? ok(resolvePairs(parsed.value, full)) : parsed;
}

interface PairResult {
  readonly row: string;
  readonly error: string | null;
}

function skipped(pair: ResolvedPair, error: LocatedError): PairResult {
  return { row: resultsRow({ pairId: pair.pairId, status: 'skipped', error }), error: `pair ${pair.pairId}: ${formatLocated(error)}` };
}

/** One pair of the batch; whatever goes wrong becomes a skipped row, never the end of the run. */
async function comparePair(pair: ResolvedPair, settings: Settings, band: BandTable): Promise<PairResult> {
  try {
    return await comparePairUnguarded(pair, settings, band);
  } catch (error) {
    return skipped(pair, locatedError('pair-failed', pair.day1Name, null, null, `This pair could not be compared: ${(error as Error).message}`));
  }
}

async function comparePairUnguarded(pair: ResolvedPair, settings: Settings, band: BandTable): Promise<PairResult> {
  const skip = (error: LocatedError) => skipped(pair, error);
  const analysisSettings = batchAnalysisSettings(settings);
  const day1 = await loadAnalysis(pair.day1Path, pair.day1Name, analysisSettings);
  if (!day1.ok) return skip(day1.error);
  const day2 = await loadAnalysis(pair.day2Path, pair.day2Name, analysisSettings);
  if (!day2.ok) return skip(day2.error);
  const comparison = compareTests(day1.value, day2.value, settings, band);
  return { row: resultsRow({ pairId: pair.pairId, status: 'compared', comparison }), error: null };
}

function progressLine(done: number, total: number): string {
  const width = 30;
  const filled = total === 0 ? width : Math.round((width * done) / total);
  return `\r[${'#'.repeat(filled)}${'.'.repeat(width - filled)}] ${done}/${total} pairs`;
}

/** URL of tsx's ESM register API (its package's `./esm/api` import export). */
function tsxApiUrl(): string {
  const require = createRequire(import.meta.url);
  const packageJson = require.resolve('tsx/package.json');
  const exportsField = (JSON.parse(readFileSync(packageJson, 'utf8')) as { exports: Record<string, { import: { default: string } }> }).exports;
  return pathToFileURL(resolve(dirname(packageJson), exportsField['./esm/api'].import.default)).href;
}

/**
 * A batch worker running this module. From the built command line (dist/cli/, JavaScript)
 * the worker loads the same compiled chunk straight away; run from the TypeScript sources
 * (tests, tsx) it registers tsx first.
 */
function batchWorker(data: Record<string, unknown>): Worker {
  const entry = import.meta.url;
  if (!entry.endsWith('.ts')) return new Worker(new URL(entry), { workerData: data });
  const bootstrap = `const { workerData } = require('node:worker_threads'); import(workerData.tsxApi).then((api) => { api.register(); return import(workerData.entry); });`;
  return new Worker(bootstrap, { eval: true, workerData: { ...data, tsxApi: tsxApiUrl(), entry } });
}

/** Run every pair, on worker threads when there are enough pairs to pay for starting them. */
async function runPairs(pairs: readonly ResolvedPair[], settings: Settings, band: BandTable, workers: number, onDone: (done: number) => void): Promise<PairResult[]> {
  const results: PairResult[] = new Array(pairs.length);
  let done = 0;
  if (workers <= 1 || pairs.length < 8) {
    for (let i = 0; i < pairs.length; i++) {
      results[i] = await comparePair(pairs[i], settings, band);
      onDone(++done);
    }
    return results;
  }
  let next = 0;
  await Promise.all(
    Array.from({ length: Math.min(workers, pairs.length) }, () =>
      new Promise<void>((settle) => {
        const worker = batchWorker({ role: WORKER_ROLE, settings, band });
        const feed = () => {
          if (next >= pairs.length) {
            void worker.terminate().then(() => settle());
            return;
          }
          const index = next++;
          worker.postMessage({ index, pair: pairs[index] });
        };
        worker.on('message', (msg: { ready?: true; index?: number; result?: PairResult }) => {
          if (msg.index !== undefined && msg.result) {
            results[msg.index] = msg.result;
            onDone(++done);
          }
          feed();
        });
        // A worker that fails leaves its pair unfinished; the main thread runs it below.
        worker.on('error', () => settle());
        worker.on('exit', () => settle());
      }),
    ),
  );
  for (let i = 0; i < pairs.length; i++) {
    if (results[i] === undefined) {
      results[i] = await comparePair(pairs[i], settings, band);
      onDone(++done);
    }
  }
  return results;
}

if (!isMainThread && parentPort && (workerData as { role?: string } | null)?.role === WORKER_ROLE) {
  const { settings, band } = workerData as { settings: Settings; band: BandTable };
  const port = parentPort;
  port.on('message', async (msg: { index: number; pair: ResolvedPair }) => {
    port.postMessage({ index: msg.index, result: await comparePair(msg.pair, settings, band) });
  });
  port.postMessage({ ready: true });
}

function fmt(value: number | null, digits: number): string {
  if (value === null || !Number.isFinite(value)) return '–';
  const text = value.toFixed(digits);
  // A value that rounds to zero prints without a minus sign.
  return Number(text) === 0 ? (0).toFixed(digits) : text;
}

function digitsFor(row: MetricRow): number {
  return row.unit === 'mL/min' || row.unit === 'W' || row.unit === 's' || row.unit === 'bpm' ? 0 : row.unit === '' ? 2 : 1;
}

/** The comparison as a readable table with units on every value. */
export function comparisonText(c: Comparison): string {
  const lines: string[] = [];
  lines.push(`Day 2 against day 1`, `  day 1: ${c.day1Source}`, `  day 2: ${c.day2Source}`);
  lines.push(`  interval: ${c.pairing.intervalH === null ? 'unknown' : `${c.pairing.intervalH.toFixed(1)} h`}`);
  for (const w of c.pairing.warnings) lines.push(`  ${w.severity === 'hard' ? '!! ' : 'warning: '}${w.message}`);
  const page = pageOne(c);
  lines.push(`  ${bandStatement(c.band)}`, '');
  for (const s of page.sentences) lines.push(s);
  lines.push('');
  const render = (t: { header: readonly string[]; rows: readonly (readonly string[])[] }) => {
    const widths = t.header.map((h, i) => Math.max(h.length, ...t.rows.map((r) => (i === t.header.length - 1 ? 0 : r[i].length))));
    const one = (cells: readonly string[]) => cells.map((cell, i) => (i === cells.length - 1 ? cell : i === 0 ? cell.padEnd(widths[i]) : cell.padStart(widths[i]))).join('  ');
    return [one(t.header), ...t.rows.map(one)];
  };
  if (page.primary.rows.length > 0) lines.push(...render(page.primary), '', ...render(page.secondary), '');
  const notes = c.metrics.filter((m) => m.verdict === 'not_comparable' || m.verdict === 'open').map((m) => `  ${m.label}: ${verdictWords(m.verdict)}: ${m.reason}`);
  if (c.refusals.length === 0 && notes.length > 0) lines.push('Notes:', ...notes, '');
  if (c.matched.available) {
    lines.push(`Matched workloads (incremental phase, ${c.matched.rangeW[0].toFixed(0)}–${c.matched.rangeW[1].toFixed(0)} W):`);
    lines.push(['work', 'VO2 d1', 'VO2 d2', 'HR d1', 'HR d2', 'VE d1', 'VE d2', 'RER d1', 'RER d2', 'VE/VCO2 d1', 'VE/VCO2 d2'].map((h) => h.padStart(11)).join(''));
    for (const r of c.matched.rows) {
      const v = r.values;
      const tag = r.kind === 'vt1_day1' ? ' (VT1 d1)' : r.kind === 'vt1_day2' ? ' (VT1 d2)' : '';
      lines.push(
        [`${r.workW.toFixed(0)} W`, `${fmt(v.vo2MlMin.day1, 0)}`, `${fmt(v.vo2MlMin.day2, 0)}`, fmt(v.hrBpm.day1, 0), fmt(v.hrBpm.day2, 0), fmt(v.veLMin.day1, 1), fmt(v.veLMin.day2, 1), fmt(v.rer.day1, 2), fmt(v.rer.day2, 2), fmt(v.veVco2.day1, 1), fmt(v.veVco2.day2, 1)]
          .map((s) => s.padStart(11))
          .join('') + tag,
      );
    }
    lines.push('  units: VO2 mL/min, HR bpm, VE L/min; RER and VE/VCO2 unitless', '');
  } else {
    lines.push(`Matched workloads: ${c.matched.reason}`, '');
  }
  lines.push('Summary:', c.summary, '', `Cautions: ${CAUTIONS}`, '');
  return lines.join('\n');
}

async function runBatch(manifestPath: string, outPath: string, settings: Settings, band: BandTable, workers: number, io: CliIo): Promise<number> {
  const pairs = await loadManifest(manifestPath, io);
  if (!pairs.ok) {
    io.err(`${formatLocated(pairs.error)}\n`);
    return EXIT_BAD_INPUT;
  }
  const total = pairs.value.length;
  const started = performance.now();
  const onDone = (done: number) => {
    if (io.interactive) io.err(progressLine(done, total));
  };
  const results = await runPairs(pairs.value, settings, band, workers, onDone);
  if (io.interactive) io.err('\n');
  const skipped = results.filter((r) => r.error !== null);
  for (const r of skipped) io.err(`skipped ${r.error}\n`);
  try {
    writeFileAtomic(resolve(io.cwd, outPath), `${[resultsHeader(), ...results.map((r) => r.row)].join('\n')}\n`);
  } catch (error) {
    io.err(`twofold compare: cannot write ${outPath}: ${(error as Error).message}\n`);
    return EXIT_OTHER;
  }
  const seconds = (performance.now() - started) / 1000;
  io.err(`Compared ${total - skipped.length} of ${total} pairs in ${seconds.toFixed(1)} s; skipped ${skipped.length}${skipped.length ? ' (listed above)' : ''}. ${bandStatement(band)} Results: ${outPath}\n`);
  if (total > 0 && skipped.length === total) {
    io.err(`twofold compare: no pair could be compared (all ${total} skipped), so the run produced no comparison.\n`);
    return EXIT_BAD_INPUT;
  }
  return EXIT_OK;
}

export async function run(args: string[], io: CliIo): Promise<number> {
  const { values, positionals } = parseFlags(args, {
    json: { type: 'boolean' },
    band: { type: 'string' },
    settings: { type: 'string' },
    manifest: { type: 'string' },
    out: { type: 'string' },
    workers: { type: 'string' },
    'allow-order': { type: 'boolean' },
    help: { type: 'boolean', short: 'h' },
  });
  if (values.help) {
    io.out(USAGE);
    return EXIT_OK;
  }
  const settings = await loadSettings(values.settings, io);
  if (!settings.ok) {
    io.err(`${formatLocated(settings.error)}\n`);
    return EXIT_BAD_INPUT;
  }
  const band = await loadBand(values.band, io);
  if (!band.ok) {
    io.err(`${formatLocated(band.error)}\n`);
    return EXIT_BAD_INPUT;
  }

  if (values.manifest !== undefined) {
    if (positionals.length > 0) throw new UsageError(`give either --manifest or two files, not both\n${USAGE}`);
    if (values.out === undefined) throw new UsageError(`--manifest needs --out FILE for the results\n${USAGE}`);
    // The results file's destination is checked before any pair is analysed.
    {
      const outProblem = outputFileProblem(resolve(io.cwd, values.out));
      if (outProblem) {
        io.err(`${resolve(io.cwd, values.out)}:0:0: ${outProblem} Nothing was written.\n`);
        return EXIT_BAD_INPUT;
      }
    }
    if (values.json) throw new UsageError('--json is for a single pair; a batch writes its results to --out');
    const workers = values.workers === undefined ? availableParallelism() : Number(values.workers);
    if (!Number.isInteger(workers) || workers < 1) throw new UsageError(`--workers expects a whole number of at least 1, got '${values.workers}'`);
    return runBatch(values.manifest, values.out, settings.value, band.value, workers, io);
  }
  if (values.out !== undefined || values.workers !== undefined) throw new UsageError(`--out and --workers belong to a batch (--manifest)\n${USAGE}`);
  if (positionals.length !== 2) throw new UsageError(`expected two breath files, day 1 then day 2\n${USAGE}`);

  const [file1, file2] = positionals;
  const day1 = await loadAnalysis(resolve(io.cwd, file1), file1, settings.value);
  if (!day1.ok) {
    io.err(`${formatLocated(day1.error)}\n`);
    return EXIT_BAD_INPUT;
  }
  const day2 = await loadAnalysis(resolve(io.cwd, file2), file2, settings.value);
  if (!day2.ok) {
    io.err(`${formatLocated(day2.error)}\n`);
    return EXIT_BAD_INPUT;
  }
  const [sha1, sha2] = await Promise.all([fileSha256(resolve(io.cwd, file1)), fileSha256(resolve(io.cwd, file2))]);
  const comparison = compareTests(day1.value, day2.value, settings.value, band.value, { day1Sha256: sha1, day2Sha256: sha2, allowOrder: values['allow-order'] === true });
  if (comparison.refusals.length > 0) {
    for (const r of comparison.refusals) io.err(`twofold compare: refused (${r.code}): ${r.message}\n`);
    return EXIT_BAD_INPUT;
  }
  io.out(values.json ? `${JSON.stringify(comparisonJson(comparison), null, 2)}\n` : comparisonText(comparison));
  return EXIT_OK;
}
