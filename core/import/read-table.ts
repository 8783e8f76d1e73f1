/**
 * The importer's entry point: whatever a metabolic cart exported, as a `BreathTable` in
 * canonical units, with a report of how every column was read, every row that could not be
 * used, per-row flags and warnings (types.ts).
 *
 * Pipeline: bytes → text (decode.ts) → header and delimiter (header.ts) → metadata block
 * (metadata.ts) → table cells (papaparse) → decimal mark (numbers.ts) → column plan
 * (columns.ts) → breaths (rows.ts) → plausibility flags (plausibility.ts).
 * A workbook (.xlsx) joins the same pipeline after its cells are read (xlsx.ts).
 *
 * Fatal (the whole file, one located error): empty file, binary content, no header, a
 * required column missing, an unknown unit, VO2 per kg without a body weight, an unclosed
 * quote, no usable breath at all. Everything else rejects a row or flags a value.
 */
import Papa from 'papaparse';
import { DEFAULT_SETTINGS, type Settings } from '../model/settings';
import { fail, locatedError, ok, type Result } from '../model/errors';
import { planColumns } from './columns';
import { decodeBytes } from './decode';
import { splitCells, type Delimiter } from './delimiters';
import { findHeaderInLines, findHeaderInRows, isUnitsRow } from './header';
import type { ColumnMapping } from './mapping';
import { parseMetadata, type MetadataLine } from './metadata';
import { detectDecimal, type DecimalMark } from './numbers';
import { plausibilityFlags } from './plausibility';
import { rowConverter, type RowConverter } from './rows';
import { parseDateTime } from './time-format';
import type { ColumnReport, FileLayout, ImportOptions, ImportResult } from './types';
import { normalizeName, PLAIN_LAYOUT_COLUMNS } from './variables';
import { workbookRows } from './xlsx';

/** How many lines from the top are searched for the header. */
export const HEADER_SEARCH_LINES = 1000;
const SAMPLE_ROWS = 200;
/** Lines handed to papaparse at a time in a file without quotes. */
const CHUNK_LINES = 4096;

interface TableCells {
  readonly kind: FileLayout['kind'];
  readonly encoding: string;
  readonly delimiter: Delimiter | null;
  readonly sheet: string | null;
  readonly headerCells: readonly string[];
  readonly headerLine: number;
  readonly unitCells: readonly string[] | null;
  readonly unitsLine: number | null;
  /** The first data rows, to detect the decimal mark, units and time format from. */
  readonly sample: readonly (readonly string[])[];
  /** Hands every data row to the converter, chunk by chunk. */
  readonly feed: (add: RowConverter['add']) => void;
  readonly metadataLines: readonly MetadataLine[];
}

function mappedHeaders(mapping: ColumnMapping | null): Set<string> {
  return new Set((mapping?.columns ?? []).map((c) => normalizeName(c.header)));
}

function noHeader<T>(file: string, searched: number): Result<T> {
  return fail<T>(
    locatedError(
      'no-header',
      file,
      null,
      null,
      `No header row found in the first ${searched} lines: Twofold looks for a row naming at least three variables it knows (time, VO2, VCO2, VE, HR, load...). If the cart names them differently, give a column map.`,
    ),
  );
}

function isWorkbook(bytes: Uint8Array): boolean {
  return bytes.length >= 4 && bytes[0] === 0x50 && bytes[1] === 0x4b && bytes[2] === 0x03 && bytes[3] === 0x04;
}

function isOldWorkbook(bytes: Uint8Array): boolean {
  return bytes.length >= 4 && bytes[0] === 0xd0 && bytes[1] === 0xcf && bytes[2] === 0x11 && bytes[3] === 0xe0;
}

/** The first lines of a text with the offset each starts at (the rest of the text is not split). */
function leadingLines(text: string, max: number): { lines: string[]; offsets: number[] } {
  const lines: string[] = [];
  const offsets: number[] = [];
  let start = 0;
  while (lines.length < max && start <= text.length) {
    const end = text.indexOf('\n', start);
    offsets.push(start);
    lines.push(text.slice(start, end < 0 ? text.length : end));
    if (end < 0) break;
    start = end + 1;
  }
  return { lines, offsets };
}

