/**
 * A follow-up sheet: several reports in one CSV file, as a coordinator types up paper forms.
 * Twofold's own layout (docs/cli.md, "Follow-up sheets"): a header row, then one report per
 * line. Required columns `test`, `hours`, `reported_by`, `channel`, `back_to_usual`; optional
 * `note`; every other column is a symptom domain rated 0–10 (empty: not asked). Comma
 * separated; a cell may be double-quoted ("" for a quote inside); a report on one line.
 * The whole sheet is checked before anything is recorded, and a problem names its line and
 * column (the cell's position, counting from 1).
 *
 * Example:
 *   test,hours,reported_by,channel,back_to_usual,note,fatigue,pain
 *   1,22,the person,phone,no,"slept badly, sore throat",6,3
 */
import { fail, locatedError, ok, type Result } from '../model/errors';
import { readBackToUsual, readChannel, readHours, readScore, readTestDay, type Field } from './fields';
import { FOLLOW_UP_VERSION, type FollowUpReport } from './report';
import { checkFollowUpReport } from './report-schema';

const REQUIRED = ['test', 'hours', 'reported_by', 'channel', 'back_to_usual'] as const;

export interface SheetRow {
  readonly line: number;
  readonly report: FollowUpReport;
}

export function readFollowUpSheet(text: string, file: string): Result<SheetRow[]> {
  const lines = text.replace(/^\uFEFF/, '').split(/\r?\n/);
  const header = splitLine(lines[0] ?? '', file, 1);
  if (!header.ok) return header;
  const names = header.value.map((h) => h.trim().toLowerCase());
  for (const name of REQUIRED) {
    if (!names.includes(name)) return fail(locatedError('sheet-column-missing', file, 1, null, `The header has no '${name}' column; a follow-up sheet needs ${REQUIRED.join(', ')}.`));
  }
  const seen = new Set<string>();
  for (let c = 0; c < names.length; c++) {
    if (names[c] === '') return fail(locatedError('sheet-column-unnamed', file, 1, c + 1, 'This header cell is empty; every column needs a name (a domain, or one of the named fields).'));
    if (seen.has(names[c])) return fail(locatedError('sheet-column-twice', file, 1, c + 1, `The column '${names[c]}' appears twice.`));
    seen.add(names[c]);
  }
  const col = (name: string) => names.indexOf(name);
  const domains = names.map((n, i) => ({ n, i })).filter(({ n }) => !(REQUIRED as readonly string[]).includes(n) && n !== 'note');
  const rows: SheetRow[] = [];
  for (let l = 1; l < lines.length; l++) {
    if (lines[l].trim() === '') continue;
    const line = l + 1;
    const cells = splitLine(lines[l], file, line);
    if (!cells.ok) return cells;
    if (cells.value.length !== names.length) {
      return fail(locatedError('sheet-cells', file, line, Math.min(cells.value.length, names.length) + 1, `This line has ${cells.value.length} cells; the header has ${names.length}. Nothing was recorded.`));
    }
    const cell = <T>(index: number, read: (t: string) => Field<T>): Result<T> => {
      const field = read(cells.value[index]);
      return field.ok ? ok(field.value) : fail(locatedError('sheet-cell', file, line, index + 1, `Expected ${field.expected} in column '${names[index]}'. Nothing was recorded.`));
    };
    const day = cell(col('test'), readTestDay);
    if (!day.ok) return day;
    const hours = cell(col('hours'), readHours);
    if (!hours.ok) return hours;
    const channel = cell(col('channel'), readChannel);
    if (!channel.ok) return channel;
    const usual = cell(col('back_to_usual'), readBackToUsual);
    if (!usual.ok) return usual;
    const ratings = [];
    for (const d of domains) {
      const score = cell(d.i, readScore);
      if (!score.ok) return score;
      ratings.push({ domain: d.n, score: score.value });
    }
    const reportedBy = cells.value[col('reported_by')].trim();
    if (reportedBy === '') return fail(locatedError('sheet-cell', file, line, col('reported_by') + 1, "Expected who gave the account (e.g. 'the person') in column 'reported_by'. Nothing was recorded."));
    const checked = checkFollowUpReport({ version: FOLLOW_UP_VERSION, day: day.value, afterTestH: hours.value, reportedBy, channel: channel.value, backToUsual: usual.value, ratings, note: col('note') >= 0 ? cells.value[col('note')].trim() : '' }, file);
    if (!checked.ok) return fail({ ...checked.error, line });
    rows.push({ line, report: checked.value });
  }
  if (rows.length === 0) return fail(locatedError('sheet-empty', file, 2, null, 'The sheet has a header but no reports under it.'));
  return ok(rows);
}

/** Cells of one line; double quotes enclose a cell, "" inside is one quote. */
function splitLine(text: string, file: string, line: number): Result<string[]> {
  const cells: string[] = [];
  let cell = '';
  let quoted = false;
  let cellStart = 0;
  for (let i = 0; i < text.length; i++) {
    const ch = text[i];
    if (quoted) {
      if (ch === '"' && text[i + 1] === '"') {
        cell += '"';
        i++;
      } else if (ch === '"') quoted = false;
      else cell += ch;
    } else if (ch === '"' && cell.trim() === '') {
      quoted = true;
      cell = '';
    } else if (ch === ',') {
      cells.push(cell);
      cell = '';
      cellStart = i + 1;
    } else cell += ch;
  }
  if (quoted) return fail(locatedError('sheet-quote', file, line, cells.length + 1, `The quote opened at character ${cellStart + 1} is not closed on this line; a report must fit on one line.`));
  cells.push(cell);
  return ok(cells);
}
