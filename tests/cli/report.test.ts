// `twofold report` with a lab certificate made by openssl: the password comes from the
// environment, the PDF verifies in pdfsig, paper size follows --paper (US Letter is
// 612 × 792 pt, 8.5 × 11 in at 72 pt/in; A4 595.28 × 841.89 pt per ISO 216), the case folder
// is reopened with its log, and mistakes are plain messages with exit 2. Clinical inputs given
// as --dayN-… flags reach the case file and the PDF; a reopened case never changes them
// silently.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { main } from '../../cli/main';
import { io } from './capture-io';
import { DEMO_FOLDER, DEMO_PAIR } from '../../host/demo-job';
import { opensslCertificate, type LabCertificate } from '../core/report/fixture';


const day1 = join(DEMO_FOLDER, DEMO_PAIR.day1);
const day2 = join(DEMO_FOLDER, DEMO_PAIR.day2);
let cert: LabCertificate;
let dir: string;

beforeAll(() => {
  cert = opensslCertificate();
  dir = mkdtempSync(join(tmpdir(), 'twofold-cli-report-'));
});

describe('twofold report', () => {
  it('signs with the password from --pass-env; pdfsig accepts it; letter paper', async () => {
    const out = join(dir, 'letter.pdf');
    const t = io({ LAB_PASS: cert.password });
    const code = await main(['report', day1, day2, '--out', out, '--sign', join(cert.dir, 'lab.p12'), '--pass-env', 'LAB_PASS', '--reviewer', 'T. Tester, MSc', '--paper', 'letter'], t.io);
    expect(code, t.err()).toBe(0);
    const sig = spawnSync('pdfsig', [out], { encoding: 'utf8' }).stdout;
    expect(sig).toContain('Signature is Valid');
    expect(sig).toContain('Test Lab Signer');
    expect(spawnSync('pdfinfo', [out], { encoding: 'utf8' }).stdout).toMatch(/Page size:\s+612 x 792 pts/);
    expect(existsSync(join(dir, 'letter-case', 'twofold-case.json'))).toBe(true);
    expect(spawnSync('pdftotext', [out, '-'], { encoding: 'utf8' }).stdout).toContain('T. Tester, MSc');
  });

  it('reopens the case folder, and refuses other files for it', async () => {
    const out = join(dir, 'a4.pdf');
    expect(await main(['report', day1, day2, '--out', out], io().io)).toBe(0);
    expect(spawnSync('pdfinfo', [out], { encoding: 'utf8' }).stdout).toMatch(/Page size:\s+595\.2\d x 841\.8\d pts \(A4\)/);
    expect(await main(['report', day1, day2, '--out', out], io().io)).toBe(0);
    // The same folder named by its case file:
    expect(await main(['report', day1, day2, '--out', out, '--case', join(dir, 'a4-case', 'twofold-case.json')], io().io)).toBe(0);
    const t = io();
    expect(await main(['report', day2, day1, '--out', out], t.io)).toBe(2);
    expect(t.err()).toContain('different day 1 file');
  });

  it('a wrong password or a missing variable is a plain message, exit 2', async () => {
    const wrong = io({ LAB_PASS: 'not-it' });
    expect(await main(['report', day1, day2, '--out', join(dir, 'w.pdf'), '--sign', join(cert.dir, 'lab.p12'), '--pass-env', 'LAB_PASS'], wrong.io)).toBe(2);
    expect(wrong.err()).toContain('could not be signed');
    const missing = io();
    expect(await main(['report', day1, day2, '--out', join(dir, 'm.pdf'), '--sign', join(cert.dir, 'lab.p12'), '--pass-env', 'LAB_PASS'], missing.io)).toBe(2);
    expect(missing.err()).toContain('LAB_PASS is not set');
  });
});

function caseJson(folder: string) {
  return JSON.parse(readFileSync(join(folder, 'twofold-case.json'), 'utf8'));
}

function pdfText(pdf: string): string {
  return spawnSync('pdftotext', ['-layout', pdf, '-'], { encoding: 'utf8' }).stdout;
}

