/**
 * The workbench's number and date format (core/locale/): the reviewer's choice kept in
 * localStorage, else the browser's language (navigator.language), else the neutral `en`.
 * The same locale goes to the report the workbench builds, so screen and PDF agree.
 */
import { localeByTag, REPORT_LOCALES, resolveLocale } from '../../../core/locale/locales';

const LOCALE_KEY = 'twofold.locale';

export function initialLocale(): string {
  try {
    const stored = localStorage.getItem(LOCALE_KEY);
    if (stored && resolveLocale(stored)) return resolveLocale(stored)!.tag;
  } catch {
    // No storage (private mode): fall back to the browser's language.
  }
  const fromBrowser = typeof navigator !== 'undefined' ? resolveLocale(navigator.language ?? '') : null;
  return fromBrowser?.tag ?? 'en';
}

export function rememberLocale(tag: string): void {
  try {
    localStorage.setItem(LOCALE_KEY, tag);
  } catch {
    // Not kept across sessions when storage is unavailable; the choice still applies now.
  }
}

export function LocalePicker({ value, onChange }: { readonly value: string; readonly onChange: (tag: string) => void }) {
  const example = localeByTag(value);
  return (
    <label className="locale" title={`Numbers and dates on screen and in the report: decimal ${example.decimal === ',' ? 'comma' : 'point'}`}>
      Numbers
      <select aria-label="Number and date format" data-testid="locale" value={value} onChange={(e) => onChange(e.target.value)}>
        {REPORT_LOCALES.map((l) => (
          <option key={l.tag} value={l.tag} title={l.name}>
            {l.tag === 'en' ? 'en (ISO)' : l.tag}
          </option>
        ))}
      </select>
    </label>
  );
}
