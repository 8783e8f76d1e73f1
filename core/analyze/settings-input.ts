/**
 * A settings file is a JSON partial of `Settings`: merged over DEFAULT_SETTINGS, then
 * validated whole. Objects merge key by key; an object with a `kind` (averaging, outliers)
 * replaces the default as a whole, since its fields depend on the kind. Errors come back
 * as values naming the file and, for malformed JSON, the line and column.
 *
 * Example: `{"peaks": {"windowS": 20}}` → the default settings with a 20 s peak window.
 */
import { z } from 'zod';
import { DEFAULT_SETTINGS, SETTINGS_VERSION, type Settings } from '../model/settings';
import { fail, locatedError, ok, type Result } from '../model/errors';

/**
 * Every number has a stated range, so no setting can ask for unbounded work (a billion
 * bootstrap replicates, a nanowatt workload step) or a meaningless analysis. The ranges are
 * common practice: wide enough for every published choice we know of, narrow enough to
 * finish; the limits of work are ours (replicates ≤ 2,000: a 95 % interval settles well
 * below that, Efron et al., An Introduction to the Bootstrap, 1993, ch. 13 (memory)).
 */
const range = (min: number, max: number) => z.number().min(min).max(max);
const intRange = (min: number, max: number) => z.number().int().min(min).max(max);
/** A phase boundary: within a day of recording, or null. */
const nullableTime = range(0, 86_400).nullable();

/** The full settings, every field checked and bounded; the case file validates its settings with it too. */
export const settingsSchema = z.strictObject({
  version: z.literal(SETTINGS_VERSION),
  import: z.strictObject({
    implausible: z
      .strictObject({ vo2MaxMlMin: range(1000, 15_000), hrMinBpm: range(10, 100), hrMaxBpm: range(150, 300), rerMin: range(0.3, 1.0), rerMax: range(1.2, 3.0) })
      .refine((v) => v.hrMinBpm < v.hrMaxBpm, { message: 'hrMinBpm must be below hrMaxBpm', path: ['hrMinBpm'] }),
    rerMismatch: range(0.001, 1),
  }),
  clean: z.strictObject({
    outliers: z.discriminatedUnion('kind', [
      z.strictObject({ kind: z.literal('none') }),
      z.strictObject({ kind: z.literal('local-sd'), windowBreaths: intRange(4, 101), limitSd: range(1, 20) }),
    ]),
    averaging: z.discriminatedUnion('kind', [
      z.strictObject({ kind: z.literal('rolling-time'), windowS: range(1, 120) }),
      z.strictObject({ kind: z.literal('time-bins'), binS: range(1, 120) }),
      z.strictObject({ kind: z.literal('rolling-breaths'), breaths: intRange(1, 60) }),
    ]),
    phases: z
      .strictObject({ incrementalStartS: nullableTime, incrementalEndS: nullableTime })
      .refine((p) => p.incrementalStartS === null || p.incrementalEndS === null || p.incrementalStartS < p.incrementalEndS, { message: 'incrementalStartS must be before incrementalEndS', path: ['incrementalStartS'] }),
  }),
  thresholds: z.strictObject({
    minPointsPerSegment: intRange(2, 200),
    disagreementPct: range(0.1, 100),
    bootstrap: z.strictObject({ replicates: intRange(0, 2000), seed: intRange(0, 4_294_967_295), checkEvery: intRange(0, 2000).optional(), stableWithinPct: range(0, 100).optional() }),
  }),
  peaks: z.strictObject({ windowS: range(5, 120) }),
  effort: z.strictObject({
    rerMin: range(0.8, 1.5),
    plateauMlMin: range(10, 1000),
    plateauMlKgMin: range(0.1, 20),
    hrMaxFormula: z.enum(['tanaka', 'fox']),
    hrPctMin: range(50, 100),
    rpeMin: range(6, 20),
    lactateMinMmolL: range(1, 20),
    // Optional: case files from before these options load unchanged (core/model/settings.ts).
    hrCriterion: z.enum(['percent', 'within-bpm', 'either', 'off']).optional(),
    hrWithinBpm: range(1, 60).optional(),
    rule: z.enum(['rer-plus-one', 'rer-alone']).optional(),
  }),
  compare: z
    .strictObject({
      intervalHMin: range(0, 336),
      intervalHMax: range(1, 336),
      workloadStepW: range(1, 200),
      bandKind: z.enum(['typical', 'mdc95']),
    })
    .refine((c) => c.intervalHMin < c.intervalHMax, { message: 'intervalHMin must be below intervalHMax', path: ['intervalHMin'] }),
  report: z.strictObject({ paper: z.enum(['a4', 'letter']) }),
});

