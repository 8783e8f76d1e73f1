// `twofold compare` end to end through the real importer and analyzeTest, on pairs written
// by the test-data generator (a stated model with known VT1; sample-tests/generator). The
// band is Twofold's default (24-h controls; VT1 VO2 CV 6 % → −14.9 / +17.5 % on the log scale).
import { mkdirSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { main } from '../../cli/main';
import { captureIo, writePair, type WrittenPair } from '../core/compare/generated-pairs';
import { batchAnalysisSettings, loadAnalysis } from '../../cli/commands/compare';
import { compareTests } from '../../core/compare/compare-tests';
import { resultsRow } from '../../core/compare/results-csv';
import { DEFAULT_SETTINGS } from '../../core/model/settings';

let dir: string;
let declining: WrittenPair;
let reproducing: WrittenPair;

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'twofold-compare-'));
  // Seeds where the detectors find VT1 near the truth on both days (asserted below), so this
  // test checks the comparison; tests/validation holds the detectors to their accuracy.
  declining = writePair(dir, 'decl', 1, 0.6);
  reproducing = writePair(dir, 'repr', 205, 1);
});

describe('twofold compare DAY1 DAY2', () => {
  // Issue 11 asks that such a decline be called "lower on day 2"; with today's calibrated VT1
  // interval (day 2's VT1 early in the ramp: measurement SD 0.19 on the log scale here) the
  // change interval straddles the limit and the honest call is "undetermined" (docs/validation.md,
  // "Day-2 verdicts"). What must hold regardless: the change is found, and never the opposite call.
  it('--json: a true VT1 VO2 drop of 40% (1100 → 660 mL/min) is found, and never called higher on day 2', async () => {
    const t = captureIo(dir);
    expect(await main(['compare', declining.day1, declining.day2, '--json'], t.io)).toBe(0);
    const j = JSON.parse(t.out());
    const vt1 = j.metrics.find((m: any) => m.id === 'vt1_vo2');
    expect(Math.abs(vt1.day1 / declining.trueVt1Day1MlMin - 1)).toBeLessThan(0.2); // detector near truth
    expect(Math.abs(vt1.day2 / declining.trueVt1Day2MlMin - 1)).toBeLessThan(0.2);
    expect(vt1.delta_pct).toBeLessThan(-25);
    expect(['fell', 'open']).toContain(vt1.verdict);
    expect(vt1.change_interval_pct[0]).toBeLessThan(vt1.band_low_pct); // reaches beyond the band's lower edge
    expect(vt1.band_low_pct).toBeCloseTo(-14.91, 2); // exp(−1.96·√2·ln 1.06) − 1
    expect(j.pairing.interval_h).toBe(24.5); // 09:00 → 09:30 next day
    expect(j.band.retest_interval).toBe('24 h');
    expect(j.summary).toMatch(/^VT1 (came earlier on day 2|on day 2 is undetermined against day 1): VO2 −[\d.]+ %/);
  });

  it('a reproducing pair (same model, new noise): never lower or higher on a primary outcome; peak VO2 reproduced', async () => {
    const t = captureIo(dir);
    expect(await main(['compare', reproducing.day1, reproducing.day2, '--json'], t.io)).toBe(0);
    const j = JSON.parse(t.out());
    const vt1 = j.metrics.find((m: any) => m.id === 'vt1_vo2');
    expect(Math.abs(vt1.day1 / reproducing.trueVt1Day1MlMin - 1)).toBeLessThan(0.2); // detector near truth
    expect(Math.abs(vt1.day2 / reproducing.trueVt1Day2MlMin - 1)).toBeLessThan(0.2);
    for (const id of ['vt1_vo2', 'peak_vo2', 'vt1_work', 'peak_work']) expect(['held', 'open'], id).toContain(j.metrics.find((m: any) => m.id === id).verdict);
    expect(j.metrics.find((m: any) => m.id === 'peak_vo2').verdict).toBe('held');
  });

  it('prints the finding, the primary and secondary tables, the band statement and the cautions', async () => {
    const t = captureIo(dir);
    expect(await main(['compare', declining.day1, declining.day2], t.io)).toBe(0);
    expect(t.out()).toContain('VO2 at VT1 (mL/min)');
    expect(t.out()).toContain('Retest interval: 24 h');
    expect(t.out()).toMatch(/Primary outcome .*Change interval %.*Reproduced range %.*Call/);
    expect(t.out()).toContain('Secondary metric');
    expect(t.out()).toContain('Matched workloads (incremental phase');
    expect(t.out()).toContain('does not diagnose');
  });

  it('--band healthy-30d uses Decato et al. 2018 (CV 10.4 % → −24.0 / +31.6 %); bandKind typical is no decision rule', async () => {
    const t = captureIo(dir);
    expect(await main(['compare', reproducing.day1, reproducing.day2, '--json', '--band', 'healthy-30d'], t.io)).toBe(0);
    const row = JSON.parse(t.out()).metrics.find((m: any) => m.id === 'vt1_vo2');
    expect(row.band_cv_pct).toBe(10.4);
    expect(row.band_low_pct).toBeCloseTo(-23.99, 1);
    const settings = join(dir, 'typical.json');
    writeFileSync(settings, JSON.stringify({ compare: { bandKind: 'typical' } }));
    const a = captureIo(dir);
    const b = captureIo(dir);
    expect(await main(['compare', declining.day1, declining.day2, '--json', '--settings', settings], a.io)).toBe(0);
    expect(await main(['compare', declining.day1, declining.day2, '--json'], b.io)).toBe(0);
    expect(JSON.parse(a.out()).metrics).toEqual(JSON.parse(b.out()).metrics);
  });

  it('refuses the same file for both days, and day 2 before day 1 unless --allow-order (exit 2)', async () => {
    const same = captureIo(dir);
    expect(await main(['compare', declining.day1, declining.day1], same.io)).toBe(2);
    expect(same.err()).toMatch(/refused \(same-file\): .*same SHA-256/);
    const swapped = captureIo(dir);
    expect(await main(['compare', declining.day2, declining.day1], swapped.io)).toBe(2);
    expect(swapped.err()).toMatch(/refused \(day-order\): Day 2 .* starts 24.5 h before day 1/);
  });

  it('exit 2 with FILE:LINE:COLUMN for a missing file, a bad band file and a garbled breath file', async () => {
    const missing = captureIo(dir);
    expect(await main(['compare', 'nope.csv', reproducing.day2], missing.io)).toBe(2);
    expect(missing.err()).toMatch(/^nope\.csv:0:0: Cannot open this breath file: the file does not exist\./);

    writeFileSync(join(dir, 'bad-band.json'), '{\n "format": "twofold-band",\n "version": 2\n}');
    const band = captureIo(dir);
    expect(await main(['compare', reproducing.day1, reproducing.day2, '--band', 'bad-band.json'], band.io)).toBe(2);
    expect(band.err()).toMatch(/^bad-band\.json:3:2: Expected "version": 1/); // "version" starts at line 3, column 2

    writeFileSync(join(dir, 'garbled.csv'), 'this is not,a breath table\n1,2\n');
    const garbled = captureIo(dir);
    expect(await main(['compare', 'garbled.csv', reproducing.day2], garbled.io)).toBe(2);
    expect(garbled.err()).toMatch(/^garbled\.csv:\d+:\d+: /);
  });

  it('usage mistakes exit 2', async () => {
    const t = captureIo(dir);
    expect(await main(['compare', reproducing.day1], t.io)).toBe(2);
    expect(await main(['compare', '--manifest', 'm.csv'], t.io)).toBe(2); // no --out
  });
});

