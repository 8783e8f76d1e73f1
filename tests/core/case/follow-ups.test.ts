// Follow-up reports in the case file: a round trip through the case text and its zod schema,
// a correction kept with its reason (the original stays in the log), a struck-out report, and
// an edited report caught by the hash chain on load (Haber et al.'s linked chain, as the
// rest of the log). Expected values are the reports written in each test.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { caseFromText, caseToText } from '../../../core/case/case-text';
import { followUpNumbers, followUpsOf, recordFollowUp, recordFollowUpCorrection } from '../../../core/case/follow-ups';
import { currentSignOff } from '../../../core/case/overrides';
import { recordSignOff } from '../../../core/case/review';
import type { CaseFile } from '../../../core/case/case-file';
import { report, RECORDER } from '../followup/fixtures';
import { smallCase } from './fixtures';

function must(r: { ok: true; value: CaseFile } | { ok: false; error: { message: string } }): CaseFile {
  if (!r.ok) throw new Error(r.error.message);
  return r.value;
}

function withFollowUps(): CaseFile {
  let c = smallCase();
  c = must(recordFollowUp(c, RECORDER, report(1, 22, false, { fatigue: 6, 'thinking and memory': 4 }, { note: 'slept badly' }), 'Call before the second test.'));
  c = must(recordFollowUp(c, RECORDER, report(2, 27, false, { fatigue: 8 }, { reportedBy: 'partner' }), 'Call after the second test.'));
  return c;
}

describe('follow-ups in the case file', () => {
  it('round-trips through the case text and the schema, and its entries chain like every reviewer action', () => {
    const c = withFollowUps();
    const text = caseToText(c);
    const back = caseFromText(text, 'twofold-case.json');
    if (!back.ok) throw new Error(back.error.message);
    expect(back.value).toEqual(c);
    // Entry 0 opens the case (core/case/opening.ts); the two follow-ups are entries 1 and 2.
    expect(back.value.log.map((e) => e.action.kind)).toEqual(['case-opened', 'follow-up', 'follow-up']);
    expect(back.value.log.map((e) => e.seq)).toEqual([0, 1, 2]);
    expect(back.value.log[1].prevHash).toBe(back.value.log[0].hash);
    expect(back.value.log[2].prevHash).toBe(back.value.log[1].hash);
    expect(followUpsOf(back.value.log).map((f) => f.report?.afterTestH)).toEqual([22, 27]);
  });

  it('still loads a case file written before follow-ups existed', () => {
    const old = readFileSync(join(__dirname, 'case-before-column-maps.json'), 'utf8');
    const loaded = caseFromText(old, 'old.json');
    expect(loaded.ok).toBe(true);
    if (loaded.ok) {
      expect(followUpsOf(loaded.value.log)).toEqual([]);
      expect(followUpNumbers(loaded.value.log)).toEqual({});
    }
  });

  it('refuses a report with a rating outside 0–10 or a missing reporter, naming the field', () => {
    const bad = recordFollowUp(smallCase(), RECORDER, report(1, 22, false, { fatigue: 11 }), 'call');
    expect(bad.ok ? null : bad.error.message).toContain('ratings.0.score');
    const nobody = recordFollowUp(smallCase(), RECORDER, report(1, 22, false, {}, { reportedBy: ' ' }), 'call');
    expect(nobody.ok ? null : nobody.error.message).toContain('reportedBy');
    const noReason = recordFollowUp(smallCase(), RECORDER, report(1, 22, false), ' ');
    expect(noReason.ok ? null : noReason.error.code).toBe('review-field-missing');
  });

  it('keeps a correction as a new entry with its reason; the original stays in the log', () => {
    const c = withFollowUps();
    const corrected = must(recordFollowUpCorrection(c, { ...RECORDER, at: '2026-03-13T09:00:00Z' }, 2, report(2, 72, false, { fatigue: 8 }, { reportedBy: 'partner' }), 'Typed 27 h; the call was at 72 h.'));
    // Entry 0 opens the case, so the log holds it, follow-ups 1 and 2, and the correction (3).
    expect(corrected.log).toHaveLength(4);
    expect(corrected.log[2]).toEqual(c.log[2]); // the corrected entry (seq 2) is untouched
    expect(corrected.log[3]).toMatchObject({ seq: 3, reason: 'Typed 27 h; the call was at 72 h.', action: { kind: 'follow-up-correction', corrects: 2 } });
    const item = followUpsOf(corrected.log).find((f) => f.seq === 2)!;
    expect(item.report?.afterTestH).toBe(72);
    expect(item.original.afterTestH).toBe(27);
    expect(item.corrections).toEqual([{ seq: 3, at: '2026-03-13T09:00:00Z', who: 'C. Coordinator', reason: 'Typed 27 h; the call was at 72 h.', struck: false }]);
    // Survives a save and a load.
    const back = caseFromText(caseToText(corrected), 'c.json');
    expect(back.ok && followUpsOf(back.value.log)[1].corrections[0].reason).toBe('Typed 27 h; the call was at 72 h.');
    // A correction needs a reason, names a follow-up, and changes something.
    expect(recordFollowUpCorrection(c, RECORDER, 2, report(2, 72, false), '').ok).toBe(false);
    const unknown = recordFollowUpCorrection(c, RECORDER, 9, report(2, 72, false), 'x');
    expect(unknown.ok ? null : unknown.error.code).toBe('follow-up-unknown');
    // Follow-up 1 is at index 1 (entry 0 opens the case); correcting it to its own report changes nothing.
    expect(c.log[1]).toMatchObject({ seq: 1, action: { kind: 'follow-up' } });
    const same = recordFollowUpCorrection(c, RECORDER, 1, c.log[1].action.kind === 'follow-up' ? c.log[1].action.report : null, 'x');
    expect(same.ok ? null : same.error.code).toBe('follow-up-unchanged');
  });

  it('strikes out a report entered in error, and refuses to correct it afterwards', () => {
    const struck = must(recordFollowUpCorrection(withFollowUps(), RECORDER, 1, null, 'Entered in the wrong case.'));
    const item = followUpsOf(struck.log).find((f) => f.seq === 1)!;
    expect(item.report).toBeNull();
    expect(item.corrections[0]).toMatchObject({ struck: true, reason: 'Entered in the wrong case.' });
    const again = recordFollowUpCorrection(struck, RECORDER, 1, report(1, 22, true), 'x');
    expect(again.ok ? null : again.error.code).toBe('follow-up-struck');
  });

  it('catches a rating edited in the file after it was recorded, naming the entry and its line', () => {
    const text = caseToText(withFollowUps());
    const edited = text.replace('"score": 8', '"score": 3');
    expect(edited).not.toBe(text);
    const loaded = caseFromText(edited, 'twofold-case.json');
    expect(loaded.ok).toBe(false);
    if (loaded.ok) return;
    expect(loaded.error.code).toBe('log-entry-altered');
    expect(loaded.error.message).toContain('entry 2');
    const lines = edited.split('\n');
    expect(lines[(loaded.error.line ?? 0) - 1]).toMatch(/"seq": 2\b/);
  });

  it('a follow-up recorded after a sign-off leaves it no longer covering what the report shows', () => {
    const signed = must(recordSignOff(withFollowUps(), RECORDER, 'Reviewed.', 'done'));
    expect(currentSignOff(signed.log)?.seq).toBe(3);
    const later = must(recordFollowUp(signed, RECORDER, report(2, 168, true), 'one-week call'));
    expect(currentSignOff(later.log)).toBeNull();
  });
});
