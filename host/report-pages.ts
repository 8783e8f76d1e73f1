/**
 * Page-by-page comparison of two PDFs that Twofold wrote: the report as received and the
 * report rebuilt from its embedded case, raw files and build record. Each page is reduced
 * to one digest of everything it draws: its dictionary (the /Parent link, the /Annots list
 * and stream lengths left out), and, followed through every indirect reference, its content
 * streams (decompressed), fonts with their glyph programs and Unicode maps, images and
 * forms. Two pages with equal digests draw the same thing; a page whose text, chart, font or
 * image was changed differs, whatever the builder puts on its pages.
 *
 * Annotations are drawn on top of a page by a viewer, so any a page carries must be the
 * invisible signature field (/Widget with a zero /Rect) the signing step adds; any other
 * annotation is reported. Like pdf-attachments.ts this reads our own reports (uncompressed
 * object syntax, last definition of an object wins), not every PDF; a report with object
 * streams is refused, since Twofold never writes them.
 */
import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { inflateSync } from 'node:zlib';

export type PageComparison = { readonly same: true; readonly pages: number } | { readonly same: false; readonly page: number | null; readonly what: string };

interface PdfObjects {
  readonly text: string;
  readonly pdf: Uint8Array;
  readonly starts: Map<number, number>;
}

function objectsOf(pdf: Uint8Array): PdfObjects {
  const text = Buffer.from(pdf.buffer, pdf.byteOffset, pdf.byteLength).toString('latin1');
  const starts = new Map<number, number>();
  for (const m of text.matchAll(/(?:^|[\r\n\s])(\d+)\s+0\s+obj\b/g)) starts.set(Number(m[1]), m.index + m[0].length);
  return { text, pdf, starts };
}

interface Body {
  readonly dict: string;
  readonly stream: Uint8Array | null;
}

function bodyOf(o: PdfObjects, n: number): Body | null {
  const start = o.starts.get(n);
  if (start === undefined) return null;
  const end = o.text.indexOf('endobj', start);
  if (end < 0) return null;
  const body = o.text.slice(start, end);
  const at = /\bstream\r?\n/.exec(body);
  if (!at) return { dict: body.trim(), stream: null };
  const dict = body.slice(0, at.index);
  const length = /\/Length\s+(\d+)(?!\s+\d+\s+R)/.exec(dict);
  const from = start + at.index + at[0].length;
  const to = length ? from + Number(length[1]) : start + body.lastIndexOf('endstream');
  let stream: Uint8Array = o.pdf.subarray(from, to);
  if (/\/Filter\s*\/FlateDecode/.test(dict)) {
    try {
      stream = new Uint8Array(inflateSync(stream));
    } catch {
      // A damaged stream digests as its raw bytes, which differ from a sound rebuilt one.
    }
  }
  return { dict: dict.trim(), stream };
}

const REF = /(\d+)\s+(\d+)\s+R\b/g;

function digestOf(o: PdfObjects, n: number, memo: Map<number, string>, visiting: Set<number>): string {
  const known = memo.get(n);
  if (known) return known;
  if (visiting.has(n)) return 'cycle';
  visiting.add(n);
  const body = bodyOf(o, n);
  let digest: string;
  if (!body) digest = 'missing';
  else {
    const dict = body.dict
      .replace(/\/Parent\s+\d+\s+\d+\s+R/g, '')
      .replace(/\/Annots\s*(\[[^\]]*\]|\d+\s+\d+\s+R)/g, '')
      .replace(/\/Length\s+\d+(\s+\d+\s+R)?/g, '')
      .replace(REF, (_, m: string) => `{${digestOf(o, Number(m), memo, visiting)}}`)
      .replace(/\s+/g, ' ');
    const h = createHash('sha256').update(dict);
    if (body.stream) h.update('|stream|').update(body.stream);
    digest = h.digest('hex');
  }
  visiting.delete(n);
  memo.set(n, digest);
  return digest;
}

