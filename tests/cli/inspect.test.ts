// Reference: the command-line contract in cli/main.ts and core/model/errors.ts
// (`FILE:LINE:COLUMN: message`; exit 0 success, 2 bad input, 1 anything else).
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, test } from 'vitest';
import { main } from '../../cli/main';
import type { CliIo } from '../../cli/io';

function capture(cwd: string) {
  const out: string[] = [];
  const err: string[] = [];
  const io: CliIo = { out: (t) => out.push(t), err: (t) => err.push(t), env: {}, cwd, interactive: false };
  return { io, out: () => out.join(''), err: () => err.join('') };
}

const dir = mkdtempSync(join(tmpdir(), 'twofold-inspect-'));
writeFileSync(
  join(dir, 'good.csv'),
  ['Subject: C-9', 'Time;VO2;VCO2;VE;HR', 'mm:ss;L/min;L/min;L/min;bpm', '00:03;0,35;0,30;10,5;70', '00:06;0,40;;11,0;72', '01:03;0,42;0,36;11,5;74', ''].join('\n'),
);
writeFileSync(join(dir, 'noheader.csv'), 'just some notes\nand more notes\n');
writeFileSync(join(dir, 'nogas.csv'), 'Time;VO2;VE;HR\n1;300;9;70\n');

describe('twofold inspect', () => {
  test('prints columns, row count, duration and unusable rows; exit 0', async () => {
    const c = capture(dir);
    expect(await main(['inspect', 'good.csv'], c.io)).toBe(0);
    const text = c.out();
    expect(text).toMatch(/2\s+VO2\s+vo2MlMin\s+L\/min/);
    expect(text).toContain('breaths: 2 of 3 rows, 1 not usable');
    expect(text).toContain('duration: 1:00 (min:s)'); // 01:03 − 00:03 = 60 s
    expect(text).toContain("good.csv:5:3: VCO2 (column 'VCO2') is empty on this row; the row is not used.");
  });

  test('--json gives the same facts as data', async () => {
    const c = capture(dir);
    expect(await main(['inspect', 'good.csv', '--json'], c.io)).toBe(0);
    const report = JSON.parse(c.out());
    expect([report.breaths, report.dataRows, report.durationS, report.rejected[0].line, report.columns[1].unit]).toEqual([2, 3, 60, 5, 'L/min']);
  });

  test('--save-mapping writes a column map that --mapping reads back', async () => {
    const c = capture(dir);
    expect(await main(['inspect', 'good.csv', '--save-mapping', 'map.json'], c.io)).toBe(0);
    const map = JSON.parse(readFileSync(join(dir, 'map.json'), 'utf8'));
    expect([map.format, map.version, map.delimiter, map.decimal]).toEqual(['twofold-column-map', 1, ';', ',']);
    const again = capture(dir);
    expect(await main(['inspect', 'good.csv', '--mapping', 'map.json', '--json'], again.io)).toBe(0);
    expect(JSON.parse(again.out()).breaths).toBe(2);
  });

  test('bad input: exit 2 with FILE:LINE:COLUMN on stderr', async () => {
    const a = capture(dir);
    expect(await main(['inspect', 'noheader.csv'], a.io)).toBe(2);
    expect(a.err()).toMatch(/^noheader\.csv:0:0: No header row found/);
    const b = capture(dir);
    expect(await main(['inspect', 'nogas.csv'], b.io)).toBe(2);
    expect(b.err()).toMatch(/^nogas\.csv:1:0: The table has no VCO2 column/);
    const c = capture(dir);
    expect(await main(['inspect', 'absent.csv'], c.io)).toBe(2);
    expect(c.err()).toBe('absent.csv:0:0: The file cannot be read (no such file).\n');
    const d = capture(dir);
    writeFileSync(join(dir, 'bad-map.json'), '{"format": "twofold-column-map", "version": 1,,}');
    expect(await main(['inspect', 'good.csv', '--mapping', 'bad-map.json'], d.io)).toBe(2);
    expect(d.err()).toMatch(/^bad-map\.json:1:\d+: The column map is not valid JSON/);
  });

  test('usage mistakes exit 2; a map path in a missing folder is bad input too, exit 2, before the file is read', async () => {
    const a = capture(dir);
    expect(await main(['inspect'], a.io)).toBe(2);
    const b = capture(dir);
    expect(await main(['inspect', 'good.csv', '--save-mapping', join(dir, 'no', 'such', 'dir', 'm.json')], b.io)).toBe(2);
    expect(b.err()).toContain(`${join(dir, 'no', 'such', 'dir', 'm.json')}:0:0: The folder of this output, ${join(dir, 'no', 'such', 'dir')}, does not exist.`);
  });

  test('the installed command runs through bin/twofold.cjs', () => {
    const out = execFileSync('node', ['bin/twofold.cjs', 'inspect', join(dir, 'good.csv'), '--json'], { encoding: 'utf8' });
    expect(JSON.parse(out).breaths).toBe(2);
    let status = 0;
    try {
      execFileSync('node', ['bin/twofold.cjs', 'inspect', join(dir, 'noheader.csv')], { encoding: 'utf8', stdio: 'pipe' });
    } catch (error) {
      status = (error as { status: number }).status;
    }
    expect(status).toBe(2);
  }, 60_000);
});
