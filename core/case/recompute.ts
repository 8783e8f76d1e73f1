/**
 * Recomputes a case from its raw files, settings, clinical inputs and reviewer log:
 * read each day with its recorded column map and analyse it, put every active override in place of the automatic
 * threshold (values read off the series at the override's time with `valuesAt`), then
 * compare the days. The same case file and raw bytes always give the same numbers, because
 * every step is a pure function and the bootstrap is seeded by the settings.
 *
 * Two steps, so an interactive shell can show the values before it records them:
 * `recomputeValues` gives what the screen shows; `recordResults` adds the headline numbers
 * and the SHA-256 digest of the canonical JSON of the whole result (about 400 kB for two
 * 1,600-breath tests, most of the recompute's time). `recomputeCase` does both, and is what
 * saving, reports and verification use.
 */
import type { TestAnalysis, ThresholdId, ThresholdResult } from '../model/analysis';
import { fail, locatedError, ok, type Result } from '../model/errors';
import { SOFTWARE_VERSION } from '../version';
import { columnMapOf, type AuditEntry, type CaseFile, type DayNumber, type RawInput, type RecordedResults, type ThresholdPoint } from './case-file';
import { canonicalJsonSha256 } from './canonical-json';
import type { Engine } from './engine';
import { flattenLeaves } from './flatten';
import { followUpNumbers } from './follow-ups';
import { activeOverrides, overrideKey, type ActiveOverride } from './overrides';
import { sha256Hex } from './sha256';

export interface ThresholdState {
  /** The detectors' own result, untouched by the reviewer. */
  readonly automatic: ThresholdResult;
  /** The override in force, or null when the automatic estimate stands. */
  readonly override: ActiveOverride | null;
  /** Where the threshold now sits: the override's point, or the automatic consensus. */
  readonly effective: ThresholdPoint | null;
}

export interface DayOutcome {
  readonly day: DayNumber;
  /** The analysis with overrides in place (what compare, the charts and the tables use). */
  readonly analysis: TestAnalysis;
  readonly vt1: ThresholdState;
  readonly vt2: ThresholdState;
}

/** The recomputed case before its results are recorded. */
export interface CaseValues<C> {
  readonly day1: DayOutcome;
  readonly day2: DayOutcome;
  readonly comparison: C;
}

export interface CaseOutcome<C> extends CaseValues<C> {
  readonly recorded: RecordedResults;
}

export interface RawBytes {
  readonly day1: Uint8Array;
  readonly day2: Uint8Array;
}

/** Values and recorded results in one step (`recomputeValues`, then `recordResults`). */
export function recomputeCase<C>(caseFile: CaseFile, raw: RawBytes, engine: Engine<C>): Result<CaseOutcome<C>> {
  const values = recomputeValues(caseFile, raw, engine);
  if (!values.ok) return values;
  const recorded = recordResults(values.value, caseFile.log);
  if (!recorded.ok) return recorded;
  return ok({ ...values.value, recorded: recorded.value });
}

/** Both days analysed with the overrides in place, and compared; nothing recorded yet. */
export function recomputeValues<C>(caseFile: CaseFile, raw: RawBytes, engine: Engine<C>): Result<CaseValues<C>> {
  const overrides = activeOverrides(caseFile.log);
  const days: DayOutcome[] = [];
  for (const day of [1, 2] as const) {
    const analysed = analyseDay(caseFile, day, day === 1 ? raw.day1 : raw.day2, engine);
    if (!analysed.ok) return analysed;
    days.push(applyOverrides(day, analysed.value, overrides.get(overrideKey(day, 'vt1')) ?? null, overrides.get(overrideKey(day, 'vt2')) ?? null, engine));
  }
  const [day1, day2] = days;
  return ok({ day1, day2, comparison: engine.compareTests(day1.analysis, day2.analysis, caseFile.settings) });
}

