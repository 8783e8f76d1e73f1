/**
 * One follow-up report after a test: what the person said about their recovery, at a stated
 * number of hours after the end of the test. It is the person's own account, recorded as
 * given; nothing here judges it. Version 1 of the record (docs/case-file.md, "Follow-ups").
 *
 * The domains are the lab's list; DEFAULT_DOMAINS are Twofold's wording of the symptom areas
 * two-day labs commonly ask about after exertion (common practice). A rating is 0 (none) to
 * 10 (worst imaginable), or null when it was not asked this time.
 *
 * Example: { version: 1, day: 1, afterTestH: 22, reportedBy: 'the person', channel: 'phone',
 * backToUsual: false, ratings: [{ domain: 'fatigue', score: 6 }], note: 'slept most of the afternoon' }.
 */

export const FOLLOW_UP_VERSION = 1 as const;

/** Which test the report follows. */
export type TestDay = 1 | 2;

export const REPORT_CHANNELS = ['in-person', 'phone', 'form'] as const;
export type ReportChannel = (typeof REPORT_CHANNELS)[number];

export const CHANNEL_LABELS: Readonly<Record<ReportChannel, string>> = {
  'in-person': 'in person',
  phone: 'phone',
  form: 'form',
};

/** Twofold's default symptom domains (common practice of two-day labs; wording our own). */
export const DEFAULT_DOMAINS: readonly string[] = ['fatigue', 'thinking and memory', 'pain', 'sleep', 'light-headedness on standing', 'flu-like feelings'];

export const SCORE_MIN = 0;
export const SCORE_MAX = 10;
/** Follow-ups are accepted up to 120 days after the test (a guard against unit slips, e.g. minutes typed as hours). */
export const MAX_AFTER_TEST_H = 120 * 24;

export interface DomainRating {
  /** The domain as the lab names it, lower case. */
  readonly domain: string;
  /** 0–10 whole number, or null when not asked this time. */
  readonly score: number | null;
}

export interface FollowUpReport {
  readonly version: typeof FOLLOW_UP_VERSION;
  readonly day: TestDay;
  /** Hours from the end of that day's test to the time the report refers to. */
  readonly afterTestH: number;
  /** Who gave the account: "the person", "partner", "parent", … */
  readonly reportedBy: string;
  readonly channel: ReportChannel;
  /** Whether the person reports being back to their usual state. */
  readonly backToUsual: boolean;
  readonly ratings: readonly DomainRating[];
  /** Free note, as said or written; may be empty. */
  readonly note: string;
}

/** "36 h (1.5 days)" style wording of a follow-up time. */
export function hoursText(afterTestH: number): string {
  const h = Number.isInteger(afterTestH) ? String(afterTestH) : afterTestH.toFixed(1);
  return afterTestH >= 48 ? `${h} h (${trimDays(afterTestH / 24)} days)` : `${h} h`;
}

function trimDays(days: number): string {
  return Number.isInteger(days) ? String(days) : days.toFixed(1);
}
