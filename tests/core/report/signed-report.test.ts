// The signed report held against tools outside Twofold (poppler-utils pdfsig, pdftotext,
// pdffonts, pdfdetach, pdfinfo; openssl cms; qpdf): a valid signature over the whole file, a
// sound PDF structure, the comparison numbers readable as text, embedded fonts, the PDF/A-3
// identification in the XMP metadata, and the attachments byte for byte. Then tampering: one
// changed byte, and an appended incremental update, must each be caught by pdfsig and by
// Twofold's own check.
import { execFileSync, spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { fixed } from '../../../core/report/format';
import { verifySignature } from '../../../core/report/verify-signature';
import { embeddedFiles } from '../../../host/pdf-attachments';
import { verifyReport } from '../../../host/verify-report';
import { appendIncrementalUpdate, opensslCertificate, signedDemoReport, trustOf } from './fixture';

let dir: string;
let signed: Uint8Array;
let built: Awaited<ReturnType<typeof signedDemoReport>>;
let certPem: string;
let trust: ReturnType<typeof trustOf>;

function tool(cmd: string, args: string[]) {
  const r = spawnSync(cmd, args, { encoding: 'utf8' });
  return { status: r.status, out: `${r.stdout}${r.stderr}` };
}

function write(name: string, bytes: Uint8Array): string {
  const path = join(dir, name);
  writeFileSync(path, bytes);
  return path;
}

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'twofold-report-'));
  const cert = opensslCertificate();
  certPem = cert.certPem;
  trust = trustOf(cert);
  built = await signedDemoReport(cert);
  signed = built.signed;
  write('report.pdf', signed);
});

describe('the signed report, checked by outside tools', () => {
  it('pdfsig: signature valid and the whole document signed', () => {
    const r = tool('pdfsig', [join(dir, 'report.pdf')]);
    expect(r.out).toContain('Signature Validation: Signature is Valid.');
    expect(r.out).toContain('Total document signed');
    expect(r.out).toContain('Test Lab Signer');
  });

  it('openssl cms -verify accepts the detached signature over the signed byte ranges', () => {
    const text = Buffer.from(signed).toString('latin1');
    const [a, b, c, d] = /\/ByteRange\s*\[\s*(\d+)\s+(\d+)\s+(\d+)\s+(\d+)\s*\]/.exec(text)!.slice(1, 5).map(Number);
    const der = Buffer.from(text.slice(b + 1, c - 1), 'hex');
    const sig = write('sig.der', der);
    const content = write('content.bin', Buffer.concat([Buffer.from(signed.subarray(a, a + b)), Buffer.from(signed.subarray(c, c + d))]));
    const r = tool('openssl', ['cms', '-verify', '-binary', '-inform', 'DER', '-in', sig, '-content', content, '-CAfile', certPem, '-purpose', 'any', '-out', join(dir, 'verified.bin')]);
    expect(r.out).toContain('Verification successful');
    expect(r.status).toBe(0);
  });

  it('qpdf --check finds no structural errors', () => {
    const r = tool('qpdf', ['--check', join(dir, 'report.pdf')]);
    expect(r.out).toContain('No syntax or stream encoding errors found');
    expect(r.status).toBe(0);
  });

  it('pdftotext reads back the comparison table numbers', () => {
    const text = execFileSync('pdftotext', ['-layout', join(dir, 'report.pdf'), '-'], { encoding: 'utf8' });
    const lines = text.split('\n');
    for (const id of ['vt1_vo2', 'peak_vo2', 'peak_hr'] as const) {
      const row = built.outcome.comparison.metrics.find((m) => m.id === id)!;
      const line = lines.find((l) => l.trimStart().startsWith(row.label) && l.includes(fixed(row.day1, 0)));
      expect(line, `${row.label} row`).toBeDefined();
      expect(line).toContain(fixed(row.day2, 0));
    }
    // The reviewer's override of day 2 VT1 is printed with its reason.
    expect(text).toContain('test: breakpoint read 30 s earlier');
    // The trade's glyphs come through as text (DejaVu Sans subsets with a Unicode map).
    for (const glyph of ['VO₂', '≥ 1.1', 'Δ %', '−']) expect(text).toContain(glyph);
    expect(text).toContain('does not diagnose');
  });

  it('pdffonts: every font embedded; XMP declares PDF/A-3B (qpdf --qdf uncompresses it)', () => {
    const fonts = execFileSync('pdffonts', [join(dir, 'report.pdf')], { encoding: 'utf8' }).split('\n').slice(2).filter((l) => l.trim());
    expect(fonts.length).toBeGreaterThan(0);
    for (const f of fonts) expect(f).toMatch(/\s+yes\s+yes\s+yes\s+\d+\s+\d+\s*$/);
    execFileSync('qpdf', ['--qdf', '--object-streams=disable', join(dir, 'report.pdf'), join(dir, 'qdf.pdf')]);
    const qdf = readFileSync(join(dir, 'qdf.pdf'), 'latin1');
    expect(qdf).toMatch(/<pdfaid:part>3<\/pdfaid:part>/);
    expect(qdf).toMatch(/<pdfaid:conformance>B<\/pdfaid:conformance>/);
    expect(qdf).toContain('/OutputIntents');
    expect(qdf).toContain('/AFRelationship /Source');
    // Info dictionary and XMP agree (PDF/A-3 §6.6.2.3.1, (memory) for the clause number).
    const info = execFileSync('pdfinfo', [join(dir, 'report.pdf')], { encoding: 'utf8' });
    const producer = /Producer:\s+(.+)/.exec(info)?.[1].trim();
    expect(qdf).toContain(`<pdf:Producer>${producer}</pdf:Producer>`);
    expect(info).not.toMatch(/ModDate/);
  });

  it('pdfdetach extracts the two raw files and the case file, byte for byte what Twofold reads', () => {
    const out = join(dir, 'detached');
    execFileSync('mkdir', ['-p', out]);
    execFileSync('pdfdetach', ['-saveall', '-o', out, join(dir, 'report.pdf')]);
    const names = readdirSync(out).sort();
    expect(names).toEqual(['day1-qh0417-day1.csv', 'day2-qh0417-day2.csv', 'twofold-build.json', 'twofold-case.json']);
    const sha = (b: Uint8Array) => createHash('sha256').update(b).digest('hex');
    expect(sha(readFileSync(join(out, names[0])))).toBe(built.caseFile.inputs.day1.sha256);
    expect(sha(readFileSync(join(out, names[1])))).toBe(built.caseFile.inputs.day2.sha256);
    const ours = embeddedFiles(signed, 'report.pdf');
    expect(ours.ok).toBe(true);
    if (ours.ok) for (const f of ours.value) expect(sha(f.bytes)).toBe(sha(readFileSync(join(out, f.name))));
  });

  it("Twofold's own check agrees: signature whole, files intact, numbers reproduce", async () => {
    const r = await verifyReport(signed, 'report.pdf', { trust });
    expect(r.steps.map((s) => s.what).join('\n')).toContain('reproduced');
    expect(r.passed).toBe(true);
  });
});

