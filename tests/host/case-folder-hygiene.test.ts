// Case-folder hygiene (issue items: temporary files of killed saves left forever, input names
// with folders, JSON errors at 0:0, an unreadable raw copy called missing, 0644 files in 0755
// folders). Permission bits as stat(2) reports them; JSON positions counted in the text.
import { chmodSync, mkdirSync, mkdtempSync, readdirSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { caseFromText, caseToText } from '../../core/case/case-text';
import { newCase } from '../../core/case/new-case';
import { noClinicalInputs } from '../../core/analyze/analyze-test';
import { DEFAULT_SETTINGS } from '../../core/model/settings';
import { loadCase, saveCase } from '../../host/case-folder';

const bytes = (s: string) => new TextEncoder().encode(s);
const raw = { day1: bytes('time_s,vo2\n1,300\n'), day2: bytes('time_s,vo2\n1,310\n') };
const made = () => newCase('2026-03-10T09:00:00Z', { name: 'a.csv', bytes: raw.day1 }, { name: 'b.csv', bytes: raw.day2 }, DEFAULT_SETTINGS, { day1: noClinicalInputs(), day2: noClinicalInputs() });

describe('case folder hygiene', () => {
  it('case folders are 0700 and case files 0600', () => {
    const folder = join(mkdtempSync(join(tmpdir(), 'twofold-hygiene-')), 'case');
    expect(saveCase(folder, made(), raw).ok).toBe(true);
    expect(statSync(folder).mode & 0o777).toBe(0o700);
    expect(statSync(join(folder, 'twofold-case.json')).mode & 0o777).toBe(0o600);
    expect(statSync(join(folder, 'raw')).mode & 0o777).toBe(0o700);
  });

  it('a case folder an older version left 0755 is narrowed to 0700 at its next save', () => {
    const folder = join(mkdtempSync(join(tmpdir(), 'twofold-hygiene-')), 'case');
    mkdirSync(folder, { mode: 0o755 });
    chmodSync(folder, 0o755);
    expect(saveCase(folder, made(), raw).ok).toBe(true);
    expect(statSync(folder).mode & 0o777).toBe(0o700);
  });

  it("a killed save's temporary file is removed on the next open; a live writer's is kept", () => {
    const folder = join(mkdtempSync(join(tmpdir(), 'twofold-hygiene-')), 'case');
    saveCase(folder, made(), raw);
    const dead = '.twofold-case.json.999999999.0123456789ab.tmp';
    const live = `.twofold-case.json.${process.pid}.0123456789ab.tmp`;
    writeFileSync(join(folder, dead), 'half');
    writeFileSync(join(folder, live), 'in progress');
    // A killed export of the workbench leaves its temporary report in reports/.
    mkdirSync(join(folder, 'reports'));
    const deadReport = '.twofold-report-20261202-101500.pdf.999999999.0123456789ab.tmp';
    writeFileSync(join(folder, 'reports', deadReport), 'half a pdf');
    expect(loadCase(folder).ok).toBe(true);
    expect(readdirSync(folder)).not.toContain(dead);
    expect(readdirSync(folder)).toContain(live);
    expect(readdirSync(join(folder, 'reports'))).toEqual([]);
  });

  it('a name with folders is stored bare; a hand-edited one with folders is refused on load', () => {
    const c = newCase('2026-03-10T09:00:00Z', { name: '../../etc/day1.csv', bytes: raw.day1 }, { name: 'C:\\\\lab\\\\day2.csv', bytes: raw.day2 }, DEFAULT_SETTINGS, { day1: noClinicalInputs(), day2: noClinicalInputs() });
    expect([c.inputs.day1.name, c.inputs.day2.name]).toEqual(['day1.csv', 'day2.csv']);
    const edited = caseToText(made()).replace('"name": "a.csv"', '"name": "../../x.csv"');
    const r = caseFromText(edited, 'c.json');
    expect(!r.ok && r.error.message).toContain('a file name without folders or control characters');
  });

  it('invalid JSON is located by line and column, and a file cut short at its end', () => {
    const text = '{\n  "format": "twofold-case",\n  "version": 1,\n  oops\n}\n';
    const r = caseFromText(text, 'c.json');
    expect(!r.ok && [r.error.line, r.error.column]).toEqual([4, 3]);
    const cut = caseToText(made()).slice(0, 200);
    const c = caseFromText(cut, 'c.json');
    expect(!c.ok && c.error.line).toBe(cut.split('\n').length);
  });

  it('an unreadable raw copy is called unreadable, not missing', () => {
    const folder = join(mkdtempSync(join(tmpdir(), 'twofold-hygiene-')), 'case');
    const c = made();
    saveCase(folder, c, raw);
    const copy = join(folder, c.inputs.day1.storedAs);
    // A folder where the copy should be: reading fails (EISDIR) though something is there.
    rmSync(copy);
    mkdirSync(copy);
    const r = loadCase(folder);
    expect(!r.ok && r.error.code).toBe('raw-unreadable');
    expect(!r.ok && r.error.message).toBe('The copy of a.csv in the case folder cannot be read (The raw copy is a folder, not a file.)');
    rmSync(copy, { recursive: true });
    expect(!loadCase(folder).ok && (loadCase(folder) as { error: { code: string } }).error.code).toBe('raw-missing');
  });
});
