/**
 * The worker's engine: core's `defaultEngine`, with two additions that belong to an
 * interactive shell and change no number:
 * - a remembered column map is applied when a file's layout has one (the importer's own
 *   `mapping` option);
 * - import and analysis are memoised per file and settings, so moving a threshold recomputes
 *   only what depends on it. Both functions are pure, so a cached result is the result.
 *   Workbooks (.xlsx) need the importer's asynchronous reader; `preload` runs it once and
 *   the synchronous engine then finds the table in the cache.
 */
import { defaultEngine } from '../../../core/case/default-engine';
import type { Engine } from '../../../core/case/engine';
import { sha256Hex } from '../../../core/case/sha256';
import type { Comparison } from '../../../core/compare/compare-tests';
import { readBreathFile } from '../../../core/import/read-table';
import type { ColumnMapping } from '../../../core/import/mapping';
import { COLUMN_VARIABLES, type ImportResult } from '../../../core/import/types';
import { knownUnitLabels } from '../../../core/import/units';
import { decodeBytes } from '../../../core/import/decode';
import { variableLabel } from '../../../core/import/columns';
import { splitCells } from '../../../core/import/delimiters';
import type { TestAnalysis } from '../../../core/model/analysis';
import type { BreathTable } from '../../../core/model/breath-table';
import { fail, ok, type Result } from '../../../core/model/errors';
import { refuseImpossible } from '../../../core/import/sanity';
import type { Settings } from '../../../core/model/settings';
import type { DayNumber } from '../../../core/case/case-file';
import type { MappingQuestion } from './protocol';

/** Importer warnings that mean "check this column" (core/import/columns.ts codes). */
const DOUBT_CODES = new Set(['unit-inferred', 'duplicate-column', 'mapping-column-absent']);
const PREVIEW_ROWS = 8;

/** A key for a cart's export layout: the header cells as the importer read them. */
export function layoutKeyOf(result: ImportResult): string {
  return `layout-${sha256Hex(result.columns.map((c) => c.header.trim().toLowerCase()).join('\u001f')).slice(0, 24)}`;
}

export function needsMapping(result: ImportResult): boolean {
  return result.warnings.some((w) => DOUBT_CODES.has(w.code)) || result.columns.some((c) => c.unitInferred || (c.variable === null && c.header.trim() !== ''));
}

/** The mapping step's question: the header, the first rows as written, the importer's reading. */
export function mappingQuestion(day: DayNumber, fileName: string, bytes: Uint8Array, result: ImportResult): MappingQuestion {
  const { layout } = result;
  let rows: string[][] = [];
  const decoded = layout.kind === 'text' ? decodeBytes(bytes, fileName) : null;
  if (decoded?.ok && layout.delimiter) {
    const lines = decoded.value.text.split(/\r\n|\n|\r/);
    const first = (layout.unitsLine ?? layout.headerLine) + 1;
    rows = lines.slice(first - 1, first - 1 + PREVIEW_ROWS).map((line) => splitCells(line, layout.delimiter!));
  }
  return {
    day,
    fileName,
    layoutKey: layoutKeyOf(result),
    headers: result.columns.map((c) => c.header),
    rows,
    columns: result.columns.map((c) => ({ variable: c.variable, unit: c.unit, unitInferred: c.unitInferred, note: c.note })),
    warnings: result.warnings,
    choices: COLUMN_VARIABLES.map((variable) => ({ variable, label: variableLabel(variable), units: knownUnitLabels(variable) })),
  };
}

/** Per table object (the import cache hands out the same one each time), per settings and clinical inputs. */
const analyses = new WeakMap<BreathTable, Map<string, Result<TestAnalysis>>>();
const bytesKeys = new WeakMap<Uint8Array, string>();

function keyOfBytes(bytes: Uint8Array): string {
  let key = bytesKeys.get(bytes);
  if (!key) {
    key = sha256Hex(bytes);
    bytesKeys.set(bytes, key);
  }
  return key;
}

const importKey = (name: string, bytes: Uint8Array, settings: Settings, mapping: ColumnMapping | null) => `${name}\u0000${keyOfBytes(bytes)}\u0000${JSON.stringify(settings.import)}\u0000${JSON.stringify(mapping)}`;

export interface WorkbenchEngine extends Engine<Comparison> {
  /** Imports one file (text or workbook), applying the remembered map of its layout. */
  preload(name: string, bytes: Uint8Array, settings: Settings): Promise<Result<ImportResult>>;
  /** The import result behind a table, after `preload`. */
  importOf(name: string, bytes: Uint8Array, settings: Settings): Result<ImportResult> | null;
}

/** One engine per open case: its import cache goes when the case is closed. */
export function workbenchEngine(mappings: ReadonlyMap<string, ColumnMapping>): WorkbenchEngine {
  const mappingKeyed = new Map<string, ColumnMapping | null>();
  const imports = new Map<string, Result<ImportResult>>();

  async function preload(name: string, bytes: Uint8Array, settings: Settings): Promise<Result<ImportResult>> {
    const plain = await readBreathFile(bytes, { sourceName: name, settings });
    let chosen: ColumnMapping | null = null;
    let result = plain;
    if (plain.ok) {
      chosen = mappings.get(layoutKeyOf(plain.value)) ?? null;
      if (chosen) result = await readBreathFile(bytes, { sourceName: name, settings, mapping: chosen });
    }
    mappingKeyed.set(`${name}\u0000${keyOfBytes(bytes)}`, chosen);
    imports.set(importKey(name, bytes, settings, chosen), result);
    return result;
  }

  function importOf(name: string, bytes: Uint8Array, settings: Settings): Result<ImportResult> | null {
    const mapping = mappingKeyed.get(`${name}\u0000${keyOfBytes(bytes)}`);
    if (mapping === undefined) return null;
    return imports.get(importKey(name, bytes, settings, mapping)) ?? null;
  }

  return {
    preload,
    importOf,
    readTable: (name, bytes, settings, columnMap) => {
      // The case's own map decides: a preloaded import is used only when it was read with that map.
      const cached = imports.get(importKey(name, bytes, settings, columnMap));
      if (cached) {
        if (!cached.ok) return cached;
        // The same refusal of impossible data as core's readTable (core/import/sanity.ts).
        const impossible = refuseImpossible(cached.value, name);
        return impossible ? fail(impossible) : ok(cached.value.table);
      }
      return defaultEngine.readTable(name, bytes, settings, columnMap);
    },
    analyzeTest: (table, settings, clinical) => {
      const key = `${JSON.stringify(settings)}\u0000${JSON.stringify(clinical)}`;
      const perTable = analyses.get(table) ?? new Map<string, Result<TestAnalysis>>();
      analyses.set(table, perTable);
      const cached = perTable.get(key);
      if (cached) return cached;
      const result = defaultEngine.analyzeTest(table, settings, clinical);
      perTable.set(key, result);
      return result;
    },
    valuesAt: defaultEngine.valuesAt,
    compareTests: defaultEngine.compareTests,
    // The worker decodes each raw file once and never writes to it, so its digest is remembered.
    rawDigest: keyOfBytes,
  };
}
