/**
 * Finding the table in a file: the header is the first row in which several cells (three
 * or more) name variables Twofold knows (in any language of header-words/), or headers the column map names; a units row is
 * the row directly under it when none of its cells is a number and at least one is a unit.
 * Everything above the header is the metadata block (metadata.ts).
 */
import { DELIMITERS, splitCells, type Delimiter } from './delimiters';
import { normalizeName, readHeaderCell, splitHeader } from './variables';
import { columnEntries } from './header-words/words';
import { normalizeUnit } from './units';

/** Fewest recognised cells that make a row the header (time plus the gases is four). */
export const HEADER_MIN_KNOWN = 3;

/** True when a header cell names a variable in some language's header words (header-words/). */
function namesVariableInSomeLanguage(cell: string): boolean {
  return columnEntries(splitHeader(cell).name).some((e) => e.meaning !== 'marker' && e.meaning !== 'phase' && e.meaning !== 'bloodPressure');
}

/** How many cells of a row name a known variable (in any language) or a mapped header. */
export function headerScore(cells: readonly string[], mappedHeaders: ReadonlySet<string>): number {
  let n = 0;
  for (const cell of cells) {
    if (cell.trim() === '') continue;
    if (mappedHeaders.has(normalizeName(cell))) n++;
    else if (readHeaderCell(cell).variable !== null || namesVariableInSomeLanguage(cell)) n++;
  }
  return n;
}

export interface HeaderInText {
  /** 0-based index of the header among the lines. */
  readonly index: number;
  readonly delimiter: Delimiter;
  readonly cells: string[];
}

/** The header line and its delimiter, searching the first lines of a text file. */
export function findHeaderInLines(
  lines: readonly string[],
  mappedHeaders: ReadonlySet<string>,
  forced: { delimiter: Delimiter | null; index: number | null },
): HeaderInText | null {
  const candidates = forced.delimiter ? [forced.delimiter] : DELIMITERS;
  const indices = forced.index !== null ? [forced.index] : lines.map((_, i) => i);
  for (const i of indices) {
    const line = lines[i];
    if (line === undefined) continue;
    let best: HeaderInText | null = null;
    let bestScore = 0;
    for (const d of candidates) {
      if (!line.includes(d)) continue;
      const cells = splitCells(line, d);
      const score = headerScore(cells, mappedHeaders);
      if (score > bestScore) {
        bestScore = score;
        best = { index: i, delimiter: d, cells };
      }
    }
    if (best && (bestScore >= HEADER_MIN_KNOWN || forced.index !== null)) return best;
  }
  return null;
}

/** The header among rows already split into cells (a worksheet). */
export function findHeaderInRows(
  rows: readonly (readonly string[])[],
  mappedHeaders: ReadonlySet<string>,
  forcedIndex: number | null,
): number | null {
  if (forcedIndex !== null) return rows[forcedIndex] ? forcedIndex : null;
  for (let i = 0; i < rows.length; i++) if (headerScore(rows[i], mappedHeaders) >= HEADER_MIN_KNOWN) return i;
  return null;
}

const UNIT_WORDS = new Set([
  's', 'sec', 'min', 'mm:ss', 'hh:mm:ss', 'h:mm:ss', 'ml/min', 'l/min', 'ml/kg/min', 'ml/min/kg', 'bpm', '/min', '1/min',
  'w', 'watt', 'watts', 'km/h', 'kmh', 'mph', 'm/s', '%', 'mmhg', 'kpa', 'torr', 'l', 'ml', 'breaths/min', 'br/min',
  'beats/min', 'b/min',
]);

/** True when a row reads as the units of the header above it (`s;mL/min;L/min;bpm`). */
export function isUnitsRow(cells: readonly string[]): boolean {
  let units = 0;
  for (const raw of cells) {
    const cell = raw.trim().replace(/^[[(](.*)[\])]$/, '$1');
    if (cell === '') continue;
    if (/^[-+]?(\d+[.,]?\d*|[.,]\d+)$/.test(cell) || /^\d+:\d{2}/.test(cell)) return false;
    if (UNIT_WORDS.has(normalizeUnit(cell))) units++;
  }
  return units > 0;
}

/** A units-row cell without its brackets, or null when empty. */
export function unitCell(raw: string | undefined): string | null {
  if (raw === undefined) return null;
  const cell = raw.trim().replace(/^[[(](.*)[\])]$/, '$1').trim();
  return cell === '' || cell === '-' ? null : cell;
}
