/**
 * A failed try leaves no case behind, and the demo pair reopens its case: the case store's
 * `discardUnreviewed` and `findSame`. References: the folder on disk (it is there or not),
 * the files' identity by content (the same bytes under another title are another case).
 */
import { existsSync, mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeEach, describe, expect, it } from 'vitest';
import { createCaseStore } from '../../../host/workbench/case-store';
import { DEMO_FOLDER, DEMO_PAIR } from '../../../host/demo-job';
import { DEFAULT_SETTINGS } from '../../../core/model/settings';
import { noClinicalInputs } from '../../../core/analyze/analyze-test';
import { caseFromText, caseToText } from '../../../core/case/case-text';
import { recordSignOff } from '../../../core/case/review';

const payload = (name: string) => ({ name, base64: readFileSync(join(DEMO_FOLDER, name)).toString('base64') });
const clinical = { day1: noClinicalInputs(), day2: noClinicalInputs() };
let store: ReturnType<typeof createCaseStore>;

beforeEach(() => {
  const dataDir = mkdtempSync(join(tmpdir(), 'twofold-discard-'));
  let clock = Date.parse('2026-03-09T08:10:00Z');
  let n = 0;
  store = createCaseStore({ dataDir, now: () => new Date((clock += 1000)), randomHex6: () => (n++).toString(16).padStart(6, '0') });
});

function make(title: string, day1 = DEMO_PAIR.day1, day2 = DEMO_PAIR.day2) {
  const made = store.create(title, payload(day1), payload(day2), DEFAULT_SETTINGS, clinical);
  if (!made.ok) throw new Error(made.error.message);
  return made.value.caseId;
}

describe('discarding a case that holds no work', () => {
  it('removes a just-made case, so Recent cases no longer lists it', () => {
    const id = make('Pair A');
    expect(store.discardUnreviewed(id)).toEqual({ ok: true, value: { discarded: true } });
    expect(existsSync(store.folderOf(id))).toBe(false);
    expect(store.list()).toEqual([]);
  });

  it('keeps a case with a reviewer log entry', () => {
    const id = make('Pair A');
    const opened = store.open(id);
    if (!opened.ok) throw new Error(opened.error.message);
    const parsed = caseFromText(opened.value.caseJson, 'case');
    if (!parsed.ok) throw new Error(parsed.error.message);
    const signed = recordSignOff(parsed.value, { who: 'R. Okafor', role: 'physiologist', at: '2026-03-09T09:00:00Z' }, 'Reviewed.', 'checked');
    if (!signed.ok) throw new Error(signed.error.message);
    expect(store.save(id, caseToText(signed.value)).ok).toBe(true);
    const refused = store.discardUnreviewed(id);
    expect(refused.ok).toBe(false);
    if (!refused.ok) expect(refused.error.code).toBe('case-has-work');
    expect(existsSync(store.folderOf(id))).toBe(true);
    expect(store.list().map((c) => c.caseId)).toEqual([id]);
  });
});

describe('finding the case of a pair already opened', () => {
  it('finds the case with the same title and the same two files, and nothing else', () => {
    expect(store.findSame('Pair A', payload(DEMO_PAIR.day1), payload(DEMO_PAIR.day2))).toBeNull();
    const id = make('Pair A');
    make('Pair B');
    expect(store.findSame('Pair A', payload(DEMO_PAIR.day1), payload(DEMO_PAIR.day2))).toBe(id);
    // Same title, days swapped: other files on each day, so not the same case.
    expect(store.findSame('Pair A', payload(DEMO_PAIR.day2), payload(DEMO_PAIR.day1))).toBeNull();
  });
});
