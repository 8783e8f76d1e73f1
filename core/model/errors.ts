/**
 * Errors are values with a place. Core functions never throw on bad input:
 * they return a `Result` whose error names the file, line and column.
 */

export interface LocatedError {
  /** Stable machine code, e.g. `no-header`, `time-backwards`. */
  readonly code: string;
  readonly file: string;
  /** 1-based line, or null when the problem is the whole file. */
  readonly line: number | null;
  /** 1-based column (cell index in a table, counting from 1), or null. */
  readonly column: number | null;
  /** A sentence a physiologist understands, saying what was expected. */
  readonly message: string;
}

export type Result<T> = { readonly ok: true; readonly value: T } | { readonly ok: false; readonly error: LocatedError };

export function ok<T>(value: T): Result<T> {
  return { ok: true, value };
}

export function fail<T = never>(error: LocatedError): Result<T> {
  return { ok: false, error };
}

export function locatedError(
  code: string,
  file: string,
  line: number | null,
  column: number | null,
  message: string,
): LocatedError {
  return { code, file, line, column, message };
}

/**
 * `FILE:LINE:COLUMN: message`, the form compilers use, so editors can jump to it.
 * A missing line or column is written as 0.
 */
export function formatLocated(error: LocatedError): string {
  return `${error.file}:${error.line ?? 0}:${error.column ?? 0}: ${error.message}`;
}
