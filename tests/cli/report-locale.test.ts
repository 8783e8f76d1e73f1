// `twofold report --locale` and `twofold verify` in a decimal-comma locale. Reference: the
// conventions of core/locale/locales.ts (de-DE: decimal comma, `.` thousands, dd.mm.yyyy);
// the printed text is read with poppler's pdftotext, independently of the code that wrote it.
import { spawnSync } from 'node:child_process';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { main } from '../../cli/main';
import { io } from './capture-io';
import { DEMO_FOLDER, DEMO_PAIR } from '../../host/demo-job';
import { opensslCertificate, type LabCertificate } from '../core/report/fixture';
import { loadCase } from '../../host/case-folder';
import { readRaw, recordCase } from '../../host/report-job';
import { checkPrintedNumbers } from '../../host/printed-numbers';
import { caseFromText, caseToText } from '../../core/case/case-text';

let dir: string;
let cert: LabCertificate;
let report: string;
const day1 = join(DEMO_FOLDER, DEMO_PAIR.day1);
const day2 = join(DEMO_FOLDER, DEMO_PAIR.day2);

function text(pdf: string): string {
  return spawnSync('pdftotext', ['-layout', pdf, '-'], { encoding: 'utf8' }).stdout;
}

beforeAll(async () => {
  cert = opensslCertificate();
  dir = mkdtempSync(join(tmpdir(), 'twofold-cli-locale-'));
  report = join(dir, 'de.pdf');
  const t = io({ P: cert.password });
  const code = await main(['report', day1, day2, '--out', report, '--sign', join(cert.dir, 'lab.p12'), '--pass-env', 'P', '--locale', 'de-DE'], t.io);
  if (code !== 0) throw new Error(`report failed: ${t.err()}`);
});

describe('a report in a decimal-comma locale', () => {
  it('prints numbers and dates in de-DE and records the locale in the case', () => {
    const printed = text(report);
    expect(printed).toMatch(/Interval\s+24,3 h/);
    expect(printed).toMatch(/Day 1 start\s+09\.03\.2026 09:10 \(UTC\+01:00\)/);
    expect(printed).toMatch(/Height, mass\s+167 cm, 70,0 kg/);
    // Page 1 states the interval in its facts (above); its finding sentences and primary
    // table carry their numbers in de-DE too: decimal comma, `.` from four integer digits.
    expect(printed).toMatch(/VO2 [−+]?\d+,\d % \(interval [−+]?\d+,\d to [−+]?\d+,\d %/);
    expect(printed).not.toMatch(/\(interval [−+]?\d+\.\d/);
    expect(printed).toMatch(/Peak VO2 \(mL\/min\)\s+\d\.\d{3}\s+\d\.\d{3}\s+[−+]?\d+,\d\s/);
    expect(printed).not.toMatch(/\b\d+\.\d h\b/);
    const loaded = loadCase(join(dir, 'de-case'));
    expect(loaded.ok && loaded.value.caseFile.reportLocale).toBe('de-DE');
  });

  it('verifies: twofold verify reads the printed figures back in de-DE', async () => {
    const t = io();
    expect(await main(['verify', report, '--trust', cert.certPem], t.io)).toBe(0);
    expect(t.out()).toMatch(/ok {4} Printed figures: all \d+ day 1 and day 2 figures of the comparison table read back in de-DE/);
  });

  it('the same printed text read as if it were neutral does not pass', () => {
    const loaded = loadCase(join(dir, 'de-case'));
    if (!loaded.ok) throw new Error(loaded.error.message);
    const recorded = recordCase(loaded.value.caseFile, { day1: readRaw(day1).bytes, day2: readRaw(day2).bytes });
    if (!recorded.ok) throw new Error(recorded.error.message);
    const comparison = recorded.value.outcome.comparison;
    expect(checkPrintedNumbers(text(report), comparison, 'de-DE').ok).toBe(true);
    const asNeutral = checkPrintedNumbers(text(report), comparison, 'en');
    expect(asNeutral.ok).toBe(false);
    expect(asNeutral.problems.length).toBeGreaterThan(0);
  });

  it('without --locale the environment decides; a reopened case keeps its locale', async () => {
    const out = join(dir, 'sv.pdf');
    const t = io({ LANG: 'sv_SE.UTF-8' });
    expect(await main(['report', day1, day2, '--out', out], t.io)).toBe(0);
    expect(t.out()).toContain('locale  sv-SE');
    expect(text(out)).toMatch(/Day 1 start\s+2026-03-09 09:10 \(UTC\+01:00\)/);
    const again = io({ LANG: 'C.UTF-8' });
    expect(await main(['report', day1, day2, '--out', out], again.io)).toBe(0);
    expect(again.out()).toContain('locale  sv-SE');
  });

  it('an unknown locale is a usage error naming the known ones', async () => {
    const t = io();
    expect(await main(['report', day1, day2, '--out', join(dir, 'x.pdf'), '--locale', 'tlh-QO'], t.io)).toBe(2);
    expect(t.err()).toContain("no number and date format for 'tlh-QO'");
    expect(t.err()).toContain('de-DE');
  });

  it('a case file without a locale loads as the neutral en; one with an unknown locale does not load', () => {
    const loaded = loadCase(join(dir, 'de-case'));
    if (!loaded.ok) throw new Error(loaded.error.message);
    const { reportLocale: _, ...old } = loaded.value.caseFile;
    const back = caseFromText(caseToText(old), 'old.json');
    expect(back.ok && back.value.reportLocale).toBeUndefined();
    const bad = caseFromText(caseToText({ ...old, reportLocale: 'xx-YY' }), 'bad.json');
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.error.message).toContain('reportLocale');
  });
});
