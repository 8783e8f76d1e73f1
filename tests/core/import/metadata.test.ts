// Reference: conversion definitions — 1 in = 2.54 cm, 1 lb = 0.45359237 kg (international
// yard and pound); 1 kPa = 7.50062 mmHg (760 mmHg = 101.325 kPa). Values worked by hand.
import { describe, expect, test } from 'vitest';
import { parseMetadata, type MetadataLine } from '../../../core/import/metadata';
import { splitCells, type Delimiter } from '../../../core/import/delimiters';

function lines(texts: string[], d: Delimiter | null): MetadataLine[] {
  return texts.map((text, i) => ({ line: i + 1, text, cells: d ? splitCells(text, d) : [text] }));
}

describe('parseMetadata', () => {
  test('key: value, key;value and # key: value with units', () => {
    const m = parseMetadata(
      lines(['# subject: P-7', 'Age;52', 'Sex: female', 'Height: 67 in', 'Weight (lb): 150', 'Pb: 101.3 kPa', 'Ergometer = Cycle', 'Operator: night shift'], ';'),
      ';',
      'm.csv',
    );
    expect(m.metadata.subjectId).toBe('P-7');
    expect(m.metadata.ageY).toBe(52);
    expect(m.metadata.sex).toBe('F');
    expect(m.metadata.heightCm).toBeCloseTo(170.18, 6); // 67 · 2.54
    expect(m.metadata.weightKg).toBeCloseTo(68.0389, 4); // 150 · 0.45359237
    expect(m.metadata.barometricMmhg).toBeCloseTo(759.81, 2); // 101.3 · 7.50062
    expect(m.metadata.modality).toBe('cycle');
    expect(m.metadata.extra).toEqual({ Operator: 'night shift' });
  });

  test('a date and a start time make the test start; free text is kept as preamble', () => {
    const m = parseMetadata(lines(['Exercise laboratory report', 'Date: 09.03.2026', 'Time: 9:10'], null), null, 'm.txt');
    expect(m.metadata.testStart).toBe('2026-03-09T09:10:00');
    expect(m.startClockS).toBe(33000); // 9·3600 + 10·60
    expect(m.preamble).toEqual([{ line: 1, text: 'Exercise laboratory report' }]);
  });

  test('an ambiguous a/b/yyyy date is not guessed', () => {
    const m = parseMetadata(lines(['Date: 03/04/2026'], null), null, 'm.txt');
    expect(m.metadata.testStart).toBeNull();
    expect(m.warnings.map((w) => [w.code, w.line])).toEqual([['metadata-unreadable', 1]]);
    expect(m.metadata.extra).toEqual({ Date: '03/04/2026' });
  });

  test('our plain layout reads only its own keys; others stay verbatim in extra', () => {
    const m = parseMetadata(lines(['# subject_id: QX-1', '# weight_kg: 70.5', '# id: not the subject', '# test_start: 2026-03-09T09:10:00+01:00'], ','), ',', 'p.csv', true);
    expect(m.metadata.subjectId).toBe('QX-1');
    expect(m.metadata.weightKg).toBe(70.5);
    expect(m.metadata.testStart).toBe('2026-03-09T09:10:00+01:00');
    expect(m.metadata.extra).toEqual({ id: 'not the subject' });
  });

  test('an unreadable known value is a warning at its line', () => {
    const m = parseMetadata(lines(['x', 'Age: unknown'], null), null, 'm.txt');
    expect(m.metadata.ageY).toBeNull();
    expect(m.warnings[0]).toMatchObject({ code: 'metadata-unreadable', file: 'm.txt', line: 2 });
  });
});
