/**
 * Numeric cells with a point or a comma as decimal mark. An empty cell, or one of the
 * placeholders carts write for "not measured" (`-`, `--`, `NA`, `n/a`, `*`), is `null`;
 * text that is not a number is `NaN`, so the caller can say where it was.
 *
 * Example: parseNumber('1,25', ',') → 1.25; parseNumber('--', '.') → null; parseNumber('abc', '.') → NaN.
 */

const PLACEHOLDERS = new Set(['-', '--', '---', 'na', 'n/a', 'nan', '*', '?', 'null', 'none']);
const NUMBER = /^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/;
const THOUSANDS_THEN_COMMA = /^[-+]?\d{1,3}(\.\d{3})+(,\d*)?$/;

export type DecimalMark = '.' | ',';

export function isPlaceholder(cell: string): boolean {
  return PLACEHOLDERS.has(cell.toLowerCase());
}

const POW10 = [1, 10, 100, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12, 1e13, 1e14, 1e15];

/**
 * `[-+]digits[mark digits]` with at most 15 digits, read without building a string: the
 * value is the exact integer of all digits divided once by an exact power of ten, which is
 * the correctly rounded double, the same one `Number` returns (IEEE 754 division is
 * correctly rounded). Undefined for any other form.
 */
export function plainDecimal(cell: string, markCode: number): number | undefined {
  const n = cell.length;
  let i = 0;
  let negative = false;
  const first = cell.charCodeAt(0);
  if (first === 45 || first === 43) {
    negative = first === 45;
    i = 1;
  }
  let digits = 0;
  let mantissa = 0;
  let decimals = -1;
  for (; i < n; i++) {
    const c = cell.charCodeAt(i);
    if (c >= 48 && c <= 57) {
      mantissa = mantissa * 10 + (c - 48);
      digits++;
      if (decimals >= 0) decimals++;
    } else if (c === markCode && decimals < 0) decimals = 0;
    else return undefined;
  }
  if (digits === 0 || digits > 15) return undefined;
  const v = decimals > 0 ? mantissa / POW10[decimals] : mantissa;
  return negative ? -v : v;
}

/**
 * The number of a cell made only of digits, signs, one decimal mark and an exponent, or
 * undefined when the cell needs the careful path (spaces, placeholders, thousands marks).
 * `Number` alone is not enough: it reads '' and ' ' as 0 and accepts hex and `Infinity`.
 */
function quickNumber(cell: string, decimal: DecimalMark): number | undefined {
  const n = cell.length;
  if (n === 0) return undefined;
  const plain = plainDecimal(cell, decimal === '.' ? 46 : 44);
  if (plain !== undefined) return plain;
  let comma = -1;
  for (let i = 0; i < n; i++) {
    const c = cell.charCodeAt(i);
    // 0-9, '+', '-', '.', 'e', 'E'
    if ((c >= 48 && c <= 57) || c === 43 || c === 45 || c === 101 || c === 69) continue;
    if (c === 46 && decimal === '.') continue;
    if (c === 44 && decimal === ',' && comma < 0) {
      comma = i;
      continue;
    }
    return undefined;
  }
  const v = Number(comma < 0 ? cell : `${cell.slice(0, comma)}.${cell.slice(comma + 1)}`);
  return Number.isFinite(v) ? v : undefined;
}

export function parseNumber(cell: string, decimal: DecimalMark): number | null {
  const quick = quickNumber(cell, decimal);
  if (quick !== undefined) return quick;
  const s = cell.trim();
  if (s === '') return null;
  let t = s;
  if (decimal === ',') {
    t = THOUSANDS_THEN_COMMA.test(s) ? s.replace(/\./g, '').replace(',', '.') : s.replace(',', '.');
  }
  if (NUMBER.test(t)) {
    const n = Number(t);
    // `1e400` is a number's spelling but no measurement: treat it as unreadable.
    return Number.isFinite(n) ? n : Number.NaN;
  }
  return isPlaceholder(s) ? null : Number.NaN;
}

/**
 * The decimal mark of a table, from its cells: a comma when some cells look like `12,5`
 * and more of them than look like `12.5` (a point-decimal file has no `12,5` cells once
 * split on its delimiter).
 */
export function detectDecimal(rows: readonly (readonly string[])[]): DecimalMark {
  let comma = 0;
  let point = 0;
  for (const row of rows) {
    for (const cell of row) {
      const s = cell.trim();
      if (/^[-+]?\d+,\d+$/.test(s)) comma++;
      else if (/^[-+]?\d*\.\d+$/.test(s)) point++;
    }
  }
  return comma > point ? ',' : '.';
}
