// Reference: RFC 4180 (CSV): double quotes group a field, a doubled quote is a literal quote.
import { expect, test } from 'vitest';
import { splitCells } from '../../../core/import/delimiters';

test('splitCells follows RFC 4180 quoting', () => {
  expect(splitCells('a;"b;c";d', ';')).toEqual(['a', 'b;c', 'd']);
  expect(splitCells('"say ""hi""",2', ',')).toEqual(['say "hi"', '2']);
  expect(splitCells('1\t2\t\t4', '\t')).toEqual(['1', '2', '', '4']);
});
