/**
 * Deciding what each column of a table is: the column map first, then the header name
 * (variables.ts), then the unit from the header cell or the units row (units.ts), and
 * when there is no unit, the one its values' magnitude implies (a warning says so).
 * Fatal here: an unknown unit, a required variable with no column.
 */
import { REQUIRED_VARIABLES } from '../model/breath-table';
import { fail, locatedError, ok, type LocatedError, type Result } from '../model/errors';
import { median } from '../math/stats';
import type { ColumnMapping } from './mapping';
import { parseNumber, type DecimalMark } from './numbers';
import { classifyTime } from './time-format';
import type { ColumnVariable, TimeFormat } from './types';
import { inferUnit, knownUnitLabels, onlyUnit, parseUnit, type UnitSpec } from './units';
import { isClockName, normalizeName, PLAIN_LAYOUT_COLUMNS, readHeaderCell } from './variables';
import { unitCell } from './header';
import { columnEntries, readHeaderWords, type CellReading } from './header-words/words';
import { languageName, type ColumnMeaning, type LanguageCode } from './header-words/index';

export interface ColumnPlan {
  /** 0-based cell index. */
  readonly index: number;
  readonly header: string;
  readonly variable: ColumnVariable | null;
  readonly unit: UnitSpec | null;
  readonly unitInferred: boolean;
  readonly note: string | null;
}

export interface TablePlan {
  readonly columns: readonly ColumnPlan[];
  readonly timeFormat: TimeFormat;
  readonly warnings: readonly LocatedError[];
  /** The languages whose header words the row is written in (header-words/), empty when only trade abbreviations matched. */
  readonly languages: readonly LanguageCode[];
}

export interface PlanInput {
  readonly file: string;
  readonly headerCells: readonly string[];
  readonly unitCells: readonly string[] | null;
  readonly headerLine: number;
  readonly unitsLine: number | null;
  readonly mapping: ColumnMapping | null;
  /** The first data rows, to infer units and the time format from. */
  readonly sample: readonly (readonly string[])[];
  readonly decimal: DecimalMark;
}

const LABELS: Readonly<Record<ColumnVariable, string>> = {
  timeS: 'time',
  vo2MlMin: 'VO2',
  vco2MlMin: 'VCO2',
  veLMin: 'VE',
  hrBpm: 'HR',
  workW: 'work rate',
  speedKmh: 'speed',
  gradePct: 'grade',
  peto2Mmhg: 'PetO2',
  petco2Mmhg: 'PetCO2',
  rrPerMin: 'breathing rate',
  vtL: 'tidal volume',
  vo2MlKgMin: 'VO2 per kg',
  rer: 'RER',
  rpe: 'RPE',
};

export function variableLabel(v: ColumnVariable): string {
  return LABELS[v];
}

function sampleValues(input: PlanInput, index: number): number[] {
  const values: number[] = [];
  for (const row of input.sample) {
    const v = parseNumber(row[index] ?? '', input.decimal);
    if (v !== null && Number.isFinite(v)) values.push(v);
  }
  return values;
}

function firstCell(input: PlanInput, index: number): string | null {
  for (const row of input.sample) {
    const c = (row[index] ?? '').trim();
    if (c !== '') return c;
  }
  return null;
}

const NOT_USED: Readonly<Record<'marker' | 'phase' | 'bloodPressure', string>> = {
  marker: "the cart's event markers; not used",
  phase: "the cart's phase or stage labels; not used (Twofold finds the phases from the load)",
  bloodPressure: 'a blood pressure; not used',
};

function meaningLabel(m: ColumnMeaning): string {
  return m === 'clock' ? 'time of day' : m === 'marker' ? 'event marker' : m === 'phase' ? 'phase label' : m === 'bloodPressure' ? 'blood pressure' : LABELS[m];
}

function languagesText(codes: readonly string[]): string {
  return codes.map((c) => (c === 'trade' ? 'the trade abbreviation' : languageName(c as LanguageCode))).join(' and ');
}

