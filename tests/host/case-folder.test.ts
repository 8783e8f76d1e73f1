// The case folder: raw copies stored under their SHA-256 and never replaced, and loading
// refuses a changed raw copy or an edited history with a located error.
import { createHash } from 'node:crypto';
import { mkdtempSync, readFileSync, writeFileSync, mkdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { caseFilePath, loadCase, saveCase, storeRaw } from '../../host/case-folder';
import { caseWithLog } from '../core/case/fixtures';

const raw = { day1: new TextEncoder().encode('time_s,vo2\n1,300\n'), day2: new TextEncoder().encode('time_s,vo2\n1,310\n') };

describe('case folder', () => {
  it('stores each raw file as raw/<sha256>.<ext> (the hash as sha256sum computes it) and loads the case back', () => {
    const folder = mkdtempSync(join(tmpdir(), 'twofold-case-'));
    const c = caseWithLog();
    expect(saveCase(folder, c, raw).ok).toBe(true);
    const sha = createHash('sha256').update(raw.day1).digest('hex');
    expect(c.inputs.day1.storedAs).toBe(`raw/${sha}.csv`);
    expect(readFileSync(join(folder, c.inputs.day1.storedAs))).toEqual(Buffer.from(raw.day1));
    const loaded = loadCase(folder);
    expect(loaded.ok && loaded.value.caseFile).toEqual(c);
  });

  it('refuses to replace a different file already at a raw path, and leaves it untouched', () => {
    const folder = mkdtempSync(join(tmpdir(), 'twofold-case-'));
    const c = caseWithLog();
    mkdirSync(join(folder, 'raw'));
    writeFileSync(join(folder, c.inputs.day1.storedAs), 'someone else');
    const r = storeRaw(folder, c.inputs.day1, raw.day1);
    expect(!r.ok && r.error.code).toBe('raw-exists-different');
    expect(readFileSync(join(folder, c.inputs.day1.storedAs), 'utf8')).toBe('someone else');
  });

  it('refuses a case whose raw copy was changed', () => {
    const folder = mkdtempSync(join(tmpdir(), 'twofold-case-'));
    const c = caseWithLog();
    saveCase(folder, c, raw);
    writeFileSync(join(folder, c.inputs.day2.storedAs), 'time_s,vo2\n1,999\n');
    const r = loadCase(folder);
    expect(!r.ok && r.error.code).toBe('raw-changed');
  });

  it('refuses a case whose history was edited, naming the entry and its line', () => {
    const folder = mkdtempSync(join(tmpdir(), 'twofold-case-'));
    saveCase(folder, caseWithLog(), raw);
    const path = caseFilePath(folder);
    const text = readFileSync(path, 'utf8');
    writeFileSync(path, text.replace('"who": "R. Reviewer"', '"who": "Somebody Else"'));
    const r = loadCase(folder);
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.error.message).toContain('entry 1');
      expect(r.error.file).toBe(path);
      expect(r.error.line).toBeGreaterThan(1);
    }
  });
});
