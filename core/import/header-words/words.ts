/**
 * Reading header words in any of the languages of header-words/: which language a header
 * row is written in, and what each cell means in it. Trade abbreviations (trade.ts) mean the
 * same in every language and do not count towards the language.
 *
 * The language of a row is the one whose table holds the most of its cells (several when
 * they tie). A cell is read in that language; a word that two of the row's candidate
 * languages read differently (German `Tempo` is speed, Italian `Tempo` is time) is never
 * read silently: `readHeaderWords` returns it as an ambiguity, with both readings, and the
 * importer stops with a located error asking for a column map.
 *
 * Example: readHeaderWords(['Zeit', 'VO2 [l/min]', 'HF [1/min]', 'RR [mmHg]']) →
 * languages ['de'], cells: timeS, vo2MlMin, hrBpm, bloodPressure (in German `RR` is the
 * blood pressure, not the breathing rate).
 */
import { normalizeName, splitHeader } from '../variables';
import { LANGUAGES, TRADE_WORDS, type ColumnMeaning, type LanguageCode, type MetadataMeaning } from './index';

/** Lower case without accents, spaces, dots, dashes (`Körpergröße` → `korpergrosse`). */
export function foldWord(word: string): string {
  return normalizeName(word)
    .normalize('NFD')
    .replace(/\p{M}/gu, '')
    .replace(/ß/g, 'ss')
    .replace(/ø/g, 'o')
    .replace(/æ/g, 'ae')
    .replace(/œ/g, 'oe')
    .replace(/ł/g, 'l');
}

/** A metadata label as a key: folded, only letters and digits, a bracketed unit and words after a comma removed. */
export function metadataKey(label: string): { key: string; unit: string | null } {
  const m = /^(.*?)\s*[[(]([^\])]*)[\])]\s*$/.exec(label);
  // `Protocol, "as run"`: the words before a comma name the key.
  const base = (m ? m[1] : label).split(',')[0];
  const unit = m ? m[2].trim().toLowerCase() : null;
  return { key: foldWord(base).replace(/[^a-z0-9]/g, ''), unit };
}

interface Entry<M> {
  readonly language: LanguageCode | 'trade';
  readonly meaning: M;
}

function buildIndex<M extends string>(tables: readonly { language: LanguageCode | 'trade'; words: Readonly<Partial<Record<M, readonly string[]>>> }[], key: (w: string) => string): Map<string, Entry<M>[]> {
  const index = new Map<string, Entry<M>[]>();
  for (const t of tables) {
    for (const [meaning, words] of Object.entries(t.words) as [M, readonly string[]][]) {
      for (const w of words) {
        const k = key(w);
        const list = index.get(k) ?? [];
        if (!list.some((e) => e.language === t.language && e.meaning === meaning)) list.push({ language: t.language, meaning });
        index.set(k, list);
      }
    }
  }
  return index;
}

const COLUMN_INDEX = buildIndex<ColumnMeaning>(
  [{ language: 'trade', words: TRADE_WORDS }, ...LANGUAGES.map((l) => ({ language: l.language, words: l.columns }))],
  foldWord,
);
const METADATA_INDEX = buildIndex<MetadataMeaning>(LANGUAGES.map((l) => ({ language: l.language, words: l.metadata })), (w) => metadataKey(w).key);

/** Every reading of a header name (without its unit), in every language. */
export function columnEntries(name: string): readonly Entry<ColumnMeaning>[] {
  return COLUMN_INDEX.get(foldWord(name)) ?? [];
}

export interface CellReading {
  readonly meaning: ColumnMeaning | null;
  /** The languages whose words gave the reading; ['trade'] for an abbreviation of the trade. */
  readonly languages: readonly (LanguageCode | 'trade')[];
}

export interface Ambiguity {
  /** 0-based cell index. */
  readonly index: number;
  readonly header: string;
  readonly readings: readonly { readonly meaning: ColumnMeaning; readonly languages: readonly LanguageCode[] }[];
}

export interface HeaderWordsReading {
  /** The languages the row is written in (several when their words tie); empty when only trade abbreviations matched. */
  readonly languages: readonly LanguageCode[];
  /** How many cells are words of those languages (trade abbreviations excluded). */
  readonly languageCells: number;
  readonly cells: readonly CellReading[];
  readonly ambiguities: readonly Ambiguity[];
}

function distinct<T>(xs: readonly T[]): T[] {
  return [...new Set(xs)];
}

