// The reviewer log's hash chain, checked against hashes recomputed independently with
// Node's crypto over canonical JSON written out by hand, and against tampering.
import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { anchorHash, appendEntry, verifyLog } from '../../../core/case/audit-log';
import { caseFromText, caseToText } from '../../../core/case/case-text';
import { caseWithLog, smallCase } from './fixtures';

const sha = (s: string) => createHash('sha256').update(s, 'utf8').digest('hex');

describe('audit log', () => {
  it('hashes an entry as SHA-256 of its canonical body, chained to the anchor', () => {
    const c = caseWithLog();
    const e = c.log[0];
    // Keys in code-unit order: action, at, prevHash, reason, role, seq, who; action's keys likewise.
    const body =
      `{"action":{"after":{"timeS":570,"vo2MlMin":1320},"before":{"timeS":600,"vo2MlMin":1400},"day":2,"givenAs":"time","kind":"set-threshold","threshold":"vt1"},` +
      `"at":"2026-03-10T09:00:00Z","prevHash":"${anchorHash(c)}","reason":"reason 1","role":"exercise physiologist","seq":1,"who":"R. Reviewer"}`;
    expect(e.hash).toBe(sha(body));
    expect(c.log[1].prevHash).toBe(c.log[0].hash);
    expect(verifyLog(c).ok).toBe(true);
  });

  it('refuses an entry without a reason', () => {
    const r = appendEntry(smallCase(), { at: '2026-03-10T09:00:00Z', who: 'R', role: 'r', reason: '  ', action: { kind: 'sign-off', statement: 'ok' } });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.error.code).toBe('review-field-missing');
  });

  it('names the entry whose content was edited', () => {
    const c = caseWithLog();
    const edited = { ...c, log: c.log.map((e) => (e.seq === 2 ? { ...e, reason: 'a better-sounding reason' } : e)) };
    const r = verifyLog(edited);
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.error.code).toBe('log-entry-altered');
      expect(r.error.message).toContain('entry 2');
    }
  });

  it('detects a removed entry and a changed setting', () => {
    const c = caseWithLog();
    const removed = verifyLog({ ...c, log: [c.log[0], c.log[2]] });
    expect(!removed.ok && removed.error.code).toBe('log-order');
    const resettled = verifyLog({ ...c, settings: { ...c.settings, peaks: { windowS: 20 } } });
    expect(!resettled.ok && resettled.error.code).toBe('log-chain-broken');
  });

  it('round-trips through text, and a hand-edited file is refused with the entry and its line', () => {
    const c = caseWithLog();
    const text = caseToText(c);
    const back = caseFromText(text, 'case.json');
    expect(back.ok && back.value).toEqual(c);
    const tampered = text.replace('"vo2MlMin": 1290', '"vo2MlMin": 1390');
    const r = caseFromText(tampered, 'case.json');
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.error.message).toContain('entry 2');
      const line = tampered.split('\n')[(r.error.line ?? 0) - 1];
      expect(line).toContain('"seq": 2');
    }
  });

  it('refuses a case file that fails the schema, naming the field', () => {
    const text = caseToText(smallCase()).replace(/"sha256": "[0-9a-f]{64}"/, '"sha256": "nothex"');
    const r = caseFromText(text, 'case.json');
    expect(!r.ok && r.error.code).toBe('case-invalid');
    if (!r.ok) expect(r.error.message).toContain('inputs.day1.sha256');
  });
});
