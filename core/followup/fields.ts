/**
 * Reading the fields of a follow-up as a person types them (command line, sheet, keyboard
 * entry), each into its value or a sentence saying what was expected. Shared by every shell,
 * so "y", "yes" and "back" mean the same everywhere.
 */
import { MAX_AFTER_TEST_H, REPORT_CHANNELS, SCORE_MAX, SCORE_MIN, type ReportChannel, type TestDay } from './report';

export type Field<T> = { readonly ok: true; readonly value: T } | { readonly ok: false; readonly expected: string };

const good = <T>(value: T): Field<T> => ({ ok: true, value });
const bad = <T>(expected: string): Field<T> => ({ ok: false, expected });

export function readTestDay(text: string): Field<TestDay> {
  const t = text.trim().replace(/^day\s*/i, '');
  return t === '1' ? good(1) : t === '2' ? good(2) : bad(`the test the report follows, 1 or 2 (got '${text}')`);
}

/** Hours after the test; "3d" or "3 days" is read as 72 h. */
export function readHours(text: string): Field<number> {
  const m = /^\s*(\d+(?:\.\d+)?)\s*(h|hours?|d|days?)?\s*$/i.exec(text);
  if (!m) return bad(`hours after the end of the test, e.g. 22, 22h or 3d (got '${text}')`);
  const value = Number(m[1]) * (m[2] && /^d/i.test(m[2]) ? 24 : 1);
  if (value > MAX_AFTER_TEST_H) return bad(`at most ${MAX_AFTER_TEST_H} h (120 days) after the test (got '${text}')`);
  return good(value);
}

export function readChannel(text: string): Field<ReportChannel> {
  const t = text.trim().toLowerCase().replace(/[\s_]+/g, '-');
  const aliases: Record<string, ReportChannel> = { 'in-person': 'in-person', person: 'in-person', visit: 'in-person', i: 'in-person', phone: 'phone', call: 'phone', p: 'phone', form: 'form', f: 'form' };
  const value = aliases[t];
  return value ? good(value) : bad(`how it was reported: ${REPORT_CHANNELS.join(', ')} (got '${text}')`);
}

export function readBackToUsual(text: string): Field<boolean> {
  const t = text.trim().toLowerCase();
  if (['yes', 'y', 'back', 'true'].includes(t)) return good(true);
  if (['no', 'n', 'not back', 'false'].includes(t)) return good(false);
  return bad(`whether the person reports being back to their usual state, yes or no (got '${text}')`);
}

/** A 0–10 rating; an empty cell or "-" is "not asked" (null). */
export function readScore(text: string): Field<number | null> {
  const t = text.trim();
  if (t === '' || t === '-' || t === '–') return good(null);
  if (!/^\d{1,2}$/.test(t) || Number(t) < SCORE_MIN || Number(t) > SCORE_MAX) return bad(`a whole-number rating from ${SCORE_MIN} to ${SCORE_MAX}, or empty when not asked (got '${text}')`);
  return good(Number(t));
}