/** The language of a header row and the reading of each of its cells. */
export function readHeaderWords(cells: readonly string[]): HeaderWordsReading {
  const entries = cells.map((c) => columnEntries(splitHeader(c).name));
  const score = new Map<LanguageCode, number>();
  for (const list of entries) {
    if (list.some((e) => e.language === 'trade')) continue;
    for (const lang of distinct(list.map((e) => e.language as LanguageCode))) score.set(lang, (score.get(lang) ?? 0) + 1);
  }
  const best = Math.max(0, ...score.values());
  const languages = best === 0 ? [] : LANGUAGES.map((l) => l.language).filter((l) => score.get(l) === best);
  const readings: CellReading[] = [];
  const ambiguities: Ambiguity[] = [];
  entries.forEach((list, index) => {
    if (list.length === 0) {
      readings.push({ meaning: null, languages: [] });
      return;
    }
    const trade = list.find((e) => e.language === 'trade');
    if (trade) {
      readings.push({ meaning: trade.meaning, languages: ['trade'] });
      return;
    }
    // Read in the row's languages; a word none of them knows is read in the languages that do.
    const inRow = list.filter((e) => languages.includes(e.language as LanguageCode));
    const used = inRow.length > 0 ? inRow : list;
    const meanings = distinct(used.map((e) => e.meaning));
    if (meanings.length > 1) {
      ambiguities.push({
        index,
        header: cells[index].trim(),
        readings: meanings.map((meaning) => ({ meaning, languages: used.filter((e) => e.meaning === meaning).map((e) => e.language as LanguageCode) })),
      });
      readings.push({ meaning: null, languages: [] });
      return;
    }
    readings.push({ meaning: meanings[0], languages: used.map((e) => e.language) });
  });
  return { languages, languageCells: best, cells: readings, ambiguities };
}

/** The meanings a metadata label has in the given languages (every language when none is given). */
export function metadataMeanings(label: string, languages: readonly LanguageCode[]): { key: string; unit: string | null; meanings: MetadataMeaning[] } {
  const { key, unit } = metadataKey(label);
  const list = METADATA_INDEX.get(key) ?? [];
  const inFile = list.filter((e) => e.language === 'en' || languages.length === 0 || languages.includes(e.language as LanguageCode));
  return { key, unit, meanings: distinct(inFile.map((e) => e.meaning)) };
}

/**
 * The sex a value states, read in the given languages (English when none is given; a full
 * English word such as `female` in any file); 'ambiguous' when they disagree (Spanish `M`
 * is masculino or mujer; `V` is varón in Spanish and vrouw in Dutch).
 */
export function sexOf(value: string, languages: readonly LanguageCode[]): 'F' | 'M' | 'ambiguous' | null {
  const v = foldWord(value);
  const codes: readonly LanguageCode[] = languages.length > 0 ? languages : ['en'];
  const found = new Set<'F' | 'M'>();
  for (const l of LANGUAGES) {
    const words = codes.includes(l.language) ? l.sex : l.language === 'en' && v.length > 1 ? l.sex : null;
    if (!words) continue;
    if (words.female.some((w) => foldWord(w) === v)) found.add('F');
    if (words.male.some((w) => foldWord(w) === v)) found.add('M');
  }
  if (found.size === 2) return 'ambiguous';
  return found.size === 1 ? [...found][0] : null;
}

/** True when every one of the given languages writes `a/b/yyyy` day first (false for none). */
export function dayFirstIn(languages: readonly LanguageCode[]): boolean {
  return languages.length > 0 && languages.every((code) => LANGUAGES.find((l) => l.language === code)?.dayFirst === true);
}

const MONTHS: readonly { readonly word: string; readonly month: number }[] = LANGUAGES.flatMap((l) => l.months.map((m, i) => ({ word: foldWord(m), month: i + 1 })));

/**
 * The month (1–12) a written month names in any of the languages, whole or shortened to at
 * least three letters (`März`, `mrz` no, `mar`, `févr.`, `dic`); null when it names none or
 * two different months (`jui` is juin or juillet).
 */
export function monthOf(word: string): number | null {
  const w = foldWord(word);
  if (w.length < 3) return null;
  const found = new Set(MONTHS.filter((m) => m.word === w || m.word.startsWith(w)).map((m) => m.month));
  return found.size === 1 ? [...found][0] : null;
}

function containsWord(folded: string, words: readonly string[], value: string): boolean {
  const tokens = value.split(/[^\p{L}]+/u).map(foldWord);
  return words.some((w) => {
    const f = foldWord(w);
    return f.length >= 4 ? folded.includes(f) : tokens.includes(f);
  });
}

/**
 * The modality a value names with the languages' words (treadmill words first, so a German
 * `Laufbandergometer` is a treadmill, not an ergometer); null when none is named.
 */
export function modalityOf(value: string): 'cycle' | 'treadmill' | null {
  const folded = foldWord(value);
  const others = LANGUAGES.filter((l) => l.language !== 'en');
  if (others.some((l) => containsWord(folded, l.modality.treadmill, value))) return 'treadmill';
  if (others.some((l) => containsWord(folded, l.modality.cycle, value))) return 'cycle';
  return null;
}
