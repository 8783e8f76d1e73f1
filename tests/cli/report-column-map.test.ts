// `twofold report --day1-map`: a day-1 export whose heart-rate column the importer cannot name
// (the demo file with `hr_bpm` renamed), read with a column map that names it again. Reference:
// renaming a header and naming it back changes no value, so peak HR in the PDF equals that of
// the original demo file, and `twofold verify` (which re-reads the attached raw files with the
// map the attached case records) recomputes every number.
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { spawnSync } from 'node:child_process';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { main } from '../../cli/main';
import { io } from './capture-io';
import { DEMO_FOLDER, DEMO_PAIR } from '../../host/demo-job';
import { heartRateMap, renamed } from '../host/mapped-case';
import { opensslCertificate, type LabCertificate } from '../core/report/fixture';


const day2 = join(DEMO_FOLDER, DEMO_PAIR.day2);
let dir: string;
let day1: string;
let map: string;
let cert: LabCertificate;

beforeAll(() => {
  cert = opensslCertificate();
  dir = mkdtempSync(join(tmpdir(), 'twofold-cli-map-'));
  day1 = join(dir, DEMO_PAIR.day1);
  writeFileSync(day1, renamed);
  map = join(dir, 'heart-rate-map.json');
  writeFileSync(map, JSON.stringify(heartRateMap));
});

const peakHrLine = (pdf: string) => spawnSync('pdftotext', ['-layout', pdf, '-'], { encoding: 'utf8' }).stdout.split('\n').find((l) => /HR peak|Peak HR/.test(l)) ?? '';

describe('twofold report with a column map', () => {
  it('records the map in a new case, reads day 1 with it (same peak HR as the original file), and the report verifies', async () => {
    const withMap = join(dir, 'mapped.pdf');
    const t = io({ LAB_PASS: cert.password });
    expect(await main(['report', day1, day2, '--out', withMap, '--day1-map', map, '--sign', join(cert.dir, 'lab.p12'), '--pass-env', 'LAB_PASS'], t.io), t.err()).toBe(0);
    const caseFile = JSON.parse(readFileSync(join(dir, 'mapped-case', 'twofold-case.json'), 'utf8'));
    expect(caseFile.inputs.day1.columnMap).toEqual(heartRateMap);
    expect(caseFile.inputs.day2.columnMap ?? null).toBeNull();

    const reference = join(dir, 'original.pdf');
    expect(await main(['report', join(DEMO_FOLDER, DEMO_PAIR.day1), day2, '--out', reference], io().io)).toBe(0);
    expect(peakHrLine(withMap)).not.toBe('');
    expect(peakHrLine(withMap)).toBe(peakHrLine(reference));

    const v = io();
    expect(await main(['verify', withMap, '--trust', cert.certPem], v.io), v.out() + v.err()).toBe(0);
  }, 240_000);

  it('a reopened case refuses a different map; a bad map file names its place', async () => {
    const out = join(dir, 'mapped2.pdf');
    expect(await main(['report', day1, day2, '--out', out, '--day1-map', map], io().io)).toBe(0);
    const other = join(dir, 'other-map.json');
    writeFileSync(other, JSON.stringify({ ...heartRateMap, columns: [{ header: 'cardiac_beats', variable: 'hrBpm', unit: 'bpm' }, { header: 'Time', variable: 'timeS', unit: 's' }] }));
    const before = readFileSync(join(dir, 'mapped2-case', 'twofold-case.json'), 'utf8');
    const t = io();
    expect(await main(['report', day1, day2, '--out', out, '--day1-map', other], t.io)).toBe(2);
    expect(t.err()).toContain('differs from the one this case recorded');
    expect(readFileSync(join(dir, 'mapped2-case', 'twofold-case.json'), 'utf8')).toBe(before);

    const broken = join(dir, 'broken-map.json');
    writeFileSync(broken, '{ "format": "twofold-column-map", ');
    const b = io();
    expect(await main(['report', day1, day2, '--out', join(dir, 'x.pdf'), '--day1-map', broken], b.io)).toBe(2);
    expect(b.err()).toContain('broken-map.json');
    const missing = io();
    expect(await main(['report', day1, day2, '--out', join(dir, 'y.pdf'), '--day2-map', join(dir, 'nope.json')], missing.io)).toBe(2);
    expect(missing.err()).toContain('--day2-map does not exist');
  });
});