/** Page object numbers in reading order, from the last trailer's /Root through /Pages /Kids. */
function pageList(o: PdfObjects): number[] | string {
  if (/\/Type\s*\/ObjStm\b/.test(o.text)) return 'it holds compressed object streams, which Twofold never writes';
  const roots = [...o.text.matchAll(/\/Root\s+(\d+)\s+\d+\s+R/g)];
  if (roots.length === 0) return 'it names no document catalog (/Root)';
  const catalog = bodyOf(o, Number(roots[roots.length - 1][1]));
  const pagesRef = catalog && /\/Pages\s+(\d+)\s+\d+\s+R/.exec(catalog.dict);
  if (!pagesRef) return 'its catalog names no page tree';
  const out: number[] = [];
  const walk = (n: number, depth: number): string | null => {
    const node = bodyOf(o, n);
    if (!node || depth > 32) return `page tree object ${n} is missing or nested too deep`;
    if (/\/Type\s*\/Pages\b/.test(node.dict)) {
      const kids = /\/Kids\s*\[([^\]]*)\]/.exec(node.dict);
      for (const k of kids ? kids[1].matchAll(REF) : []) {
        const problem = walk(Number(k[1]), depth + 1);
        if (problem) return problem;
      }
      return null;
    }
    out.push(n);
    return null;
  };
  const problem = walk(Number(pagesRef[1]), 0);
  return problem ?? out;
}

/** Annotations on a page other than the invisible signature field, described; empty when none. */
function visibleAnnotations(o: PdfObjects, page: number): string[] {
  const dict = bodyOf(o, page)?.dict ?? '';
  const annots = /\/Annots\s*(\[[^\]]*\]|(\d+)\s+\d+\s+R)/.exec(dict);
  if (!annots) return [];
  const list = annots[2] ? (bodyOf(o, Number(annots[2]))?.dict ?? '') : annots[1];
  const out: string[] = [];
  for (const ref of list.matchAll(REF)) {
    const a = bodyOf(o, Number(ref[1]))?.dict ?? '';
    const zeroRect = /\/Rect\s*\[\s*0(\.0*)?\s+0(\.0*)?\s+0(\.0*)?\s+0(\.0*)?\s*\]/.test(a);
    if (!(/\/Subtype\s*\/Widget\b/.test(a) && zeroRect)) out.push(/\/Subtype\s*\/(\w+)/.exec(a)?.[1] ?? 'unknown');
  }
  return out;
}

/** The first line that differs between two texts, for the statement; null when none. */
function firstDifference(a: string, b: string): string | null {
  const la = a.split('\n').map((l) => l.trim()).filter(Boolean);
  const lb = b.split('\n').map((l) => l.trim()).filter(Boolean);
  for (let i = 0; i < Math.max(la.length, lb.length); i++) {
    if (la[i] !== lb[i]) return `the report shows "${(la[i] ?? '(nothing)').slice(0, 120)}" where the rebuilt page shows "${(lb[i] ?? '(nothing)').slice(0, 120)}"`;
  }
  return null;
}

/** The page's text from poppler's pdftotext when it is installed (only to word the statement). */
function pageText(pdf: Uint8Array, page: number): string | null {
  const dir = mkdtempSync(join(tmpdir(), 'twofold-page-'));
  try {
    const path = join(dir, 'r.pdf');
    writeFileSync(path, pdf);
    const r = spawnSync('pdftotext', ['-layout', '-f', String(page), '-l', String(page), path, '-'], { encoding: 'utf8', timeout: 20_000 });
    return r.status === 0 ? r.stdout : null;
  } catch {
    return null;
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

export function comparePages(received: Uint8Array, rebuilt: Uint8Array): PageComparison {
  const a = objectsOf(received);
  const b = objectsOf(rebuilt);
  const pa = pageList(a);
  if (typeof pa === 'string') return { same: false, page: null, what: `The report's pages cannot be read: ${pa}.` };
  const pb = pageList(b);
  if (typeof pb === 'string') return { same: false, page: null, what: `The rebuilt report's pages cannot be read: ${pb}.` };
  if (pa.length !== pb.length) return { same: false, page: null, what: `The report has ${pa.length} pages; rebuilt from its embedded case it has ${pb.length}.` };
  const ma = new Map<number, string>();
  const mb = new Map<number, string>();
  for (let i = 0; i < pa.length; i++) {
    const extra = visibleAnnotations(a, pa[i]);
    if (extra.length > 0) return { same: false, page: i + 1, what: `Page ${i + 1} carries ${extra.length === 1 ? 'an annotation' : 'annotations'} (${extra.join(', ')}) drawn over it that Twofold never adds.` };
    if (digestOf(a, pa[i], ma, new Set()) !== digestOf(b, pb[i], mb, new Set())) {
      const ta = pageText(received, i + 1);
      const tb = pageText(rebuilt, i + 1);
      const diff = ta !== null && tb !== null ? firstDifference(ta, tb) : null;
      return { same: false, page: i + 1, what: `Page ${i + 1} differs from the page rebuilt from the embedded case, raw files and settings${diff ? `: ${diff}` : ' (its drawing, fonts or images differ; the text may be the same)'}.` };
    }
  }
  return { same: true, pages: pa.length };
}
