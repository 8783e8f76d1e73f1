// The workbench's screen formatting follows the chosen locale (core/locale/locales.ts:
// de-DE decimal comma and `.` thousands, en-GB decimal point and `,` thousands); the default
// comes from navigator.language. Expected strings worked by hand.
import { afterEach, describe, expect, test, vi } from 'vitest';
import { chartSeparators, fmt, prose, setDisplayLocale, signed, when } from '../../../../renderer/src/ui/format';
import { initialLocale } from '../../../../renderer/src/ui/locale';

afterEach(() => {
  setDisplayLocale('en-GB');
  vi.unstubAllGlobals();
});

describe('screen numbers in the workbench locale', () => {
  test('en-GB, as before locales existed', () => {
    setDisplayLocale('en-GB');
    expect(fmt(2226.4, 0, 'mL/min')).toBe('2,226 mL/min');
    expect(fmt(24.25, 1, 'h')).toBe('24.3 h');
    expect(chartSeparators()).toBe('.,');
  });

  test('de-DE: decimal comma, point thousands, day.month.year', () => {
    setDisplayLocale('de-DE');
    expect(fmt(2226.4, 0, 'mL/min')).toBe('2.226 mL/min');
    expect(signed(-5.38, 2)).toBe('−5,38');
    expect(when('2026-03-09T09:10:00+01:00')).toBe('09.03.2026 09:10 (UTC+01:00)');
    expect(chartSeparators()).toBe(',.');
    expect(prose('The tests were 24.3 h apart (Weir 2005).')).toBe('The tests were 24,3 h apart (Weir 2005).');
  });

  test('the default comes from the browser language; a stored choice wins', () => {
    vi.stubGlobal('navigator', { language: 'sv-SE' });
    vi.stubGlobal('localStorage', { getItem: () => null, setItem: () => undefined });
    expect(initialLocale()).toBe('sv-SE');
    vi.stubGlobal('localStorage', { getItem: () => 'it-IT', setItem: () => undefined });
    expect(initialLocale()).toBe('it-IT');
    vi.stubGlobal('navigator', { language: 'pt-BR' });
    vi.stubGlobal('localStorage', { getItem: () => null, setItem: () => undefined });
    expect(initialLocale()).toBe('en');
  });
});