describe('twofold report: clinical inputs per day', () => {
  it('puts the flags into the case and the PDF shows the values computed from them', async () => {
    const out = join(dir, 'clinical.pdf');
    const t = io();
    const code = await main(['report', day1, day2, '--out', out, '--day1-rest-hr', '62', '--day1-lactate', '9.4', '--day1-fev1-l', '4', '--day2-mvv-l-min', '150', '--day2-rpe', '19'], t.io);
    expect(code, t.err()).toBe(0);
    const c = caseJson(join(dir, 'clinical-case'));
    expect(c.clinical.day1).toEqual({ restingHrBpm: 62, lactateMmolL: 9.4, fev1L: 4, mvvLMin: null, peakRpe: null });
    expect(c.clinical.day2).toEqual({ restingHrBpm: null, lactateMmolL: null, fev1L: null, mvvLMin: 150, peakRpe: 19 });
    expect(t.out()).toContain('day 1   resting HR 62 bpm, peak lactate 9.4 mmol/L');
    const text = pdfText(out);
    // Rule of thumb resting HR + 15 bpm (common practice): 62 + 15 = 77 bpm, worked by hand.
    expect(text).toMatch(/Day 1 .*77 bpm \(rest 62\)/);
    expect(text).toMatch(/Day 2 .*resting HR not given/);
    // Lactate effort criterion ≥ 8 mmol/L (common practice, the default setting): 9.4 is printed to 1 decimal and met.
    expect(text).toMatch(/Peak blood lactate\s+9\.4 mmol\/L\s+≥ 8 mmol\/L\s+met/);
    // The per-day table prints the reserve and states how MVV was obtained: 4 L × 40 = 160 L/min
    // on day 1, the measured 150 L/min on day 2.
    const ve1: number = c.recorded.numbers['day1.peak.veLMin'];
    const reserve1 = `${(160 - ve1).toFixed(0)} L/min (${((100 * (160 - ve1)) / 160).toFixed(0)} %)`;
    expect(text).toMatch(new RegExp(`Breathing reserve\\s+${reserve1.replace(/[()]/g, '\\$&')}\\s+MVV estimated as FEV1 4\\.00 L ×`));
    expect(text).toMatch(/Breathing reserve\s+\d+ L\/min \(\d+ %\)\s+MVV measured, 150 L\/min/);
    expect(text).toMatch(/Peak blood lactate\s+not measured/);
    // Breathing reserve = MVV − peak VE, MVV ≈ FEV1 × 40 when not measured (common practice):
    // day 1 MVV 4 × 40 = 160 L/min; day 2 the measured 150 L/min.
    const n = c.recorded.numbers;
    expect(n['day1.derived.breathingReserveLMin']).toBeCloseTo(160 - n['day1.peak.veLMin'], 9);
    expect(n['day1.derived.breathingReservePct']).toBeCloseTo((100 * (160 - n['day1.peak.veLMin'])) / 160, 9);
    expect(n['day2.derived.breathingReserveLMin']).toBeCloseTo(150 - n['day2.peak.veLMin'], 9);
  });

  it('a bad clinical value is a usage error naming the flag, and nothing is written', async () => {
    const out = join(dir, 'bad-clinical.pdf');
    const cases: [string[], string][] = [
      [['--day1-rest-hr', 'sixty'], "--day1-rest-hr expects a number, got 'sixty'"],
      [['--day2-rpe', '25'], '--day2-rpe expects peak Borg RPE from 6 to 20, got 25'],
      [['--day1-lactate=-1'], '--day1-lactate expects peak lactate from 0 to 40 mmol/L, got -1'],
      [['--day2-fev1-l', '3.2', '--day2-mvv-l-min', '120'], 'give either --day2-fev1-l or --day2-mvv-l-min, not both'],
      [['--amend-clinical'], '--amend-clinical needs at least one'],
    ];
    for (const [flags, message] of cases) {
      const t = io();
      expect(await main(['report', day1, day2, '--out', out, ...flags], t.io)).toBe(2);
      expect(t.err()).toContain(message);
    }
    expect(existsSync(out)).toBe(false);
    expect(existsSync(join(dir, 'bad-clinical-case'))).toBe(false);
  });

  it('a reopened case keeps its inputs; a changed value needs --amend-clinical, and is refused once the log has entries', async () => {
    const out = join(dir, 'reopen.pdf');
    const folder = join(dir, 'reopen-case');
    expect(await main(['report', day1, day2, '--out', out, '--day1-rest-hr', '62'], io().io)).toBe(0);
    // No flags, or the same value: the recorded inputs stand.
    expect(await main(['report', day1, day2, '--out', out], io().io)).toBe(0);
    expect(await main(['report', day1, day2, '--out', out, '--day1-rest-hr', '62'], io().io)).toBe(0);
    expect(caseJson(folder).clinical.day1.restingHrBpm).toBe(62);
    expect(pdfText(out)).toMatch(/Day 1 .*77 bpm \(rest 62\)/);

    const before = readFileSync(join(folder, 'twofold-case.json'), 'utf8');
    const refused = io();
    expect(await main(['report', day1, day2, '--out', out, '--day1-rest-hr', '70', '--day2-lactate', '8.1'], refused.io)).toBe(2);
    expect(refused.err()).toContain('day 1 resting HR: 62 bpm → 70 bpm');
    expect(refused.err()).toContain('day 2 peak lactate: not given → 8.1 mmol/L');
    expect(refused.err()).toContain('--amend-clinical');
    expect(readFileSync(join(folder, 'twofold-case.json'), 'utf8')).toBe(before);

    const amended = io();
    expect(await main(['report', day1, day2, '--out', out, '--day1-rest-hr', '70', '--amend-clinical'], amended.io)).toBe(0);
    expect(amended.out()).toContain('amended day 1 resting HR: 62 bpm → 70 bpm');
    expect(caseJson(folder).clinical.day1.restingHrBpm).toBe(70);
    // 70 + 15 = 85 bpm, worked by hand.
    expect(pdfText(out)).toMatch(/Day 1 .*85 bpm \(rest 70\)/);

    // Once a reviewer action is logged, the chain is anchored to the inputs: no amendment.
    const automatic = caseJson(folder).recorded.numbers['day1.vt1.timeS'];
    expect(await main(['override', folder, '--day', '1', '--threshold', 'vt1', '--time-s', String(Math.round(automatic) + 20), '--reason', 'reads later', '--reviewer', 'T. Tester', '--role', 'physiologist'], io().io)).toBe(0);
    const logged = readFileSync(join(folder, 'twofold-case.json'), 'utf8');
    const chained = io();
    expect(await main(['report', day1, day2, '--out', out, '--day1-rest-hr', '75', '--amend-clinical'], chained.io)).toBe(2);
    expect(chained.err()).toContain('reviewer log (1 entry) is chained to the recorded inputs');
    expect(chained.err()).toContain('day 1 resting HR: 70 bpm → 75 bpm');
    expect(readFileSync(join(folder, 'twofold-case.json'), 'utf8')).toBe(logged);
  });

  it('FEV1 given for a case that recorded a measured MVV replaces it, visibly', async () => {
    const out = join(dir, 'spiro.pdf');
    const folder = join(dir, 'spiro-case');
    expect(await main(['report', day1, day2, '--out', out, '--day2-mvv-l-min', '150'], io().io)).toBe(0);
    const t = io();
    expect(await main(['report', day1, day2, '--out', out, '--day2-fev1-l', '3.5', '--amend-clinical'], t.io)).toBe(0);
    expect(t.out()).toContain('amended day 2 FEV1: not given → 3.5 L');
    expect(t.out()).toContain('amended day 2 measured MVV: 150 L/min → not given');
    const c = caseJson(folder);
    expect(c.clinical.day2).toMatchObject({ fev1L: 3.5, mvvLMin: null });
    // MVV ≈ 3.5 × 40 = 140 L/min (common practice).
    expect(c.recorded.numbers['day2.derived.breathingReserveLMin']).toBeCloseTo(140 - c.recorded.numbers['day2.peak.veLMin'], 9);
  });
});
