/**
 * An Excel workbook (.xlsx) as rows of text cells, so it goes through the same pipeline as
 * a text export. The first worksheet is read unless one is named. Numbers are written with
 * a point; a cell formatted as a time of less than two days (Excel stores time as a
 * fraction of a day, epoch 1899-12-30) becomes `h:mm:ss.sss`; a date-time becomes
 * `YYYY-MM-DDTHH:MM:SS.sss`. A file that is not a readable workbook is a located error.
 * Reading is asynchronous because exceljs is.
 */
import type ExcelJS from 'exceljs';
import { fail, locatedError, ok, type Result } from '../model/errors';

const EXCEL_EPOCH_MS = Date.UTC(1899, 11, 30);
const TWO_DAYS_MS = 2 * 86_400_000;

export interface WorkbookRows {
  readonly sheet: string;
  /** rows[r] is worksheet row r + 1. */
  readonly rows: string[][];
}

function pad(n: number, width = 2): string {
  return String(n).padStart(width, '0');
}

function dateText(d: Date): string {
  const ms = Math.round(d.getTime());
  const since = ms - EXCEL_EPOCH_MS;
  if (since >= 0 && since < TWO_DAYS_MS) {
    const totalMs = Math.round(since);
    const h = Math.floor(totalMs / 3_600_000);
    const m = Math.floor((totalMs % 3_600_000) / 60_000);
    const s = Math.floor((totalMs % 60_000) / 1000);
    const frac = totalMs % 1000;
    return `${h}:${pad(m)}:${pad(s)}${frac ? `.${pad(frac, 3)}` : ''}`;
  }
  const iso = new Date(ms).toISOString();
  return iso.endsWith('.000Z') ? iso.slice(0, 19) : iso.slice(0, 23);
}

function cellText(value: unknown): string {
  if (value === null || value === undefined) return '';
  if (typeof value === 'number') return String(value);
  if (typeof value === 'string') return value;
  if (typeof value === 'boolean') return value ? 'TRUE' : 'FALSE';
  if (value instanceof Date) return dateText(value);
  if (typeof value === 'object') {
    const v = value as { richText?: { text: string }[]; result?: unknown; text?: unknown; error?: unknown };
    if (Array.isArray(v.richText)) return v.richText.map((t) => t.text).join('');
    if ('result' in v) return cellText(v.result);
    if (typeof v.text === 'string') return v.text;
  }
  return '';
}

export async function workbookRows(bytes: Uint8Array, file: string, sheetName: string | null): Promise<Result<WorkbookRows>> {
  // exceljs loads only when a workbook is read: a CSV never pays for it.
  const { default: excel } = await import('exceljs');
  const workbook = new excel.Workbook();
  try {
    await workbook.xlsx.load(Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength) as unknown as ExcelJS.Buffer);
  } catch (error) {
    const why = error instanceof Error ? error.message : String(error);
    return fail(locatedError('bad-workbook', file, null, null, `The file looks like an Excel workbook but cannot be opened (${why}). Save it again as .xlsx or export CSV.`));
  }
  const sheets = workbook.worksheets;
  const sheet = sheetName === null ? sheets[0] : sheets.find((s) => s.name === sheetName);
  if (!sheet) {
    const names = sheets.map((s) => `'${s.name}'`).join(', ');
    return fail(
      locatedError('no-sheet', file, null, null, sheetName === null ? 'The workbook has no worksheet.' : `The workbook has no worksheet named '${sheetName}' (it has ${names || 'none'}).`),
    );
  }
  const rows: string[][] = [];
  for (let r = 1; r <= sheet.rowCount; r++) {
    const values = sheet.getRow(r).values as unknown[];
    rows.push(Array.from(values.slice(1), cellText));
  }
  return ok({ sheet: sheet.name, rows });
}
