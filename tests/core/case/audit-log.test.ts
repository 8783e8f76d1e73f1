// The reviewer log's hash chain, checked against hashes recomputed independently with
// Node's crypto over canonical JSON written out by hand, and against tampering.
import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { anchorHash, appendEntry, verifyLog } from '../../../core/case/audit-log';
import { canonicalJson } from '../../../core/case/canonical-json';
import { caseFromText, caseToText } from '../../../core/case/case-text';
import { withColumnMaps } from '../../../core/case/new-case';
import { caseWithLog, smallCase } from './fixtures';

const sha = (s: string) => createHash('sha256').update(s, 'utf8').digest('hex');

describe('audit log', () => {
  it('hashes an entry as SHA-256 of its canonical body, chained to the anchor', () => {
    const c = caseWithLog();
    // Entry 0 is the opening entry, chained to the anchor (core/case/opening.ts); entry 1 to it.
    expect(c.log[0].action.kind).toBe('case-opened');
    expect(c.log[0].prevHash).toBe(anchorHash(c));
    const e = c.log[1];
    // Keys in code-unit order: action, at, prevHash, reason, role, seq, who; action's keys likewise.
    const body =
      `{"action":{"after":{"timeS":570,"vo2MlMin":1320},"before":{"timeS":600,"vo2MlMin":1400},"day":2,"givenAs":"time","kind":"set-threshold","threshold":"vt1"},` +
      `"at":"2026-03-10T09:00:00Z","prevHash":"${c.log[0].hash}","reason":"reason 1","role":"exercise physiologist","seq":1,"who":"R. Reviewer"}`;
    expect(e.hash).toBe(sha(body));
    expect(c.log[2].prevHash).toBe(c.log[1].hash);
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

describe('audit log: the anchor covers each day\'s column map', () => {
  const map = { format: 'twofold-column-map', version: 1, columns: [{ header: 'cardiac_beats', variable: 'hrBpm', unit: 'bpm' }] } as const;
  const mapped = () => {
    const r = withColumnMaps(smallCase(), { day1: map, day2: null });
    if (!r.ok) throw new Error(r.error.message);
    return r.value;
  };

  it('a day without a map hashes as before the field existed; a map changes the anchor', () => {
    const c = smallCase();
    const { columnMap: _a, ...day1 } = c.inputs.day1;
    const { columnMap: _b, ...day2 } = c.inputs.day2;
    expect(anchorHash({ ...c, inputs: { day1, day2 } })).toBe(anchorHash(c));
    expect(anchorHash(mapped())).not.toBe(anchorHash(c));
  });

  it('the anchor is the SHA-256 of the canonical JSON with the map inside the day it reads', () => {
    const c = mapped();
    const plainAnchor = canonicalJson({ ...c, inputs: { day1: { name: c.inputs.day1.name, sha256: c.inputs.day1.sha256 }, day2: { name: c.inputs.day2.name, sha256: c.inputs.day2.sha256 } }, log: undefined, recorded: undefined });
    if (!plainAnchor.ok) throw new Error(plainAnchor.error.message);
    // Written out by hand: keys in code-unit order, so "columnMap" sorts before "name" in day1.
    const day1 = `"day1":{"columnMap":{"columns":[{"header":"cardiac_beats","unit":"bpm","variable":"hrBpm"}],"format":"twofold-column-map","version":1},"name":"day1.csv","sha256":"${c.inputs.day1.sha256}"}`;
    const expected = plainAnchor.value.replace(`"day1":{"name":"day1.csv","sha256":"${c.inputs.day1.sha256}"}`, day1);
    expect(expected).toContain('"columnMap"');
    expect(anchorHash(c)).toBe(sha(expected));
  });

  it('editing a recorded map after a review entry breaks the chain at entry 1', () => {
    const reviewed = appendEntry(mapped(), { at: '2026-03-10T09:00:00Z', who: 'R. Reviewer', role: 'exercise physiologist', reason: 'checked', action: { kind: 'sign-off', statement: 'Reviewed.' } });
    if (!reviewed.ok) throw new Error(reviewed.error.message);
    const text = caseToText(reviewed.value);
    expect(caseFromText(text, 'case.json').ok).toBe(true);
    const r = caseFromText(text.replace('"unit": "bpm"', '"unit": "1/min"'), 'case.json');
    expect(r.ok ? null : [r.error.code, r.error.message.includes('column maps')]).toEqual(['log-chain-broken', true]);
    // Removing the map (as if the file said "read it with detection alone") breaks it too.
    const data = JSON.parse(text) as { inputs: { day1: { columnMap?: unknown } } };
    delete data.inputs.day1.columnMap;
    const removed = caseFromText(JSON.stringify(data, null, 2), 'case.json');
    expect(removed.ok ? null : removed.error.code).toBe('log-chain-broken');
  });
});