function textCells(text: string, file: string, encoding: string, mapping: ColumnMapping | null): Result<TableCells> {
  let t = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  if (t.includes('\r')) t = t.replace(/\r\n?/g, '\n');
  const { lines, offsets } = leadingLines(t, HEADER_SEARCH_LINES);
  const forcedIndex = mapping?.headerLine ? mapping.headerLine - 1 : null;
  const header = findHeaderInLines(lines, mappedHeaders(mapping), { delimiter: mapping?.delimiter ?? null, index: forcedIndex });
  if (!header) return noHeader(file, lines.length);
  const { index, delimiter } = header;
  const nextLineStart = (at: number) => {
    const i = t.indexOf('\n', at);
    return i < 0 ? t.length : i + 1;
  };
  const afterHeader = nextLineStart(offsets[index]);
  const next = afterHeader < t.length ? t.slice(afterHeader, nextLineStart(afterHeader)).replace(/\n$/, '') : null;
  const unitCells = next !== null && isUnitsRow(splitCells(next, delimiter)) ? splitCells(next, delimiter) : null;
  const firstDataIndex = index + 1 + (unitCells ? 1 : 0);
  const body = t.slice(unitCells ? nextLineStart(afterHeader) : afterHeader);
  const firstLine = firstDataIndex + 1;
  const parse = (text: string) => Papa.parse<string[]>(text, { delimiter, newline: '\n', quoteChar: '"', skipEmptyLines: false });

  let sample: string[][];
  let feed: TableCells['feed'];
  if (body.includes('"')) {
    // Quoted cells may hold line breaks: parse whole, and count them so every row keeps its true line.
    const parsed = parse(body);
    const rows = parsed.data;
    const starts = new Int32Array(rows.length);
    let line = firstLine;
    for (let r = 0; r < rows.length; r++) {
      starts[r] = line;
      line += 1;
      for (const cell of rows[r]) for (let i = cell.indexOf('\n'); i >= 0; i = cell.indexOf('\n', i + 1)) line++;
    }
    const unclosed = parsed.errors.find((e) => e.code === 'MissingQuotes');
    if (unclosed) {
      return fail(locatedError('unclosed-quote', file, starts[unclosed.row ?? 0] ?? firstLine, null, 'A quotation mark opened on this line is never closed, so the rest of the file cannot be split into cells.'));
    }
    sample = rows.slice(0, SAMPLE_ROWS);
    feed = (add) => add(rows, (r) => starts[r]);
  } else {
    // Without quotes a line is a row: parse in chunks of lines, so the cells of a large file
    // are never all held at once (much less garbage-collection work).
    sample = parse(leadingLines(body, SAMPLE_ROWS).lines.join('\n')).data;
    feed = (add) => {
      let start = 0;
      let base = firstLine;
      while (start < body.length) {
        let end = start;
        let n = 0;
        while (n < CHUNK_LINES) {
          const i = body.indexOf('\n', end);
          if (i < 0) {
            end = body.length;
            break;
          }
          end = i + 1;
          n++;
        }
        const first = base;
        add(parse(body.slice(start, end)).data, (r) => first + r);
        base += n;
        start = end;
      }
    };
  }
  const metadataLines: MetadataLine[] = lines.slice(0, index).map((l, i) => ({ line: i + 1, text: l, cells: splitCells(l, delimiter) }));
  return ok({
    kind: 'text',
    encoding,
    delimiter,
    sheet: null,
    headerCells: header.cells,
    headerLine: index + 1,
    unitCells,
    unitsLine: unitCells ? index + 2 : null,
    sample,
    feed,
    metadataLines,
  });
}

function workbookCells(rows: string[][], sheet: string, file: string, mapping: ColumnMapping | null): Result<TableCells> {
  const forced = mapping?.headerLine ? mapping.headerLine - 1 : null;
  const index = findHeaderInRows(rows, mappedHeaders(mapping), forced);
  if (index === null) return noHeader(file, rows.length);
  const unitCells = rows[index + 1] && isUnitsRow(rows[index + 1]) ? rows[index + 1] : null;
  const first = index + 1 + (unitCells ? 1 : 0);
  // A worksheet row simply ends at its last filled cell: the cells after it are empty, not missing.
  const width = rows[index].length;
  const body = rows.slice(first).map((r) => (r.length > 0 && r.length < width ? [...r, ...new Array<string>(width - r.length).fill('')] : r));
  return ok({
    kind: 'workbook',
    encoding: 'xlsx',
    delimiter: null,
    sheet,
    headerCells: rows[index],
    headerLine: index + 1,
    unitCells,
    unitsLine: unitCells ? index + 2 : null,
    sample: body.slice(0, SAMPLE_ROWS),
    feed: (add) => add(body, (r) => first + r + 1),
    metadataLines: rows.slice(0, index).map((cells, i) => ({ line: i + 1, text: cells.filter((c) => c.trim() !== '').join('\t'), cells })),
  });
}

function firstTimeCell(cells: TableCells, timeIndex: number): string | null {
  for (const row of cells.sample) {
    const c = row[timeIndex]?.trim();
    if (c) return c;
  }
  return null;
}

