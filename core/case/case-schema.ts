/**
 * The zod schema of case file format, versions 1 and 2 (docs/case-file.md). Loading validates
 * against it before anything is trusted; the TypeScript types in case-file.ts and this
 * schema describe the same shape, and the test suite checks that a saved case parses.
 */
import { settingsSchema } from '../analyze/settings-input';
import { parseMapping } from '../import/mapping';
import { z } from 'zod';
import { followUpReportSchema } from '../followup/report-schema';
import { CASE_FORMAT } from './case-file';
import { resolveLocale } from '../locale/locales';

const num = z.number().finite();
const sha = z.string().regex(/^[0-9a-f]{64}$/, 'a SHA-256 in lowercase hex');
const isoTime = z.string().regex(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2}(\.\d+)?)?(Z|[+-]\d{2}:\d{2})$/, 'an ISO 8601 date-time with a zone');

/** The same ranges the command line's clinical flags accept (cli/commands/report.ts). */
const clinicalSchema = z.object({
  peakRpe: num.min(6).max(20).nullable(),
  lactateMmolL: num.min(0).max(40).nullable(),
  fev1L: num.min(0.2).max(9).nullable(),
  mvvLMin: num.min(5).max(400).nullable(),
  restingHrBpm: num.min(20).max(200).nullable(),
});

/** A column map is checked by the importer's own parser, so its format has one owner (core/import/mapping.ts). */
const columnMapSchema = z.record(z.string(), z.unknown()).transform((value, ctx) => {
  const parsed = parseMapping(JSON.stringify(value), 'column map');
  if (parsed.ok) return parsed.value;
  ctx.addIssue({ code: 'custom', message: parsed.error.message.replace(/\.$/, '') });
  return z.NEVER;
});

const rawInputSchema = z.object({
  // A bare file name: no folders, no control characters (it names an attachment in the report).
  name: z.string().min(1).max(255).regex(/^[^/\\\u0000-\u001f]+$/, 'a file name without folders or control characters').refine((n) => n !== '.' && n !== '..', 'a file name'),
  sha256: sha,
  sizeBytes: z.number().int().nonnegative(),
  storedAs: z.string().regex(/^raw\/[0-9a-f]{64}(\.[A-Za-z0-9]{1,8})?$/, 'raw/<sha256>.<extension>'),
  // Absent in case files written before it existed: read as no column map.
  columnMap: columnMapSchema.nullable().optional(),
});

const point = z.object({ timeS: num, vo2MlMin: num });
const day = z.union([z.literal(1), z.literal(2)]);
const threshold = z.enum(['vt1', 'vt2']);

const actionSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('set-threshold'), day, threshold, givenAs: z.enum(['time', 'vo2']), before: point.nullable(), after: point }),
  z.object({ kind: z.literal('withdraw'), withdraws: z.number().int().positive(), day, threshold, before: point.nullable(), after: point.nullable() }),
  z.object({ kind: z.literal('sign-off'), statement: z.string().min(1) }),
  z.object({ kind: z.literal('follow-up'), report: followUpReportSchema }),
  z.object({ kind: z.literal('follow-up-correction'), corrects: z.number().int().positive(), report: followUpReportSchema.nullable() }),
  z.object({ kind: z.literal('case-opened'), migrated: z.boolean() }),
]);

const entrySchema = z.object({
  seq: z.number().int().nonnegative(),
  at: isoTime,
  who: z.string().min(1),
  role: z.string().min(1),
  action: actionSchema,
  reason: z.string().min(1),
  prevHash: sha,
  hash: sha,
});

const leaf = z.union([z.number(), z.string(), z.boolean(), z.null()]);

export const caseSchema = z.object({
  format: z.literal(CASE_FORMAT),
  version: z.union([z.literal(1), z.literal(2)]),
  createdAt: isoTime,
  inputs: z.object({ day1: rawInputSchema, day2: rawInputSchema }),
  settings: settingsSchema,
  clinical: z.object({ day1: clinicalSchema, day2: clinicalSchema }),
  log: z.array(entrySchema),
  recorded: z.object({ softwareVersion: z.string(), digest: sha, numbers: z.record(z.string(), leaf) }).nullable(),
  // Absent in case files written before it existed: read as the neutral `en`.
  reportLocale: z
    .string()
    .refine((tag) => resolveLocale(tag) !== null, 'a locale Twofold knows (see docs/locale.md)')
    .optional(),
});
