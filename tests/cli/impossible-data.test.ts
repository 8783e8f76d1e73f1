// Impossible data is refused with its place, not analysed with confidence (issue: negated
// values gave "Effort: maximal" and VT1 −680 mL/min; 430 rows at one time or a 1e9 s jump
// passed; a 1e18 s time cell crashed peaks.ts). The files are the demo day-1 file with the
// stated edit; the expected lines are counted in the edited text.
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { main } from '../../cli/main';
import { DEMO_FOLDER, DEMO_PAIR } from '../../host/demo-job';
import { io } from './capture-io';

const lines = readFileSync(join(DEMO_FOLDER, DEMO_PAIR.day1), 'utf8').split('\n');
const header = lines.findIndex((l) => l.startsWith('time_s'));
const dir = mkdtempSync(join(tmpdir(), 'twofold-impossible-'));

/** The demo file with each data row changed by `edit(cells, index)`; returns its path. */
function edited(name: string, edit: (cells: string[], i: number) => string[]): string {
  const out = lines.map((l, i) => (i > header && l.trim() !== '' ? edit(l.split(','), i - header - 1).join(',') : l));
  const path = join(dir, name);
  writeFileSync(path, out.join('\n'));
  return path;
}

async function analyze(path: string) {
  const t = io();
  const code = await main(['analyze', path], t.io);
  return { code, err: t.err(), out: t.out() };
}

const middle = Math.floor((lines.length - header) / 2);
const lineOfRow = (i: number) => header + 2 + i;

describe('impossible data', () => {
  it('every gas and HR value negated: refused, exit 2, at the first flagged line', async () => {
    const r = await analyze(edited('negated.csv', (c) => c.map((v, k) => (k > 0 && v !== '' ? String(-Number(v)) : v))));
    expect(r.code).toBe(2);
    expect(r.err).toMatch(new RegExp(`^${join(dir, 'negated.csv').replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}:${lineOfRow(0)}:\\d+: \\d+ of \\d+ breaths \\(100 %, more than 20 %\\) have values no living subject gives`));
    expect(r.out).toBe('');
  });

  it('all rows at t = 100 s: refused as time that does not advance', async () => {
    const r = await analyze(edited('one-time.csv', (c) => [String(100), ...c.slice(1)]));
    expect(r.code).toBe(2);
    expect(r.err).toContain(`one-time.csv:${lineOfRow(0)}:1: All `);
    expect(r.err).toContain('breaths lie within 0 s of each other');
  });

  it('a jump of 1e9 s mid-file: refused at the line of the jump', async () => {
    const r = await analyze(edited('jump.csv', (c, i) => (i >= middle ? [String(Number(c[0]) + 1e9), ...c.slice(1)] : c)));
    expect(r.code).toBe(2);
    expect(r.err).toContain(`jump.csv:${lineOfRow(middle)}:1: Time jumps by 1.00e+9 s`);
  });

  it('one time cell of 1e18 s mid-ramp: a located refusal, not a stack trace', async () => {
    const r = await analyze(edited('huge-time.csv', (c, i) => (i === middle ? ['1e18', ...c.slice(1)] : c)));
    expect(r.code).toBe(2);
    expect(r.err).toContain(`huge-time.csv:${lineOfRow(middle)}:1: Time jumps by 1.00e+18 s`);
    expect(r.err).not.toMatch(/\n\s+at /);
  });
});
