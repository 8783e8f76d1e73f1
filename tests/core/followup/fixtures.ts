/** Follow-up reports for the tests, written out by hand so each expected figure can be checked by eye. */
import type { FollowUpReport } from '../../../core/followup/report';

export function report(day: 1 | 2, afterTestH: number, backToUsual: boolean, scores: Record<string, number | null> = {}, extra: Partial<FollowUpReport> = {}): FollowUpReport {
  return { version: 1, day, afterTestH, reportedBy: 'the person', channel: 'phone', backToUsual, ratings: Object.entries(scores).map(([domain, score]) => ({ domain, score })), note: '', ...extra };
}

export const RECORDER = { who: 'C. Coordinator', role: 'lab coordinator', at: '2026-03-12T10:00:00Z' };
