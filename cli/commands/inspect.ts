/**
 * `twofold inspect FILE [--json] [--mapping MAP.json] [--save-mapping OUT.json] [--sheet NAME]`:
 * shows how a breath file was read (each column with its variable and unit, the row count,
 * the test duration, the warnings, flagged values and the rows that could not be used),
 * and can save the column map it used so the next file from the same cart imports with
 * no questions. Exit 0 when the file was read, 2 for bad input, 1 for anything else.
 */
import { readFileSync } from 'node:fs';
import { writeFileAtomic } from '../../host/atomic-write';
import { outputFileProblem } from '../../host/output-check';
import { resolve } from 'node:path';
import { formatLocated, type LocatedError } from '../../core/model/errors';
import { mappingFromImport, parseMapping, serializeMapping, type ColumnMapping } from '../../core/import/mapping';
import { readBreathFile } from '../../core/import/read-table';
import type { ImportResult } from '../../core/import/types';
import { delimiterName } from '../../core/import/delimiters';
import { formatSeconds } from '../../core/import/time-format';
import { languageName } from '../../core/import/header-words/index';
import { parseFlags } from '../args';
import { EXIT_BAD_INPUT, EXIT_OK, EXIT_OTHER, UsageError, type CliIo } from '../io';

const USAGE = `usage: twofold inspect FILE [--json] [--mapping MAP.json] [--save-mapping OUT.json] [--sheet NAME]

  --json               print the import report as JSON
  --mapping FILE       read the columns as this column map says (overrides detection)
  --save-mapping FILE  write the column map this import used
  --sheet NAME         worksheet of an .xlsx workbook (default: the first)
`;

/** How many rejected rows and flags the text report lists before it summarises. */
const LIST_LIMIT = 20;

function readBytes(path: string, shown: string): Uint8Array | LocatedError {
  try {
    return new Uint8Array(readFileSync(path));
  } catch (error) {
    const why = (error as NodeJS.ErrnoException).code === 'ENOENT' ? 'no such file' : error instanceof Error ? error.message : String(error);
    return { code: 'unreadable-file', file: shown, line: null, column: null, message: `The file cannot be read (${why}).` };
  }
}

function listed(title: string, items: readonly LocatedError[]): string[] {
  if (items.length === 0) return [];
  const lines = [`${title} (${items.length}):`, ...items.slice(0, LIST_LIMIT).map((e) => `  ${formatLocated(e)}`)];
  if (items.length > LIST_LIMIT) lines.push(`  … and ${items.length - LIST_LIMIT} more (see --json)`);
  return lines;
}

function textReport(result: ImportResult): string {
  const { table, layout, columns } = result;
  const breaths = table.breaths;
  const durationS = breaths.length > 0 ? breaths[breaths.length - 1].timeS - breaths[0].timeS : 0;
  const where = layout.kind === 'workbook' ? `workbook, sheet '${layout.sheet}'` : `text (${layout.encoding}), ${delimiterName(layout.delimiter)}-separated`;
  const widthHeader = Math.max(6, ...columns.map((c) => c.header.length));
  const lines = [
    `${table.sourceName}: ${where}, decimal mark '${layout.decimal}', header on line ${layout.headerLine}${layout.unitsLine ? `, units on line ${layout.unitsLine}` : ''}`,
    `header words: ${layout.languages.length === 0 ? 'trade abbreviations only (no language)' : layout.languages.map((l) => `${languageName(l)} (${l})`).join(' or ')}`,
    '',
    `  ${'#'.padStart(3)}  ${'header'.padEnd(widthHeader)}  ${'variable'.padEnd(11)}  unit`,
    ...columns.map(
      (c) =>
        `  ${String(c.index).padStart(3)}  ${c.header.padEnd(widthHeader)}  ${(c.variable ?? '(ignored)').padEnd(11)}  ${c.unit ?? '-'}${c.unitInferred && c.variable !== null ? ' (inferred)' : ''}${c.note ? `  ${c.note}` : ''}`,
    ),
    '',
    `breaths: ${breaths.length} of ${result.dataRows} rows${result.rejected.length ? `, ${result.rejected.length} not usable` : ''}${table.rpe.length ? `, ${table.rpe.length} RPE readings` : ''}`,
    `duration: ${formatSeconds(durationS)} (min:s), time format ${layout.timeFormat}${table.metadata.testStart ? `, test start ${table.metadata.testStart}` : ''}`,
  ];
  const m = table.metadata;
  const known = [
    m.subjectId && `subject ${m.subjectId}`,
    m.ageY !== null && `age ${m.ageY} y`,
    m.sex && `sex ${m.sex}`,
    m.heightCm !== null && `height ${Math.round(m.heightCm * 10) / 10} cm`,
    m.weightKg !== null && `weight ${Math.round(m.weightKg * 10) / 10} kg`,
    m.modality && `modality ${m.modality}`,
    m.protocol && `protocol ${m.protocol}`,
  ].filter(Boolean);
  if (known.length) lines.push(`metadata: ${known.join(', ')}`);
  lines.push(...listed('warnings', result.warnings), ...listed('rows not used', result.rejected), ...listed('flagged values', result.flags));
  return `${lines.join('\n')}\n`;
}

