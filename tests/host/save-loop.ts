/**
 * Child process for the kill-mid-save test: saves a growing case again and again into the
 * folder given as argv[2], printing "saved N" (N = log entries) after each completed save.
 */
import { appendEntry } from '../../core/case/audit-log';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { caseFromText } from '../../core/case/case-text';
import { saveCase } from '../../host/case-folder';
import { caseWithLog } from '../core/case/fixtures';

const folder = process.argv[2];
let c = caseWithLog();
const raw = { day1: new TextEncoder().encode('time_s,vo2\n1,300\n'), day2: new TextEncoder().encode('time_s,vo2\n1,310\n') };
// Long entries make each save about 8 MB, so that writing (not building) the file takes most
// of each cycle and a kill often lands inside a write.
for (let i = 0; i < 200; i++) {
  const r = appendEntry(c, { at: '2026-03-10T10:00:00Z', who: 'R. Reviewer', role: 'exercise physiologist', reason: `padding ${i} ${'x'.repeat(40_000)}`, action: { kind: 'sign-off', statement: 'ok' } });
  if (r.ok) c = r.value;
}
// A folder left by an earlier, killed child is continued: a save never drops entries already on disk.
try {
  const onDisk = caseFromText(readFileSync(join(folder, 'twofold-case.json'), 'utf8'), 'on disk');
  if (onDisk.ok && onDisk.value.log.length > c.log.length) c = onDisk.value;
} catch {
  // No case there yet.
}
for (;;) {
  const r = appendEntry(c, { at: '2026-03-10T11:00:00Z', who: 'R. Reviewer', role: 'exercise physiologist', reason: 'another save', action: { kind: 'sign-off', statement: 'ok' } });
  if (!r.ok) throw new Error(r.error.message);
  c = r.value;
  const saved = saveCase(folder, c, raw);
  if (!saved.ok) throw new Error(saved.error.message);
  process.stdout.write(`saved ${c.log.length}\n`);
}
