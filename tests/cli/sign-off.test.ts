// `twofold sign-off` end to end through the command registry, on the demo pair
// (sample-tests/demo/): the statement lands in the case's hash-chained reviewer log, a report
// built from the case is a DRAFT on every page until then and not after, a later threshold
// change ends the sign-off (the report is a draft again), and mistakes exit 2 with the flag
// or the file named and nothing written. The rules are Twofold's own (docs/cli.md).
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { main } from '../../cli/main';
import { io } from './capture-io';
import { loadCase } from '../../host/case-folder';
import { DEMO_FOLDER, DEMO_PAIR } from '../../host/demo-job';
import { caseToText } from '../../core/case/case-text';
import { opensslCertificate } from '../core/report/fixture';

const day1 = join(DEMO_FOLDER, DEMO_PAIR.day1);
const day2 = join(DEMO_FOLDER, DEMO_PAIR.day2);
const WHO = ['--reviewer', 'R. Second', '--role', 'clinical exercise physiologist'];
const STATEMENT = 'Thresholds reviewed on both days; the comparison is as shown.';
let dir: string;

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'twofold-cli-signoff-'));
});

async function report(name: string, folder?: string): Promise<string> {
  const out = join(dir, `${name}.pdf`);
  const t = io();
  expect(await main(['report', day1, day2, '--out', out, ...(folder ? ['--case', folder] : [])], t.io), t.err()).toBe(0);
  return out;
}

/** The text of each page (pdftotext separates pages with a form feed). */
function pages(pdf: string): string[] {
  const text = spawnSync('pdftotext', [pdf, '-'], { encoding: 'utf8' }).stdout;
  return text.split('\f').filter((p) => p.trim() !== '');
}

const caseText = (folder: string) => readFileSync(join(folder, 'twofold-case.json'), 'utf8');

describe('twofold sign-off', () => {
  it('records the statement in the chained log; the report is a draft on every page before and not after', async () => {
    const draft = await report('before');
    const folder = join(dir, 'before-case');
    const draftPages = pages(draft);
    expect(draftPages.length).toBeGreaterThan(3);
    for (const p of draftPages) expect(p).toContain('DRAFT');

    const t = io();
    expect(await main(['sign-off', folder, '--statement', STATEMENT, ...WHO], t.io), t.err()).toBe(0);
    expect(t.out()).toContain('entry 1  sign-off by R. Second (clinical exercise physiologist)');
    const loaded = loadCase(folder);
    expect(loaded.ok).toBe(true);
    if (!loaded.ok) return;
    const log = loaded.value.caseFile.log;
    // Entry 0 opens the case (core/case/opening.ts); the sign-off is the one reviewer entry, entry 1.
    expect(log).toHaveLength(2);
    expect(log[0].action.kind).toBe('case-opened');
    expect(log[1].seq).toBe(1);
    expect(log[1].action).toEqual({ kind: 'sign-off', statement: STATEMENT });
    expect(log[1].who).toBe('R. Second');

    const signed = await report('after', folder);
    const signedPages = pages(signed);
    for (const p of signedPages) expect(p).not.toContain('DRAFT');
    expect(signedPages.join(' ').replace(/\s+/g, ' ')).toContain(STATEMENT);
  });

  it('a threshold change after the sign-off ends it: the report is a draft again', async () => {
    await report('later');
    const folder = join(dir, 'later-case');
    expect(await main(['sign-off', folder, '--statement', STATEMENT, ...WHO], io().io)).toBe(0);
    const timeS = JSON.parse(caseText(folder)).recorded.numbers['day1.vt1.timeS'] as number;
    const o = io();
    expect(await main(['override', folder, '--day', '1', '--threshold', 'vt1', '--time-s', String(Math.round(timeS) + 20), '--reason', 'reads later', ...WHO], o.io), o.err()).toBe(0);
    const again = pages(await report('later-2', folder));
    for (const p of again) expect(p).toContain('DRAFT');
    expect(again.join(' ').replace(/\s+/g, ' ')).toContain('was followed by a threshold change');
  });

  it('the sign-off removed from the case folder after a signed report: the case still loads, verify --case fails and says so', async () => {
    // Issue 12 item 3: deleting the last entry leaves a valid chain; the report's log head shows the cut.
    await report('cut');
    const folder = join(dir, 'cut-case');
    expect(await main(['sign-off', folder, '--statement', STATEMENT, ...WHO], io().io)).toBe(0);
    const cert = opensslCertificate();
    const out = join(dir, 'cut-signed.pdf');
    const r = io({ LAB_PASS: cert.password });
    expect(await main(['report', day1, day2, '--out', out, '--case', folder, '--sign', join(cert.dir, 'lab.p12'), '--pass-env', 'LAB_PASS', '--reviewer', 'R. Second'], r.io), r.err()).toBe(0);
    const before = io();
    expect(await main(['verify', out, '--trust', cert.certPem, '--case', folder], before.io), before.out() + before.err()).toBe(0);

    const loaded = loadCase(folder);
    if (!loaded.ok) throw new Error(loaded.error.message);
    writeFileSync(join(folder, 'twofold-case.json'), caseToText({ ...loaded.value.caseFile, log: loaded.value.caseFile.log.slice(0, 1) }));
    expect(loadCase(folder).ok).toBe(true); // the opening entry alone is a valid chain
    const after = io();
    expect(await main(['verify', out, '--trust', cert.certPem, '--case', folder], after.io)).toBe(1);
    expect(after.out() + after.err()).toMatch(/reviewer log has 1 entry, but a report made from it recorded 2: entries were removed/);
  }, 240_000);

  it('refuses a missing or empty statement, reviewer or role with exit 2, naming the flag; nothing is written', async () => {
    await report('bad');
    const folder = join(dir, 'bad-case');
    const before = caseText(folder);
    for (const [args, flag] of [
      [['--statement', '   ', ...WHO], '--statement'],
      [[...WHO], '--statement'],
      [['--statement', STATEMENT, '--role', 'physiologist'], '--reviewer'],
      [['--statement', STATEMENT, '--reviewer', 'R. Second'], '--role'],
      [['--statement', 'a\u0007b', ...WHO], '--statement has a control character at character 2'],
      [['--statement', 'x'.repeat(1001), ...WHO], 'at most 1000'],
    ] as const) {
      const t = io();
      expect(await main(['sign-off', folder, ...args], t.io)).toBe(2);
      expect(t.err()).toContain(flag);
    }
    expect(caseText(folder)).toBe(before);
  });

  it('a folder without a case is refused with its path and exit 2', async () => {
    const t = io();
    const empty = mkdtempSync(join(tmpdir(), 'twofold-no-case-'));
    expect(await main(['sign-off', empty, '--statement', STATEMENT, ...WHO], t.io)).toBe(2);
    expect(t.err()).toContain(`${join(empty, 'twofold-case.json')}:0:0: There is no case here`);
  });
});