/** A note for a column whose word means something else in a language the row is not written in. */
function otherReadings(name: string, reading: CellReading): string {
  const others = columnEntries(name).filter((e) => e.meaning !== reading.meaning && !reading.languages.includes(e.language));
  if (others.length === 0) return '';
  const o = others[0];
  return ` (read in ${languagesText(reading.languages)}; in ${languagesText([o.language])} it would be ${meaningLabel(o.meaning)}: if that is meant, name it in a column map)`;
}

export function planColumns(input: PlanInput): Result<TablePlan> {
  const { file, headerLine } = input;
  const warnings: LocatedError[] = [];
  const mapped = new Map<string, ColumnMapping['columns'][number]>();
  for (const entry of input.mapping?.columns ?? []) mapped.set(normalizeName(entry.header), entry);
  const plainRow = input.headerCells.every((c) => PLAIN_LAYOUT_COLUMNS[c.trim().toLowerCase()] !== undefined);
  const words = readHeaderWords(plainRow ? [] : input.headerCells);
  for (const a of words.ambiguities) {
    if (mapped.has(normalizeName(a.header))) continue;
    const readings = a.readings.map((r) => `${meaningLabel(r.meaning)} in ${languagesText(r.languages)}`).join(', or ');
    return fail(
      locatedError(
        'ambiguous-header',
        file,
        headerLine,
        a.index + 1,
        `Column '${a.header}' can be read two ways: ${readings}; the other columns do not tell which language the file is written in, so Twofold does not choose. Name the column in a column map (twofold inspect --mapping).`,
      ),
    );
  }
  const seen = new Map<ColumnVariable, number>();
  const columns: ColumnPlan[] = [];
  let timeFormat: TimeFormat = 'seconds';

  for (let i = 0; i < input.headerCells.length; i++) {
    const header = input.headerCells[i].trim();
    const fromMap = mapped.get(normalizeName(header));
    const read = readHeaderCell(header);
    const word: CellReading = words.cells[i] ?? { meaning: null, languages: [] };
    const meaning = word.meaning;
    const wordVariable: ColumnVariable | null = meaning === 'clock' ? 'timeS' : meaning === 'marker' || meaning === 'phase' || meaning === 'bloodPressure' ? null : meaning;
    const plainVariable = PLAIN_LAYOUT_COLUMNS[header.toLowerCase()]?.variable ?? null;
    let variable: ColumnVariable | null = fromMap ? fromMap.variable : (plainVariable ?? (meaning !== null ? wordVariable : read.variable));
    const unitText = fromMap?.unit ? fromMap.unit : (read.unit ?? unitCell(input.unitCells?.[i]));
    if (header === '' && variable === null) continue;
    if (variable === null) {
      const known = !fromMap && (meaning === 'marker' || meaning === 'phase' || meaning === 'bloodPressure') ? NOT_USED[meaning] + otherReadings(read.name, word) : null;
      columns.push({ index: i, header, variable: null, unit: null, unitInferred: false, note: fromMap ? 'ignored by the column map' : (known ?? 'not a variable Twofold uses') });
      continue;
    }
    let unit: UnitSpec | null = null;
    let unitInferred = false;
    if (unitText !== null) {
      unit = parseUnit(variable, unitText) ?? (variable === 'vo2MlMin' ? parseUnit('vo2MlKgMin', unitText) : null);
      if (!unit) {
        return fail(
          locatedError(
            'unknown-unit',
            file,
            fromMap?.unit ? headerLine : (input.unitsLine ?? headerLine),
            i + 1,
            `The unit '${unitText}' of column '${header}' is not one Twofold knows for ${LABELS[variable]} (known: ${knownUnitLabels(variable).join(', ')}). Give the unit in a column map.`,
          ),
        );
      }
      if (unit.perKg) variable = 'vo2MlKgMin';
    }
    const earlier = seen.get(variable);
    if (earlier !== undefined) {
      const note = `a second ${LABELS[variable]} column; column ${earlier + 1} is used`;
      warnings.push(locatedError('duplicate-column', file, headerLine, i + 1, `Column '${header}' is ${note}.`));
      columns.push({ index: i, header, variable: null, unit: null, unitInferred: false, note });
      continue;
    }
    seen.set(variable, i);

    if (variable === 'timeS') {
      const cell = firstCell(input, i);
      const format = cell === null ? null : classifyTime(cell, unit?.label ?? null, isClockName(read.name) || (!fromMap && meaning === 'clock') || unit?.label === 'clock');
      if (format === null) {
        return fail(locatedError('time-unreadable', file, headerLine, i + 1, `Column '${header}' should hold the time of each breath, but it has no readable time.`));
      }
      timeFormat = unit?.label === 'date-time' ? 'date-time' : format;
      if (unit === null && (format === 'seconds' || format === 'minutes')) {
        const times = sampleValues(input, i);
        const steps = times.slice(1).map((t, k) => t - times[k]).filter((d) => d > 0);
        // Breaths come 1–6 s apart; in minutes that is 0.02–0.1 per row (common practice).
        const minutes = times.length >= 3 && Math.max(...times) < 60 && median(steps) < 0.25;
        timeFormat = minutes ? 'minutes' : 'seconds';
        warnings.push(
          locatedError(
            'unit-inferred',
            file,
            headerLine,
            i + 1,
            `Column '${header}' gives no time unit; ${minutes ? 'breaths a few hundredths apart can only be minutes' : 'it is read as seconds'}.`,
          ),
        );
        unitInferred = true;
      }
      const label = timeFormat === 'seconds' ? 's' : timeFormat === 'minutes' ? 'min' : timeFormat;
      columns.push({ index: i, header, variable, unit: { label, factor: 1, colon: !['seconds', 'minutes'].includes(timeFormat) }, unitInferred, note: null });
      continue;
    }

    if (unit === null) {
      const single = onlyUnit(variable);
      if (single) {
        unit = single;
        unitInferred = single.label !== '';
      } else {
        const values = sampleValues(input, i);
        const guess = inferUnit(variable, median(values));
        if (!guess) return fail(locatedError('unknown-unit', file, headerLine, i + 1, `Column '${header}' gives no unit and Twofold cannot infer one.`));
        unit = guess.unit;
        unitInferred = true;
        warnings.push(locatedError('unit-inferred', file, headerLine, i + 1, `Column '${header}' gives no unit; ${guess.reason}.`));
      }
    }
    const otherNote = !fromMap && plainVariable === null && meaning !== null ? otherReadings(read.name, word) : '';
    columns.push({ index: i, header, variable, unit, unitInferred, note: fromMap ? 'set by the column map' : otherNote !== '' ? otherNote.trim().replace(/^\((.*)\)$/, '$1') : null });
  }

  for (const entry of input.mapping?.columns ?? []) {
    if (!input.headerCells.some((h) => normalizeName(h) === normalizeName(entry.header))) {
      warnings.push(locatedError('mapping-column-absent', file, headerLine, null, `The column map names a column '${entry.header}' that this file does not have.`));
    }
  }

  // Absolute VO2 wins over VO2 per kg when both are present.
  if (seen.has('vo2MlMin') && seen.has('vo2MlKgMin')) {
    const k = columns.findIndex((c) => c.variable === 'vo2MlKgMin');
    columns[k] = { ...columns[k], variable: null, unit: null, note: 'VO2 per kg is not needed: the file gives absolute VO2' };
  }
  for (const v of REQUIRED_VARIABLES) {
    if (seen.has(v) || (v === 'vo2MlMin' && seen.has('vo2MlKgMin'))) continue;
    return fail(
      locatedError(
        'missing-column',
        file,
        headerLine,
        null,
        `The table has no ${LABELS[v]} column. Twofold needs time, VO2, VCO2 and VE; if the file calls one of them something else, name it in a column map (twofold inspect --mapping).`,
      ),
    );
  }
  return ok({ columns, timeFormat, warnings, languages: words.languages });
}

