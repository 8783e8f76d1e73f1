/**
 * The two reviewer-log actions that carry follow-up reports. A report is never edited: a
 * correction is a new entry naming the entry it corrects (the first one that recorded the
 * report), with the report as it should read, or null when the report was entered in error
 * and is struck out. The log entry's reason says why.
 */
import type { FollowUpReport } from './report';

export type FollowUpAction =
  | { readonly kind: 'follow-up'; readonly report: FollowUpReport }
  | {
      readonly kind: 'follow-up-correction';
      /** `seq` of the follow-up entry that first recorded the report. */
      readonly corrects: number;
      /** The report as it should read, or null: struck out, entered in error. */
      readonly report: FollowUpReport | null;
    };