function jsonReport(result: ImportResult): string {
  const breaths = result.table.breaths;
  return `${JSON.stringify(
    {
      file: result.table.sourceName,
      layout: result.layout,
      columns: result.columns,
      breaths: breaths.length,
      dataRows: result.dataRows,
      durationS: breaths.length > 0 ? breaths[breaths.length - 1].timeS - breaths[0].timeS : 0,
      rpeReadings: result.table.rpe.length,
      metadata: result.table.metadata,
      warnings: result.warnings,
      rejected: result.rejected,
      flags: result.flags,
      preamble: result.preamble,
    },
    null,
    2,
  )}\n`;
}

export async function run(args: string[], io: CliIo): Promise<number> {
  const { values, positionals } = parseFlags(args, {
    json: { type: 'boolean' },
    mapping: { type: 'string' },
    'save-mapping': { type: 'string' },
    sheet: { type: 'string' },
    help: { type: 'boolean', short: 'h' },
  });
  if (values.help) {
    io.out(USAGE);
    return EXIT_OK;
  }
  if (positionals.length !== 1) throw new UsageError(`expects one breath file\n${USAGE}`);
  const file = positionals[0];
  // The column map's destination is checked before the file is read, so a bad path is exit 2.
  if (values['save-mapping']) {
    const target = resolve(io.cwd, values['save-mapping']);
    const outProblem = outputFileProblem(target);
    if (outProblem) {
      io.err(`${target}:0:0: ${outProblem}\n`);
      return EXIT_BAD_INPUT;
    }
  }

  let mapping: ColumnMapping | null = null;
  if (values.mapping) {
    const bytes = readBytes(resolve(io.cwd, values.mapping), values.mapping);
    if (!(bytes instanceof Uint8Array)) {
      io.err(`${formatLocated(bytes)}\n`);
      return EXIT_BAD_INPUT;
    }
    const parsed = parseMapping(new TextDecoder().decode(bytes), values.mapping);
    if (!parsed.ok) {
      io.err(`${formatLocated(parsed.error)}\n`);
      return EXIT_BAD_INPUT;
    }
    mapping = parsed.value;
  }

  const bytes = readBytes(resolve(io.cwd, file), file);
  if (!(bytes instanceof Uint8Array)) {
    io.err(`${formatLocated(bytes)}\n`);
    return EXIT_BAD_INPUT;
  }
  const result = await readBreathFile(bytes, { sourceName: file, mapping, sheet: values.sheet ?? null });
  if (!result.ok) {
    io.err(`${formatLocated(result.error)}\n`);
    return EXIT_BAD_INPUT;
  }
  io.out(values.json ? jsonReport(result.value) : textReport(result.value));
  const save = values['save-mapping'];
  if (save) {
    try {
      writeFileAtomic(resolve(io.cwd, save), serializeMapping(mappingFromImport(result.value)));
    } catch (error) {
      io.err(`twofold inspect: cannot write the column map to ${save}: ${error instanceof Error ? error.message : String(error)}\n`);
      return EXIT_OTHER;
    }
    if (!values.json) io.out(`column map written to ${save}\n`);
  }
  return EXIT_OK;
}
