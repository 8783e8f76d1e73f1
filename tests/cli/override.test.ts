// `twofold override` end to end through the command registry, on the demo pair
// (sample-tests/demo/): the reviewer's position is recorded in the case's hash-chained log,
// the recorded numbers follow it, `twofold report --case` prints it and keeps the log, the
// signed report verifies (its numbers recompute from the attached files), withdrawing brings
// back the automatic estimate, and mistakes name the flag or the file, with exit 2 and
// nothing written.
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, readdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { main } from '../../cli/main';
import { io } from './capture-io';
import { loadCase } from '../../host/case-folder';
import { DEMO_FOLDER, DEMO_PAIR } from '../../host/demo-job';
import { opensslCertificate, type LabCertificate } from '../core/report/fixture';


const day1 = join(DEMO_FOLDER, DEMO_PAIR.day1);
const day2 = join(DEMO_FOLDER, DEMO_PAIR.day2);
const WHO = ['--reviewer', 'T. Tester', '--role', 'exercise physiologist'];
let dir: string;
let cert: LabCertificate;

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'twofold-cli-override-'));
  cert = opensslCertificate();
});

/** A fresh case folder made by `twofold report`; returns the folder. */
async function freshCase(name: string): Promise<string> {
  const t = io();
  expect(await main(['report', day1, day2, '--out', join(dir, `${name}.pdf`)], t.io), t.err()).toBe(0);
  return join(dir, `${name}-case`);
}

function caseText(folder: string): string {
  return readFileSync(join(folder, 'twofold-case.json'), 'utf8');
}

function caseJson(folder: string) {
  return JSON.parse(caseText(folder));
}

