/**
 * The shape of one language's header words: what physiologists in that language write above
 * the columns of a breath-by-breath export and beside the test's details above the table.
 * Each language is one plain table of words (de.ts, fr.ts, ...); nothing here is code that
 * decides anything. Matching ignores case, spaces, dots, apostrophes, dashes and accents
 * (`Körpergröße`, `korpergrosse` and `KÖRPER-GRÖSSE` are one word), see words.ts.
 */
import type { ColumnVariable } from '../types';

export type LanguageCode = 'en' | 'de' | 'fr' | 'es' | 'it' | 'nl' | 'sv' | 'da' | 'nb';

/**
 * What a column word can mean: a variable the importer reads, or a column the importer
 * recognises but does not use (the cart's own markers, its phase or stage labels, a blood
 * pressure), so that it is reported by name rather than as unknown.
 */
export type ColumnMeaning = ColumnVariable | 'clock' | 'marker' | 'phase' | 'bloodPressure';

/** Labels of the test's details above the table. `clock` is the time of day the test started. */
export type MetadataMeaning = 'subjectId' | 'date' | 'clock' | 'ageY' | 'sex' | 'heightCm' | 'weightKg' | 'modality' | 'protocol' | 'barometricMmhg';

export interface HeaderWords {
  readonly language: LanguageCode;
  /** The language's name in English, as `twofold inspect` prints it. */
  readonly name: string;
  readonly columns: Readonly<Partial<Record<ColumnMeaning, readonly string[]>>>;
  readonly metadata: Readonly<Partial<Record<MetadataMeaning, readonly string[]>>>;
  /** Values of a sex label (single letters included), as this language writes them. */
  readonly sex: { readonly female: readonly string[]; readonly male: readonly string[] };
  /** The months January to December, written out (a date `9. März 2026` is read with them). */
  readonly months: readonly string[];
  /** Words in a modality value (`Fahrradergometer`, `tapis roulant`) for each modality. */
  readonly modality: { readonly cycle: readonly string[]; readonly treadmill: readonly string[] };
  /** True when `a/b/yyyy` in this language puts the day first (`09/03/2026` is 9 March). */
  readonly dayFirst: boolean;
}
