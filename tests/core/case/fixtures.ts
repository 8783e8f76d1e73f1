/** A small case built in memory (no engine needed) for the log and text tests. */
import { newCase } from '../../../core/case/new-case';
import { DEFAULT_SETTINGS } from '../../../core/model/settings';
import type { CaseFile } from '../../../core/case/case-file';
import { appendEntry } from '../../../core/case/audit-log';

const clinical = { peakRpe: null, lactateMmolL: null, fev1L: null, mvvLMin: null, restingHrBpm: 62 };

export function smallCase(): CaseFile {
  return newCase(
    '2026-03-10T08:00:00Z',
    { name: 'day1.csv', bytes: new TextEncoder().encode('time_s,vo2\n1,300\n') },
    { name: 'day2.csv', bytes: new TextEncoder().encode('time_s,vo2\n1,310\n') },
    DEFAULT_SETTINGS,
    { day1: clinical, day2: clinical },
  );
}

export function caseWithLog(): CaseFile {
  let c = smallCase();
  const steps = [
    { kind: 'set-threshold', day: 2, threshold: 'vt1', givenAs: 'time', before: { timeS: 600, vo2MlMin: 1400 }, after: { timeS: 570, vo2MlMin: 1320 } },
    { kind: 'set-threshold', day: 2, threshold: 'vt1', givenAs: 'vo2', before: { timeS: 570, vo2MlMin: 1320 }, after: { timeS: 555, vo2MlMin: 1290 } },
    { kind: 'withdraw', withdraws: 2, day: 2, threshold: 'vt1', before: { timeS: 555, vo2MlMin: 1290 }, after: { timeS: 570, vo2MlMin: 1320 } },
  ] as const;
  steps.forEach((action, i) => {
    const r = appendEntry(c, { at: `2026-03-10T09:0${i}:00Z`, who: 'R. Reviewer', role: 'exercise physiologist', action, reason: `reason ${i + 1}` });
    if (!r.ok) throw new Error(r.error.message);
    c = r.value;
  });
  return c;
}