describe('twofold override', () => {
  it('records a threshold given as a time; the report uses it, keeps the log and verifies', async () => {
    const folder = await freshCase('by-time');
    const automatic = caseJson(folder).recorded.numbers;
    const autoTimeS: number = automatic['day2.vt1.timeS'];
    const autoVo2: number = automatic['day2.vt1.vo2MlMin'];
    // 30 s later on the ramp than the automatic consensus (the demo's day 2 ramp runs well past it).
    const timeS = Math.round(autoTimeS) + 30;
    const started = Date.now();
    const t = io();
    const code = await main(['override', folder, '--day', '2', '--threshold', 'vt1', '--time-s', String(timeS), '--reason', 'The V-slope bend reads 30 s later', ...WHO], t.io);
    expect(code, t.err()).toBe(0);
    expect(t.out()).toContain(`before: ${autoTimeS.toFixed(1)} s`);
    expect(t.out()).toContain(`VO2 ${autoVo2.toFixed(0)} mL/min (automatic consensus)`);
    expect(t.out()).toContain(`after:  ${timeS.toFixed(1)} s`);

    const c = caseJson(folder);
    // Entry 0 opens the case (core/case/opening.ts); the override is entry 1.
    expect(c.log).toHaveLength(2);
    expect(c.log[0].action.kind).toBe('case-opened');
    const entry = c.log[1];
    expect(entry).toMatchObject({ seq: 1, who: 'T. Tester', role: 'exercise physiologist', reason: 'The V-slope bend reads 30 s later' });
    expect(entry.action).toMatchObject({ kind: 'set-threshold', day: 2, threshold: 'vt1', givenAs: 'time' });
    expect(entry.action.before.timeS).toBeCloseTo(autoTimeS, 9);
    expect(entry.action.after.timeS).toBe(timeS);
    // The time of the action is the CLI's clock, ISO 8601 to the second.
    expect(entry.at).toMatch(/^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\dZ$/);
    expect(Date.parse(entry.at)).toBeGreaterThanOrEqual(Math.floor(started / 1000) * 1000);
    expect(Date.parse(entry.at)).toBeLessThanOrEqual(Date.now());
    // The recorded numbers follow the override; the other thresholds stay automatic.
    expect(c.recorded.numbers['day2.vt1.timeS']).toBe(timeS);
    expect(c.recorded.numbers['day2.vt1.vo2MlMin']).toBeCloseTo(entry.action.after.vo2MlMin, 9);
    expect(c.recorded.numbers['day2.vt1Source']).toBe('reviewer#1');
    expect(c.recorded.numbers['day1.vt1Source']).toBe('automatic');
    expect(c.recorded.numbers['day1.vt1.timeS']).toBe(automatic['day1.vt1.timeS']);
    expect(loadCase(folder).ok).toBe(true);

    const out = join(dir, 'by-time-signed.pdf');
    const r = io({ LAB_PASS: cert.password });
    expect(await main(['report', day1, day2, '--out', out, '--case', folder, '--sign', join(cert.dir, 'lab.p12'), '--pass-env', 'LAB_PASS', '--reviewer', 'T. Tester, MSc'], r.io), r.err()).toBe(0);
    const text = spawnSync('pdftotext', [out, '-'], { encoding: 'utf8' }).stdout.replace(/\s+/g, ' ');
    // m:ss of the override as the report prints it, e.g. 557 s → 9:17.
    const minSec = `${Math.floor(timeS / 60)}:${String(timeS % 60).padStart(2, '0')}`;
    expect(text).toContain(`Used: set by the reviewer, T. Tester (exercise physiologist), ${entry.at}, log entry 1: ${minSec}, VO₂ ${entry.action.after.vo2MlMin.toFixed(0)} mL/min`);
    expect(text).toContain('The V-slope bend reads 30 s later');
    expect(caseJson(folder).log).toEqual(c.log);
    const v = io();
    expect(await main(['verify', out, '--trust', cert.certPem, '--case', folder], v.io), v.out() + v.err()).toBe(0);
    expect(v.out()).toContain('numbers and pages reproduce');
    expect(v.out()).toContain('its reviewer log (2 entries) continues the 2 entries this report records');
  }, 240_000);

  it('a VO2 places the threshold where VO2 first reaches it; withdrawing brings back the automatic estimate', async () => {
    const folder = await freshCase('by-vo2');
    const automatic = caseJson(folder).recorded.numbers;
    const vo2 = Math.round(automatic['day1.vt2.vo2MlMin']) - 100;
    const t = io();
    expect(await main(['override', folder, '--day', '1', '--threshold', 'VT2', '--vo2-ml-min', String(vo2), '--reason', 'RCP reads lower on VE/VCO2', ...WHO], t.io), t.err()).toBe(0);
    expect(t.out()).toContain(`VO2 ${vo2} mL/min (reviewer, entry 1)`);
    const c = caseJson(folder);
    expect(c.log[1].action).toMatchObject({ givenAs: 'vo2', day: 1, threshold: 'vt2' });
    // The reviewer's VO2 is where the threshold sits: read off the series at the mapped time, it is the given VO2.
    expect(c.recorded.numbers['day1.vt2.vo2MlMin']).toBeCloseTo(vo2, 6);
    expect(c.recorded.numbers['day1.vt2Source']).toBe('reviewer#1');

    const w = io();
    expect(await main(['override', folder, '--withdraw', '1', '--reason', 'Automatic reading accepted after all', ...WHO], w.io), w.err()).toBe(0);
    expect(w.out()).toContain('Entry 1 withdrawn (day 1 VT2)');
    expect(w.out()).toContain(`after:  ${automatic['day1.vt2.timeS'].toFixed(1)} s`);
    const after = caseJson(folder);
    expect(after.log.map((e: { action: { kind: string } }) => e.action.kind)).toEqual(['case-opened', 'set-threshold', 'withdraw']);
    expect(after.log[2].prevHash).toBe(after.log[1].hash);
    expect(after.recorded.numbers['day1.vt2Source']).toBe('automatic');
    expect(after.recorded.numbers['day1.vt2.timeS']).toBe(automatic['day1.vt2.timeS']);
    expect(after.recorded.numbers['day1.vt2.vo2MlMin']).toBe(automatic['day1.vt2.vo2MlMin']);

    const again = io();
    expect(await main(['override', folder, '--withdraw', '1', '--reason', 'twice', ...WHO], again.io)).toBe(2);
    expect(again.err()).toContain('--withdraw 1: The threshold change in reviewer log entry 1 has already been withdrawn.');
    const notOne = io();
    expect(await main(['override', folder, '--withdraw', '2', '--reason', 'not a change', ...WHO], notOne.io)).toBe(2);
    expect(notOne.err()).toContain('Reviewer log entry 2 is not a threshold change');

    const list = io();
    expect(await main(['override', folder, '--list'], list.io)).toBe(0);
    expect(list.out()).toContain('day 1 VT2');
    expect(list.out()).toMatch(/^ {2}1 {2}\S+Z {2}T\. Tester \(exercise physiologist\) {2}Day 1 VT2 set: .* \(given as a VO₂\) {2}reason: RCP reads lower on VE\/VCO2$/m);
    expect(list.out()).toMatch(/^ {2}2 {2}\S+Z {2}T\. Tester \(exercise physiologist\) {2}Entry 1 withdrawn \(day 1 VT2\).* {2}reason: Automatic reading accepted after all$/m);
    expect(list.out()).toMatch(/^ {2}0 {2}\S+Z {2}Twofold \(software, on opening the case\) {2}Case opened: /m);
    expect(caseJson(folder).log).toHaveLength(3);
  });

  it('bad input names the flag or the file, exits 2 and writes nothing', async () => {
    const folder = await freshCase('bad');
    const before = caseText(folder);
    const set = ['override', folder, '--day', '2', '--threshold', 'vt1'];
    const cases: [string[], string][] = [
      [[...set, '--time-s', '600', ...WHO], '--reason is required'],
      [[...set, '--time-s', '600', '--reason', '  ', ...WHO], '--reason is required'],
      [[...set, '--time-s', '600', '--reason', 'x', '--role', 'physiologist'], '--reviewer is required'],
      [['override', folder, '--day', '3', '--threshold', 'vt1', '--time-s', '600', '--reason', 'x', ...WHO], "--day expects 1 or 2, got '3'"],
      [['override', folder, '--day', '2', '--threshold', 'lt1', '--time-s', '600', '--reason', 'x', ...WHO], "--threshold expects vt1 or vt2, got 'lt1'"],
      [[...set, '--time-s', '600', '--vo2-ml-min', '900', '--reason', 'x', ...WHO], 'either as --time-s N or as --vo2-ml-min N'],
      [[...set, '--time-s', 'late', '--reason', 'x', ...WHO], "--time-s expects a number, got 'late'"],
      [[...set, '--time-s', '600', '--withdraw', '1', '--reason', 'x', ...WHO], 'give one of'],
      [['override', folder, '--withdraw', '0', '--reason', 'x', ...WHO], '--withdraw expects a reviewer log entry number'],
      [['override', folder, '--list', '--reason', 'x'], '--list changes nothing'],
      // Before the ramp: the demo's incremental phase starts minutes in.
      [[...set, '--time-s', '5', '--reason', 'x', ...WHO], `${join(folder, 'twofold-case.json')}:0:0: --time-s 5: A threshold must lie on the incremental phase`],
      [[...set, '--vo2-ml-min', '99999', '--reason', 'x', ...WHO], '--vo2-ml-min 99999: VO₂ never reaches 99999 mL/min on the incremental phase'],
      [['override', join(dir, 'no-such-case'), '--list'], 'There is no case here'],
    ];
    for (const [args, message] of cases) {
      const t = io();
      expect(await main(args, t.io), args.join(' ')).toBe(2);
      expect(t.err()).toContain(message);
    }
    expect(caseText(folder)).toBe(before);
  });

  it('refuses a case whose raw copy or log was altered', async () => {
    const rawChanged = await freshCase('raw-changed');
    const rawFolder = join(rawChanged, 'raw');
    const copy = join(rawFolder, readdirSync(rawFolder)[0]);
    writeFileSync(copy, `${readFileSync(copy, 'utf8')}\n`);
    const t = io();
    expect(await main(['override', rawChanged, '--list'], t.io)).toBe(2);
    expect(t.err()).toContain(`${copy}:0:0: The copy of`);
    expect(t.err()).toContain('was changed');

    const logChanged = await freshCase('log-changed');
    expect(await main(['override', logChanged, '--day', '2', '--threshold', 'vt2', '--vo2-ml-min', '1300', '--reason', 'original reason', ...WHO], io().io)).toBe(0);
    writeFileSync(join(logChanged, 'twofold-case.json'), caseText(logChanged).replace('original reason', 'edited reason'));
    const e = io();
    expect(await main(['override', logChanged, '--withdraw', '1', '--reason', 'x', ...WHO], e.io)).toBe(2);
    expect(e.err()).toContain('Reviewer log entry 1');
    expect(e.err()).toContain('edited after it was recorded');
  });

  it('on the demo case (override and sign-off) a new change says the sign-off no longer covers it', async () => {
    const demo = join(dir, 'demo');
    expect(await main(['demo', '--out', demo], io().io)).toBe(0);
    const folder = join(demo, 'case');
    // The demo's log: entry 0 opens the case, then the override (entry 1), its follow-up
    // reports, then the sign-off last; the sign-off's number is its seq (one less than the
    // log's length, since entry 0 is counted in the length).
    const log: { seq: number; action: { kind: string } }[] = caseJson(folder).log;
    expect(log[log.length - 1].action.kind).toBe('sign-off');
    expect(log[0].action.kind).toBe('case-opened');
    expect(log[log.length - 1].seq).toBe(log.length - 1);
    const t = io();
    expect(await main(['override', folder, '--withdraw', '1', '--reason', 'Back to the consensus', ...WHO], t.io), t.err()).toBe(0);
    expect(t.out()).toContain(`the sign-off in entry ${log.length - 1} no longer covers the thresholds shown`);
    expect(caseJson(folder).recorded.numbers['day2.vt1Source']).toBe('automatic');
  });
});
