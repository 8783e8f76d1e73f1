/**
 * Records the demo's invented follow-up reports (sample-tests/scenario/demo-follow-ups.ts) in
 * a case, each with its reason, a slip entered and then corrected as a lab would.
 */
import type { CaseFile } from '../core/case/case-file';
import { recordFollowUp, recordFollowUpCorrection } from '../core/case/follow-ups';
import type { Reviewer } from '../core/case/review';
import type { Result } from '../core/model/errors';
import { DEMO_FOLLOW_UPS } from '../sample-tests/scenario/demo-follow-ups';

export function recordDemoFollowUps(caseFile: CaseFile, recorder: Reviewer): Result<CaseFile> {
  let current = caseFile;
  for (const item of DEMO_FOLLOW_UPS) {
    const added = recordFollowUp(current, recorder, item.enteredAs ?? item.report, item.reason);
    if (!added.ok) return added;
    current = added.value;
    if (item.enteredAs) {
      const seq = current.log[current.log.length - 1].seq;
      const corrected = recordFollowUpCorrection(current, recorder, seq, item.report, item.correctionReason ?? 'Correction.');
      if (!corrected.ok) return corrected;
      current = corrected.value;
    }
  }
  return { ok: true, value: current };
}
