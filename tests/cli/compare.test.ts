// `twofold compare` end to end through the real importer and analyzeTest, on pairs written
// by the test-data generator (a stated model with known VT1; sample-tests/generator). The
// bands are Twofold's defaults (Decato et al. 2018 CVs; MDC95 = 2.77 × CV, Weir 2005).
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
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
  it('--json: a true VT1 VO2 drop of 40% (1100 → 660 mL/min) is a decline beyond the mdc95 band ±28.8%', async () => {
    const t = captureIo(dir);
    expect(await main(['compare', declining.day1, declining.day2, '--json'], t.io)).toBe(0);
    const j = JSON.parse(t.out());
    const vt1 = j.metrics.find((m: any) => m.id === 'vt1_vo2');
    expect(Math.abs(vt1.day1 / declining.trueVt1Day1MlMin - 1)).toBeLessThan(0.2); // detector near truth
    expect(Math.abs(vt1.day2 / declining.trueVt1Day2MlMin - 1)).toBeLessThan(0.2);
    expect(vt1.verdict).toBe('decline');
    expect(vt1.band_pct).toBeCloseTo(28.83, 2); // 10.4 × 2.77186
    expect(j.pairing.interval_h).toBe(24.5); // 09:00 → 09:30 next day
    expect(j.band.kind).toBe('mdc95');
    expect(j.summary).toMatch(/VO2 at VT1 [\d.]+% lower on day 2/);
  });

  it('a reproducing pair (same model, new noise): VT1 VO2 and peak VO2 within the band', async () => {
    const t = captureIo(dir);
    expect(await main(['compare', reproducing.day1, reproducing.day2, '--json'], t.io)).toBe(0);
    const j = JSON.parse(t.out());
    const vt1 = j.metrics.find((m: any) => m.id === 'vt1_vo2');
    expect(Math.abs(vt1.day1 / reproducing.trueVt1Day1MlMin - 1)).toBeLessThan(0.2); // detector near truth
    expect(Math.abs(vt1.day2 / reproducing.trueVt1Day2MlMin - 1)).toBeLessThan(0.2);
    for (const id of ['vt1_vo2', 'peak_vo2', 'vt1_work']) expect(j.metrics.find((m: any) => m.id === id).verdict, id).toBe('within');
  });

  it('prints a readable table with the band kind, the summary and the cautions', async () => {
    const t = captureIo(dir);
    expect(await main(['compare', declining.day1, declining.day2], t.io)).toBe(0);
    expect(t.out()).toContain('VO2 at VT1 (mL/min)');
    expect(t.out()).toContain('band: minimal detectable change');
    expect(t.out()).toContain('Matched workloads (incremental phase');
    expect(t.out()).toContain('does not diagnose');
  });

  it('--settings bandKind typical narrows the band to ± the CV (10.4%)', async () => {
    const settings = join(dir, 'typical.json');
    writeFileSync(settings, JSON.stringify({ compare: { bandKind: 'typical' } }));
    const t = captureIo(dir);
    expect(await main(['compare', reproducing.day1, reproducing.day2, '--json', '--settings', settings], t.io)).toBe(0);
    expect(JSON.parse(t.out()).metrics.find((m: any) => m.id === 'vt1_vo2').band_pct).toBe(10.4);
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
    expect(rows[3].split(',')[header.indexOf('vt1_vo2_verdict')]).toBe('decline'); // truth −40%
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

  it('the batch (no bootstrap) gives the same results row as a full analysis with the bootstrap', async () => {
    const settings = DEFAULT_SETTINGS;
    const read = async (p: string, s: typeof settings) => {
      const r = await loadAnalysis(p, p, s);
      if (!r.ok) throw new Error(r.error.message);
      return r.value;
    };
    const full = compareTests(await read(declining.day1, settings), await read(declining.day2, settings), settings);
    const fast = batchAnalysisSettings(settings);
    expect(fast.thresholds.bootstrap.replicates).toBe(0);
    const quick = compareTests(await read(declining.day1, fast), await read(declining.day2, fast), settings);
    expect(resultsRow({ pairId: 'X', status: 'compared', comparison: quick })).toBe(resultsRow({ pairId: 'X', status: 'compared', comparison: full }));
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
  it('declining cycle pair: VT1 VO2 and VT1 workload decline beyond the band, as the truth does', async () => {
    // truth: VT1 VO2 1300 → 830 mL/min = −36.2% (beyond ±28.83%); VT1 work 91.0 → 54.6 W = −40.0%
    // (beyond ±22.17%), from qh0417-day1/day2.truth.json
    const t1 = truth('qh0417-day1');
    const t2 = truth('qh0417-day2');
    expect((100 * (t2.vt1.vo2MlMin - t1.vt1.vo2MlMin)) / t1.vt1.vo2MlMin).toBeLessThan(-28.83);
    expect((100 * (t2.vt1.workW - t1.vt1.workW)) / t1.vt1.workW).toBeLessThan(-22.17);
    const j = await demoJson('qh0417');
    for (const id of ['vt1_vo2', 'vt1_work']) {
      expect(j.metrics.find((m: any) => m.id === id), id).toMatchObject({ verdict: 'decline', adverse_beyond_band: true });
    }
    expect(j.pairing.warnings).toEqual([]);
    expect(j.summary).toContain('Both tests met the maximal-effort criteria.');
  });

  it('reproducing cycle pair: every comparable metric within its band', async () => {
    const j = await demoJson('qh0522');
    const comparable = j.metrics.filter((m: any) => m.verdict !== 'not_comparable');
    expect(comparable.length).toBeGreaterThanOrEqual(15);
    for (const m of comparable) expect(m.verdict, m.id).toBe('within');
    expect(j.summary).toContain('No metric changed beyond its band in the adverse direction.');
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
    expect(byId.get('QH-0417')![header.indexOf('vt1_vo2_verdict')]).toBe('decline');
    expect(byId.get('QH-0522')![header.indexOf('vt1_vo2_verdict')]).toBe('within');
    expect(byId.get('QH-0638')![header.indexOf('vt1_work_verdict')]).toBe('not_comparable');
  });
});
