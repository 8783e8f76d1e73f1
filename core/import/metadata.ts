/**
 * The block of lines above the table. A line is a pair when it reads `key: value`,
 * `key = value`, `key;value` (any cell delimiter, key ending in `:` allowed), optionally
 * behind `#`; anything else is free text, kept as a preamble line. Known keys fill
 * `TestMetadata` (units converted: height in in → cm ×2.54, weight in lb → kg ×0.45359237,
 * pressure in kPa → mmHg ×7.50062 or hPa/mbar → ×0.750062; international definitions);
 * every other pair is kept verbatim in `extra`. A known key with an unreadable value is a
 * warning and the pair is kept in `extra`.
 *
 * Labels are read in English and in the languages the header row is written in
 * (header-words/; every language when the header names none); a label that means two
 * different things in those languages is a warning, kept in extra. Sex values are read in
 * the same languages (`w` weiblich, `K` kvinna; Spanish `M` is masculino or mujer and is not
 * read).
 *
 * Dates: ISO 8601 (`2026-03-02`, `2026-03-02T09:15:00`), `dd.mm.yyyy`, and `a/b/yyyy` when
 * one part is above 12 (otherwise day and month cannot be told apart: warning, kept in extra).
 * When every language of the header writes the day first (all but English), `a/b/yyyy` and
 * `dd-mm-yyyy` are read day first: `09/03/2026` in a French file is 9 March.
 */
import { emptyMetadata, type Modality, type TestMetadata } from '../model/breath-table';
import { locatedError, type LocatedError } from '../model/errors';
import { splitCells, type Delimiter } from './delimiters';
import { MMHG_PER_KPA } from './units';
import type { PreambleLine } from './types';
import { dayFirstIn, metadataKey, metadataMeanings, modalityOf, monthOf, sexOf } from './header-words/words';
import { languageName, type LanguageCode } from './header-words/index';

export interface MetadataLine {
  /** 1-based line of the file (or row of the worksheet). */
  readonly line: number;
  readonly text: string;
  /** The line split on the file's delimiter (a worksheet row's cells). */
  readonly cells: readonly string[];
}

export interface ParsedMetadata {
  readonly metadata: TestMetadata;
  /** Seconds after midnight of the stated test start (its own clock), null when unknown. */
  readonly startClockS: number | null;
  /** `YYYY-MM-DD` of the test when known (from a date key or test_start), for clock-time columns. */
  readonly date: string | null;
  readonly preamble: readonly PreambleLine[];
  readonly warnings: readonly LocatedError[];
}

type Field = 'subjectId' | 'ageY' | 'sex' | 'heightCm' | 'weightKg' | 'testStart' | 'start' | 'date' | 'clock' | 'modality' | 'protocol' | 'barometricMmhg';

const KEYS: Readonly<Record<string, Field>> = {
  subjectid: 'subjectId',
  subject: 'subjectId',
  patientcode: 'subjectId',
  subjectcode: 'subjectId',
  id: 'subjectId',
  patientid: 'subjectId',
  patient: 'subjectId',
  participant: 'subjectId',
  participantid: 'subjectId',
  age: 'ageY',
  agey: 'ageY',
  ageyears: 'ageY',
  sex: 'sex',
  gender: 'sex',
  height: 'heightCm',
  heightcm: 'heightCm',
  heightin: 'heightCm',
  stature: 'heightCm',
  weight: 'weightKg',
  weightkg: 'weightKg',
  weightlb: 'weightKg',
  bodymass: 'weightKg',
  bodyweight: 'weightKg',
  mass: 'weightKg',
  teststart: 'testStart',
  teststarted: 'testStart',
  recorded: 'testStart',
  start: 'start',
  startdatetime: 'testStart',
  datetime: 'testStart',
  date: 'date',
  testdate: 'date',
  time: 'clock',
  starttime: 'clock',
  testtime: 'clock',
  modality: 'modality',
  mode: 'modality',
  ergometer: 'modality',
  exercise: 'modality',
  protocol: 'protocol',
  barometricmmhg: 'barometricMmhg',
  barometric: 'barometricMmhg',
  barometricpressure: 'barometricMmhg',
  pb: 'barometricMmhg',
  pbar: 'barometricMmhg',
  barometer: 'barometricMmhg',
  airpressure: 'barometricMmhg',
};