/**
 * One day read and analysed, in a function of its own so that its breath table (an object
 * per breath) is unreachable once the analysis returns, before the other day is read.
 */
function analyseDay<C>(caseFile: CaseFile, day: DayNumber, bytes: Uint8Array, engine: Engine<C>): Result<TestAnalysis> {
  const input = day === 1 ? caseFile.inputs.day1 : caseFile.inputs.day2;
  const checked = checkRaw(input, bytes, engine.rawDigest ?? sha256Hex);
  if (!checked.ok) return checked;
  const table = engine.readTable(input.name, bytes, caseFile.settings, columnMapOf(input));
  if (!table.ok) return table;
  return engine.analyzeTest(table.value, caseFile.settings, day === 1 ? caseFile.clinical.day1 : caseFile.clinical.day2);
}

function checkRaw(input: RawInput, bytes: Uint8Array, digestOf: (bytes: Uint8Array) => string): Result<true> {
  const hash = digestOf(bytes);
  if (hash !== input.sha256) {
    return fail(locatedError('raw-file-changed', input.storedAs, null, null, `The breath file ${input.name} is not the one this case was built from (SHA-256 ${hash.slice(0, 12)}…, expected ${input.sha256.slice(0, 12)}…).`));
  }
  return ok(true);
}

function applyOverrides<C>(day: DayNumber, automatic: TestAnalysis, vt1: ActiveOverride | null, vt2: ActiveOverride | null, engine: Engine<C>): DayOutcome {
  const state = (id: ThresholdId, override: ActiveOverride | null): ThresholdState => {
    const auto = automatic[id];
    const effective = override ? override.point : auto.at ? { timeS: auto.at.timeS, vo2MlMin: auto.at.vo2MlMin } : null;
    return { automatic: auto, override, effective };
  };
  const replaced = (id: ThresholdId, override: ActiveOverride | null): ThresholdResult => {
    if (!override) return automatic[id];
    // The interval describes the automatic estimate, not the reviewer's point, so it is not carried over.
    return { ...automatic[id], at: engine.valuesAt(automatic, override.point.timeS), ci95Vo2MlMin: null, ci95TimeS: null, reason: null };
  };
  return {
    day,
    analysis: { ...automatic, vt1: replaced('vt1', vt1), vt2: replaced('vt2', vt2) },
    vt1: state('vt1', vt1),
    vt2: state('vt2', vt2),
  };
}

/**
 * The headline numbers (thresholds as used, peaks, effort, the whole comparison) and a digest
 * of everything: SHA-256 (FIPS 180-4) of the canonical JSON of both analyses and the
 * comparison, non-finite numbers written as strings. With the reviewer log, the follow-up
 * figures (core/followup/course.ts) join the numbers, so verification recomputes them too; a
 * log without follow-ups adds nothing.
 */
export function recordResults<C>({ day1, day2, comparison }: CaseValues<C>, log: readonly AuditEntry[] = []): Result<RecordedResults> {
  const headline = (d: DayOutcome) => ({
    vt1: d.analysis.vt1.at,
    vt2: d.analysis.vt2.at,
    vt1Source: d.vt1.override ? `reviewer#${d.vt1.override.seq}` : 'automatic',
    vt2Source: d.vt2.override ? `reviewer#${d.vt2.override.seq}` : 'automatic',
    peak: d.analysis.peak,
    derived: d.analysis.derived,
    effort: d.analysis.effort.verdict,
  });
  // Hashed as it is written: for a test of a million breaths the text runs to hundreds of megabytes.
  const digest = canonicalJsonSha256({ day1: day1.analysis, day2: day2.analysis, comparison }, 'recomputed result', 'as-string');
  if (!digest.ok) return digest;
  return ok({
    softwareVersion: SOFTWARE_VERSION,
    digest: digest.value,
    numbers: flattenLeaves({ day1: headline(day1), day2: headline(day2), comparison, ...followUpNumbers(log) }),
  });
}
