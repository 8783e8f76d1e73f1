// A reviewer log that is emptied or cut short must not read as valid (issue 12, item 3).
// Version 2 cases always start with their opening entry; only a version 1 case (written before
// opening entries existed) with an empty log is migrated, and then visibly (`migrated: true`).
// What the case alone cannot show (its last entries removed) a report's log head shows.
import { describe, expect, it } from 'vitest';
import { anchorHash, verifyLog } from '../../../core/case/audit-log';
import { CASE_VERSION, type CaseFile } from '../../../core/case/case-file';
import { caseFromText, caseToText } from '../../../core/case/case-text';
import { logHeadOf, logShortenedFrom } from '../../../core/report/build-record';
import { caseWithLog, smallCase } from './fixtures';

/** The case as text with its log replaced by `log` and, optionally, its version set. */
function edited(c: CaseFile, log: CaseFile['log'], version?: number): string {
  return caseToText({ ...c, ...(version === undefined ? {} : { version: version as 1 }), log });
}

describe('a log that cannot be emptied or cut short silently', () => {
  it('new cases are written as version 2 and start with their opening entry', () => {
    const c = smallCase();
    expect(CASE_VERSION).toBe(2);
    expect(c.version).toBe(2);
    expect(c.log).toHaveLength(1);
    expect(c.log[0].action).toEqual({ kind: 'case-opened', migrated: false });
  });

  it('a version 2 case whose log was emptied is refused, pointing at the log line', () => {
    const c = caseWithLog();
    const text = edited(c, []);
    const r = caseFromText(text, 'case.json');
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.error.code).toBe('log-empty');
    expect(r.error.file).toBe('case.json');
    expect(text.split('\n')[(r.error.line ?? 0) - 1]).toMatch(/^\s*"log": \[\]/);
    expect(r.error.message).toMatch(/entries have been removed/);
  });

  it('a version 2 case whose opening entry was removed (reviewer entries kept) is refused', () => {
    const c = caseWithLog();
    const r = caseFromText(edited(c, c.log.slice(1)), 'case.json');
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.error.code).toBe('log-order');
  });

  it('a version 2 case with its last entry removed still chains, and the head a report recorded shows the cut', () => {
    const c = caseWithLog();
    const head = logHeadOf(c); // what a report made from the whole case records
    expect(head.entries).toBe(4);
    const cut = caseFromText(edited(c, c.log.slice(0, -1)), 'case.json');
    expect(cut.ok).toBe(true); // the remaining entries are a valid chain on their own
    if (!cut.ok) return;
    expect(logShortenedFrom(cut.value, head)).toMatch(/has 3 entries, but a report made from it recorded 4/);
    expect(logShortenedFrom(c, head)).toBeNull();
  });

  it('a version 1 case with an empty log (made before opening entries) is migrated, visibly, and chains to its version 1 anchor', () => {
    const v1 = { ...smallCase(), version: 1 as const };
    const r = caseFromText(edited(v1, []), 'old.json');
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value.version).toBe(1); // the version is part of the anchor, so it is kept
    expect(r.value.log).toHaveLength(1);
    expect(r.value.log[0].action).toEqual({ kind: 'case-opened', migrated: true });
    expect(r.value.log[0].prevHash).toBe(anchorHash({ ...v1, version: 1 }));
    expect(anchorHash({ ...v1, version: 1 })).not.toBe(anchorHash({ ...v1, version: 2 }));
    expect(verifyLog(r.value).ok).toBe(true);
  });

  it('a version 2 case emptied and relabelled version 1 reads only as migrated, and a report head catches it', () => {
    const c = caseWithLog();
    const r = caseFromText(edited(c, [], 1), 'case.json');
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    // It cannot pass as an unreviewed case of its own time: its opening entry says migrated...
    expect(r.value.log[0].action).toEqual({ kind: 'case-opened', migrated: true });
    // ...and against a report made before the cut, the log does not continue that report's head.
    expect(logShortenedFrom(r.value, logHeadOf(c))).toMatch(/has 1 entry, but a report made from it recorded 4/);
  });

  it('a version this Twofold does not read is refused, naming the versions it reads', () => {
    const r = caseFromText(edited(smallCase(), smallCase().log, 3), 'case.json');
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.error.message).toBe('This case file is version 3; this Twofold reads versions 1 and 2 (it writes version 2).');
  });
});
