/**
 * One embedded file of the report (ISO 32000-1 §7.11.4: an /EmbeddedFile stream, its
 * /Filespec in the document's EmbeddedFiles name tree, and the catalogue's /AF array that
 * PDF/A-3 asks for). It writes the same objects, in the same order and with the same
 * /CheckSum (MD5 of the bytes, lowercase hex), as pdfkit 0.17's own `doc.file`, so a report is
 * byte for byte the one `doc.file` made.
 *
 * Why not `doc.file`: it copies the bytes twice before it stores them and computes the MD5
 * through a word array of JavaScript numbers, about 300 MB of passing garbage for a 55 MB
 * breath file (measured, docs/performance.md). Here the bytes are stored as given (pdfkit
 * copies them once when it compresses the stream) and the MD5 is @noble/hashes' over the
 * bytes themselves. Uses pdfkit's `ref` and `addNamedEmbeddedFile` and the catalogue's data,
 * which its type definitions do not list; the pdfkit version is pinned in package.json.
 */
import type PDFDocument from 'pdfkit';
import { md5 } from '@noble/hashes/legacy';
import { bytesToHex } from '@noble/hashes/utils';

export interface AttachedFile {
  readonly name: string;
  /** MIME type, e.g. text/plain. */
  readonly type: string;
  readonly description: string;
  /** PDF/A-3 AFRelationship. */
  readonly relationship: 'Source' | 'Data';
  readonly created: Date;
}

/** The parts of pdfkit's document this needs and its type definitions leave out. */
interface DocumentInternals {
  ref(data: object): { end(chunk?: Uint8Array): void };
  addNamedEmbeddedFile(name: string, ref: object): void;
  _root: { data: { AF?: object[] } };
}

export function attachFile(doc: InstanceType<typeof PDFDocument>, bytes: Uint8Array, file: AttachedFile): void {
  const pdf = doc as unknown as DocumentInternals;
  const stream = pdf.ref({
    Type: 'EmbeddedFile',
    Params: { CreationDate: file.created, ModDate: file.created, CheckSum: new String(bytesToHex(md5(bytes))), Size: bytes.byteLength },
    Subtype: file.type.replace('/', '#2F'),
  });
  stream.end(bytes);
  const spec = pdf.ref({
    Type: 'Filespec',
    AFRelationship: file.relationship,
    F: new String(file.name),
    EF: { F: stream },
    UF: new String(file.name),
    Desc: new String(file.description),
  });
  spec.end();
  pdf.addNamedEmbeddedFile(file.name, spec);
  const catalogue = pdf._root.data;
  if (catalogue.AF) catalogue.AF.push(spec);
  else catalogue.AF = [spec];
}
