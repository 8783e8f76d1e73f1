/**
 * Small text helpers shared by the invented export layouts: numbers with a chosen decimal
 * mark and fixed decimals, elapsed and clock times, and the RPE rating on each breath.
 */
import type { Breath, BreathTable } from '../../core/model/breath-table';

/** `value` with `decimals` fixed decimals and `mark` as the decimal mark; '' for null. */
export function fixed(value: number | null, decimals: number, mark: '.' | ',' = '.'): string {
  if (value === null) return '';
  const text = value.toFixed(decimals);
  return mark === '.' ? text : text.replace('.', ',');
}

/** Elapsed seconds as m:ss (whole seconds; minutes may exceed 59). 754.6 → "12:35". */
export function minutesSeconds(timeS: number): string {
  const whole = Math.round(timeS);
  return `${String(Math.floor(whole / 60)).padStart(2, '0')}:${String(whole % 60).padStart(2, '0')}`;
}

/** Clock time of the start of an ISO 8601 date-time as written (its own offset), s after midnight. */
export function clockStartS(testStart: string): number {
  const match = /T(\d{2}):(\d{2}):(\d{2})/.exec(testStart);
  if (!match) throw new Error(`layout writer: test_start '${testStart}' has no time of day`);
  return Number(match[1]) * 3600 + Number(match[2]) * 60 + Number(match[3]);
}

/** Seconds after midnight as h:mm:ss (whole seconds, wrapping at 24 h). 33004 → "9:10:04". */
export function clockTime(secondsOfDay: number): string {
  const whole = Math.round(secondsOfDay) % 86400;
  const h = Math.floor(whole / 3600);
  const m = Math.floor((whole % 3600) / 60);
  const s = whole % 60;
  return `${h}:${String(m).padStart(2, '0')}:${String(s).padStart(2, '0')}`;
}

/** The date part (YYYY-MM-DD) of an ISO 8601 date-time. */
export function isoDate(testStart: string): string {
  return testStart.slice(0, 10);
}

/** Each RPE rating on the breath with exactly its time (the generator places ratings on breaths). */
export function rpeByBreath(table: BreathTable): Map<Breath, number> {
  const out = new Map<Breath, number>();
  for (const reading of table.rpe) {
    const b = table.breaths.find((x) => x.timeS === reading.timeS);
    if (!b) throw new Error(`layout writer: no breath at the RPE time ${reading.timeS} s`);
    out.set(b, reading.borg);
  }
  return out;
}

export const MMHG_TO_KPA = 0.133322; // 1 mmHg = 0.133322 kPa (definition)

export function sexWord(sex: 'F' | 'M' | null): string {
  return sex === 'F' ? 'female' : sex === 'M' ? 'male' : '';
}
