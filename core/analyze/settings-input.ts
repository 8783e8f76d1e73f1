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

const positive = z.number().positive();
const nullableTime = z.number().nonnegative().nullable();

/** The full settings, every field checked; the case file validates its settings with it too. */
export const settingsSchema = z.strictObject({
  version: z.literal(SETTINGS_VERSION),
  import: z.strictObject({
    implausible: z.strictObject({ vo2MaxMlMin: positive, hrMinBpm: positive, hrMaxBpm: positive, rerMin: positive, rerMax: positive }),
    rerMismatch: positive,
  }),
  clean: z.strictObject({
    outliers: z.discriminatedUnion('kind', [
      z.strictObject({ kind: z.literal('none') }),
      z.strictObject({ kind: z.literal('local-sd'), windowBreaths: z.number().int().min(4), limitSd: positive }),
    ]),
    averaging: z.discriminatedUnion('kind', [
      z.strictObject({ kind: z.literal('rolling-time'), windowS: positive }),
      z.strictObject({ kind: z.literal('time-bins'), binS: positive }),
      z.strictObject({ kind: z.literal('rolling-breaths'), breaths: z.number().int().min(1) }),
    ]),
    phases: z.strictObject({ incrementalStartS: nullableTime, incrementalEndS: nullableTime }),
  }),
  thresholds: z.strictObject({
    minPointsPerSegment: z.number().int().min(2),
    disagreementPct: positive,
    bootstrap: z.strictObject({ replicates: z.number().int().min(0), seed: z.number().int(), checkEvery: z.number().int().min(0).optional(), stableWithinPct: z.number().nonnegative().optional() }),
  }),
  peaks: z.strictObject({ windowS: positive }),
  effort: z.strictObject({
    rerMin: positive,
    plateauMlMin: positive,
    plateauMlKgMin: positive,
    hrMaxFormula: z.enum(['tanaka', 'fox']),
    hrPctMin: positive,
    rpeMin: z.number().min(6).max(20),
    lactateMinMmolL: positive,
  }),
  compare: z.strictObject({
    intervalHMin: z.number().nonnegative(),
    intervalHMax: positive,
    workloadStepW: positive,
    bandKind: z.enum(['typical', 'mdc95']),
  }),
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
  return settingsFromPartial(partial, fileName);
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
