/**
 * The workbench's case folders. References: SHA-256 computed here with Node's own crypto
 * (OpenSSL), independent of the project's hashing; case ids worked by hand from a fixed
 * clock; the hash-chained reviewer log must refuse an edited entry (core/case/audit-log.ts
 * states the rule; the tampering is done by hand here).
 */
import { createHash } from 'node:crypto';
import { existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeEach, describe, expect, it } from 'vitest';
import { createCaseStore, newCaseId } from '../../../host/workbench/case-store';
import { DEMO_FOLDER, DEMO_PAIR } from '../../../host/demo-job';
import { DEFAULT_SETTINGS } from '../../../core/model/settings';
import { noClinicalInputs } from '../../../core/analyze/analyze-test';
import { caseFromText, caseToText } from '../../../core/case/case-text';
import { appendEntry } from '../../../core/case/audit-log';
import { resealOpening } from '../../../core/case/opening';

const payload = (name: string) => ({ name, base64: readFileSync(join(DEMO_FOLDER, name)).toString('base64') });
const clinical = { day1: noClinicalInputs(), day2: noClinicalInputs() };

let dataDir: string;
let clock: number;
let store: ReturnType<typeof createCaseStore>;

beforeEach(() => {
  dataDir = mkdtempSync(join(tmpdir(), 'twofold-cases-'));
  clock = Date.parse('2026-03-09T08:10:00Z');
  let n = 0;
  store = createCaseStore({ dataDir, now: () => new Date((clock += 1000)), randomHex6: () => (n++).toString(16).padStart(6, '0') });
});

function created() {
  const result = store.create('Pair A', payload(DEMO_PAIR.day1), payload(DEMO_PAIR.day2), DEFAULT_SETTINGS, clinical);
  if (!result.ok) throw new Error(result.error.message);
  return result.value;
}

/** A new case, reopened, with one sign-off entry appended (not yet saved). */
function createdWithEntry() {
  const summary = created();
  const opened = store.open(summary.caseId);
  if (!opened.ok) throw new Error(opened.error.message);
  const caseFile = caseFromText(opened.value.caseJson, 'case');
  if (!caseFile.ok) throw new Error(caseFile.error.message);
  const next = appendEntry(caseFile.value, { at: '2026-03-09T09:00:00Z', who: 'R. Okafor', role: 'physiologist', reason: 'checked', action: { kind: 'sign-off', statement: 'Reviewed.' } });
  if (!next.ok) throw new Error(next.error.message);
  return { summary, next };
}

