// The report's own attachment writer (core/report/attach-file.ts) against pdfkit's `doc.file`:
// two documents that differ only in which one attached the files are the same bytes, so the
// objects, their order and the MD5 /CheckSum are pdfkit's. The MD5 is also checked against
// RFC 1321's own test value (Rivest, RFC 1321, 1992, appendix A.5: MD5("abc")).
import PDFDocument from 'pdfkit';
import { describe, expect, it } from 'vitest';
import { attachFile } from '../../../core/report/attach-file';

const CREATED = new Date('2026-12-03T10:00:00Z');

function pdfWith(attach: (doc: InstanceType<typeof PDFDocument>) => void): Promise<Buffer> {
  const doc = new PDFDocument({ subset: 'PDF/A-3b', pdfVersion: '1.7', info: { Title: 'attachments', CreationDate: CREATED } });
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve) => doc.on('end', () => resolve(Buffer.concat(chunks))));
  doc.text('page');
  attach(doc);
  doc.end();
  return done;
}

describe('attachFile', () => {
  it('writes the bytes pdfkit doc.file writes, CheckSum included', async () => {
    const raw = new TextEncoder().encode('time_s,vo2_ml_min\n1,300\n2,310\n');
    const json = new TextEncoder().encode('{"abc":1}');
    type Options = PDFKit.Mixins.PDFAttachmentOptions & { relationship: 'Source' | 'Data' };
    const theirs = await pdfWith((doc) => {
      doc.file(Buffer.from(raw), { name: 'day1-a.csv', type: 'text/plain', description: 'Day 1 raw', creationDate: CREATED, modifiedDate: CREATED, relationship: 'Source' } as Options);
      doc.file(Buffer.from(json), { name: 'case.json', type: 'application/json', description: 'Case', creationDate: CREATED, modifiedDate: CREATED, relationship: 'Data' } as Options);
    });
    const ours = await pdfWith((doc) => {
      attachFile(doc, raw, { name: 'day1-a.csv', type: 'text/plain', description: 'Day 1 raw', created: CREATED, relationship: 'Source' });
      attachFile(doc, json, { name: 'case.json', type: 'application/json', description: 'Case', created: CREATED, relationship: 'Data' });
    });
    expect(ours.length).toBe(theirs.length);
    expect(ours.equals(theirs)).toBe(true);
    expect(ours.toString('latin1')).toContain('/AFRelationship /Data');
  });

  it('gives the MD5 of RFC 1321 as the CheckSum', async () => {
    const pdf = await pdfWith((doc) => attachFile(doc, new TextEncoder().encode('abc'), { name: 'abc.txt', type: 'text/plain', description: 'abc', created: CREATED, relationship: 'Data' }));
    expect(pdf.toString('latin1')).toContain('/CheckSum (900150983cd24fb0d6963f7d28e17f72)');
  });
});