describe('twofold compare --manifest', () => {
  it('skips a broken pair with its place, completes the run (exit 0) and says how many were skipped', async () => {
    const batch = join(dir, 'batch');
    writePair(batch, 'a', 303);
    writePair(batch, 'b', 404, 0.6);
    writeFileSync(join(batch, 'broken.csv'), 'time_s,vo2_ml_min,vco2_ml_min,ve_l_min\n0,abc\n');
    writeFileSync(join(batch, 'manifest.csv'), 'pair_id,day1_file,day2_file\nA,a-day1.csv,a-day2.csv\nBROKEN,broken.csv,a-day2.csv\nB,b-day1.csv,b-day2.csv\n');
    const t = captureIo(dir, true);
    expect(await main(['compare', '--manifest', join(batch, 'manifest.csv'), '--out', join(batch, 'results.csv')], t.io)).toBe(0);
    expect(t.err()).toMatch(/skipped pair BROKEN: broken\.csv:\d+:\d+: /);
    expect(t.err()).toMatch(/Compared 2 of 3 pairs in [\d.]+ s; skipped 1/);
    expect(t.err()).toContain('] 3/3 pairs'); // progress bar when interactive
    const rows = readFileSync(join(batch, 'results.csv'), 'utf8').trim().split('\n');
    expect(rows.length).toBe(4);
    expect(rows.map((r) => r.split(',').slice(0, 2).join(','))).toEqual(['pair_id,status', 'A,compared', 'BROKEN,skipped', 'B,compared']);
    const header = rows[0].split(',');
    // truth −40 %: lower on day 2, or undetermined where the two VT1 intervals are wide; never reproduced or higher
    expect(['fell', 'open']).toContain(rows[3].split(',')[header.indexOf('vt1_vo2_verdict')]);
  });

  it('runs on worker threads with results in manifest order', async () => {
    const batch = join(dir, 'workers');
    const lines = ['pair_id,day1_file,day2_file'];
    for (let i = 0; i < 8; i++) {
      writePair(batch, `w${i}`, 500 + i);
      lines.push(`W${i},w${i}-day1.csv,w${i}-day2.csv`);
    }
    lines.push('MISSING,none.csv,w0-day2.csv');
    writeFileSync(join(batch, 'manifest.csv'), `${lines.join('\n')}\n`);
    const t = captureIo(dir);
    expect(await main(['compare', '--manifest', join(batch, 'manifest.csv'), '--out', join(batch, 'results.csv'), '--workers', '2'], t.io)).toBe(0);
    const ids = readFileSync(join(batch, 'results.csv'), 'utf8').trim().split('\n').slice(1).map((r) => r.split(',')[0]);
    expect(ids).toEqual(['W0', 'W1', 'W2', 'W3', 'W4', 'W5', 'W6', 'W7', 'MISSING']);
    expect(t.err()).toMatch(/Compared 8 of 9 pairs/);
    expect(t.err()).toContain('skipped pair MISSING: none.csv:0:0: Cannot open this breath file');
  });

  it('the batch analyses with the bootstrap, so its row equals a single full comparison', async () => {
    const settings = DEFAULT_SETTINGS;
    const read = async (p: string, s: typeof settings) => {
      const r = await loadAnalysis(p, p, s);
      if (!r.ok) throw new Error(r.error.message);
      return r.value;
    };
    const full = compareTests(await read(declining.day1, settings), await read(declining.day2, settings), settings);
    const fast = batchAnalysisSettings(settings);
    expect(fast.thresholds.bootstrap.replicates).toBe(settings.thresholds.bootstrap.replicates);
    const quick = compareTests(await read(declining.day1, fast), await read(declining.day2, fast), settings);
    expect(resultsRow({ pairId: 'X', status: 'compared', comparison: quick })).toBe(resultsRow({ pairId: 'X', status: 'compared', comparison: full }));
  });

  it('a batch in which every pair is skipped exits 2, and its results still list each pair with its reason', async () => {
    const batch = join(dir, 'all-skipped');
    mkdirSync(batch, { recursive: true });
    writeFileSync(join(batch, 'broken.csv'), 'time_s,vo2_ml_min,vco2_ml_min,ve_l_min\n0,abc\n');
    writeFileSync(join(batch, 'manifest.csv'), 'pair_id,day1_file,day2_file\nX,broken.csv,none.csv\nY,none.csv,broken.csv\n');
    const t = captureIo(dir);
    expect(await main(['compare', '--manifest', join(batch, 'manifest.csv'), '--out', join(batch, 'results.csv')], t.io)).toBe(2);
    expect(t.err()).toMatch(/Compared 0 of 2 pairs .*skipped 2/);
    expect(t.err()).toContain('no pair could be compared (all 2 skipped)');
    const rows = readFileSync(join(batch, 'results.csv'), 'utf8').trim().split('\n');
    expect(rows.slice(1).map((r) => r.split(',').slice(0, 2).join(','))).toEqual(['X,skipped', 'Y,skipped']);
  });

  it('a bad manifest exits 2 with its place', async () => {
    writeFileSync(join(dir, 'bad-manifest.csv'), 'pair_id,day1_file,day2_file\nP1,a.csv\n');
    const t = captureIo(dir);
    expect(await main(['compare', '--manifest', 'bad-manifest.csv', '--out', 'r.csv'], t.io)).toBe(2);
    expect(t.err()).toMatch(/^bad-manifest\.csv:2:9: Expected 3 fields/); // "P1,a.csv" is 8 characters
  });
});