/** Keys of our own plain layout (docs/formats.md); in that layout no other key is interpreted. */
const PLAIN_KEYS: Readonly<Record<string, Field>> = {
  subject_id: 'subjectId',
  age: 'ageY',
  sex: 'sex',
  height_cm: 'heightCm',
  weight_kg: 'weightKg',
  test_start: 'testStart',
  modality: 'modality',
  protocol: 'protocol',
  barometric_mmhg: 'barometricMmhg',
};

function splitPair(line: MetadataLine, delimiter: Delimiter | null, plain: boolean): { key: string; value: string } | null {
  const text = line.text.replace(/^\s*#+\s*/, '').trim();
  if (text === '') return null;
  if (plain) {
    const m = /^([^:]+):\s?(.*)$/.exec(text);
    return m ? { key: m[1].trim(), value: m[2].trim() } : null;
  }
  const cells = (delimiter ? splitCells(text, delimiter) : [...line.cells]).map((c) => c.trim()).filter((c) => c !== '');
  if (cells.length >= 2 && !/[:=]/.test(cells[0].replace(/[:=]\s*$/, ''))) {
    return { key: cells[0].replace(/\s*[:=]\s*$/, ''), value: cells.slice(1).join(' ') };
  }
  const m = /^([^:=]{1,60}?)\s*[:=]\s*(.*)$/.exec(cells.length === 1 ? cells[0] : text);
  if (m && m[2].trim() !== '') return { key: m[1].trim(), value: m[2].trim() };
  return null;
}

function normalizeKey(key: string): { key: string; unit: string | null } {
  return metadataKey(key);
}

/** A number with an optional trailing unit word (`72.5 kg`, `172cm`, `1,75 m`). */
function numberWithUnit(value: string): { n: number; unit: string | null } | null {
  const m = /^([-+]?\d+(?:[.,]\d+)?)\s*([a-zA-Z%]*)\.?$/.exec(value.trim());
  if (!m) return null;
  return { n: Number(m[1].replace(',', '.')), unit: m[2] ? m[2].toLowerCase() : null };
}

function isoDate(value: string, dayFirst = false): string | null {
  const v = value.trim();
  let m = /^(\d{4})-(\d{2})-(\d{2})/.exec(v);
  if (m) return validDate(Number(m[1]), Number(m[2]), Number(m[3]));
  m = /^(\d{1,2})\.(\d{1,2})\.(\d{4})/.exec(v);
  if (m) return validDate(Number(m[3]), Number(m[2]), Number(m[1]));
  m = (dayFirst ? /^(\d{1,2})[/-](\d{1,2})[/-](\d{4})/ : /^(\d{1,2})\/(\d{1,2})\/(\d{4})/).exec(v);
  if (m) {
    const a = Number(m[1]);
    const b = Number(m[2]);
    if (dayFirst) return validDate(Number(m[3]), b, a);
    if (a > 12 && b <= 12) return validDate(Number(m[3]), b, a);
    if (b > 12 && a <= 12) return validDate(Number(m[3]), a, b);
  }
  // A written month, in any language of header-words/: `9. März 2026`, `9 de marzo de 2026`, `March 9, 2026`.
  m = /^(\d{1,2})\.?\s*(?:de\s+)?(\p{L}+)\.?\s*(?:de\s+)?(\d{4})/u.exec(v);
  if (m) {
    const month = monthOf(m[2]);
    if (month !== null) return validDate(Number(m[3]), month, Number(m[1]));
  }
  m = /^(\p{L}+)\.?\s+(\d{1,2}),?\s+(\d{4})/u.exec(v);
  if (m) {
    const month = monthOf(m[1]);
    if (month !== null) return validDate(Number(m[3]), month, Number(m[2]));
  }
  return null;
}

function validDate(y: number, mo: number, d: number): string | null {
  if (mo < 1 || mo > 12 || d < 1 || d > 31) return null;
  const dt = new Date(Date.UTC(y, mo - 1, d));
  if (dt.getUTCMonth() !== mo - 1) return null;
  return `${String(y).padStart(4, '0')}-${String(mo).padStart(2, '0')}-${String(d).padStart(2, '0')}`;
}

function clockOf(value: string): string | null {
  const m = /(?:^|[T\s])(\d{1,2}):(\d{2})(?::(\d{2}))?/.exec(value.trim());
  if (!m || Number(m[1]) > 23 || Number(m[2]) > 59 || Number(m[3] ?? 0) > 59) return null;
  return `${m[1].padStart(2, '0')}:${m[2]}:${m[3] ?? '00'}`;
}


function parseModality(value: string): Modality | null {
  const named = modalityOf(value);
  if (named) return named;
  const v = value.trim().toLowerCase();
  if (/cycl|bike|bicycle|ergometer/.test(v)) return 'cycle';
  if (/treadmill|walk|run/.test(v)) return 'treadmill';
  return null;
}

function secondsOfClock(clock: string): number {
  const [h, m, sec] = clock.split(':').map(Number);
  return h * 3600 + m * 60 + sec;
}

/**
 * The metadata in the lines above a table. `plain` is true for our own layout, where only
 * its own keys are read and every other pair goes to `extra` untouched, so a file written by
 * core/export/breath-csv.ts reads back exactly.
 */
export function parseMetadata(
  lines: readonly MetadataLine[],
  delimiter: Delimiter | null,
  file: string,
  plain = false,
  languages: readonly LanguageCode[] = [],
): ParsedMetadata {
  const dayFirst = dayFirstIn(languages);
  const base = emptyMetadata();
  const out: { -readonly [K in keyof TestMetadata]: TestMetadata[K] } = { ...base, extra: {} };
  const extra: Record<string, string> = {};
  const preamble: PreambleLine[] = [];
  const warnings: LocatedError[] = [];
  let date: string | null = null;
  let clock: string | null = null;
  let dateLine: { key: string; value: string } | null = null;
  let startClock: string | null = null;

  for (const line of lines) {
    const pair = splitPair(line, delimiter, plain);
    if (!pair) {
      if (line.text.trim() !== '') preamble.push({ line: line.line, text: line.text.trim() });
      continue;
    }
    const { key, unit } = normalizeKey(pair.key);
    const value = pair.value;
    const unreadable = (what: string) => {
      warnings.push(locatedError('metadata-unreadable', file, line.line, null, `'${pair.key}: ${value}' could not be read as ${what}; it is kept as a note and not used.`));
      extra[pair.key] = value;
    };
    let field: Field | undefined = plain ? PLAIN_KEYS[pair.key] : KEYS[key];
    if (!plain && field === undefined) {
      const { meanings } = metadataMeanings(pair.key, languages);
      if (meanings.length === 1) field = meanings[0];
      else if (meanings.length > 1) {
        warnings.push(locatedError('metadata-ambiguous', file, line.line, null, `The label '${pair.key}' means ${meanings.join(' or ')} in the languages this file may be written in; it is kept as a note and not used.`));
        extra[pair.key] = value;
        continue;
      }
    }
    switch (field) {
      case 'subjectId':
        out.subjectId = value;
        break;
      case 'protocol':
        out.protocol = value;
        break;
      case 'ageY': {
        const n = numberWithUnit(value);
        if (n && n.n > 0 && n.n < 130) out.ageY = n.n;
        else unreadable('an age in years');
        break;
      }
      case 'sex': {
        const s = sexOf(value, languages);
        if (s === 'ambiguous') unreadable(`sex: in ${languages.map(languageName).join(' and ') || 'English'} '${value}' can stand for female or male`);
        else if (s) out.sex = s;
        else unreadable('sex (F or M)');
        break;
      }
      case 'heightCm': {
        const n = numberWithUnit(value);
        const u = n?.unit ?? unit ?? (key === 'heightin' ? 'in' : 'cm');
        const factor = u === 'cm' ? 1 : u === 'm' ? 100 : u === 'in' || u === 'inch' || u === 'inches' ? 2.54 : null;
        if (n && factor !== null && n.n > 0) out.heightCm = n.n * factor;
        else unreadable('a height in cm, m or in');
        break;
      }
      case 'weightKg': {
        const n = numberWithUnit(value);
        const u = n?.unit ?? unit ?? (key === 'weightlb' ? 'lb' : 'kg');
        const factor = u === 'kg' ? 1 : u === 'lb' || u === 'lbs' ? 0.45359237 : null;
        if (n && factor !== null && n.n > 0) out.weightKg = n.n * factor;
        else unreadable('a body weight in kg or lb');
        break;
      }
      case 'barometricMmhg': {
        const n = numberWithUnit(value);
        const u = n?.unit ?? unit ?? 'mmhg';
        const factor = u === 'mmhg' || u === 'torr' ? 1 : u === 'kpa' ? MMHG_PER_KPA : u === 'hpa' || u === 'mbar' ? MMHG_PER_KPA / 10 : null;
        if (n && factor !== null && n.n > 0) out.barometricMmhg = n.n * factor;
        else unreadable('a barometric pressure in mmHg, kPa or hPa');
        break;
      }
      case 'modality': {
        const m = parseModality(value);
        if (m) out.modality = m;
        else unreadable('a modality (cycle or treadmill)');
        // A description such as `cycle ergometer; ramp 15 W/min` says more than the modality.
        if (m && !plain && value.trim().toLowerCase() !== m) extra[pair.key] = value;
        break;
      }
      case 'start':
      case 'testStart': {
        const d = isoDate(value, dayFirst);
        if (!d) {
          const c = field === 'start' ? clockOf(value) : null;
          if (c) clock = c;
          else unreadable('a date and time');
          break;
        }
        date = d;
        const c = clockOf(value);
        if (c) startClock = c;
        const v = value.trim();
        out.testStart = /^\d{4}-\d{2}-\d{2}[T ]\d/.test(v) ? v.replace(' ', 'T') : c ? `${d}T${c}` : d;
        break;
      }
      case 'date': {
        const d = isoDate(value, dayFirst);
        if (!d) {
          unreadable(dayFirst ? 'a date (YYYY-MM-DD, DD.MM.YYYY, DD/MM/YYYY or DD-MM-YYYY)' : 'a date (YYYY-MM-DD or DD.MM.YYYY; a/b/YYYY only when the day is above 12)');
          break;
        }
        date = d;
        dateLine = { key: pair.key, value };
        const c = clockOf(value);
        if (c) clock = c;
        break;
      }
      case 'clock': {
        const c = clockOf(value);
        if (c) clock = c;
        else extra[pair.key] = value;
        break;
      }
      default:
        extra[pair.key] = value;
    }
  }
  if (out.testStart === null && date !== null && clock !== null) out.testStart = `${date}T${clock}`;
  // A date without a time of day is no test start; keep it verbatim rather than lose it.
  if (out.testStart === null && dateLine !== null) extra[dateLine.key] = dateLine.value;
  out.extra = extra;
  const startClockS = startClock !== null ? secondsOfClock(startClock) : clock !== null ? secondsOfClock(clock) : null;
  return { metadata: out, startClockS, date, preamble, warnings };
}
