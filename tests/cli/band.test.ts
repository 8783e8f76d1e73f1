// `twofold band` end to end: repeat-test pairs written by the test-data generator
// (sample-tests/generator), analysed by the real pipeline. The expected band is recomputed in
// the test from each pair's values reported by `twofold compare --json`, with mathjs std and
// Hopkins' log method: CV = 100·(exp(SD(ln d2 − ln d1)/√2) − 1) (Hopkins, Sports Med 2000);
// MDC95 = 1.96·√2·SEM (Weir 2005).
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { std } from 'mathjs';
import { beforeAll, describe, expect, it } from 'vitest';
import { main } from '../../cli/main';
import { captureIo, writePair } from '../core/compare/generated-pairs';

let dir: string;
const ids = ['R1', 'R2', 'R3', 'R4', 'R5'];

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'twofold-band-'));
  const lines = ['pair_id,day1_file,day2_file'];
  ids.forEach((id, i) => {
    writePair(dir, id, 900 + i);
    lines.push(`${id},${id}-day1.csv,${id}-day2.csv`);
  });
  writeFileSync(join(dir, 'garbage.csv'), '\u0000\u0001\u0002binary');
  lines.push('JUNK,garbage.csv,R1-day2.csv');
  writeFileSync(join(dir, 'repeats.csv'), `${lines.join('\n')}\n`);
});

describe('twofold band', () => {
  it('writes a lab-derived band whose peak VO2 CV matches the log-method recomputation', async () => {
    const t = captureIo(dir);
    expect(await main(['band', 'repeats.csv', '--out', 'band.json'], t.io)).toBe(0);
    expect(t.err()).toMatch(/skipped pair JUNK: garbage\.csv:/);
    expect(t.out()).toMatch(/Band from 5 of 6 pairs \(skipped 1\)/);
    const band = JSON.parse(readFileSync(join(dir, 'band.json'), 'utf8'));
    expect(band).toMatchObject({ format: 'twofold-band', version: 1, origin: 'lab-derived' });

    const logRatios: number[] = [];
    for (const id of ids) {
      const c = captureIo(dir);
      expect(await main(['compare', `${id}-day1.csv`, `${id}-day2.csv`, '--json'], c.io)).toBe(0);
      const peak = JSON.parse(c.out()).metrics.find((m: any) => m.id === 'peak_vo2');
      logRatios.push(Math.log(peak.day2) - Math.log(peak.day1));
    }
    const expectedCv = 100 * (Math.exp((std(logRatios) as unknown as number) / Math.SQRT2) - 1);
    const peak = band.metrics.peak_vo2;
    expect(peak.stats.n).toBe(5);
    expect(peak.stats.cv_method).toBe('log-transformed');
    expect(peak.cv_pct).toBeCloseTo(expectedCv, 1); // JSON values are rounded to 3 decimals
    expect(peak.stats.mdc95).toBeCloseTo(1.96 * Math.SQRT2 * peak.stats.sem, 2);
  });

  it('the band file is read back by compare --band and stated as the source', async () => {
    const t = captureIo(dir);
    expect(await main(['compare', 'R1-day1.csv', 'R1-day2.csv', '--json', '--band', 'band.json'], t.io)).toBe(0);
    const j = JSON.parse(t.out());
    expect(j.band.origin).toBe('lab-derived');
    expect(j.metrics.find((m: any) => m.id === 'peak_vo2').band_source).toMatch(/^lab-derived: lab repeat tests, 5 pairs/);
  });

  it('a bad manifest exits 2 with its place; a missing --out is a usage error', async () => {
    writeFileSync(join(dir, 'bad.csv'), 'pair,day1_file,day2_file\n');
    const t = captureIo(dir);
    expect(await main(['band', 'bad.csv', '--out', 'x.json'], t.io)).toBe(2);
    expect(t.err()).toMatch(/^bad\.csv:1:1: /);
    expect(await main(['band', 'repeats.csv'], t.io)).toBe(2);
  });
});
