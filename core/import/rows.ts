/**
 * Data rows to breaths, in canonical units. Row-level problems reject only their row and
 * are listed with line, column and reason: a row that ends before a used column, an empty
 * or non-numeric time, VO2, VCO2 or VE, and a time earlier than the breath before it.
 * A row with a time and an RPE but no gas values is an RPE entry, not a breath.
 * An unreadable optional cell (HR, load...) becomes null and is flagged on its row.
 * A time of day is made relative to the test start the metadata states (when it lies before
 * the first row) or else to the first row; passing midnight adds a day.
 */
import type { Breath, RpeReading } from '../model/breath-table';
import { locatedError, type LocatedError } from '../model/errors';
import { variableLabel, type TablePlan } from './columns';
import { parseNumber, type DecimalMark } from './numbers';
import { formatSeconds, parseTimeCell } from './time-format';
import type { ColumnVariable, RowFlag } from './types';
import { BreathStore } from './breath-store';

export interface RowsInput {
  readonly file: string;
  readonly plan: TablePlan;
  readonly decimal: DecimalMark;
  readonly weightKg: number | null;
  /** Seconds after midnight of the test start the file states; a time-of-day column counts from it. */
  readonly startClockS: number | null;
  /** The breath count from which breaths are kept in columns (core/import/breath-store.ts); tests set it low. */
  readonly compactFromBreaths?: number;
}

export interface RowsOutput {
  readonly breaths: Breath[];
  /** The cart's own RER on each breath (aligned with `breaths`), null where absent. */
  readonly fileRer: (number | null)[];
  readonly rpe: RpeReading[];
  readonly rejected: LocatedError[];
  readonly flags: RowFlag[];
  readonly dataRows: number;
  /** Seconds of day that time 0 stands for when the time column is a time of day, else null. */
  readonly firstClockS: number | null;
}

const OPTIONAL: readonly ColumnVariable[] = ['hrBpm', 'workW', 'speedKmh', 'gradePct', 'peto2Mmhg', 'petco2Mmhg', 'rrPerMin', 'vtL'];
const HALF_DAY_S = 43_200;

/**
 * A converter fed the table in chunks (`add`), so a large file never holds all its cells
 * at once; `result` gives everything converted so far.
 */
export interface RowConverter {
  /** Converts rows; `lineOf(r)` is the 1-based source line of `rows[r]`. */
  readonly add: (rows: readonly (readonly string[])[], lineOf: (r: number) => number) => void;
  readonly result: () => RowsOutput;
}