describe('case store', () => {
  it('names a case by its creation time and a random suffix', () => {
    // 2026-03-09T08:10:00Z → date 20260309, time 081000.
    expect(newCaseId(new Date('2026-03-09T08:10:00Z'), 'abc123')).toBe('case-20260309-081000-abc123');
  });

  it('copies each breath file verbatim under its SHA-256 and writes the case file', () => {
    const summary = created();
    const folder = store.folderOf(summary.caseId);
    for (const name of [DEMO_PAIR.day1, DEMO_PAIR.day2]) {
      const bytes = readFileSync(join(DEMO_FOLDER, name));
      const sha = createHash('sha256').update(bytes).digest('hex');
      expect(readFileSync(join(folder, 'raw', `${sha}.csv`)).equals(bytes)).toBe(true);
    }
    expect(existsSync(join(folder, 'twofold-case.json'))).toBe(true);
    expect(summary).toMatchObject({ title: 'Pair A', day1Name: DEMO_PAIR.day1, day2Name: DEMO_PAIR.day2 });
  });

  it('reopens a case with the same bytes it was given', () => {
    const summary = created();
    const opened = store.open(summary.caseId);
    expect(opened.ok).toBe(true);
    if (!opened.ok) return;
    expect(opened.value.day1).toEqual(payload(DEMO_PAIR.day1));
    expect(opened.value.day2).toEqual(payload(DEMO_PAIR.day2));
    expect(caseFromText(opened.value.caseJson, 'case').ok).toBe(true);
  });

  it('saves a case with a new reviewer entry, and it is there on reopening', () => {
    const { summary, next } = createdWithEntry();
    const saved = store.save(summary.caseId, caseToText(next.value));
    expect(saved.ok).toBe(true);
    const again = store.open(summary.caseId);
    if (!again.ok) throw new Error(again.error.message);
    const reread = caseFromText(again.value.caseJson, 'case');
    expect(reread.ok && reread.value.log.slice(1).map((e) => e.reason)).toEqual(['checked']);
    expect(reread.ok && reread.value.log[0].action.kind).toBe('case-opened');
  });

  it('refuses to save a case whose log entry was edited, and keeps the saved one', () => {
    const { summary, next } = createdWithEntry();
    const forged = caseToText(next.value).replace('"reason": "checked"', '"reason": "changed later"');
    const before = readFileSync(join(store.folderOf(summary.caseId), 'twofold-case.json'), 'utf8');
    const result = store.save(summary.caseId, forged);
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.error.code).toBe('log-entry-altered');
    expect(readFileSync(join(store.folderOf(summary.caseId), 'twofold-case.json'), 'utf8')).toBe(before);
  });

  it('refuses to save a case whose log drops the entry on disk, and keeps the saved one', () => {
    const { summary, next } = createdWithEntry();
    expect(store.save(summary.caseId, caseToText(next.value)).ok).toBe(true);
    const before = readFileSync(join(store.folderOf(summary.caseId), 'twofold-case.json'), 'utf8');
    // The sign-off removed: what is left (the opening entry) is a valid chain on its own.
    const result = store.save(summary.caseId, caseToText({ ...next.value, log: next.value.log.slice(0, 1) }));
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.error).toMatchObject({ code: 'log-shortened', message: expect.stringMatching(/has 1 entry, but a report made from it recorded 2/) });
    expect(readFileSync(join(store.folderOf(summary.caseId), 'twofold-case.json'), 'utf8')).toBe(before);
  });

  it('still saves a case whose only entry, the opening, was made again for new clinical inputs', () => {
    const summary = created();
    const opened = store.open(summary.caseId);
    if (!opened.ok) throw new Error(opened.error.message);
    const c = caseFromText(opened.value.caseJson, 'case');
    if (!c.ok) throw new Error(c.error.message);
    const changed = resealOpening({ ...c.value, clinical: { ...c.value.clinical, day1: { ...c.value.clinical.day1, peakRpe: 19 } } });
    expect(changed.log[0].hash).not.toBe(c.value.log[0].hash);
    expect(store.save(summary.caseId, caseToText(changed)).ok).toBe(true);
    expect(store.open(summary.caseId).ok).toBe(true);
  });

  it('refuses to open a case whose log on disk was cut short after the workbench saved it', () => {
    const { summary, next } = createdWithEntry();
    expect(store.save(summary.caseId, caseToText(next.value)).ok).toBe(true);
    // Cut by hand on disk: the sign-off removed, the rest left as a valid chain.
    writeFileSync(join(store.folderOf(summary.caseId), 'twofold-case.json'), caseToText({ ...next.value, log: next.value.log.slice(0, 1) }));
    const opened = store.open(summary.caseId);
    expect(opened.ok).toBe(false);
    if (!opened.ok) expect(opened.error).toMatchObject({ code: 'log-shortened', message: expect.stringMatching(/entries were removed.*was not opened/) });
  });

  it('refuses a case that names other breath files than its folder holds', () => {
    const a = created();
    const b = store.create('Pair B', payload('qh0522-day1.csv'), payload('qh0522-day2.csv'), DEFAULT_SETTINGS, clinical);
    if (!b.ok) throw new Error(b.error.message);
    const other = store.open(b.value.caseId);
    if (!other.ok) throw new Error(other.error.message);
    const result = store.save(a.caseId, other.value.caseJson);
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.error.code).toBe('case-inputs-differ');
  });

  it('lists the most recently saved case first', () => {
    const first = created();
    const second = created();
    expect(store.list().map((c) => c.caseId)).toEqual([second.caseId, first.caseId]);
    const opened = store.open(first.caseId);
    if (!opened.ok) throw new Error(opened.error.message);
    store.save(first.caseId, opened.value.caseJson);
    expect(store.list().map((c) => c.caseId)).toEqual([first.caseId, second.caseId]);
  });
});