function isPlainObject(x: unknown): x is Record<string, unknown> {
  return typeof x === 'object' && x !== null && !Array.isArray(x);
}

function merge(base: unknown, over: unknown): unknown {
  if (!isPlainObject(base) || !isPlainObject(over) || 'kind' in over) return over;
  const out: Record<string, unknown> = { ...base };
  for (const [key, value] of Object.entries(over)) out[key] = key in base ? merge(base[key], value) : value;
  return out;
}

/** Merge a parsed partial over the defaults and validate the result. */
export function settingsFromPartial(partial: unknown, fileName: string): Result<Settings> {
  if (!isPlainObject(partial)) {
    return fail(locatedError('settings-not-object', fileName, null, null, 'A settings file must hold one JSON object, e.g. {"peaks": {"windowS": 30}}.'));
  }
  const parsed = settingsSchema.safeParse(merge(DEFAULT_SETTINGS, partial));
  if (parsed.success) return ok(parsed.data as Settings);
  const issue = parsed.error.issues[0];
  const path = issue.path.join('.') || '(top level)';
  return fail(locatedError('settings-invalid', fileName, null, null, `Setting '${path}' is not valid: ${issue.message}.`));
}

/** Parse the text of a settings file; a JSON syntax error is located by line and column. */
export function settingsFromJson(text: string, fileName: string): Result<Settings> {
  let partial: unknown;
  try {
    partial = JSON.parse(text);
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error);
    const { line, column } = locate(text, message);
    return fail(locatedError('settings-json', fileName, line, column, `The settings file is not valid JSON (${message}).`));
  }
  const settings = settingsFromPartial(partial, fileName);
  if (settings.ok || settings.error.code !== 'settings-invalid') return settings;
  const at = lineOfPath(text, settingsPath(partial));
  return at ? fail({ ...settings.error, line: at.line, column: at.column }) : settings;
}

/** The dotted path of the first invalid setting, from the same validation. */
function settingsPath(partial: unknown): readonly (string | number)[] {
  const parsed = settingsSchema.safeParse(merge(DEFAULT_SETTINGS, partial));
  return parsed.success ? [] : parsed.error.issues[0].path.map((k) => (typeof k === 'symbol' ? String(k) : k));
}

/** Line and column of the last key of `path` in the file's text, found key by key; null when absent (a default). */
function lineOfPath(text: string, path: readonly (string | number)[]): { line: number; column: number } | null {
  let from = 0;
  let found = -1;
  for (const key of path) {
    if (typeof key !== 'string') continue;
    const i = text.indexOf(`"${key}"`, from);
    if (i < 0) break;
    found = i;
    from = i + key.length + 2;
  }
  if (found < 0) return null;
  const before = text.slice(0, found);
  const lines = before.split('\n');
  return { line: lines.length, column: lines[lines.length - 1].length + 1 };
}

function locate(text: string, message: string): { line: number | null; column: number | null } {
  const lc = /line (\d+) column (\d+)/.exec(message);
  if (lc) return { line: Number(lc[1]), column: Number(lc[2]) };
  const pos = /position (\d+)/.exec(message);
  if (!pos) return { line: null, column: null };
  const before = text.slice(0, Number(pos[1]));
  const lines = before.split('\n');
  return { line: lines.length, column: lines[lines.length - 1].length + 1 };
}
