/**
 * Twofold's column map: a small, versioned JSON file that tells the importer how a cart's
 * export is laid out, so the next file from the same cart imports with no questions.
 * It overrides detection for every column it names; columns it does not name are detected
 * as usual. Layout (documented in docs/formats.md):
 *
 *   {
 *     "format": "twofold-column-map",
 *     "version": 1,
 *     "delimiter": ";",          // ",", ";", "\t", or null to detect
 *     "decimal": ",",            // ".", ",", or null to detect
 *     "headerLine": null,        // 1-based line of the header, or null to search for it
 *     "columns": [
 *       { "header": "V'O2", "variable": "vo2MlMin", "unit": "L/min" },
 *       { "header": "Marker", "variable": null }
 *     ]
 *   }
 *
 * Headers match case- and space-insensitively (variables.ts `normalizeName`).
 */
import { z } from 'zod';
import { fail, locatedError, ok, type Result } from '../model/errors';
import { COLUMN_VARIABLES, type ColumnVariable, type ImportResult } from './types';

export const MAPPING_FORMAT = 'twofold-column-map';
export const MAPPING_VERSION = 1;

export interface ColumnMapEntry {
  readonly header: string;
  /** The variable the column feeds; null to ignore it. */
  readonly variable: ColumnVariable | null;
  /** The unit its values are in; null or absent to detect. */
  readonly unit?: string | null;
}

export interface ColumnMapping {
  readonly format: typeof MAPPING_FORMAT;
  readonly version: typeof MAPPING_VERSION;
  readonly delimiter?: ',' | ';' | '\t' | null;
  readonly decimal?: '.' | ',' | null;
  readonly headerLine?: number | null;
  readonly columns: readonly ColumnMapEntry[];
}

const schema = z.object({
  format: z.literal(MAPPING_FORMAT),
  version: z.literal(MAPPING_VERSION),
  delimiter: z.enum([',', ';', '\t']).nullable().optional(),
  decimal: z.enum(['.', ',']).nullable().optional(),
  headerLine: z.number().int().min(1).nullable().optional(),
  columns: z.array(
    z.object({
      header: z.string().min(1),
      variable: z.enum(COLUMN_VARIABLES as [ColumnVariable, ...ColumnVariable[]]).nullable(),
      unit: z.string().nullable().optional(),
    }),
  ),
});

function lineColumnOfPosition(text: string, position: number): { line: number; column: number } {
  const before = text.slice(0, position);
  const line = before.split('\n').length;
  return { line, column: position - before.lastIndexOf('\n') };
}

/** A column map from the text of its file; a located error when it is not one. */
export function parseMapping(text: string, file: string): Result<ColumnMapping> {
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error);
    const pos = /position (\d+)/.exec(message);
    const at = pos ? lineColumnOfPosition(text, Number(pos[1])) : { line: null, column: null };
    return fail(locatedError('mapping-not-json', file, at.line, at.column, `The column map is not valid JSON (${message}).`));
  }
  const parsed = schema.safeParse(json);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    const where = issue.path.length > 0 ? issue.path.join('.') : 'the top level';
    return fail(
      locatedError(
        'mapping-invalid',
        file,
        null,
        null,
        `The column map is not a ${MAPPING_FORMAT} version ${MAPPING_VERSION} file: at ${where}, ${issue.message}. Variables are ${COLUMN_VARIABLES.join(', ')}.`,
      ),
    );
  }
  return ok(parsed.data as ColumnMapping);
}

/** The map that reproduces an import: every column with the variable and unit it was read as. */
export function mappingFromImport(result: ImportResult): ColumnMapping {
  return {
    format: MAPPING_FORMAT,
    version: MAPPING_VERSION,
    delimiter: result.layout.delimiter,
    decimal: result.layout.decimal,
    headerLine: null,
    columns: result.columns.map((c) => ({
      header: c.header,
      variable: c.variable,
      unit: c.variable === null || c.unit === null || c.unit === '' ? null : c.unit,
    })),
  };
}

export function serializeMapping(mapping: ColumnMapping): string {
  return `${JSON.stringify(mapping, null, 2)}\n`;
}
