// Hostile paths and hand-edited cases reach the user as one located sentence and exit 2,
// never an internal fault (exit 1) or a stack trace (issue: a map, certificate or output
// that is a folder, `--out` in a missing folder, `demo --out` under a file, a case file
// that is a folder, schema errors at column 0 or at the wrong day's line). Places are
// counted by hand in the text the test writes.
import { mkdirSync, mkdtempSync, readdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { main } from '../../cli/main';
import { caseFromText, caseToText } from '../../core/case/case-text';
import { newCase } from '../../core/case/new-case';
import { noClinicalInputs } from '../../core/analyze/analyze-test';
import { DEFAULT_SETTINGS } from '../../core/model/settings';
import { DEMO_FOLDER, DEMO_PAIR } from '../../host/demo-job';
import { io } from './capture-io';

const day1 = join(DEMO_FOLDER, DEMO_PAIR.day1);
const day2 = join(DEMO_FOLDER, DEMO_PAIR.day2);
const STACK = /\n\s+at |internal fault/;

async function run(args: string[], env: Record<string, string> = {}) {
  const t = io(env);
  const code = await main(args, t.io);
  return { code, err: t.err() };
}

describe('hostile paths: exit 2 with the path and one sentence', () => {
  const dir = mkdtempSync(join(tmpdir(), 'twofold-hostile-'));
  const folder = join(dir, 'a-folder');
  mkdirSync(folder);
  const file = join(dir, 'a-file');
  writeFileSync(file, 'x');

  it.each([
    ['report --day1-map at a folder', ['report', day1, day2, '--out', join(dir, 'm.pdf'), '--day1-map', folder], 'is a folder, not a file'],
    ['report --sign at a folder', ['report', day1, day2, '--out', join(dir, 's.pdf'), '--sign', folder, '--pass-env', 'P'], 'The certificate file is a folder'],
    ['inspect --save-mapping at a folder', ['inspect', day1, '--save-mapping', folder], 'This output path is a folder'],
    ['inspect --save-mapping in a missing folder', ['inspect', day1, '--save-mapping', join(dir, 'none', 'm.json')], 'does not exist'],
    ['compare --manifest --out at a folder', ['compare', '--manifest', join(dir, 'man.csv'), '--out', folder], 'This output path is a folder'],
    ['band --out in a missing folder', ['band', join(dir, 'man.csv'), '--out', join(dir, 'none', 'b.json')], 'does not exist'],
    ['demo --out under a file', ['demo', '--out', join(file, 'sub')], 'runs through a file'],
    ['recovery --sheet at a folder', ['recovery', join(dir, 'case'), '--sheet', folder, '--reviewer', 'R', '--role', 'x'], 'The follow-up sheet is a folder'],
  ])('%s', async (_name, args, sentence) => {
    writeFileSync(join(dir, 'man.csv'), `pair_id,day1_file,day2_file\np1,${day1},${day2}\n`);
    if (args[0] === 'recovery') expect((await run(['report', day1, day2, '--out', join(dir, 'r.pdf'), '--case', join(dir, 'case')])).code).toBe(0);
    const before = readdirSync(dir).sort();
    const r = await run(args, { P: 'x' });
    expect(r.code, r.err).toBe(2);
    expect(r.err).toContain(sentence);
    expect(r.err).not.toMatch(STACK);
    // Nothing was written beside the inputs (no case folder of a refused report, no results).
    expect(readdirSync(dir).sort()).toEqual(before);
  }, 60_000);

  it('a case file that is a folder: exit 2 naming it', async () => {
    const caseDir = join(dir, 'odd-case');
    mkdirSync(join(caseDir, 'twofold-case.json'), { recursive: true });
    const r = await run(['override', caseDir, '--list']);
    expect(r.code).toBe(2);
    expect(r.err).toContain(`${join(caseDir, 'twofold-case.json')}:0:0: The case file is a folder, not a file.`);
  });
});

describe('hand-edited case files are refused at the line and column of the field', () => {
  const bytes = (s: string) => new TextEncoder().encode(s);
  const made = newCase('2026-03-10T09:00:00Z', { name: 'a.csv', bytes: bytes('time_s,vo2\n1,300\n') }, { name: 'b.csv', bytes: bytes('time_s,vo2\n1,310\n') }, DEFAULT_SETTINGS, { day1: noClinicalInputs(), day2: noClinicalInputs() });
  const text = caseToText(made);
  /** 1-based line and column of the n-th (0-based) occurrence of `needle` in `t`. */
  const placeOf = (t: string, needle: string, n = 0) => {
    let at = -1;
    for (let i = 0; i <= n; i++) at = t.indexOf(needle, at + 1);
    const before = t.slice(0, at);
    return [before.split('\n').length, at - before.lastIndexOf('\n')];
  };

  it('workloadStepW 1e-9 in the embedded settings: refused at its key, not at column 0', () => {
    const edited = text.replace('"workloadStepW": 10', '"workloadStepW": 1e-9');
    const r = caseFromText(edited, 'c.json');
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.error.message).toContain('settings.compare.workloadStepW');
    expect([r.error.line, r.error.column]).toEqual(placeOf(edited, '"workloadStepW"'));
  });

  it("day 2's input name with folders: the place is day 2's name, not day 1's", () => {
    const edited = text.replace('"name": "b.csv"', '"name": "../b.csv"');
    const r = caseFromText(edited, 'c.json');
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.error.message).toContain('inputs.day2.name');
    // The second "name" key of the file is day 2's (day 1's comes first).
    expect([r.error.line, r.error.column]).toEqual(placeOf(edited, '"name": "../b.csv"'));
    expect(r.error.line).not.toBe(placeOf(edited, '"name"')[0]);
  });

  it('replicates 2e9 in the embedded settings: refused, at its key', () => {
    const edited = text.replace(/"replicates": \d+/, '"replicates": 2000000000');
    const r = caseFromText(edited, 'c.json');
    expect(!r.ok && r.error.message).toContain('settings.thresholds.bootstrap.replicates');
    expect(!r.ok && [r.error.line, r.error.column]).toEqual(placeOf(edited, '"replicates"'));
  });
});
