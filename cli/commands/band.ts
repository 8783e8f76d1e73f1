/**
 * `twofold band MANIFEST --out band.json [--settings FILE]`: a lab's own test-retest band from
 * its repeat tests. Each manifest pair (same person, same protocol, tested twice) is analysed;
 * per metric, the pairs on which the metric is comparable (threshold found on both days, two
 * maximal efforts for a peak metric, same subject) give the statistics of
 * core/compare/band-stats.ts (Hopkins 2000; Weir 2005), written as a twofold-band file that
 * `twofold compare --band` reads. An unreadable pair is reported with its place and skipped.
 * Exit 0 when the run completed, 2 for bad input, 1 otherwise.
 */
import { writeFileAtomic } from '../../host/atomic-write';
import { outputFileProblem } from '../../host/output-check';
import { resolve } from 'node:path';
import { repeatStats, type RepeatPair, type RepeatStats } from '../../core/compare/band-stats';
import { writeDerivedBandFile } from '../../core/compare/band-file';
import { METRICS } from '../../core/compare/metric-catalog';
import { compareMetrics } from '../../core/compare/metrics';
import { pairTests } from '../../core/compare/pairing';
import type { MetricId } from '../../core/compare/types';
import { formatLocated } from '../../core/model/errors';
import { parseFlags } from '../args';
import { EXIT_BAD_INPUT, EXIT_OK, EXIT_OTHER, UsageError, type CliIo } from '../io';
import { batchAnalysisSettings, loadAnalysis, loadManifest, loadSettings } from './compare';

const USAGE = `usage: twofold band MANIFEST --out band.json [--settings FILE]

  MANIFEST       a CSV of repeat-test pairs: pair_id,day1_file,day2_file (paths relative to it)
  --out FILE     where to write the band file (twofold-band JSON, read by 'twofold compare --band')
  --settings FILE  a JSON partial of the settings used to analyse every test
`;

function fmt(value: number | null, digits: number): string {
  return value === null || !Number.isFinite(value) ? '–' : value.toFixed(digits);
}

export async function run(args: string[], io: CliIo): Promise<number> {
  const { values, positionals } = parseFlags(args, { out: { type: 'string' }, settings: { type: 'string' }, help: { type: 'boolean', short: 'h' } });
  if (values.help) {
    io.out(USAGE);
    return EXIT_OK;
  }
  if (positionals.length !== 1) throw new UsageError(`expected one manifest file\n${USAGE}`);
  if (values.out === undefined) throw new UsageError(`--out FILE is required\n${USAGE}`);
  // The band file's destination is checked before any test is analysed.
  {
    const outProblem = outputFileProblem(resolve(io.cwd, values.out));
    if (outProblem) {
      io.err(`${resolve(io.cwd, values.out)}:0:0: ${outProblem} Nothing was written.\n`);
      return EXIT_BAD_INPUT;
    }
  }
  const settings = await loadSettings(values.settings, io);
  if (!settings.ok) {
    io.err(`${formatLocated(settings.error)}\n`);
    return EXIT_BAD_INPUT;
  }
  const pairs = await loadManifest(positionals[0], io);
  if (!pairs.ok) {
    io.err(`${formatLocated(pairs.error)}\n`);
    return EXIT_BAD_INPUT;
  }

  const collected = new Map<MetricId, RepeatPair[]>(METRICS.map((m) => [m.id, []]));
  let skipped = 0;
  let done = 0;
  const analysisSettings = batchAnalysisSettings(settings.value);
  for (const pair of pairs.value) {
    const day1 = await loadAnalysis(pair.day1Path, pair.day1Name, analysisSettings);
    const day2 = day1.ok ? await loadAnalysis(pair.day2Path, pair.day2Name, analysisSettings) : null;
    if (!day1.ok || !day2 || !day2.ok) {
      skipped++;
      const error = !day1.ok ? day1.error : day2 && !day2.ok ? day2.error : null;
      if (error) io.err(`${io.interactive ? '\n' : ''}skipped pair ${pair.pairId}: ${formatLocated(error)}\n`);
    } else if (pairTests(day1.value, day2.value, settings.value).hardMismatch) {
      skipped++;
      io.err(`${io.interactive ? '\n' : ''}skipped pair ${pair.pairId}: the two tests carry different subject ids, so they are not a repeat test\n`);
    } else {
      for (const row of compareMetrics(day1.value, day2.value)) {
        if (row.verdict !== 'not_comparable' && row.day1 !== null && row.day2 !== null) collected.get(row.id)!.push({ day1: row.day1, day2: row.day2 });
      }
    }
    done++;
    if (io.interactive) io.err(`\r${done}/${pairs.value.length} pairs analysed`);
  }
  if (io.interactive) io.err('\n');

  const stats: Partial<Record<MetricId, RepeatStats>> = {};
  const lines: string[] = [];
  lines.push(['metric', 'n', 'mean change', 'typical error', 'CV %', 'ICC(3,1)', 'MDC95', 'MDC95 %'].join('\t'));
  for (const m of METRICS) {
    const s = repeatStats(collected.get(m.id)!);
    if (s === null || !Number.isFinite(s.cvPct) || s.cvPct <= 0) {
      lines.push(`${m.id}\t${collected.get(m.id)!.length}\tnot enough comparable pairs (or no variation) for a band; compare falls back to the default table`);
      continue;
    }
    stats[m.id] = s;
    lines.push([m.id, s.n, fmt(s.meanChange, 2), fmt(s.typicalError, 2), fmt(s.cvPct, 2), fmt(s.icc31, 3), fmt(s.mdc95, 2), fmt(s.mdc95Pct, 1)].join('\t'));
  }
  const used = pairs.value.length - skipped;
  const text = writeDerivedBandFile(stats, `${used} repeat pairs from ${positionals[0]}`);
  try {
    writeFileAtomic(resolve(io.cwd, values.out), text);
  } catch (error) {
    io.err(`twofold band: cannot write ${values.out}: ${(error as Error).message}\n`);
    return EXIT_OTHER;
  }
  io.out(`${lines.join('\n')}\n\nBand from ${used} of ${pairs.value.length} pairs (skipped ${skipped}); CV by the log-transformed method where every value is positive (Hopkins 2000); SEM = typical error; MDC95 = 1.96 × √2 × SEM (Weir 2005). Written to ${values.out}.\n`);
  return EXIT_OK;
}
