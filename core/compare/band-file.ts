/**
 * Twofold's band file (JSON, our own format; documented in docs/comparison.md):
 *
 *   { "format": "twofold-band", "version": 1,
 *     "origin": "lab-stated" | "lab-derived",
 *     "description": "what this band is",
 *     "population": "who was retested", "retest_interval": "24 h",
 *     "statistic": "what the numbers are", "source": "where the table comes from",
 *     "metrics": { "<metric id>": { "cv_pct": 6.5, "source": "where it comes from",
 *                                    "mean_change_pct": 1.5,   (optional; the band centres on it)
 *                                    "stats": { ...repeat-test statistics, optional } } } }
 *
 * A lab states its own band by writing such a file; `twofold band` writes one derived from
 * the lab's repeat tests. Parsing never throws: a problem comes back as a located error.
 */
import { fail, locatedError, ok, type LocatedError, type Result } from '../model/errors';
import { isMetricId } from './metric-catalog';
import type { RepeatStats } from './band-stats';
import type { BandEntry, BandTable, MetricId } from './types';

export const BAND_FORMAT = 'twofold-band';
export const BAND_FORMAT_VERSION = 1;

/** 1-based line and column of a character offset. */
function lineColumn(text: string, offset: number): { line: number; column: number } {
  let line = 1;
  let column = 1;
  for (let i = 0; i < Math.min(offset, text.length); i++) {
    if (text[i] === '\n') {
      line++;
      column = 1;
    } else column++;
  }
  return { line, column };
}

/** Where a key first appears in the text, so an error can point at it. */
function keyPlace(text: string, key: string): { line: number | null; column: number | null } {
  const at = text.indexOf(`"${key}"`);
  if (at < 0) return { line: null, column: null };
  return lineColumn(text, at);
}

function jsonError(text: string, file: string, error: unknown): LocatedError {
  const message = error instanceof Error ? error.message : String(error);
  const lc = /line (\d+) column (\d+)/.exec(message);
  const pos = /position (\d+)/.exec(message);
  const place = lc ? { line: Number(lc[1]), column: Number(lc[2]) } : pos ? lineColumn(text, Number(pos[1])) : { line: null, column: null };
  return locatedError('band-json', file, place.line, place.column, `The band file is not valid JSON (${message}).`);
}

