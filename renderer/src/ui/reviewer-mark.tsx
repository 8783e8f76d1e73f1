/**
 * The mark beside a value that comes from a threshold a reviewer set (an override in the
 * reviewer log), so it is never read as the automatic estimate. Text, not colour alone.
 */
import type { ThresholdId } from '../../../core/model/analysis';
import type { DayOutcome } from '../../../core/case/recompute';

/** The threshold a comparison metric is read at ('vt1_vo2' → 'vt1'), or null for peak and slope metrics. */
export function thresholdOfMetric(metricId: string): ThresholdId | null {
  return metricId.startsWith('vt1_') ? 'vt1' : metricId.startsWith('vt2_') ? 'vt2' : null;
}

export function ReviewerMark({ day, threshold }: { day: DayOutcome; threshold: ThresholdId | null }) {
  const override = threshold ? day[threshold].override : null;
  if (!override) return null;
  return (
    <span className="reviewer-mark" data-testid="reviewer-mark" title={`Set by the reviewer: ${threshold!.toUpperCase()}, reviewer log entry ${override.seq}`}>
      {' '}
      ✎ reviewer-set (entry {override.seq})
    </span>
  );
}
