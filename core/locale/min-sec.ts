/**
 * The one m:ss formatter: a time of the recording or a duration, as a person reads it on
 * screen, in the report and at the command line. Rounded to the whole second; minutes keep
 * counting past an hour (a test lasts minutes, and h:mm:ss would read as a clock time); a
 * negative value takes a minus sign (U+2212). `missing` is written for null or a value that
 * is not finite (the report's en dash by default; the workbench passes its em dash); a time
 * beyond the printable range (format-number.ts) prints as '≥ 10⁹ s'.
 *
 * Example: minSec(372) → '6:12'; minSec(59.6) → '1:00'; minSec(3725) → '62:05';
 * minSec(-5) → '−0:05'; signedMinSec(-287) → '−4:47'; signedMinSec(36) → '+0:36';
 * signedMinSec(0.4) → '0:00'.
 */
import { MISSING, outOfRange } from './format-number';

function digits(whole: number): string {
  return `${Math.floor(whole / 60)}:${String(whole % 60).padStart(2, '0')}`;
}

export function minSec(seconds: number | null | undefined, missing: string = MISSING): string {
  if (seconds === null || seconds === undefined || !Number.isFinite(seconds)) return missing;
  const beyond = outOfRange(seconds);
  if (beyond) return `${beyond} s`;
  const whole = Math.round(Math.abs(seconds));
  return whole > 0 && seconds < 0 ? `−${digits(whole)}` : digits(whole);
}

/** A change of time with its sign: '+' later or longer, '−' sooner or shorter; none at 0:00. */
export function signedMinSec(seconds: number | null | undefined, missing: string = MISSING): string {
  if (seconds === null || seconds === undefined || !Number.isFinite(seconds)) return missing;
  const beyond = outOfRange(seconds);
  if (beyond) return `${beyond} s`;
  const whole = Math.round(Math.abs(seconds));
  if (whole === 0) return '0:00';
  return `${seconds < 0 ? '−' : '+'}${digits(whole)}`;
}
