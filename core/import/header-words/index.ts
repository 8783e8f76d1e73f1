/** Every language's header words, in the order `twofold inspect` lists them. */
import { DA } from './da';
import { DE } from './de';
import { EN } from './en';
import { ES } from './es';
import { FR } from './fr';
import { IT } from './it';
import { NB } from './nb';
import { NL } from './nl';
import { SV } from './sv';
import type { HeaderWords, LanguageCode } from './types';

export const LANGUAGES: readonly HeaderWords[] = [EN, DE, FR, ES, IT, NL, SV, DA, NB];

export function languageName(code: LanguageCode): string {
  return LANGUAGES.find((l) => l.language === code)?.name ?? code;
}

export type { ColumnMeaning, HeaderWords, LanguageCode, MetadataMeaning } from './types';
export { TRADE_WORDS } from './trade';
