// The recovery rule and the domain course, on reports whose expected figures are worked out by
// hand in each test (the rule is Twofold's own, stated in core/followup/course.ts).
import { describe, expect, it } from 'vitest';
import { courseNumbers, followUpCourse, recoveryOf, recoveryText, type RecordedFollowUp } from '../../../core/followup/course';
import type { FollowUpReport } from '../../../core/followup/report';
import { report } from './fixtures';

function recorded(reports: (FollowUpReport | null)[]): RecordedFollowUp[] {
  return reports.map((r, i) => ({ seq: i + 1, at: '2026-03-12T10:00:00Z', who: 'C', role: 'c', report: r, original: r ?? report(1, 0, false), corrections: [] }));
}

describe('time to reported recovery', () => {
  it('is the first report of usual state with none later saying otherwise, bracketed by the report before it', () => {
    expect(recoveryOf([report(2, 20, false), report(2, 72, false), report(2, 168, true)])).toEqual({ kind: 'recovered', byH: 168, notYetAtH: 72 });
    // A relapse after a report of recovery: the later report counts.
    expect(recoveryOf([report(2, 24, true), report(2, 72, false), report(2, 120, true), report(2, 240, true)])).toEqual({ kind: 'recovered', byH: 120, notYetAtH: 72 });
    // Back at the very first follow-up: no earlier bound.
    expect(recoveryOf([report(1, 22, true)])).toEqual({ kind: 'recovered', byH: 22, notYetAtH: null });
  });

  it('says "not recovered by the last follow-up at N days" when the latest report is not back', () => {
    const r = recoveryOf([report(2, 20, false), report(2, 168, false)]);
    expect(r).toEqual({ kind: 'not-recovered', lastH: 168 });
    expect(recoveryText(r)).toBe('not recovered by the last follow-up at 7 days (168 h)');
    expect(recoveryText({ kind: 'recovered', byH: 48, notYetAtH: 22 })).toBe('reported back to usual state by 48 h (2 days), not yet at 22 h');
    expect(recoveryText(recoveryOf([]))).toBe('no follow-up recorded');
  });

  it('orders reports by hours, whatever order they were recorded in, and leaves struck-out ones out', () => {
    const course = followUpCourse(recorded([report(2, 168, true), report(2, 20, false), null, report(1, 22, false)]));
    expect(course.day2.recovery).toEqual({ kind: 'recovered', byH: 168, notYetAtH: 20 });
    expect(course.day2.reports.map((r) => r.seq)).toEqual([2, 1]);
    expect(course.day1.recovery).toEqual({ kind: 'not-recovered', lastH: 22 });
  });
});

describe('course of each domain', () => {
  it('gives each domain its highest and latest rating, skipping reports where it was not asked', () => {
    const course = followUpCourse(recorded([
      report(2, 20, false, { fatigue: 8, pain: 3, nausea: 2 }),
      report(2, 72, false, { fatigue: 8, pain: null }),
      report(2, 168, true, { fatigue: 2, pain: 1 }),
    ]));
    // Default domains first in the lab's listed order, then others as first recorded.
    expect(course.domains).toEqual(['fatigue', 'pain', 'nausea']);
    const fatigue = course.day2.domains.find((d) => d.domain === 'fatigue')!;
    expect(fatigue.peak).toEqual({ afterTestH: 20, score: 8, seq: 1 }); // first time the highest was given
    expect(fatigue.last).toEqual({ afterTestH: 168, score: 2, seq: 3 });
    const pain = course.day2.domains.find((d) => d.domain === 'pain')!;
    expect(pain.points.map((p) => p.afterTestH)).toEqual([20, 168]);
    expect(course.day1.domains.find((d) => d.domain === 'pain')!.peak).toBeNull();
  });

  it('records nothing when there are no reports, and the figures a verifier recomputes when there are', () => {
    expect(courseNumbers(followUpCourse([]))).toEqual({});
    const numbers = courseNumbers(followUpCourse(recorded([report(1, 22, false, { fatigue: 6 }), report(2, 48, true, { fatigue: 3 })]))) as { followUp: Record<string, Record<string, unknown>> };
    expect(numbers.followUp.day1).toMatchObject({ reports: 1, recovery: 'not-recovered', recoveredByH: null, lastFollowUpH: 22 });
    expect(numbers.followUp.day2).toMatchObject({ reports: 1, recovery: 'recovered', recoveredByH: 48, notYetAtH: null, peaks: [{ domain: 'fatigue', score: 3, afterTestH: 48 }] });
  });
});
