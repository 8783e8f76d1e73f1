// `twofold recovery` end to end through the command registry, on a case folder made by
// `twofold report` from the demo pair: a report is recorded in the hash-chained log, listed,
// corrected with a reason, recorded from a sheet, and bad input is refused with exit 2, a
// located message and nothing written. Expected values are the flags given in each test.
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { main } from '../../cli/main';
import { DEMO_FOLDER, DEMO_PAIR } from '../../host/demo-job';
import { io } from './capture-io';

const WHO = ['--reviewer', 'C. Coordinator', '--role', 'lab coordinator'];
let folder: string;
let dir: string;

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'twofold-cli-recovery-'));
  const t = io();
  expect(await main(['report', join(DEMO_FOLDER, DEMO_PAIR.day1), join(DEMO_FOLDER, DEMO_PAIR.day2), '--out', join(dir, 'r.pdf')], t.io), t.err()).toBe(0);
  folder = join(dir, 'r-case');
}, 120_000);

const caseJson = () => JSON.parse(readFileSync(join(folder, 'twofold-case.json'), 'utf8'));

describe('twofold recovery', () => {
  it('records, lists and corrects follow-ups; the recorded numbers follow', async () => {
    const add = io();
    expect(await main(['recovery', folder, '--test', '1', '--hours', '22', '--by', 'the person', '--how', 'phone', '--usual', 'no', '--rate', 'fatigue=6', '--rate', 'thinking and memory=4', '--note', 'slept badly', ...WHO], add.io), add.err()).toBe(0);
    expect(add.out()).toContain('entry 1  Follow-up, day 1 test, 22 h: not back to usual state; fatigue 6, thinking and memory 4 (the person, phone)');
    expect(add.out()).toContain('recovery after the day 1 test: not recovered by the last follow-up at 0.9 days (22 h)');
    const back = io();
    expect(await main(['recovery', folder, '--test', '1', '--hours', '2d', '--by', 'the person', '--how', 'form', '--usual', 'yes', '--rate', 'fatigue=1', ...WHO], back.io), back.err()).toBe(0);
    let c = caseJson();
    // Entry 0 opens the case (core/case/opening.ts); the two follow-ups are entries 1 and 2.
    expect(c.log.map((e: { action: { kind: string } }) => e.action.kind)).toEqual(['case-opened', 'follow-up', 'follow-up']);
    expect(c.log[1]).toMatchObject({ seq: 1, who: 'C. Coordinator', role: 'lab coordinator', reason: 'Follow-up report, recorded as given.', action: { report: { day: 1, afterTestH: 22, channel: 'phone', backToUsual: false, note: 'slept badly' } } });
    expect(c.recorded.numbers['followUp.day1.recoveredByH']).toBe(48);
    expect(c.recorded.numbers['followUp.day1.notYetAtH']).toBe(22);

    const fix = io();
    expect(await main(['recovery', folder, '--correct', '2', '--hours', '36', '--reason', 'The form was dated 36 h after the test.', ...WHO], fix.io), fix.err()).toBe(0);
    c = caseJson();
    expect(c.log[3]).toMatchObject({ seq: 3, reason: 'The form was dated 36 h after the test.', action: { kind: 'follow-up-correction', corrects: 2, report: { afterTestH: 36, channel: 'form', backToUsual: true } } });
    expect(c.log[2]).toMatchObject({ seq: 2 });
    expect(c.log[2].action.report.afterTestH).toBe(48); // the original entry is kept as recorded
    expect(c.recorded.numbers['followUp.day1.recoveredByH']).toBe(36);

    const list = io();
    expect(await main(['recovery', folder, '--list'], list.io)).toBe(0);
    expect(list.out()).toContain('after the day 1 test: reported back to usual state by 36 h, not yet at 22 h');
    expect(list.out()).toContain('corrected in entry 3 by C. Coordinator');
    expect(list.out()).toContain('after the day 2 test: no follow-up recorded');
    expect(list.out()).toContain("Symptom reports are the person's own account");
    expect(list.out()).toContain("Interpreting them is the clinician's task.");
    const json = io();
    expect(await main(['recovery', folder, '--list', '--json'], json.io)).toBe(0);
    expect(JSON.parse(json.out()).recovery.day1).toMatchObject({ kind: 'recovered', byH: 36, notYetAtH: 22 });
  }, 180_000);

  it('records a sheet, or refuses it whole with FILE:LINE:COLUMN and exit 2', async () => {
    const before = readFileSync(join(folder, 'twofold-case.json'), 'utf8');
    const badSheet = join(dir, 'bad.csv');
    writeFileSync(badSheet, 'test,hours,reported_by,channel,back_to_usual,fatigue\n2,20,the person,phone,no,7\n2,72,the person,phone,no,12\n');
    const bad = io();
    expect(await main(['recovery', folder, '--sheet', badSheet, ...WHO], bad.io)).toBe(2);
    expect(bad.err()).toMatch(new RegExp(`^${badSheet.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}:3:6: Expected a whole-number rating from 0 to 10`));
    expect(readFileSync(join(folder, 'twofold-case.json'), 'utf8')).toBe(before);

    const sheet = join(dir, 'good.csv');
    writeFileSync(sheet, 'test,hours,reported_by,channel,back_to_usual,fatigue\n2,20,the person,phone,no,7\n2,7d,partner,phone,no,5\n');
    const good = io();
    expect(await main(['recovery', folder, '--sheet', sheet, ...WHO], good.io), good.err()).toBe(0);
    const n = caseJson().recorded.numbers;
    expect(n['followUp.day2.recovery']).toBe('not-recovered');
    expect(n['followUp.day2.lastFollowUpH']).toBe(168);
    expect(good.out()).toContain('recovery after the day 2 test: not recovered by the last follow-up at 7 days (168 h)');
  }, 180_000);

  it('refuses bad flags with exit 2 and writes nothing', async () => {
    const before = readFileSync(join(folder, 'twofold-case.json'), 'utf8');
    const cases: [string[], RegExp][] = [
      [['--test', '3', '--hours', '1', '--by', 'x', '--how', 'phone', '--usual', 'no', ...WHO], /--test expects the test the report follows, 1 or 2/],
      [['--test', '1', '--hours', 'soon', '--by', 'x', '--how', 'phone', '--usual', 'no', ...WHO], /--hours expects hours after the end of the test/],
      [['--test', '1', '--hours', '1', '--by', 'x', '--how', 'fax', '--usual', 'no', ...WHO], /--how expects how it was reported: in-person, phone, form/],
      [['--test', '1', '--hours', '1', '--by', 'x', '--how', 'phone', '--usual', 'no', '--rate', 'fatigue=11', ...WHO], /--rate fatigue expects a whole-number rating from 0 to 10/],
      [['--test', '1', '--hours', '1', '--how', 'phone', '--usual', 'no', ...WHO], /--by is required for a new follow-up/],
      [['--correct', '1', '--hours', '30', ...WHO], /--reason is required/],
      [['--test', '1', '--hours', '1', '--by', 'x', '--how', 'phone', '--usual', 'no', '--role', 'r'], /--reviewer is required/],
    ];
    for (const [args, message] of cases) {
      const t = io();
      expect(await main(['recovery', folder, ...args], t.io), args.join(' ')).toBe(2);
      expect(t.err()).toMatch(message);
    }
    const unknown = io();
    expect(await main(['recovery', folder, '--correct', '99', '--hours', '30', '--reason', 'r', ...WHO], unknown.io)).toBe(2);
    expect(unknown.err()).toMatch(/twofold-case\.json:0:0: Reviewer log entry 99 is not in the log, so there is nothing to correct\. Nothing was recorded\./);
    const missing = io();
    expect(await main(['recovery', join(dir, 'nowhere'), '--list'], missing.io)).toBe(2);
    expect(missing.err()).toMatch(/nowhere\/twofold-case\.json:0:0: There is no case here/);
    expect(readFileSync(join(folder, 'twofold-case.json'), 'utf8')).toBe(before);
  }, 180_000);
});
