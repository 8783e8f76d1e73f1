// Reference: hand-built exports; the rule under test is the documented one (header = first
// row naming three or more known variables; units row = no numbers and at least one unit).
import { describe, expect, test } from 'vitest';
import { findHeaderInLines, isUnitsRow } from '../../../core/import/header';

describe('findHeaderInLines', () => {
  const none = { delimiter: null, index: null };
  test('skips a metadata block and picks the delimiter that splits the header best', () => {
    const lines = ['Name: A; B', 'Time: 09:15', '', "t;V'O2;V'CO2;VE;HR", '3;0,3;0,25;10;70'];
    const h = findHeaderInLines(lines, new Set(), none);
    expect(h && [h.index, h.delimiter, h.cells.length]).toEqual([3, ';', 5]);
  });
  test('tabs and commas', () => {
    expect(findHeaderInLines(['x', 'Time\tVO2\tVCO2\tVE'], new Set(), none)?.delimiter).toBe('\t');
    expect(findHeaderInLines(['Time,VO2,VCO2,VE'], new Set(), none)?.delimiter).toBe(',');
  });
  test('a row with fewer than three known names is not the header', () => {
    expect(findHeaderInLines(['Time;Marker;Comment', '1;a;b'], new Set(), none)).toBeNull();
  });
  test('headers named in a column map count as known', () => {
    const h = findHeaderInLines(['Sekunde;Sauerstoff;Kohlendioxid;Atmung'], new Set(['sekunde', 'sauerstoff', 'kohlendioxid']), none);
    expect(h?.index).toBe(0);
  });
});

describe('isUnitsRow', () => {
  test('units, bracketed units and blanks, but no numbers', () => {
    expect(isUnitsRow(['s', 'mL/min', 'L/min', '', 'bpm'])).toBe(true);
    expect(isUnitsRow(['[s]', '[l/min]', '[kPa]'])).toBe(true);
    expect(isUnitsRow(['3', '0,35', '0,30'])).toBe(false);
    expect(isUnitsRow(['00:03', 'x', 'y'])).toBe(false);
    expect(isUnitsRow(['Rest', 'phase'])).toBe(false);
  });
});