function assemble(cells: TableCells, options: ImportOptions): Result<ImportResult> {
  const file = options.sourceName;
  const settings: Settings = options.settings ?? DEFAULT_SETTINGS;
  const mapping = options.mapping ?? null;
  const sample = cells.sample;
  const decimal: DecimalMark = mapping?.decimal ?? detectDecimal(sample);
  const plain = cells.headerCells.every((c) => PLAIN_LAYOUT_COLUMNS[c.trim()] !== undefined);
  const planned = planColumns({
    file,
    headerCells: cells.headerCells,
    unitCells: cells.unitCells,
    headerLine: cells.headerLine,
    unitsLine: cells.unitsLine,
    mapping,
    sample,
    decimal,
  });
  if (!planned.ok) return planned;
  const plan = planned.value;
  const meta = parseMetadata(cells.metadataLines, cells.delimiter, file, plain, plan.languages);
  const perKg = plan.columns.find((c) => c.variable === 'vo2MlKgMin');
  if (perKg && meta.metadata.weightKg === null) {
    return fail(
      locatedError(
        'weight-needed',
        file,
        cells.headerLine,
        perKg.index + 1,
        `VO2 in column '${perKg.header}' is given per kg of body weight, but the file states no weight, so absolute VO2 cannot be computed. Add a 'weight: … kg' line above the table.`,
      ),
    );
  }
  const converter = rowConverter({ file, plan, decimal, weightKg: meta.metadata.weightKg, startClockS: meta.startClockS, compactFromBreaths: options.compactFromBreaths });
  cells.feed(converter.add);
  const out = converter.result();
  if (out.breaths.length === 0) {
    const first = out.rejected[0];
    return fail(
      locatedError(
        'no-usable-rows',
        file,
        first?.line ?? cells.headerLine,
        first?.column ?? null,
        `None of the ${out.dataRows} rows under the header gives a usable breath${first ? `; the first problem: ${first.message}` : ''}.`,
      ),
    );
  }

  let metadata = meta.metadata;
  const timeCol = plan.columns.find((c) => c.variable === 'timeS')!;
  if (metadata.testStart === null && out.firstClockS !== null) {
    const dt = plan.timeFormat === 'date-time' ? parseDateTime(firstTimeCell(cells, timeCol.index) ?? '') : null;
    const date = dt?.date ?? meta.date;
    if (date !== null) {
      const s = Math.floor(out.firstClockS);
      const hh = String(Math.floor(s / 3600) % 24).padStart(2, '0');
      const mm = String(Math.floor((s % 3600) / 60)).padStart(2, '0');
      const ss = String(s % 60).padStart(2, '0');
      metadata = { ...metadata, testStart: `${date}T${hh}:${mm}:${ss}` };
    }
  }
  const columns: ColumnReport[] = plan.columns.map((c) => ({
    index: c.index + 1,
    header: c.header,
    variable: c.variable,
    unit: c.unit && c.unit.label !== '' ? c.unit.label : null,
    unitInferred: c.unitInferred,
    note: c.note,
  }));
  const flags = [...out.flags, ...plausibilityFlags(out.breaths, out.fileRer, out.rpe, columns, settings.import, file)].sort(
    (a, b) => (a.line ?? 0) - (b.line ?? 0),
  );
  return ok({
    table: { metadata, breaths: out.breaths, rpe: out.rpe, sourceName: file },
    layout: {
      kind: cells.kind,
      encoding: cells.encoding,
      delimiter: cells.delimiter,
      decimal,
      headerLine: cells.headerLine,
      unitsLine: cells.unitsLine,
      sheet: cells.sheet,
      timeFormat: plan.timeFormat,
      languages: plan.languages,
    },
    columns,
    rejected: out.rejected,
    flags,
    warnings: [...meta.warnings, ...plan.warnings],
    preamble: meta.preamble,
    dataRows: out.dataRows,
  });
}

/** A breath table from text already decoded (synchronous). */
export function readBreathText(text: string, options: ImportOptions, encoding = 'utf-8'): Result<ImportResult> {
  const cells = textCells(text, options.sourceName, encoding, options.mapping ?? null);
  return cells.ok ? assemble(cells.value, options) : cells;
}

/** A breath table from the bytes of a text export (synchronous; a workbook needs `readBreathFile`). */
export function readBreathBytes(bytes: Uint8Array, options: ImportOptions): Result<ImportResult> {
  const file = options.sourceName;
  if (isWorkbook(bytes)) {
    return fail(locatedError('workbook-needs-async', file, null, null, 'This is an Excel workbook; it is read by readBreathFile, not the text reader.'));
  }
  if (isOldWorkbook(bytes)) {
    return fail(locatedError('old-workbook', file, null, null, 'This is an old-format Excel file (.xls), which Twofold does not read. Save it as .xlsx or export CSV.'));
  }
  const decoded = decodeBytes(bytes, file);
  return decoded.ok ? readBreathText(decoded.value.text, options, decoded.value.encoding) : decoded;
}

/** A breath table from the bytes of any supported file: text export or .xlsx workbook. */
export async function readBreathFile(bytes: Uint8Array, options: ImportOptions): Promise<Result<ImportResult>> {
  if (!isWorkbook(bytes)) return readBreathBytes(bytes, options);
  const book = await workbookRows(bytes, options.sourceName, options.sheet ?? null);
  if (!book.ok) return book;
  const cells = workbookCells(book.value.rows, book.value.sheet, options.sourceName, options.mapping ?? null);
  return cells.ok ? assemble(cells.value, options) : cells;
}