describe('tampering', () => {
  it('one changed byte inside the signed range fails pdfsig and Twofold', async () => {
    const text = Buffer.from(signed).toString('latin1');
    const at = text.indexOf('/Producer');
    const bad = new Uint8Array(signed);
    bad[at + 12] ^= 0x01;
    const path = write('one-byte.pdf', bad);
    const r = tool('pdfsig', [path]);
    expect(r.out).not.toContain('Signature is Valid');
    const ours = verifySignature(bad, 'one-byte.pdf');
    expect(!ours.ok && ours.error.code).toBe('signature-digest-mismatch');
    expect((await verifyReport(bad, 'one-byte.pdf', { trust })).passed).toBe(false);
  });

  it('an appended incremental update that alters a recorded number fails pdfsig (not total) and Twofold', async () => {
    const text = Buffer.from(signed).toString('latin1');
    const spec = /(\d+) 0 obj\s*<<\s*\/Type \/Filespec[^]*?\/F \(twofold-case\.json\)[^]*?\/EF <<\s*\/F (\d+) 0 R/.exec(text);
    expect(spec).not.toBeNull();
    const files = embeddedFiles(signed, 'report.pdf');
    if (!files.ok) throw new Error(files.error.message);
    const caseText = new TextDecoder().decode(files.value.find((f) => f.name === 'twofold-case.json')!.bytes);
    const i = built.outcome.comparison.metrics.findIndex((m) => m.id === 'vt1_vo2');
    const day2 = built.outcome.comparison.metrics[i].day2;
    const key = `"comparison.metrics[${i}].day2"`;
    const altered = caseText.replace(`${key}: ${day2}`, `${key}: ${(day2 ?? 0) + 100}`);
    expect(altered).not.toBe(caseText);
    const updated = appendIncrementalUpdate(signed, Number(spec![2]), '/Type /EmbeddedFile /Subtype /application#2Fjson', new TextEncoder().encode(altered));
    const path = write('appended.pdf', updated);
    expect(tool('qpdf', ['--check', path]).out).toContain('No syntax or stream encoding errors found');
    // A reader now sees the altered case file (pdfdetach takes the newest object):
    execFileSync('pdfdetach', ['-savefile', 'twofold-case.json', '-o', join(dir, 'appended-case.json'), path]);
    expect(readFileSync(join(dir, 'appended-case.json'), 'utf8')).toContain(`${key}: ${(day2 ?? 0) + 100}`);
    const pdfsig = tool('pdfsig', [path]);
    expect(pdfsig.out).not.toContain('Total document signed');
    const ours = verifySignature(updated, 'appended.pdf');
    expect(!ours.ok && ours.error.code).toBe('signature-partial');
    const full = await verifyReport(updated, 'appended.pdf', { trust });
    expect(full.passed).toBe(false);
    expect(full.steps[0].what).toContain('added after the signed part');
  });
});
