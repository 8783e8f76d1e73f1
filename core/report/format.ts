/**
 * Number formatting for the report: fixed decimals, a dash for a missing value, a signed
 * form for changes, and a minus sign (U+2212) rather than a hyphen, as typesetting does.
 *
 * Example: fixed(1234.56, 0) → '1235'; signed(-3.14159, 1) → '−3.1'; fixed(null) → '–'.
 */
export const MISSING = '–';

export function fixed(value: number | null | undefined, digits = 0): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return MISSING;
  return value.toFixed(digits).replace(/^-/, '−');
}

export function signed(value: number | null | undefined, digits = 0): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return MISSING;
  const text = Math.abs(value).toFixed(digits);
  if (Number(text) === 0) return text;
  return `${value < 0 ? '−' : '+'}${text}`;
}

/** Seconds as m:ss, e.g. 372 → '6:12'. */
export function minSec(seconds: number | null | undefined): string {
  if (seconds === null || seconds === undefined || !Number.isFinite(seconds)) return MISSING;
  const whole = Math.round(seconds);
  return `${Math.floor(whole / 60)}:${String(whole % 60).padStart(2, '0')}`;
}
