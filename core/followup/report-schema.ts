/**
 * The zod schema of a follow-up report (version 1), used by the case file's schema for
 * the log entries that carry one, and by `checkFollowUpReport` for what a shell typed in.
 * The rules: hours 0–2880 (120 days), a reporter and a channel, 0–10 whole-number ratings
 * (or null, not asked), each domain named once.
 */
import { z } from 'zod';
import { fail, locatedError, ok, type Result } from '../model/errors';
import { FOLLOW_UP_VERSION, MAX_AFTER_TEST_H, REPORT_CHANNELS, SCORE_MAX, SCORE_MIN, type FollowUpReport } from './report';

const ratingSchema = z.object({
  domain: z.string().refine((d) => d.trim().length > 0, 'a domain with a name').max(60, 'a domain name of at most 60 characters'),
  score: z.number().int(`a whole number from ${SCORE_MIN} to ${SCORE_MAX}`).min(SCORE_MIN, `a rating from ${SCORE_MIN} to ${SCORE_MAX}`).max(SCORE_MAX, `a rating from ${SCORE_MIN} to ${SCORE_MAX}`).nullable(),
});

export const followUpReportSchema = z.object({
  version: z.literal(FOLLOW_UP_VERSION),
  day: z.union([z.literal(1), z.literal(2)]),
  afterTestH: z.number().finite().min(0, 'hours after the test, 0 or more').max(MAX_AFTER_TEST_H, `at most ${MAX_AFTER_TEST_H} h (120 days) after the test`),
  reportedBy: z.string().refine((r) => r.trim().length > 0, 'who gave the account (e.g. "the person")'),
  channel: z.enum(REPORT_CHANNELS),
  backToUsual: z.boolean(),
  ratings: z.array(ratingSchema).refine((r) => new Set(r.map((x) => x.domain.trim().toLowerCase())).size === r.length, 'each domain rated at most once'),
  note: z.string().max(2000, 'a note of at most 2000 characters'),
});

/**
 * A follow-up report from a shell, checked. The error names the field (`ratings.2.score`)
 * in `file`; a shell that knows where the field came from replaces line and column.
 */
export function checkFollowUpReport(candidate: unknown, file: string): Result<FollowUpReport> {
  const parsed = followUpReportSchema.safeParse(candidate);
  if (parsed.success) {
    const value = parsed.data;
    return ok({ ...value, reportedBy: value.reportedBy.trim(), ratings: value.ratings.map((r) => ({ domain: r.domain.trim().toLowerCase(), score: r.score })) });
  }
  const issue = parsed.error.issues[0];
  const path = issue.path.map(String).join('.');
  return fail(locatedError('follow-up-invalid', file, null, null, `The follow-up's ${path || 'entry'} is not valid: expected ${issue.message}.`));
}
