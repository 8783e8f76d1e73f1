/**
 * Builds the demo pair's report in the test process (real importer, analysis, comparison),
 * with one reviewer override, and a lab certificate made by openssl in a temporary folder.
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { noClinicalInputs } from '../../../core/analyze/analyze-test';
import { caseToText } from '../../../core/case/case-text';
import { newCase } from '../../../core/case/new-case';
import { recordOverride } from '../../../core/case/review';
import { DEFAULT_SETTINGS, type Settings } from '../../../core/model/settings';
import { buildReport } from '../../../core/report/build-report';
import { signReport } from '../../../host/sign-report';
import { DEMO_FOLDER, DEMO_PAIR } from '../../../host/demo-job';
import { reportFonts } from '../../../host/fonts';
import { readRaw, recordCase } from '../../../host/report-job';

export interface LabCertificate {
  readonly dir: string;
  readonly p12: Uint8Array;
  readonly certPem: string;
  readonly password: string;
}

/** A self-signed lab certificate made with openssl (req -x509, then pkcs12 -export). */
export function opensslCertificate(): LabCertificate {
  const dir = mkdtempSync(join(tmpdir(), 'twofold-cert-'));
  const password = 'lab-secret';
  execFileSync('openssl', ['req', '-x509', '-newkey', 'rsa:2048', '-nodes', '-keyout', join(dir, 'key.pem'), '-out', join(dir, 'cert.pem'), '-days', '2', '-subj', '/CN=Test Lab Signer/O=Test Lab'], { stdio: 'pipe' });
  execFileSync('openssl', ['pkcs12', '-export', '-inkey', join(dir, 'key.pem'), '-in', join(dir, 'cert.pem'), '-out', join(dir, 'lab.p12'), '-passout', `pass:${password}`], { stdio: 'pipe' });
  return { dir, p12: readFileSync(join(dir, 'lab.p12')), certPem: join(dir, 'cert.pem'), password };
}

export async function demoReport(paper: Settings['report']['paper'] = 'a4') {
  const day1 = readRaw(join(DEMO_FOLDER, DEMO_PAIR.day1));
  const day2 = readRaw(join(DEMO_FOLDER, DEMO_PAIR.day2));
  const raw = { day1: day1.bytes, day2: day2.bytes };
  const at = '2026-03-11T10:00:00Z';
  let caseFile = newCase(at, day1, day2, { ...DEFAULT_SETTINGS, report: { paper } }, { day1: noClinicalInputs(), day2: noClinicalInputs() });
  const first = recordCase(caseFile, raw);
  if (!first.ok) throw new Error(first.error.message);
  const auto = first.value.outcome.day2.vt1.automatic.at;
  if (!auto) throw new Error('demo day 2 has no VT1');
  const moved = recordOverride(caseFile, first.value.outcome, { who: 'T. Tester', role: 'reviewer', at }, 2, 'vt1', { timeS: auto.timeS - 30 }, 'test: breakpoint read 30 s earlier');
  if (!moved.ok) throw new Error(moved.error.message);
  const recorded = recordCase(moved.value, raw);
  if (!recorded.ok) throw new Error(recorded.error.message);
  caseFile = recorded.value.caseFile;
  const pdf = await buildReport({
    caseFile,
    caseText: caseToText(caseFile),
    outcome: recorded.value.outcome,
    raw,
    fonts: reportFonts(),
    generatedAt: at,
    reviewer: 'T. Tester, test credential',
    signature: 'lab',
  });
  return { pdf, caseFile, outcome: recorded.value.outcome, raw };
}

export async function signedDemoReport(cert: LabCertificate, paper: Settings['report']['paper'] = 'a4') {
  const built = await demoReport(paper);
  const signed = await signReport(built.pdf, { p12: cert.p12, passphrase: cert.password, p12Name: 'lab.p12', signerName: 'T. Tester', reason: 'test', location: 'test lab', signingTime: new Date('2026-03-11T10:05:00Z') });
  if (!signed.ok) throw new Error(signed.error.message);
  return { ...built, signed: signed.value };
}

/** Appends an incremental update that replaces object `objectNumber` with a new stream (ISO 32000-1 §7.5.6). */
export function appendIncrementalUpdate(pdf: Uint8Array, objectNumber: number, dictionary: string, data: Uint8Array): Uint8Array {
  const text = Buffer.from(pdf).toString('latin1');
  const prev = Number([...text.matchAll(/startxref\s+(\d+)/g)].pop()?.[1]);
  const trailers = [...text.matchAll(/trailer\s*<<([^]*?)>>\s*startxref/g)];
  const trailer = trailers[trailers.length - 1][1];
  const size = Number(/\/Size\s+(\d+)/.exec(trailer)?.[1]);
  const root = /\/Root\s+(\d+\s+\d+\s+R)/.exec(trailer)?.[1];
  const head = Buffer.from(`\n${objectNumber} 0 obj\n<< ${dictionary} /Length ${data.length} >>\nstream\n`, 'latin1');
  const objOffset = pdf.length + 1;
  const body = Buffer.concat([head, Buffer.from(data), Buffer.from('\nendstream\nendobj\n', 'latin1')]);
  const xrefOffset = pdf.length + body.length;
  const xref = `xref\n0 1\n0000000000 65535 f \n${objectNumber} 1\n${String(objOffset).padStart(10, '0')} 00000 n \ntrailer\n<< /Size ${size} /Root ${root} /Prev ${prev} >>\nstartxref\n${xrefOffset}\n%%EOF\n`;
  return new Uint8Array(Buffer.concat([Buffer.from(pdf), body, Buffer.from(xref, 'latin1')]));
}

/** The trust list that names this certificate alone, as `twofold verify --trust cert.pem` reads it. */
export function trustOf(cert: LabCertificate): { pem: string; source: string }[] {
  return [{ pem: readFileSync(cert.certPem, 'latin1'), source: cert.certPem }];
}