export function parseBandFile(text: string, file: string): Result<BandTable> {
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch (error) {
    return fail(jsonError(text, file, error));
  }
  const at = (key: string, code: string, message: string) => {
    const p = keyPlace(text, key);
    return fail<BandTable>(locatedError(code, file, p.line, p.column, message));
  };
  if (typeof data !== 'object' || data === null || Array.isArray(data)) {
    return fail(locatedError('band-shape', file, 1, 1, 'A band file is one JSON object with "format", "version" and "metrics".'));
  }
  const obj = data as Record<string, unknown>;
  if (obj.format !== BAND_FORMAT) return at('format', 'band-format', `Expected "format": "${BAND_FORMAT}".`);
  if (obj.version !== BAND_FORMAT_VERSION) return at('version', 'band-version', `Expected "version": ${BAND_FORMAT_VERSION}; this Twofold reads version ${BAND_FORMAT_VERSION} band files only.`);
  const origin = obj.origin ?? 'lab-stated';
  if (origin !== 'lab-stated' && origin !== 'lab-derived') return at('origin', 'band-origin', '"origin" must be "lab-stated" or "lab-derived".');
  const description = typeof obj.description === 'string' ? obj.description : `band file ${file}`;
  const metrics = obj.metrics;
  if (typeof metrics !== 'object' || metrics === null || Array.isArray(metrics)) return at('metrics', 'band-metrics', '"metrics" must be an object keyed by metric id.');
  const entries: Partial<Record<MetricId, BandEntry>> = {};
  for (const [id, raw] of Object.entries(metrics as Record<string, unknown>)) {
    if (!isMetricId(id)) return at(id, 'band-metric-id', `"${id}" is not a metric Twofold compares; see docs/comparison.md for the list.`);
    const entry = raw as Record<string, unknown> | null;
    const cv = entry && typeof entry === 'object' ? entry.cv_pct : undefined;
    if (typeof cv !== 'number' || !Number.isFinite(cv) || cv <= 0 || cv >= 100) {
      return at(id, 'band-cv', `"${id}" needs "cv_pct", a within-subject CV in percent greater than 0 and below 100.`);
    }
    const source = typeof entry?.source === 'string' && entry.source.trim() !== '' ? entry.source : null;
    if (source === null) return at(id, 'band-source', `"${id}" needs a "source" saying where its CV comes from.`);
    const mean = entry?.mean_change_pct;
    if (mean !== undefined && (typeof mean !== 'number' || !Number.isFinite(mean) || mean <= -100)) {
      return at(id, 'band-mean-change', `"${id}": "mean_change_pct" must be a number above −100 (the population's mean day-2 change in percent).`);
    }
    entries[id] = { cvPct: cv, source, ...(typeof mean === 'number' ? { meanChangePct: mean } : {}) };
  }
  const label = origin === 'lab-derived' ? "band derived from the lab's repeat tests" : 'band stated by the lab';
  const field = (key: string, fallback: string) => (typeof obj[key] === 'string' && (obj[key] as string).trim() !== '' ? (obj[key] as string) : fallback);
  return ok({
    origin,
    description: `${label}: ${description} (${file})`,
    population: field('population', 'not stated in the band file'),
    retestInterval: field('retest_interval', 'not stated in the band file'),
    statistic: field('statistic', 'within-subject coefficient of variation; limits 1.96 × √2 × ln(1 + CV) on the log scale'),
    source: field('source', origin === 'lab-derived' ? `the lab's repeat tests (${file})` : `stated by the lab (${file})`),
    entries,
  });
}

function round(value: number | null, digits = 4): number | null {
  if (value === null || !Number.isFinite(value)) return null;
  const f = 10 ** digits;
  return Math.round(value * f) / f;
}

/** The band file for statistics derived from repeat tests, as a JSON text. */
export function writeDerivedBandFile(
  stats: Readonly<Partial<Record<MetricId, RepeatStats>>>,
  description: string,
  context: { readonly population?: string; readonly retestInterval?: string } = {},
): string {
  const metrics: Record<string, unknown> = {};
  for (const [id, s] of Object.entries(stats) as [MetricId, RepeatStats][]) {
    metrics[id] = {
      cv_pct: round(s.cvPct),
      mean_change_pct: s.meanDay1 !== 0 ? round((100 * s.meanChange) / s.meanDay1, 2) : 0,
      source: `lab repeat tests, ${s.n} pairs; CV ${s.cvMethod} (Hopkins 2000)`,
      stats: {
        n: s.n,
        mean_day1: round(s.meanDay1),
        mean_day2: round(s.meanDay2),
        mean_change: round(s.meanChange),
        sd_change: round(s.sdChange),
        typical_error: round(s.typicalError),
        sem: round(s.sem),
        cv_pct_raw: round(s.cvPctRaw),
        cv_pct_log: round(s.cvPctLog),
        cv_method: s.cvMethod,
        icc_3_1: round(s.icc31),
        icc_2_1: round(s.icc21),
        mdc95: round(s.mdc95),
        mdc95_pct: round(s.mdc95Pct),
      },
    };
  }
  const header = {
    format: BAND_FORMAT,
    version: BAND_FORMAT_VERSION,
    origin: 'lab-derived',
    description,
    population: context.population ?? "the lab's own repeat-tested subjects (state who they were)",
    retest_interval: context.retestInterval ?? 'as in the manifest pairs (state it)',
    statistic: 'within-subject CV (log-transformed where every value is positive; Hopkins 2000) and mean day-2 change; limits 1.96 × √2 × ln(1 + CV) on the log scale',
    source: `the lab's repeat tests: ${description}`,
  };
  return `${JSON.stringify({ ...header, metrics }, null, 2)}\n`;
}