export function rowConverter(input: RowsInput): RowConverter {
  const { file, plan, decimal } = input;
  const col = (v: ColumnVariable) => plan.columns.find((c) => c.variable === v) ?? null;
  const timeCol = col('timeS')!;
  const vo2Col = col('vo2MlMin');
  const vo2KgCol = col('vo2MlKgMin');
  const vco2Col = col('vco2MlMin')!;
  const veCol = col('veLMin')!;
  const rerCol = col('rer');
  const rpeCol = col('rpe');
  const gasCols = [vo2Col ?? vo2KgCol!, vco2Col, veCol];
  const gasFactor = [vo2Col ? vo2Col.unit!.factor : (input.weightKg ?? Number.NaN), vco2Col.unit!.factor, veCol.unit!.factor];
  const optionalCols = OPTIONAL.map((v) => col(v));
  const used = plan.columns.filter((c) => c.variable !== null);
  const lastUsed = used.reduce((a, c) => (c.index > a.index ? c : a), used[0]);
  const clock = plan.timeFormat === 'clock' || plan.timeFormat === 'date-time';

  const store = new BreathStore(input.compactFromBreaths);
  const fileRer: (number | null)[] = [];
  const rpe: RpeReading[] = [];
  const rejected: LocatedError[] = [];
  const flags: RowFlag[] = [];
  let dataRows = 0;
  let firstClock: number | null = null;
  let dayOffset = 0;
  let lastRaw = Number.NEGATIVE_INFINITY;
  let prevTime = Number.NEGATIVE_INFINITY;
  const gas = [0, 0, 0];

  const reject = (code: string, line: number, column: number, message: string) => rejected.push(locatedError(code, file, line, column, message));
  /** Optional variable k of a breath row in canonical units; an unreadable cell is flagged and left empty. */
  const optional = (k: number, cells: readonly string[], line: number, timeS: number): number | null => {
    const c = optionalCols[k];
    if (c === null) return null;
    const v = parseNumber(cells[c.index], decimal);
    if (v === null) return null;
    if (Number.isNaN(v)) {
      flags.push({
        ...locatedError('unreadable-cell', file, line, c.index + 1, `'${cells[c.index].trim()}' in column '${c.header}' is not a number; ${variableLabel(OPTIONAL[k])} is left empty on this breath.`),
        timeS,
        variable: OPTIONAL[k],
        value: null,
      });
      return null;
    }
    return v * c.unit!.factor;
  };

  const add = (rows: readonly (readonly string[])[], lineOf: (r: number) => number): void => {
    rowLoop: for (let r = 0; r < rows.length; r++) {
      const cells = rows[r];
      if (cells.length === 0 || (cells.length === 1 && cells[0].trim() === '')) continue;
      dataRows++;
      const line = lineOf(r);
      if (cells.length <= lastUsed.index) {
        reject(
          'too-few-cells',
          line,
          cells.length + 1,
          `This row has ${cells.length} cell${cells.length === 1 ? '' : 's'}, but the columns Twofold reads run to column ${lastUsed.index + 1} ('${lastUsed.header}'); the row is not used.`,
        );
        continue;
      }
      const rawTime = parseTimeCell(cells[timeCol.index], plan.timeFormat, decimal);
      if (rawTime === null || Number.isNaN(rawTime)) {
        reject(
          rawTime === null ? 'missing-value' : 'not-a-number',
          line,
          timeCol.index + 1,
          rawTime === null ? 'The time of this row is empty; the row is not used.' : `The time '${cells[timeCol.index].trim()}' is not a time Twofold can read (${plan.timeFormat}); the row is not used.`,
        );
        continue;
      }
      let timeS = rawTime;
      if (clock) {
        if (firstClock === null) {
          // The stated start is the origin when it lies before the first row, within half a day.
          const start = input.startClockS;
          firstClock = start !== null && rawTime - start >= 0 && rawTime - start < HALF_DAY_S ? start : rawTime;
        }
        if (rawTime + dayOffset < lastRaw - HALF_DAY_S) dayOffset += 86_400;
        timeS = rawTime + dayOffset - firstClock;
      }

      let missingAt = -1;
      for (let g = 0; g < 3; g++) {
        const v = parseNumber(cells[gasCols[g].index], decimal);
        if (v === null) {
          if (missingAt < 0) missingAt = g;
          continue;
        }
        if (Number.isNaN(v)) {
          const c = gasCols[g];
          reject('not-a-number', line, c.index + 1, `'${cells[c.index].trim()}' in column '${c.header}' is not a number; ${variableLabel(c.variable!)} must be numeric, so the row is not used.`);
          continue rowLoop;
        }
        gas[g] = v * gasFactor[g];
      }
      if (missingAt >= 0) {
        const borg = rpeCol ? parseNumber(cells[rpeCol.index] ?? '', decimal) : null;
        if (borg !== null && Number.isFinite(borg)) {
          rpe.push({ timeS, borg });
          continue;
        }
        const c = gasCols[missingAt];
        reject('missing-value', line, c.index + 1, `${variableLabel(c.variable!)} (column '${c.header}') is empty on this row; the row is not used.`);
        continue;
      }
      if (timeS < prevTime) {
        reject(
          'time-backwards',
          line,
          timeCol.index + 1,
          `Time goes backwards here, from ${formatSeconds(prevTime)} to ${formatSeconds(timeS)} (min:s): breaths must be in time order, so the row is not used.`,
        );
        continue;
      }
      prevTime = timeS;
      if (clock) lastRaw = rawTime + dayOffset;

      store.push({
        timeS,
        vo2MlMin: gas[0],
        vco2MlMin: gas[1],
        veLMin: gas[2],
        hrBpm: optional(0, cells, line, timeS),
        workW: optional(1, cells, line, timeS),
        speedKmh: optional(2, cells, line, timeS),
        gradePct: optional(3, cells, line, timeS),
        peto2Mmhg: optional(4, cells, line, timeS),
        petco2Mmhg: optional(5, cells, line, timeS),
        rrPerMin: optional(6, cells, line, timeS),
        vtL: optional(7, cells, line, timeS),
        sourceLine: line,
      });
      const rer = rerCol ? parseNumber(cells[rerCol.index], decimal) : null;
      fileRer.push(rer !== null && Number.isFinite(rer) ? rer : null);
      if (rpeCol) {
        const borg = parseNumber(cells[rpeCol.index], decimal);
        if (borg !== null && Number.isFinite(borg)) rpe.push({ timeS, borg });
      }
    }
  };
  return { add, result: () => ({ breaths: store.breaths, fileRer, rpe, rejected, flags, dataRows, firstClockS: firstClock }) };
}
