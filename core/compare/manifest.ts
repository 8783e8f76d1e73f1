/**
 * Twofold's batch manifest: a CSV file (our own layout) listing the pairs to compare.
 *
 *   pair_id,day1_file,day2_file
 *   P001,archive/P001-day1.csv,archive/P001-day2.csv
 *
 * The header row is required, comma-delimited, fields may be double-quoted (RFC 4180 quoting,
 * one record per line). Paths are relative to the manifest's folder (resolved by the caller:
 * core does no file-system work). Blank lines and lines starting with '#' are skipped; every
 * other line is a pair or a located error (file, line, column), never dropped silently.
 */
import { fail, locatedError, ok, type LocatedError, type Result } from '../model/errors';

export const MANIFEST_COLUMNS = ['pair_id', 'day1_file', 'day2_file'] as const;

export interface ManifestEntry {
  readonly pairId: string;
  readonly day1File: string;
  readonly day2File: string;
  /** 1-based line of the manifest this entry came from. */
  readonly line: number;
}

/** Split one CSV record; each field with the 1-based column (character) where it starts. */
function splitRecord(text: string): { fields: { value: string; column: number }[]; error: number | null } {
  const fields: { value: string; column: number }[] = [];
  let i = 0;
  while (i <= text.length) {
    const start = i;
    let value = '';
    if (text[i] === '"') {
      i++;
      for (;;) {
        if (i >= text.length) return { fields, error: start + 1 };
        if (text[i] === '"') {
          if (text[i + 1] === '"') {
            value += '"';
            i += 2;
            continue;
          }
          i++;
          break;
        }
        value += text[i++];
      }
      if (i < text.length && text[i] !== ',') return { fields, error: i + 1 };
    } else {
      while (i < text.length && text[i] !== ',') value += text[i++];
    }
    fields.push({ value: value.trim(), column: start + 1 });
    i++;
  }
  return { fields, error: null };
}

export function parseManifest(text: string, file: string): Result<ManifestEntry[]> {
  const lines = text.replace(/^\uFEFF/, '').split(/\r?\n/);
  const err = (code: string, line: number, column: number | null, message: string): Result<ManifestEntry[]> =>
    fail<ManifestEntry[]>(locatedError(code, file, line, column, message) as LocatedError);
  let headerSeen = false;
  const entries: ManifestEntry[] = [];
  const seen = new Map<string, number>();
  for (let index = 0; index < lines.length; index++) {
    const lineNo = index + 1;
    const raw = lines[index];
    if (raw.trim() === '' || raw.trimStart().startsWith('#')) continue;
    const { fields, error } = splitRecord(raw);
    if (error !== null) return err('manifest-quote', lineNo, error, 'A quoted field is not closed, or text follows its closing quote.');
    if (!headerSeen) {
      const names = fields.map((f) => f.value.toLowerCase());
      for (let c = 0; c < MANIFEST_COLUMNS.length; c++) {
        if (names[c] !== MANIFEST_COLUMNS[c]) {
          return err('manifest-header', lineNo, fields[c]?.column ?? raw.length + 1, `The manifest's first row must be the header ${MANIFEST_COLUMNS.join(',')}; column ${c + 1} should be '${MANIFEST_COLUMNS[c]}'.`);
        }
      }
      if (fields.length > MANIFEST_COLUMNS.length) return err('manifest-header', lineNo, fields[MANIFEST_COLUMNS.length].column, `The header has more than the ${MANIFEST_COLUMNS.length} columns ${MANIFEST_COLUMNS.join(',')}.`);
      headerSeen = true;
      continue;
    }
    if (fields.length !== MANIFEST_COLUMNS.length) {
      const column = fields.length > MANIFEST_COLUMNS.length ? fields[MANIFEST_COLUMNS.length].column : raw.length + 1;
      return err('manifest-fields', lineNo, column, `Expected ${MANIFEST_COLUMNS.length} fields (pair id, day-1 file, day-2 file), found ${fields.length}.`);
    }
    for (let c = 0; c < fields.length; c++) {
      if (fields[c].value === '') return err('manifest-empty', lineNo, fields[c].column, `The ${MANIFEST_COLUMNS[c]} field is empty.`);
    }
    const [id, d1, d2] = fields;
    const earlier = seen.get(id.value);
    if (earlier !== undefined) return err('manifest-duplicate', lineNo, id.column, `Pair id '${id.value}' already appears on line ${earlier}; each pair needs its own id.`);
    seen.set(id.value, lineNo);
    entries.push({ pairId: id.value, day1File: d1.value, day2File: d2.value, line: lineNo });
  }
  if (!headerSeen) return err('manifest-header', 1, 1, `The manifest is empty; it needs the header ${MANIFEST_COLUMNS.join(',')} and one row per pair.`);
  return ok(entries);
}