// The demo pairs (sample-tests/demo/, an invented scenario generated from the stated model,
// with each day's true thresholds in *.truth.json).
const demo = fileURLToPath(new URL('../../sample-tests/demo', import.meta.url));
const truth = (name: string) => JSON.parse(readFileSync(join(demo, `${name}.truth.json`), 'utf8'));
const demoJson = async (id: string) => {
  const t = captureIo(demo);
  expect(await main(['compare', `${id}-day1.csv`, `${id}-day2.csv`, '--json'], t.io)).toBe(0);
  return JSON.parse(t.out());
};

describe('demo pairs end to end', () => {
  it('declining cycle pair: the peak is lower on day 2; VT1 lower or undetermined, never higher', async () => {
    // truth (qh0417-day1/day2.truth.json): VT1 VO2 1300 → 985 mL/min = −24.2 %; peak 2250 → 1920 = −14.7 %
    const t1 = truth('qh0417-day1');
    const t2 = truth('qh0417-day2');
    expect((100 * (t2.vt1.vo2MlMin - t1.vt1.vo2MlMin)) / t1.vt1.vo2MlMin).toBeCloseTo(-24.2, 1);
    const j = await demoJson('qh0417');
    expect(j.findings.find((f: any) => f.id === 'peak')).toMatchObject({ verdict: 'fell', words: 'lower on day 2' });
    expect(['fell', 'open']).toContain(j.findings.find((f: any) => f.id === 'vt1').verdict);
    for (const id of ['vt1_vo2', 'vt1_work', 'peak_vo2', 'peak_work']) expect(['fell', 'open'], id).toContain(j.metrics.find((m: any) => m.id === id).verdict);
    expect(j.pairing.warnings).toEqual([]);
    expect(j.summary).toContain('Both tests met the maximal-effort criteria.');
  });

  it('reproducing cycle pair: no metric lower or higher on day 2; the peak reproduced', async () => {
    const j = await demoJson('qh0522');
    const comparable = j.metrics.filter((m: any) => m.verdict !== 'not_comparable');
    expect(comparable.length).toBeGreaterThanOrEqual(15);
    for (const m of comparable) expect(['held', 'open'], m.id).toContain(m.verdict);
    expect(j.findings.find((f: any) => f.id === 'peak').verdict).toBe('held');
    expect(j.summary).toContain('The peak reproduced day 1');
  });

  it('treadmill pair: matched workloads and watts are not available, and say why', async () => {
    const j = await demoJson('qh0638');
    expect(j.matched_workloads).toEqual([]);
    expect(j.matched_workloads_status.reason).toMatch(/treadmill/);
    expect(j.metrics.find((m: any) => m.id === 'vt1_work')).toMatchObject({ verdict: 'not_comparable' });
    expect(j.metrics.find((m: any) => m.id === 'vt1_work').reason).toMatch(/no workload in watts on day 1 \(treadmill\)/);
  });

  it('batch over the demo pairs with a broken file made in a temp dir: the broken pair is skipped, the rest compared', async () => {
    const batch = mkdtempSync(join(tmpdir(), 'twofold-demo-batch-'));
    writeFileSync(join(batch, 'broken-day1.csv'), 'time_s,vo2_ml_min,vco2_ml_min\n0,300,250\n');
    const rel = (f: string) => join(demo, f);
    writeFileSync(
      join(batch, 'manifest.csv'),
      ['pair_id,day1_file,day2_file', `QH-0417,${rel('qh0417-day1.csv')},${rel('qh0417-day2.csv')}`, 'BROKEN,broken-day1.csv,' + rel('qh0522-day2.csv'), `QH-0522,${rel('qh0522-day1.csv')},${rel('qh0522-day2.csv')}`, `QH-0638,${rel('qh0638-day1.csv')},${rel('qh0638-day2.csv')}`].join('\n'),
    );
    const t = captureIo(batch);
    expect(await main(['compare', '--manifest', 'manifest.csv', '--out', 'results.csv'], t.io)).toBe(0);
    expect(t.err()).toMatch(/skipped pair BROKEN: broken-day1\.csv:\d+:\d+: /);
    expect(t.err()).toMatch(/Compared 3 of 4 pairs/);
    const rows = readFileSync(join(batch, 'results.csv'), 'utf8').trim().split('\n');
    const header = rows[0].split(',');
    const byId = new Map(rows.slice(1).map((r) => [r.split(',')[0], r.split(',')]));
    expect(byId.get('BROKEN')![1]).toBe('skipped');
    expect(byId.get('QH-0417')![header.indexOf('peak_vo2_verdict')]).toBe('fell');
    expect(['held', 'open']).toContain(byId.get('QH-0522')![header.indexOf('vt1_vo2_verdict')]);
    expect(byId.get('QH-0638')![header.indexOf('vt1_work_verdict')]).toBe('not_comparable');
  });
});
